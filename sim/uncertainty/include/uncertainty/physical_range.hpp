#pragma once
// Does a distribution put noticeable probability where the quantity makes no sense (a radius
// or a concentration at or below 0)? A normal with a large relative sd does; the fix is
// usually a log-normal, which lives on (0, inf).
//
//   if (auto problem = physical_range_problem(radius, 0.0, inf, "radius_nm"))
//       throw ScenarioError(file, line, *problem);
#include <optional>
#include <string>
#include <string_view>

#include "uncertainty/distribution.hpp"

namespace brownfloc::uncertainty {

// More than this probability outside the physical range is an error: at 1e-6, a run of 1e5
// samples draws an unphysical value with probability about 0.1 (common practice, our choice).
inline constexpr double max_probability_outside_physical_range = 1e-6;

// nullopt when distribution.probability_outside(lower, upper) <= 1e-6; otherwise a message
// naming the key, the distribution, the range and the mass outside it, and suggesting
// { median, factor } (with numbers: the log-normal of the same mean and sd) where a
// log-normal fits the range (lower <= 0, upper = +inf), else to narrow the distribution:
//
//   radius_nm = { mean = 10, sd = 4 }: probability 6.2e-03 lies outside the physical range
//   [0, inf); use a log-normal, e.g. radius_nm = { median = 9.28, factor = 1.47 } (the same
//   mean and sd)
//
// Throws UncertaintyError if lower > upper or either is NaN.
[[nodiscard]] std::optional<std::string> physical_range_problem(const Distribution& distribution, double lower,
                                                                double upper, std::string_view key);

}  // namespace brownfloc::uncertainty
