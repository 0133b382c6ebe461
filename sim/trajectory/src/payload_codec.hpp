#pragma once
// The header payload and the frame payload: encoding by explicit byte packing, decoding with a
// bounds-checked reader (layouts in trajectory/trajectory_format.hpp). Decoding checks structure
// (lengths, counts, booleans); the value rules are in content_rules.hpp.
#include <cstddef>
#include <cstdint>
#include <span>
#include <string>
#include <vector>

#include "frame_shape.hpp"
#include "trajectory/trajectory_data.hpp"

namespace brownfloc::trajectory::detail {

// Appends the header payload to out. The header must pass header_problem().
void encode_header_payload(const TrajectoryHeader& header, std::vector<std::byte>& out);

// Decodes a header payload found at byte base_offset of source and checks every rule; throws
// TrajectoryFormatError naming the offset and the field.
[[nodiscard]] TrajectoryHeader decode_header_payload(std::span<const std::byte> bytes, std::uint64_t base_offset,
                                                     const std::string& source);

// Appends the frame payload to out. The frame must pass frame_problem() for this shape.
void encode_frame_payload(const TrajectoryFrame& frame, const FrameShape& shape, std::vector<std::byte>& out);

// Decodes a frame payload into `into` (reusing its vectors' capacity) and checks the rules of
// frame_problem(); throws TrajectoryFormatError naming the offset and the field.
void decode_frame_payload(std::span<const std::byte> bytes, const FrameShape& shape, std::uint64_t base_offset,
                          const std::string& source, TrajectoryFrame& into);

}  // namespace brownfloc::trajectory::detail
