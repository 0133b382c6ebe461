#include "sim/calibration.hpp"

#include <Eigen/Dense>
#include <algorithm>
#include <cmath>
#include <functional>
#include <limits>
#include <map>
#include <stdexcept>
#include <utility>

#include "potentials/ccc.hpp"
#include "potentials/grahame.hpp"
#include "potentials/input_error.hpp"
#include "potentials/kinetics.hpp"
#include "potentials/stability_ratio.hpp"
#include "report_format.hpp"
#include "scenario_text.hpp"
#include "sim/scenario_physics.hpp"
#include "sim/storage_conditions.hpp"

namespace brownfloc::sim {

namespace {

constexpr double ln10 = 2.302585092994046;
constexpr double celsius_K = 273.15;
constexpr double psi_limit_mV = 200.0;
constexpr double log10_hamaker_low = -22.0, log10_hamaker_high = -18.0;
// Two-sided 95 % quantile of the standard normal distribution (the "1.96").
constexpr double z95 = 1.959963984540054;
// Where a fit counts as "at a bound": far below any step the data could resolve.
constexpr double at_bound_tolerance = 1e-6;

const char* const psi_name = "surface_potential_mV";
const char* const hamaker_name = "hamaker_J";

enum class Coordinate { psi_mV, log10_hamaker };

// One measurement with its W formed (ln W) and its conditions resolved.
struct Datum {
    double concentration_mM = 0;
    std::string salt;
    double temperature_K = 0;
    double log_w = 0;
    double relative_sd = 0;
};

// Everything the fit needs, validated once.
struct Problem {
    Scenario base;
    std::vector<Coordinate> coordinates;
    Eigen::VectorXd lower, upper, start, step, tolerance;
    std::vector<Datum> data;
    std::optional<double> ccc_mM;
    double ccc_relative_sd = 0.1;
    std::string ccc_salt;
    bool relative = true;  // w_reference = "measured-fast"
    SurfaceHold hold = SurfaceHold::potential;
    bool hydrodynamic = true;
    std::string w_reference_note;
    std::vector<std::string> warnings;
};

std::string where(const Scenario& s) { return s.source + ": [calibration] "; }
std::string point_key(std::size_t i, const char* key) {
    std::string k = "points[";
    k += std::to_string(i);
    k += "].";
    k += key;
    return k;
}
std::string num(double v) { return detail::number_text(v); }

std::vector<Coordinate> coordinates_of(const Scenario& s) {
    const std::vector<std::string>& names = s.calibration.parameters;
    if (names.empty())
        throw InputError(where(s) + "parameters = []: name at least one of \"surface_potential_mV\", \"hamaker_J\"");
    std::vector<Coordinate> out;
    for (const std::string& name : names) {
        Coordinate c;
        if (name == psi_name) c = Coordinate::psi_mV;
        else if (name == hamaker_name) c = Coordinate::log10_hamaker;
        else {
            std::string m = where(s);
            m += "parameters: ";
            m += detail::quote_for_message(name);
            m += " cannot be fitted; allowed: \"surface_potential_mV\", \"hamaker_J\"";
            throw InputError(m);
        }
        if (std::find(out.begin(), out.end(), c) != out.end())
            throw InputError(where(s) + "parameters: \"" + name + "\" is named twice");
        out.push_back(c);
    }
    return out;
}

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

// ---- validation: the fitted coordinates, their bounds and start ------------------------

void set_coordinates(Problem& p) {
    const Scenario& s = p.base;
    if (s.species.size() != 1)
        throw InputError(where(s) + "calibration fits one particle species; the scenario has " +
                         std::to_string(s.species.size()) + " (use [particle] or a single [[species]])");
    p.coordinates = coordinates_of(s);
    const auto n = static_cast<Eigen::Index>(p.coordinates.size());
    p.lower.resize(n), p.upper.resize(n), p.start.resize(n), p.step.resize(n), p.tolerance.resize(n);
    for (Eigen::Index j = 0; j < n; ++j) {
        if (p.coordinates[static_cast<std::size_t>(j)] == Coordinate::psi_mV) {
            const double psi = s.species[0].surface_potential_mV;
            if (psi == 0.0)
                throw InputError(where(s) + "parameters: fitting surface_potential_mV needs its sign, but [particle] "
                                 "surface_potential_mV = 0; give a guess with the sign of the surface (e.g. -30)");
            // |psi| in [0, 200] mV with the scenario's sign.
            p.lower[j] = psi > 0 ? 0.0 : -psi_limit_mV;
            p.upper[j] = psi > 0 ? psi_limit_mV : 0.0;
            p.start[j] = std::clamp(psi, p.lower[j], p.upper[j]);
            p.step[j] = 1e-2;        // mV: ln W is computed to ~1e-9, far below the change over this step
            p.tolerance[j] = 1e-7;   // mV
        } else {
            p.lower[j] = log10_hamaker_low;
            p.upper[j] = log10_hamaker_high;
            const double a = s.species[0].hamaker_J;
            p.start[j] = a > 0 ? std::clamp(std::log10(a), p.lower[j], p.upper[j]) : -20.0;
            p.step[j] = 1e-3;
            p.tolerance[j] = 1e-9;
        }
    }
}

// ---- validation: the data, with W formed from them -------------------------------------

std::string point_salt(const Scenario& s, const CalibrationPoint& point, std::size_t i) {
    if (point.salt) return *point.salt;
    if (s.titrant) return *s.titrant;
    if (s.salt) return *s.salt;
    throw InputError(where(s) + point_key(i, "salt") + ": not given, and the scenario names no salt or titrant "
                     "([electrolyte] gives ions); give salt = \"NaCl\" (or another formula) for the point");
}

void check_positive(const Scenario& s, const std::string& key, double v) {
    if (!(v > 0.0) || !std::isfinite(v)) throw InputError(where(s) + key + " = " + num(v) + ": must be > 0 and finite");
}

double point_temperature_K(const Scenario& s, const CalibrationPoint& point, std::size_t i) {
    if (!point.temperature_C) return s.temperature_K;
    const double t = *point.temperature_C;
    const std::string key = point_key(i, "temperature_C");
    if (!(t >= 0.0 && t <= 100.0))
        throw InputError(where(s) + key + " = " + num(t) + ": must be in [0, 100] (liquid water)");
    const double kelvin = t + celsius_K;
    if ((s.viscosity_mPa_s || s.relative_permittivity) && std::abs(kelvin - s.temperature_K) > 1e-9)
        throw InputError(where(s) + key + " = " + num(t) + ": [medium] fixes the viscosity or permittivity, which "
                         "holds at the scenario's temperature only; remove the override or measure at that temperature");
    return kelvin;
}

// k as used with dN/dt = -k N^2 / 2, from a number given in the stated convention.
double rate_constant_k(const Scenario& s, double given, std::size_t i) {
    const auto& convention = s.calibration.rate_convention;
    if (!convention)
        throw InputError(where(s) + point_key(i, "rate_constant_m3_per_s") + " = " + num(given) +
                         ": rate constants need rate_convention = \"k\" (dN/dt = -k N^2 / 2, the Smoluchowski k = "
                         "8kT/3eta) or \"half-k\" (dN/dt = -k' N^2, k' = k / 2)");
    // PHYSICS.md "Kinetics and stability": some texts use k' = k / 2 with dN/dt = -k' N^2.
    return *convention == "half-k" ? 2.0 * given : given;
}

void check_settings(const Scenario& s) {
    const CalibrationSettings& c = s.calibration;
    if (c.w_reference != "measured-fast" && c.w_reference != "smoluchowski")
        throw InputError(where(s) + "w_reference = " + detail::quote_for_message(c.w_reference) +
                         ": allowed \"measured-fast\" (W = k_fast,measured / k) or \"smoluchowski\" (W = (8kT/3eta) / k)");
    if (c.rate_convention && *c.rate_convention != "k" && *c.rate_convention != "half-k")
        throw InputError(where(s) + "rate_convention = " + detail::quote_for_message(*c.rate_convention) +
                         ": allowed \"k\" (dN/dt = -k N^2 / 2) or \"half-k\" (dN/dt = -k' N^2)");
    if (c.ccc_mM) check_positive(s, "ccc_mM", *c.ccc_mM);
    check_positive(s, "ccc_relative_sd", c.ccc_relative_sd);
    if (c.fast_rate_constant_m3_per_s) check_positive(s, "fast_rate_constant_m3_per_s", *c.fast_rate_constant_m3_per_s);
}

// The measured fast rate for measured-fast rate constants, with the sentence saying where it came from.
std::pair<double, std::string> measured_fast_rate(const Scenario& s, const std::vector<double>& k) {
    const CalibrationSettings& c = s.calibration;
    if (c.fast_rate_constant_m3_per_s) {
        const double fast = *c.fast_rate_constant_m3_per_s * (*c.rate_convention == "half-k" ? 2.0 : 1.0);
        return {fast, "k_fast,measured = fast_rate_constant_m3_per_s (" + format_significant(fast, 4) + " m^3/s as k)"};
    }
    std::size_t best = 0;
    for (std::size_t i = 0; i < k.size(); ++i)
        if (k[i] > k[best]) best = i;
    return {k[best], "k_fast,measured = the largest measured rate constant, points[" + std::to_string(best) + "] (" +
                         format_significant(k[best], 4) + " m^3/s as k), which therefore has W = 1"};
}

void set_data(Problem& p) {
    const Scenario& s = p.base;
    const CalibrationSettings& c = s.calibration;
    p.relative = c.w_reference == "measured-fast";
    std::vector<double> k(c.points.size(), 0.0);
    bool any_rate = false, any_ratio = false;
    std::vector<double> rate_temperatures;
    for (std::size_t i = 0; i < c.points.size(); ++i) {
        const CalibrationPoint& point = c.points[i];
        Datum d;
        d.concentration_mM = point.concentration_mM;
        check_positive(s, point_key(i, "concentration_mM"), d.concentration_mM);
        check_positive(s, point_key(i, "relative_sd"), point.relative_sd);
        d.relative_sd = point.relative_sd;
        d.salt = point_salt(s, point, i);
        try {
            (void)potentials::Electrolyte::from_salt(d.salt, d.concentration_mM);
        } catch (const InputError& e) {
            throw InputError(where(s) + point_key(i, "salt") + " = " + detail::quote_for_message(d.salt) + ": " +
                             detail::printable_message(e.what()));
        }
        d.temperature_K = point_temperature_K(s, point, i);
        if (point.stability_ratio.has_value() == point.rate_constant_m3_per_s.has_value())
            throw InputError(where(s) + "points[" + std::to_string(i) +
                             "]: give exactly one of stability_ratio and rate_constant_m3_per_s");
        if (point.stability_ratio) {
            check_positive(s, point_key(i, "stability_ratio"), *point.stability_ratio);
            d.log_w = std::log(*point.stability_ratio);
            any_ratio = true;
        } else {
            check_positive(s, point_key(i, "rate_constant_m3_per_s"), *point.rate_constant_m3_per_s);
            k[i] = rate_constant_k(s, *point.rate_constant_m3_per_s, i);
            if (!p.relative) {
                const Scenario at = at_conditions(s, d.salt, d.concentration_mM, d.temperature_K);
                const double a = s.species[0].radius_nm * 1e-9;
                const double fast = potentials::fast_rate_m3_per_s(a, a, d.temperature_K, medium_of(at).viscosity_Pa_s);
                d.log_w = std::log(fast / k[i]);
            }
            any_rate = true;
            rate_temperatures.push_back(d.temperature_K);
        }
        p.data.push_back(d);
    }

    const std::string honig = p.hydrodynamic ? "with the Honig et al. (1971) drainage factor"
                                             : "without hydrodynamic drainage (hydrodynamic_correction = false)";
    if (p.relative) {
        p.w_reference_note = "measured-fast: W relative to the measured fast (van der Waals only) rate; model W = "
                             "W(psi) / W(van der Waals only), both " + honig;
        if (any_rate) {
            const auto [fast, note] = measured_fast_rate(s, k);
            for (std::size_t i = 0; i < k.size(); ++i)
                if (k[i] > 0) p.data[i].log_w = std::log(fast / k[i]);
            p.w_reference_note += "; rate constants as W = k_fast,measured / k, " + note;
            const auto [lo, hi] = std::minmax_element(rate_temperatures.begin(), rate_temperatures.end());
            if (*hi - *lo > 1e-9)
                p.warnings.push_back("rate constants at several temperatures share one k_fast,measured, although "
                                     "the fast rate scales with T / eta; give stability_ratio per temperature instead");
        }
    } else {
        p.w_reference_note = "smoluchowski: W absolute, relative to 8kT/3eta; model W " + honig;
        if (any_rate) p.w_reference_note += "; rate constants as W = (8kT/3eta) / k at each point's temperature";
        if (c.fast_rate_constant_m3_per_s)
            p.warnings.push_back("fast_rate_constant_m3_per_s is not used with w_reference = \"smoluchowski\"");
    }
    if (any_rate && *c.rate_convention == "half-k")
        p.w_reference_note += "; rate_convention = \"half-k\": the given k' doubled to k";
    if (any_ratio && any_rate)
        p.w_reference_note += "; stability_ratio values used as given";
    if (c.fast_rate_constant_m3_per_s && !any_rate && p.relative)
        p.warnings.push_back("fast_rate_constant_m3_per_s is not used: no point gives a rate constant");
}

// The CCC's salt: the default point salt (titrant, else salt), else the one salt the points name.
std::string ccc_salt_of(const Problem& p) {
    const Scenario& s = p.base;
    if (s.titrant) return *s.titrant;
    if (s.salt) return *s.salt;
    for (const Datum& d : p.data)
        if (d.salt != p.data.front().salt)
            throw InputError(where(s) + "ccc_mM: the points name several salts and the scenario none; give "
                             "[electrolyte] titrant = the salt of the measured CCC");
    if (p.data.empty())
        throw InputError(where(s) + "ccc_mM = " + num(*s.calibration.ccc_mM) + ": the scenario names no salt or "
                         "titrant ([electrolyte] gives ions), so the salt of the CCC is unknown; add titrant = ...");
    return p.data.front().salt;
}

Problem make_problem(const Scenario& s) {
    if (!s.calibration_given) throw InputError(s.source + ": [calibration]: calibration needs a [calibration] section");
    Problem p;
    p.base = s;
    p.hold = s.storage.surface_hold == "charge" ? SurfaceHold::charge : SurfaceHold::potential;
    p.hydrodynamic = s.storage.hydrodynamic_correction;
    set_coordinates(p);
    check_settings(s);
    set_data(p);
    if (s.calibration.ccc_mM) {
        p.ccc_mM = s.calibration.ccc_mM;
        p.ccc_relative_sd = s.calibration.ccc_relative_sd;
        p.ccc_salt = ccc_salt_of(p);
    }
    const std::size_t n = p.data.size() + (p.ccc_mM ? 1 : 0);
    if (n < p.coordinates.size())
        throw InputError(where(s) + "parameters: " + std::to_string(p.coordinates.size()) +
                         " fitted parameters need at least as many data, but there are " + std::to_string(n) + " (" +
                         std::to_string(p.data.size()) + " points + " + std::to_string(p.ccc_mM ? 1 : 0) +
                         " CCC); add points or fit fewer parameters");
    return p;
}

// ---- the model ---------------------------------------------------------------------------

class Model {
public:
    explicit Model(const Problem& p) : p_(p) {}

    // ln W of the model in `salt` at concentration_mM and temperature_K, with the fitted
    // scenario (whose own conditions fix the surface charge when it is held).
    double log_w(const Scenario& fitted, const std::string& salt, double concentration_mM, double temperature_K) {
        return log_w_at(at_conditions(fitted, salt, concentration_mM, temperature_K), fitted);
    }

    // ln W at the fitted scenario's own electrolyte and temperature.
    double own_log_w(const Scenario& fitted) {
        Scenario at = fitted;
        if (!number_density_per_m3(at)) at.number_density_per_m3 = 1.0;
        return log_w_at(at, fitted);
    }

    // The barrier CCC [mM] of the CCC salt: potentials::barrier_ccc on the same pair as
    // compute_ccc_report (its kinetic CCC and valence series are not needed here). With the
    // charge held, the potential at each trial concentration follows from the Grahame
    // equation, as for the points; with the potential held this is compute_ccc_report's CCC.
    double ccc_mM(const Scenario& fitted) {
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

private:
    double log_w_at(const Scenario& at, const Scenario& charge_reference) {
        const double log10_w =
            storage_conditions(at, {at.temperature_K}, p_.hold, p_.hydrodynamic, charge_reference).front()
                .log10_stability_ratio;
        return log10_w * ln10 - (p_.relative ? log_w_vdw_only(at) : 0.0);
    }

    // ln W with van der Waals alone (INTERFACES "stability_ratio_experimental"): depends on A
    // and T only, so it is kept per (T, A) while psi moves.
    double log_w_vdw_only(const Scenario& at) {
        const auto key = std::make_pair(at.temperature_K, at.species[0].hamaker_J);
        if (const auto it = vdw_only_.find(key); it != vdw_only_.end()) return it->second;
        const potentials::PairInteraction pair(pair_model(at, 0, 0), medium_of(at), electrolyte_of(at));
        const double v = potentials::log_stability_ratio(pair.van_der_waals_only(), min_gap_m(at), p_.hydrodynamic);
        vdw_only_.emplace(key, v);
        return v;
    }

    const Problem& p_;
    std::map<std::pair<double, double>, double> vdw_only_;
};

Eigen::VectorXd residuals(const Problem& p, Model& model, const Eigen::VectorXd& x) {
    const Scenario fitted = apply(p.base, p.coordinates, x);
    Eigen::VectorXd r(static_cast<Eigen::Index>(p.data.size() + (p.ccc_mM ? 1 : 0)));
    Eigen::Index i = 0;
    for (const Datum& d : p.data)
        r[i++] = (d.log_w - model.log_w(fitted, d.salt, d.concentration_mM, d.temperature_K)) / d.relative_sd;
    if (p.ccc_mM) r[i] = (std::log(*p.ccc_mM) - std::log(model.ccc_mM(fitted))) / p.ccc_relative_sd;
    return r;
}

// ---- Levenberg-Marquardt with box bounds ------------------------------------------------

using ResidualFn = std::function<Eigen::VectorXd(const Eigen::VectorXd&)>;

struct Bounds {
    Eigen::VectorXd lower, upper, step, tolerance;
};

struct LmOutcome {
    Eigen::VectorXd x, r;
    Eigen::MatrixXd jacobian;  // of the residuals at x
    int iterations = 0;
    bool converged = false;
};

// Central differences inside the box; one-sided at a bound.
Eigen::MatrixXd numeric_jacobian(const ResidualFn& f, const Eigen::VectorXd& x, const Eigen::VectorXd& r0,
                                 const Bounds& b) {
    Eigen::MatrixXd jac(r0.size(), x.size());
    for (Eigen::Index j = 0; j < x.size(); ++j) {
        const double h = b.step[j];
        const bool up = x[j] + h <= b.upper[j], down = x[j] - h >= b.lower[j];
        Eigen::VectorXd xp = x, xm = x;
        xp[j] += h;
        xm[j] -= h;
        if (up && down) jac.col(j) = (f(xp) - f(xm)) / (2 * h);
        else if (up) jac.col(j) = (f(xp) - r0) / h;
        else jac.col(j) = (r0 - f(xm)) / h;
    }
    return jac;
}

// Marquardt (1963): (J^T J + lambda diag(J^T J)) delta = -J^T r, lambda shrinking after a
// step that lowers chi2 and growing after one that does not. Bounds by clamping; a
// coordinate at a bound whose descent points outwards is held there for the step.
LmOutcome levenberg_marquardt(const ResidualFn& f, Eigen::VectorXd x, const Bounds& b) {
    constexpr int max_iterations = 100;
    LmOutcome out;
    Eigen::VectorXd r = f(x);
    double chi2 = r.squaredNorm(), lambda = 1e-3;
    for (int it = 1; it <= max_iterations && !out.converged; ++it) {
        out.iterations = it;
        const Eigen::MatrixXd jac = numeric_jacobian(f, x, r, b);
        const Eigen::MatrixXd h = jac.transpose() * jac;
        const Eigen::VectorXd g = jac.transpose() * r;
        const double diag_floor = 1e-12 * std::max(h.diagonal().maxCoeff(), 1e-300);
        bool accepted = false;
        while (!accepted && lambda < 1e16) {
            Eigen::MatrixXd a = h;
            Eigen::VectorXd rhs = -g;
            for (Eigen::Index j = 0; j < x.size(); ++j) {
                a(j, j) += lambda * std::max(h(j, j), diag_floor);
                const bool held = (x[j] <= b.lower[j] && g[j] > 0) || (x[j] >= b.upper[j] && g[j] < 0);
                if (held) {
                    a.row(j).setZero(), a.col(j).setZero(), a(j, j) = 1, rhs[j] = 0;
                }
            }
            const Eigen::VectorXd x_new = (x + a.ldlt().solve(rhs)).cwiseMax(b.lower).cwiseMin(b.upper);
            const bool tiny = ((x_new - x).cwiseAbs().array() <= b.tolerance.array()).all();
            const Eigen::VectorXd r_new = f(x_new);
            const double chi2_new = r_new.squaredNorm();
            if (chi2_new < chi2) {
                accepted = true;
                x = x_new, r = r_new;
                out.converged = tiny || chi2 - chi2_new <= 1e-14 * chi2 || chi2_new < 1e-24;
                chi2 = chi2_new;
                lambda = std::max(lambda / 10, 1e-12);
            } else if (tiny) {
                out.converged = true;  // no step the tolerances resolve lowers chi2: a minimum
                break;
            } else {
                lambda *= 10;
            }
        }
        if (!accepted && !out.converged) break;  // lambda ran away without a lower chi2
    }
    out.x = x;
    out.r = r;
    out.jacobian = numeric_jacobian(f, x, r, b);
    return out;
}

// ---- one complete fit: start, LM ---------------------------------------------------------

struct Fit {
    LmOutcome lm;
    Eigen::MatrixXd covariance;
};

// A coarse scan of each coordinate (others held) for a start inside the basin: ln W is
// steep in psi and flat where there is no barrier, where a local method stalls.
Eigen::VectorXd scan_start(const Problem& p, const ResidualFn& f) {
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

Eigen::MatrixXd covariance_of(const Eigen::MatrixXd& jac) {
    const Eigen::MatrixXd h = jac.transpose() * jac;
    const Eigen::FullPivLU<Eigen::MatrixXd> lu(h);
    if (lu.isInvertible()) return lu.inverse();
    // A direction the data do not constrain: infinite variance.
    Eigen::MatrixXd c = Eigen::MatrixXd::Constant(h.rows(), h.cols(), std::numeric_limits<double>::quiet_NaN());
    c.diagonal().setConstant(std::numeric_limits<double>::infinity());
    return c;
}

Fit run_fit(const Problem& p) {
    Model model(p);
    const ResidualFn f = [&](const Eigen::VectorXd& x) { return residuals(p, model, x); };
    Fit fit;
    fit.lm = levenberg_marquardt(f, scan_start(p, f), Bounds{p.lower, p.upper, p.step, p.tolerance});
    fit.covariance = covariance_of(fit.lm.jacobian);
    return fit;
}

// ---- the result ------------------------------------------------------------------------

FittedParameter fitted_parameter(const Problem& p, const Fit& fit, Eigen::Index j) {
    const double x = fit.lm.x[j], se = std::sqrt(fit.covariance(j, j));
    FittedParameter out;
    const bool at_low = x <= p.lower[j] + at_bound_tolerance, at_high = x >= p.upper[j] - at_bound_tolerance;
    if (p.coordinates[static_cast<std::size_t>(j)] == Coordinate::psi_mV) {
        out.name = psi_name;
        out.estimate = x, out.standard_error = se;
        out.ci95_low = x - z95 * se, out.ci95_high = x + z95 * se;
        if (at_low || at_high)
            out.bound_message = "surface_potential_mV ended at its bound " + num(at_low ? p.lower[j] : p.upper[j]) +
                                " mV (|psi| is fitted in [0, 200] mV); its standard error is not meaningful there";
    } else {
        // Fitted as log10 A: the SE by the delta method, the interval from the log interval.
        out.name = hamaker_name;
        out.estimate = std::pow(10.0, x);
        out.standard_error = out.estimate * ln10 * se;
        out.ci95_low = std::pow(10.0, x - z95 * se), out.ci95_high = std::pow(10.0, x + z95 * se);
        if (at_low || at_high)
            out.bound_message = "hamaker_J ended at its bound " + num(std::pow(10.0, at_low ? p.lower[j] : p.upper[j])) +
                                " J (A is fitted in [1e-22, 1e-18] J); its standard error is not meaningful there";
    }
    return out;
}

double least_squares_slope(const std::vector<double>& x, const std::vector<double>& y) {
    double mx = 0, my = 0;
    for (std::size_t i = 0; i < x.size(); ++i) mx += x[i], my += y[i];
    mx /= static_cast<double>(x.size()), my /= static_cast<double>(x.size());
    double sxy = 0, sxx = 0;
    for (std::size_t i = 0; i < x.size(); ++i) sxy += (x[i] - mx) * (y[i] - my), sxx += (x[i] - mx) * (x[i] - mx);
    return sxy / sxx;
}

// d log10 W / d log10 c of the data and of the model over the slow branch (measured W > 1.5)
// of the salt with the most points.
void add_slopes(CalibrationResult& out) {
    std::map<std::string, int> count;
    for (const CalibrationResidual& r : out.residuals) ++count[r.salt];
    std::string salt;
    int most = 0;
    for (const CalibrationResidual& r : out.residuals)  // first salt among equals, in point order
        if (count[r.salt] > most) most = count[r.salt], salt = r.salt;
    std::vector<double> log_c, measured, model;
    for (const CalibrationResidual& r : out.residuals)
        if (r.salt == salt && r.measured_w > 1.5) {
            log_c.push_back(std::log10(r.concentration_mM));
            measured.push_back(r.measured_log10_w);
            model.push_back(r.model_log10_w);
        }
    const auto [lo, hi] = std::minmax_element(log_c.begin(), log_c.end());
    if (log_c.size() < 2 || *hi - *lo < 1e-12) return;
    out.slope_salt = salt;
    out.measured_slope = least_squares_slope(log_c, measured);
    out.model_slope = least_squares_slope(log_c, model);
    out.slope_ratio = *out.measured_slope / *out.model_slope;
    if (!(*out.slope_ratio >= 0.5 && *out.slope_ratio <= 2.0))
        out.warnings.push_back("DLVO predicts a slope " + format_significant(*out.model_slope / *out.measured_slope, 3) +
                               " times the measured: d log10 W / d log10 c is " + format_significant(*out.model_slope, 3) +
                               " in the model and " + format_significant(*out.measured_slope, 3) +
                               " in the data (" + salt + "), so the fitted parameters reproduce W only near the "
                               "points and W away from them is less certain than the intervals say");
}

void add_residuals(CalibrationResult& out, const Problem& p, const Fit& fit) {
    Model model(p);
    const Scenario fitted = apply(p.base, p.coordinates, fit.lm.x);
    for (std::size_t i = 0; i < p.data.size(); ++i) {
        const Datum& d = p.data[i];
        CalibrationResidual r;
        r.concentration_mM = d.concentration_mM;
        r.salt = d.salt;
        r.temperature_C = d.temperature_K - celsius_K;
        r.measured_w = std::exp(d.log_w);
        r.measured_log10_w = d.log_w / ln10;
        r.weighted_residual = fit.lm.r[static_cast<Eigen::Index>(i)];
        const double model_log_w = d.log_w - r.weighted_residual * d.relative_sd;
        r.model_w = std::exp(model_log_w);
        r.model_log10_w = model_log_w / ln10;
        out.residuals.push_back(r);
    }
    if (p.ccc_mM) {
        out.measured_ccc_mM = p.ccc_mM;
        out.ccc_weighted_residual = fit.lm.r[fit.lm.r.size() - 1];
        out.model_ccc_mM = *p.ccc_mM * std::exp(-*out.ccc_weighted_residual * p.ccc_relative_sd);
        out.ccc_salt = p.ccc_salt;
    }
    double max_measured_log10_w = 0;  // with a CCC alone: W = 1, where the CCC puts the onset of fast aggregation
    if (!out.residuals.empty()) {
        max_measured_log10_w = out.residuals.front().measured_log10_w;
        for (const CalibrationResidual& r : out.residuals) max_measured_log10_w = std::max(max_measured_log10_w, r.measured_log10_w);
    }
    out.extrapolation_decades = model.own_log_w(fitted) / ln10 - max_measured_log10_w;
    if (out.extrapolation_decades > 1)
        out.warnings.push_back("the storage prediction extrapolates " + format_significant(out.extrapolation_decades, 3) +
                               " decades of W beyond the data: at the scenario's own electrolyte and temperature the "
                               "model W is 10^" + format_significant(out.extrapolation_decades, 3) +
                               " times the largest measured W; measure closer to the storage conditions");
}

void add_parameters(CalibrationResult& out, const Problem& p, const Fit& fit) {
    const Eigen::Index n = fit.lm.x.size();
    for (Eigen::Index j = 0; j < n; ++j) {
        out.parameters.push_back(fitted_parameter(p, fit, j));
        if (out.parameters.back().bound_message) out.warnings.push_back(*out.parameters.back().bound_message);
        out.fit_coordinates.push_back(p.coordinates[static_cast<std::size_t>(j)] == Coordinate::psi_mV
                                          ? psi_name : "log10_hamaker_J");
        out.fit_values.push_back(fit.lm.x[j]);
        std::vector<double> row;
        for (Eigen::Index k = 0; k < n; ++k) row.push_back(fit.covariance(j, k));
        out.covariance.push_back(row);
    }
    if (n == 2) {
        const double r = fit.covariance(0, 1) / std::sqrt(fit.covariance(0, 0) * fit.covariance(1, 1));
        if (std::isfinite(r)) {
            out.psi_hamaker_correlation = r;
            if (std::abs(r) > 0.95)
                out.warnings.push_back("psi and A cannot be told apart by these data; their estimates are correlated "
                                       "with r = " + format_significant(r, 4) + ", so only a combination of them is "
                                       "fitted: fix one (fit one parameter), or add points nearer the CCC or a "
                                       "measured ccc_mM");
        }
    }
    for (const FittedParameter& f : out.parameters)
        if (!std::isfinite(f.standard_error))
            out.warnings.push_back(f.name + ": the data do not determine it (J^T J is singular)");
}

void add_fit_statistics(CalibrationResult& out, const Problem& p, const Fit& fit) {
    out.chi_squared = fit.lm.r.squaredNorm();
    out.degrees_of_freedom = static_cast<int>(fit.lm.r.size() - fit.lm.x.size());
    if (out.degrees_of_freedom > 0) {
        out.reduced_chi_squared = out.chi_squared / out.degrees_of_freedom;
        if (*out.reduced_chi_squared > 3)
            out.warnings.push_back("chi2/dof = " + format_significant(*out.reduced_chi_squared, 3) +
                                   ": the model misses the data by more than their stated sds; the standard errors "
                                   "understate the uncertainty");
    }
    out.iterations = fit.lm.iterations;
    out.converged = fit.lm.converged;
    if (!fit.lm.converged)
        out.warnings.push_back("the fit stopped after " + std::to_string(fit.lm.iterations) +
                               " iterations without meeting its convergence test");
    out.w_reference = p.relative ? "measured-fast" : "smoluchowski";
    out.w_reference_note = p.w_reference_note;
    out.interval_note = "95 % intervals: estimate +- 1.96 standard errors (normal, since the sds of the data are "
                        "given, not estimated from the scatter); covariance (J^T J)^-1 at the optimum; hamaker_J: "
                        "the interval of log10 A, transformed";
}

}  // namespace

CalibrationResult calibrate(const Scenario& scenario) {
    const Problem p = make_problem(scenario);
    const Fit fit = run_fit(p);
    CalibrationResult out;
    out.warnings = p.warnings;
    add_fit_statistics(out, p, fit);
    add_parameters(out, p, fit);
    add_residuals(out, p, fit);
    add_slopes(out);

    // The same W values compared with the absolute model W: how far psi moves if relative data
    // are mistaken for absolute ones (a CCC alone does not depend on the W reference).
    const auto psi = std::find(p.coordinates.begin(), p.coordinates.end(), Coordinate::psi_mV);
    if (p.relative && psi != p.coordinates.end() && !p.data.empty()) {
        Problem absolute = p;
        absolute.relative = false;
        const Fit refit = run_fit(absolute);
        const auto j = static_cast<Eigen::Index>(psi - p.coordinates.begin());
        out.psi_shift_if_absolute_mV = refit.lm.x[j] - fit.lm.x[j];
    }
    return out;
}

Scenario with_fit_values(const Scenario& scenario, const std::vector<double>& fit_values) {
    const std::vector<Coordinate> coordinates = coordinates_of(scenario);
    if (fit_values.size() != coordinates.size() || scenario.species.size() != 1)
        throw std::invalid_argument("with_fit_values: one value per fitted parameter of a one-species scenario");
    return apply(scenario, coordinates, Eigen::Map<const Eigen::VectorXd>(fit_values.data(),
                                                                          static_cast<Eigen::Index>(fit_values.size())));
}

Json calibration_json(const CalibrationResult& result) {
    const char* const not_determined = "not determined by the data (J^T J singular)";
    Json json = Json::object();
    json.set("w_reference", result.w_reference);
    json.set("w_reference_note", result.w_reference_note);
    Json parameters = Json::array();
    for (const FittedParameter& f : result.parameters) {
        Json e = Json::object();
        e.set("name", f.name);
        e.set("estimate", f.estimate);
        e.set_number_or_null("standard_error", f.standard_error, not_determined);
        e.set_number_or_null("ci95_low", f.ci95_low, not_determined);
        e.set_number_or_null("ci95_high", f.ci95_high, not_determined);
        if (f.bound_message) e.set("bound_message", *f.bound_message);
        parameters.push(std::move(e));
    }
    json.set("parameters", std::move(parameters));
    json.set("interval_note", result.interval_note);
    json.set("fit_coordinates", Json(result.fit_coordinates));
    Json values = Json::array(), covariance = Json::array();
    for (double v : result.fit_values) values.push(v);
    for (const auto& row : result.covariance) {
        Json r = Json::array();
        for (double v : row) r.push(std::isfinite(v) ? Json(v) : Json(nullptr));
        covariance.push(std::move(r));
    }
    json.set("fit_values", std::move(values));
    json.set("covariance", std::move(covariance));
    json.set_number_or_null("psi_hamaker_correlation", result.psi_hamaker_correlation,
                            "only with surface_potential_mV and hamaker_J fitted together");
    Json residuals = Json::array();
    for (const CalibrationResidual& r : result.residuals) {
        Json e = Json::object();
        e.set("concentration_mM", r.concentration_mM);
        e.set("salt", r.salt);
        e.set("temperature_C", r.temperature_C);
        e.set("measured_w", r.measured_w);
        e.set_number_or_null("model_w", r.model_w, "above 1e308; see model_log10_w");
        e.set("measured_log10_w", r.measured_log10_w);
        e.set("model_log10_w", r.model_log10_w);
        e.set("weighted_residual", r.weighted_residual);
        residuals.push(std::move(e));
    }
    json.set("residuals", std::move(residuals));
    if (result.measured_ccc_mM) {
        Json ccc = Json::object();
        ccc.set("salt", result.ccc_salt);
        ccc.set("measured_ccc_mM", *result.measured_ccc_mM);
        ccc.set("model_ccc_mM", *result.model_ccc_mM);
        ccc.set("weighted_residual", *result.ccc_weighted_residual);
        json.set("ccc", std::move(ccc));
    }
    json.set("chi_squared", result.chi_squared);
    json.set("degrees_of_freedom", result.degrees_of_freedom);
    json.set_number_or_null("reduced_chi_squared", result.reduced_chi_squared, "no degrees of freedom left");
    json.set("iterations", result.iterations);
    json.set("converged", result.converged);
    json.set("extrapolation_decades", result.extrapolation_decades);
    const char* const no_slope = "fewer than two concentrations with measured W > 1.5 in one salt";
    json.set_number_or_null("measured_slope", result.measured_slope, no_slope);
    json.set_number_or_null("model_slope", result.model_slope, no_slope);
    json.set_number_or_null("slope_ratio", result.slope_ratio, no_slope);
    if (result.measured_slope) json.set("slope_salt", result.slope_salt);
    json.set_number_or_null("psi_shift_if_absolute_mV", result.psi_shift_if_absolute_mV,
                            "only with w_reference = \"measured-fast\" and surface_potential_mV fitted");
    json.set("warnings", Json(result.warnings));
    return json;
}

void write_calibration_text(std::ostream& out, const CalibrationResult& result) {
    auto row = [&](const std::string& label, const std::string& value) { write_row(out, label, value, 34); };
    out << "Calibration (weighted least squares in ln W, Levenberg-Marquardt)\n";
    row("W reference", result.w_reference_note);
    for (const FittedParameter& f : result.parameters) {
        const bool mv = f.name == psi_name;
        const std::string unit = mv ? " mV" : " J";
        auto show = [&](double v) { return mv ? format_fixed(v, 2) : format_significant(v, 3); };
        std::string value = show(f.estimate) + " +- " + show(f.standard_error) + unit + "  (95 %: " +
                            show(f.ci95_low) + " to " + show(f.ci95_high) + unit + ")";
        if (f.bound_message) value += "  [at a bound]";
        row("  " + f.name, value);
    }
    out << "  " << result.interval_note << "\n";
    if (result.psi_hamaker_correlation) row("  correlation psi-A", format_fixed(*result.psi_hamaker_correlation, 3));
    if (!result.residuals.empty()) {
        auto cell = [&](const std::string& v, std::size_t width) { out << std::string(width > v.size() ? width - v.size() : 1, ' ') << v; };
        out << "\n      c_mM  salt       T_C   W measured      W model  residual/sd\n";
        for (const CalibrationResidual& r : result.residuals) {
            cell(format_significant(r.concentration_mM, 4), 10);
            out << "  " << r.salt << std::string(r.salt.size() < 6 ? 6 - r.salt.size() : 1, ' ');
            cell(format_fixed(r.temperature_C, 1), 6);
            cell(format_significant(r.measured_w, 4), 13);
            cell(std::isfinite(r.model_w) ? format_significant(r.model_w, 4) : "10^" + format_fixed(r.model_log10_w, 1), 13);
            cell(format_fixed(r.weighted_residual, 2), 13);
            out << "\n";
        }
    }
    if (result.measured_ccc_mM)
        row("  CCC measured / model", format_significant(*result.measured_ccc_mM, 4) + " / " +
                                          format_significant(*result.model_ccc_mM, 4) + " mM " + result.ccc_salt);
    std::string chi = format_significant(result.chi_squared, 4) + " for " +
                      std::to_string(result.degrees_of_freedom) + " degrees of freedom";
    if (result.reduced_chi_squared) chi += " (chi2/dof " + format_significant(*result.reduced_chi_squared, 3) + ")";
    row("chi2", chi);
    row("Extrapolation", format_significant(result.extrapolation_decades, 3) +
                             " decades of W beyond the largest measured W");
    if (result.measured_slope)
        row("d log10 W / d log10 c", format_significant(*result.measured_slope, 3) + " measured, " +
                                         format_significant(*result.model_slope, 3) + " model (" + result.slope_salt + ")");
    if (result.psi_shift_if_absolute_mV)
        row("psi shift if taken as absolute", format_fixed(*result.psi_shift_if_absolute_mV, 2) + " mV");
    for (const std::string& w : result.warnings) out << "warning: " << w << "\n";
}

}  // namespace brownfloc::sim
