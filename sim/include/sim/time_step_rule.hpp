#pragma once
// The time-step rule (written out in DEVELOPERS.md and stored in summary.json):
//   l = the shortest of the Debye length, the barrier width and the secondary-well width
//       over all species pairs; for a pair without any of them (sticky spheres, or van der
//       Waals alone) l = a/2 with a the smaller median radius of the pair;
//   dt = the largest step with, for every pair inside the cutoff (monomers of the smallest
//       radii, the fastest bodies), the rms relative displacement along the line of
//       centres sqrt(2 D_rel dt) <= l/10 and the drift displacement
//       (D_rel/kT) max|F| dt <= l/10, D_rel = D_i + D_j, with max|F| over the gaps from
//       which the pair can still escape (PairKind::commit_gap_m, capture probability below
//       99 %) out to the cutoff: closer in, every path ends in capture whatever the step;
//   capped by [run] max_time_step_s. A user's [run] time_step_s replaces dt after the same
//   check is reported (it may exceed the rule's step: that is the user's choice, and is said).
#include <optional>
#include <string>
#include <vector>

#include "sim/pair_kind.hpp"

namespace brownfloc::sim {

struct TimeStep {
    double time_step_s = 0;
    double rule_time_step_s = 0;  // what the rule alone gives
    double length_scale_m = 0;    // l
    std::string limited_by;       // e.g. "Debye length, drift of pair 1-1"
    std::string rule;             // the rule in words, for summary.json
    bool user_given = false;
};

struct TimeStepInputs {
    std::vector<PairKind> pair_kinds;
    std::vector<double> species_min_radius_m;     // smallest radius actually drawn, per species
    std::vector<double> species_median_radius_m;
    double kT_J = 0, viscosity_Pa_s = 0;
    std::optional<double> max_time_step_s, time_step_s;
};

[[nodiscard]] TimeStep choose_time_step(const TimeStepInputs& in);

// The rule as one sentence (stored as summary.json time_step_rule).
[[nodiscard]] std::string time_step_rule_text();

}  // namespace brownfloc::sim
