#pragma once
// Time to reach an aggregation criterion, and the criterion's value at a given time, from
// the constant-kernel solution of Smoluchowski (1917), Z. Phys. Chem. 92, 129: with
// τ = t½ · W = W · 3η/(4 kT n0) (rate (8kT/3η)/W, dN/dt = -½ k N²) and x = t/τ,
//   N/N0 = 1/(1 + x),   n_k/N0 = x^(k-1)/(1 + x)^(k+1).
// Closed forms, exact up to rounding:
//   count-drop           g = 1 - N/N0 = x/(1+x)           t = τ g/(1-g)
//   mean-size            v = N0/N = 1 + x                  t = τ (v - 1)
//   aggregated-fraction  g = 1 - n1/N0 = 1 - 1/(1+x)²      t = τ (1/√(1-g) - 1)
//   z-average-growth     g = D_z/D_z(0) - 1 (z_average.hpp) t by a root search
//
//   const double t_s = time_to_criterion_s(spec, tau_s, 100e-9);
//   const double back = criterion_at(spec, t_s / tau_s, 100e-9);   // == spec.value
//
// The ratio t/τ depends on the criterion (and, for the z-average, on the optics and the
// radius), not on τ: an estimator that sweeps temperatures can compute
// criterion_t_over_tau once. Pure functions; thread-safe.
#include "shelf_criteria/criterion.hpp"

namespace brownfloc::shelf {

// t/τ at which the criterion's value is reached. primary_radius_m > 0 [m] (used by the
// z-average only, always checked). Throws std::invalid_argument for a bad spec or radius.
[[nodiscard]] double criterion_t_over_tau(const CriterionSpec& spec, double primary_radius_m);

// Time [s] at which the criterion is reached: τ · criterion_t_over_tau. tau_s > 0 and
// finite [s]. Throws std::invalid_argument for bad input, std::range_error when the time
// overflows a double (a count drop within 1e-300 of 1 with a huge τ, say).
[[nodiscard]] double time_to_criterion_s(const CriterionSpec& spec, double tau_s,
                                         double primary_radius_m);

// The criterion's quantity at x = t/τ >= 0 (finite; <= max_z_average_t_over_tau for the
// z-average): count drop g, mean size v, aggregated fraction g or z-average growth g, as in
// the table above. spec.value is checked but not used.
[[nodiscard]] double criterion_at(const CriterionSpec& spec, double t_over_tau,
                                  double primary_radius_m);

}  // namespace brownfloc::shelf
