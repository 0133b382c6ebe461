#include "trajectory/trajectory_writer.hpp"

#include <cmath>
#include <limits>
#include <stdexcept>
#include <unistd.h>

#include "content_rules.hpp"
#include "fixed_headers.hpp"
#include "io/file_writing.hpp"
#include "io/io_error.hpp"
#include "io_pieces.hpp"
#include "payload_codec.hpp"
#include "trajectory/crc32c.hpp"
#include "trajectory/trajectory_error.hpp"
#include "trajectory/trajectory_format.hpp"
#include "trajectory/trajectory_reader.hpp"

namespace brownfloc::trajectory {
namespace {

std::filesystem::path directory_of(const std::filesystem::path& path) {
    const std::filesystem::path parent = path.parent_path();
    return parent.empty() ? std::filesystem::path{"."} : parent;
}

}  // namespace

TrajectoryWriter::TrajectoryWriter(io::UniqueFd fd, std::filesystem::path path, std::size_t particle_count,
                                   bool positions_float64, std::uint64_t bytes, std::uint64_t frames, double last_time_s)
    : fd_{std::move(fd)},
      path_{std::move(path)},
      particle_count_{particle_count},
      positions_float64_{positions_float64},
      bytes_{bytes},
      frames_{frames},
      last_time_s_{last_time_s} {}

TrajectoryWriter TrajectoryWriter::create(const std::filesystem::path& path, const TrajectoryHeader& header,
                                          bool positions_float64) {
    if (auto problem = detail::header_problem(header))
        throw std::invalid_argument(detail::message(path.string(), ": trajectory header: ", *problem));
    std::vector<std::byte> bytes(format::file_header_bytes);
    detail::encode_header_payload(header, bytes);
    const std::uint64_t payload_bytes = bytes.size() - format::file_header_bytes;
    if (payload_bytes > format::max_header_payload_bytes)
        throw std::invalid_argument(detail::message(path.string(), ": trajectory header: ", payload_bytes,
                                                    " bytes, more than the format's limit of ",
                                                    format::max_header_payload_bytes));
    const std::uint32_t payload_crc = crc32c(std::span<const std::byte>{bytes}.subspan(format::file_header_bytes));
    const detail::FixedHeaderBytes fixed = detail::encode_file_header(positions_float64, payload_bytes, payload_crc);
    std::copy(fixed.begin(), fixed.end(), bytes.begin());

    io::UniqueFd fd = io::create_new_file(path);
    try {
        io::write_all(fd.get(), bytes, path);
    } catch (const io::IoError&) {
        // We created the file a moment ago (O_EXCL): a half header is of no use to anyone, and
        // leaving it would make the next attempt fail with "File exists".
        fd.reset();
        ::unlink(path.c_str());
        throw;
    }
    return TrajectoryWriter(std::move(fd), path, header.radius_nm.size(), positions_float64, bytes.size(), 0,
                            -std::numeric_limits<double>::infinity());
}

TrajectoryWriter TrajectoryWriter::reopen_for_append(const std::filesystem::path& path, std::uint64_t valid_bytes,
                                                     std::uint64_t frames_written) {
    // The reader checks the header and every frame up to valid_bytes; damage in earlier frames
    // only costs warnings, and the file stays readable after more frames are appended.
    const TrajectoryReader reader{path, valid_bytes};
    const std::string name = path.string();
    if (reader.file_bytes() < valid_bytes)
        throw TrajectoryFormatError(name, reader.file_bytes(),
                                    detail::message("cannot resume: the checkpoint expects ", valid_bytes,
                                                    " bytes, the file has only ", reader.file_bytes()));
    double last_time_s = -std::numeric_limits<double>::infinity();
    if (frames_written == 0) {
        if (valid_bytes != reader.frames_offset_bytes())
            throw TrajectoryFormatError(name, valid_bytes,
                                        detail::message("cannot resume: the checkpoint expects no frames, so ", valid_bytes,
                                                        " bytes should be where the header ends, byte ",
                                                        reader.frames_offset_bytes()));
    } else {
        const std::size_t count = reader.frame_count();
        const FrameInfo* last = count > 0 ? &reader.frame_info(count - 1) : nullptr;
        const std::uint64_t last_end = last ? last->offset_bytes + format::frame_header_bytes + last->payload_bytes
                                            : reader.frames_offset_bytes();
        if (!last || last->frame_number != frames_written - 1 || last_end != valid_bytes) {
            std::string found = last ? detail::message("the last intact frame before it is frame ", last->frame_number,
                                                       ", ending at byte ", last_end)
                                     : std::string{"there is no intact frame before it"};
            throw TrajectoryFormatError(name, valid_bytes,
                                        detail::message("cannot resume: the checkpoint expects frame ", frames_written - 1,
                                                        " to end at byte ", valid_bytes, ", but ", found));
        }
        last_time_s = last->time_s;
    }
    io::UniqueFd fd = io::open_existing_for_append(path);
    io::truncate_to(fd.get(), valid_bytes, path);
    return TrajectoryWriter(std::move(fd), path, reader.particle_count(), reader.positions_float64(), valid_bytes,
                            frames_written, last_time_s);
}

void TrajectoryWriter::append(const TrajectoryFrame& frame) {
    const std::string name = path_.string();
    if (end_unknown_)
        throw io::IoError("write", path_, 0,
                          "an earlier write failed and the file could not be cut back to its last complete frame");
    const detail::FrameShape shape{particle_count_, positions_float64_};
    if (auto problem = detail::frame_problem(frame, shape))
        throw std::invalid_argument(detail::message(name, ": frame ", frames_, ": ", *problem));
    if (frame.time_s < last_time_s_)
        throw std::invalid_argument(detail::message(name, ": frame ", frames_, ": time_s = ", frame.time_s,
                                                    " is earlier than the previous frame's ", last_time_s_));

    buffer_.resize(format::frame_header_bytes);
    detail::encode_frame_payload(frame, shape, buffer_);
    const std::span<const std::byte> payload = std::span<const std::byte>{buffer_}.subspan(format::frame_header_bytes);
    const detail::FixedHeaderBytes header = detail::encode_frame_header(frames_, payload.size(), crc32c(payload));
    std::copy(header.begin(), header.end(), buffer_.begin());

    try {
        io::write_all(fd_.get(), buffer_, path_);
    } catch (const io::IoError&) {
        // Best effort: cut the partial frame off so that the file ends with a complete frame.
        // If even that fails the reader still copes (a torn last frame is only a warning), but
        // this writer must not append after bytes it cannot account for.
        try {
            io::truncate_to(fd_.get(), bytes_, path_);
        } catch (const io::IoError&) {
            end_unknown_ = true;
        }
        throw;
    }
    bytes_ += buffer_.size();
    ++frames_;
    last_time_s_ = frame.time_s;
}

void TrajectoryWriter::sync() {
    io::sync_file(fd_.get(), path_);
    if (!directory_synced_) {
        io::sync_directory(directory_of(path_));
        directory_synced_ = true;
    }
}

}  // namespace brownfloc::trajectory
