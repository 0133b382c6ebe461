#include "shelf_criteria/criterion_time.hpp"

#include <cmath>
#include <stdexcept>
#include <string>

#include "number_text.hpp"
#include "shelf_criteria/z_average.hpp"

namespace brownfloc::shelf {
namespace {

void check_radius(double primary_radius_m) {
    if (!(primary_radius_m > 0.0 && std::isfinite(primary_radius_m))) {
        std::string message = "primary_radius_m = ";
        message += detail::number_text(primary_radius_m);
        message += ": must be finite and > 0";
        throw std::invalid_argument(message);
    }
}

}  // namespace

double criterion_t_over_tau(const CriterionSpec& spec, double primary_radius_m) {
    validate_criterion(spec);
    check_radius(primary_radius_m);
    const double g = spec.value;
    switch (spec.criterion) {
        case Criterion::count_drop: return g / (1.0 - g);      // N/N0 = 1/(1+x) = 1 - g
        case Criterion::mean_size: return g - 1.0;             // N0/N = 1 + x = v
        case Criterion::aggregated_fraction:
            // (1+x)² = 1/(1-g): x = 1/√(1-g) - 1, written as expm1(-½ ln(1-g)) so that a
            // small g keeps its relative precision.
            return std::expm1(-0.5 * std::log1p(-g));
        case Criterion::z_average_growth:
            return t_over_tau_for_z_average_growth(spec.scattering, spec.fractal_dimension, g,
                                                   primary_radius_m);
    }
    throw std::invalid_argument("criterion_t_over_tau: not a Criterion enumerator");
}

double time_to_criterion_s(const CriterionSpec& spec, double tau_s, double primary_radius_m) {
    if (!(tau_s > 0.0 && std::isfinite(tau_s))) {
        std::string message = "tau_s = ";
        message += detail::number_text(tau_s);
        message += ": the slow-aggregation time scale must be finite and > 0";
        throw std::invalid_argument(message);
    }
    const double t_over_tau = criterion_t_over_tau(spec, primary_radius_m);
    const double time_s = tau_s * t_over_tau;
    if (!std::isfinite(time_s)) {
        std::string message = "time to criterion ";
        message += criterion_name(spec.criterion);
        message += " = ";
        message += detail::number_text(spec.value);
        message += " overflows a double: tau_s = ";
        message += detail::number_text(tau_s);
        message += " times t/tau = ";
        message += detail::number_text(t_over_tau);
        throw std::range_error(message);
    }
    return time_s;
}

double criterion_at(const CriterionSpec& spec, double t_over_tau, double primary_radius_m) {
    validate_criterion(spec);
    check_radius(primary_radius_m);
    if (!(t_over_tau >= 0.0 && std::isfinite(t_over_tau))) {
        std::string message = "criterion ";
        message += criterion_name(spec.criterion);
        message += ": t/tau = ";
        message += detail::number_text(t_over_tau);
        message += ": must be finite and >= 0";
        throw std::invalid_argument(message);
    }
    const double x = t_over_tau;
    // y = x/(1+x) = 1 - N/N0 stays in [0, 1] for every finite x (no inf/inf).
    const double count_drop = x / (1.0 + x);
    switch (spec.criterion) {
        case Criterion::count_drop: return count_drop;
        case Criterion::mean_size: return 1.0 + x;
        case Criterion::aggregated_fraction:
            // 1 - n1/N0 = 1 - (1 - y)² = y (2 - y): no cancellation at small x.
            return count_drop * (2.0 - count_drop);
        case Criterion::z_average_growth:
            return z_average_growth(spec.scattering, spec.fractal_dimension, x, primary_radius_m);
    }
    throw std::invalid_argument("criterion_at: not a Criterion enumerator");
}

}  // namespace brownfloc::shelf
