#pragma once
// The scenario schema (private to brownfloc::sim): every section and key a scenario file may
// hold, with its type, allowed range or values, and which keys exclude each other. The
// parser, the `--set` overrides and the checks all read this one table, so a new key is
// added here once. The keys and rules are those of shared/INTERFACES.md, "Scenario file".
#include <cstddef>
#include <optional>
#include <string_view>
#include <utility>
#include <vector>

namespace brownfloc::sim::detail {

enum class ValueKind {
    number,        // float; a TOML integer is accepted too (5 == 5.0); must be finite
    integer,       // TOML integer only
    boolean,
    text,          // non-empty string without control characters
    choice,        // one of KeySpec::choices
    salt_formula,  // a string that potentials::parse_salt_formula accepts
    ion_list,      // array of { valence, concentration_mM } tables (checked by the electrolyte reader)
    number_list,   // array of KeySpec::min_items..max_items numbers, each finite and within min/max
    choice_list,   // array of 1..choices.size() distinct KeySpec::choices
    point_list,    // [calibration] points: array of tables (checked by the calibration reader)
};

struct Bound {
    double value = 0.0;
    bool inclusive = true;
};

struct KeySpec {
    std::string_view key;
    ValueKind kind = ValueKind::number;
    std::optional<Bound> min, max;
    bool nonzero = false;                   // integers: 0 excluded (ion valence)
    std::vector<std::string_view> choices;  // ValueKind::choice
    std::size_t min_items = 0, max_items = 0;  // ValueKind::number_list: how many elements
    // ValueKind::number only: a distribution ({ mean, sd }, { low, high }, { median, factor })
    // is allowed in place of the number: uncertainty about this value (shelf-life estimates).
    bool uncertain = false;
};

struct SectionSpec {
    std::string_view name;
    bool array_of_tables = false;  // [[species]]
    std::vector<KeySpec> keys;
    // Groups of keys of which at most one may appear ("temperature_C | temperature_K").
    std::vector<std::vector<std::string_view>> alternatives;
    // (head, key): key only goes with head, and goes when a rival of head is set
    // (salt -> concentration_mM: `--set electrolyte.ions=...` removes both).
    std::vector<std::pair<std::string_view, std::string_view>> companions;

    [[nodiscard]] const KeySpec* find(std::string_view key) const;
    [[nodiscard]] std::vector<std::string_view> key_names() const;
    // The alternative group holding key (empty when key has no alternatives).
    [[nodiscard]] std::vector<std::string_view> alternatives_of(std::string_view key) const;
    // Keys to remove when key is set: its rivals and their companions.
    [[nodiscard]] std::vector<std::string_view> displaced_by(std::string_view key) const;
};

// The top-level sections, in the order a resolved scenario writes them.
[[nodiscard]] const std::vector<SectionSpec>& scenario_sections();
[[nodiscard]] const SectionSpec* find_section(std::string_view name);
[[nodiscard]] std::vector<std::string_view> section_names();
// The tables inside [electrolyte] ions = [...].
[[nodiscard]] const SectionSpec& ion_spec();
// The tables inside [calibration] points = [...].
[[nodiscard]] const SectionSpec& calibration_point_spec();

// Bounds shared between the schema and the cross-key checks.
inline constexpr int max_species = 16;
inline constexpr double number_fraction_sum_tolerance = 1e-6;
inline constexpr double electroneutrality_tolerance = 1e-9;  // relative to sum |z| c
// Outside liquid water (potentials::water_min/max_temperature_K, potentials/water.hpp) the
// water property fits do not hold, so both viscosity_mPa_s and relative_permittivity must
// then be given.
inline constexpr double celsius_offset_K = 273.15;
// [storage] temperatures_C: the shelf-life table is read by people, and 16 temperatures
// already cover every storage condition of ICH Q1A(R2) (2003) several times over.
inline constexpr std::size_t max_storage_temperatures = 16;

}  // namespace brownfloc::sim::detail
