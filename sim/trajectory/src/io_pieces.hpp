#pragma once
// The byte packing, bounds-checked reading and message helpers of brownfloc::io, under the
// names this library's sources use, and a ByteReader whose failures are
// TrajectoryFormatErrors.
#include <cstdint>
#include <span>
#include <string>
#include <string_view>

#include "io/byte_packing.hpp"
#include "io/byte_reader.hpp"
#include "io/message_text.hpp"

namespace brownfloc::trajectory::detail {

using io::ByteReader;
using io::ByteWriter;
using io::load_u32;
using io::load_u64;
using io::located;
using io::message;
using io::quoted;
using io::store_u32;
using io::store_u64;

[[noreturn]] void throw_format_error(const std::string& source, std::uint64_t offset_bytes, const std::string& problem);

[[nodiscard]] inline ByteReader trajectory_byte_reader(std::span<const std::byte> bytes, std::uint64_t base_offset,
                                                       std::string_view source_name, std::string_view region) {
    return ByteReader(bytes, base_offset, source_name, region, &throw_format_error);
}

}  // namespace brownfloc::trajectory::detail
