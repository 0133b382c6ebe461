// The Monte Carlo inputs of a scenario: a fixed index per value that may be uncertain, and
// the setter that puts a drawn value in its place.
#include "sim/scenario.hpp"

namespace brownfloc::sim {

std::uint32_t input_index_of(InputSlot slot, int species) {
    const auto s = static_cast<std::uint32_t>(species);
    switch (slot) {
        case InputSlot::radius_nm: return 3 * s;
        case InputSlot::hamaker_J: return 3 * s + 1;
        case InputSlot::surface_potential_mV: return 3 * s + 2;
        case InputSlot::volume_fraction: return 64;
        case InputSlot::number_density_per_m3: return 65;
        case InputSlot::mass_fraction: return 66;
        case InputSlot::particle_density_kg_per_m3: return 67;
        case InputSlot::viscosity_mPa_s: return 80;
        case InputSlot::relative_permittivity: return 81;
        case InputSlot::salt_concentration_mM: return 96;
    }
    return 127;  // unreachable: every slot is listed above
}

void set_input(Scenario& scenario, InputSlot slot, int species, double value) {
    switch (slot) {
        case InputSlot::radius_nm: scenario.species.at(static_cast<std::size_t>(species)).radius_nm = value; return;
        case InputSlot::hamaker_J: scenario.species.at(static_cast<std::size_t>(species)).hamaker_J = value; return;
        case InputSlot::surface_potential_mV:
            scenario.species.at(static_cast<std::size_t>(species)).surface_potential_mV = value;
            return;
        case InputSlot::volume_fraction: scenario.volume_fraction = value; return;
        case InputSlot::number_density_per_m3: scenario.number_density_per_m3 = value; return;
        case InputSlot::mass_fraction: scenario.mass_fraction = value; return;
        case InputSlot::particle_density_kg_per_m3: scenario.particle_density_kg_per_m3 = value; return;
        case InputSlot::viscosity_mPa_s: scenario.viscosity_mPa_s = value; return;
        case InputSlot::relative_permittivity: scenario.relative_permittivity = value; return;
        case InputSlot::salt_concentration_mM: scenario.salt_concentration_mM = value; return;
    }
}

}  // namespace brownfloc::sim
