#include "scenario_check.hpp"

#include <algorithm>
#include <cmath>
#include <cstdint>
#include <sstream>
#include <tuple>

#include "potentials/electrolyte.hpp"
#include "potentials/input_error.hpp"
#include "scenario_distribution.hpp"
#include "scenario_text.hpp"

namespace brownfloc::sim::detail {
namespace {

constexpr std::size_t max_value_chars = 80;  // shared/INTERFACES.md: quoted input cut at 80

bool is_bare_key(std::string_view key) {
    return !key.empty() && std::all_of(key.begin(), key.end(), [](char c) {
        return (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || (c >= '0' && c <= '9') || c == '_' || c == '-';
    });
}

// Full TOML text of a node; strings inside are escaped but not cut (value_text cuts the whole).
std::string render(const toml::node& node) {
    if (const auto* s = node.as_string()) return quote_for_message(s->get(), SIZE_MAX);
    if (const auto* i = node.as_integer()) return std::to_string(i->get());
    if (const auto* f = node.as_floating_point()) return number_text(f->get());
    if (const auto* b = node.as_boolean()) return b->get() ? "true" : "false";
    if (const auto* a = node.as_array()) {
        std::string out = "[";
        for (std::size_t i = 0; i < a->size(); ++i) out += (i ? ", " : "") + render((*a)[i]);
        return out + "]";
    }
    if (const auto* t = node.as_table()) {
        // In the order written (toml++ keeps tables sorted by key).
        std::vector<std::pair<std::string_view, const toml::node*>> entries;
        for (auto&& [k, v] : *t) entries.emplace_back(k.str(), &v);
        std::stable_sort(entries.begin(), entries.end(), [](const auto& a, const auto& b) {
            const auto &ra = a.second->source().begin, &rb = b.second->source().begin;
            return std::tie(ra.line, ra.column) < std::tie(rb.line, rb.column);
        });
        std::string out = "{";
        for (std::size_t i = 0; i < entries.size(); ++i)
            out += (i ? ", " : " ") + key_text(entries[i].first) + " = " + render(*entries[i].second);
        return out + (entries.empty() ? "}" : " }");
    }
    std::ostringstream os;  // dates and times: toml++ prints them in TOML syntax
    if (const auto* d = node.as_date()) os << d->get();
    if (const auto* t = node.as_time()) os << t->get();
    if (const auto* dt = node.as_date_time()) os << dt->get();
    return escape_for_message(os.str(), SIZE_MAX);
}

double as_double(const toml::node& node) {
    if (const auto* i = node.as_integer()) return static_cast<double>(i->get());
    return node.as_floating_point()->get();
}

std::string range_text(const KeySpec& spec) {
    std::string text;
    if (spec.min) text += std::string(spec.min->inclusive ? ">= " : "> ") + bound_text(spec.min->value);
    if (spec.min && spec.max) text += " and ";
    if (spec.max) text += std::string(spec.max->inclusive ? "<= " : "< ") + bound_text(spec.max->value);
    return text;
}

bool in_range(const KeySpec& spec, double v) {
    if (spec.min && (spec.min->inclusive ? v < spec.min->value : v <= spec.min->value)) return false;
    if (spec.max && (spec.max->inclusive ? v > spec.max->value : v >= spec.max->value)) return false;
    return true;
}

std::string choices_text(const KeySpec& spec) {
    std::string out;
    for (std::size_t i = 0; i < spec.choices.size(); ++i)
        out += (i ? ", " : "") + quote_for_message(spec.choices[i]);
    return out;
}

}  // namespace

std::string key_text(std::string_view key) {
    return is_bare_key(key) ? std::string(key) : quote_for_message(key, max_value_chars);
}

std::string unknown_key_text(const SectionSpec& spec, std::string_view key, bool top_level) {
    std::string text = "unknown key";
    const SectionSpec* home = nullptr;  // the section key belongs to, when it is another one
    if (top_level)
        for (const SectionSpec& other : scenario_sections())
            if (&other != &spec && other.find(key)) {
                home = &other;  // the first: [particle] before [[species]]
                break;
            }
    const auto near = nearest_name(key, spec.key_names());
    if (near) text += "; did you mean '" + std::string(*near) + "'?";
    if (home) {
        // With a near key here as well, both: temperature_C in [storage] is more likely a slip
        // for temperatures_C than a [medium] key in the wrong place, but either may be meant.
        const std::string name(home->name);
        text += near ? " (" : "; ";
        text += key_text(key);
        text += " belongs in ";
        text += home->array_of_tables ? "[[" + name + "]]" : "[" + name + "]";
        if (near) text += ")";
    }
    return text + "; known keys: " + join_names(spec.key_names());
}

std::string where(const std::string& source, const toml::node& node) {
    const toml::source_region& region = node.source();
    if (region.path && *region.path != source) return *region.path;  // "--set ARG"
    if (region.begin.line > 0) return source + ":" + std::to_string(region.begin.line);
    return source;
}

std::string value_text(const toml::node& node) {
    if (const auto* s = node.as_string()) return quote_for_message(s->get(), max_value_chars);
    std::string text = render(node);
    if (text.size() > max_value_chars) text = text.substr(0, max_value_chars) + "...";
    return text;
}

std::string type_phrase(const toml::node& node) {
    switch (node.type()) {
        case toml::node_type::string: return "a string";
        case toml::node_type::integer: return "an integer";
        case toml::node_type::floating_point: return "a float";
        case toml::node_type::boolean: return "a boolean";
        case toml::node_type::array: return "an array";
        case toml::node_type::table: return "a table";
        case toml::node_type::date: return "a date";
        case toml::node_type::time: return "a time";
        case toml::node_type::date_time: return "a date-time";
        case toml::node_type::none: break;
    }
    return "nothing";
}

void fail(const std::string& source, const toml::node& at, std::string_view section, std::string_view key,
          const toml::node* value, std::string_view what) {
    std::string message = where(source, at) + ": [" + std::string(section) + "]";
    if (!key.empty()) message += " " + std::string(key);
    if (value) message += " = " + value_text(*value);
    throw InputError(message + ": " + std::string(what));
}

void check_value(const std::string& source, std::string_view section, std::string_view key, const KeySpec& spec,
                 const toml::node& value) {
    const auto bad = [&](const std::string& what) { fail(source, value, section, key, &value, what); };
    switch (spec.kind) {
        case ValueKind::number: {
            if (value.is_table() && spec.uncertain) {
                check_distribution(source, section, key, spec, *value.as_table());
                return;
            }
            if (value.is_table() && key.find("ions.") == 0)
                bad("must be a number: a distribution on one ion would break electroneutrality; put the "
                    "uncertainty on [electrolyte] concentration_mM with salt = \"...\" instead");
            if (value.is_table())
                bad(std::string("must be a number, not a table (distributions ") + distribution_forms() +
                    " are allowed on the particle keys radius_nm, hamaker_J and surface_potential_mV, on "
                    "[suspension] keys, on [medium] viscosity_mPa_s and relative_permittivity and on "
                    "[electrolyte] concentration_mM)");
            if (!value.is_number()) bad("must be a number, not " + type_phrase(value));
            const double v = as_double(value);
            if (!std::isfinite(v)) bad("must be a finite number");
            if (!in_range(spec, v)) bad("must be " + range_text(spec));
            return;
        }
        case ValueKind::integer: {
            if (!value.is_integer()) bad("must be an integer, not " + type_phrase(value));
            const auto v = value.as_integer()->get();
            if ((spec.nonzero && v == 0) || !in_range(spec, static_cast<double>(v)))
                bad(std::string(spec.nonzero ? "must be a non-zero integer " : "must be an integer ") + range_text(spec));
            return;
        }
        case ValueKind::boolean:
            if (!value.is_boolean()) bad("must be true or false, not " + type_phrase(value));
            return;
        case ValueKind::text: {
            if (!value.is_string()) bad("must be a string, not " + type_phrase(value));
            const std::string& s = value.as_string()->get();
            if (s.empty()) bad("must not be empty");
            // Names end up in text reports, CSV headers and JSON: no line breaks or tabs.
            if (std::any_of(s.begin(), s.end(), [](char c) { return static_cast<unsigned char>(c) < 0x20 || c == 0x7F; }))
                bad("must not contain control characters (tabs, line breaks)");
            return;
        }
        case ValueKind::choice: {
            if (!value.is_string()) bad("must be one of " + choices_text(spec) + ", not " + type_phrase(value));
            const std::string& s = value.as_string()->get();
            if (std::find(spec.choices.begin(), spec.choices.end(), s) != spec.choices.end()) return;
            std::string what = "must be one of " + choices_text(spec);
            if (const auto near = nearest_name(s, spec.choices)) what += "; did you mean \"" + std::string(*near) + "\"?";
            bad(what);
            return;
        }
        case ValueKind::salt_formula: {
            if (!value.is_string()) bad("must be a salt formula such as \"NaCl\", not " + type_phrase(value));
            try {
                (void)potentials::parse_salt_formula(value.as_string()->get());
            } catch (const InputError& e) {
                // Its message names the formula (unescaped) but not the file and line.
                bad(printable_message(e.what()));
            }
            return;
        }
        case ValueKind::number_list: {
            std::string allowed = "must be an array of ";
            if (spec.min_items == spec.max_items) {
                allowed += std::to_string(spec.min_items);
            } else {
                allowed += std::to_string(spec.min_items);
                allowed += " to ";
                allowed += std::to_string(spec.max_items);
            }
            allowed += " numbers";
            if (spec.min || spec.max) allowed += ", each " + range_text(spec);
            if (!value.is_array()) bad(allowed + ", not " + type_phrase(value));
            const toml::array& array = *value.as_array();
            if (array.size() < spec.min_items || array.size() > spec.max_items)
                bad(allowed + "; it holds " + std::to_string(array.size()));
            // Each element is checked as a number with the list's bounds and named by its
            // place, counted from 1 as [[species]] and ions are: "temperatures_C[2]".
            KeySpec element_spec = spec;
            element_spec.kind = ValueKind::number;
            for (std::size_t i = 0; i < array.size(); ++i) {
                std::string element_key(key);
                element_key += '[';
                element_key += std::to_string(i + 1);
                element_key += ']';
                check_value(source, section, element_key, element_spec, array[i]);
            }
            return;
        }
        case ValueKind::choice_list: {
            const std::string allowed = "must be an array of distinct names out of " + choices_text(spec);
            if (!value.is_array()) bad(allowed + ", not " + type_phrase(value));
            const toml::array& array = *value.as_array();
            if (array.empty()) bad(allowed + "; it is empty");
            std::vector<std::string> seen;
            for (const toml::node& element : array) {
                const std::string* name = element.is_string() ? &element.as_string()->get() : nullptr;
                if (!name || std::find(spec.choices.begin(), spec.choices.end(), *name) == spec.choices.end())
                    bad(allowed + "; " + value_text(element) + " is not one of them");
                if (std::find(seen.begin(), seen.end(), *name) != seen.end())
                    bad(allowed + "; " + value_text(element) + " is given twice");
                seen.push_back(*name);
            }
            return;
        }
        case ValueKind::point_list:
            if (!value.is_array())
                bad("must be an array of tables such as [{ concentration_mM = 50, stability_ratio = 120 }], not " +
                    type_phrase(value));
            return;
        case ValueKind::ion_list:
            if (!value.is_array())
                bad("must be an array of tables such as [{ valence = 1, concentration_mM = 10 }, "
                    "{ valence = -1, concentration_mM = 10 }], not " + type_phrase(value));
            return;
    }
}

void check_table(const std::string& source, const SectionSpec& spec, std::string_view section,
                 const toml::table& table, std::string_view key_prefix) {
    const auto entries = entries_in_source_order(source, table);
    const auto shown = [&](std::string_view key) { return std::string(key_prefix) + key_text(key); };
    for (const auto& group : spec.alternatives) {
        std::vector<std::pair<std::string_view, const toml::node*>> present;
        for (const auto& entry : entries)
            if (std::find(group.begin(), group.end(), entry.first) != group.end()) present.push_back(entry);
        if (present.size() < 2) continue;
        const auto& [first_key, first] = present[0];
        const auto& [second_key, second] = present[1];
        fail(source, *second, section, shown(second_key), second,
             "conflicts with " + shown(first_key) + " = " + value_text(*first) + " at " + where(source, *first) +
                 "; give only one of " + join_names(group, " | "));
    }
    for (const auto& [key, node] : entries) {
        const KeySpec* key_spec = spec.find(key);
        if (!key_spec) fail(source, *node, section, shown(key), node, unknown_key_text(spec, key, key_prefix.empty()));
        check_value(source, section, shown(key), *key_spec, *node);
    }
}

void require(const std::string& source, const toml::table& table, std::string_view section, std::string_view key,
             std::string_view when) {
    if (table.contains(key)) return;
    fail(source, table, section, key, nullptr,
         when.empty() ? std::string("missing (required)") : "missing (required " + std::string(when) + ")");
}

std::vector<std::pair<std::string_view, const toml::node*>> entries_in_source_order(const std::string& source,
                                                                                    const toml::table& table) {
    using Entry = std::tuple<bool, toml::source_index, toml::source_index, std::string_view, const toml::node*>;
    std::vector<Entry> sorted;
    for (auto&& [key, node] : table) {
        const toml::source_region& r = node.source();
        const bool from_set = r.path && *r.path != source;
        sorted.emplace_back(from_set, r.begin.line, r.begin.column, std::string_view(key.str()), &node);
    }
    std::stable_sort(sorted.begin(), sorted.end(), [](const Entry& a, const Entry& b) {
        return std::tie(std::get<0>(a), std::get<1>(a), std::get<2>(a)) <
               std::tie(std::get<0>(b), std::get<1>(b), std::get<2>(b));
    });
    std::vector<std::pair<std::string_view, const toml::node*>> out;
    for (const auto& e : sorted) out.emplace_back(std::get<3>(e), std::get<4>(e));
    return out;
}

std::optional<double> number_at(const toml::table& table, std::string_view key) {
    const toml::node* node = table.get(key);
    if (!node) return std::nullopt;
    // A distribution stands for its median (scenario_distribution.hpp).
    if (node->is_table()) return distribution_at(*node).quantile(0.5);
    return as_double(*node);
}

std::optional<std::int64_t> integer_at(const toml::table& table, std::string_view key) {
    const toml::node* node = table.get(key);
    return node ? std::optional<std::int64_t>(node->as_integer()->get()) : std::nullopt;
}

std::optional<bool> boolean_at(const toml::table& table, std::string_view key) {
    const toml::node* node = table.get(key);
    return node ? std::optional<bool>(node->as_boolean()->get()) : std::nullopt;
}

std::optional<std::vector<double>> numbers_at(const toml::table& table, std::string_view key) {
    const toml::node* node = table.get(key);
    if (!node) return std::nullopt;
    std::vector<double> values;
    for (const toml::node& element : *node->as_array()) values.push_back(as_double(element));
    return values;
}

std::optional<std::string> string_at(const toml::table& table, std::string_view key) {
    const toml::node* node = table.get(key);
    return node ? std::optional<std::string>(node->as_string()->get()) : std::nullopt;
}

}  // namespace brownfloc::sim::detail
