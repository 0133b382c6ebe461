#include "data/frame_loader.hpp"

#include <exception>
#include <stdexcept>
#include <utility>

#include "frame_source.hpp"

namespace brownfloc::viewer {

struct FrameLoader::Request {
    std::uint64_t sequence = 0;
    std::size_t index = 0;
    trajectory::FrameInfo info;
    detail::FileVersion version;
};

struct FrameLoader::CacheEntry {
    std::uint64_t generation = 0;
    trajectory::FrameInfo info;
    std::shared_ptr<const trajectory::TrajectoryFrame> frame;
    std::shared_ptr<const FrameAnalysis> analysis;
};

namespace {

bool same_frame(const trajectory::FrameInfo& a, const trajectory::FrameInfo& b) {
    return a.frame_number == b.frame_number && a.offset_bytes == b.offset_bytes && a.payload_bytes == b.payload_bytes &&
           a.payload_crc == b.payload_crc;
}

}  // namespace

FrameLoader::FrameLoader(std::shared_ptr<LiveTrajectory> trajectory)
    : trajectory_{std::move(trajectory)}, source_{std::make_unique<detail::FrameSource>()} {
    if (!trajectory_) throw std::invalid_argument("FrameLoader: no trajectory given (null pointer)");
    worker_ = std::thread{[this] { work(); }};
}

FrameLoader::~FrameLoader() {
    {
        const std::lock_guard lock{mutex_};
        stopping_ = true;
    }
    wake_.notify_all();
    worker_.join();
}

void FrameLoader::request(std::size_t frame_index) {
    // On the UI thread, like poll(): the LiveTrajectory is read here and only here.
    auto wanted = std::make_unique<Request>();
    wanted->info = trajectory_->frame_info(frame_index);  // std::out_of_range past the end
    wanted->sequence = next_sequence_++;
    wanted->index = frame_index;
    wanted->version = detail::FileVersion{trajectory_->location().trajectory, trajectory_->file_identity(),
                                          trajectory_->generation(), trajectory_->frames_offset_bytes()};
    {
        const std::lock_guard lock{mutex_};
        if (std::optional<LoadedFrame> hit = cached(*wanted)) {
            ready_ = std::move(hit);
            ready_sequence_ = wanted->sequence;
            pending_.reset();  // an older request not yet started is not needed any more
            return;
        }
        pending_ = std::move(wanted);
    }
    wake_.notify_one();
}

std::optional<LoadedFrame> FrameLoader::take_ready() {
    const std::lock_guard lock{mutex_};
    std::optional<LoadedFrame> taken = std::move(ready_);
    ready_.reset();
    return taken;
}

std::optional<std::string> FrameLoader::take_error() {
    const std::lock_guard lock{mutex_};
    std::optional<std::string> taken = std::move(error_);
    error_.reset();
    return taken;
}

std::optional<LoadedFrame> FrameLoader::cached(const Request& request) {
    for (auto entry = cache_.begin(); entry != cache_.end(); ++entry) {
        if (entry->generation != request.version.generation || !same_frame(entry->info, request.info)) continue;
        cache_.splice(cache_.begin(), cache_, entry);  // most recently used first
        return LoadedFrame{request.index, request.info, cache_.front().frame, cache_.front().analysis};
    }
    return std::nullopt;
}

void FrameLoader::remember(const Request& request, const LoadedFrame& loaded) {
    // Frames of an older generation can never be asked for again.
    std::erase_if(cache_, [&](const CacheEntry& entry) { return entry.generation < request.version.generation; });
    cache_.push_front(CacheEntry{request.version.generation, request.info, loaded.frame, loaded.analysis});
    while (cache_.size() > cache_capacity) cache_.pop_back();
}

void FrameLoader::work() {
    for (;;) {
        std::unique_ptr<Request> next;
        {
            std::unique_lock lock{mutex_};
            wake_.wait(lock, [this] { return stopping_ || pending_ != nullptr; });
            if (stopping_) return;
            next = std::move(pending_);
            if (std::optional<LoadedFrame> hit = cached(*next)) {  // loaded while this request waited
                if (next->sequence > ready_sequence_) {
                    ready_ = std::move(hit);
                    ready_sequence_ = next->sequence;
                }
                continue;
            }
        }
        try {
            load(*next);
        } catch (const std::exception& failure) {  // no memory to keep the result: never end the thread
            const std::lock_guard lock{mutex_};
            error_ = failure.what();
        }
    }
}

void FrameLoader::load(const Request& request) {
    // Outside the lock: reading and analysing a large frame takes a while.
    LoadedFrame loaded;
    try {
        trajectory::TrajectoryFrame frame = source_->read(request.version, request.info, request.index);
        ++frames_read_;
        FrameAnalysis analysis = analyse_frame(source_->header(), frame, source_->seed());
        loaded = LoadedFrame{request.index, request.info,
                             std::make_shared<const trajectory::TrajectoryFrame>(std::move(frame)),
                             std::make_shared<const FrameAnalysis>(std::move(analysis))};
    } catch (const std::exception& failure) {  // a damaged or replaced file, a failed read, no memory
        const std::lock_guard lock{mutex_};
        error_ = failure.what();
        return;
    }
    const std::lock_guard lock{mutex_};
    remember(request, loaded);
    if (request.sequence > ready_sequence_) {
        ready_ = std::move(loaded);
        ready_sequence_ = request.sequence;
    }
}

}  // namespace brownfloc::viewer
