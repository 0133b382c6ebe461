// The calibration result assembled from one fit: the fitted parameters with their 95 % intervals,
// the residuals and slopes of W, the fit statistics and the warnings.
#include <Eigen/Dense>
#include <algorithm>
#include <cmath>
#include <map>
#include <string>
#include <vector>

#include "calibration_detail.hpp"
#include "report_format.hpp"
#include "scenario_text.hpp"

namespace brownfloc::sim::detail {

namespace {

// Two-sided 95 % quantile of the standard normal distribution (the "1.96").
constexpr double z95 = 1.959963984540054;
// Where a fit counts as "at a bound": far below any step the data could resolve.
constexpr double at_bound_tolerance = 1e-6;

FittedParameter fitted_parameter(const CalibrationProblem& p, const CalibrationFit& fit, Eigen::Index j) {
    const double x = fit.lm.x[j], se = std::sqrt(fit.covariance(j, j));
    FittedParameter out;
    const bool at_low = x <= p.lower[j] + at_bound_tolerance, at_high = x >= p.upper[j] - at_bound_tolerance;
    if (p.coordinates[static_cast<std::size_t>(j)] == Coordinate::psi_mV) {
        out.name = psi_name;
        out.estimate = x, out.standard_error = se;
        out.ci95_low = x - z95 * se, out.ci95_high = x + z95 * se;
        if (at_low || at_high)
            out.bound_message = "surface_potential_mV ended at its bound " +
                                number_text(at_low ? p.lower[j] : p.upper[j]) +
                                " mV (|psi| is fitted in [0, 200] mV); its standard error is not meaningful there";
    } else {
        // Fitted as log10 A: the SE by the delta method, the interval from the log interval.
        out.name = hamaker_name;
        out.estimate = std::pow(10.0, x);
        out.standard_error = out.estimate * ln10 * se;
        out.ci95_low = std::pow(10.0, x - z95 * se), out.ci95_high = std::pow(10.0, x + z95 * se);
        if (at_low || at_high)
            out.bound_message = "hamaker_J ended at its bound " +
                                number_text(std::pow(10.0, at_low ? p.lower[j] : p.upper[j])) +
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

void add_residuals(CalibrationResult& out, const CalibrationProblem& p, const CalibrationFit& fit) {
    CalibrationModel model(p);
    const Scenario fitted = apply(p.base, p.coordinates, fit.lm.x);
    for (std::size_t i = 0; i < p.data.size(); ++i) {
        const CalibrationDatum& d = p.data[i];
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

void add_parameters(CalibrationResult& out, const CalibrationProblem& p, const CalibrationFit& fit) {
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

void add_fit_statistics(CalibrationResult& out, const CalibrationProblem& p, const CalibrationFit& fit) {
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

CalibrationResult result_of(const CalibrationProblem& p, const CalibrationFit& fit) {
    CalibrationResult out;
    out.warnings = p.warnings;
    add_fit_statistics(out, p, fit);
    add_parameters(out, p, fit);
    add_residuals(out, p, fit);
    add_slopes(out);
    return out;
}

}  // namespace brownfloc::sim::detail
