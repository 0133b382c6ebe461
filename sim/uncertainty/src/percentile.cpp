#include "uncertainty/percentile.hpp"

#include <cmath>
#include <limits>
#include <string>

#include "number_text.hpp"
#include "uncertainty/uncertainty_error.hpp"

namespace brownfloc::uncertainty {

namespace {

void require_probability(double p, const char* what) {
    if (p >= 0.0 && p <= 1.0) return;
    std::string message = what;
    message += ": p = ";
    message += detail::number_text(p);
    message += ": must be in [0, 1] (a fraction, not per cent)";
    throw UncertaintyError(message);
}

void require_sorted_numbers(const std::vector<double>& sorted) {
    if (sorted.empty()) throw UncertaintyError("percentile of no values: at least one sample is needed");
    for (std::size_t i = 0; i < sorted.size(); ++i) {
        if (std::isnan(sorted[i])) {
            std::string message = "percentile: value ";
            message += std::to_string(i);
            message += " is nan: every sample needs a number (+inf is allowed)";
            throw UncertaintyError(message);
        }
        if (i > 0 && sorted[i] < sorted[i - 1]) {
            std::string message = "percentile: values are not sorted: value ";
            message += std::to_string(i);
            message += " = ";
            message += detail::number_text(sorted[i]);
            message += " comes after ";
            message += detail::number_text(sorted[i - 1]);
            throw UncertaintyError(message);
        }
    }
}

}  // namespace

double percentile(const std::vector<double>& sorted, double p) {
    require_probability(p, "percentile");
    require_sorted_numbers(sorted);
    // h - 1 = (n - 1) p, counted from 0.
    const double position = static_cast<double>(sorted.size() - 1) * p;
    const double below = std::floor(position);
    const auto index = static_cast<std::size_t>(below);
    const double fraction = position - below;
    const double x_low = sorted[index];
    if (fraction == 0.0 || index + 1 >= sorted.size()) return x_low;
    const double x_high = sorted[index + 1];
    if (x_low == x_high) return x_low;  // also two equal infinities
    if (std::isinf(x_low) && std::isinf(x_high))
        throw UncertaintyError("percentile: interpolating between -inf and +inf has no meaning");
    if (std::isinf(x_high)) return x_high;
    if (std::isinf(x_low)) return x_low;
    return x_low + fraction * (x_high - x_low);
}

PercentileEstimate estimate_percentile(const std::vector<double>& sorted, double p, double confidence) {
    const double value = percentile(sorted, p);
    const OrderStatisticInterval interval = order_statistic_interval(sorted.size(), p, confidence);
    const double lower =
        interval.lower_rank == 0 ? -std::numeric_limits<double>::infinity() : sorted[interval.lower_rank - 1];
    const double upper = interval.upper_rank > sorted.size() ? std::numeric_limits<double>::infinity()
                                                             : sorted[interval.upper_rank - 1];
    return PercentileEstimate{p, value, lower, upper, interval};
}

}  // namespace brownfloc::uncertainty
