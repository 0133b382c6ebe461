#pragma once
// The largest single allocation through the global operator new since the last reset, so that
// a test can show that reading a hostile file never allocates what the file claims.
#include <cstddef>

namespace brownfloc::test {

void reset_largest_allocation();
[[nodiscard]] std::size_t largest_allocation_bytes();

}  // namespace brownfloc::test
