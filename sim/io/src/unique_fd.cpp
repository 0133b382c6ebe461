#include "io/unique_fd.hpp"

#include <unistd.h>

namespace brownfloc::io {

UniqueFd& UniqueFd::operator=(UniqueFd&& other) noexcept {
    if (this != &other) reset(other.release());
    return *this;
}

int UniqueFd::release() noexcept {
    const int fd = fd_;
    fd_ = -1;
    return fd;
}

void UniqueFd::reset(int fd) noexcept {
    // No retry on EINTR: Linux has closed the descriptor already, and retrying could close a
    // descriptor another thread has just been given.
    if (fd_ >= 0) ::close(fd_);
    fd_ = fd;
}

}  // namespace brownfloc::io
