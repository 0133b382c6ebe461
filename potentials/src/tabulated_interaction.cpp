#include "potentials/tabulated_interaction.hpp"

#include <cassert>
#include <cmath>

#include "potentials/constants.hpp"

namespace brownfloc::potentials {
namespace {

// Monomial coefficients (in t on [0, 1]) of the cubic through (t_k, f_k), by Newton
// divided differences; the t_k are the 4 Chebyshev nodes of [0, 1].
void cubic_through(const double t[4], const double f[4], double out[4]) {
    double d[4] = {f[0], f[1], f[2], f[3]};
    for (int level = 1; level < 4; ++level)
        for (int k = 3; k >= level; --k) d[k] = (d[k] - d[k - 1]) / (t[k] - t[k - level]);
    // p(t) = d0 + d1 (t-t0) + d2 (t-t0)(t-t1) + d3 (t-t0)(t-t1)(t-t2), expanded by Horner.
    double c[4] = {d[3], 0, 0, 0};  // polynomial being built, c[0] + c[1] t + ...
    int degree = 0;
    for (int k = 2; k >= 0; --k) {
        // c <- c * (t - t_k) + d_k
        for (int j = degree + 1; j >= 1; --j) c[j] = c[j - 1] - t[k] * c[j];
        c[0] = -t[k] * c[0] + d[k];
        ++degree;
    }
    for (int j = 0; j < 4; ++j) out[j] = c[j];
}

}  // namespace

TabulatedInteraction::TabulatedInteraction(const PairInteraction& pair, double start_gap_m, double end_gap_m)
    : start_gap_m_(start_gap_m), end_gap_m_(end_gap_m), inverse_start_gap_(1.0 / start_gap_m),
      end_x_(end_gap_m / start_gap_m) {
    assert(start_gap_m > 0 && end_gap_m > start_gap_m);
    const EnergySlope at_start = pair.total(start_gap_m);
    force_start_N_ = -at_start.slope_J_per_m;
    energy_start_J_ = at_start.energy_J;

    const int octaves = static_cast<int>(std::ceil(std::log2(end_x_)));
    const std::size_t count = static_cast<std::size_t>(octaves) * intervals_per_octave;
    coefficients_.resize(8 * count);
    double nodes[4];
    for (int k = 0; k < 4; ++k) nodes[k] = 0.5 * (1.0 - std::cos((2 * k + 1) * constants::pi / 8.0));
    for (std::size_t i = 0; i < count; ++i) {
        const int octave = static_cast<int>(i / intervals_per_octave);
        const int sub = static_cast<int>(i % intervals_per_octave);
        const double width_x = std::ldexp(1.0, octave) / intervals_per_octave;
        const double x0 = std::ldexp(1.0, octave) + sub * width_x;
        double force[4], energy[4];
        for (int k = 0; k < 4; ++k) {
            const EnergySlope es = pair.total(start_gap_m * (x0 + nodes[k] * width_x));
            force[k] = -es.slope_J_per_m;
            energy[k] = es.energy_J;
        }
        cubic_through(nodes, force, &coefficients_[8 * i]);
        cubic_through(nodes, energy, &coefficients_[8 * i + 4]);
    }
}

}  // namespace brownfloc::potentials
