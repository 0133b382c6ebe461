#include "sim/storage_conditions.hpp"

#include <cmath>
#include <limits>

#include "potentials/fast_stability_ratio.hpp"
#include "potentials/grahame.hpp"
#include "potentials/input_error.hpp"
#include "potentials/kinetics.hpp"
#include "potentials/pair_interaction.hpp"
#include "potentials/stability_ratio.hpp"
#include "sim/scenario_physics.hpp"

namespace brownfloc::sim {

namespace {

constexpr double ln10 = 2.302585092994046;

// log(sum_k exp(x_k)) without overflow.
double log_sum_exp(const std::vector<double>& x) {
    double top = -std::numeric_limits<double>::infinity();
    for (double v : x) top = std::max(top, v);
    if (!std::isfinite(top)) return top;
    double sum = 0;
    for (double v : x) sum += std::exp(v - top);
    return top + std::log(sum);
}

// The [storage] per-temperature viscosity and permittivity, when given, at the storage
// temperature they belong to (matched to 1e-9 K: the temperatures come from the same list).
void apply_storage_medium(Scenario& at, double temperature_K) {
    const StorageSettings& st = at.storage;
    for (std::size_t k = 0; k < st.temperatures_C.size(); ++k) {
        if (std::abs(st.temperatures_C[k] + 273.15 - temperature_K) > 1e-9) continue;
        if (st.viscosities_mPa_s) at.viscosity_mPa_s = (*st.viscosities_mPa_s)[k];
        if (st.relative_permittivities) at.relative_permittivity = (*st.relative_permittivities)[k];
        return;
    }
}

}  // namespace

const char* rule_of_thumb_caution() {
    return "This factor covers only the physics in the model; do not use it to turn accelerated-test results "
           "into a shelf life.";
}

std::vector<StorageCondition> storage_conditions(const Scenario& scenario, const std::vector<double>& temperatures_K,
                                                 SurfaceHold hold, bool hydrodynamic_correction) {
    return storage_conditions(scenario, temperatures_K, hold, hydrodynamic_correction, scenario);
}

std::vector<StorageCondition> storage_conditions(const Scenario& scenario, const std::vector<double>& temperatures_K,
                                                 SurfaceHold hold, bool hydrodynamic_correction,
                                                 const Scenario& charge_reference, WQuadrature quadrature) {
    if (temperatures_K.empty()) throw InputError(scenario.source + ": [storage] temperatures_C: at least one is needed");
    const StorageSettings& st = scenario.storage;
    if (temperatures_K.size() > 1) {
        if (scenario.viscosity_mPa_s && !st.viscosities_mPa_s)
            throw InputError(scenario.source + ": [medium] viscosity_mPa_s: a fixed viscosity holds at one temperature "
                             "only; remove it (water's viscosity is then computed at each storage temperature) or "
                             "give one storage temperature, or [storage] viscosities_mPa_s, one per temperature");
        if (scenario.relative_permittivity && !st.relative_permittivities)
            throw InputError(scenario.source + ": [medium] relative_permittivity: a fixed permittivity holds at one "
                             "temperature only; remove it, give one storage temperature, or give [storage] "
                             "relative_permittivities, one per temperature");
    }
    const std::optional<double> n0 = number_density_per_m3(scenario);
    if (!n0) throw InputError(scenario.source + ": [suspension]: shelf-life estimates need volume_fraction or "
                              "number_density_per_m3");
    const potentials::Electrolyte electrolyte = electrolyte_of(scenario);
    const std::size_t species = scenario.species.size();

    // Surface charge densities at the reference's own temperature and electrolyte, where the
    // potentials were given.
    std::vector<double> charge_C_per_m2(species, 0.0);
    if (hold == SurfaceHold::charge) {
        const potentials::Medium own = medium_of(charge_reference);
        const potentials::Electrolyte own_ions = electrolyte_of(charge_reference);
        for (std::size_t s = 0; s < species; ++s)
            charge_C_per_m2[s] = potentials::grahame_surface_charge_C_per_m2(
                charge_reference.species[s].surface_potential_mV * 1e-3, own_ions, own);
    }

    std::vector<StorageCondition> out;
    for (double temperature_K : temperatures_K) {
        Scenario at = scenario;
        at.temperature_K = temperature_K;
        apply_storage_medium(at, temperature_K);
        StorageCondition c;
        c.temperature_K = temperature_K;
        c.medium = medium_of(at);
        for (std::size_t s = 0; s < species; ++s) {
            if (hold == SurfaceHold::charge)
                at.species[s].surface_potential_mV =
                    potentials::grahame_surface_potential_V(charge_C_per_m2[s], electrolyte, c.medium) * 1e3;
            c.surface_potential_mV.push_back(at.species[s].surface_potential_mV);
        }
        c.debye_length_nm = electrolyte.debye_length_m(c.medium) * 1e9;
        // Mean kernel over species pairs, weighted by number fractions (ordered pairs).
        std::vector<double> log_terms, log_fast_terms;
        for (std::size_t i = 0; i < species; ++i)
            for (std::size_t j = 0; j < species; ++j) {
                const potentials::PairModel model = pair_model(at, i, j);
                const potentials::PairInteraction pair(model, c.medium, electrolyte);
                const double log_w =
                    quadrature == WQuadrature::fast
                        ? potentials::log_stability_ratio_fast(pair, min_gap_m(at), hydrodynamic_correction)
                        : potentials::log_stability_ratio(pair, min_gap_m(at), hydrodynamic_correction);
                const double weight = at.species[i].number_fraction * at.species[j].number_fraction;
                const double log_fast = std::log(weight * potentials::fast_rate_m3_per_s(
                                                              model.radius1_m, model.radius2_m, temperature_K,
                                                              c.medium.viscosity_Pa_s));
                log_fast_terms.push_back(log_fast);
                log_terms.push_back(log_fast - log_w);
            }
        const double log_k = log_sum_exp(log_terms), log_k_fast = log_sum_exp(log_fast_terms);
        c.log10_stability_ratio = (log_k_fast - log_k) / ln10;
        c.half_life_fast_s = 2.0 / (std::exp(log_k_fast) * *n0);
        c.log10_tau_s = (std::log(2.0 / *n0) - log_k) / ln10;
        out.push_back(std::move(c));
    }
    const StorageCondition& ref = out.front();
    for (StorageCondition& c : out) {
        c.acceleration_vs_reference = std::pow(10.0, ref.log10_tau_s - c.log10_tau_s);
        c.acceleration_from_medium = ref.half_life_fast_s / c.half_life_fast_s;
        c.acceleration_from_stability = std::pow(10.0, ref.log10_stability_ratio - c.log10_stability_ratio);
        c.rule_of_thumb_factor = std::pow(2.0, (c.temperature_K - ref.temperature_K) / 10.0);
    }
    return out;
}

}  // namespace brownfloc::sim
