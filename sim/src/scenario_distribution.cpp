#include "scenario_distribution.hpp"

#include <algorithm>
#include <cmath>
#include <limits>

#include "potentials/input_error.hpp"
#include "scenario_check.hpp"
#include "scenario_text.hpp"
#include "uncertainty/physical_range.hpp"
#include "uncertainty/uncertainty_error.hpp"

namespace brownfloc::sim::detail {
namespace {

struct Form {
    std::string_view first, second;
};
constexpr Form forms[] = {{"mean", "sd"}, {"low", "high"}, {"median", "factor"}};

double number_of(const toml::node& node) {
    if (const auto* i = node.as_integer()) return static_cast<double>(i->get());
    return node.as_floating_point()->get();
}

uncertainty::Distribution make(const Form& form, double first, double second) {
    if (form.first == "mean") return uncertainty::Distribution::normal(first, second);
    if (form.first == "low") return uncertainty::Distribution::uniform(first, second);
    return uncertainty::Distribution::log_normal(first, second);
}

// The form whose two keys the table holds, exactly; nullptr otherwise.
const Form* form_of(const toml::table& table) {
    if (table.size() != 2) return nullptr;
    for (const Form& form : forms)
        if (table.contains(form.first) && table.contains(form.second)) return &form;
    return nullptr;
}

}  // namespace

const char* distribution_forms() { return "{ mean, sd }, { low, high } or { median, factor }"; }

void check_distribution(const std::string& source, std::string_view section, std::string_view key,
                        const KeySpec& spec, const toml::table& table) {
    const auto bad = [&](const std::string& what) { fail(source, table, section, key, &table, what); };
    const Form* form = form_of(table);
    if (!form)
        bad(std::string("a distribution must be one of ") + distribution_forms() +
            " (uncertainty about this one value), with exactly those two keys");
    const toml::node& first = *table.get(form->first);
    const toml::node& second = *table.get(form->second);
    for (const toml::node* part : {&first, &second})
        if (!part->is_number() || !std::isfinite(number_of(*part)))
            bad(std::string("the parameters of ") + distribution_forms() + " must be finite numbers");
    uncertainty::Distribution distribution = uncertainty::Distribution::point(0.0);
    try {
        distribution = make(*form, number_of(first), number_of(second));
    } catch (const uncertainty::UncertaintyError& error) {
        bad(printable_message(error.what()));
    }
    // The median stands for the value in every command but shelf-life: it obeys the key's range.
    const double median = distribution.quantile(0.5);
    const bool below = spec.min && (spec.min->inclusive ? median < spec.min->value : median <= spec.min->value);
    const bool above = spec.max && (spec.max->inclusive ? median > spec.max->value : median >= spec.max->value);
    if (below || above) {
        std::string what = "its median ";
        what += bound_text(median);
        what += " is outside the range of the key (";
        if (spec.min) what += std::string(spec.min->inclusive ? ">= " : "> ") + bound_text(spec.min->value);
        if (spec.min && spec.max) what += " and ";
        if (spec.max) what += std::string(spec.max->inclusive ? "<= " : "< ") + bound_text(spec.max->value);
        what += ")";
        bad(what);
    }
    const double inf = std::numeric_limits<double>::infinity();
    const double lower = spec.min ? spec.min->value : -inf;
    const double upper = spec.max ? spec.max->value : inf;
    // The key as the user wrote it, without a "species.2." style prefix, for the suggestion.
    const std::string_view bare = key.substr(key.rfind('.') == std::string_view::npos ? 0 : key.rfind('.') + 1);
    // The lower end first, with no upper end: that check suggests a log-normal where one fits.
    // The key and distribution that start its message are already in ours.
    const std::string prefix = std::string(bare) + " = " + distribution.text() + ": ";
    for (const double end : {inf, upper})
        if (auto problem = uncertainty::physical_range_problem(distribution, lower, end, bare)) {
            if (problem->rfind(prefix, 0) == 0) problem->erase(0, prefix.size());
            bad(*problem);
        }
}

uncertainty::Distribution distribution_at(const toml::node& value) {
    const toml::table* table = value.as_table();
    if (!table) return uncertainty::Distribution::point(number_of(value));
    const Form& form = *form_of(*table);
    return make(form, number_of(*table->get(form.first)), number_of(*table->get(form.second)));
}

void note_uncertain(Scenario& scenario, const toml::table& table, std::string_view key, InputSlot slot,
                    int species, const std::string& shown) {
    const toml::node* node = table.get(key);
    if (!node || !node->is_table()) return;
    UncertainInput input;
    input.slot = slot;
    input.species = species;
    input.key = shown;
    input.distribution = distribution_at(*node);
    input.input_index = input_index_of(slot, species);
    // Kept in input-index order: the Monte Carlo and the reports list them that way.
    const auto at = std::lower_bound(scenario.uncertain_inputs.begin(), scenario.uncertain_inputs.end(), input,
                                     [](const UncertainInput& a, const UncertainInput& b) {
                                         return a.input_index < b.input_index;
                                     });
    scenario.uncertain_inputs.insert(at, std::move(input));
}

}  // namespace brownfloc::sim::detail
