#pragma once
// Helpers shared by the plot builders (private to the plots library).
#include <cstddef>
#include <string>
#include <vector>

namespace brownfloc::viewer::builder_support {

// Throws PlotError "<plot>: <na> <a_name> but <nb> <b_name>; the two arrays must have equal length".
void require_equal_lengths(const char* plot, std::size_t na, const char* a_name, std::size_t nb, const char* b_name);

// Largest finite value, or `fallback` when there is none.
[[nodiscard]] double largest_finite(const std::vector<double>& values, double fallback);

// factor * value, held inside the positive normal doubles so a log axis bound stays usable.
[[nodiscard]] double scaled_positive(double value, double factor);

// factor * value, held inside [-DBL_MAX, DBL_MAX].
[[nodiscard]] double scaled_finite(double value, double factor);

// Fixed-point text with `decimals` decimals ("nan", "inf" for non-finite values).
[[nodiscard]] std::string fixed_text(double value, int decimals);

}  // namespace brownfloc::viewer::builder_support
