#pragma once
// Axis ticks and their labels. Plain C++ (no SFML).
//
// Every function here terminates and returns a small, sane result for any input: NaN,
// +-inf, lo == hi, lo > hi (the bounds are swapped), subnormal numbers and spans up to the
// largest double. Bad bounds give no ticks rather than an exception, because an axis without
// ticks is still a usable plot. Results depend only on the arguments (no global state), so
// they are thread-safe and reproducible.
//
//   linear_ticks(0, 4)      -> 0, 1, 2, 3, 4  (step 0.5 would give 9 ticks, more than 6)
//   log10_ticks(0.8, 1250)  -> 1, 10, 100, 1000
#include <string>
#include <vector>

namespace brownfloc::viewer {

struct Tick {
    double value;
    std::string label;
};

// Largest max_ticks honoured; larger requests are clamped to it, requests below 1 become 1.
inline constexpr int max_ticks_limit = 50;

// Ticks at whole multiples of a 1-2-5 step (1, 2, 5, 10, 20, ...) inside [lo, hi], using
// the smallest such step that gives at most max_ticks ticks. A tick within 1e-9 of a step
// outside a bound is pulled onto the bound. lo == hi, or a span below 1e-300 or below 1e-12
// of the bounds' magnitude (too narrow for distinct labels), gives one tick at lo; a
// non-finite bound gives none. A span whose step would overflow gives the two bounds.
[[nodiscard]] std::vector<Tick> linear_ticks(double lo, double hi, int max_ticks = 6);

// Ticks at powers of ten inside [lo, hi] (lo, hi > 0). When there are more than max_ticks
// decades, only every k-th decade is kept (exponents divisible by k, k the smallest that
// fits). When fewer than two decades lie inside, the 1-2-5 multiples of each decade inside
// [lo, hi] are used, and when those give fewer than two ticks (or too many), linear_ticks.
// hi <= 0 or a non-finite bound gives no ticks; lo <= 0 is raised to the smallest normal
// double.
[[nodiscard]] std::vector<Tick> log10_ticks(double lo, double hi, int max_ticks = 6);

// A compact label: "0", "0.5", "2.5", "1000", "1e-03", "2.5e+06", "-3". Fixed notation for
// 0.01 <= |value| < 1e5, otherwise scientific with the mantissa's trailing zeros removed and
// C's two-digit exponent. Twelve significant digits at most, so rounding noise such as
// 0.30000000000000004 prints as "0.3". Never "-0"; non-finite values print "nan", "inf",
// "-inf".
[[nodiscard]] std::string tick_label(double value);

}  // namespace brownfloc::viewer
