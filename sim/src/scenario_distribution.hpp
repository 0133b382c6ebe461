#pragma once
// Distributions on scenario values (private to brownfloc::sim): a key the schema marks
// `uncertain` may hold { mean, sd }, { low, high } or { median, factor } in place of its
// number, meaning uncertainty about that one value (uncertainty/distribution.hpp). Checked
// here once: the form, each parameter, the median against the key's range, and at most 1e-6
// of the probability outside the key's range (uncertainty/physical_range.hpp).
#include <string>
#include <string_view>

#include <toml++/toml.h>

#include "scenario_schema.hpp"
#include "sim/scenario.hpp"
#include "uncertainty/distribution.hpp"

namespace brownfloc::sim::detail {

// The forms, for messages: "{ mean, sd }, { low, high } or { median, factor }".
[[nodiscard]] const char* distribution_forms();

// Checks a table given for an uncertain number key; throws InputError "WHERE: [section] key =
// VALUE: what" for a wrong form, a bad parameter, a median outside the key's range, or more
// than 1e-6 of the probability outside it (suggesting a log-normal where one fits).
void check_distribution(const std::string& source, std::string_view section, std::string_view key,
                        const KeySpec& spec, const toml::table& table);

// The distribution of a value check_value has accepted: a point for a number.
[[nodiscard]] uncertainty::Distribution distribution_at(const toml::node& value);

// When table[key] is a distribution, records it in scenario.uncertain_inputs as `shown`
// ("[particle] radius_nm") for slot (and species).
void note_uncertain(Scenario& scenario, const toml::table& table, std::string_view key, InputSlot slot,
                    int species, const std::string& shown);

}  // namespace brownfloc::sim::detail
