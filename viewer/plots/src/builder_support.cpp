#include "builder_support.hpp"

#include "plots/plot_error.hpp"

#include <algorithm>
#include <array>
#include <cfloat>
#include <cmath>
#include <cstdio>

namespace brownfloc::viewer::builder_support {

void require_equal_lengths(const char* plot, std::size_t na, const char* a_name, std::size_t nb, const char* b_name) {
    if (na == nb) return;
    std::string message = plot;
    message += ": ";
    message += std::to_string(na);
    message += " ";
    message += a_name;
    message += " but ";
    message += std::to_string(nb);
    message += " ";
    message += b_name;
    message += "; the two arrays must have equal length";
    throw PlotError(message);
}

double largest_finite(const std::vector<double>& values, double fallback) {
    bool found = false;
    double largest = 0.0;
    for (const double v : values) {
        if (!std::isfinite(v)) continue;
        if (!found || v > largest) largest = v;
        found = true;
    }
    return found ? largest : fallback;
}

double scaled_positive(double value, double factor) { return std::clamp(value * factor, DBL_MIN, DBL_MAX); }

double scaled_finite(double value, double factor) { return std::clamp(value * factor, -DBL_MAX, DBL_MAX); }

std::string fixed_text(double value, int decimals) {
    if (std::isnan(value)) return "nan";
    if (std::isinf(value)) return value > 0 ? "inf" : "-inf";
    std::array<char, 400> buffer{};  // %.2f of 1e308 needs 312 characters
    std::snprintf(buffer.data(), buffer.size(), "%.*f", decimals, value);
    std::string text(buffer.data());
    if (text.find_first_not_of("-0.") == std::string::npos && text.front() == '-') text.erase(0, 1);  // no "-0.0"
    return text;
}

}  // namespace brownfloc::viewer::builder_support
