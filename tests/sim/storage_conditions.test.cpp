#include <catch2/catch.hpp>
#include <cmath>

#include "potentials/electrolyte.hpp"
#include "potentials/grahame.hpp"
#include "potentials/input_error.hpp"
#include "potentials/water.hpp"
#include "sim/dlvo_report.hpp"
#include "sim/scenario.hpp"
#include "sim/scenario_physics.hpp"
#include "sim/storage_conditions.hpp"
#include "latex_paint.hpp"

using namespace brownfloc::sim;
using Catch::Matchers::Contains;
using Catch::Matchers::WithinAbs;
using Catch::Matchers::WithinRel;

namespace {

// With hard-water calcium.
const std::string paint = brownfloc::test::latex_paint_toml(
    "-45", "ions = [ { valence = 2, concentration_mM = 2 }, { valence = 1, concentration_mM = 5 },\n"
           "         { valence = -1, concentration_mM = 9 } ]\n");

constexpr double celsius = 273.15;

}  // namespace

TEST_CASE("at the scenario temperature the storage W is the one dlvo reports", "[sim][shelf]") {
    const Scenario s = parse_scenario(paint, "paint.toml");
    const DlvoReport dlvo = compute_dlvo_report(s);
    const auto plain = storage_conditions(s, {s.temperature_K}, SurfaceHold::potential, false);
    const auto hydro = storage_conditions(s, {s.temperature_K}, SurfaceHold::potential, true);
    // Same code path for one species: equal to rounding.
    CHECK_THAT(plain[0].log10_stability_ratio, WithinRel(dlvo.pairs[0].log10_stability_ratio, 1e-12));
    CHECK_THAT(hydro[0].log10_stability_ratio, WithinRel(dlvo.pairs[0].log10_stability_ratio_hydrodynamic, 1e-12));
    REQUIRE(dlvo.pairs[0].half_life_fast_s);
    CHECK_THAT(plain[0].half_life_fast_s, WithinRel(*dlvo.pairs[0].half_life_fast_s, 1e-12));
    // tau = W t1/2 (Smoluchowski 1917 with Fuchs 1934).
    CHECK_THAT(hydro[0].log10_tau_s,
               WithinRel(std::log10(*dlvo.pairs[0].half_life_fast_s) + dlvo.pairs[0].log10_stability_ratio_hydrodynamic,
                         1e-12));
}

TEST_CASE("the fast half-life scales as eta over T between storage temperatures", "[sim][shelf]") {
    // t1/2 = 3 eta / (4 kT n0) (Smoluchowski 1917); n0 is fixed by the volume fraction and radius.
    const Scenario s = parse_scenario(paint, "paint.toml");
    const std::vector<double> temperatures{25 + celsius, 40 + celsius, 5 + celsius};
    const auto c = storage_conditions(s, temperatures, SurfaceHold::potential, true);
    for (std::size_t k = 0; k < c.size(); ++k) {
        const double expected = (brownfloc::potentials::water_viscosity_Pa_s(temperatures[k]) / temperatures[k]) /
                                (brownfloc::potentials::water_viscosity_Pa_s(temperatures[0]) / temperatures[0]);
        CHECK_THAT(c[k].half_life_fast_s / c[0].half_life_fast_s, WithinRel(expected, 1e-12));
        CHECK_THAT(c[k].acceleration_from_medium, WithinRel(1.0 / expected, 1e-12));
        // The total splits exactly into the medium part and the stability part.
        CHECK_THAT(c[k].acceleration_vs_reference,
                   WithinRel(c[k].acceleration_from_medium * c[k].acceleration_from_stability, 1e-9));
        CHECK_THAT(c[k].rule_of_thumb_factor, WithinRel(std::pow(2.0, (temperatures[k] - temperatures[0]) / 10.0), 1e-15));
    }
    CHECK(c[1].acceleration_from_medium > 1.0);  // warmer water is thinner and kT larger
    CHECK(c[2].acceleration_from_medium < 1.0);
    CHECK(c[0].acceleration_vs_reference == 1.0);
}

TEST_CASE("holding the surface charge keeps sigma fixed and moves the potential with temperature", "[sim][shelf]") {
    const Scenario s = parse_scenario(paint, "paint.toml");
    const auto held_charge = storage_conditions(s, {s.temperature_K, 40 + celsius}, SurfaceHold::charge, true);
    const auto held_potential = storage_conditions(s, {s.temperature_K, 40 + celsius}, SurfaceHold::potential, true);
    // At the scenario's own temperature nothing changes (Grahame 1947 round trip).
    CHECK_THAT(held_charge[0].surface_potential_mV[0], WithinRel(-45.0, 1e-10));
    CHECK_THAT(held_charge[0].log10_stability_ratio, WithinRel(held_potential[0].log10_stability_ratio, 1e-9));
    // At 40 degC the charge density is the same as at 25 degC, the potential is not.
    const auto electrolyte = electrolyte_of(s);
    const double sigma25 = brownfloc::potentials::grahame_surface_charge_C_per_m2(-45e-3, electrolyte,
                                                                                medium_of(s));
    const double sigma40 = brownfloc::potentials::grahame_surface_charge_C_per_m2(
        held_charge[1].surface_potential_mV[0] * 1e-3, electrolyte, held_charge[1].medium);
    CHECK_THAT(sigma40, WithinRel(sigma25, 1e-10));
    CHECK(std::abs(held_charge[1].surface_potential_mV[0] + 45.0) > 0.1);
    CHECK(held_potential[1].surface_potential_mV[0] == -45.0);
}

TEST_CASE("fixed medium overrides with several temperatures and a missing suspension are refused", "[sim][shelf]") {
    Scenario s = parse_scenario(paint, "paint.toml", {"medium.viscosity_mPa_s=1.2"});
    CHECK_THROWS_WITH(storage_conditions(s, {298.15, 313.15}, SurfaceHold::potential, true),
                      Contains("paint.toml: [medium] viscosity_mPa_s: a fixed viscosity holds at one temperature only"));
    CHECK_NOTHROW(storage_conditions(s, {298.15}, SurfaceHold::potential, true));
    s = parse_scenario(paint, "paint.toml", {"medium.relative_permittivity=70"});
    CHECK_THROWS_WITH(storage_conditions(s, {298.15, 313.15}, SurfaceHold::potential, true),
                      Contains("relative_permittivity"));
    const std::string no_suspension = std::string(paint).replace(paint.find("[suspension]"), 36, "");
    s = parse_scenario(no_suspension, "paint.toml");
    CHECK_THROWS_WITH(storage_conditions(s, {298.15}, SurfaceHold::potential, true), Contains("[suspension]"));
}

TEST_CASE("a medium given per storage temperature is used at each temperature", "[sim][shelf]") {
    // t1/2 = 3 eta / (4 kT n0) (Smoluchowski 1917) with the eta given for each temperature.
    const Scenario s = parse_scenario(paint + "[storage]\ntemperatures_C = [25, 40]\nviscosities_mPa_s = [2.0, 1.5]\n"
                                              "relative_permittivities = [70, 66]\n",
                                      "paint.toml", {"medium.viscosity_mPa_s=2.0", "medium.relative_permittivity=70"});
    const auto c = storage_conditions(s, {25 + celsius, 40 + celsius}, SurfaceHold::potential, true);
    CHECK_THAT(c[0].medium.viscosity_Pa_s, WithinRel(2.0e-3, 1e-15));
    CHECK_THAT(c[1].medium.viscosity_Pa_s, WithinRel(1.5e-3, 1e-15));
    CHECK_THAT(c[1].medium.relative_permittivity, WithinRel(66.0, 1e-15));
    CHECK_THAT(c[1].half_life_fast_s / c[0].half_life_fast_s,
               WithinRel((1.5 / (40 + celsius)) / (2.0 / (25 + celsius)), 1e-12));
    // A list of the wrong length is refused where it is written.
    try {
        (void)parse_scenario(paint + "[storage]\ntemperatures_C = [25, 40]\nviscosities_mPa_s = [2.0]\n", "paint.toml");
        FAIL("accepted");
    } catch (const brownfloc::InputError& e) {
        CHECK_THAT(std::string(e.what()),
                   Contains("[storage] viscosities_mPa_s = [2.0]: gives 1 values for 2 temperatures_C"));
    }
}
