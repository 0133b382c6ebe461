#pragma once
// What the engine needs to know about one species pair at its median radii: where a pair
// is captured, how far the interaction reaches, and the length scales the time step must
// resolve. Computed once per run from the analytic PairInteraction.
#include <optional>
#include <string>

#include "potentials/pair_interaction.hpp"

namespace brownfloc::sim {

struct PairKind {
    std::size_t species_i = 0, species_j = 0;  // 0-based, i <= j
    bool interacting = false;                  // false: U == 0 (sticky hard spheres)

    // Capture gap [m]. Default: where U first falls 10 kT below the barrier top inside the
    // barrier; without a barrier where U first reaches -10 kT coming in; U == 0: min_gap.
    // Never below min_gap.
    double capture_gap_m = 0;
    std::string capture_gap_rule;  // which of the rules above set it, for summary.json

    // Cutoff gap [m]: beyond it |U| <= 0.01 kT everywhere (scanned to 20 radii); never
    // below the capture gap. Forces are set to zero beyond it.
    double cutoff_gap_m = 0;

    // Length scales [m] of the potential that the step must resolve (empty when absent).
    std::optional<double> debye_length_m;  // only when the double layer acts
    std::optional<double> barrier_width_m;  // width of the region where U >= U_max - 1 kT
    std::optional<double> well_width_m;     // width of the secondary well where U <= U_min + 1 kT
    // Commitment gap [m]: inside it a pair is captured with probability >= 99 % before it
    // escapes to infinity (the splitting probability of radial diffusion in U,
    // p_capture(r) = int_r^inf e^(U/kT) r'^-2 dr' / int_{R_c}^inf e^(U/kT) r'^-2 dr').
    // Between it and the capture gap the step need not resolve the drift: every path there
    // ends in capture.
    double commit_gap_m = 0;
    double max_force_N = 0;                 // max |F| on [commitment gap, cutoff]

    // Barrier and secondary minimum as in `dlvo` (kT; 0 when absent).
    double barrier_kT = 0;
    double secondary_minimum_kT = 0;
    std::optional<double> secondary_minimum_gap_m;
    // Cluster gap [m] for geometric (secondary-minimum) clusters: where U has risen to half
    // the secondary-minimum depth beyond the minimum; empty when the depth is < 1 kT.
    std::optional<double> cluster_gap_m;

    // ln of the Fuchs stability ratio (no hydrodynamics) from min_gap (as in `dlvo`), and
    // from the capture distance a1 + a2 + h_c relative to the fast rate 4 pi D_rel (a1 + a2)
    // (what the engine, which has no hydrodynamic interactions, should reproduce).
    double log_stability_ratio = 0;
    double log_stability_ratio_at_capture = 0;
};

// Analyses the pair. capture_gap_override_m (from [run] capture_gap_nm) replaces the
// default rule; it must be >= min_gap (the caller validates).
[[nodiscard]] PairKind analyse_pair_kind(const potentials::PairInteraction& pair, std::size_t species_i,
                                         std::size_t species_j, double min_gap_m,
                                         std::optional<double> capture_gap_override_m,
                                         std::optional<double> cluster_gap_override_m);

}  // namespace brownfloc::sim
