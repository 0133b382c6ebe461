#pragma once
// Calibration of the shelf-life model to measured aggregation rates: fits the surface
// potential and/or the Hamaker constant of a one-species scenario so that the model's
// stability ratio W matches measured W (or rate constants) of the dispersion in salt
// solutions, optionally with a measured CCC.
//
// Method: weighted least squares in ln W (log-normal errors; the given relative_sd is the sd
// of ln W, common practice), Levenberg-Marquardt (Marquardt 1963, SIAM J. Appl. Math. 11,
// 431) with central numeric derivatives and box bounds; covariance (J^T J)^-1 at the optimum
// with the weights in the residuals, and 95 % intervals estimate +- 1.96 SE (normal, since the
// sds are given rather than estimated from the scatter).
//
//   Scenario s = load_scenario("paint.toml");          // with a [calibration] section
//   CalibrationResult fit = calibrate(s);
//   Scenario calibrated = with_fit_values(s, fit.fit_values);
//
// W conventions (w_reference): "measured-fast" compares the data with the model's
// W(psi) / W(van der Waals only), "smoluchowski" with the absolute W relative to 8kT/3eta;
// both with the Honig factor when [storage] hydrodynamic_correction is on. Pure functions;
// calibrate costs of order (points x iterations x 3) stability-ratio integrals (~ms each).
#include <optional>
#include <ostream>
#include <string>
#include <vector>

#include "sim/json_writer.hpp"
#include "sim/scenario.hpp"

namespace brownfloc::sim {

struct FittedParameter {
    std::string name;            // "surface_potential_mV" | "hamaker_J"
    double estimate = 0;         // mV or J
    double standard_error = 0;   // same unit; +inf when the data do not determine it
    double ci95_low = 0, ci95_high = 0;
    std::optional<std::string> bound_message;  // set when the fit ended at a bound
};

struct CalibrationResidual {
    double concentration_mM = 0;
    std::string salt;
    double temperature_C = 0;
    double measured_w = 0;        // as formed from the data (see w_reference_note)
    double model_w = 0;           // +inf when above the double range (see model_log10_w)
    double measured_log10_w = 0;
    double model_log10_w = 0;
    double weighted_residual = 0; // (ln W_meas - ln W_model) / relative_sd
};

struct CalibrationResult {
    std::string w_reference;                          // "measured-fast" | "smoluchowski"
    std::vector<FittedParameter> parameters;          // in settings.parameters order; hamaker in J (estimate and SE converted from the log fit, CI from the log interval)
    std::vector<std::string> fit_coordinates;         // "surface_potential_mV" | "log10_hamaker_J"
    std::vector<double> fit_values;                   // the fitted values in the fit's own coordinates (psi mV, log10 A)
    std::vector<std::vector<double>> covariance;      // of fit_values
    std::optional<double> psi_hamaker_correlation;
    std::vector<CalibrationResidual> residuals;
    std::optional<double> measured_ccc_mM, model_ccc_mM, ccc_weighted_residual;
    std::string ccc_salt;                             // set with a measured CCC
    double chi_squared = 0;
    int degrees_of_freedom = 0;
    std::optional<double> reduced_chi_squared;        // chi2 / dof; empty when dof = 0
    int iterations = 0;
    bool converged = false;
    double extrapolation_decades = 0;                 // log10 W_model (scenario's own salt and T) - log10 max W_meas
    std::optional<double> measured_slope, model_slope; // d log10 W / d log10 c over the slow branch
    std::optional<double> slope_ratio;                // measured / model
    std::string slope_salt;                           // the salt the slopes are taken over
    std::optional<double> psi_shift_if_absolute_mV;   // psi(data taken as absolute W) - psi(fit)
    std::string w_reference_note;                     // how W was formed from the data
    std::string interval_note;                        // how the 95 % intervals were formed
    std::vector<std::string> warnings;
};

// Fits scenario.calibration.parameters to scenario.calibration's data. Throws InputError for
// inconsistent input (no [calibration], several species, unknown parameter, psi fitted with a
// zero scenario potential, rate constants without rate_convention, fewer data than parameters).
[[nodiscard]] CalibrationResult calibrate(const Scenario& scenario);

// The scenario with fit coordinates applied (psi mV, log10 A in settings.parameters order): used by the Monte Carlo, which draws fit_values jointly from N(fit_values, covariance).
[[nodiscard]] Scenario with_fit_values(const Scenario& scenario, const std::vector<double>& fit_values);

[[nodiscard]] Json calibration_json(const CalibrationResult& result);
void write_calibration_text(std::ostream& out, const CalibrationResult& result);

}  // namespace brownfloc::sim
