#include "sim/philox_noise.hpp"

#include <cmath>
#include <limits>

namespace brownfloc::sim {

namespace {

// Horner evaluation of c[0] + c[1] x + ... + c[7] x^7.
double polynomial7(const double (&c)[8], double x) {
    double s = c[7];
    for (int k = 6; k >= 0; --k) s = s * x + c[k];
    return s;
}

}  // namespace

double inverse_normal_cdf(double p) {
    // PPND16 of Wichura (1988), Appl. Statist. 37, 477, coefficients as published: a rational
    // function of (p - 1/2)^2 for |p - 1/2| <= 0.425, else of r = sqrt(-log(min(p, 1 - p)))
    // for r <= 5 and r > 5.
    static constexpr double a[8] = {3.3871328727963666080e0, 1.3314166789178437745e2, 1.9715909503065514427e3,
                                    1.3731693765509461125e4, 4.5921953931549871457e4, 6.7265770927008700853e4,
                                    3.3430575583588128105e4, 2.5090809287301226727e3};
    static constexpr double b[8] = {1.0,
                                    4.2313330701600911252e1,
                                    6.8718700749205790830e2,
                                    5.3941960214247511077e3,
                                    2.1213794301586595867e4,
                                    3.9307895800092710610e4,
                                    2.8729085735721942674e4,
                                    5.2264952788528545610e3};
    static constexpr double c[8] = {1.42343711074968357734e0, 4.63033784615654529590e0, 5.76949722146069140550e0,
                                    3.64784832476320460504e0, 1.27045825245236838258e0, 2.41780725177450611770e-1,
                                    2.27238449892691845833e-2, 7.74545014278341407640e-4};
    static constexpr double d[8] = {1.0,
                                    2.05319162663775882187e0,
                                    1.67638483018380384940e0,
                                    6.89767334985100004550e-1,
                                    1.48103976427480074590e-1,
                                    1.51986665636164571966e-2,
                                    5.47593808499534494600e-4,
                                    1.05075007164441684324e-9};
    static constexpr double e[8] = {6.65790464350110377720e0, 5.46378491116411436990e0, 1.78482653991729133580e0,
                                    2.96560571828504891230e-1, 2.65321895265761230930e-2, 1.24266094738807843860e-3,
                                    2.71155556874348757815e-5, 2.01033439929228813265e-7};
    static constexpr double f[8] = {1.0,
                                    5.99832206555887937690e-1,
                                    1.36929880922735805310e-1,
                                    1.48753612908506148525e-2,
                                    7.86869131145613259100e-4,
                                    1.84631831751005468180e-5,
                                    1.42151175831644588870e-7,
                                    2.04426310338993978564e-15};
    if (!(p > 0.0)) return p == 0.0 ? -std::numeric_limits<double>::infinity() : std::numeric_limits<double>::quiet_NaN();
    if (!(p < 1.0)) return p == 1.0 ? std::numeric_limits<double>::infinity() : std::numeric_limits<double>::quiet_NaN();
    const double q = p - 0.5;
    if (std::fabs(q) <= 0.425) {
        const double r = 0.180625 - q * q;
        return q * polynomial7(a, r) / polynomial7(b, r);
    }
    double r = std::sqrt(-std::log(q < 0.0 ? p : 1.0 - p));
    double z;
    if (r <= 5.0) {
        r -= 1.6;
        z = polynomial7(c, r) / polynomial7(d, r);
    } else {
        r -= 5.0;
        z = polynomial7(e, r) / polynomial7(f, r);
    }
    return q < 0.0 ? -z : z;
}

namespace detail {

NormalQuantileTable build_normal_quantile_table() {
    // Built in long double (64-bit mantissa on x86-64) so the change of variable to f adds no
    // rounding of its own; the nodes come from inverse_normal_cdf (double, about 1e-16).
    using real = long double;
    constexpr real inv_sqrt_2pi = 0.398942280401432677939946059934L;  // phi(z) = e^(-z^2/2) / sqrt(2 pi)
    constexpr real h = 1.0L / normal_intervals;                        // width of an interval in u
    // Node k at u = k h: z, and dz/dt = h Q'(u) = h / phi(z). Computed on the lower half and
    // mirrored, so the nodes are exactly antisymmetric: z_(4096 - k) = -z_k.
    std::array<real, normal_intervals + 1> z{}, slope{};
    for (std::uint32_t k = 1; k <= normal_intervals / 2; ++k) {
        const real zk = k == normal_intervals / 2 ? 0.0L : static_cast<real>(inverse_normal_cdf(static_cast<double>(k * h)));
        z[k] = zk;
        z[normal_intervals - k] = -zk;
        slope[k] = slope[normal_intervals - k] = h / (inv_sqrt_2pi * std::exp(-0.5L * zk * zk));
    }
    NormalQuantileTable table{};  // rows of the exact-path intervals stay zero and are never read
    constexpr real a = 1.0L / (1u << normal_fraction_bits);  // t = a f + b
    constexpr real b = 0.5L * a;
    for (std::uint32_t k = normal_exact_intervals_per_side; k < normal_intervals - normal_exact_intervals_per_side;
         ++k) {
        // Cubic Hermite on t in [0, 1] through (z_k, slope_k) and (z_(k+1), slope_(k+1)).
        const real dz = z[k + 1] - z[k];
        const real p[4] = {z[k], slope[k], 3 * dz - 2 * slope[k] - slope[k + 1], slope[k] + slope[k + 1] - 2 * dz};
        // The same cubic in f: sum_j p_j (a f + b)^j = sum_i q_i f^i.
        const real q[4] = {p[0] + b * (p[1] + b * (p[2] + b * p[3])),
                           a * (p[1] + b * (2 * p[2] + 3 * b * p[3])),
                           a * a * (p[2] + 3 * b * p[3]),
                           a * a * a * p[3]};
        for (int i = 0; i < 4; ++i) table[k].c[i] = static_cast<double>(q[i]);
    }
    return table;
}

double normal_from_bits_exact(std::uint32_t bits) {
    // The lower tail probability u, or the upper one 1 - u = (~bits + 1/2) 2^-32, both exact.
    return bits >> 31 ? -inverse_normal_cdf(uniform_open01(~bits)) : inverse_normal_cdf(uniform_open01(bits));
}

}  // namespace detail

}  // namespace brownfloc::sim
