// The resolved scenario: every value a run used, defaults included, as TOML that
// parse_scenario reads back to an equal Scenario (numbers are written as the shortest text
// that reads back bit for bit). Runs store it as scenario.toml so that they can be repeated.
#include <cstdint>
#include <optional>
#include <string>
#include <vector>

#include "scenario_schema.hpp"
#include "scenario_text.hpp"
#include "sim/scenario.hpp"

namespace brownfloc::sim {
namespace {

using detail::number_text;
using detail::toml_string_literal;

class TomlWriter {
public:
    void comment(const std::string& text) {
        // A comment runs to the end of the line and may not hold control characters.
        std::string safe;
        for (const char c : text) safe += (static_cast<unsigned char>(c) < 0x20 || c == 0x7F) ? '?' : c;
        out_ += "# " + safe + "\n";
    }
    void section(const std::string& header) { out_ += (out_.empty() ? "" : "\n") + header + "\n"; }
    void number(const char* key, double v) { line(key, number_text(v)); }
    void number(const char* key, const std::optional<double>& v) {
        if (v) number(key, *v);
    }
    void integer(const char* key, std::int64_t v) { line(key, std::to_string(v)); }
    void integer(const char* key, const std::optional<std::int64_t>& v) {
        if (v) integer(key, *v);
    }
    void text(const char* key, const std::string& v) { line(key, toml_string_literal(v)); }
    void text(const char* key, const std::optional<std::string>& v) {
        if (v) text(key, *v);
    }
    void boolean(const char* key, bool v) { line(key, v ? "true" : "false"); }
    void numbers(const char* key, const std::vector<double>& values) {
        std::string text = "[";
        for (std::size_t i = 0; i < values.size(); ++i) {
            if (i > 0) text += ", ";
            text += number_text(values[i]);
        }
        line(key, text + "]");
    }
    void line(const char* key, const std::string& value_toml, const std::string& note = {}) {
        out_ += std::string(key) + " = " + value_toml + (note.empty() ? "" : "  # " + note) + "\n";
    }
    [[nodiscard]] const std::string& str() const { return out_; }

private:
    std::string out_;
};

// A value that may be a distribution: its text as written ("{ median = 50, factor = 1.1 }")
// when the scenario holds one for the slot, else the number.
void value(TomlWriter& w, const Scenario& s, const char* key, InputSlot slot, int species, double number) {
    for (const UncertainInput& u : s.uncertain_inputs)
        if (u.slot == slot && u.species == species) return w.line(key, u.distribution.text());
    w.number(key, number);
}
void value(TomlWriter& w, const Scenario& s, const char* key, InputSlot slot, const std::optional<double>& number) {
    if (number) value(w, s, key, slot, 0, *number);
}

void write_species(TomlWriter& w, const Scenario& s) {
    // [particle] is the one-species shorthand; keep the form the user wrote.
    const bool shorthand = s.from_particle_table && s.species.size() == 1;
    for (std::size_t i = 0; i < s.species.size(); ++i) {
        const SpeciesSpec& sp = s.species[i];
        const int index = static_cast<int>(i);
        w.section(shorthand ? "[particle]" : "[[species]]");
        w.text("name", sp.name);
        value(w, s, "radius_nm", InputSlot::radius_nm, index, sp.radius_nm);
        value(w, s, "hamaker_J", InputSlot::hamaker_J, index, sp.hamaker_J);
        value(w, s, "surface_potential_mV", InputSlot::surface_potential_mV, index, sp.surface_potential_mV);
        w.number("radius_spread", sp.radius_spread);
        if (!shorthand) w.number("number_fraction", sp.number_fraction);
    }
}

void write_conditions(TomlWriter& w, const Scenario& s) {
    if (s.volume_fraction || s.number_density_per_m3 || s.mass_fraction || s.particle_density_kg_per_m3) {
        w.section("[suspension]");
        value(w, s, "volume_fraction", InputSlot::volume_fraction, s.volume_fraction);
        value(w, s, "number_density_per_m3", InputSlot::number_density_per_m3, s.number_density_per_m3);
        value(w, s, "mass_fraction", InputSlot::mass_fraction, s.mass_fraction);
        value(w, s, "particle_density_kg_per_m3", InputSlot::particle_density_kg_per_m3, s.particle_density_kg_per_m3);
    }
    w.section("[medium]");
    w.line("temperature_K", number_text(s.temperature_K),
           detail::bound_text(s.temperature_K - detail::celsius_offset_K) + " degC");
    value(w, s, "viscosity_mPa_s", InputSlot::viscosity_mPa_s, s.viscosity_mPa_s);
    value(w, s, "relative_permittivity", InputSlot::relative_permittivity, s.relative_permittivity);
    if (!s.viscosity_mPa_s || !s.relative_permittivity)
        w.comment("viscosity and permittivity not given are those of water at this temperature");

    w.section("[electrolyte]");
    if (s.salt) {
        w.text("salt", *s.salt);
        value(w, s, "concentration_mM", InputSlot::salt_concentration_mM, 0, s.salt_concentration_mM);
    } else {
        std::string ions = "[";
        for (std::size_t i = 0; i < s.ions.size(); ++i)
            ions += std::string(i ? ", " : "") + "{ valence = " + std::to_string(s.ions[i].valence) +
                    ", concentration_mM = " + number_text(s.ions[i].concentration_mM) + " }";
        w.line("ions", ions + "]");
    }
    w.text("titrant", s.titrant);
}

void write_settings(TomlWriter& w, const Scenario& s) {
    w.section("[interaction]");
    w.text("double_layer", std::string(double_layer_name(s.double_layer)));
    w.boolean("retarded_vdw", s.retarded_vdw);
    w.number("min_gap_nm", s.min_gap_nm);

    const RunSettings& r = s.run;
    w.section("[run]");
    w.integer("particles", r.particles);
    w.integer("seed", static_cast<std::int64_t>(r.seed));
    w.number("end_time_s", r.end_time_s);
    w.number("end_half_lives", r.end_half_lives);
    w.integer("steps", r.steps);
    w.text("aggregation", r.aggregation);
    w.text("cluster_mobility", r.cluster_mobility);
    w.number("capture_gap_nm", r.capture_gap_nm);
    w.number("cluster_gap_nm", r.cluster_gap_nm);
    w.number("time_step_s", r.time_step_s);
    w.number("max_time_step_s", r.max_time_step_s);
    w.integer("max_steps", r.max_steps);

    const OutputSettings& o = s.output;
    if (o.output_interval_s || o.output_spacing || o.snapshot_interval_s || o.snapshots || o.trajectory_precision ||
        o.checkpoint_interval_wall_s) {
        w.section("[output]");
        w.number("output_interval_s", o.output_interval_s);
        w.text("output_spacing", o.output_spacing);
        w.number("snapshot_interval_s", o.snapshot_interval_s);
        w.integer("snapshots", o.snapshots);
        w.text("trajectory_precision", o.trajectory_precision);
        w.number("checkpoint_interval_wall_s", o.checkpoint_interval_wall_s);
    }
}

// Written whole, every key, only when the input had a [storage] section: a scenario without
// one resolves to the same text as before [storage] existed.
void write_storage(TomlWriter& w, const Scenario& s) {
    if (!s.storage_given) return;
    const StorageSettings& st = s.storage;
    w.section("[storage]");
    w.numbers("temperatures_C", st.temperatures_C);
    w.text("surface_hold", st.surface_hold);
    w.text("criterion", st.criterion);
    w.number("criterion_value", st.criterion_value);
    w.number("target_days", st.target_days);
    w.boolean("hydrodynamic_correction", st.hydrodynamic_correction);
    w.text("optics", st.optics);
    w.number("scattering_angle_deg", st.scattering_angle_deg);
    w.number("wavelength_nm", st.wavelength_nm);
    w.number("medium_refractive_index", st.medium_refractive_index);
    w.number("fractal_dimension", st.fractal_dimension);
    w.text("second_salt", st.second_salt);
    w.integer("samples", st.samples);
    w.integer("band_samples", st.band_samples);
    if (st.viscosities_mPa_s) w.numbers("viscosities_mPa_s", *st.viscosities_mPa_s);
    if (st.relative_permittivities) w.numbers("relative_permittivities", *st.relative_permittivities);
}

void write_calibration(TomlWriter& w, const Scenario& s) {
    if (!s.calibration_given) return;
    const CalibrationSettings& c = s.calibration;
    w.section("[calibration]");
    if (!c.points.empty()) {
        std::string points = "[";
        for (std::size_t i = 0; i < c.points.size(); ++i) {
            const CalibrationPoint& p = c.points[i];
            points += i ? ",\n  " : "\n  ";
            const auto field = [&points](const char* name, const std::string& text) {
                points.append(name).append(" = ").append(text);
            };
            points += "{ ";
            field("concentration_mM", number_text(p.concentration_mM));
            if (p.stability_ratio) field(", stability_ratio", number_text(*p.stability_ratio));
            if (p.rate_constant_m3_per_s) field(", rate_constant_m3_per_s", number_text(*p.rate_constant_m3_per_s));
            field(", relative_sd", number_text(p.relative_sd));
            if (p.temperature_C) field(", temperature_C", number_text(*p.temperature_C));
            if (p.salt) field(", salt", toml_string_literal(*p.salt));
            points += " }";
        }
        w.line("points", points + ",\n]");
    }
    w.number("ccc_mM", c.ccc_mM);
    w.number("ccc_relative_sd", c.ccc_relative_sd);
    w.text("w_reference", c.w_reference);
    w.text("rate_convention", c.rate_convention);
    w.number("fast_rate_constant_m3_per_s", c.fast_rate_constant_m3_per_s);
    std::string names = "[";
    for (std::size_t i = 0; i < c.parameters.size(); ++i) {
        if (i) names += ", ";
        names += toml_string_literal(c.parameters[i]);
    }
    w.line("parameters", names + "]");
}

}  // namespace

std::string resolved_scenario_toml(const Scenario& scenario) {
    TomlWriter w;
    w.comment("Resolved scenario: every value used, defaults included. Read from " + scenario.source);
    for (const std::string& d : scenario.defaults_applied) w.comment("default: " + d);
    write_species(w, scenario);
    write_conditions(w, scenario);
    write_settings(w, scenario);
    write_storage(w, scenario);
    write_calibration(w, scenario);
    return w.str();
}

const char* double_layer_name(potentials::DoubleLayerModel model) {
    switch (model) {
        case potentials::DoubleLayerModel::linear_superposition: return "linear-superposition";
        case potentials::DoubleLayerModel::constant_potential: return "constant-potential";
        case potentials::DoubleLayerModel::constant_charge: return "constant-charge";
    }
    return "unknown";  // unreachable: every enumerator is handled above
}

}  // namespace brownfloc::sim
