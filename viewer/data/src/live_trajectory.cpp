#include "data/live_trajectory.hpp"

#include <sys/stat.h>

#include <exception>
#include <utility>

#include "data/writer_status.hpp"
#include "trajectory/trajectory_format.hpp"

namespace brownfloc::viewer {
namespace {

bool same_frame(const trajectory::FrameInfo& a, const trajectory::FrameInfo& b) {
    return a.frame_number == b.frame_number && a.offset_bytes == b.offset_bytes && a.payload_bytes == b.payload_bytes &&
           a.payload_crc == b.payload_crc;
}

}  // namespace

struct LiveTrajectory::OpenedReader {
    trajectory::TrajectoryReader reader;
    FileLook seen;
};

LiveTrajectory::LiveTrajectory(RunLocation where) : where_{std::move(where)} {
    OpenedReader opened = open_reader();
    reader_.emplace(std::move(opened.reader));
    identity_ = opened.seen.identity;
    last_look_ = opened.seen;
}

std::optional<LiveTrajectory::FileLook> LiveTrajectory::look() const {
    struct stat facts {};
    if (::stat(where_.trajectory.c_str(), &facts) != 0) return std::nullopt;
    FileLook seen;
    seen.identity = FileIdentity{facts.st_dev, facts.st_ino};
    seen.size_bytes = static_cast<std::int64_t>(facts.st_size);
    seen.modified_ns = static_cast<std::int64_t>(facts.st_mtim.tv_sec) * 1'000'000'000 + facts.st_mtim.tv_nsec;
    return seen;
}

LiveTrajectory::OpenedReader LiveTrajectory::open_reader() const {
    // The reader keeps its own descriptor and does not say which inode it opened: look at the
    // path before and after, and accept the reader when both looks name one file. A file
    // replaced in between (twice in a row at most, in practice) is opened again.
    for (int attempt = 0;; ++attempt) {
        const std::optional<FileLook> before = look();
        trajectory::TrajectoryReader reader{where_.trajectory};  // throws for a missing or bad file
        const std::optional<FileLook> after = look();
        if ((before && after && before->identity == after->identity) || attempt == 2) {
            // The reader measured the size itself; the look before it is the baseline, so that
            // anything written after it shows up as a change at the next poll().
            return OpenedReader{std::move(reader), before.value_or(after.value_or(FileLook{}))};
        }
    }
}

PollResult LiveTrajectory::poll() {
    const std::optional<FileLook> now = look();
    if (!now) {
        std::string text = where_.trajectory.string();
        text += ": the file is gone; showing the frames read before";
        problem_ = text;
        return {};
    }
    const bool changed = now->identity != last_look_.identity || now->size_bytes != last_look_.size_bytes ||
                         now->modified_ns != last_look_.modified_ns;
    if (now->identity != identity_ || reader_suspect_) {
        if (!changed) return {};  // already tried on this state of the file
        last_look_ = *now;
        return reopen();
    }
    if (!changed && static_cast<std::uint64_t>(now->size_bytes) == reader_->file_bytes()) {
        problem_.reset();
        return {};
    }
    last_look_ = *now;
    return refresh();
}

PollResult LiveTrajectory::reopen() {
    try {
        OpenedReader opened = open_reader();
        reader_.emplace(std::move(opened.reader));
        identity_ = opened.seen.identity;
        last_look_ = opened.seen;
    } catch (const std::exception& error) {
        std::string text = where_.trajectory.string();
        text += reader_suspect_ ? ": cannot be read again (" : ": was replaced, and the new file cannot be read (yet): ";
        text += error.what();
        if (reader_suspect_) text += ")";
        text += "; showing the frames read before";
        problem_ = text;
        return {};
    }
    reader_suspect_ = false;
    problem_.reset();
    ++generation_;
    return PollResult{reader_->frame_count(), true};
}

PollResult LiveTrajectory::refresh() {
    const std::size_t count_before = reader_->frame_count();
    const std::uint64_t bytes_before = reader_->file_bytes();
    std::optional<trajectory::FrameInfo> last_before;
    if (count_before > 0) last_before = reader_->frame_info(count_before - 1);
    try {
        reader_->refresh();
    } catch (const std::exception& error) {
        // The file was cut back to something that is no longer a trajectory, or a read failed:
        // the index may no longer fit the file. Reopen it at the next change.
        std::string text = where_.trajectory.string();
        text += ": cannot follow the file: ";
        text += error.what();
        text += "; showing the frames read before";
        problem_ = text;
        reader_suspect_ = true;
        return {};
    }
    problem_.reset();
    const std::size_t count_now = reader_->frame_count();
    // TrajectoryReader::refresh() rebuilds its index silently when the file shrank or its last
    // indexed frame changed; the frame that was last before tells whether the old indices
    // still hold.
    const bool rebuilt = reader_->file_bytes() < bytes_before ||
                         (last_before && (count_now < count_before ||
                                          !same_frame(reader_->frame_info(count_before - 1), *last_before)));
    if (rebuilt) {
        ++generation_;
        return PollResult{count_now, true};
    }
    return PollResult{count_now - count_before, false};
}

const trajectory::TrajectoryHeader& LiveTrajectory::header() const { return reader_->header(); }
std::size_t LiveTrajectory::frame_count() const { return reader_->frame_count(); }
const trajectory::FrameInfo& LiveTrajectory::frame_info(std::size_t k) const { return reader_->frame_info(k); }
trajectory::TrajectoryFrame LiveTrajectory::read_frame(std::size_t k) const { return reader_->read_frame(k); }
const RunLocation& LiveTrajectory::location() const { return where_; }
std::uint64_t LiveTrajectory::frames_offset_bytes() const { return reader_->frames_offset_bytes(); }

TailState LiveTrajectory::tail_state() const {
    const std::size_t count = reader_->frame_count();
    std::uint64_t intact_end = reader_->frames_offset_bytes();
    if (count > 0) {
        const trajectory::FrameInfo& last = reader_->frame_info(count - 1);
        intact_end = last.offset_bytes + trajectory::format::frame_header_bytes + last.payload_bytes;
    }
    if (reader_->file_bytes() <= intact_end) return TailState::complete;
    return writer_active() ? TailState::writing : TailState::incomplete_last_frame;
}

bool LiveTrajectory::writer_active() const {
    if (where_.run_directory.empty()) return false;
    return writer_holds_lock(where_.run_directory / ".lock");
}

std::vector<std::string> LiveTrajectory::warnings() const {
    std::vector<std::string> texts = reader_->warnings();
    if (problem_) texts.push_back(*problem_);
    return texts;
}

}  // namespace brownfloc::viewer
