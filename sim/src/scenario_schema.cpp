#include "scenario_schema.hpp"

#include <algorithm>

namespace brownfloc::sim::detail {
namespace {

constexpr Bound gt(double v) { return {v, false}; }
constexpr Bound ge(double v) { return {v, true}; }
constexpr Bound lt(double v) { return {v, false}; }
constexpr Bound le(double v) { return {v, true}; }

// 5 M is beyond the solubility of most salts and far beyond where DLVO screening means
// anything; larger values are taken for a unit slip (M or uM typed as mM).
constexpr double max_concentration_mM = 5000.0;

KeySpec number(std::string_view key, std::optional<Bound> min = {}, std::optional<Bound> max = {}) {
    return KeySpec{key, ValueKind::number, min, max, false, {}, 0, 0};
}
KeySpec integer(std::string_view key, std::optional<Bound> min = {}, std::optional<Bound> max = {}) {
    return KeySpec{key, ValueKind::integer, min, max, false, {}, 0, 0};
}
KeySpec of_kind(std::string_view key, ValueKind kind) { return KeySpec{key, kind, {}, {}, false, {}, 0, 0}; }
KeySpec choice(std::string_view key, std::vector<std::string_view> choices) {
    return KeySpec{key, ValueKind::choice, {}, {}, false, std::move(choices), 0, 0};
}
// An array of min_items..max_items numbers, each within [min, max] as bounded.
KeySpec number_list(std::string_view key, std::size_t min_items, std::size_t max_items, std::optional<Bound> min,
                    std::optional<Bound> max) {
    return KeySpec{key, ValueKind::number_list, min, max, false, {}, min_items, max_items};
}

// The same key, accepting a distribution in place of the number (scenario_schema.hpp).
KeySpec uncertain(KeySpec spec) {
    spec.uncertain = true;
    return spec;
}

// [storage]: the conditions of a shelf-life estimate (`brownfloc shelf-life`). Ranges here
// catch slips and impossible values only; each library that uses a value checks what it
// needs (the criteria library the range of criterion_value per criterion, the storage
// conditions the 0-100 degC range of the water property fits).
SectionSpec storage_section() {
    return {"storage",
            false,
            {// Water-based dispersions: below 0 degC only supercooled or with antifreeze.
             number_list("temperatures_C", 1, max_storage_temperatures, ge(-20), le(100)),
             choice("surface_hold", {"potential", "charge"}),
             choice("criterion", {"count-drop", "mean-size", "aggregated-fraction", "z-average-growth"}),
             number("criterion_value", gt(0)),
             number("target_days", gt(0)),
             of_kind("hydrodynamic_correction", ValueKind::boolean),
             choice("optics", {"rayleigh", "rgd"}),
             number("scattering_angle_deg", gt(0), le(180)),
             // Light scattering from the near ultraviolet to the near infrared; a value outside
             // is a unit slip (um or m typed as nm).
             number("wavelength_nm", gt(100), lt(2000)),
             // Liquids lie within 1.3-1.8; 3 leaves room for any medium while catching slips.
             number("medium_refractive_index", ge(1), lt(3)),
             // Mass fractal dimension of clusters: 1 a rod, 3 a compact sphere.
             number("fractal_dimension", gt(1), le(3)),
             of_kind("second_salt", ValueKind::salt_formula),
             integer("samples", ge(1), le(1e7)),
             integer("band_samples", ge(1), le(1e6)),
             number_list("viscosities_mPa_s", 1, max_storage_temperatures, gt(0), {}),
             number_list("relative_permittivities", 1, max_storage_temperatures, ge(1), {})},
            {},
            {}};
}

// [calibration]: measurements the shelf-life model is fitted to (sim/include/sim/calibration.hpp).
SectionSpec calibration_section() {
    KeySpec parameters{"parameters", ValueKind::choice_list, {}, {}, false, {"surface_potential_mV", "hamaker_J"}, 0, 0};
    return {"calibration",
            false,
            {of_kind("points", ValueKind::point_list), number("ccc_mM", gt(0), le(max_concentration_mM)),
             number("ccc_relative_sd", gt(0), le(5)), choice("w_reference", {"measured-fast", "smoluchowski"}),
             choice("rate_convention", {"k", "half-k"}),
             // 1e-15 m3/s is some 1e2 times any diffusion-limited rate in water; larger is a slip.
             number("fast_rate_constant_m3_per_s", gt(0), lt(1e-15)), parameters},
            {},
            {}};
}

// Particle keys shared by [particle] and [[species]]. The upper bounds catch unit slips
// (a radius in m or um typed as nm, a Hamaker constant in zJ typed as J): real Hamaker
// constants lie within 1e-21-5e-19 J (Israelachvili, Intermolecular and Surface Forces,
// 3rd ed. 2011, table 13.2), and 500 mV is far beyond any measured zeta potential.
std::vector<KeySpec> particle_keys(bool with_number_fraction) {
    std::vector<KeySpec> keys{
        of_kind("name", ValueKind::text),
        uncertain(number("radius_nm", gt(0), lt(1e5))),
        uncertain(number("hamaker_J", ge(0), lt(1e-17))),
        uncertain(number("surface_potential_mV", ge(-500), le(500))),
        // Standard deviation of ln(radius); >= 1 would span decades of sizes.
        number("radius_spread", ge(0), lt(1)),
    };
    if (with_number_fraction) keys.push_back(number("number_fraction", gt(0), le(1)));
    return keys;
}


std::vector<SectionSpec> build_sections() {
    std::vector<SectionSpec> sections;
    sections.push_back({"particle", false, particle_keys(false), {}, {}});
    sections.push_back({"species", true, particle_keys(true), {}, {}});
    // 0.64: random close packing of equal spheres, 0.637 (Scott & Kilgour 1969, J. Phys. D 2, 863).
    // 25000 kg/m3: above the densest element (osmium, 22590 kg/m3); larger is a slip.
    sections.push_back({"suspension", false,
                        {uncertain(number("volume_fraction", gt(0), lt(0.64))),
                         uncertain(number("number_density_per_m3", gt(0))),
                         uncertain(number("mass_fraction", gt(0), lt(1))),
                         uncertain(number("particle_density_kg_per_m3", gt(0), lt(25000)))},
                        {{"volume_fraction", "number_density_per_m3", "mass_fraction"}}, {}});
    // Absolute zero bounds the temperatures here; the liquid-water range is checked later,
    // because it depends on whether viscosity and permittivity are given.
    sections.push_back({"medium", false,
                        {number("temperature_C", gt(-celsius_offset_K)), number("temperature_K", gt(0)),
                         uncertain(number("viscosity_mPa_s", gt(0))), uncertain(number("relative_permittivity", ge(1)))},
                        {{"temperature_C", "temperature_K"}}, {}});
    sections.push_back({"electrolyte", false,
                        {of_kind("salt", ValueKind::salt_formula),
                         uncertain(number("concentration_mM", ge(0), le(max_concentration_mM))),
                         of_kind("ions", ValueKind::ion_list), of_kind("titrant", ValueKind::salt_formula)},
                        {{"salt", "ions"}},
                        {{"salt", "concentration_mM"}}});
    sections.push_back({"interaction", false,
                        {choice("double_layer", {"linear-superposition", "constant-potential", "constant-charge"}),
                         of_kind("retarded_vdw", ValueKind::boolean),
                         // 100 nm: beyond it every DLVO term is negligible; a larger value is a slip.
                         number("min_gap_nm", gt(0), lt(100))},
                        {}, {}});
    sections.push_back({"run", false,
                        {integer("particles", ge(2)), integer("seed", ge(0)), number("end_time_s", gt(0)),
                         number("end_half_lives", gt(0)), integer("steps", gt(0)),
                         choice("aggregation", {"irreversible", "reversible"}),
                         choice("cluster_mobility", {"hydrodynamic-radius", "free-draining"}),
                         number("capture_gap_nm", gt(0)), number("cluster_gap_nm", gt(0)),
                         number("time_step_s", gt(0)), number("max_time_step_s", gt(0)),
                         integer("max_steps", gt(0))},
                        {{"end_time_s", "end_half_lives", "steps"}}, {}});
    sections.push_back({"output", false,
                        {number("output_interval_s", gt(0)), choice("output_spacing", {"linear", "log"}),
                         number("snapshot_interval_s", gt(0)), integer("snapshots", ge(2)),
                         choice("trajectory_precision", {"float32", "float64"}),
                         number("checkpoint_interval_wall_s", gt(0))},
                        {{"snapshot_interval_s", "snapshots"}}, {}});
    sections.push_back(storage_section());
    sections.push_back(calibration_section());
    return sections;
}

}  // namespace

const KeySpec* SectionSpec::find(std::string_view key) const {
    const auto it = std::find_if(keys.begin(), keys.end(), [&](const KeySpec& k) { return k.key == key; });
    return it == keys.end() ? nullptr : &*it;
}

std::vector<std::string_view> SectionSpec::key_names() const {
    std::vector<std::string_view> names;
    for (const KeySpec& k : keys) names.push_back(k.key);
    return names;
}

std::vector<std::string_view> SectionSpec::alternatives_of(std::string_view key) const {
    for (const auto& group : alternatives)
        if (std::find(group.begin(), group.end(), key) != group.end()) return group;
    return {};
}

std::vector<std::string_view> SectionSpec::displaced_by(std::string_view key) const {
    std::vector<std::string_view> out;
    for (const std::string_view rival : alternatives_of(key)) {
        if (rival == key) continue;
        out.push_back(rival);
        for (const auto& [head, companion] : companions)
            if (head == rival) out.push_back(companion);
    }
    return out;
}

const std::vector<SectionSpec>& scenario_sections() {
    static const std::vector<SectionSpec> sections = build_sections();
    return sections;
}

const SectionSpec* find_section(std::string_view name) {
    for (const SectionSpec& s : scenario_sections())
        if (s.name == name) return &s;
    return nullptr;
}

std::vector<std::string_view> section_names() {
    std::vector<std::string_view> names;
    for (const SectionSpec& s : scenario_sections()) names.push_back(s.name);
    return names;
}

const SectionSpec& ion_spec() {
    // Valences beyond 4 do not occur in simple aqueous salts; |z| <= 4 covers Th4+ and
    // [Fe(CN)6]4-.
    static const SectionSpec spec{"ions",
                                  false,
                                  {KeySpec{"valence", ValueKind::integer, ge(-4), le(4), true, {}, 0, 0},
                                   number("concentration_mM", ge(0), le(max_concentration_mM))},
                                  {},
                                  {}};
    return spec;
}

const SectionSpec& calibration_point_spec() {
    // relative_sd is the sd of ln W: 5 is already a factor e^5 = 150 either way.
    static const SectionSpec spec{"points",
                                  false,
                                  {number("concentration_mM", gt(0), le(max_concentration_mM)),
                                   number("stability_ratio", gt(0)),
                                   number("rate_constant_m3_per_s", gt(0), lt(1e-15)),
                                   number("relative_sd", gt(0), le(5)),
                                   number("temperature_C", ge(0), le(100)),
                                   of_kind("salt", ValueKind::salt_formula)},
                                  {{"stability_ratio", "rate_constant_m3_per_s"}},
                                  {}};
    return spec;
}

}  // namespace brownfloc::sim::detail
