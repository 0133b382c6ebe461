#include "shelf_criteria/z_average.hpp"

#include <algorithm>
#include <cmath>
#include <stdexcept>
#include <string>

#include "brent_root.hpp"
#include "number_text.hpp"
#include "shelf_criteria/cluster_optics.hpp"
#include "z_average_series.hpp"

namespace brownfloc::shelf {
namespace {

// Issue 6: the time to a z-average growth to a relative 1e-10 in t.
constexpr double root_relative_tolerance = 1e-10;

void check_radius(double primary_radius_m) {
    if (!(primary_radius_m > 0.0 && std::isfinite(primary_radius_m))) {
        std::string message = "primary_radius_m = ";
        message += detail::number_text(primary_radius_m);
        message += ": must be finite and > 0";
        throw std::invalid_argument(message);
    }
}

void check_t_over_tau(double t_over_tau) {
    if (!(t_over_tau >= 0.0 && t_over_tau <= max_z_average_t_over_tau)) {
        std::string message = "z-average: t/tau = ";
        message += detail::number_text(t_over_tau);
        message += ": must be in [0, ";
        message += detail::number_text(max_z_average_t_over_tau);
        message += "] (the constant kernel stopped holding long before the upper limit)";
        throw std::invalid_argument(message);
    }
}

// Validates everything and returns the series for the setup (qa = 0 for rayleigh).
detail::ZAverageSeries make_series(const ScatteringSetup& setup, double fractal_dimension,
                                   double primary_radius_m) {
    validate_scattering(setup, fractal_dimension);
    check_radius(primary_radius_m);
    double qa = 0.0;
    if (setup.optics == Optics::rgd) {
        qa = scattering_vector_per_m(setup) * primary_radius_m;
        if (!std::isfinite(qa)) {
            std::string message = "z-average-growth: q a = ";
            message += detail::number_text(qa);
            message += " (wavelength_nm = ";
            message += detail::number_text(setup.wavelength_nm);
            message += ", primary_radius_m = ";
            message += detail::number_text(primary_radius_m);
            message += "): q a must be finite";
            throw std::invalid_argument(message);
        }
    }
    return detail::ZAverageSeries(setup.optics, qa, fractal_dimension);
}

}  // namespace

double z_average_growth(const ScatteringSetup& setup, double fractal_dimension, double t_over_tau,
                        double primary_radius_m) {
    detail::ZAverageSeries series = make_series(setup, fractal_dimension, primary_radius_m);
    check_t_over_tau(t_over_tau);
    return series.growth(t_over_tau);
}

double z_average_diameter_ratio(const ScatteringSetup& setup, double fractal_dimension,
                                double t_over_tau, double primary_radius_m) {
    return 1.0 + z_average_growth(setup, fractal_dimension, t_over_tau, primary_radius_m);
}

double z_average_initial_slope(const ScatteringSetup& setup, double fractal_dimension,
                               double primary_radius_m) {
    validate_scattering(setup, fractal_dimension);
    check_radius(primary_radius_m);
    const double qa = setup.optics == Optics::rgd ? scattering_vector_per_m(setup) * primary_radius_m : 0.0;
    const double doublet_intensity = cluster_intensity_over_primary(2, setup.optics, qa, fractal_dimension);
    return doublet_intensity * (1.0 - 1.0 / cluster_hydrodynamic_radius_over_a(2, fractal_dimension));
}

double t_over_tau_for_z_average_growth(const ScatteringSetup& setup, double fractal_dimension,
                                       double growth, double primary_radius_m) {
    detail::ZAverageSeries series = make_series(setup, fractal_dimension, primary_radius_m);
    if (!(growth > 0.0 && std::isfinite(growth))) {
        std::string message = "z-average-growth: growth = ";
        message += detail::number_text(growth);
        message += ": must be finite and > 0";
        throw std::invalid_argument(message);
    }
    const auto excess = [&](double x) { return series.growth(x) - growth; };

    // Bracket: start from the initial slope's estimate and double; D_z(t) rises with t.
    const double slope = z_average_initial_slope(setup, fractal_dimension, primary_radius_m);
    double lo = 0.0, excess_lo = -growth;
    double hi = std::min(growth / slope, max_z_average_t_over_tau);
    double excess_hi = excess(hi);
    while (excess_hi < 0.0) {
        if (hi >= max_z_average_t_over_tau) {
            std::string message = "z-average-growth = ";
            message += detail::number_text(growth);
            message += " is not reached by t/tau = ";
            message += detail::number_text(max_z_average_t_over_tau);
            message += " (the growth there is ";
            message += detail::number_text(excess_hi + growth);
            message += "); the constant kernel is not followed that far";
            throw std::invalid_argument(message);
        }
        lo = hi;
        excess_lo = excess_hi;
        hi = std::min(2.0 * hi, max_z_average_t_over_tau);
        excess_hi = excess(hi);
    }
    return detail::brent_root(excess, lo, hi, excess_lo, excess_hi, root_relative_tolerance);
}

}  // namespace brownfloc::shelf
