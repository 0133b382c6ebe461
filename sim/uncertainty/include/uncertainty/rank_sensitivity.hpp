#pragma once
// Which uncertain input dominates the spread of the estimated time? Standardised rank
// regression coefficients (SRRC): regress the ranks of y = log10(time) on the ranks of the
// sampled inputs by least squares (Iman & Conover (1979), Technometrics 21, 499, "The use of
// the rank transform in regression"; Saltelli, Tarantola, Campolongo & Ratto (2004),
// "Sensitivity Analysis in Practice", section 1.2.5; Saltelli et al. (2008), "Global
// Sensitivity Analysis. The Primer", section 1.2.5). Ranks are invariant under any increasing
// map, so the ranks of log10(time) are the ranks of time: pass the times themselves; +inf
// (never aggregating) ranks above every finite time, ties share the average rank.
//
// Method: ranks (average ranks for ties) standardised to mean 0, sd 1; least squares without
// intercept (the centring removes it) by Householder QR (least_squares.hpp); the coefficients
// are then the SRRC directly, and R^2 = 1 - RSS / (n - 1). Spearman's rho of each input with
// y is reported beside it (for independent inputs, SRRC ~ rho).
// An input whose samples are all equal (a point value) has no rank variance: it is left out
// of the regression and reported with srrc and spearman_rho empty.
// The SRRC explain the ranks only as far as R^2 does: below R^2 = 0.7 (Saltelli et al.
// 2004, section 1.2.5, suggest the linear rank model is adequate from about 0.7 [memory]) the
// ranking of inputs is shaky (non-monotone or interacting effects); `reliable` says which.
//
//   const RankSensitivity s = rank_sensitivity({{"radius_nm", r}, {"zeta_mV", z}}, times_s);
//   if (s.reliable && !s.by_influence.empty()) dominant = s.inputs[s.by_influence[0]].name;
//
// Pure, deterministic and thread-safe (sequential; no parallel sums).
#include <cstddef>
#include <optional>
#include <string>
#include <vector>

namespace brownfloc::uncertainty {

// R^2 of the rank regression from which the SRRC ranking is called reliable.
inline constexpr double reliable_rank_r_squared = 0.7;

struct SampledInput {
    std::string name;            // e.g. "radius_nm": used in messages and the report
    std::vector<double> values;  // one per sample, same order as the outputs
};

struct InputSensitivity {
    std::string name;
    bool varied;                          // false: all samples equal, excluded from the regression
    std::optional<double> srrc;           // standardised rank regression coefficient; empty if not varied
    std::optional<double> spearman_rho;   // with the output; empty if not varied
};

struct RankSensitivity {
    std::vector<InputSensitivity> inputs;   // in the order given
    std::vector<std::size_t> by_influence;  // indices into inputs of the varied ones, largest |srrc| first
    double r_squared;                       // of the rank regression; 0 if the output does not vary
    bool output_varied;                     // false: every time equal (e.g. all +inf); no sensitivity
    bool reliable;                          // output_varied && r_squared >= reliable_rank_r_squared
};

// outputs: one time per sample (any increasing transform of it gives the same result), NaN not
// allowed. Throws UncertaintyError for NaN, lengths that differ from outputs.size(), fewer than
// (varied inputs + 2) samples, or two varied inputs whose ranks are (nearly) collinear (named).
[[nodiscard]] RankSensitivity rank_sensitivity(const std::vector<SampledInput>& inputs,
                                               const std::vector<double>& outputs);

}  // namespace brownfloc::uncertainty
