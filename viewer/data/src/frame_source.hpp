#pragma once
// The frame loader's own access to the trajectory file, separate from the UI thread's
// LiveTrajectory so that the two never share a reader. It keeps a descriptor on the file the
// UI indexed (checked by device and inode) and a copy of the file's header bytes; a frame is
// read by the FrameInfo the UI's index holds: its bytes are put behind the header bytes and
// decoded by a TrajectoryReader made from that image, which checks both CRCs and every value
// rule again. So nothing is indexed twice and no private part of the trajectory library is
// used. Used by one thread only.
#include <cstdint>
#include <filesystem>
#include <optional>
#include <vector>

#include "data/live_trajectory.hpp"
#include "io/unique_fd.hpp"
#include "trajectory/trajectory_data.hpp"
#include "trajectory/trajectory_reader.hpp"

namespace brownfloc::viewer::detail {

// Which file and header a frame request refers to (copied from the LiveTrajectory when the
// request is made).
struct FileVersion {
    std::filesystem::path path;
    FileIdentity identity;
    std::uint64_t generation = 0;
    std::uint64_t frames_offset_bytes = 0;
};

struct DecodedFrame {
    trajectory::TrajectoryHeader header;  // shared by every frame of one file version
    trajectory::TrajectoryFrame frame;
};

class FrameSource {
public:
    // Reads the frame info describes from the file version (re-opening the file when the
    // version changed). Throws ViewerInputError (the file was replaced, or the frame is no
    // longer what was indexed), io::IoError, trajectory::TrajectoryFormatError.
    [[nodiscard]] trajectory::TrajectoryFrame read(const FileVersion& version, const trajectory::FrameInfo& info,
                                                   std::size_t index);
    // The header of the version last read, and the run's seed from it.
    [[nodiscard]] const trajectory::TrajectoryHeader& header() const { return header_; }
    [[nodiscard]] std::uint64_t seed() const { return seed_; }

private:
    void open(const FileVersion& version);

    std::optional<FileVersion> version_;
    io::UniqueFd fd_;
    std::vector<std::byte> image_;  // the file's first frames_offset_bytes bytes, then one frame
    trajectory::TrajectoryHeader header_;
    std::uint64_t seed_ = 0;
};

}  // namespace brownfloc::viewer::detail
