#pragma once
// Reads and analyses frames on one background thread, so that the UI thread never waits on
// the file: it asks for a frame and picks up whatever has finished at its next repaint.
//
//   auto live = std::make_shared<LiveTrajectory>(locate_run(dir));
//   FrameLoader loader{live};
//   loader.request(k);                                   // on every timeline move
//   ...each UI frame:
//   if (auto loaded = loader.take_ready()) show(*loaded->frame, *loaded->analysis);
//   if (auto error = loader.take_error()) status_line(*error);
//
// Threads and locking. The LiveTrajectory belongs to the UI thread: poll(), request() and the
// loader's constructor and destructor must all be called on the one thread that uses it.
// request() copies what the worker needs from it (the frame's FrameInfo, the file's identity,
// the reload generation, where the frames start); the worker never touches the
// LiveTrajectory. It keeps its own descriptor on the same file (checked by device and inode)
// and decodes each frame from its bytes with a fresh TrajectoryReader (see src/frame_source.hpp),
// so a concurrent poll() that extends or rebuilds the UI's index cannot disturb it. After a
// reload (poll() says reloaded) request frames again: results are keyed by generation and the
// frame's identity, so nothing from before the reload is handed out for a new index. One mutex
// guards the pending request, the finished result, the error and the cache.
//
// Memory: at most cache_capacity decoded frames with their analyses, plus the one being read
// and the file's header bytes; never the whole trajectory.
#include <atomic>
#include <condition_variable>
#include <cstddef>
#include <cstdint>
#include <list>
#include <memory>
#include <mutex>
#include <optional>
#include <string>
#include <thread>

#include "data/frame_analysis.hpp"
#include "data/live_trajectory.hpp"

namespace brownfloc::viewer {

namespace detail {
class FrameSource;
}

struct LoadedFrame {
    std::size_t index = 0;  // in the LiveTrajectory's index at request time
    trajectory::FrameInfo info;
    std::shared_ptr<const trajectory::TrajectoryFrame> frame;
    std::shared_ptr<const FrameAnalysis> analysis;
};

class FrameLoader {
public:
    // Decoded frames kept so that stepping back and forth is instant.
    static constexpr std::size_t cache_capacity = 4;

    // Starts the worker thread. trajectory must not be null (std::invalid_argument).
    explicit FrameLoader(std::shared_ptr<LiveTrajectory> trajectory);
    FrameLoader(const FrameLoader&) = delete;
    FrameLoader& operator=(const FrameLoader&) = delete;
    ~FrameLoader();  // stops the worker and joins it (after the frame it is reading, if any)

    // Asks for frame frame_index (< trajectory->frame_count(), else std::out_of_range). The
    // newest request wins: an older one not yet started is dropped. A cached frame is ready at
    // once, without the worker.
    void request(std::size_t frame_index);
    // Non-blocking: the most recently requested frame that has finished since the last call,
    // once. A frame overtaken by a newer request that finished first is never handed out.
    [[nodiscard]] std::optional<LoadedFrame> take_ready();
    // Non-blocking: why the last failed frame could not be read or analysed (the frame is
    // skipped; the message names the file, the byte offset and the frame), once.
    [[nodiscard]] std::optional<std::string> take_error();

    // Frames the worker has read from the file so far (cache hits excluded).
    [[nodiscard]] std::size_t frames_read() const { return frames_read_.load(); }

private:
    struct Request;
    struct CacheEntry;
    void work();
    void load(const Request& request);
    [[nodiscard]] std::optional<LoadedFrame> cached(const Request& request);  // mutex_ held
    void remember(const Request& request, const LoadedFrame& loaded);        // mutex_ held

    std::shared_ptr<LiveTrajectory> trajectory_;
    std::unique_ptr<detail::FrameSource> source_;  // the worker's only
    std::uint64_t next_sequence_ = 1;              // UI thread only

    std::mutex mutex_;
    std::condition_variable wake_;
    std::unique_ptr<Request> pending_;
    std::optional<LoadedFrame> ready_;
    std::uint64_t ready_sequence_ = 0;  // the newest request whose result was handed out or is ready
    std::optional<std::string> error_;
    std::list<CacheEntry> cache_;  // most recently used first
    bool stopping_ = false;
    std::atomic<std::size_t> frames_read_{0};

    std::thread worker_;  // last: started once everything above exists
};

}  // namespace brownfloc::viewer
