#include "potentials/kinetics.hpp"

#include "potentials/constants.hpp"

namespace brownfloc::potentials {

double fast_rate_m3_per_s(double a1_m, double a2_m, double temperature_K, double viscosity_Pa_s) {
    // k = 4 pi (D1 + D2)(a1 + a2) with D = kT/(6 pi eta a) = (2kT/3eta)(a1+a2)^2/(a1 a2).
    const double kT = constants::boltzmann_J_per_K * temperature_K;
    const double s = a1_m + a2_m;
    return 2.0 * kT / (3.0 * viscosity_Pa_s) * s * s / (a1_m * a2_m);
}

double fast_half_life_s(double rate_m3_per_s, double number_density_per_m3) {
    // dN/dt = -1/2 k N^2  =>  N = N0 / (1 + t k N0 / 2), half at t = 2 / (k N0).
    return 2.0 / (rate_m3_per_s * number_density_per_m3);
}

double stokes_einstein_m2_per_s(double radius_m, double temperature_K, double viscosity_Pa_s) {
    return constants::boltzmann_J_per_K * temperature_K / (6.0 * constants::pi * viscosity_Pa_s * radius_m);
}

}  // namespace brownfloc::potentials
