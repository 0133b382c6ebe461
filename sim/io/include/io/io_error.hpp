#pragma once
// The error of every operation in brownfloc::io: what was being done, to which path, and why.
//
//   cannot write runs/a/trajectory.bftraj: No space left on device
//   cannot read /tmp/pipe: not a regular file (a FIFO)
//
// error_number() is the errno of the failed call (ENOSPC, EFBIG, ...), or 0 when the refusal
// is ours rather than the system's (a FIFO where a regular file is needed, a short read).
#include <filesystem>
#include <stdexcept>
#include <string>
#include <string_view>

namespace brownfloc::io {

class IoError : public std::runtime_error {
public:
    // "cannot <action> <path>: <the system's text for error_number>"
    IoError(std::string_view action, const std::filesystem::path& path, int error_number);
    // "cannot <action> <path>: <reason>"
    IoError(std::string_view action, const std::filesystem::path& path, int error_number, std::string_view reason);

    [[nodiscard]] const std::string& path() const noexcept { return path_; }
    [[nodiscard]] int error_number() const noexcept { return error_number_; }

private:
    std::string path_;
    int error_number_;
};

}  // namespace brownfloc::io
