#include "shelf_criteria/cluster_optics.hpp"

#include <cmath>
#include <stdexcept>
#include <string>

#include "number_text.hpp"
#include "rigid_cluster.hpp"

namespace brownfloc::shelf {
namespace {

void check_size(int k) {
    if (k < 1) {
        std::string message = "cluster size k = ";
        message += std::to_string(k);
        message += ": must be >= 1";
        throw std::invalid_argument(message);
    }
}

void check_qa(double qa) {
    if (!(qa >= 0.0 && std::isfinite(qa))) {
        std::string message = "q a = ";
        message += detail::number_text(qa);
        message += ": must be finite and >= 0";
        throw std::invalid_argument(message);
    }
}

void check_fractal_dimension(double fractal_dimension) {
    if (!(fractal_dimension >= 1.0 && fractal_dimension <= 3.0)) {
        std::string message = "fractal_dimension = ";
        message += detail::number_text(fractal_dimension);
        message += ": must be in [1, 3]";
        throw std::invalid_argument(message);
    }
}

}  // namespace

double sphere_form_factor(double qa) {
    check_qa(qa);
    const double x = qa;
    double amplitude = 0.0;
    if (x < 1.0) {
        // Below 1 the difference sin x - x cos x loses digits to cancellation (all of them
        // as x -> 0), so sum its series instead: 3 (sin x - x cos x)/x³ =
        // Σ_{n>=1} (-1)^(n+1) 6n x^(2n-2) / (2n+1)! = 1 - x²/10 + x⁴/280 - ...; alternating
        // with falling terms, so stopping below 1e-17 of the sum leaves rounding only.
        double x_power = 1.0;      // x^(2n-2)
        double factorial = 6.0;    // (2n+1)!
        for (int n = 1; n <= 30; ++n) {
            const double term = 6.0 * n * x_power / factorial;
            amplitude += (n % 2 == 1) ? term : -term;
            if (term < 1e-17 * amplitude) break;
            x_power *= x * x;
            factorial *= (2.0 * n + 2.0) * (2.0 * n + 3.0);
        }
    } else {
        amplitude = 3.0 * (std::sin(x) - x * std::cos(x)) / (x * x * x);
    }
    return amplitude * amplitude;
}

double cluster_structure_factor(int k, double qa, double fractal_dimension) {
    check_size(k);
    check_qa(qa);
    check_fractal_dimension(fractal_dimension);
    if (k == 1) return 1.0;
    if (k == 2) return detail::debye_structure_factor(detail::doublet(), qa);
    if (k == 3)
        return 0.5 * (detail::debye_structure_factor(detail::linear_triplet(), qa) +
                      detail::debye_structure_factor(detail::triangle_triplet(), qa));
    // Fisher & Burford (1967) with R_g = a k^(1/d_f); (q R_g)² overflowing to inf gives 0.
    const double radius_of_gyration_over_a = std::pow(static_cast<double>(k), 1.0 / fractal_dimension);
    const double q_rg = qa * radius_of_gyration_over_a;
    return std::pow(1.0 + 2.0 * q_rg * q_rg / (3.0 * fractal_dimension), -0.5 * fractal_dimension);
}

double cluster_intensity_over_primary(int k, Optics optics, double qa, double fractal_dimension) {
    check_size(k);
    const double kk = static_cast<double>(k) * static_cast<double>(k);
    switch (optics) {
        case Optics::rayleigh:
            check_fractal_dimension(fractal_dimension);
            return kk;
        case Optics::rgd: return kk * cluster_structure_factor(k, qa, fractal_dimension);
    }
    throw std::invalid_argument("cluster_intensity_over_primary: not an Optics enumerator");
}

double cluster_hydrodynamic_radius_over_a(int k, double fractal_dimension) {
    check_size(k);
    check_fractal_dimension(fractal_dimension);
    if (k == 1) return 1.0;
    if (k == 2) return detail::kirkwood_radius_over_a(detail::doublet());
    if (k == 3)
        return 0.5 * (detail::kirkwood_radius_over_a(detail::linear_triplet()) +
                      detail::kirkwood_radius_over_a(detail::triangle_triplet()));
    return std::pow(static_cast<double>(k), 1.0 / fractal_dimension);
}

}  // namespace brownfloc::shelf
