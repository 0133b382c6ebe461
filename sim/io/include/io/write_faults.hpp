#pragma once
// Fault injection for tests: make a chosen low-level write of brownfloc::io fail, so that the
// handling of a full disk (ENOSPC) or a file-size limit (EFBIG) can be tested in every part of
// the project that writes through this library.
//
//   testing::fail_nth_write(2, ENOSPC);   // the 2nd write from now on fails
//   ... code under test ...                // expects IoError "... No space left on device"
//   testing::clear_write_faults();
//
// One fault at a time; it disarms itself once it has fired. The counter is atomic, so writes
// from several threads each count once, but which thread's write is the n-th is up to timing.
// Costs one atomic load per write when disarmed.
#include <cstddef>
#include <cstdint>

namespace brownfloc::io::testing {

// The n-th low-level write (1-based, counted from this call) fails with error_number. It first
// writes up to bytes_written_first of its bytes for real, as a disk that fills up in the middle
// of a write leaves them, then reports the failure. n = 0 disarms.
void fail_nth_write(std::uint64_t n, int error_number, std::size_t bytes_written_first = 0);

// Disarms any pending fault.
void clear_write_faults();

}  // namespace brownfloc::io::testing
