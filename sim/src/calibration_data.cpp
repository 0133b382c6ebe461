// The [calibration] data checked and turned into ln W: the fitted coordinates with their bounds
// and start, the points, the rate convention and the W reference (w_reference).
#include <Eigen/Dense>
#include <algorithm>
#include <cmath>
#include <string>
#include <utility>
#include <vector>

#include "calibration_detail.hpp"
#include "potentials/electrolyte.hpp"
#include "potentials/input_error.hpp"
#include "potentials/kinetics.hpp"
#include "report_format.hpp"
#include "scenario_text.hpp"
#include "sim/scenario_physics.hpp"

namespace brownfloc::sim::detail {

namespace {

constexpr double psi_limit_mV = 200.0;

std::string where(const Scenario& s) { return s.source + ": [calibration] "; }
std::string point_key(std::size_t i, const char* key) {
    std::string k = "points[";
    k += std::to_string(i);
    k += "].";
    k += key;
    return k;
}
std::string num(double v) { return detail::number_text(v); }

}  // namespace

// ---- validation: the fitted coordinates, their bounds and start ------------------------

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

namespace {

void set_coordinates(CalibrationProblem& p) {
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

void set_data(CalibrationProblem& p) {
    const Scenario& s = p.base;
    const CalibrationSettings& c = s.calibration;
    p.relative = c.w_reference == "measured-fast";
    std::vector<double> k(c.points.size(), 0.0);
    bool any_rate = false, any_ratio = false;
    std::vector<double> rate_temperatures;
    for (std::size_t i = 0; i < c.points.size(); ++i) {
        const CalibrationPoint& point = c.points[i];
        CalibrationDatum d;
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
std::string ccc_salt_of(const CalibrationProblem& p) {
    const Scenario& s = p.base;
    if (s.titrant) return *s.titrant;
    if (s.salt) return *s.salt;
    for (const CalibrationDatum& d : p.data)
        if (d.salt != p.data.front().salt)
            throw InputError(where(s) + "ccc_mM: the points name several salts and the scenario none; give "
                             "[electrolyte] titrant = the salt of the measured CCC");
    if (p.data.empty())
        throw InputError(where(s) + "ccc_mM = " + num(*s.calibration.ccc_mM) + ": the scenario names no salt or "
                         "titrant ([electrolyte] gives ions), so the salt of the CCC is unknown; add titrant = ...");
    return p.data.front().salt;
}

}  // namespace

CalibrationProblem make_problem(const Scenario& s) {
    if (!s.calibration_given) throw InputError(s.source + ": [calibration]: calibration needs a [calibration] section");
    CalibrationProblem p;
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

}  // namespace brownfloc::sim::detail
