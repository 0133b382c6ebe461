#include "uncertainty/distribution.hpp"

#include <algorithm>
#include <cmath>
#include <limits>

#include "number_text.hpp"
#include "uncertainty/sample_draw.hpp"
#include "uncertainty/standard_normal.hpp"
#include "uncertainty/uncertainty_error.hpp"

namespace brownfloc::uncertainty {

namespace {

using detail::number_text;

std::string parameters_text(DistributionKind kind, double first, double second) {
    std::string text;
    switch (kind) {
        case DistributionKind::point:
            return number_text(first);
        case DistributionKind::normal:
            text += "{ mean = ";
            text += number_text(first);
            text += ", sd = ";
            break;
        case DistributionKind::uniform:
            text += "{ low = ";
            text += number_text(first);
            text += ", high = ";
            break;
        case DistributionKind::log_normal:
            text += "{ median = ";
            text += number_text(first);
            text += ", factor = ";
            break;
    }
    text += number_text(second);
    text += " }";
    return text;
}

[[noreturn]] void reject(DistributionKind kind, double first, double second, const char* name, double value,
                         const char* rule) {
    std::string message = parameters_text(kind, first, second);
    message += ": ";
    message += name;
    message += " = ";
    message += number_text(value);
    message += ": ";
    message += rule;
    throw UncertaintyError(message);
}

void require_finite(DistributionKind kind, double first, double second, const char* name, double value) {
    if (!std::isfinite(value)) reject(kind, first, second, name, value, "must be a finite number");
}

[[noreturn]] void reject_nan_argument(const Distribution& distribution, const char* what) {
    std::string message = distribution.text();
    message += ": ";
    message += what;
    message += " nan: the argument must be a number";
    throw UncertaintyError(message);
}

// The most extreme probabilities uniform_draw can return.
constexpr double smallest_draw_p = uniform_from_bits(0, 0);
constexpr double largest_draw_p = uniform_from_bits(0xffffffffu, 0xffffffffu);

}  // namespace

Distribution Distribution::point(double value) {
    require_finite(DistributionKind::point, value, 0.0, "value", value);
    return Distribution{DistributionKind::point, value, 0.0};
}

Distribution Distribution::normal(double mean, double sd) {
    constexpr auto kind = DistributionKind::normal;
    require_finite(kind, mean, sd, "mean", mean);
    require_finite(kind, mean, sd, "sd", sd);
    if (sd < 0.0) reject(kind, mean, sd, "sd", sd, "must be >= 0");
    const Distribution made{kind, mean, sd};
    if (!std::isfinite(made.quantile(smallest_draw_p)) || !std::isfinite(made.quantile(largest_draw_p)))
        reject(kind, mean, sd, "sd", sd, "too wide: draws would overflow a double");
    return made;
}

Distribution Distribution::uniform(double low, double high) {
    constexpr auto kind = DistributionKind::uniform;
    require_finite(kind, low, high, "low", low);
    require_finite(kind, low, high, "high", high);
    if (low > high) reject(kind, low, high, "high", high, "must be >= low");
    if (!std::isfinite(high - low)) reject(kind, low, high, "high", high, "too far from low: high - low overflows");
    return Distribution{kind, low, high};
}

Distribution Distribution::log_normal(double median, double factor) {
    constexpr auto kind = DistributionKind::log_normal;
    require_finite(kind, median, factor, "median", median);
    require_finite(kind, median, factor, "factor", factor);
    if (!(median > 0.0)) reject(kind, median, factor, "median", median, "must be > 0");
    if (factor < 1.0)
        reject(kind, median, factor, "factor", factor, "must be >= 1 (the geometric standard deviation; 1 is a point)");
    const Distribution made{kind, median, factor};
    const double smallest = made.quantile(smallest_draw_p);
    const double largest = made.quantile(largest_draw_p);
    if (!(smallest > 0.0) || !std::isfinite(largest) || !std::isfinite(made.mean()) ||
        !std::isfinite(made.standard_deviation()))
        reject(kind, median, factor, "factor", factor,
               "too wide: draws, the mean or the standard deviation would overflow a double");
    return made;
}

bool Distribution::is_point() const noexcept {
    switch (kind_) {
        case DistributionKind::point:
            return true;
        case DistributionKind::normal:
            return second_ == 0.0;
        case DistributionKind::uniform:
            return first_ == second_;
        case DistributionKind::log_normal:
            return second_ == 1.0;
    }
    return true;
}

double Distribution::log_sigma() const { return std::log(second_); }

double Distribution::quantile(double p) const {
    if (!(p >= 0.0 && p <= 1.0)) {
        std::string message = text();
        message += ": quantile at p = ";
        message += number_text(p);
        message += ": p must be in [0, 1]";
        throw UncertaintyError(message);
    }
    if (is_point()) return first_;
    switch (kind_) {
        case DistributionKind::normal:
            return first_ + second_ * standard_normal_quantile(p);
        case DistributionKind::uniform:
            // Clamped: low + 1 * (high - low) may round above high.
            return std::min(first_ + p * (second_ - first_), second_);
        case DistributionKind::log_normal:
            return first_ * std::exp(log_sigma() * standard_normal_quantile(p));
        case DistributionKind::point:
            break;
    }
    return first_;
}

double Distribution::cdf(double x) const {
    // Continuous kinds: P(X <= x) = P(X < x). A point puts all its mass on its value.
    if (is_point() && !std::isnan(x)) return x >= first_ ? 1.0 : 0.0;
    return probability_below(x);
}

double Distribution::probability_below(double x) const {
    if (std::isnan(x)) reject_nan_argument(*this, "probability below");
    if (is_point()) return first_ < x ? 1.0 : 0.0;
    switch (kind_) {
        case DistributionKind::normal:
            return standard_normal_cdf((x - first_) / second_);
        case DistributionKind::uniform:
            if (x <= first_) return 0.0;
            if (x >= second_) return 1.0;
            return (x - first_) / (second_ - first_);
        case DistributionKind::log_normal:
            if (x <= 0.0) return 0.0;
            if (std::isinf(x)) return 1.0;
            return standard_normal_cdf((std::log(x) - std::log(first_)) / log_sigma());
        case DistributionKind::point:
            break;
    }
    return 0.0;
}

double Distribution::probability_above(double x) const {
    if (std::isnan(x)) reject_nan_argument(*this, "probability above");
    if (is_point()) return first_ > x ? 1.0 : 0.0;
    switch (kind_) {
        case DistributionKind::normal:
            return standard_normal_survival((x - first_) / second_);
        case DistributionKind::uniform:
            if (x <= first_) return 1.0;
            if (x >= second_) return 0.0;
            return (second_ - x) / (second_ - first_);
        case DistributionKind::log_normal:
            if (x <= 0.0) return 1.0;
            if (std::isinf(x)) return 0.0;
            return standard_normal_survival((std::log(x) - std::log(first_)) / log_sigma());
        case DistributionKind::point:
            break;
    }
    return 0.0;
}

double Distribution::probability_outside(double lower, double upper) const {
    if (std::isnan(lower) || std::isnan(upper) || lower > upper) {
        std::string message = text();
        message += ": physical range [";
        message += number_text(lower);
        message += ", ";
        message += number_text(upper);
        message += "] is not a range (lower must be <= upper, neither nan)";
        throw UncertaintyError(message);
    }
    return std::min(1.0, probability_below(lower) + probability_above(upper));
}

double Distribution::mean() const {
    switch (kind_) {
        case DistributionKind::point:
        case DistributionKind::normal:
            return first_;
        case DistributionKind::uniform:
            return first_ + 0.5 * (second_ - first_);
        case DistributionKind::log_normal: {
            const double s = log_sigma();
            return first_ * std::exp(0.5 * s * s);
        }
    }
    return first_;
}

double Distribution::standard_deviation() const {
    switch (kind_) {
        case DistributionKind::point:
            return 0.0;
        case DistributionKind::normal:
            return second_;
        case DistributionKind::uniform:
            return (second_ - first_) / std::sqrt(12.0);
        case DistributionKind::log_normal: {
            // mean * sqrt(exp(sigma^2) - 1), with expm1 for small sigma.
            const double s = log_sigma();
            return mean() * std::sqrt(std::expm1(s * s));
        }
    }
    return 0.0;
}

std::string Distribution::text() const { return parameters_text(kind_, first_, second_); }

}  // namespace brownfloc::uncertainty
