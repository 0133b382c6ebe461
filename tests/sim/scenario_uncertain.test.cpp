// Distributions on scenario values, mass fractions and the [calibration] section (issue 6).
#include <catch2/catch.hpp>

#include <cmath>
#include <string>
#include <vector>

#include "potentials/input_error.hpp"
#include "potentials/water.hpp"
#include "sim/scenario.hpp"
#include "sim/scenario_physics.hpp"

using brownfloc::InputError;
using brownfloc::sim::InputSlot;
using brownfloc::sim::parse_scenario;
using brownfloc::sim::Scenario;
using brownfloc::uncertainty::Distribution;
using Catch::Matchers::Contains;
using Catch::Matchers::StartsWith;

namespace {

// Line 1 is [particle]; radius on line 2, hamaker 3, potential 4; [electrolyte] lines 5-7.
std::string scenario_with(const std::string& radius, const std::string& electrolyte_concentration = "10",
                          const std::string& more = "") {
    return "[particle]\nradius_nm = " + radius + "\nhamaker_J = 1e-20\nsurface_potential_mV = -30\n"
           "[electrolyte]\nsalt = \"NaCl\"\nconcentration_mM = " + electrolyte_concentration + "\n" + more;
}

std::string error_of(const std::string& text, const std::vector<std::string>& sets = {}) {
    try {
        (void)parse_scenario(text, "s.toml", sets);
    } catch (const InputError& e) {
        return e.what();
    }
    return "";
}

}  // namespace

TEST_CASE("each distribution form is read and the field holds its median", "[sim][scenario][uncertain]") {
    SECTION("normal") {
        const Scenario s = parse_scenario(scenario_with("{ mean = 50, sd = 2 }"), "s.toml");
        CHECK(s.species[0].radius_nm == 50.0);
        REQUIRE(s.uncertain_inputs.size() == 1);
        CHECK(s.uncertain_inputs[0].key == "[particle] radius_nm");
        CHECK(s.uncertain_inputs[0].distribution == Distribution::normal(50, 2));
        CHECK(s.uncertain_inputs[0].input_index == 0);
    }
    SECTION("uniform") {
        const Scenario s = parse_scenario(scenario_with("{ low = 40, high = 60 }"), "s.toml");
        CHECK(s.species[0].radius_nm == 50.0);
        CHECK(s.uncertain_inputs[0].distribution == Distribution::uniform(40, 60));
    }
    SECTION("log-normal: the median is the field value, not the mean") {
        const Scenario s = parse_scenario(scenario_with("{ median = 50, factor = 1.3 }"), "s.toml");
        CHECK(s.species[0].radius_nm == Approx(50.0).epsilon(1e-14));
        CHECK(s.uncertain_inputs[0].distribution == Distribution::log_normal(50, 1.3));
    }
}

TEST_CASE("input indices are fixed by the slot and not by which other values are uncertain",
          "[sim][scenario][uncertain]") {
    const std::string text = "[[species]]\nradius_nm = 50\nhamaker_J = { median = 1e-20, factor = 1.5 }\n"
                             "surface_potential_mV = -30\nnumber_fraction = 0.5\n"
                             "[[species]]\nradius_nm = 80\nhamaker_J = 1e-20\n"
                             "surface_potential_mV = { mean = -40, sd = 3 }\nnumber_fraction = 0.5\n"
                             "[suspension]\nvolume_fraction = { median = 0.01, factor = 1.1 }\n"
                             "[medium]\nviscosity_mPa_s = { mean = 0.89, sd = 0.01 }\n"
                             "[electrolyte]\nsalt = \"NaCl\"\nconcentration_mM = { median = 10, factor = 1.2 }\n";
    const Scenario s = parse_scenario(text, "s.toml");
    REQUIRE(s.uncertain_inputs.size() == 5);
    std::vector<std::uint32_t> indices;
    for (const auto& u : s.uncertain_inputs) indices.push_back(u.input_index);
    CHECK(indices == std::vector<std::uint32_t>{1, 5, 64, 80, 96});
    CHECK(s.uncertain_inputs[1].key == "[species.2] surface_potential_mV");
    CHECK(s.uncertain_inputs[1].species == 1);
    CHECK(s.uncertain_inputs[4].slot == InputSlot::salt_concentration_mM);
    // set_input puts a drawn value in its place.
    Scenario copy = s;
    brownfloc::sim::set_input(copy, InputSlot::surface_potential_mV, 1, -44.0);
    brownfloc::sim::set_input(copy, InputSlot::salt_concentration_mM, 0, 12.5);
    CHECK(copy.species[1].surface_potential_mV == -44.0);
    CHECK(copy.salt_concentration_mM == 12.5);
}

TEST_CASE("distributions survive the resolved scenario and --set", "[sim][scenario][uncertain]") {
    const Scenario s = parse_scenario(
        scenario_with("{ median = 50, factor = 1.1 }", "{ low = 5, high = 15 }",
                      "[suspension]\nmass_fraction = { mean = 0.3, sd = 0.01 }\nparticle_density_kg_per_m3 = 1050\n"),
        "s.toml");
    const std::string resolved = brownfloc::sim::resolved_scenario_toml(s);
    CHECK_THAT(resolved, Contains("radius_nm = { median = 50, factor = 1.1 }"));
    const Scenario again = parse_scenario(resolved, "s.toml");
    CHECK(again.uncertain_inputs == s.uncertain_inputs);
    CHECK(again.species == s.species);
    CHECK(again.mass_fraction == s.mass_fraction);
    const Scenario set = parse_scenario(scenario_with("50"), "s.toml", {"particle.hamaker_J={median=1e-20,factor=2}"});
    REQUIRE(set.uncertain_inputs.size() == 1);
    CHECK(set.uncertain_inputs[0].distribution == Distribution::log_normal(1e-20, 2));
}

TEST_CASE("bad distributions are clear errors naming file line key and value", "[sim][scenario][uncertain]") {
    CHECK_THAT(error_of(scenario_with("{ mean = 50, sd = -4 }")),
               StartsWith("s.toml:2: [particle] radius_nm = { mean = 50, sd = -4 }:") && Contains("sd = -4: must be >= 0"));
    CHECK_THAT(error_of(scenario_with("{ low = 60, high = 40 }")), StartsWith("s.toml:2: [particle] radius_nm = "));
    CHECK_THAT(error_of(scenario_with("{ median = 50, factor = 0.9 }")), Contains("factor"));
    CHECK_THAT(error_of(scenario_with("{ mean = 50 }")),
               Contains("a distribution must be one of { mean, sd }, { low, high } or { median, factor }"));
    CHECK_THAT(error_of(scenario_with("{ mean = 50, sd = 2, low = 1 }")), Contains("exactly those two keys"));
    CHECK_THAT(error_of(scenario_with("{ mean = 50, sd = \"2\" }")), Contains("must be finite numbers"));
    // More than 1e-6 of the probability below a radius of 0: suggest a log-normal.
    CHECK_THAT(error_of(scenario_with("{ mean = 10, sd = 4 }")),
               StartsWith("s.toml:2: [particle] radius_nm = { mean = 10, sd = 4 }:") &&
                   Contains("outside the physical range") && Contains("radius_nm = { median ="));
    // The median must lie in the key's own range.
    CHECK_THAT(error_of(scenario_with("{ median = 2e5, factor = 1.1 }")), Contains("its median 200000 is outside"));
    // A uniform that reaches past 0.64 for a volume fraction.
    CHECK_THAT(error_of(scenario_with("50", "10", "[suspension]\nvolume_fraction = { low = 0.5, high = 0.7 }\n")),
               StartsWith("s.toml:9: [suspension] volume_fraction = { low = 0.5, high = 0.7 }:"));
}

TEST_CASE("distributions are refused where they do not belong", "[sim][scenario][uncertain]") {
    // On one ion: it would break electroneutrality.
    CHECK_THAT(error_of("[particle]\nradius_nm = 50\nhamaker_J = 1e-20\nsurface_potential_mV = -30\n[electrolyte]\n"
                        "ions = [{ valence = 1, concentration_mM = { mean = 10, sd = 1 } }, "
                        "{ valence = -1, concentration_mM = 10 }]\n"),
               StartsWith("s.toml:6: [electrolyte] ions.1.concentration_mM = { mean = 10, sd = 1 }:") &&
                   Contains("electroneutrality"));
    // On a key that is a setting, not a property of the dispersion.
    CHECK_THAT(error_of(scenario_with("50", "10", "[interaction]\nmin_gap_nm = { mean = 0.2, sd = 0.01 }\n")),
               StartsWith("s.toml:9: [interaction] min_gap_nm = { mean = 0.2, sd = 0.01 }: must be a number, not a table"));
    CHECK_THAT(error_of(scenario_with("50", "10", "[medium]\ntemperature_C = { mean = 25, sd = 1 }\n")),
               Contains("must be a number, not a table"));
}

TEST_CASE("a mass fraction with the particle density gives the volume fraction", "[sim][scenario][uncertain]") {
    const Scenario s = parse_scenario(
        scenario_with("50", "10", "[suspension]\nmass_fraction = 0.4\nparticle_density_kg_per_m3 = 1050\n"), "s.toml");
    // phi = (w / rho_p) / (w / rho_p + (1 - w) / rho_water): the definition of the mass fraction
    // (common practice), water at 25 degC from Tanaka et al. (2001): 997.05 kg/m3.
    const double rho_w = brownfloc::potentials::water_density_kg_per_m3(298.15);
    CHECK(rho_w == Approx(997.05).margin(0.01));
    const double phi = (0.4 / 1050) / (0.4 / 1050 + 0.6 / rho_w);
    CHECK(*brownfloc::sim::volume_fraction_of(s) == Approx(phi).epsilon(1e-14));
    CHECK(phi == Approx(0.38767).epsilon(1e-4));
    CHECK_THAT(error_of(scenario_with("50", "10", "[suspension]\nmass_fraction = 0.4\n")),
               Contains("[suspension] particle_density_kg_per_m3: missing (required with mass_fraction)"));
    CHECK_THAT(error_of(scenario_with("50", "10", "[suspension]\nmass_fraction = 0.4\nvolume_fraction = 0.1\n"
                                                  "particle_density_kg_per_m3 = 1050\n")),
               Contains("give only one of volume_fraction | number_density_per_m3 | mass_fraction"));
}

TEST_CASE("the [calibration] section is read and written back", "[sim][scenario][calibration]") {
    const std::string calibration =
        "[calibration]\npoints = [{ concentration_mM = 50, stability_ratio = 300 },\n"
        "  { concentration_mM = 80, rate_constant_m3_per_s = 1e-18, relative_sd = 0.3, temperature_C = 20, "
        "salt = \"KCl\" }]\nccc_mM = 150\nrate_convention = \"half-k\"\nparameters = [\"surface_potential_mV\", "
        "\"hamaker_J\"]\n";
    const Scenario s = parse_scenario(scenario_with("50", "10", calibration), "s.toml");
    REQUIRE(s.calibration_given);
    REQUIRE(s.calibration.points.size() == 2);
    CHECK(s.calibration.points[0].stability_ratio == 300.0);
    CHECK(s.calibration.points[0].relative_sd == 0.2);
    CHECK(s.calibration.points[1].rate_constant_m3_per_s == 1e-18);
    CHECK(s.calibration.points[1].salt == "KCl");
    CHECK(s.calibration.ccc_mM == 150.0);
    CHECK(s.calibration.w_reference == "measured-fast");
    CHECK(s.calibration.parameters == std::vector<std::string>{"surface_potential_mV", "hamaker_J"});
    const Scenario again = parse_scenario(brownfloc::sim::resolved_scenario_toml(s), "s.toml");
    CHECK(again.calibration == s.calibration);
}

TEST_CASE("bad [calibration] input is a clear error", "[sim][scenario][calibration]") {
    const auto with = [](const std::string& lines) { return error_of(scenario_with("50", "10", "[calibration]\n" + lines)); };
    CHECK_THAT(with(""), Contains("[calibration]: give the measurements"));
    CHECK_THAT(with("points = [{ concentration_mM = 50 }]\n"),
               StartsWith("s.toml:9: [calibration] points.1: give the measurement: stability_ratio or rate_constant_m3_per_s"));
    CHECK_THAT(with("points = [{ concentration_mM = 50, stability_ratio = 3, rate_constant_m3_per_s = 1e-18 }]\n"),
               Contains("give only one of stability_ratio | rate_constant_m3_per_s"));
    CHECK_THAT(with("points = [{ concentration_mM = 50, rate_constant_m3_per_s = 1e-18 }]\n"),
               Contains("[calibration] rate_convention: missing (required with rate constants)"));
    CHECK_THAT(with("points = [{ concentration_mM = -5, stability_ratio = 3 }]\n"),
               Contains("[calibration] points.1.concentration_mM = -5: must be > 0"));
    CHECK_THAT(with("points = [{ concentration_mM = 5, stability_ratio = 3, relative_sd = 0 }]\n"),
               Contains("relative_sd = 0: must be > 0"));
    CHECK_THAT(with("ccc_mM = 100\nparameters = [\"zeta\"]\n"), Contains("\"zeta\" is not one of them"));
    CHECK_THAT(with("ccc_mM = 100\nparameters = []\n"), Contains("it is empty"));
    CHECK_THAT(with("ccc_mM = 100\nparameters = [\"hamaker_J\", \"hamaker_J\"]\n"), Contains("is given twice"));
    CHECK_THAT(with("points = [3]\n"), Contains("[calibration] points.1 = 3: must be a table"));
}
