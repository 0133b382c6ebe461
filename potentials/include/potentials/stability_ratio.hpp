#pragma once
// Fuchs stability ratio W: the factor by which the interaction slows diffusion-limited
// coagulation. All results are natural logarithms so that barriers of hundreds of kT do
// not overflow. Thread-safe.
//
// Fuchs (1934), Z. Physik 89, 736: W = R_c int_{R_c}^inf beta(r) exp(U/kT) r^-2 dr,
// R_c = a1 + a2 + min_gap, so W = 1 exactly for U = 0 and beta = 1.
// beta(h) = hydrodynamic correction of Honig, Roebersen & Wiersema (1971), J. Colloid
// Interface Sci. 36, 97: beta(u) = (6u^2 + 13u + 2)/(6u^2 + 4u), u = h / a_bar with
// a_bar = 2 a1 a2 / (a1 + a2) for unequal spheres.
#include "potentials/pair_interaction.hpp"

namespace brownfloc::potentials {

// Honig et al. (1971) relative diffusion coefficient factor D0/D(h) at gap h.
[[nodiscard]] double honig_beta(double h_m, double a1_m, double a2_m);

// ln W without (hydrodynamic = false) or with the Honig correction. Adaptive Gauss-Kronrod
// on ln h with the extrema as break points, then the tail in 1/r; relative error ~1e-9.
[[nodiscard]] double log_stability_ratio(const PairInteraction& pair, double min_gap_m,
                                         bool hydrodynamic);

struct StabilityRatios {
    double log_w = 0.0;               // ln W (no hydrodynamics)
    double log_w_hydrodynamic = 0.0;  // ln W_hyd
    double log_w_hydrodynamic_vdw_only = 0.0;
    [[nodiscard]] double log_w_experimental() const { return log_w_hydrodynamic - log_w_hydrodynamic_vdw_only; }
};

[[nodiscard]] StabilityRatios stability_ratios(const PairInteraction& pair, double min_gap_m);

}  // namespace brownfloc::potentials
