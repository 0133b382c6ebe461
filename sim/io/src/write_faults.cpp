#include <algorithm>
#include <atomic>
#include <cerrno>
#include <unistd.h>

#include "io/write_faults.hpp"
#include "low_level_write.hpp"

namespace brownfloc::io {
namespace {

// Writes left until the fault fires, counting the failing one; 0 = disarmed. The errno and
// byte count are stored before the counter is armed (release) and read after it fires
// (acquire), so a firing write sees the values of the fail_nth_write that armed it.
std::atomic<std::uint64_t> writes_until_fault{0};
std::atomic<int> fault_error_number{0};
std::atomic<std::size_t> fault_bytes_written_first{0};

// True exactly once: for the write that takes the counter from 1 to 0.
bool fault_due_now() {
    std::uint64_t left = writes_until_fault.load(std::memory_order_acquire);
    while (left != 0) {
        if (writes_until_fault.compare_exchange_weak(left, left - 1, std::memory_order_acq_rel)) return left == 1;
    }
    return false;
}

}  // namespace

namespace testing {

void fail_nth_write(std::uint64_t n, int error_number, std::size_t bytes_written_first) {
    writes_until_fault.store(0, std::memory_order_release);
    fault_error_number.store(error_number, std::memory_order_relaxed);
    fault_bytes_written_first.store(bytes_written_first, std::memory_order_relaxed);
    writes_until_fault.store(n, std::memory_order_release);
}

void clear_write_faults() { writes_until_fault.store(0, std::memory_order_release); }

}  // namespace testing

namespace detail {

ssize_t low_level_write(int fd, const std::byte* data, std::size_t size) {
    if (fault_due_now()) {
        const std::size_t partial = std::min(size, fault_bytes_written_first.load(std::memory_order_relaxed));
        if (partial > 0) {
            // A real partial write first; its own errors do not matter, the fault follows.
            [[maybe_unused]] const ssize_t ignored = ::write(fd, data, partial);
        }
        errno = fault_error_number.load(std::memory_order_relaxed);
        return -1;
    }
    return ::write(fd, data, size);
}

}  // namespace detail
}  // namespace brownfloc::io
