// The ensemble behind the shelf-life margins, CCC percentiles and plot band
// (shelf_life_ensemble.hpp).
#include "shelf_life_ensemble.hpp"
#include "shelf_life_format.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <exception>
#include <stdexcept>

#include "potentials/ccc.hpp"
#include "potentials/electrolyte.hpp"
#include "potentials/grahame.hpp"
#include "shelf_criteria/criterion_time.hpp"
#include "sim/scenario_physics.hpp"
#include "uncertainty/percentile.hpp"

namespace brownfloc::sim::detail {

// The scenario with `added_mM` of `formula` on top of its ions (as an ion list).
Scenario with_added_salt(const Scenario& s, const std::string& formula, double added_mM) {
    Scenario out = s;
    const potentials::Electrolyte mixed =
        electrolyte_of(s).plus(potentials::Electrolyte::from_salt(formula, added_mM));
    out.salt.reset();
    out.salt_concentration_mM = 0;
    out.titrant.reset();
    out.ions.clear();
    for (const potentials::Ion& ion : mixed.ions()) out.ions.push_back({ion.valence, ion.concentration_mol_per_m3});
    return out;
}

// Time to the criterion [s] from log10 tau; +inf when it overflows.
double time_from_log10_tau(double log10_tau, const ShelfLifeReport& r) {
    if (log10_tau > 300) return INFINITY;
    try {
        return shelf::time_to_criterion_s(r.criterion, std::pow(10.0, log10_tau), r.primary_radius_m);
    } catch (const std::range_error&) {
        return INFINITY;
    }
}



// value(member) for every member of the ensemble, in parallel (OpenMP), each in its own slot:
// the same bits at any thread count. The first error (by member) is rethrown after the loop,
// since exceptions must not leave an OpenMP region.
static std::vector<double> over_members(const Ensemble& e, const std::function<double(const Scenario&)>& value) {
    const std::size_t n = e.members.size();
    std::vector<double> out(n);
    std::vector<std::exception_ptr> errors(n);
#pragma omp parallel for schedule(dynamic, 4)
    for (std::size_t i = 0; i < n; ++i) {
        try {
            out[i] = value(e.members[i]);
        } catch (...) {
            errors[i] = std::current_exception();
        }
    }
    for (const std::exception_ptr& error : errors)
        if (error) std::rethrow_exception(error);
    return out;
}

std::vector<double> ensemble_times(const Ensemble& e, double temperature_K, const ShelfLifeReport& r,
                                   bool hydrodynamic, const std::function<Scenario(const Scenario&)>& change) {
    std::vector<double> times = over_members(e, [&](const Scenario& member) {
        const std::vector<StorageCondition> c =
            storage_conditions(change(member), {temperature_K}, r.hold, hydrodynamic, member, e.quadrature);
        return time_from_log10_tau(c.front().log10_tau_s, r);
    });
    std::sort(times.begin(), times.end());
    return times;
}

// The added salt at which the p-th percentile of the time falls to the target. The time falls
// as salt screens the double layer, so f(c) = ln(time_p(c) / target) falls through 0: a
// bracket by decades down from the most salt allowed, then regula falsi (Illinois variant,
// Dowell & Jarratt 1971, BIT 11, 168) in ln c, to |f| < 1e-4 (0.01 % in time).
SaltMargin margin_for(const Ensemble& e, const std::string& formula, double temperature_K, double p,
                      double time_now_s, const ShelfLifeReport& r, bool hydrodynamic) {
    SaltMargin margin;
    if (!(time_now_s > r.target_s)) {
        margin.reason = "already missed: without added salt the time is at or below the target";
        return margin;
    }
    const double room = std::max(max_total_salt_mM - electrolyte_of(e.members.front()).ionic_strength_mol_per_m3(), 1.0);
    const auto f = [&](double added_mM) {
        const double t = uncertainty::percentile(
            ensemble_times(e, temperature_K, r, hydrodynamic,
                           [&](const Scenario& s) { return with_added_salt(s, formula, added_mM); }),
            p);
        return std::isfinite(t) ? std::log(t / r.target_s) : 1e3;
    };
    double hi = room, f_hi = f(hi);
    if (f_hi > 0) {
        margin.reason = "never reached: even " + g4(room) + " mM of " + formula + " added leaves the time above the target";
        return margin;
    }
    double lo = hi / 10, f_lo = f(lo);
    while (f_lo <= 0 && lo > 1e-9) {
        hi = lo;
        f_hi = f_lo;
        lo /= 10;
        f_lo = f(lo);
    }
    if (f_lo <= 0) {
        margin.added_mM = lo;  // below 1e-9 mM: the target is missed with a trace of salt
        return margin;
    }
    double x_lo = std::log(lo), x_hi = std::log(hi);
    int side = 0;
    for (int k = 0; k < 100; ++k) {
        const double x = (x_lo * f_hi - x_hi * f_lo) / (f_hi - f_lo);
        const double fx = f(std::exp(x));
        if (std::abs(fx) < 1e-4 || x_hi - x_lo < 1e-12) {
            margin.added_mM = std::exp(x);
            return margin;
        }
        if (fx > 0) {
            x_lo = x;
            f_lo = fx;
            if (side == +1) f_hi /= 2;
            side = +1;
        } else {
            x_hi = x;
            f_hi = fx;
            if (side == -1) f_lo /= 2;
            side = -1;
        }
    }
    margin.added_mM = std::exp(0.5 * (x_lo + x_hi));
    return margin;
}

// The scenario at concentration c_mM of its varied salt: the titrant added on top, or the
// [electrolyte] salt at that concentration.
Scenario at_varied_salt(const Scenario& s, double c_mM) {
    if (s.titrant) return with_added_salt(s, *s.titrant, c_mM);
    Scenario out = s;
    out.salt_concentration_mM = c_mM;
    return out;
}

// The barrier CCC [mM] of the varied salt (Verwey & Overbeek 1948: the salt at which the
// highest maximum of U falls to 0 kT) for the pair that loses its barrier first, with the
// surface held as the estimate holds it: at a fixed charge the potentials fall as the salt
// rises (Grahame 1947), which brings the CCC down. 0 when no pair has a barrier even at 1 uM;
// +inf when every barrier survives 5 M.
static double barrier_ccc_mM(const Scenario& s, SurfaceHold hold) {
    const potentials::Medium medium = medium_of(s);
    std::vector<double> charge_C_per_m2;
    if (hold == SurfaceHold::charge)
        for (const SpeciesSpec& sp : s.species)
            charge_C_per_m2.push_back(
                potentials::grahame_surface_charge_C_per_m2(sp.surface_potential_mV * 1e-3, electrolyte_of(s), medium));
    double lowest = INFINITY;
    for (std::size_t i = 0; i < s.species.size(); ++i)
        for (std::size_t j = i; j < s.species.size(); ++j) {
            const potentials::PairAtConcentration make_pair = [&](double c_mM) {
                const potentials::Electrolyte electrolyte = electrolyte_with_varied_salt(s, c_mM);
                Scenario at = s;
                for (std::size_t k = 0; k < charge_C_per_m2.size(); ++k)
                    at.species[k].surface_potential_mV =
                        potentials::grahame_surface_potential_V(charge_C_per_m2[k], electrolyte, medium) * 1e3;
                return potentials::PairInteraction(pair_model(at, i, j), medium, electrolyte);
            };
            const potentials::CccResult barrier = potentials::barrier_ccc(make_pair, min_gap_m(s));
            if (barrier.status == potentials::CccStatus::no_barrier_anywhere) return 0.0;
            if (barrier.concentration_mol_per_m3) lowest = std::min(lowest, *barrier.concentration_mol_per_m3);
        }
    return lowest;
}

// The barrier CCC of a scenario at one storage temperature, starting from the potentials it
// has there.
double ccc_at_temperature(const Scenario& m, double temperature_K, const ShelfLifeReport& r) {
    Scenario at = m;
    const std::vector<StorageCondition> c = storage_conditions(at, {temperature_K}, r.hold, false, at, WQuadrature::fast);
    at.temperature_K = temperature_K;
    for (std::size_t k = 0; k < at.species.size(); ++k) at.species[k].surface_potential_mV = c.front().surface_potential_mV[k];
    return barrier_ccc_mM(at, r.hold);
}

// The barrier CCC of the varied salt for each member at one temperature, ascending.
std::vector<double> ensemble_cccs(const Ensemble& e, double temperature_K, const ShelfLifeReport& r) {
    std::vector<double> cccs =
        over_members(e, [&](const Scenario& member) { return ccc_at_temperature(member, temperature_K, r); });
    std::sort(cccs.begin(), cccs.end());
    return cccs;
}

}  // namespace brownfloc::sim::detail
