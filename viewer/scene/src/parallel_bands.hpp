#pragma once
// Horizontal bands of rows, one per thread, and a helper that runs one task per band.
#include <functional>

namespace brownfloc::viewer::detail {

struct RowRange {
    int begin, end;  // rows [begin, end)
};

// Band k of band_count over rows [first_row, first_row + row_count): rows
// first_row + floor(row_count k / band_count) up to the next band's first row.
[[nodiscard]] RowRange row_band(int first_row, int row_count, int band, int band_count);

// The band holding `row` (which must lie in [first_row, first_row + row_count)).
[[nodiscard]] int band_of_row(int first_row, int row_count, int band_count, int row);

// Runs task(k) for k = 0 .. count - 1, task(0) on the calling thread and the others on their
// own std::thread; waits for all. If tasks throw, the exception of the lowest k is rethrown
// after every thread has joined.
void run_in_parallel(int count, const std::function<void(int)>& task);

}  // namespace brownfloc::viewer::detail
