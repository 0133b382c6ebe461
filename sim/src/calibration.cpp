// Calibration of the shelf-life model: the model's W at each point, the start scan and the fit,
// and calibrate() and with_fit_values() (data checks: calibration_data.cpp; result: calibration_result.cpp).
#include "sim/calibration.hpp"

#include <Eigen/Dense>
#include <algorithm>
#include <cmath>
#include <stdexcept>
#include <utility>

#include "calibration_detail.hpp"
#include "calibration_fit.hpp"
#include "potentials/ccc.hpp"
#include "potentials/electrolyte.hpp"
#include "potentials/grahame.hpp"
#include "potentials/stability_ratio.hpp"
#include "sim/scenario_physics.hpp"
#include "sim/storage_conditions.hpp"

namespace brownfloc::sim::detail {

Scenario apply(const Scenario& s, const std::vector<Coordinate>& coordinates, const Eigen::VectorXd& x) {
    Scenario out = s;
    for (std::size_t j = 0; j < coordinates.size(); ++j) {
        if (coordinates[j] == Coordinate::psi_mV) out.species[0].surface_potential_mV = x[static_cast<Eigen::Index>(j)];
        else out.species[0].hamaker_J = std::pow(10.0, x[static_cast<Eigen::Index>(j)]);
    }
    return out;
}

// The scenario in the electrolyte of one measurement: that salt alone, at that temperature.
Scenario at_conditions(const Scenario& fitted, const std::string& salt, double concentration_mM,
                       double temperature_K) {
    Scenario s = fitted;
    s.salt = salt;
    s.salt_concentration_mM = concentration_mM;
    s.ions.clear();
    s.titrant.reset();
    s.temperature_K = temperature_K;
    // W does not depend on the particle number; storage_conditions wants one for tau only.
    if (!number_density_per_m3(s)) s.number_density_per_m3 = 1.0;
    return s;
}

// ---- the model ---------------------------------------------------------------------------

double CalibrationModel::log_w(const Scenario& fitted, const std::string& salt, double concentration_mM, double temperature_K) {
    return log_w_at(at_conditions(fitted, salt, concentration_mM, temperature_K), fitted);
}

double CalibrationModel::own_log_w(const Scenario& fitted) {
    Scenario at = fitted;
    if (!number_density_per_m3(at)) at.number_density_per_m3 = 1.0;
    return log_w_at(at, fitted);
}

// The barrier CCC [mM] of the CCC salt: potentials::barrier_ccc on the same pair as
// compute_ccc_report (its kinetic CCC and valence series are not needed here). With the
// charge held, the potential at each trial concentration follows from the Grahame
// equation, as for the points; with the potential held this is compute_ccc_report's CCC.
double CalibrationModel::ccc_mM(const Scenario& fitted) {
    const Scenario at = at_conditions(fitted, p_.ccc_salt, 1.0, fitted.temperature_K);
    const potentials::Medium medium = medium_of(at);
    const potentials::PairModel model = pair_model(at, 0, 0);
    double sigma_C_per_m2 = 0;
    if (p_.hold == SurfaceHold::charge)
        sigma_C_per_m2 = potentials::grahame_surface_charge_C_per_m2(fitted.species[0].surface_potential_mV * 1e-3,
                                                                     electrolyte_of(fitted), medium_of(fitted));
    const potentials::PairAtConcentration make_pair = [&](double c_mol_per_m3) {
        // 1 mol/m^3 = 1 mM.
        const auto e = potentials::Electrolyte::from_salt(p_.ccc_salt, c_mol_per_m3);
        potentials::PairModel m = model;
        if (p_.hold == SurfaceHold::charge)
            m.surface_potential1_V = m.surface_potential2_V =
                potentials::grahame_surface_potential_V(sigma_C_per_m2, e, medium);
        return potentials::PairInteraction(m, medium, e);
    };
    const potentials::CccResult r = potentials::barrier_ccc(make_pair, min_gap_m(at));
    if (r.concentration_mol_per_m3) return *r.concentration_mol_per_m3;
    // No crossing in the search range: its edge keeps the residual finite and pointing the right way.
    return r.status == potentials::CccStatus::no_barrier_anywhere ? potentials::ccc_lowest_mol_per_m3
                                                                   : potentials::ccc_highest_mol_per_m3;
}

double CalibrationModel::log_w_at(const Scenario& at, const Scenario& charge_reference) {
    const double log10_w =
        storage_conditions(at, {at.temperature_K}, p_.hold, p_.hydrodynamic, charge_reference).front()
            .log10_stability_ratio;
    return log10_w * ln10 - (p_.relative ? log_w_vdw_only(at) : 0.0);
}

// ln W with van der Waals alone (INTERFACES "stability_ratio_experimental"): depends on A
// and T only, so it is kept per (T, A) while psi moves.
double CalibrationModel::log_w_vdw_only(const Scenario& at) {
    const auto key = std::make_pair(at.temperature_K, at.species[0].hamaker_J);
    if (const auto it = vdw_only_.find(key); it != vdw_only_.end()) return it->second;
    const potentials::PairInteraction pair(pair_model(at, 0, 0), medium_of(at), electrolyte_of(at));
    const double v = potentials::log_stability_ratio(pair.van_der_waals_only(), min_gap_m(at), p_.hydrodynamic);
    vdw_only_.emplace(key, v);
    return v;
}

namespace {

Eigen::VectorXd residuals(const CalibrationProblem& p, CalibrationModel& model, const Eigen::VectorXd& x) {
    const Scenario fitted = apply(p.base, p.coordinates, x);
    Eigen::VectorXd r(static_cast<Eigen::Index>(p.data.size() + (p.ccc_mM ? 1 : 0)));
    Eigen::Index i = 0;
    for (const CalibrationDatum& d : p.data)
        r[i++] = (d.log_w - model.log_w(fitted, d.salt, d.concentration_mM, d.temperature_K)) / d.relative_sd;
    if (p.ccc_mM) r[i] = (std::log(*p.ccc_mM) - std::log(model.ccc_mM(fitted))) / p.ccc_relative_sd;
    return r;
}

// ---- one complete fit: start, LM ---------------------------------------------------------

// A coarse scan of each coordinate (others held) for a start inside the basin: ln W is
// steep in psi and flat where there is no barrier, where a local method stalls.
Eigen::VectorXd scan_start(const CalibrationProblem& p, const detail::ResidualFn& f) {
    Eigen::VectorXd x = p.start;
    double best = f(x).squaredNorm();
    for (Eigen::Index j = 0; j < x.size(); ++j) {
        std::vector<double> candidates;
        if (p.coordinates[static_cast<std::size_t>(j)] == Coordinate::psi_mV) {
            const double sign = p.upper[j] > 0 ? 1.0 : -1.0;
            for (double v : {5.0, 10.0, 15.0, 20.0, 25.0, 30.0, 40.0, 50.0, 65.0, 80.0, 100.0, 130.0, 165.0, 200.0})
                candidates.push_back(sign * v);
        } else {
            for (double v = log10_hamaker_low + 0.5; v < log10_hamaker_high; v += 0.5) candidates.push_back(v);
        }
        const Eigen::VectorXd held = x;
        for (double v : candidates) {
            Eigen::VectorXd trial = held;
            trial[j] = v;
            const double chi2 = f(trial).squaredNorm();
            if (chi2 < best) best = chi2, x = trial;
        }
    }
    return x;
}

CalibrationFit run_fit(const CalibrationProblem& p) {
    CalibrationModel model(p);
    const detail::ResidualFn f = [&](const Eigen::VectorXd& x) { return residuals(p, model, x); };
    CalibrationFit fit;
    fit.lm = detail::levenberg_marquardt(f, scan_start(p, f), detail::Bounds{p.lower, p.upper, p.step, p.tolerance});
    fit.covariance = detail::covariance_of(fit.lm.jacobian);
    return fit;
}

}  // namespace

}  // namespace brownfloc::sim::detail

namespace brownfloc::sim {

CalibrationResult calibrate(const Scenario& scenario) {
    const detail::CalibrationProblem p = detail::make_problem(scenario);
    const detail::CalibrationFit fit = detail::run_fit(p);
    CalibrationResult out = detail::result_of(p, fit);

    // The same W values compared with the absolute model W: how far psi moves if relative data
    // are mistaken for absolute ones (a CCC alone does not depend on the W reference).
    const auto psi = std::find(p.coordinates.begin(), p.coordinates.end(), detail::Coordinate::psi_mV);
    if (p.relative && psi != p.coordinates.end() && !p.data.empty()) {
        detail::CalibrationProblem absolute = p;
        absolute.relative = false;
        const detail::CalibrationFit refit = detail::run_fit(absolute);
        const auto j = static_cast<Eigen::Index>(psi - p.coordinates.begin());
        out.psi_shift_if_absolute_mV = refit.lm.x[j] - fit.lm.x[j];
    }
    return out;
}

Scenario with_fit_values(const Scenario& scenario, const std::vector<double>& fit_values) {
    const std::vector<detail::Coordinate> coordinates = detail::coordinates_of(scenario);
    if (fit_values.size() != coordinates.size() || scenario.species.size() != 1)
        throw std::invalid_argument("with_fit_values: one value per fitted parameter of a one-species scenario");
    const Eigen::Map<const Eigen::VectorXd> x(fit_values.data(), static_cast<Eigen::Index>(fit_values.size()));
    return detail::apply(scenario, coordinates, x);
}

}  // namespace brownfloc::sim
