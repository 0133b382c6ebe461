#pragma once
// The continuous medium between the particles: temperature, viscosity, permittivity.
// A value type; build it with water_at() and override fields as the scenario asks.
#include "potentials/constants.hpp"

namespace brownfloc::potentials {

struct Medium {
    double temperature_K = 298.15;
    double viscosity_Pa_s = 0.890e-3;
    double relative_permittivity = 78.30;

    [[nodiscard]] double thermal_energy_J() const { return constants::boltzmann_J_per_K * temperature_K; }
    [[nodiscard]] double permittivity_F_per_m() const {
        return constants::vacuum_permittivity_F_per_m * relative_permittivity;
    }
    // Thermal voltage kT/e [V].
    [[nodiscard]] double thermal_voltage_V() const {
        return thermal_energy_J() / constants::elementary_charge_C;
    }
};

// Water at temperature_K with viscosity and permittivity from the correlations in water.hpp.
[[nodiscard]] Medium water_at(double temperature_K);

}  // namespace brownfloc::potentials
