#pragma once
// Percentiles of the Monte Carlo times and their distribution-free confidence intervals.
// Times may be +inf (a sample that never aggregates); order statistics handle that without
// any special case: the percentile or a bound is then +inf, which reads "longer than any
// finite time", never NaN.
//
//   std::sort(times_s.begin(), times_s.end());
//   const PercentileEstimate p10 = estimate_percentile(times_s, 0.10);   // 95 % interval
//   // p10.value, p10.lower, p10.upper, p10.interval.coverage
//
// All functions are pure and thread-safe.
#include <cstddef>
#include <vector>

namespace brownfloc::uncertainty {

// The p-quantile (p in [0, 1], not per cent) of ascending values x(1) <= ... <= x(n):
// type 7 of Hyndman & Fan (1996), "Sample quantiles in statistical packages", Am. Stat. 50,
// 361, definition 7: h = (n - 1) p + 1, Q = x(floor h) + (h - floor h) (x(floor h + 1) -
// x(floor h)). With an infinite neighbour, Q is that neighbour when h - floor h > 0, and
// x(floor h) when h is a whole number. Throws UncertaintyError for an empty or unsorted
// vector, NaN in it, p outside [0, 1], or -inf and +inf as neighbours (no meaning).
[[nodiscard]] double percentile(const std::vector<double>& sorted, double p);

// Ranks (from 1) of the order statistics x(r) <= x(s) that bracket the p-quantile with
// probability coverage >= confidence, for any continuous distribution:
// P(x(r) <= xi_p <= x(s)) = P(r <= B <= s - 1), B ~ Binomial(n, p) (Conover (1999),
// "Practical Nonparametric Statistics", 3rd ed., section 3.2; Hahn & Meeker (1991),
// "Statistical Intervals", section 5.2). Tails are chosen symmetric: r is the largest with
// P(B <= r - 1) <= (1 - confidence) / 2, s the smallest with P(B >= s) <= (1 - confidence)/2.
// The binomial probabilities are exact (no normal approximation): the terms within about 12
// standard deviations of the mode by the ratio recurrence, normalised by their sum.
// r = 0 means no order statistic is low enough (the interval is open below); s = n + 1 that
// none is high enough (open above): too few samples for that tail.
struct OrderStatisticInterval {
    std::size_t lower_rank;  // r in [0, n]
    std::size_t upper_rank;  // s in [1, n + 1], s > r
    double coverage;         // P(r <= B <= s - 1)
};

// n >= 1, p in [0, 1], confidence in (0, 1); otherwise throws UncertaintyError.
[[nodiscard]] OrderStatisticInterval order_statistic_interval(std::size_t n, double p, double confidence = 0.95);

struct PercentileEstimate {
    double p;      // in [0, 1]
    double value;  // percentile(sorted, p)
    double lower;  // x(r), -inf when r = 0
    double upper;  // x(s), +inf when s = n + 1
    OrderStatisticInterval interval;
};

// The percentile of ascending values with its order-statistic confidence interval.
[[nodiscard]] PercentileEstimate estimate_percentile(const std::vector<double>& sorted, double p,
                                                     double confidence = 0.95);

}  // namespace brownfloc::uncertainty
