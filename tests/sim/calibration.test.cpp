#include <catch2/catch.hpp>
#include <cmath>
#include <cstdint>
#include <sstream>
#include <string>
#include <vector>

#include "potentials/electrolyte.hpp"
#include "potentials/grahame.hpp"
#include "potentials/input_error.hpp"
#include "sim/calibration.hpp"
#include "sim/ccc_report.hpp"
#include "sim/dlvo_report.hpp"
#include "sim/scenario.hpp"
#include "sim/scenario_physics.hpp"
#include "latex_paint.hpp"

using namespace brownfloc::sim;
using Catch::Matchers::Contains;
using Catch::Matchers::WithinAbs;
using Catch::Matchers::WithinRel;

namespace {

// Synthetic data come from the latex of latex_paint.hpp at this potential, on the slow
// branch of NaCl (log10 W from about 5 down to 1 over 30-100 mM).
constexpr double psi_true_mV = -25.0;
const std::vector<double> slow_branch_mM{30, 40, 50, 70, 100};

// The scenario a user would calibrate: a guess of -40 mV, stored in 10 mM NaCl.
Scenario paint(const std::string& surface_potential_mV = "-40") {
    Scenario s = parse_scenario(brownfloc::test::latex_paint_toml(surface_potential_mV,
                                                                  "salt = \"NaCl\"\nconcentration_mM = 10\n"),
                                "paint.toml");
    s.calibration_given = true;
    return s;
}

// log10 W of the latex in NaCl alone, from the dlvo report: a second path to the same
// model W (stability_ratio_experimental for measured-fast, the Honig-corrected absolute W
// for smoluchowski), so the data do not come from the code under test.
double dlvo_log10_w(double psi_mV, double concentration_mM, bool relative, double hamaker_J = 1e-20) {
    Scenario s = paint();
    s.species[0].surface_potential_mV = psi_mV;
    s.species[0].hamaker_J = hamaker_J;
    s.salt_concentration_mM = concentration_mM;
    const DlvoReport report = compute_dlvo_report(s);  // kept: pairs[0] lives in it
    const PairStability& pair = report.pairs[0];
    return relative ? pair.log10_stability_ratio_experimental : pair.log10_stability_ratio_hydrodynamic;
}

std::vector<CalibrationPoint> synthetic_points(const std::vector<double>& concentrations_mM, bool relative,
                                               double hamaker_J = 1e-20) {
    std::vector<CalibrationPoint> points;
    for (double c : concentrations_mM) {
        CalibrationPoint p;
        p.concentration_mM = c;
        p.stability_ratio = std::pow(10.0, dlvo_log10_w(psi_true_mV, c, relative, hamaker_J));
        points.push_back(p);
    }
    return points;
}

// splitmix64 (Steele, Lea & Flood 2014, OOPSLA "Fast splittable pseudorandom number
// generators"): portable, so the noisy data are the same everywhere.
struct SplitMix64 {
    std::uint64_t state;
    std::uint64_t next() {
        std::uint64_t z = (state += 0x9E3779B97F4A7C15ULL);
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9ULL;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBULL;
        return z ^ (z >> 31);
    }
    double uniform_open() { return (static_cast<double>(next() >> 11) + 0.5) * 0x1.0p-53; }  // in (0, 1)
};

// Box & Muller (1958), Ann. Math. Stat. 29, 610: one standard normal from two uniforms.
double standard_normal(SplitMix64& g) {
    const double u1 = g.uniform_open(), u2 = g.uniform_open();
    return std::sqrt(-2.0 * std::log(u1)) * std::cos(2.0 * 3.141592653589793 * u2);
}

std::string error_of(const Scenario& s) {
    try {
        (void)calibrate(s);
    } catch (const brownfloc::InputError& e) {
        return e.what();
    }
    return "";
}

bool has_warning(const CalibrationResult& r, const std::string& part) {
    for (const std::string& w : r.warnings)
        if (w.find(part) != std::string::npos) return true;
    return false;
}

}  // namespace

TEST_CASE("noise-free synthetic W give back the potential they were made with", "[sim][calibration]") {
    for (const bool relative : {true, false}) {
        Scenario s = paint();
        s.calibration.w_reference = relative ? "measured-fast" : "smoluchowski";
        s.calibration.points = synthetic_points(slow_branch_mM, relative);
        const CalibrationResult r = calibrate(s);
        REQUIRE(r.parameters.size() == 1);
        // Exact data: only the integrals' ~1e-9 error and the fit tolerance remain.
        CHECK_THAT(r.parameters[0].estimate, WithinAbs(psi_true_mV, 0.01));
        CHECK(r.converged);
        CHECK(r.chi_squared < 1e-8);
        CHECK(r.degrees_of_freedom == 4);
        CHECK_THAT(with_fit_values(s, r.fit_values).species[0].surface_potential_mV, WithinAbs(psi_true_mV, 0.01));
        // On exact data the model's log-log slope is the measured one.
        REQUIRE(r.slope_ratio);
        CHECK_THAT(*r.slope_ratio, WithinRel(1.0, 1e-5));
        // Extrapolation to the scenario's own 10 mM NaCl, from the dlvo report at the true psi.
        const double largest = dlvo_log10_w(psi_true_mV, slow_branch_mM.front(), relative);
        CHECK_THAT(r.extrapolation_decades, WithinAbs(dlvo_log10_w(psi_true_mV, 10, relative) - largest, 1e-4));
        CHECK(r.extrapolation_decades > 1);
        CHECK(has_warning(r, "the storage prediction extrapolates"));
    }
}

TEST_CASE("with 20 percent log-normal noise the 95 percent interval covers the true potential",
          "[sim][calibration]") {
    Scenario s = paint();
    s.calibration.points = synthetic_points({30, 35, 40, 50, 60, 70, 100}, true);
    SplitMix64 noise{1};  // seed 1; over 1000 seeds the interval covered 94.4 %
    for (CalibrationPoint& p : s.calibration.points) {
        p.relative_sd = 0.2;
        *p.stability_ratio *= std::exp(0.2 * standard_normal(noise));
    }
    const CalibrationResult r = calibrate(s);
    const FittedParameter& psi = r.parameters[0];
    CHECK(psi.ci95_low < psi_true_mV);
    CHECK(psi.ci95_high > psi_true_mV);
    CHECK_THAT(psi.ci95_high - psi.ci95_low, WithinRel(2 * 1.959963984540054 * psi.standard_error, 1e-12));
    CHECK(psi.standard_error > 0);
    CHECK(psi.standard_error < 1.0);  // seven points with 20 % errors pin psi to well under a mV
    // chi2/dof of order 1: chi2 with 6 dof lies in [0.676, 18.55] with 99 % probability (0.5 %
    // and 99.5 % points of the chi2 table, from memory).
    REQUIRE(r.reduced_chi_squared);
    CHECK(*r.reduced_chi_squared > 0.676 / 6);
    CHECK(*r.reduced_chi_squared < 18.55 / 6);
    CHECK_FALSE(psi.bound_message);
}

TEST_CASE("relative data fitted as absolute move psi by the reported shift", "[sim][calibration]") {
    Scenario s = paint();
    s.calibration.points = synthetic_points(slow_branch_mM, true);
    const CalibrationResult relative = calibrate(s);
    REQUIRE(relative.psi_shift_if_absolute_mV);
    Scenario wrong = s;
    wrong.calibration.w_reference = "smoluchowski";
    const CalibrationResult absolute = calibrate(wrong);
    CHECK_FALSE(absolute.psi_shift_if_absolute_mV);
    // Both fits converge to ~1e-7 mV.
    CHECK_THAT(absolute.parameters[0].estimate - relative.parameters[0].estimate,
               WithinAbs(*relative.psi_shift_if_absolute_mV, 1e-4));
    // The absolute W carries the van der Waals/drainage factor of the fast rate, so it is not zero.
    CHECK(std::abs(*relative.psi_shift_if_absolute_mV) > 0.1);
}

TEST_CASE("psi and A fitted together to high-W points only are flagged as correlated", "[sim][calibration]") {
    Scenario s = paint();
    s.calibration.parameters = {"surface_potential_mV", "hamaker_J"};
    s.calibration.points = synthetic_points({20, 25, 30}, true);
    const CalibrationResult r = calibrate(s);
    REQUIRE(r.psi_hamaker_correlation);
    CHECK(std::abs(*r.psi_hamaker_correlation) > 0.95);
    CHECK(has_warning(r, "psi and A cannot be told apart by these data"));
    REQUIRE(r.parameters.size() == 2);
    CHECK(r.parameters[1].name == "hamaker_J");
    CHECK_THAT(r.fit_values[1], WithinAbs(std::log10(r.parameters[1].estimate), 1e-12));
    // The covariance is symmetric and matches the reported correlation.
    CHECK_THAT(r.covariance[0][1], WithinRel(r.covariance[1][0], 1e-12));
    CHECK_THAT(*r.psi_hamaker_correlation,
               WithinRel(r.covariance[0][1] / std::sqrt(r.covariance[0][0] * r.covariance[1][1]), 1e-12));
}

TEST_CASE("a measured CCC alone fits psi so that the model CCC equals it", "[sim][calibration]") {
    Scenario s = paint();
    s.calibration.ccc_mM = 150.0;
    const CalibrationResult r = calibrate(s);
    CHECK(r.degrees_of_freedom == 0);
    CHECK_FALSE(r.reduced_chi_squared);
    REQUIRE(r.model_ccc_mM);
    // The CCC of the fitted scenario by `brownfloc ccc`'s own report (bisection to 1e-7).
    const CccReport ccc = compute_ccc_report(with_fit_values(s, r.fit_values));
    REQUIRE(ccc.pairs[0].ccc_mM);
    CHECK_THAT(*ccc.pairs[0].ccc_mM, WithinRel(150.0, 1e-5));
    CHECK_THAT(*r.model_ccc_mM, WithinRel(150.0, 1e-5));
    CHECK(r.ccc_salt == "NaCl");
}

TEST_CASE("rate constants in the half-k convention give the same psi as k with numbers twice as large",
          "[sim][calibration]") {
    // k_i = k_fast / W_i with W_i relative (measured-fast); k_fast 3e-18 m^3/s is an invented plateau.
    const double k_fast = 3e-18;
    const std::vector<CalibrationPoint> ratios = synthetic_points(slow_branch_mM, true);
    auto with_rates = [&](const char* convention, double scale) {
        Scenario s = paint();
        s.calibration.rate_convention = convention;
        s.calibration.fast_rate_constant_m3_per_s = k_fast * scale;
        for (CalibrationPoint p : ratios) {
            p.rate_constant_m3_per_s = k_fast / *p.stability_ratio * scale;
            p.stability_ratio.reset();
            s.calibration.points.push_back(p);
        }
        return s;
    };
    const CalibrationResult k = calibrate(with_rates("k", 1.0));
    const CalibrationResult half_k = calibrate(with_rates("half-k", 0.5));
    CHECK_THAT(half_k.parameters[0].estimate, WithinAbs(k.parameters[0].estimate, 1e-6));
    CHECK_THAT(k.parameters[0].estimate, WithinAbs(psi_true_mV, 0.01));
    CHECK_THAT(half_k.w_reference_note, Contains("half-k"));

    // Without rate_convention the numbers are ambiguous by a factor 2.
    Scenario none = with_rates("k", 1.0);
    none.calibration.rate_convention.reset();
    CHECK_THAT(error_of(none), Contains("points[0].rate_constant_m3_per_s") && Contains("rate_convention"));

    // Without fast_rate_constant_m3_per_s the largest measured rate is the plateau, and the result says so.
    Scenario largest = with_rates("k", 1.0);
    largest.calibration.fast_rate_constant_m3_per_s.reset();
    const CalibrationResult r = calibrate(largest);
    CHECK_THAT(r.w_reference_note, Contains("largest measured rate constant, points[4]"));
    CHECK_THAT(r.residuals[4].measured_w, WithinRel(1.0, 1e-12));
}

TEST_CASE("a fit driven outside the allowed potentials stops at the bound and says so", "[sim][calibration]") {
    // Measured-fast W below 1 everywhere: only psi = 0 (no barrier, W_rel = 1) comes close.
    Scenario s = paint();
    for (double c : {50.0, 100.0}) {
        CalibrationPoint p;
        p.concentration_mM = c;
        p.stability_ratio = 0.8;
        s.calibration.points.push_back(p);
    }
    const CalibrationResult r = calibrate(s);
    CHECK(r.parameters[0].estimate == 0.0);
    REQUIRE(r.parameters[0].bound_message);
    CHECK_THAT(*r.parameters[0].bound_message, Contains("bound") && Contains("standard error is not meaningful"));
}

TEST_CASE("calibration input that cannot be fitted is refused with the key and value", "[sim][calibration]") {
    Scenario s = paint();
    s.calibration.points = synthetic_points({50}, true);
    s.calibration.parameters = {"surface_potential_mV", "hamaker_J"};
    CHECK_THAT(error_of(s), Contains("paint.toml: [calibration] parameters: 2 fitted parameters") &&
                                Contains("there are 1 (1 points + 0 CCC)"));

    s = paint();
    s.calibration.points = synthetic_points({50}, true);
    s.calibration.parameters = {"zeta_mV"};
    CHECK_THAT(error_of(s), Contains("parameters: \"zeta_mV\" cannot be fitted") && Contains("hamaker_J"));

    s = paint("0");
    s.calibration.points = synthetic_points({50}, true);
    CHECK_THAT(error_of(s), Contains("surface_potential_mV = 0") && Contains("sign"));

    s = paint();
    s.species.push_back(s.species[0]);
    s.species[0].number_fraction = s.species[1].number_fraction = 0.5;
    s.calibration.points = synthetic_points({50}, true);
    CHECK_THAT(error_of(s), Contains("one particle species; the scenario has 2"));

    s = paint();
    s.calibration.points = synthetic_points({50}, true);
    s.calibration.w_reference = "absolute";
    CHECK_THAT(error_of(s), Contains("w_reference = \"absolute\""));

    s = paint();
    s.calibration.points = synthetic_points({50}, true);
    s.calibration.points[0].relative_sd = 0;
    CHECK_THAT(error_of(s), Contains("points[0].relative_sd = 0.0: must be > 0"));

    s = paint();
    s.calibration_given = false;
    CHECK_THAT(error_of(s), Contains("[calibration]"));
}

TEST_CASE("a point without a salt in a scenario that names none is refused", "[sim][calibration]") {
    Scenario s = parse_scenario(brownfloc::test::latex_paint_toml(
                                    "-40", "ions = [ { valence = 1, concentration_mM = 5 }, "
                                           "{ valence = -1, concentration_mM = 5 } ]\n"),
                                "paint.toml");
    s.calibration_given = true;
    s.calibration.points = synthetic_points({50}, true);
    CHECK_THAT(error_of(s), Contains("points[0].salt: not given"));
    s.calibration.points[0].salt = "NaCl";
    CHECK_NOTHROW(calibrate(s));
}

TEST_CASE("the calibration json and text carry the estimate and the warnings", "[sim][calibration]") {
    Scenario s = paint();
    s.calibration.points = synthetic_points({30, 50, 100}, true);
    const CalibrationResult r = calibrate(s);
    const std::string json = calibration_json(r).dump();
    CHECK_THAT(json, Contains("\"name\": \"surface_potential_mV\"") && Contains("\"psi_shift_if_absolute_mV\"") &&
                         Contains("\"covariance\"") && Contains("the storage prediction extrapolates"));
    std::ostringstream text;
    write_calibration_text(text, r);
    CHECK_THAT(text.str(), Contains("surface_potential_mV") && Contains("-25.00") && Contains("warning: "));
}

TEST_CASE("with the surface charge held the fitted psi is the potential in the scenario's own electrolyte",
          "[sim][calibration]") {
    // Data made by hand: the charge density of psi_true in the scenario's 10 mM NaCl (Grahame
    // 1947), the potential that charge has in each point's salt, then W from the dlvo report.
    namespace pot = brownfloc::potentials;
    Scenario s = paint();
    s.storage.surface_hold = "charge";
    const pot::Medium water = medium_of(s);
    const double sigma_C_per_m2 = pot::grahame_surface_charge_C_per_m2(psi_true_mV * 1e-3, electrolyte_of(s), water);
    for (double c : slow_branch_mM) {
        const double psi_mV =
            pot::grahame_surface_potential_V(sigma_C_per_m2, pot::Electrolyte::from_salt("NaCl", c), water) * 1e3;
        CalibrationPoint p;
        p.concentration_mM = c;
        p.stability_ratio = std::pow(10.0, dlvo_log10_w(psi_mV, c, true));
        s.calibration.points.push_back(p);
    }
    const CalibrationResult r = calibrate(s);
    // Exact data again: the fit tolerance and the Grahame inversion's rounding remain.
    CHECK_THAT(r.parameters[0].estimate, WithinAbs(psi_true_mV, 0.01));
    // Holding the potential instead misreads the same data (salt lowers a charged surface's potential).
    s.storage.surface_hold = "potential";
    CHECK(std::abs(calibrate(s).parameters[0].estimate - psi_true_mV) > 0.5);
}

TEST_CASE("a measured slope much shallower than the model's is flagged", "[sim][calibration]") {
    // Invented data with d log10 W / d log10 c = -1 over a decade of salt: far shallower than
    // the slow branch of this latex's DLVO W at any potential that reaches W ~ 100 there.
    Scenario s = paint();
    for (double c : {20.0, 50.0, 100.0, 200.0}) {
        CalibrationPoint p;
        p.concentration_mM = c;
        p.stability_ratio = std::pow(10.0, 2.5 - 1.0 * std::log10(c / 10.0));
        s.calibration.points.push_back(p);
    }
    const CalibrationResult r = calibrate(s);
    REQUIRE(r.slope_ratio);
    CHECK(*r.slope_ratio < 0.5);
    CHECK_THAT(*r.slope_ratio, WithinRel(*r.measured_slope / *r.model_slope, 1e-12));
    CHECK(r.slope_salt == "NaCl");
    CHECK(has_warning(r, "DLVO predicts a slope"));
    // The measured slope is an ordinary least-squares slope of log10 W on log10 c, recomputed here.
    double mx = 0, my = 0, sxy = 0, sxx = 0;
    for (const CalibrationResidual& p : r.residuals) mx += std::log10(p.concentration_mM) / 4, my += p.measured_log10_w / 4;
    for (const CalibrationResidual& p : r.residuals) {
        const double dx = std::log10(p.concentration_mM) - mx;
        sxy += dx * (p.measured_log10_w - my), sxx += dx * dx;
    }
    CHECK_THAT(*r.measured_slope, WithinRel(sxy / sxx, 1e-12));
    CHECK_THAT(*r.measured_slope, WithinRel(-1.0, 1e-12));
}
