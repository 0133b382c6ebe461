#include "sim/scenario_physics.hpp"

#include <cmath>
#include <cstdio>

#include "potentials/constants.hpp"
#include "potentials/input_error.hpp"
#include "potentials/water.hpp"

namespace brownfloc::sim {

using namespace brownfloc::potentials;

Medium medium_of(const Scenario& scenario) {
    Medium medium{scenario.temperature_K, 0.0, 0.0};
    const bool in_water_range = scenario.temperature_K >= water_min_temperature_K &&
                                scenario.temperature_K <= water_max_temperature_K;
    // The parser refuses temperatures outside liquid water unless both overrides are given.
    medium.viscosity_Pa_s = scenario.viscosity_mPa_s ? *scenario.viscosity_mPa_s * 1e-3
                                                     : (in_water_range ? water_viscosity_Pa_s(scenario.temperature_K) : 0.0);
    medium.relative_permittivity = scenario.relative_permittivity
                                       ? *scenario.relative_permittivity
                                       : (in_water_range ? water_relative_permittivity(scenario.temperature_K) : 0.0);
    return medium;
}

Electrolyte electrolyte_of(const Scenario& scenario) {
    if (scenario.salt) return Electrolyte::from_salt(*scenario.salt, scenario.salt_concentration_mM);
    std::vector<Ion> ions;
    for (const IonSpec& ion : scenario.ions) ions.push_back({ion.valence, ion.concentration_mM});
    return Electrolyte::from_ions(std::move(ions));
}

std::string varied_salt_name(const Scenario& scenario) {
    if (scenario.titrant) return *scenario.titrant;
    if (scenario.salt) return *scenario.salt;
    throw InputError(scenario.source + ": [electrolyte]: the CCC varies a salt, but ions are given without a "
                     "titrant; add titrant = \"NaCl\" (or another formula) or give salt = ... instead of ions");
}

Electrolyte electrolyte_with_varied_salt(const Scenario& scenario, double concentration_mM) {
    const Electrolyte varied = Electrolyte::from_salt(varied_salt_name(scenario), concentration_mM);
    return scenario.titrant ? electrolyte_of(scenario).plus(varied) : varied;
}

Electrolyte electrolyte_with_symmetric_salt(const Scenario& scenario, int valence, double concentration_mM) {
    (void)varied_salt_name(scenario);  // same precondition as the varied salt
    const Electrolyte salt = Electrolyte::symmetric(valence, concentration_mM);
    return scenario.titrant ? electrolyte_of(scenario).plus(salt) : salt;
}

PairModel pair_model(const Scenario& scenario, std::size_t i, std::size_t j) {
    const SpeciesSpec& a = scenario.species.at(i);
    const SpeciesSpec& b = scenario.species.at(j);
    PairModel model;
    model.radius1_m = a.radius_nm * 1e-9;
    model.radius2_m = b.radius_nm * 1e-9;
    // Combining rule for unlike particles across a medium: A_12 ~ sqrt(A_11 A_22)
    // A_132 ~ sqrt(A_131 A_232) (Israelachvili 2011, Intermolecular and Surface Forces,
    // 3rd ed., ch. 13 [memory for the equation number]). Exact for identical species.
    model.hamaker_J = std::sqrt(a.hamaker_J * b.hamaker_J);
    model.surface_potential1_V = a.surface_potential_mV * 1e-3;
    model.surface_potential2_V = b.surface_potential_mV * 1e-3;
    model.vdw = scenario.retarded_vdw ? VdwForm::gregory_retarded : VdwForm::hamaker_full;
    model.double_layer = scenario.double_layer;
    return model;
}

double min_gap_m(const Scenario& scenario) { return scenario.min_gap_nm * 1e-9; }

double mean_cubed_radius_m3(const SpeciesSpec& species) {
    const double a = species.radius_nm * 1e-9, sigma = species.radius_spread;
    if (sigma == 0.0) return a * a * a;
    // E[exp(3 sigma Z) | |Z| <= 3] = exp(9 sigma^2 / 2) [Phi(3 - 3 sigma) - Phi(-3 - 3 sigma)] / [Phi(3) - Phi(-3)].
    auto Phi = [](double x) { return 0.5 * std::erfc(-x / std::sqrt(2.0)); };
    const double truncated = (Phi(3.0 - 3.0 * sigma) - Phi(-3.0 - 3.0 * sigma)) / (Phi(3.0) - Phi(-3.0));
    return a * a * a * std::exp(4.5 * sigma * sigma) * truncated;
}

std::optional<double> volume_fraction_of(const Scenario& scenario) {
    if (scenario.volume_fraction) return scenario.volume_fraction;
    if (!scenario.mass_fraction || !scenario.particle_density_kg_per_m3) return std::nullopt;
    const double w = *scenario.mass_fraction;
    const double particle_m3_per_kg = w / *scenario.particle_density_kg_per_m3;
    const double medium_m3_per_kg = (1 - w) / potentials::water_density_kg_per_m3(scenario.temperature_K);
    return particle_m3_per_kg / (particle_m3_per_kg + medium_m3_per_kg);
}

std::optional<double> number_density_per_m3(const Scenario& scenario) {
    if (scenario.number_density_per_m3) return scenario.number_density_per_m3;
    const std::optional<double> phi = volume_fraction_of(scenario);
    if (!phi) return std::nullopt;
    double mean_volume_m3 = 0.0;
    for (const SpeciesSpec& s : scenario.species)
        mean_volume_m3 += s.number_fraction * 4.0 / 3.0 * constants::pi * mean_cubed_radius_m3(s);
    return *phi / mean_volume_m3;
}

std::optional<std::string> medians_used_warning(const Scenario& scenario) {
    if (scenario.uncertain_inputs.empty()) return std::nullopt;
    std::string text = "values given as distributions are taken at their medians here (";
    for (std::size_t i = 0; i < scenario.uncertain_inputs.size(); ++i) {
        const UncertainInput& u = scenario.uncertain_inputs[i];
        if (i) text += "; ";
        text += u.key;
        text += " = ";
        text += u.distribution.text();
        text += ": ";
        char median[32];
        std::snprintf(median, sizeof median, "%.6g", u.distribution.quantile(0.5));
        text += median;
    }
    text += "); `brownfloc shelf-life` carries their uncertainty through";
    return text;
}

}  // namespace brownfloc::sim
