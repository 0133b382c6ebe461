#include "uncertainty/standard_normal.hpp"

#include <cmath>
#include <limits>
#include <numbers>
#include <string>

#include "number_text.hpp"
#include "uncertainty/uncertainty_error.hpp"

namespace brownfloc::uncertainty {

namespace {

// Acklam's algorithm (P. J. Acklam, "An algorithm for computing the inverse normal cumulative
// distribution function", 2003, web page; coefficients as published there [from memory,
// checked by the tests against 1e-12]): a rational function of (p - 1/2) in the central region
// and of sqrt(-2 ln p) in the tail, relative error below 1.15e-9. Only called for p <= 1/2.
double acklam_lower_half(double p) {
    static constexpr double a[6] = {-3.969683028665376e+01, 2.209460984245205e+02, -2.759285104469687e+02,
                                    1.383577518672690e+02,  -3.066479806614716e+01, 2.506628277459239e+00};
    static constexpr double b[5] = {-5.447609879822406e+01, 1.615858368580409e+02, -1.556989798598866e+02,
                                    6.680131188771972e+01, -1.328068155288572e+01};
    static constexpr double c[6] = {-7.784894002430293e-03, -3.223964580411365e-01, -2.400758277161838e+00,
                                    -2.549732539343734e+00, 4.374664141464968e+00,  2.938163982698783e+00};
    static constexpr double d[4] = {7.784695709041462e-03, 3.224671290700398e-01, 2.445134137142996e+00,
                                    3.754408661907416e+00};
    constexpr double p_low = 0.02425;
    if (p < p_low) {
        const double q = std::sqrt(-2.0 * std::log(p));
        return (((((c[0] * q + c[1]) * q + c[2]) * q + c[3]) * q + c[4]) * q + c[5]) /
               ((((d[0] * q + d[1]) * q + d[2]) * q + d[3]) * q + 1.0);
    }
    const double q = p - 0.5;
    const double r = q * q;
    return (((((a[0] * r + a[1]) * r + a[2]) * r + a[3]) * r + a[4]) * r + a[5]) * q /
           (((((b[0] * r + b[1]) * r + b[2]) * r + b[3]) * r + b[4]) * r + 1.0);
}

}  // namespace

double standard_normal_cdf(double z) { return 0.5 * std::erfc(-z * std::numbers::sqrt2 / 2.0); }

double standard_normal_survival(double z) { return 0.5 * std::erfc(z * std::numbers::sqrt2 / 2.0); }

double standard_normal_quantile(double p) {
    if (!(p >= 0.0 && p <= 1.0)) {
        std::string message = "normal quantile: p = ";
        message += detail::number_text(p);
        message += ": must be in [0, 1]";
        throw UncertaintyError(message);
    }
    if (p == 0.0) return -std::numeric_limits<double>::infinity();
    if (p == 1.0) return std::numeric_limits<double>::infinity();
    // Work in the lower half only: for p >= 1/2, 1 - p is exact (Sterbenz), so the upper tail
    // keeps full relative accuracy in 1 - p and the result is antisymmetric.
    if (p > 0.5) return -standard_normal_quantile(1.0 - p);
    double z = acklam_lower_half(p);
    // One Halley step on f(z) = Phi(z) - p (cubic convergence: 1e-9 -> below 1e-15):
    // u = f / phi(z), z <- z - u / (1 + z u / 2). Acklam (2003) suggests this refinement.
    // Skipped where phi(z) underflows (|z| > 38.5, p < 1e-323), where Acklam alone is used.
    const double density = std::exp(-0.5 * z * z) / std::sqrt(2.0 * std::numbers::pi);
    if (density > 0.0) {
        const double u = (standard_normal_cdf(z) - p) / density;
        z -= u / (1.0 + 0.5 * z * u);
    }
    return z;
}

}  // namespace brownfloc::uncertainty
