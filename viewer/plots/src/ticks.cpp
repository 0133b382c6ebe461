// Tick placement. Every loop here is bounded by a small constant (the 1-2-5 step search by
// 15 candidates, tick generation by max_ticks_limit), so no input can make it hang.
#include "plots/ticks.hpp"

#include <algorithm>
#include <array>
#include <cfloat>
#include <cmath>
#include <cstdio>
#include <utility>

namespace brownfloc::viewer {
namespace {

// Relative slack, in units of the step, for a tick that rounding puts just outside a bound.
constexpr double bound_slack = 1e-9;

std::vector<Tick> single_tick(double value) {
    const double v = value == 0.0 ? 0.0 : value;  // never -0
    return {Tick{v, tick_label(v)}};
}

// Ticks k * step for k in [k_first, k_first + count), pulled into [lo, hi].
std::vector<Tick> multiples(double k_first, int count, double step, double lo, double hi) {
    std::vector<Tick> ticks;
    ticks.reserve(static_cast<std::size_t>(count));
    for (int i = 0; i < count; ++i) {
        double value = (k_first + i) * step;
        value = std::clamp(value, lo, hi);
        if (value == 0.0) value = 0.0;  // turns -0 into +0
        ticks.push_back(Tick{value, tick_label(value)});
    }
    return ticks;
}

}  // namespace

std::vector<Tick> linear_ticks(double lo, double hi, int max_ticks) {
    if (!std::isfinite(lo) || !std::isfinite(hi)) return {};
    const int n = std::clamp(max_ticks, 1, max_ticks_limit);
    if (lo > hi) std::swap(lo, hi);
    // Half the span is finite even for [-DBL_MAX, DBL_MAX], where the span itself overflows.
    const double half_span = 0.5 * hi - 0.5 * lo;
    const double magnitude = std::max(std::abs(lo), std::abs(hi));
    if (!(half_span > 0.5e-300) || half_span < 0.5e-12 * magnitude) return single_tick(lo);

    // Start one decade below span / (n - 1) and walk up the 1-2-5 steps until the count fits.
    const double spacing_log10 = std::log10(half_span) + std::log10(2.0 / std::max(n - 1, 1));
    const int first_exponent = static_cast<int>(std::floor(spacing_log10)) - 1;
    constexpr std::array<double, 3> mantissas{1.0, 2.0, 5.0};
    for (int exponent = first_exponent; exponent <= first_exponent + 4; ++exponent) {
        for (const double mantissa : mantissas) {
            const double step = mantissa * std::pow(10.0, exponent);
            if (!std::isfinite(step) || !(step > 0.0)) return {Tick{lo, tick_label(lo)}, Tick{hi, tick_label(hi)}};
            const double k_first = std::ceil(lo / step - bound_slack);
            const double k_last = std::floor(hi / step + bound_slack);
            const double count = k_last - k_first + 1.0;
            if (count <= n) return multiples(k_first, static_cast<int>(std::max(count, 0.0)), step, lo, hi);
        }
    }
    // Unreachable in exact arithmetic (step 10^(first_exponent + 4) exceeds the span); kept so
    // that rounding can never leave the function without a result.
    return {Tick{lo, tick_label(lo)}, Tick{hi, tick_label(hi)}};
}

std::vector<Tick> log10_ticks(double lo, double hi, int max_ticks) {
    if (!std::isfinite(lo) || !std::isfinite(hi)) return {};
    const int n = std::clamp(max_ticks, 1, max_ticks_limit);
    if (lo > hi) std::swap(lo, hi);
    if (!(hi > 0.0)) return {};
    if (!(lo > 0.0)) lo = DBL_MIN;

    const double lo_log10 = std::log10(lo);
    const double hi_log10 = std::log10(hi);
    // log10 of a positive finite double lies in [-324, 309): the exponents fit in an int.
    const int first_decade = static_cast<int>(std::ceil(lo_log10 - bound_slack));
    const int last_decade = static_cast<int>(std::floor(hi_log10 + bound_slack));
    const int decade_count = last_decade - first_decade + 1;

    if (decade_count >= 2) {
        const int stride = (decade_count + n - 1) / n;
        // Smallest multiple of stride >= first_decade (floor division also for negatives).
        int exponent = first_decade;
        const int remainder = ((exponent % stride) + stride) % stride;
        if (remainder != 0) exponent += stride - remainder;
        std::vector<Tick> ticks;
        for (; exponent <= last_decade; exponent += stride) {
            const double value = std::clamp(std::pow(10.0, exponent), lo, hi);
            ticks.push_back(Tick{value, tick_label(value)});
        }
        return ticks;
    }

    // Fewer than two decades inside: try 1, 2 and 5 times each decade that overlaps.
    std::vector<Tick> ticks;
    const int lowest = static_cast<int>(std::floor(lo_log10));
    const int highest = static_cast<int>(std::floor(hi_log10));
    for (int exponent = lowest; exponent <= highest; ++exponent) {
        for (const double mantissa : {1.0, 2.0, 5.0}) {
            const double value = mantissa * std::pow(10.0, exponent);
            if (value >= lo * (1.0 - bound_slack) && value <= hi * (1.0 + bound_slack)) {
                const double inside = std::clamp(value, lo, hi);
                ticks.push_back(Tick{inside, tick_label(inside)});
            }
        }
    }
    if (ticks.size() >= 2 && ticks.size() <= static_cast<std::size_t>(n)) return ticks;
    return linear_ticks(lo, hi, n);
}

std::string tick_label(double value) {
    if (std::isnan(value)) return "nan";
    if (std::isinf(value)) return value > 0 ? "inf" : "-inf";
    if (value == 0.0) return "0";

    std::array<char, 64> buffer{};
    const double magnitude = std::abs(value);
    if (magnitude >= 1e-2 && magnitude < 1e5) {
        // %g drops trailing zeros and stays in fixed notation for exponents -2..4 at 12 digits.
        std::snprintf(buffer.data(), buffer.size(), "%.12g", value);
        return std::string(buffer.data());
    }
    std::snprintf(buffer.data(), buffer.size(), "%.11e", value);
    const std::string text(buffer.data());
    const std::size_t e_at = text.find('e');
    std::string mantissa = text.substr(0, e_at);
    if (mantissa.find('.') != std::string::npos) {
        while (!mantissa.empty() && mantissa.back() == '0') mantissa.pop_back();
        if (!mantissa.empty() && mantissa.back() == '.') mantissa.pop_back();
    }
    mantissa += text.substr(e_at);
    return mantissa;
}

}  // namespace brownfloc::viewer
