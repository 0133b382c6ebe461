#include "potentials/van_der_waals.hpp"

#include <cmath>

namespace brownfloc::potentials {

EnergySlope vdw_hamaker_full(double hamaker_J, double a1_m, double a2_m, double h_m) {
    // Hamaker (1937): U = -(A/6)[2a1a2/(r^2-s^2) + 2a1a2/(r^2-d^2) + ln((r^2-s^2)/(r^2-d^2))]
    // with s = a1+a2, d = a1-a2, r = s+h. With q = r^2-d^2, p = r^2-s^2 = h(2s+h) and
    // x = 4a1a2/q (so 1-x = p/q): U = -(A/6) g(x), g = x q/(2p) + x/2 + ln(p/q), and
    // dU/dh = (A/6) x^3 r q / p^2 (differentiated by hand; checked against finite
    // differences in the tests).
    if (hamaker_J == 0.0) return {};
    const double s = a1_m + a2_m, d = a1_m - a2_m, r = s + h_m;
    const double q = r * r - d * d, p = h_m * (2.0 * s + h_m);
    const double x = 4.0 * a1_m * a2_m / q;
    double g;
    if (x < 0.02) {
        // g(x) = sum_{n>=3} (n-2)/(2n) x^n: the far field without cancelling logarithms.
        double xn = x * x * x;
        g = 0.0;
        for (int n = 3; n < 16; ++n) {
            g += (n - 2.0) / (2.0 * n) * xn;
            xn *= x;
        }
    } else {
        g = 0.5 * x * q / p + 0.5 * x + std::log(p / q);
    }
    return {-hamaker_J / 6.0 * g, vdw_hamaker_full_slope(hamaker_J, a1_m, a2_m, h_m)};
}

double vdw_hamaker_full_slope(double hamaker_J, double a1_m, double a2_m, double h_m) {
    const double s = a1_m + a2_m, d = a1_m - a2_m, r = s + h_m;
    const double q = r * r - d * d, p = h_m * (2.0 * s + h_m);
    const double x = 4.0 * a1_m * a2_m / q;
    return hamaker_J / 6.0 * x * x * x * r * q / (p * p);
}

EnergySlope vdw_derjaguin(double hamaker_J, double a1_m, double a2_m, double h_m) {
    const double reduced = a1_m * a2_m / (a1_m + a2_m);
    const double u = -hamaker_J * reduced / (6.0 * h_m);
    return {u, -u / h_m};
}

EnergySlope gregory_kernel(double h_m) {
    // f = 1 - (b h/lambda) ln(1 + lambda/(b h)); f' = -(b/lambda) ln(1 + lambda/(bh)) + b/(bh + lambda).
    const double bh = gregory_b * h_m;
    const double log_term = std::log1p(gregory_lambda_m / bh);
    const double f = 1.0 - bh / gregory_lambda_m * log_term;
    const double df = -gregory_b / gregory_lambda_m * log_term + gregory_b / (bh + gregory_lambda_m);
    return {f / h_m, df / h_m - f / (h_m * h_m)};
}

EnergySlope vdw_gregory_from_kernel(double hamaker_J, double a1_m, double a2_m, const EnergySlope& kernel) {
    // Gregory (1981) [equation number not checked] (sphere-sphere via Derjaguin): U = -(A R/6) f(h)/h, R = a1 a2/(a1+a2).
    const double factor = -hamaker_J * a1_m * a2_m / (a1_m + a2_m) / 6.0;
    return {factor * kernel.energy_J, factor * kernel.slope_J_per_m};
}

EnergySlope vdw_gregory_retarded(double hamaker_J, double a1_m, double a2_m, double h_m) {
    return vdw_gregory_from_kernel(hamaker_J, a1_m, a2_m, gregory_kernel(h_m));
}

EnergySlope van_der_waals(VdwForm form, double hamaker_J, double a1_m, double a2_m, double h_m) {
    switch (form) {
        case VdwForm::hamaker_full: return vdw_hamaker_full(hamaker_J, a1_m, a2_m, h_m);
        case VdwForm::derjaguin: return vdw_derjaguin(hamaker_J, a1_m, a2_m, h_m);
        case VdwForm::gregory_retarded: return vdw_gregory_retarded(hamaker_J, a1_m, a2_m, h_m);
    }
    return {};
}

}  // namespace brownfloc::potentials
