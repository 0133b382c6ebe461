#pragma once
// A root of a continuous function on a bracket [lo, hi] with f(lo) and f(hi) of opposite
// signs (or one of them zero), by Brent's method: inverse quadratic interpolation and
// secant steps, falling back to bisection whenever they do not shrink the bracket fast
// enough, so it never does worse than bisection by more than a small factor.
// Brent (1973), "Algorithms for Minimization without Derivatives", ch. 4 (zeroin).
#include <functional>

namespace brownfloc::shelf::detail {

// Returns x with the root within relative_tolerance · |x| (plus a few ulps). Throws
// std::invalid_argument if [lo, hi] does not bracket a sign change.
[[nodiscard]] double brent_root(const std::function<double(double)>& f, double lo, double hi,
                                double f_lo, double f_hi, double relative_tolerance);

}  // namespace brownfloc::shelf::detail
