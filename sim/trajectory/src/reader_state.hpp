#pragma once
// The inside of a TrajectoryReader: its byte source, the decoded header and the frame index,
// and where indexing stands (a clean end, a torn last frame, or a damaged stretch in which it
// is looking for the next intact frame header).
#include <array>
#include <cstdint>
#include <optional>
#include <string>
#include <vector>

#include "byte_source.hpp"
#include "fixed_headers.hpp"
#include "frame_shape.hpp"
#include "trajectory/trajectory_reader.hpp"

namespace brownfloc::trajectory {

struct TrajectoryReader::State {
    struct Warning {
        std::uint64_t offset_bytes;
        std::string text;  // "<source>: byte <offset>: ..."
    };
    // A damaged stretch not yet closed by an intact frame header.
    struct OpenDamage {
        std::uint64_t offset_bytes;
        std::string problem;
    };

    State(detail::ByteSource byte_source, std::uint64_t byte_limit)
        : source{std::move(byte_source)}, max_bytes{byte_limit} {}

    detail::ByteSource source;
    std::uint64_t max_bytes;   // bytes beyond this are ignored (resume checks)
    std::uint64_t file_bytes = 0;  // measured at the last look

    detail::FixedHeaderBytes file_header{};
    TrajectoryHeader header;
    detail::FrameShape shape;
    std::uint64_t frames_offset = 0;

    std::vector<FrameInfo> index;
    std::uint64_t scan_offset = 0;  // where the next frame (or the search for one) starts
    std::optional<OpenDamage> open_damage;
    std::vector<Warning> warnings;
    std::optional<std::string> tail_warning;  // recomputed at every look

    // Reused while indexing, so that a long file costs one frame of memory.
    std::vector<std::byte> payload_buffer;
    std::vector<std::byte> scan_buffer;
    TrajectoryFrame scratch_frame;

    // The bytes indexing may look at: min(file_bytes, max_bytes).
    [[nodiscard]] std::uint64_t readable_end() const { return file_bytes < max_bytes ? file_bytes : max_bytes; }

    // Reads and checks the file header and header payload, then empties the index to start
    // at the first frame. Changes nothing if it throws (TrajectoryFormatError, io::IoError).
    void load_header();
    // Indexes from scan_offset to readable_end() (frame_indexing.cpp).
    void index_new_bytes();
    // Whether the file header and the last indexed frame header are still what was indexed.
    [[nodiscard]] bool indexed_bytes_unchanged() const;

private:
    void index_frame(const detail::FrameHeaderFields& fields, std::uint64_t end, bool& stop);
    [[nodiscard]] bool find_next_frame_header(std::uint64_t end);
    void open_damage_at(std::uint64_t offset_bytes, std::string problem, std::uint64_t resume_at);
    void add_warning(std::uint64_t offset_bytes, const std::string& problem);
};

}  // namespace brownfloc::trajectory
