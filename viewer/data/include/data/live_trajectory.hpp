#pragma once
// A trajectory file followed while a run appends to it: a TrajectoryReader plus the checks
// that notice when the file grew, shrank (a resumed run cut it back to its checkpoint) or was
// replaced by another file (a new inode: `brownfloc run --overwrite`, or a copy).
//
//   LiveTrajectory live{locate_run("runs/a")};
//   ...every few hundred ms on the UI thread:
//   if (const PollResult p = live.poll(); p.reloaded) restart_timeline(); else if (p.frames_added) extend_timeline();
//
// poll() costs one stat() when nothing changed. After construction, problems with the file
// (it vanished, a replacement cannot be read yet, a refresh failed) do not throw: the frames
// already indexed stay, the problem is in warnings(), and the next poll() tries again.
//
// Not thread-safe: poll() changes the index, and header() and frame_info() return references
// into it that a reload invalidates (fetch them again after a poll() that says reloaded). Use
// one LiveTrajectory from one thread; FrameLoader reads frames on its own thread without
// touching it (see frame_loader.hpp).
#include <cstddef>
#include <cstdint>
#include <optional>
#include <string>
#include <sys/types.h>
#include <vector>

#include "data/run_location.hpp"
#include "trajectory/trajectory_reader.hpp"

namespace brownfloc::viewer {

// The end of the file: complete (nothing after the last intact frame), writing (bytes after
// it while the run's writer still holds its lock: the next frame is on its way), or
// incomplete_last_frame (bytes after it and no writer: a run killed mid-frame, or damage).
enum class TailState { complete, writing, incomplete_last_frame };

struct PollResult {
    std::size_t frames_added = 0;  // on a reload: every frame of the rebuilt index
    bool reloaded = false;         // file shrank, was rewritten, or replaced (new inode): index rebuilt
};

// Which file a path named when it was opened.
struct FileIdentity {
    dev_t device = 0;
    ino_t inode = 0;
    bool operator==(const FileIdentity&) const = default;
};

class LiveTrajectory {
public:
    // Opens and indexes where.trajectory. Throws trajectory::TrajectoryFormatError (a missing
    // or damaged header) or io::IoError (cannot be opened or read, not a regular file).
    explicit LiveTrajectory(RunLocation where);

    // Looks at the file again: a new inode reopens it, a changed size or modification time
    // indexes what was appended (or rebuilds the index if the file shrank or was rewritten).
    // Never throws for the file's sake (see above).
    PollResult poll();

    // The header; a reference that the next reload invalidates.
    [[nodiscard]] const trajectory::TrajectoryHeader& header() const;
    [[nodiscard]] std::size_t frame_count() const;
    // k < frame_count(), else std::out_of_range.
    [[nodiscard]] const trajectory::FrameInfo& frame_info(std::size_t k) const;
    // Reads and decodes frame k on the calling thread (std::out_of_range, io::IoError, or
    // TrajectoryFormatError if the frame changed since it was indexed: poll() and try again).
    [[nodiscard]] trajectory::TrajectoryFrame read_frame(std::size_t k) const;

    // From the reader's last look: whether bytes follow the last intact frame, and if so
    // whether the run's writer holds its lock now (reads /proc/locks only then).
    [[nodiscard]] TailState tail_state() const;
    // Whether a writer holds <run_directory>/.lock now; false for a lone trajectory file.
    [[nodiscard]] bool writer_active() const;
    // The reader's warnings (damaged frames skipped, a torn tail), then any problem following
    // the file (it vanished, its replacement cannot be read yet).
    [[nodiscard]] std::vector<std::string> warnings() const;
    [[nodiscard]] const RunLocation& location() const;

    // Counts reloads (index rebuilt or file reopened), starting at 0: frame indices from one
    // generation mean nothing in another.
    [[nodiscard]] std::uint64_t generation() const { return generation_; }
    // The open file and where its frames start (32 + header payload bytes), for FrameLoader.
    [[nodiscard]] const FileIdentity& file_identity() const { return identity_; }
    [[nodiscard]] std::uint64_t frames_offset_bytes() const;

private:
    struct FileLook {
        FileIdentity identity;
        std::int64_t size_bytes = 0;
        std::int64_t modified_ns = 0;
    };
    struct OpenedReader;
    [[nodiscard]] std::optional<FileLook> look() const;
    // A reader on the file the path names now, and how that file looked (throws as the
    // constructor does).
    [[nodiscard]] OpenedReader open_reader() const;
    PollResult reopen();
    PollResult refresh();

    RunLocation where_;
    std::optional<trajectory::TrajectoryReader> reader_;  // always set after construction
    FileIdentity identity_;
    FileLook last_look_;
    std::uint64_t generation_ = 0;
    bool reader_suspect_ = false;         // a refresh failed: reopen at the next change
    std::optional<std::string> problem_;  // the last problem following the file, if unresolved
};

}  // namespace brownfloc::viewer
