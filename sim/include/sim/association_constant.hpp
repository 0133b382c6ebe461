#pragma once
// Reversible association in the secondary minimum of a pair potential U(r).
//
// In the dilute limit the pair distribution is g(r) = exp(-U(r)/kT) (PHYSICS.md "Clusters"),
// so the excess number of partners a particle holds inside a shell [r1, r2], per partner
// number density, is the cluster integral
//   K = 4 pi integral_{r1}^{r2} (exp(-U(r)/kT) - 1) r^2 dr   [m^3].
// K counts ordered (distinguishable) pairs; for identical particles the doublet density is
// n_D = 1/2 K n_M^2 (see doublet_fraction_expected). The "- 1" removes the random, unbound
// neighbours, so K -> 0 for a vanishing well; for a well of several kT it hardly matters.
//
//   const PairInteraction pair({500e-9, 500e-9, 1e-20, -0.05, -0.05}, water_at(298.15),
//                              Electrolyte::from_salt("NaCl", 10));
//   const SecondaryMinimumAssociation k = secondary_minimum_association(pair, 0.2e-9);
//   if (k.constant_m3) double f = doublet_fraction_expected(*k.constant_m3, 1e16);
//
// Meaningful when the barrier is high enough that the primary minimum is not reached over
// the times of interest: K describes the quasi-equilibrium of the secondary well only.
// Pure functions; thread-safe.
#include <functional>
#include <optional>
#include <string>

#include "potentials/pair_interaction.hpp"

namespace brownfloc::sim {

struct SecondaryMinimumAssociation {
    std::optional<double> constant_m3;  // K; nullopt: see note
    double well_start_gap_m = 0.0;      // inner limit: the barrier maximum
    double well_end_gap_m = 0.0;        // outer limit of the quadrature (|U| < 1e-12 kT there)
    double minimum_gap_m = 0.0;         // the secondary minimum
    double minimum_kT = 0.0;            // U there, in kT (< 0)
    std::string note;
};

// K [m^3] of the well beyond the barrier maximum of `pair` (potentials::find_extrema on
// [min_gap_m, default_max_gap_m]), integrated out to where |U| < 1e-12 kT plus the r^-6 far
// tail in closed form. Adaptive Gauss-Kronrod, ~1e-10 relative. nullopt with a note when U has
// no maximum, no secondary minimum, or a van der Waals form other than the full Hamaker
// (Derjaguin and Gregory forms decay as 1/h or 1/h^2 and make the integral diverge).
[[nodiscard]] SecondaryMinimumAssociation secondary_minimum_association(const potentials::PairInteraction& pair,
                                                                        double min_gap_m);

// 4 pi integral_{r1}^{r2} (exp(-u(r)) - 1) r^2 dr [m^3] for u_kT_of_r(r [m]) in kT,
// 0 < r1_m < r2_m. Globally adaptive Gauss-Kronrod 7/15 to 1e-11 relative (or 1e-15 of the
// integral of the absolute value); u may jump (panels are bisected around the jump).
[[nodiscard]] double integrate_well(const std::function<double(double)>& u_kT_of_r, double r1_m, double r2_m);

// Fraction of particles in doublets, 2 n_D / n0, at association equilibrium of
// monomer + monomer <-> doublet with association constant K [m^3] (ordered-pair convention
// above) and total particle density n_per_m3 = n_M + 2 n_D [1/m^3]; 0 for K <= 0. Dilute
// limit: doublets only, so use it while the result is small (<~ 0.2); beyond that chains and
// larger clusters held in the secondary minimum take a share.
[[nodiscard]] double doublet_fraction_expected(double association_m3, double n_per_m3);

}  // namespace brownfloc::sim
