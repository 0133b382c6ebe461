// The calibration result as JSON (calibration_json) and as the text block of the shelf-life
// report (write_calibration_text).
#include "sim/calibration.hpp"

#include <cmath>
#include <string>
#include <utility>

#include "calibration_detail.hpp"
#include "report_format.hpp"

namespace brownfloc::sim {

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
        const bool mv = f.name == detail::psi_name;
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
