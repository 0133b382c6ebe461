#pragma once
// Checks of parsed TOML nodes against the schema (private to brownfloc::sim), and the one
// place that words scenario error messages:
//   WHERE: [section] key = VALUE: what is allowed
// WHERE is "FILE:LINE" for a node read from the file and "--set ARG" for a node set on the
// command line (its toml++ source path is that label, not the file name).
#include <cstdint>
#include <optional>
#include <string>
#include <string_view>
#include <utility>
#include <vector>

#include <toml++/toml.h>

#include "scenario_schema.hpp"

namespace brownfloc::sim::detail {

// "FILE:LINE", "--set ARG" or, for a node with no source line (a table --set created), "FILE".
// source is the file name as shown in messages (escaped).
[[nodiscard]] std::string where(const std::string& source, const toml::node& node);
// The TOML text of a value for a message: strings quoted and escaped, "-5", "0.2", "true",
// "[1, 2]", "{ valence = 1 }"; cut at 80 characters with "...".
[[nodiscard]] std::string value_text(const toml::node& node);
// A key as written in TOML: bare when it can be, else quoted and escaped.
[[nodiscard]] std::string key_text(std::string_view key);
// "unknown key; did you mean 'radius_nm'?; known keys: ..." and, when top_level, the section
// the key belongs in if it is another one's.
[[nodiscard]] std::string unknown_key_text(const SectionSpec& spec, std::string_view key, bool top_level);
// "a string", "an integer", "a float", "an array", ...
[[nodiscard]] std::string type_phrase(const toml::node& node);

// Throws InputError "WHERE(at): [section] key = VALUE: what"; without value, "[section] key:
// what"; with an empty key, "[section]: what".
[[noreturn]] void fail(const std::string& source, const toml::node& at, std::string_view section,
                       std::string_view key, const toml::node* value, std::string_view what);

// Checks one value's type and range against spec (and a salt formula against
// potentials::parse_salt_formula). key is the name shown (it may carry a prefix: "ions.2.valence").
void check_value(const std::string& source, std::string_view section, std::string_view key,
                 const KeySpec& spec, const toml::node& value);

// Checks every entry of a section table in source order: known key (else "did you mean"),
// type and range, and at most one key of each alternative group (naming both and both places).
// key_prefix is put before each key in messages ("ions.2.").
void check_table(const std::string& source, const SectionSpec& spec, std::string_view section,
                 const toml::table& table, std::string_view key_prefix = {});

// Throws "[section] key: missing (required...)" at the table's header line unless key is present.
void require(const std::string& source, const toml::table& table, std::string_view section,
             std::string_view key, std::string_view when = {});

// The entries of a table in the order they appear in the source (toml++ keeps tables sorted by
// key); entries from --set come after those from the file.
[[nodiscard]] std::vector<std::pair<std::string_view, const toml::node*>> entries_in_source_order(
    const std::string& source, const toml::table& table);

// Typed reads of values that check_table has already accepted. number_at gives the median of
// a distribution.
[[nodiscard]] std::optional<double> number_at(const toml::table& table, std::string_view key);
[[nodiscard]] std::optional<std::int64_t> integer_at(const toml::table& table, std::string_view key);
[[nodiscard]] std::optional<bool> boolean_at(const toml::table& table, std::string_view key);
[[nodiscard]] std::optional<std::string> string_at(const toml::table& table, std::string_view key);
// A ValueKind::number_list value (integers read as numbers).
[[nodiscard]] std::optional<std::vector<double>> numbers_at(const toml::table& table, std::string_view key);

}  // namespace brownfloc::sim::detail
