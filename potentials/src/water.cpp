#include "potentials/water.hpp"

#include <cmath>

#include "potentials/medium.hpp"

namespace brownfloc::potentials {

double water_viscosity_Pa_s(double temperature_K) {
    // Patek et al. (2009), J. Phys. Chem. Ref. Data 38, 21 [equation and table numbers not checked]:
    // eta / (1 uPa s) = sum a_i (T / 300 K)^b_i at 0.1 MPa.
    constexpr double a[4] = {280.68, 511.45, 61.131, 0.45903};
    constexpr double b[4] = {-1.9, -7.7, -19.6, -40.0};
    const double t = temperature_K / 300.0;
    double eta_uPa_s = 0.0;
    for (int i = 0; i < 4; ++i) eta_uPa_s += a[i] * std::pow(t, b[i]);
    return eta_uPa_s * 1e-6;
}

double water_density_kg_per_m3(double temperature_K) {
    const double t = temperature_K - constants::zero_celsius_K;
    const double a1 = -3.983035, a2 = 301.797, a3 = 522528.9, a4 = 69.34881, a5 = 999.974950;
    return a5 * (1 - (t + a1) * (t + a1) * (t + a2) / (a3 * (t + a4)));
}

double water_relative_permittivity(double temperature_K) {
    // Malmberg & Maryott (1956), J. Res. NBS 56, 1 (t in degC, 0-100 degC).
    const double t = temperature_K - constants::zero_celsius_K;
    return 87.740 - 0.40008 * t + 9.398e-4 * t * t - 1.410e-6 * t * t * t;
}

Medium water_at(double temperature_K) {
    return Medium{temperature_K, water_viscosity_Pa_s(temperature_K),
                  water_relative_permittivity(temperature_K)};
}

}  // namespace brownfloc::potentials
