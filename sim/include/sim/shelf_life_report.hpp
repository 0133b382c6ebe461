#pragma once
// `brownfloc shelf-life`: how long the dispersion takes to reach an aggregation criterion at
// each storage temperature, with the spread that the uncertainty of its inputs gives (a Monte
// Carlo over the values written as distributions, and over the fitted parameters after a
// [calibration]), which input dominates that spread, how much salt it tolerates before the
// time falls to the target, how the answer moves with the model choices, and, on request, a
// plot of the time against salt. See DEVELOPERS.md "Shelf-life estimates".
#include <cstdint>
#include <optional>
#include <ostream>
#include <string>
#include <vector>

#include "shelf_criteria/criterion.hpp"
#include "sim/calibration.hpp"
#include "sim/json_writer.hpp"
#include "sim/scenario.hpp"
#include "sim/shelf_life_plot.hpp"
#include "sim/storage_conditions.hpp"
#include "uncertainty/percentile.hpp"
#include "uncertainty/rank_sensitivity.hpp"

namespace brownfloc::sim {

// Times beyond this are written as this with beyond_range: true.
inline constexpr double shelf_life_time_limit_s = 1e12;

struct SaltMargin {
    std::optional<double> added_mM;  // salt added on top at which the time falls to the target
    std::string reason;              // when added_mM is empty: never reached, or already missed
};

// The 5th, 50th and 95th percentiles over the samples, each with its 95 % order-statistic
// interval (uncertainty/percentile.hpp). Values may be +inf (never reaches the criterion).
struct Percentiles {
    uncertainty::PercentileEstimate p5, p50, p95;
};

struct ConditionEstimate {
    StorageCondition condition;       // every input at its median (careful quadrature)
    Percentiles time_s;               // time to the criterion over the samples
    Percentiles log10_w;              // log10 of the stability ratio
    Percentiles log10_half_life_s;    // log10 of W t1/2 = tau
    double p5_time_over_target = 0;   // p5 time / target (capped time; no pass/fail wording)
    SaltMargin added_salt_p5, added_salt_p50;                // at which the p5 (p50) time falls to the target
    SaltMargin added_second_salt_p5, added_second_salt_p50;
    std::optional<double> ccc_p5_mM, ccc_p50_mM;             // barrier CCC of the varied salt over the band samples
    std::optional<uncertainty::RankSensitivity> sensitivity; // of the time to the inputs
    std::string sensitivity_note;                            // why there is none, or why it is shaky
};

// The time at the first temperature, every input at its median, under one model choice.
struct ModelChoice {
    std::string double_layer;
    bool retarded_vdw = false;
    bool hydrodynamic_correction = false;
    double log10_w = 0;
    double time_s = 0;  // capped at shelf_life_time_limit_s
    bool beyond_range = false;
    bool is_scenario_choice = false;
};

struct ShelfLifeOptions {
    bool plot = false;  // compute ShelfLifeReport::plot
};

struct ShelfLifeReport {
    shelf::CriterionSpec criterion;
    double primary_radius_m = 0;
    double number_density_per_m3 = 0;  // n0 at the medians
    double target_s = 0;
    SurfaceHold hold = SurfaceHold::potential;
    std::vector<ConditionEstimate> conditions;
    std::uint64_t samples = 1;        // Monte Carlo samples used (1 when no input varies)
    std::uint64_t band_samples = 1;   // samples behind the margins, the CCC percentiles and the plot band
    bool inputs_vary = false;
    std::vector<std::string> input_names;  // the drawn inputs, in input-index order
    std::string concentration_note;        // which concentration is held fixed while the radius varies
    std::string varied_salt;               // the salt the first margin adds (titrant or salt)
    std::optional<double> present_salt_mM; // of the varied salt, when it is the [electrolyte] salt
    std::optional<double> ccc_mM;          // barrier CCC of the varied salt at the medians
    std::string ccc_note;
    std::optional<double> settling_distance_m;  // Stokes, over the target time, at the first temperature
    std::string settling_note;
    std::optional<double> gravitational_length_m;  // kT / (|drho| V g) of single particles
    std::optional<CalibrationResult> calibration;
    std::vector<ModelChoice> model_choices;
    std::optional<ShelfLifePlotData> plot;
    std::vector<std::string> warnings;
};

// Throws InputError for a scenario that cannot be estimated (no [suspension], a criterion
// value out of its range, a fixed medium override with several temperatures, a calibration
// that cannot be fitted, --plot without a salt to vary).
[[nodiscard]] ShelfLifeReport compute_shelf_life(const Scenario& scenario, const ShelfLifeOptions& options = {});

[[nodiscard]] Json shelf_life_json(const ShelfLifeReport& report, const Scenario& scenario);
void write_shelf_life_text(std::ostream& out, const ShelfLifeReport& report, const Scenario& scenario);

// What the estimate leaves out, and the honesty statements that go with every output.
[[nodiscard]] std::vector<std::string> shelf_life_cautions();
[[nodiscard]] std::vector<std::string> shelf_life_not_modelled();

}  // namespace brownfloc::sim
