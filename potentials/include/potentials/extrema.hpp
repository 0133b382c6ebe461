#pragma once
// Maxima and minima of U(h) on [min_gap, max_gap], with the conventions of the project's
// INTERFACES (barrier, local maximum, primary and secondary minimum).
#include "potentials/pair_interaction.hpp"

namespace brownfloc::potentials {

struct Extrema {
    double min_gap_m = 0.0;
    double primary_minimum_J = 0.0;  // U(min_gap)

    // Highest local maximum on [min_gap, max_gap]; at min_gap itself when U falls from there.
    bool has_maximum = false;
    double local_maximum_J = 0.0;  // may be negative
    double maximum_gap_m = 0.0;
    bool maximum_at_min_gap = false;

    // Deepest local minimum (U < 0) beyond the maximum.
    bool has_secondary_minimum = false;
    double secondary_minimum_J = 0.0;
    double secondary_minimum_gap_m = 0.0;

    // U at the maximum if > 0, else 0.
    [[nodiscard]] double barrier_J() const { return has_maximum && local_maximum_J > 0 ? local_maximum_J : 0.0; }
    [[nodiscard]] bool has_barrier() const { return has_maximum && local_maximum_J > 0; }
};

// Scans dU/dh on `samples` log-spaced gaps and refines each sign change by bisection to
// 1e-12 relative in h. Thread-safe.
[[nodiscard]] Extrema find_extrema(const PairInteraction& pair, double min_gap_m, double max_gap_m,
                                   int samples = 2000);

// The gap range the project scans and plots: max(30 Debye lengths, 100 nm).
[[nodiscard]] double default_max_gap_m(const PairInteraction& pair);

}  // namespace brownfloc::potentials
