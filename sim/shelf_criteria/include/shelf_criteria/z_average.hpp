#pragma once
// z-average (light-scattering) diameter of the constant-kernel size distribution of
// Smoluchowski (1917), n_k/N0 = x^(k-1)/(1+x)^(k+1) with x = t/τ:
//   D_z = Σ n_k I_k / Σ (n_k I_k / D_k),  D_k = 2 R_h,k   (harmonic, intensity-weighted),
// with I_k and R_h,k from cluster_optics.hpp. At x = 0 only singlets exist: D_z(0) = 2a.
//
// Sum: with p = x/(1+x), n_k ∝ p^(k-1). Sizes k = 1..K are summed, K the first size at which
// both (a) the remaining number fraction Σ_{j>K} n_j / N = p^K is below 1e-12 and (b) a bound
// on what the rest would add, Σ_{j>K} j² p^(j-1) (every optics has I_j <= j² I_1), is below
// 1e-15 of both partial sums. K is about 41 (1 + x) for rayleigh optics and up to ~57 (1 + x)
// for rgd; it is finite for every x because x is capped at max_z_average_t_over_tau, where
// the constant kernel has long stopped holding.
//
//   const double g = z_average_growth(setup, 2.1, 0.5, 100e-9);  // D_z/D_z(0) - 1 at t = τ/2
//
// Pure functions; thread-safe. Bad input throws std::invalid_argument.
#include "shelf_criteria/scattering_setup.hpp"

namespace brownfloc::shelf {

// Largest t/τ at which the z-average is evaluated (4e5 to 6e5 sizes summed there).
inline constexpr double max_z_average_t_over_tau = 1e4;

// D_z(t)/D_z(0). t_over_tau in [0, max_z_average_t_over_tau]; primary_radius_m > 0 [m]
// (used by rgd optics only, but always checked); d_f in [1, 3]. Increasing in t.
[[nodiscard]] double z_average_diameter_ratio(const ScatteringSetup& setup, double fractal_dimension,
                                              double t_over_tau, double primary_radius_m);

// D_z(t)/D_z(0) - 1, summed without the subtraction (no cancellation at small t).
[[nodiscard]] double z_average_growth(const ScatteringSetup& setup, double fractal_dimension,
                                      double t_over_tau, double primary_radius_m);

// d(D_z/D_z(0)) / d(t/τ) at t = 0: (I_2/I_1)(1 - a/R_h,2), derived in DEVELOPERS.md
// ("Shelf-life criteria"); 1 for rayleigh optics. Divide by τ [s] for a rate in 1/s.
[[nodiscard]] double z_average_initial_slope(const ScatteringSetup& setup, double fractal_dimension,
                                             double primary_radius_m);

// t/τ at which D_z/D_z(0) = 1 + growth (growth > 0), by a bracket and Brent's method to a
// relative 1e-10 in t. Throws std::invalid_argument when the growth is not reached by
// max_z_average_t_over_tau (the message gives the growth reached there).
[[nodiscard]] double t_over_tau_for_z_average_growth(const ScatteringSetup& setup,
                                                     double fractal_dimension, double growth,
                                                     double primary_radius_m);

}  // namespace brownfloc::shelf
