#pragma once
// Reads a trajectory file (format in trajectory/trajectory_format.hpp), including one that a
// run is still writing, one that was cut short, and one that is damaged or hostile.
//
//   TrajectoryReader reader{"run/trajectory.bftraj"};
//   for (const std::string& warning : reader.warnings()) std::cerr << "warning: " << warning << '\n';
//   TrajectoryFrame last = reader.read_frame(reader.frame_count() - 1);   // if frame_count() > 0
//   ...
//   reader.refresh();   // later: index the frames the run has appended since
//
// Construction checks the whole header and indexes the frames: each frame's header and
// payload CRCs are checked and its payload decoded and validated, one frame in memory at a
// time. A damaged frame is skipped with a warning naming its byte offset, and reading goes on
// at the next intact frame header; a file that ends inside a frame gets a warning too (it may
// still be being written). Only a bad file header or header payload throws
// TrajectoryFormatError. Nothing the file claims is allocated before it is checked against
// the bytes actually there. I/O failures, and a path that is not a regular file (a FIFO,
// /dev/zero), throw io::IoError at once, without blocking.
//
// Not thread-safe for concurrent calls on one reader (refresh() changes the index); separate
// readers of one file are independent.
#include <cstddef>
#include <cstdint>
#include <filesystem>
#include <limits>
#include <memory>
#include <span>
#include <string>
#include <vector>

#include "trajectory/trajectory_data.hpp"

namespace brownfloc::trajectory {

// Where an intact frame is, and the part of it a timeline needs without reading the payload.
struct FrameInfo {
    std::uint64_t frame_number = 0;  // as stored; rises strictly with the index, gaps mark lost frames
    std::int64_t step = 0;
    double time_s = 0.0;
    std::uint64_t offset_bytes = 0;   // of the frame header
    std::uint64_t payload_bytes = 0;  // the frame ends at offset_bytes + 32 + payload_bytes
    std::uint32_t payload_crc = 0;
};

class TrajectoryReader {
public:
    // Opens and indexes the file at path; with max_bytes, only its first max_bytes bytes (as
    // a checkpoint knew the file). Throws TrajectoryFormatError or io::IoError.
    explicit TrajectoryReader(const std::filesystem::path& path,
                              std::uint64_t max_bytes = std::numeric_limits<std::uint64_t>::max());
    // The same from a copy of bytes; name stands for the path in messages.
    [[nodiscard]] static TrajectoryReader from_bytes(std::span<const std::byte> bytes, std::string name = "<memory>");

    TrajectoryReader(TrajectoryReader&&) noexcept;
    TrajectoryReader& operator=(TrajectoryReader&&) noexcept;
    ~TrajectoryReader();

    [[nodiscard]] const TrajectoryHeader& header() const;
    [[nodiscard]] std::size_t particle_count() const;
    [[nodiscard]] bool positions_float64() const;

    // Intact frames, in file order.
    [[nodiscard]] std::size_t frame_count() const;
    // Index k < frame_count(); throws std::out_of_range otherwise.
    [[nodiscard]] const FrameInfo& frame_info(std::size_t k) const;
    // Reads, checks again and decodes frame k (positions as double whatever the storage).
    // Throws std::out_of_range, io::IoError, or TrajectoryFormatError if the bytes changed
    // since indexing (the file was rewritten: refresh() and try again).
    [[nodiscard]] TrajectoryFrame read_frame(std::size_t k) const;

    // Looks at the file again: indexes frames appended since (a torn last frame that has
    // since been completed included). Returns how many frames were added. If the file shrank
    // or its last indexed frame changed (a resumed run truncated it), the index is rebuilt and
    // every frame counts as added. Does nothing for a reader made from bytes.
    std::size_t refresh();

    // Damaged or skipped frames and a torn end, each naming a byte offset, in file order.
    [[nodiscard]] std::vector<std::string> warnings() const;
    // The file size at the last look (construction or refresh), in bytes.
    [[nodiscard]] std::uint64_t file_bytes() const;
    // Where the frames start: 32 + the header payload length.
    [[nodiscard]] std::uint64_t frames_offset_bytes() const;

private:
    struct State;  // the byte source, header and frame index; in src/reader_state.hpp
    explicit TrajectoryReader(std::unique_ptr<State> state);
    std::unique_ptr<State> state_;
};

}  // namespace brownfloc::trajectory
