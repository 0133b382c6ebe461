#pragma once
// Readers that fill a Scenario from a parsed scenario table (private to brownfloc::sim).
// They run after check_table has accepted every key, type and range of every section, and
// add the rules that span keys: required keys, defaults, fractions summing to 1,
// electroneutrality, the liquid-water temperature range. Each applied default is recorded
// in Scenario::defaults_applied.
#include <string>
#include <string_view>

#include <toml++/toml.h>

#include "sim/scenario.hpp"

namespace brownfloc::sim::detail {

// [particle] or [[species]] -> scenario.species (scenario_species.cpp).
void read_species(const std::string& source, const toml::table& root, Scenario& scenario);
// [suspension], [medium], [electrolyte] (scenario_conditions.cpp).
void read_conditions(const std::string& source, const toml::table& root, Scenario& scenario);
// [interaction], [run], [output], [storage] (scenario_settings.cpp).
void read_settings(const std::string& source, const toml::table& root, Scenario& scenario);

// [calibration] (scenario_calibration.cpp).
void read_calibration(const std::string& source, const toml::table& root, Scenario& scenario);

// Records "[section] key = value" in scenario.defaults_applied.
void note_default(Scenario& scenario, std::string_view section, std::string_view key, const std::string& value_toml);

}  // namespace brownfloc::sim::detail
