#pragma once
// The two fixed 32-byte headers of the format: the file header at byte 0 and the header at the
// start of every frame (layout in trajectory/trajectory_format.hpp).
#include <array>
#include <cstddef>
#include <cstdint>
#include <span>
#include <string>

namespace brownfloc::trajectory::detail {

using FixedHeaderBytes = std::array<std::byte, 32>;

struct FileHeaderFields {
    bool positions_float64 = false;
    std::uint64_t payload_bytes = 0;
    std::uint32_t payload_crc = 0;
};

[[nodiscard]] FixedHeaderBytes encode_file_header(bool positions_float64, std::uint64_t payload_bytes,
                                                  std::uint32_t payload_crc);
// Checks magic, CRC, version, flags and the payload length cap; throws TrajectoryFormatError.
[[nodiscard]] FileHeaderFields decode_file_header(std::span<const std::byte, 32> bytes, const std::string& source);

struct FrameHeaderFields {
    std::uint64_t frame_number = 0;
    std::uint64_t payload_bytes = 0;
    std::uint32_t payload_crc = 0;
};

enum class FrameHeaderCheck { intact, no_sync_marker, crc_mismatch, reserved_not_zero };

[[nodiscard]] FixedHeaderBytes encode_frame_header(std::uint64_t frame_number, std::uint64_t payload_bytes,
                                                   std::uint32_t payload_crc);
// Fills fields and returns intact, or says what is wrong (fields then undefined).
[[nodiscard]] FrameHeaderCheck check_frame_header(std::span<const std::byte, 32> bytes, FrameHeaderFields& fields);
// Whether the 4 bytes at `at` are the frame sync marker.
[[nodiscard]] bool is_sync_marker(const std::byte* at);

}  // namespace brownfloc::trajectory::detail
