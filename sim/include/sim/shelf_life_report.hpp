#pragma once
// `brownfloc shelf-life`: how long the dispersion takes to reach an aggregation criterion at
// each storage temperature, and how much salt it tolerates before that time falls to the
// target. This first version evaluates the scenario's values as given (every input a point):
// the percentiles p5, p50 and p95 of each time are then one number, and the Monte Carlo over
// input distributions, the calibration to measurements and the plot are still to come (see
// DEVELOPERS.md "Shelf-life estimates").
#include <optional>
#include <ostream>
#include <string>
#include <vector>

#include "shelf_criteria/criterion.hpp"
#include "sim/json_writer.hpp"
#include "sim/scenario.hpp"
#include "sim/storage_conditions.hpp"

namespace brownfloc::sim {

// Times beyond this are written as this with beyond_range: true.
inline constexpr double shelf_life_time_limit_s = 1e12;

struct SaltMargin {
    std::optional<double> added_mM;  // salt added on top at which the time falls to the target
    std::string reason;              // when added_mM is empty: never reached, or already missed
};

struct ConditionEstimate {
    StorageCondition condition;
    double time_to_criterion_s = 0;  // capped at shelf_life_time_limit_s
    bool beyond_range = false;
    double time_over_target = 0;     // p5 time / target (no pass/fail wording)
    SaltMargin added_salt, added_second_salt;
};

struct ShelfLifeReport {
    shelf::CriterionSpec criterion;
    double primary_radius_m = 0;
    double target_s = 0;
    SurfaceHold hold = SurfaceHold::potential;
    std::vector<ConditionEstimate> conditions;
    std::string varied_salt;                 // the salt the first margin adds (titrant or salt)
    std::optional<double> present_salt_mM;   // [electrolyte] concentration_mM when a salt formula is given
    std::optional<double> ccc_mM;            // barrier CCC of the varied salt (limiting pair)
    std::string ccc_note;
    std::optional<double> settling_distance_m;  // Stokes, over the target time, at the reference temperature
    std::string settling_note;
    std::vector<std::string> warnings;
};

// Throws InputError for a scenario that cannot be estimated (no [suspension], a criterion
// value out of its range, a fixed medium override with several temperatures).
[[nodiscard]] ShelfLifeReport compute_shelf_life(const Scenario& scenario);

[[nodiscard]] Json shelf_life_json(const ShelfLifeReport& report, const Scenario& scenario);
void write_shelf_life_text(std::ostream& out, const ShelfLifeReport& report, const Scenario& scenario);

// What the estimate leaves out, and the honesty statements that go with every output.
[[nodiscard]] std::vector<std::string> shelf_life_cautions();
[[nodiscard]] std::vector<std::string> shelf_life_not_modelled();

}  // namespace brownfloc::sim
