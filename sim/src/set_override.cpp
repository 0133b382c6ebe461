#include "set_override.hpp"

#include <algorithm>

#include "potentials/input_error.hpp"
#include "scenario_check.hpp"
#include "scenario_schema.hpp"
#include "scenario_text.hpp"

namespace brownfloc::sim::detail {
namespace {

std::string_view trim(std::string_view s) {
    while (!s.empty() && (s.front() == ' ' || s.front() == '\t')) s.remove_prefix(1);
    while (!s.empty() && (s.back() == ' ' || s.back() == '\t')) s.remove_suffix(1);
    return s;
}

std::vector<std::string_view> split_dots(std::string_view path) {
    std::vector<std::string_view> parts;
    for (std::size_t start = 0;;) {
        const std::size_t dot = path.find('.', start);
        parts.push_back(path.substr(start, dot == std::string_view::npos ? std::string_view::npos : dot - start));
        if (dot == std::string_view::npos) return parts;
        start = dot + 1;
    }
}

bool wants_string(ValueKind kind) {
    return kind == ValueKind::text || kind == ValueKind::choice || kind == ValueKind::salt_formula;
}

// The value as a TOML node whose source path is label. A bare word that is not valid TOML,
// and anything given for a string-valued key ("--set particle.name=2"), becomes a string.
toml::table parse_value(std::string_view value, ValueKind kind, const std::string& label) {
    try {
        toml::table parsed = toml::parse("v = " + std::string(value), label);
        // Exactly one key: "5\n[run]" could otherwise smuggle in more (newlines are refused
        // earlier, but this keeps the guarantee local).
        if (parsed.size() == 1 && parsed.contains("v") && (!wants_string(kind) || parsed.get("v")->is_string()))
            return parsed;
    } catch (const toml::parse_error&) {
        // not TOML: a string, below
    }
    try {
        return toml::parse("v = " + toml_string_literal(value), label);
    } catch (const toml::parse_error& e) {
        throw InputError(label + ": cannot read the value as a string: " + escape_for_message(e.description()));
    }
}

// The table the key goes into, created if the section is absent.
toml::table& target_table(toml::table& root, const SectionSpec& spec, const std::vector<std::string_view>& parts,
                          const std::string& label) {
    const std::string name(spec.name);
    if (!spec.array_of_tables) {
        if (name == "particle" && root.contains("species"))
            throw InputError(label + ": this scenario uses [[species]]; use --set species.N." +
                             std::string(parts.size() > 1 ? parts[1] : "KEY") + "=VALUE (N counts from 1)");
        if (!root.contains(name)) root.insert(name, toml::table{});
        toml::table* table = root.get(name)->as_table();
        if (!table) throw InputError(label + ": " + name + " in the scenario is not a [" + name + "] section");
        return *table;
    }
    // [[species]]: "species.N.key"
    if (root.contains("particle") && !root.contains("species"))
        throw InputError(label + ": this scenario uses [particle]; use --set particle." +
                         std::string(parts.size() > 2 ? parts[2] : "KEY") + "=VALUE");
    toml::array* array = root.contains(name) ? root.get(name)->as_array() : nullptr;
    const std::size_t count = array ? array->size() : 0;
    const std::string_view index = parts.size() > 2 ? parts[1] : std::string_view{};
    const bool digits = !index.empty() && index.size() <= 6 &&
                        std::all_of(index.begin(), index.end(), [](char c) { return c >= '0' && c <= '9'; });
    const std::size_t n = digits ? std::stoul(std::string(index)) : 0;
    if (parts.size() < 3 || !digits || n < 1 || n > count || !(*array)[n - 1].is_table())
        throw InputError(label + ": expected species.N.KEY=VALUE with N from 1 to " + std::to_string(count) +
                         " (the [[species]] tables of this scenario, counted from 1)");
    return *(*array)[n - 1].as_table();
}

}  // namespace

void apply_set_override(toml::table& root, const std::string& arg) {
    const std::string label = "--set " + escape_for_message(arg);
    if (const auto problem = find_text_problem(arg))
        throw InputError(label + ": column " + std::to_string(problem->column) + ": " + problem->what);
    if (arg.find_first_of("\r\n") != std::string::npos)
        throw InputError(label + ": the value must be on one line");
    const std::size_t eq = arg.find('=');
    if (eq == std::string::npos) throw InputError(label + ": expected section.key=value, e.g. particle.radius_nm=50");
    const std::string_view path = trim(std::string_view(arg).substr(0, eq));
    const std::string_view value = trim(std::string_view(arg).substr(eq + 1));
    const std::vector<std::string_view> parts = split_dots(path);

    const SectionSpec* spec = find_section(parts[0]);
    if (!spec) {
        std::string what = label + ": unknown section [" + key_text(parts[0]) + "]";
        if (const auto near = nearest_name(parts[0], section_names())) what += "; did you mean [" + std::string(*near) + "]?";
        throw InputError(what + "; known sections: " + join_names(section_names()));
    }
    if (!spec->array_of_tables && parts.size() < 2)
        throw InputError(label + ": expected section.key=value, e.g. particle.radius_nm=50");
    toml::table& table = target_table(root, *spec, parts, label);

    // The key is everything after the section (and index): "electrolyte.ions.1" names no key.
    const std::size_t key_start = spec->array_of_tables ? 2 : 1;
    std::string key(parts[key_start]);
    for (std::size_t i = key_start + 1; i < parts.size(); ++i) (key += '.') += parts[i];
    std::string section(spec->name);
    if (spec->array_of_tables) (section += '.') += parts[1];  // "species.2"
    const KeySpec* key_spec = spec->find(key);
    if (!key_spec) throw InputError(label + ": [" + section + "] " + key_text(key) + ": " + unknown_key_text(*spec, key, true));

    toml::table parsed = parse_value(value, key_spec->kind, label);
    for (const std::string_view displaced : spec->displaced_by(key)) table.erase(displaced);
    // Moving (not copying) the node keeps its source region: toml++ 3.3.0 drops it on copy.
    table.insert_or_assign(key, std::move(*parsed.get("v")));
}

}  // namespace brownfloc::sim::detail
