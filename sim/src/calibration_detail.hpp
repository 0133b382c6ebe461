#pragma once
// Names and types shared by the calibration's sources (private to sim/): the checked problem,
// the model of W at a point, and one complete fit.
#include <Eigen/Dense>
#include <map>
#include <optional>
#include <string>
#include <utility>
#include <vector>

#include "calibration_fit.hpp"
#include "sim/calibration.hpp"
#include "sim/scenario.hpp"
#include "sim/storage_conditions.hpp"

namespace brownfloc::sim::detail {

// The fitted parameters as named in [calibration] parameters and in the results.
const char* const psi_name = "surface_potential_mV";
const char* const hamaker_name = "hamaker_J";

inline constexpr double ln10 = 2.302585092994046;
inline constexpr double celsius_K = 273.15;
inline constexpr double log10_hamaker_low = -22.0, log10_hamaker_high = -18.0;

enum class Coordinate { psi_mV, log10_hamaker };

// One measurement with its W formed (ln W) and its conditions resolved.
struct CalibrationDatum {
    double concentration_mM = 0;
    std::string salt;
    double temperature_K = 0;
    double log_w = 0;
    double relative_sd = 0;
};

// Everything the fit needs, validated once.
struct CalibrationProblem {
    Scenario base;
    std::vector<Coordinate> coordinates;
    Eigen::VectorXd lower, upper, start, step, tolerance;
    std::vector<CalibrationDatum> data;
    std::optional<double> ccc_mM;
    double ccc_relative_sd = 0.1;
    std::string ccc_salt;
    bool relative = true;  // w_reference = "measured-fast"
    SurfaceHold hold = SurfaceHold::potential;
    bool hydrodynamic = true;
    std::string w_reference_note;
    std::vector<std::string> warnings;
};

// One complete fit: the LM outcome and the covariance at its optimum.
struct CalibrationFit {
    LmOutcome lm;
    Eigen::MatrixXd covariance;
};

// ---- calibration_data.cpp: the [calibration] data checked, with ln W formed from them ----

// The fitted coordinates named by [calibration] parameters, checked.
[[nodiscard]] std::vector<Coordinate> coordinates_of(const Scenario& s);

// The checked problem of the scenario's [calibration] section; throws InputError naming the key.
[[nodiscard]] CalibrationProblem make_problem(const Scenario& s);

// ---- calibration.cpp: the model of W at a point --------------------------------------------

// The scenario with the fitted coordinates set to x (psi in mV, log10 of A in J).
[[nodiscard]] Scenario apply(const Scenario& s, const std::vector<Coordinate>& coordinates, const Eigen::VectorXd& x);

// The scenario in the electrolyte of one measurement: that salt alone, at that temperature.
[[nodiscard]] Scenario at_conditions(const Scenario& fitted, const std::string& salt, double concentration_mM,
                                     double temperature_K);

// The model's ln W and CCC for a problem; keeps the van der Waals only ln W per (T, A).
// Not thread-safe (the cache): one per fit, called serially.
class CalibrationModel {
public:
    explicit CalibrationModel(const CalibrationProblem& p) : p_(p) {}

    // ln W of the model in `salt` at concentration_mM and temperature_K, with the fitted
    // scenario (whose own conditions fix the surface charge when it is held).
    double log_w(const Scenario& fitted, const std::string& salt, double concentration_mM, double temperature_K);

    // ln W at the fitted scenario's own electrolyte and temperature.
    double own_log_w(const Scenario& fitted);

    // The barrier CCC [mM] of the CCC salt (see calibration.cpp).
    double ccc_mM(const Scenario& fitted);

private:
    double log_w_at(const Scenario& at, const Scenario& charge_reference);
    double log_w_vdw_only(const Scenario& at);

    const CalibrationProblem& p_;
    std::map<std::pair<double, double>, double> vdw_only_;
};

// ---- calibration_result.cpp: the result assembled ------------------------------------------

// The result of the fit of p: parameters with intervals, residuals, slopes, statistics and
// warnings (p's own first). psi_shift_if_absolute_mV is left for calibrate() to set.
[[nodiscard]] CalibrationResult result_of(const CalibrationProblem& p, const CalibrationFit& fit);

}  // namespace brownfloc::sim::detail
