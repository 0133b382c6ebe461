#include "sim/time_step_rule.hpp"

#include <algorithm>
#include <cmath>
#include <limits>

#include "potentials/constants.hpp"

namespace brownfloc::sim {

std::string time_step_rule_text() {
    return "dt is the largest step for which, for every species pair inside the cutoff (monomers of the smallest "
           "radii), the rms relative displacement along the line of centres sqrt(2 (D_i + D_j) dt) and the drift "
           "displacement ((D_i + D_j)/kT) max|F| dt are each <= l/10, max|F| taken over the gaps from which the pair "
           "can still escape (capture probability below 99 %) out to the cutoff, where l is the shortest of the Debye length, "
           "the barrier width (U >= U_max - 1 kT) and the secondary-well width (U <= U_min + 1 kT), or a/2 for a "
           "pair with none of them (a = the smaller median radius); capped by max_time_step_s";
}

TimeStep choose_time_step(const TimeStepInputs& in) {
    TimeStep out;
    out.rule = time_step_rule_text();
    double best = std::numeric_limits<double>::infinity();
    double ell_min = std::numeric_limits<double>::infinity();
    for (const PairKind& kind : in.pair_kinds) {
        double ell = std::numeric_limits<double>::infinity();
        std::string what;
        auto consider = [&](const std::optional<double>& v, const char* name) {
            if (v && *v > 0 && *v < ell) { ell = *v; what = name; }
        };
        consider(kind.debye_length_m, "Debye length");
        consider(kind.barrier_width_m, "barrier width");
        consider(kind.well_width_m, "secondary-well width");
        if (!std::isfinite(ell)) {
            ell = 0.5 * std::min(in.species_median_radius_m[kind.species_i], in.species_median_radius_m[kind.species_j]);
            what = "half the radius (no Debye length, barrier or well)";
        }
        const double d_i = in.kT_J / (6 * potentials::constants::pi * in.viscosity_Pa_s * in.species_min_radius_m[kind.species_i]);
        const double d_j = in.kT_J / (6 * potentials::constants::pi * in.viscosity_Pa_s * in.species_min_radius_m[kind.species_j]);
        const double d_rel = d_i + d_j;
        const double target = ell / 10.0;
        const double dt_noise = target * target / (2.0 * d_rel);
        const double dt_drift = kind.max_force_N > 0 ? target * in.kT_J / (d_rel * kind.max_force_N)
                                                     : std::numeric_limits<double>::infinity();
        const std::string pair = std::to_string(kind.species_i + 1) + "-" + std::to_string(kind.species_j + 1);
        if (dt_noise < best) { best = dt_noise; out.limited_by = what + ", rms displacement of pair " + pair; }
        if (dt_drift < best) { best = dt_drift; out.limited_by = what + ", drift of pair " + pair; }
        ell_min = std::min(ell_min, ell);
    }
    if (in.max_time_step_s && *in.max_time_step_s < best) {
        best = *in.max_time_step_s;
        out.limited_by = "[run] max_time_step_s";
    }
    out.rule_time_step_s = best;
    out.length_scale_m = ell_min;
    out.time_step_s = best;
    if (in.time_step_s) {
        out.time_step_s = *in.time_step_s;
        out.user_given = true;
        out.limited_by = "given in [run] time_step_s";
    }
    return out;
}

}  // namespace brownfloc::sim
