// load_scenario / parse_scenario: text checks, toml++ parsing, --set overrides, then the
// schema walk (scenario_check.cpp) and the section readers (scenario_sections.hpp).
#include <algorithm>
#include <cerrno>
#include <cstdio>
#include <cstring>
#include <filesystem>
#include <memory>

#include "potentials/input_error.hpp"
#include "scenario_check.hpp"
#include "scenario_sections.hpp"
#include "scenario_text.hpp"
#include "set_override.hpp"
#include "sim/scenario.hpp"

namespace brownfloc::sim {
namespace {

using namespace detail;

// A scenario is a short text file; anything larger is the wrong file (or /dev/zero), and
// reading it whole would only waste memory.
constexpr std::size_t max_scenario_bytes = 1 << 20;

struct FileCloser {
    void operator()(std::FILE* f) const { std::fclose(f); }
};

[[noreturn]] void unknown_top_level(const std::string& source, std::string_view name, const toml::node& node) {
    const std::vector<std::string_view> sections = section_names();
    std::string what;
    if (node.is_table() || node.is_array()) {
        what = where(source, node) + ": [" + key_text(name) + "]: unknown section";
        if (const auto near = nearest_name(name, sections)) what += "; did you mean [" + std::string(*near) + "]?";
    } else {
        what = where(source, node) + ": " + key_text(name) + " = " + value_text(node) + ": keys go inside a section";
        for (const SectionSpec& spec : scenario_sections())
            if (spec.find(name)) {
                what += "; did you mean " + key_text(name) + " under [" + std::string(spec.name) + "]?";
                break;
            }
    }
    throw InputError(what + "; known sections: " + join_names(sections));
}

// Every top-level entry is a known section of the right shape, and every key in it passes
// check_table; reported in file order so the first problem in the file comes first.
void check_sections(const std::string& source, const toml::table& root) {
    for (const auto& [name, node] : entries_in_source_order(source, root)) {
        const SectionSpec* spec = find_section(name);
        if (!spec) unknown_top_level(source, name, *node);
        const std::string section(spec->name);
        if (spec->array_of_tables) {
            const toml::array* array = node->as_array();
            if (!array || !std::all_of(array->begin(), array->end(), [](const toml::node& n) { return n.is_table(); }))
                fail(source, *node, section, "", nullptr,
                     "must be an array of tables: write a [[" + section + "]] header for each (or use [particle] "
                     "for a single kind of particle)");
            for (std::size_t i = 0; i < array->size(); ++i)
                check_table(source, *spec, section + "." + std::to_string(i + 1), *(*array)[i].as_table());
        } else {
            if (!node->is_table())
                throw InputError(where(source, *node) + ": " + section + " = " + value_text(*node) +
                                 ": must be a section: write [" + section + "] on a line of its own, then its keys");
            check_table(source, *spec, section, *node->as_table());
        }
    }
}

}  // namespace

Scenario parse_scenario(const std::string& text, const std::string& source_name,
                        const std::vector<std::string>& set_overrides) {
    // The name as shown in messages; toml++ stores it as each node's source path, which is
    // how where() tells file nodes from --set nodes.
    const std::string source = escape_for_message(source_name, 240);
    const std::string_view body = strip_byte_order_mark(text);
    if (const auto problem = find_text_problem(body))
        throw InputError(source + ":" + std::to_string(problem->line) + ":" + std::to_string(problem->column) + ": " +
                         problem->what);
    toml::table root;
    try {
        root = toml::parse(body, source);
    } catch (const toml::parse_error& e) {
        const auto line = e.source().begin.line;
        throw InputError(source + (line > 0 ? ":" + std::to_string(line) : std::string()) + ": " +
                         printable_message(e.description()));
    }
    for (const std::string& arg : set_overrides) apply_set_override(root, arg);

    check_sections(source, root);
    Scenario scenario;
    scenario.source = source_name;
    read_species(source, root, scenario);
    read_conditions(source, root, scenario);
    read_settings(source, root, scenario);
    return scenario;
}

Scenario load_scenario(const std::string& path, const std::vector<std::string>& set_overrides) {
    const std::string shown = escape_for_message(path, 240);
    std::error_code ec;
    if (std::filesystem::is_directory(path, ec))
        throw InputError(shown + ": cannot read the scenario file: it is a directory");
    const std::unique_ptr<std::FILE, FileCloser> file(std::fopen(path.c_str(), "rb"));
    if (!file) throw InputError(shown + ": cannot read the scenario file: " + std::strerror(errno));
    std::string text(max_scenario_bytes + 1, '\0');
    const std::size_t n = std::fread(text.data(), 1, text.size(), file.get());
    if (std::ferror(file.get())) throw InputError(shown + ": cannot read the scenario file: " + std::strerror(errno));
    if (n > max_scenario_bytes)
        throw InputError(shown + ": larger than " + std::to_string(max_scenario_bytes >> 20) +
                         " MiB; a scenario is a short TOML text file");
    text.resize(n);
    return parse_scenario(text, path, set_overrides);
}

}  // namespace brownfloc::sim
