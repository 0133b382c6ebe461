#pragma once
// "This trajectory file is not usable": bad magic, unknown version, a damaged header, a frame
// that changed after it was indexed. The message names the file, the byte offset and what is
// wrong; any text quoted from the file is escaped (\xNN) and cut at 80 characters:
//
//   run/trajectory.bftraj: byte 0: not a brownfloc trajectory: magic is "PK\x03\x04..."
//
// Damaged frames are not errors: the reader skips them and records a warning instead.
// I/O failures (a FIFO given as the path, a failed read) are io::IoError, not this.
#include <cstdint>
#include <stdexcept>
#include <string>

namespace brownfloc::trajectory {

class TrajectoryFormatError : public std::runtime_error {
public:
    // what() = "<source>: byte <offset_bytes>: <problem>"
    TrajectoryFormatError(const std::string& source, std::uint64_t offset_bytes, const std::string& problem);

    [[nodiscard]] std::uint64_t offset_bytes() const noexcept { return offset_bytes_; }
    [[nodiscard]] const std::string& problem() const noexcept { return problem_; }

private:
    std::uint64_t offset_bytes_;
    std::string problem_;
};

}  // namespace brownfloc::trajectory
