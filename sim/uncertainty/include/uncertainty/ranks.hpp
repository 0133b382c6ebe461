#pragma once
// Ranks for the rank-based statistics: average ranks for ties, Spearman's rho.
// Pure functions, thread-safe.
#include <vector>

namespace brownfloc::uncertainty {

// Ranks from 1 to n in the order of the values; equal values (including equal infinities)
// share the average of the ranks they span ("mid-ranks", Conover (1999), Practical
// Nonparametric Statistics, section 5.4). Throws UncertaintyError on NaN.
[[nodiscard]] std::vector<double> average_ranks(const std::vector<double>& values);

// Pearson correlation of two equally long vectors; 0 when either has zero variance
// (no association can be measured). Throws UncertaintyError if the lengths differ, n < 2,
// or a value is not finite.
[[nodiscard]] double pearson_correlation(const std::vector<double>& x, const std::vector<double>& y);

// Spearman's rho: the Pearson correlation of the average ranks (Spearman 1904; with ties this
// is the usual tie-corrected form).
[[nodiscard]] double spearman_rho(const std::vector<double>& x, const std::vector<double>& y);

}  // namespace brownfloc::uncertainty
