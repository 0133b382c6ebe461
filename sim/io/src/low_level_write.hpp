#pragma once
// The single place where brownfloc::io calls write(2), so that the fault seam of
// io/write_faults.hpp sees every write.
#include <cstddef>
#include <sys/types.h>

namespace brownfloc::io::detail {

// write(2), or the injected failure when a fault is due: then -1 with errno set.
ssize_t low_level_write(int fd, const std::byte* data, std::size_t size);

}  // namespace brownfloc::io::detail
