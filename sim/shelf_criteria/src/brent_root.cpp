#include "brent_root.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <stdexcept>
#include <utility>

namespace brownfloc::shelf::detail {

double brent_root(const std::function<double(double)>& f, double lo, double hi, double f_lo,
                  double f_hi, double relative_tolerance) {
    if (f_lo == 0.0) return lo;
    if (f_hi == 0.0) return hi;
    if ((f_lo > 0.0) == (f_hi > 0.0))
        throw std::invalid_argument("brent_root: the interval does not bracket a sign change");
    constexpr double epsilon = std::numeric_limits<double>::epsilon();
    // b: best estimate; a: previous b; c: the other end of the bracket [b, c].
    double a = lo, b = hi, c = lo;
    double fa = f_lo, fb = f_hi, fc = f_lo;
    double step = b - a, previous_step = step;
    // Each pass at least halves the bracket every few iterations; 1000 is far beyond what
    // any bracket of doubles needs.
    for (int iteration = 0; iteration < 1000; ++iteration) {
        if ((fb > 0.0) == (fc > 0.0)) {
            c = a;
            fc = fa;
            step = previous_step = b - a;
        }
        if (std::abs(fc) < std::abs(fb)) {
            a = b; b = c; c = a;
            fa = fb; fb = fc; fc = fa;
        }
        const double tolerance = 2.0 * epsilon * std::abs(b) + 0.5 * relative_tolerance * std::abs(b);
        const double half_bracket = 0.5 * (c - b);
        if (std::abs(half_bracket) <= tolerance || fb == 0.0) return b;
        if (std::abs(previous_step) >= tolerance && std::abs(fa) > std::abs(fb)) {
            double p = 0.0, q = 0.0;
            const double s = fb / fa;
            if (a == c) {  // secant
                p = 2.0 * half_bracket * s;
                q = 1.0 - s;
            } else {       // inverse quadratic interpolation
                const double qa = fa / fc, r = fb / fc;
                p = s * (2.0 * half_bracket * qa * (qa - r) - (b - a) * (r - 1.0));
                q = (qa - 1.0) * (r - 1.0) * (s - 1.0);
            }
            if (p > 0.0) q = -q; else p = -p;
            if (2.0 * p < std::min(3.0 * half_bracket * q - std::abs(tolerance * q),
                                   std::abs(previous_step * q))) {
                previous_step = step;
                step = p / q;
            } else {
                step = previous_step = half_bracket;
            }
        } else {
            step = previous_step = half_bracket;
        }
        a = b;
        fa = fb;
        b += std::abs(step) > tolerance ? step : (half_bracket > 0.0 ? tolerance : -tolerance);
        fb = f(b);
    }
    throw std::logic_error("brent_root: no convergence in 1000 iterations");
}

}  // namespace brownfloc::shelf::detail
