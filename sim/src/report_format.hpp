#pragma once
// Number formatting for the text reports (private to sim/).
#include <cstddef>
#include <ostream>
#include <string>

namespace brownfloc::sim {

// Fixed-point with `decimals` digits after the point.
[[nodiscard]] std::string format_fixed(double value, int decimals);
// Shortest round-trip form (as in JSON).
[[nodiscard]] std::string format_general(double value);
// `significant` significant digits, scientific notation when large or small ("4.9e+08").
[[nodiscard]] std::string format_significant(double value, int significant);
// One aligned "label   value" line: the label padded to `width` columns (at least one space).
void write_row(std::ostream& out, const std::string& label, const std::string& value, std::size_t width);
// A duration in s with a readable unit beside it: "3.2e+05 s (3.7 days)".
[[nodiscard]] std::string format_duration(double seconds);

}  // namespace brownfloc::sim
