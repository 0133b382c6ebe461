// [interaction], [run], [output]: how the physics is evaluated and the simulation run;
// [storage]: the conditions of a shelf-life estimate.
#include <string>
#include <vector>

#include "scenario_check.hpp"
#include "scenario_sections.hpp"
#include "scenario_text.hpp"

namespace brownfloc::sim::detail {
namespace {

const toml::table& section_or_empty(const toml::table& root, std::string_view name) {
    static const toml::table empty;
    const toml::node* node = root.get(name);
    return node && node->is_table() ? *node->as_table() : empty;
}

potentials::DoubleLayerModel double_layer_from_name(const std::string& name) {
    using potentials::DoubleLayerModel;
    for (const auto model : {DoubleLayerModel::linear_superposition, DoubleLayerModel::constant_potential,
                             DoubleLayerModel::constant_charge})
        if (name == double_layer_name(model)) return model;
    return DoubleLayerModel::linear_superposition;  // unreachable: the schema allows only the names above
}

void read_interaction(const toml::table& table, Scenario& s) {
    if (const auto name = string_at(table, "double_layer")) {
        s.double_layer = double_layer_from_name(*name);
    } else {
        s.double_layer = potentials::DoubleLayerModel::linear_superposition;
        note_default(s, "interaction", "double_layer", toml_string_literal(double_layer_name(s.double_layer)));
    }
    if (const auto retarded = boolean_at(table, "retarded_vdw")) {
        s.retarded_vdw = *retarded;
    } else {
        s.retarded_vdw = false;
        note_default(s, "interaction", "retarded_vdw", "false");
    }
    if (const auto min_gap = number_at(table, "min_gap_nm")) {
        s.min_gap_nm = *min_gap;
    } else {
        s.min_gap_nm = 0.2;
        note_default(s, "interaction", "min_gap_nm", number_text(0.2));
    }
}

void read_run(const toml::table& table, Scenario& s) {
    RunSettings& run = s.run;
    run.particles = integer_at(table, "particles");
    if (const auto seed = integer_at(table, "seed")) {
        run.seed = static_cast<std::uint64_t>(*seed);  // the schema keeps it >= 0
    } else {
        run.seed = 1;
        note_default(s, "run", "seed", "1");
    }
    run.end_time_s = number_at(table, "end_time_s");
    run.end_half_lives = number_at(table, "end_half_lives");
    run.steps = integer_at(table, "steps");
    if (const auto aggregation = string_at(table, "aggregation")) {
        run.aggregation = *aggregation;
    } else {
        run.aggregation = "irreversible";
        note_default(s, "run", "aggregation", toml_string_literal(run.aggregation));
    }
    if (const auto mobility = string_at(table, "cluster_mobility")) {
        run.cluster_mobility = *mobility;
    } else {
        run.cluster_mobility = "hydrodynamic-radius";
        note_default(s, "run", "cluster_mobility", toml_string_literal(run.cluster_mobility));
    }
    run.capture_gap_nm = number_at(table, "capture_gap_nm");
    run.cluster_gap_nm = number_at(table, "cluster_gap_nm");
    run.time_step_s = number_at(table, "time_step_s");
    run.max_time_step_s = number_at(table, "max_time_step_s");
    run.max_steps = integer_at(table, "max_steps");
}

void read_output(const toml::table& table, OutputSettings& output) {
    output.output_interval_s = number_at(table, "output_interval_s");
    output.output_spacing = string_at(table, "output_spacing");
    output.snapshot_interval_s = number_at(table, "snapshot_interval_s");
    output.snapshots = integer_at(table, "snapshots");
    output.trajectory_precision = string_at(table, "trajectory_precision");
    output.checkpoint_interval_wall_s = number_at(table, "checkpoint_interval_wall_s");
}

std::string numbers_toml(const std::vector<double>& values) {
    std::string text = "[";
    for (std::size_t i = 0; i < values.size(); ++i) {
        if (i > 0) text += ", ";
        text += number_text(values[i]);
    }
    return text + "]";
}

// Reads one [storage] key into field, or notes the default the field already holds.
class StorageReader {
public:
    StorageReader(const toml::table& table, Scenario& s) : table_(table), s_(s) {}

    void number(std::string_view key, double& field) {
        if (const auto v = number_at(table_, key)) {
            field = *v;
        } else {
            note_default(s_, "storage", key, number_text(field));
        }
    }
    void integer(std::string_view key, std::int64_t& field) {
        if (const auto v = integer_at(table_, key)) {
            field = *v;
        } else {
            note_default(s_, "storage", key, std::to_string(field));
        }
    }
    void boolean(std::string_view key, bool& field) {
        if (const auto v = boolean_at(table_, key)) {
            field = *v;
        } else {
            note_default(s_, "storage", key, field ? "true" : "false");
        }
    }
    void text(std::string_view key, std::string& field) {
        if (const auto v = string_at(table_, key)) {
            field = *v;
        } else {
            note_default(s_, "storage", key, toml_string_literal(field));
        }
    }
    void numbers(std::string_view key, std::vector<double>& field) {
        if (auto v = numbers_at(table_, key)) {
            field = std::move(*v);
        } else {
            note_default(s_, "storage", key, numbers_toml(field));
        }
    }

private:
    const toml::table& table_;
    Scenario& s_;
};

// Only a scenario with a [storage] section records anything about storage: the defaults of
// StorageSettings hold otherwise, silently, so that scenarios for other commands (and the
// resolved scenario.toml of a run) do not change.
void read_storage(const std::string& source, const toml::table& root, Scenario& s) {
    const toml::node* node = root.get("storage");
    s.storage = StorageSettings{};
    s.storage_given = node != nullptr;
    if (!s.storage_given) return;
    const toml::table& table = *node->as_table();  // check_sections has made sure it is one
    StorageSettings& st = s.storage;
    StorageReader read(table, s);
    read.numbers("temperatures_C", st.temperatures_C);
    read.text("surface_hold", st.surface_hold);
    read.text("criterion", st.criterion);
    // No default noted: it depends on the criterion and is the criteria library's to choose.
    st.criterion_value = number_at(table, "criterion_value");
    read.number("target_days", st.target_days);
    read.boolean("hydrodynamic_correction", st.hydrodynamic_correction);
    read.text("optics", st.optics);
    read.number("scattering_angle_deg", st.scattering_angle_deg);
    read.number("wavelength_nm", st.wavelength_nm);
    read.number("medium_refractive_index", st.medium_refractive_index);
    read.number("fractal_dimension", st.fractal_dimension);
    read.text("second_salt", st.second_salt);
    read.integer("samples", st.samples);
    read.integer("band_samples", st.band_samples);
    // Optional, no default: water's properties at each temperature otherwise.
    for (const auto& [key, field] : {std::pair<std::string_view, std::optional<std::vector<double>>*>{
                                         "viscosities_mPa_s", &st.viscosities_mPa_s},
                                     {"relative_permittivities", &st.relative_permittivities}}) {
        *field = numbers_at(table, key);
        if (*field && (*field)->size() != st.temperatures_C.size()) {
            const toml::node& list = *table.get(key);
            fail(source, list, "storage", key, &list,
                 "gives " + std::to_string((*field)->size()) + " values for " + std::to_string(st.temperatures_C.size()) +
                     " temperatures_C: give one per storage temperature, in the same order");
        }
    }
}

}  // namespace

void read_settings(const std::string& source, const toml::table& root, Scenario& scenario) {
    read_interaction(section_or_empty(root, "interaction"), scenario);
    read_run(section_or_empty(root, "run"), scenario);
    read_output(section_or_empty(root, "output"), scenario.output);
    read_storage(source, root, scenario);
    read_calibration(source, root, scenario);
}

void note_default(Scenario& scenario, std::string_view section, std::string_view key, const std::string& value_toml) {
    // Appended piece by piece: `"[" + std::string(...)` trips a false -Wrestrict in g++ 12 at -O3
    // (GCC bug 105651), which would fail builds with BROWNFLOC_WARNINGS_AS_ERRORS.
    std::string line = "[";
    line.append(section).append("] ").append(key).append(" = ").append(value_toml);
    scenario.defaults_applied.push_back(std::move(line));
}

}  // namespace brownfloc::sim::detail
