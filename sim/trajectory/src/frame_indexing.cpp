// Building the frame index: walk frame headers from the end of the header payload, check
// each frame completely (both CRCs, structure, value rules, rising frame number and time),
// and get past damage. Every step moves forward, and every byte is read a bounded number of
// times (a damaged payload once for its CRC, a damaged stretch once by the sync search), so
// indexing is linear in the file size whatever the file holds.
#include <algorithm>
#include <cstdio>

#include "io_pieces.hpp"
#include "payload_codec.hpp"
#include "reader_state.hpp"
#include "trajectory/crc32c.hpp"
#include "trajectory/trajectory_error.hpp"
#include "trajectory/trajectory_format.hpp"

namespace brownfloc::trajectory {
namespace {

constexpr std::size_t header_bytes = format::frame_header_bytes;
// The sync search reads this much at a time (plus 31 bytes of overlap, so that a header
// starting near the end of a window is usually checked without another read).
constexpr std::size_t scan_window_bytes = 64 * 1024;

std::string hex32(std::uint32_t value) {
    char buffer[16];
    std::snprintf(buffer, sizeof buffer, "0x%08X", static_cast<unsigned>(value));
    return buffer;
}

std::string_view as_text(std::span<const std::byte> bytes) {
    return {reinterpret_cast<const char*>(bytes.data()), bytes.size()};
}

}  // namespace

void TrajectoryReader::State::add_warning(std::uint64_t offset_bytes, const std::string& problem) {
    warnings.push_back(Warning{offset_bytes, detail::located(source.name(), offset_bytes, problem)});
}

void TrajectoryReader::State::open_damage_at(std::uint64_t offset_bytes, std::string problem, std::uint64_t resume_at) {
    open_damage = OpenDamage{offset_bytes, std::move(problem)};
    scan_offset = resume_at;
}

void TrajectoryReader::State::index_new_bytes() {
    const std::uint64_t end = readable_end();
    tail_warning.reset();
    for (;;) {
        if (open_damage) {
            if (!find_next_frame_header(end)) return;
            const OpenDamage closed = *open_damage;
            open_damage.reset();
            add_warning(closed.offset_bytes, detail::message(closed.problem, "; skipped ", scan_offset - closed.offset_bytes,
                                                             " bytes to the next intact frame header, at byte ",
                                                             scan_offset));
        }
        if (scan_offset >= end) return;
        const std::uint64_t left = end - scan_offset;
        std::array<std::byte, header_bytes> bytes{};
        if (left < header_bytes) {
            // Too short for a frame header: a frame still being written or cut off, unless the
            // bytes there already cannot start one.
            const std::span<std::byte> present{bytes.data(), static_cast<std::size_t>(left)};
            source.read(scan_offset, present);
            if (left >= 4 && !detail::is_sync_marker(bytes.data())) {
                open_damage_at(scan_offset, detail::message("no frame sync marker where a frame should start (found ",
                                                            detail::quoted(as_text(present.first(4))), ")"),
                               scan_offset + 1);
                continue;
            }
            tail_warning = detail::located(source.name(), scan_offset,
                                           detail::message("the file ends ", left,
                                                           " bytes into a frame header: a torn last frame (still being "
                                                           "written, or cut off)"));
            return;
        }
        source.read(scan_offset, bytes);
        detail::FrameHeaderFields fields;
        switch (detail::check_frame_header(bytes, fields)) {
        case detail::FrameHeaderCheck::no_sync_marker:
            open_damage_at(scan_offset, detail::message("no frame sync marker where a frame should start (found ",
                                                        detail::quoted(as_text(std::span{bytes}.first(4))), ")"),
                           scan_offset + 1);
            continue;
        case detail::FrameHeaderCheck::crc_mismatch:
            open_damage_at(scan_offset, "frame header damaged (its CRC-32C does not match)", scan_offset + 1);
            continue;
        case detail::FrameHeaderCheck::reserved_not_zero:
            open_damage_at(scan_offset, "frame header has a non-zero reserved field", scan_offset + 1);
            continue;
        case detail::FrameHeaderCheck::intact:
            break;
        }
        bool stop = false;
        index_frame(fields, end, stop);
        if (stop) return;
    }
}

void TrajectoryReader::State::index_frame(const detail::FrameHeaderFields& fields, std::uint64_t end, bool& stop) {
    const std::uint64_t at = scan_offset;
    const std::uint64_t payload = fields.payload_bytes;
    const std::uint64_t min_payload = shape.min_payload_bytes(), max_payload = shape.max_payload_bytes();
    if (payload < min_payload || payload > max_payload || (payload - min_payload) % 4 != 0) {
        // The header's CRC holds, yet its length cannot be right for N particles: it cannot be
        // trusted to skip the payload, so search on from the end of the header.
        open_damage_at(at, detail::message("frame ", fields.frame_number, " claims a payload of ", payload, " bytes; ",
                                           shape.particle_count, " particles need ", min_payload,
                                           " plus 4 per spanning cluster, at most ", max_payload),
                       at + header_bytes);
        return;
    }
    const std::uint64_t present = end - at - header_bytes;
    if (payload > present) {
        tail_warning = detail::located(source.name(), at,
                                       detail::message("frame ", fields.frame_number, " is torn: the file ends ", present,
                                                       " bytes into its ", payload,
                                                       "-byte payload (still being written, or cut off)"));
        stop = true;
        return;
    }
    const std::uint64_t frame_end = at + header_bytes + payload;
    // payload <= max_payload_bytes() < 2^37 and the bytes are in the file: a bounded allocation.
    payload_buffer.resize(static_cast<std::size_t>(payload));
    source.read(at + header_bytes, payload_buffer);
    // An intact header with a damaged payload: the header's length is trustworthy, so the next
    // frame starts right after this one.
    if (const std::uint32_t actual = crc32c(payload_buffer); actual != fields.payload_crc) {
        add_warning(at, detail::message("frame ", fields.frame_number, " skipped: its payload is damaged (CRC-32C ",
                                        hex32(actual), ", stored ", hex32(fields.payload_crc), ")"));
        scan_offset = frame_end;
        return;
    }
    scan_offset = frame_end;
    try {
        detail::decode_frame_payload(payload_buffer, shape, at + header_bytes, source.name(), scratch_frame);
    } catch (const TrajectoryFormatError& error) {
        add_warning(error.offset_bytes(), detail::message("frame ", fields.frame_number, " skipped: ", error.problem()));
        return;
    }
    if (!index.empty()) {
        const FrameInfo& previous = index.back();
        if (fields.frame_number <= previous.frame_number) {
            add_warning(at, detail::message("frame ", fields.frame_number, " skipped: its number does not rise after frame ",
                                            previous.frame_number));
            return;
        }
        if (scratch_frame.time_s < previous.time_s) {
            add_warning(at, detail::message("frame ", fields.frame_number, " skipped: time_s = ", scratch_frame.time_s,
                                            " is earlier than frame ", previous.frame_number, "'s ", previous.time_s));
            return;
        }
    }
    index.push_back(FrameInfo{fields.frame_number, scratch_frame.step, scratch_frame.time_s, at, payload, fields.payload_crc});
}

bool TrajectoryReader::State::find_next_frame_header(std::uint64_t end) {
    std::uint64_t start = scan_offset;
    while (start + 4 <= end) {
        const std::size_t window = static_cast<std::size_t>(std::min<std::uint64_t>(scan_window_bytes + 31, end - start));
        scan_buffer.resize(window);
        source.read(start, scan_buffer);
        for (std::size_t i = 0; i + 4 <= window; ++i) {
            if (!detail::is_sync_marker(scan_buffer.data() + i)) continue;
            const std::uint64_t candidate = start + i;
            if (end - candidate < header_bytes) {
                // A marker whose header is not all there yet: look again here next time.
                scan_offset = candidate;
                return false;
            }
            std::array<std::byte, header_bytes> bytes{};
            if (i + header_bytes <= window)
                std::copy_n(scan_buffer.begin() + static_cast<std::ptrdiff_t>(i), header_bytes, bytes.begin());
            else
                source.read(candidate, bytes);
            detail::FrameHeaderFields fields;
            if (detail::check_frame_header(bytes, fields) == detail::FrameHeaderCheck::intact) {
                scan_offset = candidate;
                return true;
            }
        }
        start += window - 3;  // the first position not yet examined
    }
    scan_offset = start;
    return false;
}

}  // namespace brownfloc::trajectory
