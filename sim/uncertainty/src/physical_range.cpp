#include "uncertainty/physical_range.hpp"

#include <cmath>
#include <cstdio>
#include <limits>

#include "number_text.hpp"

namespace brownfloc::uncertainty {

namespace {

// Three significant digits, e.g. 9.28 or 1.47: a suggestion, not a result.
std::string suggestion_text(double value) {
    char buffer[32];
    std::snprintf(buffer, sizeof buffer, "%.3g", value);
    return buffer;
}

}  // namespace

std::optional<std::string> physical_range_problem(const Distribution& distribution, double lower, double upper,
                                                  std::string_view key) {
    const double outside = distribution.probability_outside(lower, upper);
    if (outside <= max_probability_outside_physical_range) return std::nullopt;

    std::string message{key};
    message += " = ";
    message += distribution.text();
    message += ": probability ";
    message += detail::scientific_text(outside, 2);
    message += " lies outside the physical range [";
    message += detail::number_text(lower);
    message += ", ";
    message += detail::number_text(upper);
    message += upper == std::numeric_limits<double>::infinity() ? ")" : "]";
    message += " (at most ";
    message += detail::scientific_text(max_probability_outside_physical_range, 1);
    message += " is allowed); ";

    const double mean = distribution.mean();
    const bool log_normal_fits = lower <= 0.0 && upper == std::numeric_limits<double>::infinity();
    if (log_normal_fits && distribution.kind() != DistributionKind::log_normal && mean > 0.0) {
        // The log-normal of the same mean and sd: sigma^2 = ln(1 + cv^2),
        // median = mean / sqrt(1 + cv^2), factor = exp(sigma) (standard moments of the
        // log-normal; common practice).
        const double cv = distribution.standard_deviation() / mean;
        const double one_plus_cv2 = 1.0 + cv * cv;
        message += "use a log-normal, e.g. ";
        message += key;
        message += " = { median = ";
        message += suggestion_text(mean / std::sqrt(one_plus_cv2));
        message += ", factor = ";
        message += suggestion_text(std::exp(std::sqrt(std::log(one_plus_cv2))));
        message += " } (the same mean and sd)";
    } else if (log_normal_fits && distribution.kind() != DistributionKind::log_normal) {
        message += "move it inside the range (a log-normal { median, factor } is always positive)";
    } else {
        message += "narrow the distribution so that it stays inside the range";
        if (log_normal_fits) message += " (a log-normal { median, factor } is always positive)";
    }
    return message;
}

}  // namespace brownfloc::uncertainty
