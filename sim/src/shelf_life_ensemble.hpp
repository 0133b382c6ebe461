#pragma once
// The ensemble behind the shelf-life margins, CCC percentiles and plot band (private to
// brownfloc::sim): the first band_samples Monte Carlo samples, or the point scenario alone;
// percentiles of the time over it with salt added, the margin root, and the barrier CCC with
// the surface held as the estimate holds it.
#include <functional>
#include <string>
#include <vector>

#include "sim/scenario.hpp"
#include "sim/shelf_life_report.hpp"
#include "sim/storage_conditions.hpp"

namespace brownfloc::sim::detail {

// Every sample of the band (the first band_samples of the Monte Carlo), or the point
// scenario alone when no input varies; with the quadrature that goes with each.
struct Ensemble {
    std::vector<Scenario> members;
    WQuadrature quadrature = WQuadrature::careful;
};

// The scenario with `added_mM` of `formula` on top of its ions (as an ion list).
[[nodiscard]] Scenario with_added_salt(const Scenario& s, const std::string& formula, double added_mM);
// The scenario at concentration c_mM of its varied salt: the titrant added on top, or the
// [electrolyte] salt at that concentration.
[[nodiscard]] Scenario at_varied_salt(const Scenario& s, double c_mM);
// Time to the criterion [s] from log10 tau; +inf when it overflows.
[[nodiscard]] double time_from_log10_tau(double log10_tau, const ShelfLifeReport& r);
// The time at one temperature of every member with `change` applied (salt added), ascending,
// ready for uncertainty::percentile; the charge reference of each member is the member itself.
[[nodiscard]] std::vector<double> ensemble_times(const Ensemble& e, double temperature_K, const ShelfLifeReport& r,
                                                 bool hydrodynamic,
                                                 const std::function<Scenario(const Scenario&)>& change);
// The added salt at which the p-th percentile of the time falls to the target (see the .cpp).
[[nodiscard]] SaltMargin margin_for(const Ensemble& e, const std::string& formula, double temperature_K, double p,
                                    double time_now_s, const ShelfLifeReport& r, bool hydrodynamic);
// The barrier CCC [mM] of a scenario at one storage temperature (0: no barrier even at 1 uM;
// +inf: every barrier survives 5 M).
[[nodiscard]] double ccc_at_temperature(const Scenario& m, double temperature_K, const ShelfLifeReport& r);
// The barrier CCC of the varied salt for each member at one temperature, ascending.
[[nodiscard]] std::vector<double> ensemble_cccs(const Ensemble& e, double temperature_K, const ShelfLifeReport& r);

}  // namespace brownfloc::sim::detail
