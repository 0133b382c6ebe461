// [suspension], [medium], [electrolyte]: the conditions the particles are in.
#include <cmath>

#include "potentials/input_error.hpp"
#include "potentials/water.hpp"
#include "scenario_check.hpp"
#include "scenario_distribution.hpp"
#include "scenario_sections.hpp"
#include "scenario_text.hpp"

namespace brownfloc::sim::detail {
namespace {

const toml::table* section_table(const toml::table& root, std::string_view name) {
    const toml::node* node = root.get(name);
    return node ? node->as_table() : nullptr;
}

void read_suspension(const std::string& source, const toml::table& root, Scenario& scenario) {
    const toml::table* table = section_table(root, "suspension");
    if (!table) return;  // optional: without it half-lives are not computed
    scenario.volume_fraction = number_at(*table, "volume_fraction");
    scenario.number_density_per_m3 = number_at(*table, "number_density_per_m3");
    scenario.mass_fraction = number_at(*table, "mass_fraction");
    scenario.particle_density_kg_per_m3 = number_at(*table, "particle_density_kg_per_m3");
    if (scenario.mass_fraction) require(source, *table, "suspension", "particle_density_kg_per_m3", "with mass_fraction");
    note_uncertain(scenario, *table, "volume_fraction", InputSlot::volume_fraction, 0, "[suspension] volume_fraction");
    note_uncertain(scenario, *table, "number_density_per_m3", InputSlot::number_density_per_m3, 0,
                   "[suspension] number_density_per_m3");
    note_uncertain(scenario, *table, "mass_fraction", InputSlot::mass_fraction, 0, "[suspension] mass_fraction");
    note_uncertain(scenario, *table, "particle_density_kg_per_m3", InputSlot::particle_density_kg_per_m3, 0,
                   "[suspension] particle_density_kg_per_m3");
}

void read_medium(const std::string& source, const toml::table& root, Scenario& scenario) {
    static const toml::table empty;
    const toml::table* found = section_table(root, "medium");
    const toml::table& table = found ? *found : empty;
    const auto celsius = number_at(table, "temperature_C");
    const auto kelvin = number_at(table, "temperature_K");
    if (celsius) {
        scenario.temperature_K = *celsius + celsius_offset_K;
    } else if (kelvin) {
        scenario.temperature_K = *kelvin;
    } else {
        scenario.temperature_K = 25.0 + celsius_offset_K;
        note_default(scenario, "medium", "temperature_C", number_text(25.0));
    }
    scenario.viscosity_mPa_s = number_at(table, "viscosity_mPa_s");
    scenario.relative_permittivity = number_at(table, "relative_permittivity");
    note_uncertain(scenario, table, "viscosity_mPa_s", InputSlot::viscosity_mPa_s, 0, "[medium] viscosity_mPa_s");
    note_uncertain(scenario, table, "relative_permittivity", InputSlot::relative_permittivity, 0,
                   "[medium] relative_permittivity");
    if (scenario.viscosity_mPa_s && scenario.relative_permittivity) return;  // any T > 0 K then

    // Compared in the unit the user wrote, so that 0 degC and 100 degC are inside exactly.
    const double min_C = potentials::water_min_temperature_K - celsius_offset_K;
    const double max_C = potentials::water_max_temperature_K - celsius_offset_K;
    const bool inside = celsius ? (*celsius >= min_C && *celsius <= max_C)
                                : (scenario.temperature_K >= potentials::water_min_temperature_K &&
                                   scenario.temperature_K <= potentials::water_max_temperature_K);
    if (inside) return;
    const std::string_view key = celsius ? "temperature_C" : "temperature_K";
    const toml::node& node = *table.get(key);
    fail(source, node, "medium", key, &node,
         "must be within " + bound_text(min_C) + "-" + bound_text(max_C) + " degC (" +
             bound_text(potentials::water_min_temperature_K) + "-" + bound_text(potentials::water_max_temperature_K) +
             " K), where the water viscosity and permittivity fits hold, unless both viscosity_mPa_s and "
             "relative_permittivity are given");
}

[[noreturn]] void zero_ionic_strength(const std::string& source, const toml::node& node, std::string_view key) {
    fail(source, node, "electrolyte", key, &node,
         "zero ionic strength: the Debye length is infinite; give a salt concentration > 0");
}

void read_ions(const std::string& source, const toml::array& ions, Scenario& scenario) {
    if (ions.empty()) fail(source, ions, "electrolyte", "ions", &ions, "must hold at least one ion");
    double net_charge_mM = 0.0, total_charge_mM = 0.0;
    for (std::size_t i = 0; i < ions.size(); ++i) {
        const std::string key = "ions." + std::to_string(i + 1);
        const toml::table* ion = ions[i].as_table();
        if (!ion)
            fail(source, ions[i], "electrolyte", key, &ions[i],
                 "must be a table such as { valence = 1, concentration_mM = 10 }, not " + type_phrase(ions[i]));
        check_table(source, ion_spec(), "electrolyte", *ion, key + ".");
        for (const std::string_view part : {"valence", "concentration_mM"})
            if (!ion->contains(part)) fail(source, *ion, "electrolyte", key + "." + std::string(part), nullptr, "missing (required)");
        IonSpec spec{static_cast<int>(*integer_at(*ion, "valence")), *number_at(*ion, "concentration_mM")};
        net_charge_mM += spec.valence * spec.concentration_mM;
        total_charge_mM += std::abs(spec.valence) * spec.concentration_mM;
        scenario.ions.push_back(spec);
    }
    if (total_charge_mM == 0.0) zero_ionic_strength(source, ions, "ions");
    if (std::abs(net_charge_mM) > electroneutrality_tolerance * total_charge_mM)
        fail(source, ions, "electrolyte", "ions", &ions,
             "not electroneutral: the net charge sum(z c) is " + bound_text(net_charge_mM) +
                 " mM; the positive and negative charges must balance (to 1e-9 relative)");
}

void read_electrolyte(const std::string& source, const toml::table& root, Scenario& scenario) {
    const toml::table* table = section_table(root, "electrolyte");
    if (!table)
        throw InputError(source + ": [electrolyte]: missing (required): the Debye length needs it; give "
                                  "salt = \"NaCl\" with concentration_mM, or ions = [{ valence = 1, "
                                  "concentration_mM = 10 }, { valence = -1, concentration_mM = 10 }]");
    const toml::node* salt = table->get("salt");
    const toml::node* ions = table->get("ions");
    const toml::node* concentration = table->get("concentration_mM");
    if (!salt && !ions)
        fail(source, *table, "electrolyte", "", nullptr, "give salt (with concentration_mM) or ions");
    if (concentration && !salt)
        fail(source, *concentration, "electrolyte", "concentration_mM", concentration,
             "goes only with salt; with ions, each ion has its own concentration_mM");
    if (salt) {
        require(source, *table, "electrolyte", "concentration_mM", "with salt");
        scenario.salt = string_at(*table, "salt");
        scenario.salt_concentration_mM = *number_at(*table, "concentration_mM");
        note_uncertain(scenario, *table, "concentration_mM", InputSlot::salt_concentration_mM, 0,
                       "[electrolyte] concentration_mM");
        if (scenario.salt_concentration_mM == 0.0) zero_ionic_strength(source, *concentration, "concentration_mM");
    } else {
        read_ions(source, *ions->as_array(), scenario);
    }
    scenario.titrant = string_at(*table, "titrant");
}

}  // namespace

void read_conditions(const std::string& source, const toml::table& root, Scenario& scenario) {
    read_suspension(source, root, scenario);
    read_medium(source, root, scenario);
    read_electrolyte(source, root, scenario);
}

}  // namespace brownfloc::sim::detail
