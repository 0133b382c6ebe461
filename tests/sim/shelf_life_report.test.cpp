#include <catch2/catch.hpp>
#include <cmath>
#include <cstdio>

#include "potentials/electrolyte.hpp"
#include "potentials/input_error.hpp"
#include "sim/scenario.hpp"
#include "sim/shelf_life_report.hpp"
#include "sim/storage_conditions.hpp"
#include "latex_paint.hpp"

using namespace brownfloc::sim;
using Catch::Matchers::Contains;
using Catch::Matchers::WithinRel;

namespace {

// In a little salt.
const std::string paint = brownfloc::test::latex_paint_toml("-25", "salt = \"NaCl\"\nconcentration_mM = 5\n");

Scenario paint_with(double target_days) {
    Scenario s = parse_scenario(paint, "paint.toml");
    s.storage.target_days = target_days;
    s.storage.temperatures_C = {25.0, 40.0};
    return s;
}

}  // namespace

TEST_CASE("the time to a count drop is tau g over 1 - g at each storage temperature", "[sim][shelf]") {
    // Smoluchowski 1917 constant kernel: N/N0 = 1/(1 + t/tau), tau = W t1/2.
    const Scenario s = paint_with(730);
    const ShelfLifeReport r = compute_shelf_life(s);
    const auto conditions = storage_conditions(s, {298.15, 313.15}, SurfaceHold::potential, true);
    REQUIRE(r.conditions.size() == 2);
    for (std::size_t k = 0; k < 2; ++k) {
        const double tau = std::pow(10.0, conditions[k].log10_tau_s);
        const double t = r.conditions[k].time_s.p50.value;
        REQUIRE(t < shelf_life_time_limit_s);
        CHECK_THAT(t, WithinRel(tau * 0.1 / 0.9, 1e-12));
        CHECK_THAT(r.conditions[k].p5_time_over_target, WithinRel(t / (730 * 86400.0), 1e-15));
    }
    CHECK(r.conditions[1].time_s.p50.value < r.conditions[0].time_s.p50.value);  // warmer: faster here
}

TEST_CASE("with every input exact the percentiles of the time are the point estimate", "[sim][shelf]") {
    const Scenario s = paint_with(730);
    const ShelfLifeReport r = compute_shelf_life(s);
    const std::string json = shelf_life_json(r, s).dump();
    const double t = r.conditions[0].time_s.p50.value;
    CHECK(r.conditions[0].time_s.p5.value == t);
    CHECK(r.conditions[0].time_s.p95.value == t);
    CHECK_FALSE(r.inputs_vary);
    CHECK(r.samples == 1);
    CHECK_THAT(json, Contains("\"p5\": " + format_number(t)));
    CHECK_THAT(json, Contains("\"p95\": " + format_number(t)));
    CHECK_THAT(json, Contains("a model estimate") || Contains("Model estimate"));
    CHECK_THAT(json, Contains("do not use it to turn accelerated-test results into a shelf life"));
}

TEST_CASE("at the added salt the margin returns the time to the criterion equals the target", "[sim][shelf]") {
    // The margin root (issue 6): the time at the returned salt equals the target to 0.1 %.
    const Scenario s = paint_with(1);  // one day: 95 days at 25 degC and 2 days at 40 degC without added salt
    const ShelfLifeReport r = compute_shelf_life(s);
    for (const ConditionEstimate& e : r.conditions) {
        for (const auto& [formula, margin] : {std::pair<std::string, SaltMargin>{"NaCl", e.added_salt_p50},
                                              {"CaCl2", e.added_second_salt_p50}}) {
            INFO(formula << " at " << e.condition.temperature_K << " K: " << margin.reason);
            REQUIRE(margin.added_mM);
            // The time with that much salt added, through the report itself at one temperature.
            Scenario added = s;
            added.storage.temperatures_C = {e.condition.temperature_K - 273.15};
            const auto base = brownfloc::potentials::Electrolyte::from_salt("NaCl", 5.0).plus(
                brownfloc::potentials::Electrolyte::from_salt(formula, *margin.added_mM));
            added.salt.reset();
            added.salt_concentration_mM = 0;
            for (const auto& ion : base.ions())
                added.ions.push_back(IonSpec{ion.valence, ion.concentration_mol_per_m3});
            const ShelfLifeReport at_margin = compute_shelf_life(added);
            CHECK_THAT(at_margin.conditions[0].time_s.p50.value, WithinRel(1 * 86400.0, 1e-3));
        }
        // A 2:1 salt screens more per mole than a 1:1 salt (Schulze-Hardy).
        CHECK(*e.added_second_salt_p50.added_mM < *e.added_salt_p50.added_mM);
        CHECK(e.added_salt_p5.added_mM == e.added_salt_p50.added_mM);  // no input varies
    }
}

TEST_CASE("a margin already missed or never reached is null with its reason", "[sim][shelf]") {
    Scenario s = paint_with(1e12);  // far beyond any time here: already missed
    ShelfLifeReport r = compute_shelf_life(s);
    CHECK_FALSE(r.conditions[0].added_salt_p50.added_mM);
    CHECK_THAT(r.conditions[0].added_salt_p50.reason, Contains("already missed"));
    s = parse_scenario(std::string(paint) + "\n", "paint.toml", {"particle.surface_potential_mV=-95",
                                                              "particle.hamaker_J=1e-21"});
    s.storage.target_days = 1e-9;  // reached only in an instant: never, even with 5 M added
    s.storage.temperatures_C = {25.0};
    r = compute_shelf_life(s);
    if (!r.conditions[0].added_salt_p50.added_mM)
        CHECK_THAT(r.conditions[0].added_salt_p50.reason, Contains("never reached"));
}

TEST_CASE("a criterion value out of range is an error naming the storage section", "[sim][shelf]") {
    Scenario s = paint_with(730);
    s.storage.criterion_value = 1.5;  // count-drop needs (0, 1)
    CHECK_THROWS_WITH(compute_shelf_life(s), Contains("paint.toml: [storage]") && Contains("1.5"));
    s.storage.criterion_value.reset();
    s.storage.temperatures_C = {25.0, 120.0};
    CHECK_THROWS_WITH(compute_shelf_life(s), Contains("[storage] temperatures_C = 120"));
}
