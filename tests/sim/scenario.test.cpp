// Scenario files: parsing, defaults, --set overrides, alternatives, the resolved scenario and
// the wording of every kind of input error (shared/INTERFACES.md, "Scenario file").
#include <catch2/catch.hpp>

#include <algorithm>
#include <filesystem>
#include <fstream>
#include <string>
#include <vector>

#include "potentials/input_error.hpp"
#include "sim/scenario.hpp"

using brownfloc::InputError;
using brownfloc::sim::parse_scenario;
using brownfloc::sim::Scenario;
using Catch::Matchers::Contains;
using Catch::Matchers::StartsWith;

namespace {

// Lines 1-7; tests append sections below, starting at line 8.
const std::string minimal = R"([particle]
radius_nm = 100
hamaker_J = 1e-20
surface_potential_mV = -30
[electrolyte]
salt = "NaCl"
concentration_mM = 10
)";

const std::string species_pair = R"([[species]]
name = "silica"
radius_nm = 50
hamaker_J = 8e-21
surface_potential_mV = -40
number_fraction = 0.25
[[species]]
radius_nm = 200.5
hamaker_J = 1.5e-20
surface_potential_mV = 20
number_fraction = 0.75
radius_spread = 0.1
[electrolyte]
salt = "CaCl2"
concentration_mM = 1
)";

Scenario parse(const std::string& text, const std::vector<std::string>& sets = {}) {
    return parse_scenario(text, "s.toml", sets);
}

// The message of the InputError that parsing throws ("" if it does not throw).
std::string error_of(const std::string& text, const std::vector<std::string>& sets = {}) {
    try {
        (void)parse_scenario(text, "s.toml", sets);
    } catch (const InputError& e) {
        return e.what();
    }
    return "";
}

bool has_default(const Scenario& s, const std::string& line) {
    return std::find(s.defaults_applied.begin(), s.defaults_applied.end(), line) != s.defaults_applied.end();
}

// A scenario parsed back from its resolved TOML, with the fields that legitimately differ
// (where it was read from, which defaults were filled in) taken from the original.
Scenario round_trip(const Scenario& s) {
    Scenario back = parse_scenario(brownfloc::sim::resolved_scenario_toml(s), "resolved.toml");
    back.source = s.source;
    back.defaults_applied = s.defaults_applied;
    return back;
}

}  // namespace

TEST_CASE("a [particle] scenario gives one species with the values written", "[sim][scenario]") {
    const Scenario s = parse(minimal);
    REQUIRE(s.species.size() == 1);
    CHECK(s.from_particle_table);
    CHECK(s.species[0].name == "particle");
    CHECK(s.species[0].radius_nm == 100.0);  // a TOML integer is accepted for a float
    CHECK(s.species[0].hamaker_J == 1e-20);
    CHECK(s.species[0].surface_potential_mV == -30.0);
    CHECK(s.species[0].number_fraction == 1.0);
    CHECK(s.salt == "NaCl");
    CHECK(s.salt_concentration_mM == 10.0);
    CHECK(s.ions.empty());
    CHECK(s.source == "s.toml");
}

TEST_CASE("defaults are applied and recorded, explicit values are not", "[sim][scenario]") {
    const Scenario s = parse(minimal);
    CHECK(s.temperature_K == 298.15);
    CHECK(s.min_gap_nm == 0.2);
    CHECK(s.double_layer == brownfloc::potentials::DoubleLayerModel::linear_superposition);
    CHECK_FALSE(s.retarded_vdw);
    CHECK(s.species[0].radius_spread == 0.0);
    CHECK(s.run.seed == 1);
    CHECK(s.run.aggregation == "irreversible");
    CHECK(s.run.cluster_mobility == "hydrodynamic-radius");
    CHECK_FALSE(s.viscosity_mPa_s);
    CHECK_FALSE(s.volume_fraction);
    CHECK(has_default(s, "[interaction] min_gap_nm = 0.2"));
    CHECK(has_default(s, "[interaction] double_layer = \"linear-superposition\""));
    CHECK(has_default(s, "[interaction] retarded_vdw = false"));
    CHECK(has_default(s, "[particle] radius_spread = 0.0"));
    CHECK(has_default(s, "[medium] temperature_C = 25.0"));
    CHECK(has_default(s, "[run] seed = 1"));

    const Scenario t = parse(minimal + "[interaction]\nmin_gap_nm = 0.5\n[run]\nseed = 7\n");
    CHECK(t.min_gap_nm == 0.5);
    CHECK(t.run.seed == 7);
    CHECK_FALSE(has_default(t, "[interaction] min_gap_nm = 0.2"));
    CHECK_FALSE(has_default(t, "[run] seed = 1"));
}

TEST_CASE("[[species]] tables are read in order with default names", "[sim][scenario]") {
    const Scenario s = parse(species_pair);
    REQUIRE(s.species.size() == 2);
    CHECK_FALSE(s.from_particle_table);
    CHECK(s.species[0].name == "silica");
    CHECK(s.species[1].name == "species 2");
    CHECK(s.species[0].number_fraction == 0.25);
    CHECK(s.species[1].radius_nm == 200.5);
    CHECK(s.species[1].radius_spread == 0.1);
    CHECK(has_default(s, "[species.1] radius_spread = 0.0"));
}

TEST_CASE("every section and key of the schema is read", "[sim][scenario]") {
    const Scenario s = parse(minimal + R"([suspension]
number_density_per_m3 = 1e18
[medium]
temperature_K = 310
[interaction]
double_layer = "constant-charge"
retarded_vdw = true
min_gap_nm = 0.3
[run]
particles = 1000
seed = 42
end_half_lives = 2.5
aggregation = "reversible"
cluster_mobility = "free-draining"
capture_gap_nm = 1
cluster_gap_nm = 0.5
time_step_s = 1e-9
max_time_step_s = 1e-6
max_steps = 100000
[output]
output_interval_s = 0.1
output_spacing = "log"
snapshots = 10
checkpoint_interval_wall_s = 600
)");
    CHECK(s.number_density_per_m3 == 1e18);
    CHECK(s.temperature_K == 310.0);
    CHECK(s.double_layer == brownfloc::potentials::DoubleLayerModel::constant_charge);
    CHECK(s.retarded_vdw);
    CHECK(s.run.particles == 1000);
    CHECK(s.run.seed == 42);
    CHECK(s.run.end_half_lives == 2.5);
    CHECK(s.run.aggregation == "reversible");
    CHECK(s.run.cluster_mobility == "free-draining");
    CHECK(s.run.max_steps == 100000);
    CHECK(s.output.output_spacing == "log");
    CHECK(s.output.snapshots == 10);
    CHECK(s.output.checkpoint_interval_wall_s == 600.0);
}

TEST_CASE("temperature_C is converted to kelvin", "[sim][scenario]") {
    // 273.15 K offset: exact by definition of the Celsius scale; the sum is one rounding.
    CHECK(parse(minimal + "[medium]\ntemperature_C = 20\n").temperature_K == 20.0 + 273.15);
    CHECK(parse(minimal + "[medium]\ntemperature_C = 0\n").temperature_K == 273.15);
}

TEST_CASE("outside liquid water the temperature needs both viscosity and permittivity", "[sim][scenario]") {
    CHECK_THAT(error_of(minimal + "[medium]\ntemperature_C = 101\n"),
               StartsWith("s.toml:9: [medium] temperature_C = 101: must be within 0-100 degC") &&
                   Contains("viscosity_mPa_s and relative_permittivity"));
    CHECK_THAT(error_of(minimal + "[medium]\ntemperature_K = 270\nviscosity_mPa_s = 2\n"),
               StartsWith("s.toml:9: [medium] temperature_K = 270: must be within"));
    CHECK(parse(minimal + "[medium]\ntemperature_K = 400\nviscosity_mPa_s = 0.2\nrelative_permittivity = 55\n")
              .temperature_K == 400.0);
    CHECK_THAT(error_of(minimal + "[medium]\ntemperature_K = 0\nviscosity_mPa_s = 0.2\nrelative_permittivity = 55\n"),
               StartsWith("s.toml:9: [medium] temperature_K = 0: must be > 0"));
}

TEST_CASE("an ion list is read and must be electroneutral with a non-zero ionic strength", "[sim][scenario]") {
    const std::string particle = minimal.substr(0, minimal.find("[electrolyte]"));
    const Scenario s = parse(particle + R"([electrolyte]
ions = [{ valence = 2, concentration_mM = 1 }, { valence = -1, concentration_mM = 2 }]
titrant = "LaCl3"
)");
    REQUIRE(s.ions.size() == 2);
    CHECK(s.ions[0].valence == 2);
    CHECK(s.ions[1].concentration_mM == 2.0);
    CHECK_FALSE(s.salt);
    CHECK(s.titrant == "LaCl3");

    CHECK_THAT(error_of(particle + "[electrolyte]\nions = [{ valence = 2, concentration_mM = 1 }, "
                                   "{ valence = -1, concentration_mM = 1 }]\n"),
               StartsWith("s.toml:6: [electrolyte] ions = [{ valence = 2, concentration_mM = 1 }") &&
                   Contains("not electroneutral") && Contains("net charge sum(z c) is 1 mM"));
    CHECK_THAT(error_of(particle + "[electrolyte]\nions = [{ valence = 1, concentration_mM = 0 }, "
                                   "{ valence = -1, concentration_mM = 0 }]\n"),
               Contains("zero ionic strength: the Debye length is infinite; give a salt concentration > 0"));
    CHECK_THAT(error_of(particle + "[electrolyte]\nions = [{ valence = 0, concentration_mM = 1 }]\n"),
               StartsWith("s.toml:6: [electrolyte] ions.1.valence = 0: must be a non-zero integer >= -4 and <= 4"));
    CHECK_THAT(error_of(particle + "[electrolyte]\nions = [{ valence = 1, concentration_mM = 1 }, { valence = -1 }]\n"),
               StartsWith("s.toml:6: [electrolyte] ions.2.concentration_mM: missing"));
    CHECK_THAT(error_of(particle + "[electrolyte]\nions = [{ valence = 1, concentration_mM = 1 }]\nconcentration_mM = 1\n"),
               StartsWith("s.toml:7: [electrolyte] concentration_mM = 1: goes only with salt"));
}

TEST_CASE("salt errors carry the file, line and formula before the formula parser's reason", "[sim][scenario]") {
    const std::string text = minimal.substr(0, minimal.find("salt =")) + "salt = \"XyZ\"\nconcentration_mM = 1\n";
    CHECK_THAT(error_of(text), StartsWith("s.toml:6: [electrolyte] salt = \"XyZ\": ") && Contains("XyZ"));
    CHECK_THAT(error_of(minimal + "titrant = 5\n"), StartsWith("s.toml:8: [electrolyte] titrant = 5: must be a salt formula"));
    CHECK_THAT(error_of(minimal, {"electrolyte.concentration_mM=0"}),
               Contains("concentration_mM = 0: zero ionic strength: the Debye length is infinite"));
    CHECK_THAT(error_of(minimal, {"electrolyte.concentration_mM=5001"}), Contains("must be >= 0 and <= 5000"));
}

TEST_CASE("values out of range name file, line, section, key and value", "[sim][scenario]") {
    const auto with = [](const std::string& line2) {
        return "[particle]\n" + line2 + "\nhamaker_J = 1e-20\nsurface_potential_mV = -30\n"
                                          "[electrolyte]\nsalt = \"NaCl\"\nconcentration_mM = 10\n";
    };
    CHECK(error_of(with("radius_nm = -5")) == "s.toml:2: [particle] radius_nm = -5: must be > 0 and < 100000");
    CHECK(error_of(with("radius_nm = nan")) == "s.toml:2: [particle] radius_nm = nan: must be a finite number");
    CHECK(error_of(with("radius_nm = -inf")) == "s.toml:2: [particle] radius_nm = -inf: must be a finite number");
    CHECK(error_of(with("radius_nm = \"5\"")) == "s.toml:2: [particle] radius_nm = \"5\": must be a number, not a string");
    CHECK(error_of(with("radius_nm = [5]")) == "s.toml:2: [particle] radius_nm = [5]: must be a number, not an array");
    CHECK_THAT(error_of(minimal + "[run]\nparticles = 10.0\n"),
               StartsWith("s.toml:9: [run] particles = 10.0: must be an integer, not a float"));
    CHECK_THAT(error_of(minimal + "[interaction]\nretarded_vdw = 1\n"),
               StartsWith("s.toml:9: [interaction] retarded_vdw = 1: must be true or false, not an integer"));
    CHECK_THAT(error_of(minimal + "[interaction]\ndouble_layer = \"constant potential\"\n"),
               StartsWith("s.toml:9: [interaction] double_layer = \"constant potential\": must be one of") &&
                   Contains("did you mean \"constant-potential\"?"));
    CHECK_THAT(error_of(minimal + "[suspension]\nvolume_fraction = 0.7\n"),
               StartsWith("s.toml:9: [suspension] volume_fraction = 0.7: must be > 0 and < 0.64"));
    CHECK_THAT(error_of(minimal + "[output]\nsnapshots = 1\n"), Contains("[output] snapshots = 1: must be an integer >= 2"));
}

TEST_CASE("unknown keys and sections are errors with a suggestion", "[sim][scenario]") {
    CHECK_THAT(error_of(minimal + "[run]\nsede = 3\n"),
               StartsWith("s.toml:9: [run] sede = 3: unknown key; did you mean 'seed'?"));
    CHECK_THAT(error_of(minimal + "[interaction]\nseed = 3\n"), Contains("seed belongs in [run]"));
    CHECK_THAT(error_of(minimal + "[shipping]\npath = \"x\"\n"),
               StartsWith("s.toml:8: [shipping]: unknown section") && Contains("known sections: particle, species"));
    CHECK_THAT(error_of(minimal + "[calibrate]\n"), Contains("did you mean [calibration]?"));
    CHECK_THAT(error_of(minimal + "[partcle]\n"), Contains("did you mean [particle]?"));
}

TEST_CASE("two alternatives in a file is an error naming both keys and lines", "[sim][scenario]") {
    CHECK(error_of(minimal + "[medium]\ntemperature_C = 20\ntemperature_K = 300\n") ==
          "s.toml:10: [medium] temperature_K = 300: conflicts with temperature_C = 20 at s.toml:9; "
          "give only one of temperature_C | temperature_K");
    CHECK_THAT(error_of(minimal + "[run]\nsteps = 10\nend_time_s = 1\n"),
               Contains("end_time_s = 1: conflicts with steps = 10 at s.toml:9"));
    CHECK_THAT(error_of(minimal + "ions = [{ valence = 1, concentration_mM = 1 }, { valence = -1, concentration_mM = 1 }]\n"),
               StartsWith("s.toml:8: [electrolyte] ions = ") && Contains("conflicts with salt = \"NaCl\" at s.toml:6"));
}

TEST_CASE("missing required keys and sections are named", "[sim][scenario]") {
    CHECK(error_of("[particle]\nradius_nm = 1\nsurface_potential_mV = 1\n") ==
          "s.toml:1: [particle] hamaker_J: missing (required)");
    CHECK_THAT(error_of("[electrolyte]\nsalt = \"NaCl\"\nconcentration_mM = 1\n"),
               Contains("a scenario needs [particle] or [[species]]"));
    CHECK_THAT(error_of(minimal.substr(0, minimal.find("[electrolyte]"))), Contains("[electrolyte]: missing"));
    CHECK_THAT(error_of(minimal.substr(0, minimal.find("concentration_mM"))),
               StartsWith("s.toml:5: [electrolyte] concentration_mM: missing (required with salt)"));
    CHECK_THAT(error_of(species_pair + "[[species]]\nradius_nm = 1\nhamaker_J = 0\nsurface_potential_mV = 0\n"),
               StartsWith("s.toml:16: [species.3] number_fraction: missing (required when there is more than one species)"));
}

TEST_CASE("[particle] and [[species]] together, too many species and bad fractions are errors", "[sim][scenario]") {
    CHECK_THAT(error_of(minimal + "[[species]]\nradius_nm = 1\nhamaker_J = 0\nsurface_potential_mV = 0\n"),
               Contains("[[species]] and [particle] (at s.toml:1)"));
    std::string many = "[electrolyte]\nsalt = \"KCl\"\nconcentration_mM = 1\n";
    for (int i = 0; i < 17; ++i)
        many += "[[species]]\nradius_nm = 1\nhamaker_J = 0\nsurface_potential_mV = 0\nnumber_fraction = 0.0625\n";
    CHECK_THAT(error_of(many), StartsWith("s.toml:84: [species.17]: at most 16 species"));
    std::string bad = species_pair;
    bad.replace(bad.find("0.75"), 4, "0.7");
    CHECK_THAT(error_of(bad), StartsWith("s.toml:1: [species] number_fraction: ") &&
                                  Contains("0.25 + 0.7 sum to 0.95") && Contains("must sum to 1"));
    CHECK_THAT(error_of(species_pair, {"species.2.radius_nm=0"}),
               StartsWith("--set species.2.radius_nm=0: [species.2] radius_nm = 0: must be > 0"));
}

TEST_CASE("text that toml++ must not see is refused with line and column", "[sim][scenario]") {
    CHECK_THAT(error_of(minimal + "# caf\xFF\n"),
               StartsWith("s.toml:8:6: byte 0xFF is not valid UTF-8"));
    CHECK_THAT(error_of(minimal + "[run]\nseed = 1 \xEF\xBB\x9F\n"),  // U+FEDF after a value
               StartsWith("s.toml:9:10: character U+FEDF is not allowed: toml++ 3.3.0"));
    CHECK_THAT(error_of(minimal + "# \xC0\x80 overlong NUL\n"), StartsWith("s.toml:8:3: byte 0xC0 is not valid UTF-8"));
    CHECK_THAT(error_of(minimal + "# \xED\xA0\x80 surrogate\n"), StartsWith("s.toml:8:3: byte 0xED"));
    // A leading byte-order mark is harmless and dropped; other UTF-8 is fine.
    CHECK(parse("\xEF\xBB\xBF" + minimal + "# caf\xC3\xA9\n").species.size() == 1);
}

TEST_CASE("TOML syntax errors name the file and line", "[sim][scenario]") {
    CHECK_THAT(error_of(minimal + "[run]\nseed = 1 x\n"), StartsWith("s.toml:9: "));
    CHECK_THAT(error_of(minimal + "[particle]\n"), StartsWith("s.toml:8: "));
}

TEST_CASE("strings quoted in messages are escaped and cut at 80 characters", "[sim][scenario]") {
    CHECK_THAT(error_of(minimal + "[interaction]\ndouble_layer = \"caf\xC3\xA9\\t\\\"\"\n"),
               Contains("double_layer = \"caf\\xC3\\xA9\\x09\\\"\": must be one of"));
    const std::string long_name(100, 'a');
    const std::string message = error_of(minimal + "[run]\naggregation = \"" + long_name + "\"\n");
    CHECK_THAT(message, Contains("aggregation = \"" + std::string(80, 'a') + "\"...: must be one of"));
}

TEST_CASE("a --set override changes a value before validation", "[sim][scenario]") {
    const Scenario s = parse(minimal, {"particle.radius_nm=250", "interaction.double_layer=constant-potential",
                                        "electrolyte.salt=MgSO4", "particle.name=latex A", "run.seed = 9"});
    CHECK(s.species[0].radius_nm == 250.0);
    CHECK(s.species[0].name == "latex A");  // not TOML: taken as a string
    CHECK(s.double_layer == brownfloc::potentials::DoubleLayerModel::constant_potential);
    CHECK(s.salt == "MgSO4");
    CHECK(s.run.seed == 9);
    CHECK(parse(minimal, {"particle.name=2"}).species[0].name == "2");  // string keys take the text
    CHECK(parse(minimal, {"suspension.volume_fraction=0.02"}).volume_fraction == 0.02);  // new section
    CHECK(parse(species_pair, {"species.2.number_fraction=0.5", "species.1.number_fraction=0.5"}).species[1].number_fraction ==
          0.5);
}

TEST_CASE("a --set of one alternative replaces the others", "[sim][scenario]") {
    const std::string text = minimal + "[medium]\ntemperature_C = 20\n[run]\nsteps = 5\n[output]\nsnapshots = 4\n";
    const Scenario s = parse(text, {"medium.temperature_K=300", "run.end_time_s=2", "output.snapshot_interval_s=0.5"});
    CHECK(s.temperature_K == 300.0);
    CHECK(s.run.end_time_s == 2.0);
    CHECK_FALSE(s.run.steps);
    CHECK_FALSE(s.output.snapshots);
    CHECK(s.output.snapshot_interval_s == 0.5);
    CHECK(parse(minimal + "[suspension]\nvolume_fraction = 0.1\n", {"suspension.number_density_per_m3=1e17"})
              .volume_fraction == std::nullopt);

    const Scenario ions = parse(minimal, {"electrolyte.ions=[{valence=1,concentration_mM=3},{valence=-1,concentration_mM=3}]"});
    CHECK_FALSE(ions.salt);  // salt and its concentration_mM both go
    CHECK(ions.ions.size() == 2);
    const Scenario salt = parse(minimal, {"electrolyte.ions=[{valence=1,concentration_mM=3},{valence=-1,concentration_mM=3}]",
                                 "electrolyte.salt=KCl", "electrolyte.concentration_mM=4"});
    CHECK(salt.salt == "KCl");
    CHECK(salt.ions.empty());
    CHECK(salt.salt_concentration_mM == 4.0);
}

TEST_CASE("errors from --set say which --set argument is wrong", "[sim][scenario]") {
    CHECK(error_of(minimal, {"particle.radius_nm=-5"}) ==
          "--set particle.radius_nm=-5: [particle] radius_nm = -5: must be > 0 and < 100000");
    CHECK_THAT(error_of(minimal, {"particle.radius=5"}),
               StartsWith("--set particle.radius=5: [particle] radius: unknown key; did you mean 'radius_nm'?"));
    CHECK_THAT(error_of(minimal, {"partcle.radius_nm=5"}),
               StartsWith("--set partcle.radius_nm=5: unknown section [partcle]; did you mean [particle]?"));
    CHECK_THAT(error_of(minimal, {"particle.radius_nm"}), StartsWith("--set particle.radius_nm: expected section.key=value"));
    CHECK_THAT(error_of(minimal, {"species.1.radius_nm=5"}), Contains("this scenario uses [particle]"));
    CHECK_THAT(error_of(species_pair, {"particle.radius_nm=5"}), Contains("this scenario uses [[species]]"));
    CHECK_THAT(error_of(species_pair, {"species.3.radius_nm=5"}), Contains("N from 1 to 2"));
    CHECK_THAT(error_of(species_pair, {"species.0.radius_nm=5"}), Contains("N from 1 to 2"));
    CHECK_THAT(error_of(minimal, {"particle.name=a\xEF\xBB\xBF"}), StartsWith("--set particle.name=a\\xEF\\xBB\\xBF: column 16: character U+FEFF"));
    CHECK_THAT(error_of(minimal, {"particle.radius_nm=5\n[run]"}), Contains("must be on one line"));
    CHECK_THAT(error_of(minimal, {"electrolyte.concentration_mM=\"10\""}),
               StartsWith("--set electrolyte.concentration_mM=\\\"10\\\": [electrolyte] concentration_mM = \"10\": "
                          "must be a number, not a string"));
}

TEST_CASE("the resolved scenario parses back to an equal scenario", "[sim][scenario]") {
    SECTION("minimal [particle] file with defaults") {
        const Scenario s = parse(minimal);
        CHECK(round_trip(s) == s);
        const std::string text = brownfloc::sim::resolved_scenario_toml(s);
        CHECK_THAT(text, Contains("[particle]") && Contains("min_gap_nm = 0.2") && Contains("seed = 1") &&
                             Contains("double_layer = \"linear-superposition\""));
    }
    SECTION("species, ions and every optional key, with numbers that need 17 digits") {
        const Scenario s = parse(species_pair.substr(0, species_pair.find("[electrolyte]")) + R"(
[suspension]
volume_fraction = 0.1234567890123456789
[medium]
temperature_C = 21.3
viscosity_mPa_s = 0.3333333333333333
relative_permittivity = 78.54
[electrolyte]
ions = [{ valence = 3, concentration_mM = 0.1 }, { valence = -1, concentration_mM = 0.30000000000000004 }]
titrant = "AlCl3"
[interaction]
double_layer = "constant-potential"
retarded_vdw = true
min_gap_nm = 1e-3
[run]
particles = 4096
seed = 9007199254740993
end_time_s = 1e-3
aggregation = "reversible"
capture_gap_nm = 0.7
cluster_gap_nm = 0.35
time_step_s = 2.5e-10
max_time_step_s = 1e-7
max_steps = 10000000
[output]
output_interval_s = 1e-4
output_spacing = "linear"
snapshot_interval_s = 0.01
checkpoint_interval_wall_s = 300
)",
                                 {"species.1.name=quote \" and back\\slash caf\xC3\xA9"});
        CHECK(round_trip(s) == s);
        CHECK(round_trip(s).species[0].name == "quote \" and back\\slash caf\xC3\xA9");
        CHECK(round_trip(s).run.seed == 9007199254740993u);  // integers stay exact beyond 2^53
    }
    SECTION("after --set replaced the salt by ions") {
        const Scenario s = parse(minimal, {"electrolyte.ions=[{valence=2,concentration_mM=1},{valence=-2,concentration_mM=1}]"});
        CHECK(round_trip(s) == s);
    }
}

TEST_CASE("double-layer models have the names used in scenario files", "[sim][scenario]") {
    using brownfloc::potentials::DoubleLayerModel;
    CHECK(std::string(brownfloc::sim::double_layer_name(DoubleLayerModel::linear_superposition)) == "linear-superposition");
    CHECK(std::string(brownfloc::sim::double_layer_name(DoubleLayerModel::constant_potential)) == "constant-potential");
    CHECK(std::string(brownfloc::sim::double_layer_name(DoubleLayerModel::constant_charge)) == "constant-charge");
}

TEST_CASE("load_scenario reads a file and names it when it cannot", "[sim][scenario]") {
    const auto dir = std::filesystem::temp_directory_path() / "brownfloc-scenario-test";
    std::filesystem::create_directories(dir);
    const std::string path = (dir / "ok.toml").string();
    std::ofstream(path) << minimal;
    const Scenario s = brownfloc::sim::load_scenario(path, {"particle.radius_nm=7"});
    CHECK(s.source == path);
    CHECK(s.species[0].radius_nm == 7.0);

    const std::string missing = (dir / "missing.toml").string();
    CHECK_THROWS_WITH(brownfloc::sim::load_scenario(missing), StartsWith(missing + ": cannot read the scenario file"));
    CHECK_THROWS_WITH(brownfloc::sim::load_scenario(dir.string()), Contains("it is a directory"));
    std::ofstream(path) << minimal << "[run]\nseed = -1\n";
    CHECK_THROWS_WITH(brownfloc::sim::load_scenario(path), StartsWith(path + ":9: [run] seed = -1"));
    std::filesystem::remove_all(dir);
}

// --- [storage]: the conditions of a shelf-life estimate (issue 6) ---

namespace {

bool has_storage_default(const Scenario& s) {
    return std::any_of(s.defaults_applied.begin(), s.defaults_applied.end(),
                       [](const std::string& line) { return line.rfind("[storage]", 0) == 0; });
}

// Every [storage] key, none at its default; starts at line 8 of minimal + this.
const std::string full_storage = R"([storage]
temperatures_C = [4, 25.5, -10, 60]
surface_hold = "charge"
criterion = "z-average-growth"
criterion_value = 0.2
target_days = 365
hydrodynamic_correction = false
optics = "rgd"
scattering_angle_deg = 173
wavelength_nm = 532
medium_refractive_index = 1.345
fractal_dimension = 1.8
second_salt = "MgSO4"
samples = 2000
band_samples = 50
)";

}  // namespace

TEST_CASE("without a [storage] section the storage defaults hold and nothing about storage is recorded",
          "[sim][scenario][storage]") {
    const Scenario s = parse(minimal);
    CHECK_FALSE(s.storage_given);
    CHECK(s.storage == brownfloc::sim::StorageSettings{});
    CHECK_FALSE(has_storage_default(s));
    const std::string text = brownfloc::sim::resolved_scenario_toml(s);
    CHECK_THAT(text, !Contains("[storage]") && !Contains("temperatures_C"));
}

TEST_CASE("an empty [storage] section notes every default it applies", "[sim][scenario][storage]") {
    const Scenario s = parse(minimal + "[storage]\n");
    CHECK(s.storage_given);
    CHECK(s.storage == brownfloc::sim::StorageSettings{});
    // The struct's initialisers: 25, 30, 40 and 5 degC are the long-term, intermediate,
    // accelerated and refrigerated conditions of ICH Q1A(R2) (2003), section 2.2.7.
    CHECK(has_default(s, "[storage] temperatures_C = [25.0, 30.0, 40.0, 5.0]"));
    CHECK(has_default(s, "[storage] surface_hold = \"potential\""));
    CHECK(has_default(s, "[storage] criterion = \"count-drop\""));
    CHECK(has_default(s, "[storage] target_days = 730.0"));
    CHECK(has_default(s, "[storage] hydrodynamic_correction = true"));
    CHECK(has_default(s, "[storage] optics = \"rayleigh\""));
    CHECK(has_default(s, "[storage] scattering_angle_deg = 90.0"));
    CHECK(has_default(s, "[storage] wavelength_nm = 633.0"));
    CHECK(has_default(s, "[storage] medium_refractive_index = 1.33"));
    CHECK(has_default(s, "[storage] fractal_dimension = 2.1"));
    CHECK(has_default(s, "[storage] second_salt = \"CaCl2\""));
    CHECK(has_default(s, "[storage] samples = 10000"));
    CHECK(has_default(s, "[storage] band_samples = 1000"));
    // Optional keys without a value of their own are not defaults.
    CHECK_FALSE(s.storage.criterion_value);
    CHECK(std::count_if(s.defaults_applied.begin(), s.defaults_applied.end(),
                        [](const std::string& line) { return line.rfind("[storage]", 0) == 0; }) == 13);
}

TEST_CASE("every [storage] key is read", "[sim][scenario][storage]") {
    const Scenario s = parse(minimal + full_storage);
    const brownfloc::sim::StorageSettings& st = s.storage;
    CHECK(s.storage_given);
    CHECK(st.temperatures_C == std::vector<double>{4.0, 25.5, -10.0, 60.0});  // integers read as numbers
    CHECK(st.surface_hold == "charge");
    CHECK(st.criterion == "z-average-growth");
    CHECK(st.criterion_value == 0.2);
    CHECK(st.target_days == 365.0);
    CHECK_FALSE(st.hydrodynamic_correction);
    CHECK(st.optics == "rgd");
    CHECK(st.scattering_angle_deg == 173.0);
    CHECK(st.wavelength_nm == 532.0);
    CHECK(st.medium_refractive_index == 1.345);
    CHECK(st.fractal_dimension == 1.8);
    CHECK(st.second_salt == "MgSO4");
    CHECK(st.samples == 2000);
    CHECK(st.band_samples == 50);
    CHECK_FALSE(has_storage_default(s));
    // The inclusive ends of the ranges are accepted.
    const Scenario ends = parse(minimal + "[storage]\ntemperatures_C = [-20, 100]\nscattering_angle_deg = 180\n"
                                          "medium_refractive_index = 1\nfractal_dimension = 3\nsamples = 10000000\n"
                                          "band_samples = 1000000\n");
    CHECK(ends.storage.temperatures_C == std::vector<double>{-20.0, 100.0});
    CHECK(ends.storage.samples == 10000000);
}

TEST_CASE("the resolved scenario writes the whole [storage] section and parses back equal",
          "[sim][scenario][storage]") {
    SECTION("every key given") {
        const Scenario s = parse(minimal + full_storage);
        CHECK(round_trip(s) == s);
        CHECK_THAT(brownfloc::sim::resolved_scenario_toml(s),
                   Contains("[storage]\ntemperatures_C = [4.0, 25.5, -10.0, 60.0]\n") &&
                       Contains("criterion_value = 0.2\n"));
    }
    SECTION("only defaults, with numbers that need 17 digits from --set") {
        const Scenario s = parse(minimal + "[storage]\n", {"storage.temperatures_C=[0.1, 0.30000000000000004, 37]"});
        CHECK(round_trip(s) == s);
        const std::string text = brownfloc::sim::resolved_scenario_toml(s);
        CHECK_THAT(text, Contains("samples = 10000\n") && Contains("second_salt = \"CaCl2\"\n") &&
                             Contains("hydrodynamic_correction = true\n") && !Contains("criterion_value") &&
                             !Contains("particle_density_kg_per_m3"));
    }
}

TEST_CASE("a --set changes [storage] keys and creates the section", "[sim][scenario][storage]") {
    const Scenario s = parse(minimal, {"storage.temperatures_C=[25,40]", "storage.criterion=mean-size"});
    CHECK(s.storage_given);
    CHECK(s.storage.temperatures_C == std::vector<double>{25.0, 40.0});
    CHECK(s.storage.criterion == "mean-size");
    CHECK(has_default(s, "[storage] samples = 10000"));
    const Scenario t = parse(minimal + full_storage, {"storage.surface_hold=potential", "storage.temperatures_C=[30]"});
    CHECK(t.storage.surface_hold == "potential");
    CHECK(t.storage.temperatures_C == std::vector<double>{30.0});
    CHECK(t.storage.samples == 2000);
    CHECK(error_of(minimal, {"storage.temperatures_C=[25,\"hot\"]"}) ==
          "--set storage.temperatures_C=[25,\\\"hot\\\"]: [storage] temperatures_C[2] = \"hot\": "
          "must be a number, not a string");
    CHECK(error_of(minimal, {"storage.criterion=count"}) ==
          "--set storage.criterion=count: [storage] criterion = \"count\": must be one of \"count-drop\", "
          "\"mean-size\", \"aggregated-fraction\", \"z-average-growth\"");
}

TEST_CASE("[storage] temperatures_C must be 1 to 16 finite numbers within -20 to 100 degC",
          "[sim][scenario][storage]") {
    const auto error_with = [](const std::string& line) { return error_of(minimal + "[storage]\n" + line + "\n"); };
    const std::string allowed = "must be an array of 1 to 16 numbers, each >= -20 and <= 100";
    CHECK(error_with("temperatures_C = 25") == "s.toml:9: [storage] temperatures_C = 25: " + allowed + ", not an integer");
    CHECK(error_with("temperatures_C = []") == "s.toml:9: [storage] temperatures_C = []: " + allowed + "; it holds 0");
    std::string seventeen = "temperatures_C = [";
    for (int i = 0; i < 17; ++i) {
        if (i > 0) seventeen += ", ";
        seventeen += std::to_string(i + 1);
    }
    CHECK_THAT(error_with(seventeen + "]"), StartsWith("s.toml:9: [storage] temperatures_C = [1, 2, 3") &&
                                                Contains(allowed + "; it holds 17"));
    // Elements are named by their place, counted from 1 as [[species]] and ions are.
    CHECK(error_with("temperatures_C = [25, \"hot\"]") ==
          "s.toml:9: [storage] temperatures_C[2] = \"hot\": must be a number, not a string");
    CHECK(error_with("temperatures_C = [25, 40, 101]") ==
          "s.toml:9: [storage] temperatures_C[3] = 101: must be >= -20 and <= 100");
    CHECK(error_with("temperatures_C = [-20.5]") ==
          "s.toml:9: [storage] temperatures_C[1] = -20.5: must be >= -20 and <= 100");
    CHECK(error_with("temperatures_C = [25, nan]") ==
          "s.toml:9: [storage] temperatures_C[2] = nan: must be a finite number");
    CHECK(error_with("temperatures_C = [inf]") == "s.toml:9: [storage] temperatures_C[1] = inf: must be a finite number");
    CHECK(error_with("temperatures_C = [[25]]") ==
          "s.toml:9: [storage] temperatures_C[1] = [25]: must be a number, not an array");
    // An element on a later line of a multi-line array is reported at its own line.
    CHECK(error_of(minimal + "[storage]\ntemperatures_C = [\n  25,\n  true,\n]\n") ==
          "s.toml:11: [storage] temperatures_C[2] = true: must be a number, not a boolean");
}

TEST_CASE("bad [storage] values name the file line key and value and what is allowed", "[sim][scenario][storage]") {
    const auto error_with = [](const std::string& line) { return error_of(minimal + "[storage]\n" + line + "\n"); };
    CHECK(error_with("surface_hold = \"voltage\"") ==
          "s.toml:9: [storage] surface_hold = \"voltage\": must be one of \"potential\", \"charge\"");
    CHECK_THAT(error_with("criterion = \"count drop\""),
               StartsWith("s.toml:9: [storage] criterion = \"count drop\": must be one of \"count-drop\", \"mean-size\", "
                          "\"aggregated-fraction\", \"z-average-growth\"") &&
                   Contains("did you mean \"count-drop\"?"));
    CHECK(error_with("criterion_value = 0") == "s.toml:9: [storage] criterion_value = 0: must be > 0");
    CHECK(error_with("criterion_value = nan") == "s.toml:9: [storage] criterion_value = nan: must be a finite number");
    CHECK(error_with("target_days = -1") == "s.toml:9: [storage] target_days = -1: must be > 0");
    CHECK(error_with("target_days = inf") == "s.toml:9: [storage] target_days = inf: must be a finite number");
    CHECK(error_with("hydrodynamic_correction = \"yes\"") ==
          "s.toml:9: [storage] hydrodynamic_correction = \"yes\": must be true or false, not a string");
    CHECK(error_with("optics = \"mie\"") == "s.toml:9: [storage] optics = \"mie\": must be one of \"rayleigh\", \"rgd\"");
    CHECK(error_with("scattering_angle_deg = 0") == "s.toml:9: [storage] scattering_angle_deg = 0: must be > 0 and <= 180");
    CHECK(error_with("scattering_angle_deg = 180.5") ==
          "s.toml:9: [storage] scattering_angle_deg = 180.5: must be > 0 and <= 180");
    CHECK(error_with("wavelength_nm = 100") == "s.toml:9: [storage] wavelength_nm = 100: must be > 100 and < 2000");
    CHECK(error_with("wavelength_nm = 2000") == "s.toml:9: [storage] wavelength_nm = 2000: must be > 100 and < 2000");
    CHECK(error_with("medium_refractive_index = 0.99") ==
          "s.toml:9: [storage] medium_refractive_index = 0.99: must be >= 1 and < 3");
    CHECK(error_with("medium_refractive_index = 3") ==
          "s.toml:9: [storage] medium_refractive_index = 3: must be >= 1 and < 3");
    CHECK(error_with("fractal_dimension = 1") == "s.toml:9: [storage] fractal_dimension = 1: must be > 1 and <= 3");
    CHECK(error_with("fractal_dimension = 3.5") == "s.toml:9: [storage] fractal_dimension = 3.5: must be > 1 and <= 3");
    CHECK_THAT(error_with("second_salt = \"NaX\""), StartsWith("s.toml:9: [storage] second_salt = \"NaX\": ") && Contains("NaX"));
    CHECK(error_with("second_salt = 2") ==
          "s.toml:9: [storage] second_salt = 2: must be a salt formula such as \"NaCl\", not an integer");
    CHECK(error_with("samples = 0") == "s.toml:9: [storage] samples = 0: must be an integer >= 1 and <= 10000000");
    CHECK(error_with("samples = 10000001") ==
          "s.toml:9: [storage] samples = 10000001: must be an integer >= 1 and <= 10000000");
    CHECK(error_with("samples = 1e4") == "s.toml:9: [storage] samples = 10000.0: must be an integer, not a float");
    CHECK(error_with("band_samples = 0") == "s.toml:9: [storage] band_samples = 0: must be an integer >= 1 and <= 1000000");
    CHECK(error_with("band_samples = 1000001") ==
          "s.toml:9: [storage] band_samples = 1000001: must be an integer >= 1 and <= 1000000");
    CHECK_THAT(error_with("particle_density_kg_per_m3 = 1050"), Contains("belongs in [suspension]"));
}

TEST_CASE("unknown keys in [storage] are errors with a suggestion", "[sim][scenario][storage]") {
    CHECK_THAT(error_of(minimal + "[storage]\ntemperature_C = [25]\n"),
               StartsWith("s.toml:9: [storage] temperature_C = [25]: unknown key") &&
                   Contains("did you mean 'temperatures_C'? (temperature_C belongs in [medium])") &&
                   Contains("known keys: temperatures_C, surface_hold"));
    CHECK_THAT(error_of(minimal + "[storage]\nsample = 10\n"), Contains("did you mean 'samples'?"));
    CHECK_THAT(error_of(minimal, {"storage.path=runs"}),
               StartsWith("--set storage.path=runs: [storage] path: unknown key"));
}
