#include "frame_source.hpp"

#include <sys/stat.h>

#include <span>
#include <string>

#include "data/frame_analysis.hpp"
#include "data/viewer_input_error.hpp"
#include "io/file_reading.hpp"
#include "io/message_text.hpp"
#include "trajectory/trajectory_format.hpp"

namespace brownfloc::viewer::detail {

void FrameSource::open(const FileVersion& version) {
    version_.reset();
    io::ReadableFile file = io::open_for_reading(version.path);  // io::IoError; never blocks
    struct stat facts {};
    if (::fstat(file.fd.get(), &facts) != 0 || FileIdentity{facts.st_dev, facts.st_ino} != version.identity)
        throw ViewerInputError(io::message(version.path.string(),
                                           ": the file was replaced after it was indexed; its frames can be read "
                                           "again once the viewer has reloaded it"));
    const std::uint64_t header_end = version.frames_offset_bytes;
    if (header_end < trajectory::format::file_header_bytes ||
        header_end > trajectory::format::file_header_bytes + trajectory::format::max_header_payload_bytes ||
        header_end > file.size_bytes)
        throw ViewerInputError(io::message(version.path.string(), ": the header should end at byte ", header_end,
                                           ", but the file has ", file.size_bytes, " bytes"));
    image_.assign(static_cast<std::size_t>(header_end), std::byte{0});
    io::pread_exact(file.fd.get(), 0, image_, version.path);
    // Checks the header's CRCs and rules again: the bytes must still be what the UI indexed.
    const trajectory::TrajectoryReader header_only =
        trajectory::TrajectoryReader::from_bytes(image_, version.path.string());
    header_ = header_only.header();
    try {
        seed_ = run_seed_from_scenario_text(header_.scenario_toml);
    } catch (const ViewerInputError&) {
        // Only the fit's bootstrap error depends on the seed: show the frames anyway. The app
        // reports the bad line when it reads the seed from the header itself.
        seed_ = 0;
    }
    fd_ = std::move(file.fd);
    version_ = version;
}

trajectory::TrajectoryFrame FrameSource::read(const FileVersion& version, const trajectory::FrameInfo& info,
                                              std::size_t index) {
    if (!version_ || version_->generation != version.generation || version_->identity != version.identity ||
        version_->path != version.path || version_->frames_offset_bytes != version.frames_offset_bytes)
        open(version);
    const std::size_t header_end = static_cast<std::size_t>(version.frames_offset_bytes);
    // payload_bytes passed the reader's size checks for N when the UI indexed the frame.
    const std::size_t frame_bytes = trajectory::format::frame_header_bytes + static_cast<std::size_t>(info.payload_bytes);
    image_.resize(header_end + frame_bytes);
    io::pread_exact(fd_.get(), info.offset_bytes, std::span<std::byte>{image_}.subspan(header_end), version.path);
    const trajectory::TrajectoryReader one_frame = trajectory::TrajectoryReader::from_bytes(image_, version.path.string());
    image_.resize(header_end);  // keep the header, not the frame
    if (one_frame.frame_count() != 1 || one_frame.frame_info(0).frame_number != info.frame_number ||
        one_frame.frame_info(0).payload_bytes != info.payload_bytes ||
        one_frame.frame_info(0).payload_crc != info.payload_crc)
        throw ViewerInputError(io::message(version.path.string(), ": byte ", info.offset_bytes, ": frame ",
                                           info.frame_number, " (index ", index,
                                           ") is damaged or changed since it was indexed; skipped"));
    return one_frame.read_frame(0);
}

}  // namespace brownfloc::viewer::detail
