// [particle] / [[species]]: the particles of a scenario.
#include <cmath>

#include "potentials/input_error.hpp"
#include "scenario_check.hpp"
#include "scenario_distribution.hpp"
#include "scenario_sections.hpp"
#include "scenario_text.hpp"

namespace brownfloc::sim::detail {
namespace {

SpeciesSpec read_one(const std::string& source, const toml::table& table, const std::string& section,
                     std::string default_name, int index, Scenario& scenario) {
    for (const std::string_view key : {"radius_nm", "hamaker_J", "surface_potential_mV"})
        require(source, table, section, key);
    SpeciesSpec species;
    species.name = string_at(table, "name").value_or(std::move(default_name));
    species.radius_nm = *number_at(table, "radius_nm");
    species.hamaker_J = *number_at(table, "hamaker_J");
    species.surface_potential_mV = *number_at(table, "surface_potential_mV");
    for (const auto& [key, slot] : {std::pair<std::string_view, InputSlot>{"radius_nm", InputSlot::radius_nm},
                                    {"hamaker_J", InputSlot::hamaker_J},
                                    {"surface_potential_mV", InputSlot::surface_potential_mV}}) {
        std::string shown = "[";
        shown.append(section).append("] ").append(key);
        note_uncertain(scenario, table, key, slot, index, shown);
    }
    if (const auto spread = number_at(table, "radius_spread")) {
        species.radius_spread = *spread;
    } else {
        species.radius_spread = 0.0;
        note_default(scenario, section, "radius_spread", number_text(0.0));
    }
    return species;
}

void read_species_array(const std::string& source, const toml::array& array, Scenario& scenario) {
    if (array.empty()) fail(source, array, "species", "", nullptr, "needs at least one [[species]] table");
    if (array.size() > static_cast<std::size_t>(max_species))
        fail(source, array[max_species], "species." + std::to_string(max_species + 1), "", nullptr,
             "at most " + std::to_string(max_species) + " species are allowed");
    const bool several = array.size() > 1;
    double fraction_sum = 0.0;
    std::string fraction_terms;
    for (std::size_t i = 0; i < array.size(); ++i) {
        const toml::table& table = *array[i].as_table();
        const std::string section = "species." + std::to_string(i + 1);
        SpeciesSpec species = read_one(source, table, section, "species " + std::to_string(i + 1),
                                       static_cast<int>(i), scenario);
        if (several) require(source, table, section, "number_fraction", "when there is more than one species");
        if (const auto fraction = number_at(table, "number_fraction")) {
            species.number_fraction = *fraction;
        } else {
            species.number_fraction = 1.0;
            note_default(scenario, section, "number_fraction", number_text(1.0));
        }
        fraction_sum += species.number_fraction;  // fixed order: same sum on every machine
        fraction_terms += (i ? " + " : "") + number_text(species.number_fraction);
        scenario.species.push_back(std::move(species));
    }
    if (std::abs(fraction_sum - 1.0) > number_fraction_sum_tolerance)
        fail(source, array, "species", "number_fraction", nullptr,
             "the number fractions " + fraction_terms + " sum to " + number_text(fraction_sum) +
                 "; they must sum to 1 (within " + bound_text(number_fraction_sum_tolerance) + ")");
}

}  // namespace

void read_species(const std::string& source, const toml::table& root, Scenario& scenario) {
    const toml::node* particle = root.get("particle");
    const toml::node* species = root.get("species");
    if (particle && species)
        fail(source, *species, "species", "", nullptr,
             "both [[species]] and [particle] (at " + where(source, *particle) +
                 ") are given; give one: [particle] is the one-species shorthand of [[species]]");
    if (!particle && !species) throw InputError(source + ": a scenario needs [particle] or [[species]]");
    if (particle) {
        scenario.species.push_back(read_one(source, *particle->as_table(), "particle", "particle", 0, scenario));
        scenario.from_particle_table = true;
    } else {
        read_species_array(source, *species->as_array(), scenario);
        scenario.from_particle_table = false;
    }
}

}  // namespace brownfloc::sim::detail
