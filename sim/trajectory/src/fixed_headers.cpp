#include "fixed_headers.hpp"

#include <cstdio>

#include "io_pieces.hpp"
#include "trajectory/crc32c.hpp"
#include "trajectory/trajectory_error.hpp"
#include "trajectory/trajectory_format.hpp"

namespace brownfloc::trajectory::detail {
namespace {

std::string hex32(std::uint32_t value) {
    char buffer[16];
    std::snprintf(buffer, sizeof buffer, "0x%08X", static_cast<unsigned>(value));
    return buffer;
}

std::uint32_t crc_of_first_28(std::span<const std::byte, 32> bytes) { return crc32c(bytes.first<28>()); }

}  // namespace

FixedHeaderBytes encode_file_header(bool positions_float64, std::uint64_t payload_bytes, std::uint32_t payload_crc) {
    FixedHeaderBytes bytes{};
    for (std::size_t i = 0; i < format::magic.size(); ++i) bytes[i] = static_cast<std::byte>(format::magic[i]);
    store_u32(&bytes[8], format::version);
    store_u32(&bytes[12], positions_float64 ? format::flag_positions_float64 : 0u);
    store_u64(&bytes[16], payload_bytes);
    store_u32(&bytes[24], payload_crc);
    store_u32(&bytes[28], crc_of_first_28(bytes));
    return bytes;
}

FileHeaderFields decode_file_header(std::span<const std::byte, 32> bytes, const std::string& source) {
    const std::string_view magic{reinterpret_cast<const char*>(bytes.data()), format::magic.size()};
    if (magic != format::magic)
        throw TrajectoryFormatError(source, 0, message("not a brownfloc trajectory: the file starts with ", quoted(magic),
                                                       ", not \"", format::magic, "\""));
    const std::uint32_t stored_crc = load_u32(&bytes[28]);
    if (const std::uint32_t actual_crc = crc_of_first_28(bytes); actual_crc != stored_crc)
        throw TrajectoryFormatError(source, 28, message("the file header is damaged: its CRC-32C is ", hex32(actual_crc),
                                                        ", the stored value is ", hex32(stored_crc)));
    if (const std::uint32_t version = load_u32(&bytes[8]); version != format::version)
        throw TrajectoryFormatError(source, 8, message("format version ", version, " is not supported (this build reads version ",
                                                       format::version, ")"));
    const std::uint32_t flags = load_u32(&bytes[12]);
    if ((flags & ~format::known_flags) != 0)
        throw TrajectoryFormatError(source, 12, message("unknown flags ", hex32(flags & ~format::known_flags),
                                                        " (format version 1 knows only bit 0, positions as float64)"));
    FileHeaderFields fields;
    fields.positions_float64 = (flags & format::flag_positions_float64) != 0;
    fields.payload_bytes = load_u64(&bytes[16]);
    fields.payload_crc = load_u32(&bytes[24]);
    if (fields.payload_bytes > format::max_header_payload_bytes)
        throw TrajectoryFormatError(source, 16, message("the header payload would be ", fields.payload_bytes,
                                                        " bytes, more than the format's limit of ",
                                                        format::max_header_payload_bytes));
    return fields;
}

FixedHeaderBytes encode_frame_header(std::uint64_t frame_number, std::uint64_t payload_bytes, std::uint32_t payload_crc) {
    FixedHeaderBytes bytes{};
    store_u32(&bytes[0], format::frame_sync_marker);
    store_u32(&bytes[4], 0u);
    store_u64(&bytes[8], frame_number);
    store_u64(&bytes[16], payload_bytes);
    store_u32(&bytes[24], payload_crc);
    store_u32(&bytes[28], crc_of_first_28(bytes));
    return bytes;
}

FrameHeaderCheck check_frame_header(std::span<const std::byte, 32> bytes, FrameHeaderFields& fields) {
    if (!is_sync_marker(bytes.data())) return FrameHeaderCheck::no_sync_marker;
    if (crc_of_first_28(bytes) != load_u32(&bytes[28])) return FrameHeaderCheck::crc_mismatch;
    if (load_u32(&bytes[4]) != 0u) return FrameHeaderCheck::reserved_not_zero;
    fields.frame_number = load_u64(&bytes[8]);
    fields.payload_bytes = load_u64(&bytes[16]);
    fields.payload_crc = load_u32(&bytes[24]);
    return FrameHeaderCheck::intact;
}

bool is_sync_marker(const std::byte* at) { return load_u32(at) == format::frame_sync_marker; }

}  // namespace brownfloc::trajectory::detail
