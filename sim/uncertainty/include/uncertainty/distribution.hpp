#pragma once
// Uncertainty about ONE input value (a particle radius, a surface potential, a Hamaker
// constant, a salt concentration, a temperature offset), never a spread of values within a
// sample (polydispersity). Written in a scenario as a TOML inline table on the key; the parser
// (elsewhere) calls the factory that matches the fields:
//
//   radius_nm = 50                              -> Distribution::point(50)
//   radius_nm = { mean = 50, sd = 5 }           -> Distribution::normal(50, 5)
//   radius_nm = { low = 45, high = 55 }         -> Distribution::uniform(45, 55)
//   radius_nm = { median = 50, factor = 1.1 }   -> Distribution::log_normal(50, 1.1)
//
// The values carry the unit of the key they sit on (here nm); nothing in here cares which.
// A point, sd = 0, low = high and factor = 1 are all distributions of zero width.
// The factories validate and throw UncertaintyError naming the parameter and the rule
// ("{ mean = 10, sd = -4 }: sd = -4: must be >= 0"); the caller adds file, line and key.
// A Distribution is a small immutable value: copy it freely, use it from any thread.
#include <string>

namespace brownfloc::uncertainty {

enum class DistributionKind { point, normal, uniform, log_normal };

class Distribution {
public:
    // value finite.
    [[nodiscard]] static Distribution point(double value);
    // mean finite, sd finite and >= 0.
    [[nodiscard]] static Distribution normal(double mean, double sd);
    // low, high finite, low <= high, high - low finite.
    [[nodiscard]] static Distribution uniform(double low, double high);
    // median finite and > 0; factor (geometric standard deviation, exp(sigma) of ln X)
    // finite and >= 1. Also rejected: factors so wide that a draw, the mean or the standard
    // deviation would overflow or underflow a double (factor above about 1e11).
    [[nodiscard]] static Distribution log_normal(double median, double factor);

    [[nodiscard]] DistributionKind kind() const noexcept { return kind_; }
    // The parameters as written: value | mean | low | median.
    [[nodiscard]] double first_parameter() const noexcept { return first_; }
    // The parameters as written: 0 | sd | high | factor.
    [[nodiscard]] double second_parameter() const noexcept { return second_; }
    // True for a distribution of zero width: every draw gives the same value.
    [[nodiscard]] bool is_point() const noexcept;

    // Inverse CDF at probability p in [0, 1] (0 and 1 give the ends of the support, which
    // may be infinite). A zero-width distribution returns its value for every p. Throws
    // UncertaintyError for p outside [0, 1] or NaN.
    [[nodiscard]] double quantile(double p) const;
    // P(X <= x).
    [[nodiscard]] double cdf(double x) const;
    // P(X < x) and P(X > x), each accurate in its own tail (no 1 - cdf cancellation).
    [[nodiscard]] double probability_below(double x) const;
    [[nodiscard]] double probability_above(double x) const;
    // P(X < lower) + P(X > upper): the mass outside the physical range [lower, upper]
    // (lower may be -inf, upper +inf). See physical_range.hpp for the check built on it.
    [[nodiscard]] double probability_outside(double lower, double upper) const;

    [[nodiscard]] double mean() const;
    [[nodiscard]] double standard_deviation() const;

    // As written in a scenario: "{ mean = 10, sd = 4 }", or "10" for a point.
    [[nodiscard]] std::string text() const;

    // Same kind and the same parameters, bit for bit.
    friend bool operator==(const Distribution&, const Distribution&) = default;

private:
    Distribution(DistributionKind kind, double first, double second) noexcept
        : kind_{kind}, first_{first}, second_{second} {}
    // ln(factor) of a log-normal.
    [[nodiscard]] double log_sigma() const;

    DistributionKind kind_;
    double first_;
    double second_;
};

}  // namespace brownfloc::uncertainty
