// [calibration]: measured stability ratios or rate constants, and a measured CCC, that the
// shelf-life model is fitted to (sim/include/sim/calibration.hpp does the fit).
#include <string>

#include "potentials/input_error.hpp"
#include "scenario_check.hpp"
#include "scenario_sections.hpp"
#include "scenario_text.hpp"

namespace brownfloc::sim::detail {
namespace {

CalibrationPoint read_point(const std::string& source, const toml::array& points, std::size_t i) {
    const std::string key = "points." + std::to_string(i + 1);
    const toml::table* table = points[i].as_table();
    if (!table)
        fail(source, points[i], "calibration", key, &points[i],
             "must be a table such as { concentration_mM = 50, stability_ratio = 120 }, not " +
                 type_phrase(points[i]));
    check_table(source, calibration_point_spec(), "calibration", *table, key + ".");
    if (!table->contains("concentration_mM"))
        fail(source, *table, "calibration", key + ".concentration_mM", nullptr, "missing (required)");
    if (!table->contains("stability_ratio") && !table->contains("rate_constant_m3_per_s"))
        fail(source, *table, "calibration", key, nullptr,
             "give the measurement: stability_ratio or rate_constant_m3_per_s");
    CalibrationPoint point;
    point.concentration_mM = *number_at(*table, "concentration_mM");
    point.stability_ratio = number_at(*table, "stability_ratio");
    point.rate_constant_m3_per_s = number_at(*table, "rate_constant_m3_per_s");
    point.relative_sd = number_at(*table, "relative_sd").value_or(0.2);
    point.temperature_C = number_at(*table, "temperature_C");
    point.salt = string_at(*table, "salt");
    return point;
}

}  // namespace

void read_calibration(const std::string& source, const toml::table& root, Scenario& s) {
    const toml::node* node = root.get("calibration");
    s.calibration = CalibrationSettings{};
    s.calibration_given = node != nullptr;
    if (!node) return;
    const toml::table& table = *node->as_table();
    CalibrationSettings& c = s.calibration;
    if (const toml::node* points = table.get("points")) {
        const toml::array& array = *points->as_array();
        for (std::size_t i = 0; i < array.size(); ++i) c.points.push_back(read_point(source, array, i));
    }
    c.ccc_mM = number_at(table, "ccc_mM");
    if (c.points.empty() && !c.ccc_mM)
        fail(source, table, "calibration", "", nullptr,
             "give the measurements: points = [{ concentration_mM, stability_ratio | rate_constant_m3_per_s }, ...] "
             "and/or ccc_mM");
    c.ccc_relative_sd = number_at(table, "ccc_relative_sd").value_or(c.ccc_relative_sd);
    c.w_reference = string_at(table, "w_reference").value_or(c.w_reference);
    c.rate_convention = string_at(table, "rate_convention");
    c.fast_rate_constant_m3_per_s = number_at(table, "fast_rate_constant_m3_per_s");
    if (const toml::node* parameters = table.get("parameters")) {
        c.parameters.clear();
        for (const toml::node& name : *parameters->as_array()) c.parameters.push_back(name.as_string()->get());
    }
    bool has_rates = c.fast_rate_constant_m3_per_s.has_value();
    for (const CalibrationPoint& p : c.points) has_rates = has_rates || p.rate_constant_m3_per_s.has_value();
    if (has_rates && !c.rate_convention)
        fail(source, table, "calibration", "rate_convention", nullptr,
             "missing (required with rate constants): \"k\" when the rate constants are those of "
             "dN/dt = -k N^2 / 2 (fast limit 8kT/3eta), \"half-k\" when of dN/dt = -k N^2 (fast limit 4kT/3eta)");
}

}  // namespace brownfloc::sim::detail
