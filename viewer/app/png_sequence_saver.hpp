#pragma once
// Writes the PNG files of a frame sequence on a background thread, so that encoding (about
// 150 ms for 1280x800) never stalls the window. Files are never overwritten.
#include <SFML/Graphics/Image.hpp>

#include <condition_variable>
#include <deque>
#include <filesystem>
#include <mutex>
#include <optional>
#include <string>
#include <thread>

namespace brownfloc::viewer {

class PngSequenceSaver {
public:
    PngSequenceSaver();
    ~PngSequenceSaver();  // finishes what is queued, then joins
    PngSequenceSaver(const PngSequenceSaver&) = delete;
    PngSequenceSaver& operator=(const PngSequenceSaver&) = delete;

    // Queues one image; at most `max_queued` wait at a time (the caller checks `has_room`).
    void enqueue(sf::Image image, std::filesystem::path path);
    [[nodiscard]] bool has_room() const;
    [[nodiscard]] std::size_t saved() const;
    // The first error, once.
    [[nodiscard]] std::optional<std::string> take_error();
    // Drops what is still queued (cancel).
    void drop_queued();

    static constexpr std::size_t max_queued = 3;

private:
    void work();

    mutable std::mutex mutex_;
    std::condition_variable wake_;
    std::deque<std::pair<sf::Image, std::filesystem::path>> queue_;
    std::size_t saved_ = 0;
    std::optional<std::string> error_;
    bool stopping_ = false;
    std::thread worker_;
};

}  // namespace brownfloc::viewer
