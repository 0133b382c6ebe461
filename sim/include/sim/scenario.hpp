#pragma once
// A validated scenario: what the user asked for, with defaults filled in and every value
// checked once, here, so that the physics never re-checks. Parsed from TOML text (toml++)
// plus `--set section.key=value` overrides; every problem throws brownfloc::InputError
// whose message has the form
//   FILE:LINE: [section] key = value: what is allowed
// (main() prefixes "error: "). Values quoted from the file are escaped (\xNN) and cut at 80
// characters.
#include <cstdint>
#include <optional>
#include <string>
#include <vector>

#include "potentials/double_layer.hpp"
#include "uncertainty/distribution.hpp"

namespace brownfloc::sim {

struct SpeciesSpec {
    std::string name;
    double radius_nm = 0.0;             // median radius
    double hamaker_J = 0.0;             // >= 0
    double surface_potential_mV = 0.0;  // any sign, |psi| <= 500 mV
    double number_fraction = 1.0;       // in (0, 1]; fractions sum to 1 within 1e-6
    double radius_spread = 0.0;         // sd of ln(radius), in [0, 1); truncated at +-3 sd

    friend bool operator==(const SpeciesSpec&, const SpeciesSpec&) = default;
};

struct IonSpec {
    int valence = 0;                 // non-zero integer, |z| <= 4
    double concentration_mM = 0.0;   // >= 0

    friend bool operator==(const IonSpec&, const IonSpec&) = default;
};

struct RunSettings {  // [run]: used by `brownfloc run` (later issues); validated here
    std::optional<std::int64_t> particles;
    std::uint64_t seed = 1;
    std::optional<double> end_time_s;
    std::optional<double> end_half_lives;
    std::optional<std::int64_t> steps;
    std::string aggregation = "irreversible";             // | "reversible"
    std::string cluster_mobility = "hydrodynamic-radius";  // | "free-draining"
    std::optional<double> capture_gap_nm;
    std::optional<double> cluster_gap_nm;
    std::optional<double> time_step_s;
    std::optional<double> max_time_step_s;
    std::optional<std::int64_t> max_steps;

    friend bool operator==(const RunSettings&, const RunSettings&) = default;
};

struct OutputSettings {  // [output]: used by `brownfloc run` (later issues)
    std::optional<double> output_interval_s;
    std::optional<std::string> output_spacing;  // "linear" | "log"
    std::optional<double> snapshot_interval_s;
    std::optional<std::int64_t> snapshots;
    std::optional<std::string> trajectory_precision;  // "float32" (default) | "float64"
    std::optional<double> checkpoint_interval_wall_s;

    friend bool operator==(const OutputSettings&, const OutputSettings&) = default;
};

struct StorageSettings {  // [storage]: used by `brownfloc shelf-life`; validated here
    std::vector<double> temperatures_C{25.0, 30.0, 40.0, 5.0};  // long-term, intermediate, accelerated, refrigerated
    std::string surface_hold = "potential";      // | "charge" (held fixed across temperatures, via Grahame)
    std::string criterion = "count-drop";        // | "mean-size" | "aggregated-fraction" | "z-average-growth"
    std::optional<double> criterion_value;       // default per criterion (count-drop 0.1, ...)
    double target_days = 730.0;                  // > 0: the shelf life asked about
    bool hydrodynamic_correction = true;         // W with the Honig drainage factor
    std::string optics = "rayleigh";             // | "rgd" (z-average-growth only)
    double scattering_angle_deg = 90.0;          // (0, 180]
    double wavelength_nm = 633.0;                // > 0 (in vacuum)
    double medium_refractive_index = 1.33;       // >= 1
    double fractal_dimension = 2.1;              // (1, 3]: clusters beyond triplets
    std::string second_salt = "CaCl2";           // salt formula added on top for the second margin
    std::int64_t samples = 10000;                // Monte Carlo samples (>= 1)
    std::int64_t band_samples = 1000;            // samples per point of the margins and the plot band
    // A non-aqueous or thickened medium at several temperatures: its viscosity and permittivity
    // at each of temperatures_C (same length); a single [medium] override holds at one only.
    std::optional<std::vector<double>> viscosities_mPa_s;
    std::optional<std::vector<double>> relative_permittivities;

    friend bool operator==(const StorageSettings&, const StorageSettings&) = default;
};

// [calibration] points = [...]: one measurement of the aggregation rate of the dispersion in
// a solution of one salt (that salt alone at concentration_mM is the electrolyte of the
// measurement; the scenario's own ions play no part in it).
struct CalibrationPoint {
    double concentration_mM = 0.0;                // > 0
    std::optional<double> stability_ratio;        // measured W (>= ... see w_reference); or
    std::optional<double> rate_constant_m3_per_s; // a measured rate constant (rate_convention says which k)
    double relative_sd = 0.2;                     // of the measured value (sd of ln W), > 0
    std::optional<double> temperature_C;          // default: the scenario's temperature
    std::optional<std::string> salt;              // default: the scenario's salt (titrant first)

    friend bool operator==(const CalibrationPoint&, const CalibrationPoint&) = default;
};

struct CalibrationSettings {  // [calibration]: used by `brownfloc shelf-life`
    std::vector<CalibrationPoint> points;
    std::optional<double> ccc_mM;                  // a measured CCC of the points' salt
    double ccc_relative_sd = 0.1;                  // of the measured CCC
    std::string w_reference = "measured-fast";     // | "smoluchowski"
    std::optional<std::string> rate_convention;    // "k" (dN/dt = -k N^2 / 2) | "half-k" (dN/dt = -k' N^2)
    std::optional<double> fast_rate_constant_m3_per_s;  // measured-fast with rate constants: the plateau rate
    std::vector<std::string> parameters{"surface_potential_mV"};  // and/or "hamaker_J"

    friend bool operator==(const CalibrationSettings&, const CalibrationSettings&) = default;
};

// A scenario value written as a distribution ({ mean, sd }, { low, high }, { median, factor }):
// uncertainty about that one value. The Scenario field itself holds the median, which is what
// every command but `shelf-life` uses (`run` refuses distributions).
enum class InputSlot {
    radius_nm, hamaker_J, surface_potential_mV,  // per species
    volume_fraction, number_density_per_m3, mass_fraction, particle_density_kg_per_m3,
    viscosity_mPa_s, relative_permittivity,
    salt_concentration_mM,
};

struct UncertainInput {
    InputSlot slot = InputSlot::radius_nm;
    int species = 0;                  // for the per-species slots (0-based)
    std::string key;                  // as written: "[particle] radius_nm", "[species.2] hamaker_J"
    uncertainty::Distribution distribution = uncertainty::Distribution::point(0.0);
    std::uint32_t input_index = 0;    // Monte Carlo input j: fixed by the slot, see input_index_of

    friend bool operator==(const UncertainInput&, const UncertainInput&) = default;
};

struct Scenario {
    std::string source;  // file path as given (or "<text>")

    // [particle] or [[species]]; always at least one entry.
    std::vector<SpeciesSpec> species;
    bool from_particle_table = false;

    // [suspension]: at most one of the two (neither: half-lives are not computed).
    std::optional<double> volume_fraction;        // (0, 0.64)
    std::optional<double> number_density_per_m3;  // > 0
    std::optional<double> mass_fraction;          // (0, 1): with particle_density_kg_per_m3
    std::optional<double> particle_density_kg_per_m3;  // for mass_fraction and the Stokes settling distance

    // [medium]: temperature from temperature_C or temperature_K (default 25 degC). Outside
    // liquid water (0-100 degC) both overrides must be given.
    double temperature_K = 298.15;
    std::optional<double> viscosity_mPa_s;        // > 0
    std::optional<double> relative_permittivity;  // >= 1

    // [electrolyte]: exactly one of salt (+ concentration_mM) or ions.
    std::optional<std::string> salt;  // a formula parse_salt_formula accepts
    double salt_concentration_mM = 0.0;
    std::vector<IonSpec> ions;        // electroneutral to 1e-9 relative
    std::optional<std::string> titrant;  // salt the CCC varies, added on top

    // [interaction]
    potentials::DoubleLayerModel double_layer = potentials::DoubleLayerModel::linear_superposition;
    bool retarded_vdw = false;
    double min_gap_nm = 0.2;  // > 0

    RunSettings run;
    OutputSettings output;
    StorageSettings storage;
    bool storage_given = false;  // the input has a [storage] section (else the defaults above hold)
    CalibrationSettings calibration;
    bool calibration_given = false;

    // Values given as distributions, in the order of their input indices.
    std::vector<UncertainInput> uncertain_inputs;

    // "key = value" for each default that was applied, e.g. "[interaction] min_gap_nm = 0.2".
    std::vector<std::string> defaults_applied;

    // Field by field, source and defaults_applied included (tests compare resolved round trips).
    friend bool operator==(const Scenario&, const Scenario&) = default;
};

// Reads and parses the file at path; an unreadable file is an InputError naming it.
[[nodiscard]] Scenario load_scenario(const std::string& path, const std::vector<std::string>& set_overrides = {});

// Parses scenario text; source_name appears in messages in place of a file name.
[[nodiscard]] Scenario parse_scenario(const std::string& text, const std::string& source_name,
                                      const std::vector<std::string>& set_overrides = {});

// The resolved scenario (defaults filled in) as TOML text, which parses back to the same Scenario.
[[nodiscard]] std::string resolved_scenario_toml(const Scenario& scenario);

// Monte Carlo input index of a slot: 3 s + {0, 1, 2} for species s's radius, Hamaker constant
// and potential; 64-67 the suspension keys, 80-81 the medium keys, 96 the salt concentration.
// Fixed by the slot, so making another value uncertain never changes this one's draws.
[[nodiscard]] std::uint32_t input_index_of(InputSlot slot, int species);
// The scenario with one value replaced (a Monte Carlo draw), e.g. species 0's radius_nm.
void set_input(Scenario& scenario, InputSlot slot, int species, double value);

// Names for the double-layer model as written in scenario files.
[[nodiscard]] const char* double_layer_name(potentials::DoubleLayerModel model);

}  // namespace brownfloc::sim
