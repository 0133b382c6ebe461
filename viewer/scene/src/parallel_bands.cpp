#include "parallel_bands.hpp"

#include <exception>
#include <system_error>
#include <thread>
#include <vector>

namespace brownfloc::viewer::detail {

RowRange row_band(int first_row, int row_count, int band, int band_count) {
    const auto start = [&](int k) {
        return first_row + int((long long)row_count * (long long)k / (long long)band_count);
    };
    return {start(band), start(band + 1)};
}

int band_of_row(int first_row, int row_count, int band_count, int row) {
    int band = int((long long)(row - first_row) * (long long)band_count / (long long)row_count);
    while (band + 1 < band_count && row_band(first_row, row_count, band + 1, band_count).begin <= row) ++band;
    while (band > 0 && row_band(first_row, row_count, band, band_count).begin > row) --band;
    return band;
}

void run_in_parallel(int count, const std::function<void(int)>& task) {
    std::vector<std::exception_ptr> failures(std::size_t(count > 0 ? count : 0));
    const auto guarded = [&](int k) {
        try {
            task(k);
        } catch (...) {
            failures[std::size_t(k)] = std::current_exception();
        }
    };
    std::vector<std::thread> helpers;
    helpers.reserve(failures.size());
    std::vector<int> run_here;
    if (count > 0) run_here.push_back(0);
    for (int k = 1; k < count; ++k) {
        try {
            helpers.emplace_back(guarded, k);
        } catch (const std::system_error&) {
            run_here.push_back(k);  // no thread to be had: the tasks are independent, run it here
        }
    }
    for (int k : run_here) guarded(k);
    for (std::thread& t : helpers) t.join();
    for (const std::exception_ptr& failure : failures)
        if (failure) std::rethrow_exception(failure);
}

}  // namespace brownfloc::viewer::detail
