#include "potentials/effective_potential.hpp"

#include <cassert>
#include <cmath>

#include "quadrature.hpp"

namespace brownfloc::potentials {
namespace {

// q(x) = (exp(-x) - 1 + x - x^2/2) / x^2, accurate for all x (a Taylor series near 0,
// where the direct form cancels).
double q_of(double x) {
    if (std::abs(x) < 0.05) {
        // sum_{n>=3} (-x)^n / n! / x^2
        double term = -x / 6.0, sum = 0.0;
        for (int n = 3; n < 14; ++n) {
            sum += term;
            term *= -x / (n + 1);
        }
        return sum;
    }
    return (std::expm1(-x) + x - 0.5 * x * x) / (x * x);
}

}  // namespace

double effective_surface_potential_V(double surface_potential_V, const Electrolyte& electrolyte,
                                     const Medium& medium) {
    const double thermal_V = medium.thermal_voltage_V();
    const double y0 = surface_potential_V / thermal_V;
    if (y0 == 0.0) return 0.0;
    double sum_nz2 = 0.0;
    for (const Ion& ion : electrolyte.ions())
        sum_nz2 += ion.concentration_mol_per_m3 * ion.valence * ion.valence;
    assert(sum_nz2 > 0);

    // F(y)/y^2 = 1 + delta(y), delta = 2 sum n_i z_i^2 q(z_i y) / sum n_i z_i^2; the linear
    // term sum n_i z_i y vanishes by electroneutrality and is left out exactly.
    const double sign = y0 > 0 ? 1.0 : -1.0;
    auto integrand = [&](double t) {  // t = |y| in (0, |y0|]
        const double y = sign * t;
        double delta = 0.0;
        for (const Ion& ion : electrolyte.ions())
            delta += ion.concentration_mol_per_m3 * ion.valence * ion.valence * q_of(ion.valence * y);
        delta *= 2.0 / sum_nz2;
        const double root = std::sqrt(1.0 + delta);
        // 1/sqrt(F) - 1/t = (1/t)((1+delta)^-1/2 - 1), written without cancellation.
        return -delta / (root * (1.0 + root)) / t;
    };
    const auto result = detail::integrate(integrand, {0.0, std::abs(y0)}, 1e-13, 1e-15);
    return surface_potential_V * std::exp(result.value);
}

}  // namespace brownfloc::potentials
