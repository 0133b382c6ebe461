#pragma once
// A fast Fuchs stability ratio for Monte Carlo loops (thousands of ln W per second per core),
// accurate to |ln W_fast - ln W| <= 1e-3 against the careful log_stability_ratio of
// stability_ratio.hpp over the parameter range it was checked on (below).
//
// The integral is the same: Fuchs (1934), Z. Physik 89, 736,
//   W = R_c int_{R_c}^inf beta(r) exp(U/kT) r^-2 dr,  R_c = a1 + a2 + min_gap,
// with beta = 1 or Honig, Roebersen & Wiersema (1971), J. Colloid Interface Sci. 36, 97
// (honig_beta in stability_ratio.hpp). Only the quadrature differs:
//  1. Scan the log of the integrand in t = ln h, g(t) = ln[R_c beta e^{U/kT} h/(a1+a2+h)^2],
//     and its slope on a grid of step 0.2 in t from min_gap to the same far gap as the
//     careful routine (max(30 Debye lengths, 100 nm, 10 (a1 + a2))).
//  2. Each local maximum of g (a sign change of dg/dt, or an end where g falls inwards) is
//     refined by bisection on dg/dt; its width in t is 1/sqrt(-g'') (interior) or 1/|g'| (end).
//  3. Fixed-order (8-point) Gauss-Legendre panels in t: widths doubling outwards from each
//     peak, starting at its width, and at most 1 in t elsewhere. Nodes and weights come
//     from Newton's method on the Legendre three-term recurrence, weights 2/((1-x^2) P_n'^2)
//     (Abramowitz & Stegun 1964, eq. 25.4.29 and table 25.4 [from memory]).
//  4. Beyond the far gap, one 8-point panel in w = R_c / r on (0, R_c/(a1+a2+far_gap)],
//     where the integrand is beta e^{U/kT}, smooth and bounded.
//  All sums are taken in logarithms (a running log-sum-exp), so barriers of hundreds or
//  thousands of kT neither overflow nor lose precision.
//
// Checked range (tests/potentials/fast_stability_ratio.test.cpp): equal spheres of radius
// 20-500 nm, Hamaker 3e-21..3e-20 J, surface potential 10-80 mV, 1:1 salt 0.1-300 mM or 2:1
// salt 0.1-30 mM, every double-layer model, retarded or not, hydrodynamic or not,
// min_gap 0.2 nm. Outside it the method is the same but the 1e-3 is not promised.
//
// Cost: a few hundred evaluations of U (tens of microseconds) against a few thousand for
// the careful routine. Thread-safe and reproducible: no state outside the call (the
// Gauss-Legendre table is a function-local static, built once, thread-safely).
//
//   const double log_w = log_stability_ratio_fast(pair, 0.2e-9, true);
#include "potentials/pair_interaction.hpp"

namespace brownfloc::potentials {

// ln W as log_stability_ratio(pair, min_gap_m, hydrodynamic), to |ln W_fast - ln W| <= 1e-3
// over the range above; min_gap_m [m] is the surface gap at contact. Never NaN: should a
// non-finite value arise (a pathological pair), it falls back to the careful routine.
// Throws brownfloc::InputError when min_gap_m is not finite and > 0 (validate before any
// OpenMP region: exceptions must not leave one).
[[nodiscard]] double log_stability_ratio_fast(const PairInteraction& pair, double min_gap_m, bool hydrodynamic);

}  // namespace brownfloc::potentials
