#pragma once
// The capture rule shared by the engine and its two-body validation: a pair of gap h that
// starts a step at x0 = h0 - h_c > 0 above the capture gap h_c and ends at x1 = h1 - h_c
// is captured if x1 <= 0, or else with the probability that the Brownian bridge of the
// gap between the two ends crossed h_c inside the step:
//   P = exp(-x0 x1 / (D_rel dt)),
// D_rel the relative diffusion coefficient along the line of centres (so the gap's
// variance grows as 2 D_rel t). This is the reflection principle for a Brownian bridge
// (e.g. Karatzas & Shreve 1991, Brownian Motion and Stochastic Calculus, sec. 2.6 [memory
// for the section]), with the capture sphere taken as locally flat over one step.
#include <cmath>

namespace brownfloc::sim {

// Crossing probability; 1 when the step starts at or below the capture gap.
[[nodiscard]] inline double bridge_crossing_probability(double x0_m, double x1_m, double relative_diffusion_m2_per_s,
                                                        double dt_s) {
    if (x0_m <= 0 || x1_m <= 0) return 1.0;
    return std::exp(-x0_m * x1_m / (relative_diffusion_m2_per_s * dt_s));
}

// Whether a step that ends x1 above the capture gap can have crossed it with probability
// above e^-40 (the start x0 lies within a few rms steps of x1): x1^2 <= 144 D_rel dt.
[[nodiscard]] inline bool bridge_crossing_possible(double x1_m, double relative_diffusion_m2_per_s, double dt_s) {
    return x1_m * x1_m <= 144.0 * relative_diffusion_m2_per_s * dt_s;
}

}  // namespace brownfloc::sim
