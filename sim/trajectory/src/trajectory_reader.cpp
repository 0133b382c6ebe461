#include "trajectory/trajectory_reader.hpp"

#include <algorithm>
#include <stdexcept>

#include "io_pieces.hpp"
#include "payload_codec.hpp"
#include "reader_state.hpp"
#include "trajectory/crc32c.hpp"
#include "trajectory/trajectory_error.hpp"
#include "trajectory/trajectory_format.hpp"

namespace brownfloc::trajectory {
namespace {

constexpr std::size_t fixed_bytes = format::file_header_bytes;

}  // namespace

void TrajectoryReader::State::load_header() {
    const std::uint64_t end = readable_end();
    const std::string& name = source.name();
    detail::FixedHeaderBytes bytes{};
    const std::size_t present = static_cast<std::size_t>(std::min<std::uint64_t>(end, fixed_bytes));
    source.read(0, std::span{bytes}.first(present));
    if (present < fixed_bytes) {
        // Say "not a trajectory" rather than "too short" when the magic is already wrong.
        const std::string_view start{reinterpret_cast<const char*>(bytes.data()), std::min(present, format::magic.size())};
        if (!format::magic.starts_with(start))
            throw TrajectoryFormatError(name, 0, detail::message("not a brownfloc trajectory: the file starts with ",
                                                                 detail::quoted(start), ", not \"", format::magic, "\""));
        throw TrajectoryFormatError(name, present, detail::message("the file has ", present, " bytes, fewer than the ",
                                                                   fixed_bytes, "-byte file header"));
    }
    const detail::FileHeaderFields fields = detail::decode_file_header(bytes, name);
    if (fields.payload_bytes > end - fixed_bytes)
        throw TrajectoryFormatError(name, fixed_bytes, detail::message("the header payload should have ", fields.payload_bytes,
                                                                       " bytes, but the file has only ", end - fixed_bytes,
                                                                       " after the file header"));
    // At most 2^30 bytes (decode_file_header) and all of them present in the file.
    std::vector<std::byte> payload(static_cast<std::size_t>(fields.payload_bytes));
    source.read(fixed_bytes, payload);
    if (crc32c(payload) != fields.payload_crc)
        throw TrajectoryFormatError(name, fixed_bytes, "the header payload is damaged (its CRC-32C does not match)");
    TrajectoryHeader decoded = detail::decode_header_payload(payload, fixed_bytes, name);

    file_header = bytes;
    shape = detail::FrameShape{decoded.radius_nm.size(), fields.positions_float64};
    header = std::move(decoded);
    frames_offset = fixed_bytes + fields.payload_bytes;
    index.clear();
    warnings.clear();
    open_damage.reset();
    tail_warning.reset();
    scan_offset = frames_offset;
}

bool TrajectoryReader::State::indexed_bytes_unchanged() const {
    const std::uint64_t end = readable_end();
    if (end < frames_offset) return false;
    detail::FixedHeaderBytes bytes{};
    source.read(0, bytes);
    if (bytes != file_header) return false;
    if (index.empty()) return true;
    const FrameInfo& last = index.back();
    if (last.offset_bytes > end || end - last.offset_bytes < format::frame_header_bytes + last.payload_bytes) return false;
    source.read(last.offset_bytes, bytes);
    detail::FrameHeaderFields fields;
    return detail::check_frame_header(bytes, fields) == detail::FrameHeaderCheck::intact &&
           fields.frame_number == last.frame_number && fields.payload_bytes == last.payload_bytes &&
           fields.payload_crc == last.payload_crc;
}

TrajectoryReader::TrajectoryReader(std::unique_ptr<State> state) : state_{std::move(state)} {
    state_->file_bytes = state_->source.measure_size();
    state_->load_header();
    state_->index_new_bytes();
}

TrajectoryReader::TrajectoryReader(const std::filesystem::path& path, std::uint64_t max_bytes)
    : TrajectoryReader(std::make_unique<State>(detail::ByteSource::open_file(path), max_bytes)) {}

TrajectoryReader TrajectoryReader::from_bytes(std::span<const std::byte> bytes, std::string name) {
    return TrajectoryReader(std::make_unique<State>(detail::ByteSource::hold_bytes(bytes, std::move(name)),
                                                    std::numeric_limits<std::uint64_t>::max()));
}

TrajectoryReader::TrajectoryReader(TrajectoryReader&&) noexcept = default;
TrajectoryReader& TrajectoryReader::operator=(TrajectoryReader&&) noexcept = default;
TrajectoryReader::~TrajectoryReader() = default;

const TrajectoryHeader& TrajectoryReader::header() const { return state_->header; }
std::size_t TrajectoryReader::particle_count() const { return state_->shape.particle_count; }
bool TrajectoryReader::positions_float64() const { return state_->shape.positions_float64; }
std::size_t TrajectoryReader::frame_count() const { return state_->index.size(); }
std::uint64_t TrajectoryReader::file_bytes() const { return state_->file_bytes; }
std::uint64_t TrajectoryReader::frames_offset_bytes() const { return state_->frames_offset; }

const FrameInfo& TrajectoryReader::frame_info(std::size_t k) const {
    if (k >= state_->index.size())
        throw std::out_of_range(detail::message(state_->source.name(), ": frame index ", k, " is out of range: there are ",
                                                state_->index.size(), " intact frames"));
    return state_->index[k];
}

TrajectoryFrame TrajectoryReader::read_frame(std::size_t k) const {
    const FrameInfo& info = frame_info(k);
    const std::string& name = state_->source.name();
    // Bounded: payload_bytes passed the size checks for N when the frame was indexed.
    std::vector<std::byte> bytes(format::frame_header_bytes + static_cast<std::size_t>(info.payload_bytes));
    state_->source.read(info.offset_bytes, bytes);
    detail::FrameHeaderFields fields;
    const std::span<const std::byte, format::frame_header_bytes> header_bytes{bytes.data(), format::frame_header_bytes};
    const std::span<const std::byte> payload = std::span<const std::byte>{bytes}.subspan(format::frame_header_bytes);
    if (detail::check_frame_header(header_bytes, fields) != detail::FrameHeaderCheck::intact ||
        fields.frame_number != info.frame_number || fields.payload_bytes != info.payload_bytes ||
        fields.payload_crc != info.payload_crc || crc32c(payload) != info.payload_crc)
        throw TrajectoryFormatError(name, info.offset_bytes,
                                    detail::message("frame ", info.frame_number,
                                                    " has changed since it was indexed (was the file rewritten? refresh "
                                                    "the reader)"));
    TrajectoryFrame frame;
    detail::decode_frame_payload(payload, state_->shape, info.offset_bytes + format::frame_header_bytes, name, frame);
    return frame;
}

std::size_t TrajectoryReader::refresh() {
    State& state = *state_;
    if (!state.source.is_file()) return 0;
    const std::uint64_t previous_bytes = state.file_bytes;
    state.file_bytes = state.source.measure_size();
    if (state.file_bytes < previous_bytes || !state.indexed_bytes_unchanged()) {
        // Truncated (a resumed run cuts the file back to its checkpoint) or rewritten: start over.
        state.load_header();
        state.index_new_bytes();
        return state.index.size();
    }
    const std::size_t before = state.index.size();
    state.index_new_bytes();
    return state.index.size() - before;
}

std::vector<std::string> TrajectoryReader::warnings() const {
    const State& state = *state_;
    std::vector<std::string> texts;
    texts.reserve(state.warnings.size() + 2);
    for (const State::Warning& warning : state.warnings) texts.push_back(warning.text);
    if (state.open_damage)
        texts.push_back(detail::located(state.source.name(), state.open_damage->offset_bytes,
                                        detail::message(state.open_damage->problem,
                                                        "; no intact frame header follows it (yet)")));
    if (state.tail_warning) texts.push_back(*state.tail_warning);
    return texts;
}

}  // namespace brownfloc::trajectory
