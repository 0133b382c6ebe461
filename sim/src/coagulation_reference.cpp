#include "sim/coagulation_reference.hpp"

#include <cassert>
#include <cmath>

#include "potentials/constants.hpp"

namespace brownfloc::sim {

double constant_kernel_fraction(double t_s, double half_life_s) {
    assert(t_s >= 0 && half_life_s > 0);
    return 1.0 / (1.0 + t_s / half_life_s);
}

double constant_kernel_size_fraction(int k, double t_s, double half_life_s) {
    assert(k >= 1 && t_s >= 0 && half_life_s > 0);
    // Written as x^(k-1) / (1+x)^(k+1) = (x/(1+x))^(k-1) / (1+x)^2 so that large k and large
    // t/tau neither overflow nor lose the ratio.
    const double x = t_s / half_life_s;
    return std::pow(x / (1.0 + x), k - 1) / ((1.0 + x) * (1.0 + x));
}

double transient_integrated_time_s(double t_s, double contact_distance_m,
                                   double relative_diffusion_m2_per_s) {
    assert(t_s >= 0 && contact_distance_m >= 0 && relative_diffusion_m2_per_s > 0);
    // Integral over [0, t] of 1 + R / sqrt(pi D t'); D = +infinity leaves t alone.
    return t_s + 2.0 * contact_distance_m *
                     std::sqrt(t_s / (potentials::constants::pi * relative_diffusion_m2_per_s));
}

double transient_corrected_fraction(double t_s, double rate_m3_per_s, double n0_per_m3,
                                    double contact_distance_m, double relative_diffusion_m2_per_s) {
    assert(rate_m3_per_s > 0 && n0_per_m3 > 0);
    // 1/n = 1/n0 + (k/2) T(t)  =>  n/n0 = 1 / (1 + n0 (k/2) T(t)).
    const double integrated_s =
        transient_integrated_time_s(t_s, contact_distance_m, relative_diffusion_m2_per_s);
    return 1.0 / (1.0 + 0.5 * n0_per_m3 * rate_m3_per_s * integrated_s);
}

}  // namespace brownfloc::sim
