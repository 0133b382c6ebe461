#pragma once
// The dispersion at each storage temperature, for the shelf-life estimator: water properties
// at that temperature, the surface potentials (held fixed, or re-solved from a surface charge
// held fixed via the Grahame equation), the stability ratio and the slow-aggregation time
// scale tau = W t1/2, and how much faster than at the reference temperature it aggregates,
// split into the part from T/eta and the part from W.
//
// Kinetics (Smoluchowski 1917 with Fuchs's W; PHYSICS.md "Kinetics and stability"): with
// several species the rate is the number-fraction mean of k_ij / W_ij (k_ij the fast rate of
// the pair, no 1/2 for i != j counted twice), and tau = 2 / (k_eff n0), which for one species
// is W * 3 eta / (4 kT n0). W is the hydrodynamic one (Honig et al. 1971 drainage) when
// asked, as `brownfloc dlvo` reports it in stability_ratio_hydrodynamic.
#include <vector>

#include "potentials/medium.hpp"
#include "sim/scenario.hpp"

namespace brownfloc::sim {

enum class SurfaceHold {
    potential,  // each species' surface potential is the same at every temperature
    charge,     // each species' surface charge density (from its potential at the scenario's own
                // temperature, Grahame 1947) is the same; the potential follows
};

// Which quadrature gives W: the careful adaptive one (relative error ~1e-9), or the fast one
// of potentials/fast_stability_ratio.hpp (checked to 1e-3 in ln W on 100 drawn pairs; ~15
// times faster), which the Monte Carlo uses.
enum class WQuadrature { careful, fast };

struct StorageCondition {
    double temperature_K = 0;
    potentials::Medium medium;
    std::vector<double> surface_potential_mV;  // per species, at this temperature
    double debye_length_nm = 0;
    double log10_stability_ratio = 0;          // of the mean kernel: log10(k_fast_eff / k_eff)
    double half_life_fast_s = 0;               // 2 / (k_fast_eff n0)
    double log10_tau_s = 0;                    // tau = 2 / (k_eff n0), kept in log10 (W may be huge)
    // Relative to the first condition: tau_ref / tau = medium_part * stability_part.
    double acceleration_vs_reference = 1;
    double acceleration_from_medium = 1;       // (T / eta) / (T_ref / eta_ref)
    double acceleration_from_stability = 1;    // W_ref / W (all else in k_eff)
    double rule_of_thumb_factor = 1;           // 2^((T - T_ref) / 10 K), for comparison only
};

// One condition per temperature (kelvin), the first being the reference. The scenario must
// have [suspension]. A viscosity or permittivity override in [medium] holds at one
// temperature only: with more than one temperature it is an InputError naming the key.
// Throws InputError when a charge cannot be held (no ions).
[[nodiscard]] std::vector<StorageCondition> storage_conditions(const Scenario& scenario,
                                                               const std::vector<double>& temperatures_K,
                                                               SurfaceHold hold, bool hydrodynamic_correction);

// The same for a changed electrolyte (salt added for a margin) while the surface charge, when
// held, stays the one `charge_reference` has at its own temperature and electrolyte: added
// salt lowers the potential of a surface whose charge is fixed.
[[nodiscard]] std::vector<StorageCondition> storage_conditions(const Scenario& scenario,
                                                               const std::vector<double>& temperatures_K,
                                                               SurfaceHold hold, bool hydrodynamic_correction,
                                                               const Scenario& charge_reference,
                                                               WQuadrature quadrature = WQuadrature::careful);

// The sentence that goes with rule_of_thumb_factor wherever it is shown.
[[nodiscard]] const char* rule_of_thumb_caution();

}  // namespace brownfloc::sim
