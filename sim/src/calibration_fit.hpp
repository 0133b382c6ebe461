#pragma once
// Levenberg-Marquardt weighted least squares with box bounds, and the covariance at the
// optimum (private to sim/; the fitting routine of the calibration).
#include <Eigen/Dense>
#include <functional>

namespace brownfloc::sim::detail {

// The weighted residuals (each divided by its sd) at the fitted coordinates x.
using ResidualFn = std::function<Eigen::VectorXd(const Eigen::VectorXd&)>;

// Per coordinate, in the coordinate's own unit: the box [lower, upper], the step of the
// numeric derivative and the change below which a step counts as converged.
struct Bounds {
    Eigen::VectorXd lower, upper, step, tolerance;
};

struct LmOutcome {
    Eigen::VectorXd x, r;
    Eigen::MatrixXd jacobian;  // of the residuals at x
    int iterations = 0;
    bool converged = false;
};

// Minimises |f(x)|^2 inside the box from the start x (Marquardt 1963); f is called serially.
[[nodiscard]] LmOutcome levenberg_marquardt(const ResidualFn& f, Eigen::VectorXd x, const Bounds& b);

// (J^T J)^-1 for the Jacobian jac of weighted residuals; where J^T J is singular, infinite
// variances and NaN covariances.
[[nodiscard]] Eigen::MatrixXd covariance_of(const Eigen::MatrixXd& jac);

}  // namespace brownfloc::sim::detail
