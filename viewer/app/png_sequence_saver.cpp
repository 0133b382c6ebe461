#include "png_sequence_saver.hpp"

#include "png_output.hpp"

namespace brownfloc::viewer {

PngSequenceSaver::PngSequenceSaver() : worker_([this] { work(); }) {}

PngSequenceSaver::~PngSequenceSaver() {
    {
        const std::lock_guard lock(mutex_);
        stopping_ = true;
    }
    wake_.notify_all();
    worker_.join();
}

void PngSequenceSaver::enqueue(sf::Image image, std::filesystem::path path) {
    {
        const std::lock_guard lock(mutex_);
        queue_.emplace_back(std::move(image), std::move(path));
    }
    wake_.notify_all();
}

bool PngSequenceSaver::has_room() const {
    const std::lock_guard lock(mutex_);
    return queue_.size() < max_queued;
}

std::size_t PngSequenceSaver::saved() const {
    const std::lock_guard lock(mutex_);
    return saved_;
}

std::optional<std::string> PngSequenceSaver::take_error() {
    const std::lock_guard lock(mutex_);
    std::optional<std::string> error = std::move(error_);
    error_.reset();
    return error;
}

void PngSequenceSaver::drop_queued() {
    const std::lock_guard lock(mutex_);
    queue_.clear();
}

void PngSequenceSaver::work() {
    std::unique_lock lock(mutex_);
    while (true) {
        wake_.wait(lock, [this] { return stopping_ || !queue_.empty(); });
        if (queue_.empty()) return;  // stopping with nothing left
        auto [image, path] = std::move(queue_.front());
        queue_.pop_front();
        lock.unlock();
        std::optional<std::string> failure;
        try {
            save_png(image, path, ExistingFile::refuse);
        } catch (const std::exception& error) {
            failure = error.what();
        }
        lock.lock();
        if (failure) {
            if (!error_) error_ = std::move(failure);
            queue_.clear();
        } else {
            ++saved_;
        }
    }
}

}  // namespace brownfloc::viewer
