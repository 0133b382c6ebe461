#pragma once
// The physical objects a validated Scenario stands for: the medium, the electrolyte, one
// pair model per species pair and the particle number density, in SI units.
#include <cstddef>
#include <optional>
#include <string>

#include "potentials/electrolyte.hpp"
#include "potentials/medium.hpp"
#include "potentials/pair_interaction.hpp"
#include "sim/scenario.hpp"

namespace brownfloc::sim {

// Water at the scenario temperature, with the viscosity / permittivity overrides applied.
[[nodiscard]] potentials::Medium medium_of(const Scenario& scenario);

// The electrolyte of [electrolyte] (salt at concentration_mM, or the ion list).
[[nodiscard]] potentials::Electrolyte electrolyte_of(const Scenario& scenario);

// The electrolyte in which the CCC varies a salt: the [electrolyte] ions plus `titrant` at
// concentration_mM when a titrant is given; otherwise `salt` alone at concentration_mM.
// Throws InputError when neither a titrant nor a salt formula names the varied salt.
[[nodiscard]] potentials::Electrolyte electrolyte_with_varied_salt(const Scenario& scenario,
                                                                   double concentration_mM);
// A symmetric z:z salt in place of the varied salt (the background ions stay when a titrant is given).
[[nodiscard]] potentials::Electrolyte electrolyte_with_symmetric_salt(const Scenario& scenario, int valence,
                                                                      double concentration_mM);
// The formula of the varied salt ("titrant" if given, else "salt").
[[nodiscard]] std::string varied_salt_name(const Scenario& scenario);

// The interaction model of species i and j (0-based) at their median radii.
[[nodiscard]] potentials::PairModel pair_model(const Scenario& scenario, std::size_t i, std::size_t j);

// min_gap_nm in metres.
[[nodiscard]] double min_gap_m(const Scenario& scenario);

// Mean of a^3 [m^3] for a log-normal radius with median radius_nm and sd radius_spread of
// ln a, truncated at +-3 sd (as the sampler draws it).
[[nodiscard]] double mean_cubed_radius_m3(const SpeciesSpec& species);

// Volume fraction of particles: volume_fraction, or from mass_fraction w and
// particle_density_kg_per_m3 rho_p as phi = (w / rho_p) / (w / rho_p + (1 - w) / rho_m), with
// the medium's density rho_m taken as water's at the scenario temperature (Tanaka et al.
// 2001); empty when neither is given.
[[nodiscard]] std::optional<double> volume_fraction_of(const Scenario& scenario);

// Total particle number density [1/m^3], from number_density_per_m3 or from the volume
// fraction (volume_fraction_of) and the number-weighted mean particle volume; empty without
// [suspension].
[[nodiscard]] std::optional<double> number_density_per_m3(const Scenario& scenario);

// For commands that take one value per key (dlvo, ccc): a warning listing the values given as
// distributions and the medians used in their place; empty when there are none.
[[nodiscard]] std::optional<std::string> medians_used_warning(const Scenario& scenario);

}  // namespace brownfloc::sim
