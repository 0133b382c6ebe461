// Levenberg-Marquardt weighted least squares with box bounds and numeric derivatives, and the
// covariance (J^T J)^-1 at the optimum: the fitting routine of the calibration.
#include "calibration_fit.hpp"

#include <algorithm>
#include <limits>

namespace brownfloc::sim::detail {

namespace {

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

}  // namespace

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

Eigen::MatrixXd covariance_of(const Eigen::MatrixXd& jac) {
    const Eigen::MatrixXd h = jac.transpose() * jac;
    const Eigen::FullPivLU<Eigen::MatrixXd> lu(h);
    if (lu.isInvertible()) return lu.inverse();
    // A direction the data do not constrain: infinite variance.
    Eigen::MatrixXd c = Eigen::MatrixXd::Constant(h.rows(), h.cols(), std::numeric_limits<double>::quiet_NaN());
    c.diagonal().setConstant(std::numeric_limits<double>::infinity());
    return c;
}

}  // namespace brownfloc::sim::detail
