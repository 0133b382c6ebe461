#pragma once
// Writes a trajectory file (format in trajectory/trajectory_format.hpp), append-only: no byte
// is ever rewritten, so a reader may follow the file while the run writes it.
//
//   TrajectoryWriter out = TrajectoryWriter::create("run/trajectory.bftraj", header, false);
//   out.append(frame);                       // frame number 0, then 1, 2, ...
//   out.sync();                              // before a checkpoint records out.bytes(), out.frames()
//   ...after a crash, from the checkpoint:
//   TrajectoryWriter again = TrajectoryWriter::reopen_for_append(path, saved_bytes, saved_frames);
//
// Every value is checked against the format's rules before it is written (std::invalid_argument
// for misuse), so the writer never produces a file its reader refuses. A failed write (disk
// full, file-size limit: io::IoError naming the path and the reason) first cuts the file back
// to its last complete frame, so the file stays readable and the same frame can be appended
// again once there is room. Not thread-safe; one writer per file.
#include <cstddef>
#include <cstdint>
#include <filesystem>
#include <vector>

#include "io/unique_fd.hpp"
#include "trajectory/trajectory_data.hpp"

namespace brownfloc::trajectory {

class TrajectoryWriter {
public:
    // Creates path (refused if anything exists there, a link included) and writes the file
    // header and the header payload. positions_float64 stores positions as float64 (exact)
    // rather than float32 (relative error <= 2^-24, half the size). Throws
    // std::invalid_argument for a header that breaks a rule, io::IoError; on failure no file
    // is left behind.
    [[nodiscard]] static TrajectoryWriter create(const std::filesystem::path& path, const TrajectoryHeader& header,
                                                 bool positions_float64);

    // Resumes a file from a checkpoint that recorded bytes() = valid_bytes and frames() =
    // frames_written: checks that the file's first valid_bytes bytes hold a valid header and
    // end exactly with intact frame frames_written - 1 (or with the header when 0), cuts off
    // anything after them, and appends from there. Throws TrajectoryFormatError (naming the
    // path, the byte offset and the mismatch) or io::IoError.
    [[nodiscard]] static TrajectoryWriter reopen_for_append(const std::filesystem::path& path, std::uint64_t valid_bytes,
                                                            std::uint64_t frames_written);

    TrajectoryWriter(TrajectoryWriter&&) noexcept = default;
    TrajectoryWriter& operator=(TrajectoryWriter&&) noexcept = default;

    // Appends frame as frame number frames(). Throws std::invalid_argument (sizes against N,
    // non-finite or out-of-range values, time earlier than the previous frame's, a position
    // beyond float32 range in a float32 file) or io::IoError (after cutting the file back).
    void append(const TrajectoryFrame& frame);

    // Bytes in the file up to the end of the last complete frame, and frames written: the two
    // numbers a checkpoint keeps for reopen_for_append.
    [[nodiscard]] std::uint64_t bytes() const { return bytes_; }
    [[nodiscard]] std::uint64_t frames() const { return frames_; }

    // fsync of the file (and, the first time, of its directory, so the name is durable too).
    void sync();

    [[nodiscard]] const std::filesystem::path& path() const { return path_; }
    [[nodiscard]] std::size_t particle_count() const { return particle_count_; }
    [[nodiscard]] bool positions_float64() const { return positions_float64_; }

private:
    TrajectoryWriter(io::UniqueFd fd, std::filesystem::path path, std::size_t particle_count, bool positions_float64,
                     std::uint64_t bytes, std::uint64_t frames, double last_time_s);

    io::UniqueFd fd_;
    std::filesystem::path path_;
    std::size_t particle_count_;
    bool positions_float64_;
    std::uint64_t bytes_;
    std::uint64_t frames_;
    double last_time_s_;
    bool directory_synced_ = false;
    // Set when a failed write could not be cut back: the file's end is then unknown.
    bool end_unknown_ = false;
    std::vector<std::byte> buffer_;  // one encoded frame, reused
};

}  // namespace brownfloc::trajectory
