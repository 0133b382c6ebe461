#include "sim/rate_fit.hpp"

#include <algorithm>
#include <cassert>
#include <cmath>
#include <limits>
#include <sstream>
#include <vector>

#include "potentials/input_error.hpp"
#include "sim/coagulation_reference.hpp"

namespace brownfloc::sim {
namespace {

// Fewest events for which a rate is reported: below this the 95 % interval spans more than
// a factor of 7 and the number says little.
constexpr std::int64_t min_events = 5;

std::string fmt(double v) {
    std::ostringstream s;
    s.precision(6);
    s << v;
    return s.str();
}

// ln Gamma(n) = ln (n-1)! for integer n >= 1. Summed logarithms below 20; above, Stirling's
// series (Abramowitz & Stegun 1964, 6.1.41) to the n^-7 term, whose first dropped term
// 1/(1188 m^9) is < 2e-15 for m >= 20. Written out because std::lgamma may set the global
// signgam (glibc), which is a data race when fits run on several threads.
double log_gamma_of_integer(double n) {
    const double m = n - 1.0;  // ln m!
    if (m < 20.0) {
        double sum = 0.0;
        for (double j = 2.0; j <= m; j += 1.0) sum += std::log(j);
        return sum;
    }
    const double inv = 1.0 / m, inv2 = inv * inv;
    return m * std::log(m) - m + 0.5 * std::log(2.0 * 3.14159265358979323846 * m) +
           inv * (1.0 / 12.0 - inv2 * (1.0 / 360.0 - inv2 * (1.0 / 1260.0 - inv2 / 1680.0)));
}

// Regularized lower incomplete gamma P(a, x) for integer a >= 1: the series A&S 6.5.29 below
// x = a + 1, else 1 - Q from Legendre's continued fraction (A&S 6.5.31) evaluated by the
// modified Lentz method (Thompson & Barnett 1986, J. Comput. Phys. 64, 490).
double regularized_gamma_p(double a, double x) {
    if (x <= 0.0) return 0.0;
    const double log_prefactor = a * std::log(x) - x - log_gamma_of_integer(a);
    constexpr double eps = 1e-16, tiny = 1e-300;
    if (x < a + 1.0) {
        double term = 1.0 / a, sum = term;
        for (int n = 1; n < 100000 && term > eps * sum; ++n) {
            term *= x / (a + n);
            sum += term;
        }
        return sum * std::exp(log_prefactor);
    }
    double b = x + 1.0 - a, c = 1.0 / tiny, d = 1.0 / b, h = d;
    for (int i = 1; i < 100000; ++i) {
        const double an = -i * (i - a);
        b += 2.0;
        d = an * d + b;
        if (std::fabs(d) < tiny) d = tiny;
        c = b + an / c;
        if (std::fabs(c) < tiny) c = tiny;
        d = 1.0 / d;
        const double delta = d * c;
        h *= delta;
        if (std::fabs(delta - 1.0) < eps) break;
    }
    return 1.0 - std::exp(log_prefactor) * h;
}

// x with P(a, x) = p, by bisection (P rises monotonically in x) to 1e-14 relative.
double gamma_quantile(double a, double p) {
    double lo = 0.0, hi = a + 10.0 * std::sqrt(a) + 10.0;
    while (regularized_gamma_p(a, hi) < p) hi *= 2.0;
    for (int i = 0; i < 400 && hi - lo > 1e-14 * hi; ++i) {
        const double mid = 0.5 * (lo + hi);
        (regularized_gamma_p(a, mid) < p ? lo : hi) = mid;
    }
    return 0.5 * (lo + hi);
}

void check_rate_input(std::span<const CountSample> samples, const RateFitInput& in) {
    auto fail = [](const std::string& what) { throw InputError("rate fit: " + what); };
    if (!(std::isfinite(in.volume_m3) && in.volume_m3 > 0))
        fail("volume_m3 = " + fmt(in.volume_m3) + ": must be finite and > 0");
    if (in.initial_particles < 2)
        fail("initial_particles = " + std::to_string(in.initial_particles) + ": must be >= 2");
    if (!(std::isfinite(in.contact_distance_m) && in.contact_distance_m >= 0))
        fail("contact_distance_m = " + fmt(in.contact_distance_m) + ": must be finite and >= 0");
    if (!(in.relative_diffusion_m2_per_s > 0))  // +infinity allowed, NaN not
        fail("relative_diffusion_m2_per_s = " + fmt(in.relative_diffusion_m2_per_s) +
             ": must be > 0 (+infinity drops the transient term)");
    if (!(in.min_fraction > 0 && in.min_fraction < 1))
        fail("min_fraction = " + fmt(in.min_fraction) + ": must lie in (0, 1)");
    double previous_s = 0.0;
    for (std::size_t i = 0; i < samples.size(); ++i) {
        const CountSample& s = samples[i];
        if (!(std::isfinite(s.time_s) && s.time_s >= previous_s))
            fail("sample " + std::to_string(i) + ": time_s = " + fmt(s.time_s) +
                 ": must be finite, >= 0 and not before the previous sample (" + fmt(previous_s) + ")");
        if (s.clusters < 1 || s.clusters > in.initial_particles)
            fail("sample " + std::to_string(i) + ": clusters = " + std::to_string(s.clusters) +
                 ": must lie in [1, initial_particles = " + std::to_string(in.initial_particles) + "]");
        previous_s = s.time_s;
    }
}

// {k * lower / M, k * upper / M} from Garwood's interval, with the relative half-widths
// stretched by sqrt(design_effect) (1 for a pure counting estimate). Lower bound kept >= 0.
std::array<double, 2> scaled_interval(double rate, std::int64_t events, double design_effect) {
    const std::array<double, 2> g = poisson_interval95(events);
    const double m = static_cast<double>(events), stretch = std::sqrt(design_effect);
    return {std::max(0.0, rate * (1.0 - (1.0 - g[0] / m) * stretch)),
            rate * (1.0 + (g[1] / m - 1.0) * stretch)};
}

}  // namespace

std::array<double, 2> poisson_interval95(std::int64_t count) {
    assert(count >= 0);
    const double m = static_cast<double>(count);
    return {count == 0 ? 0.0 : gamma_quantile(m, 0.025), gamma_quantile(m + 1.0, 0.975)};
}

RateFit fit_early_rate(std::span<const CountSample> samples, const RateFitInput& in) {
    check_rate_input(samples, in);
    RateFit fit;
    const double n0 = static_cast<double>(in.initial_particles), v = in.volume_m3;
    std::size_t end = 0;
    while (end < samples.size() && static_cast<double>(samples[end].clusters) >= in.min_fraction * n0) ++end;
    if (end == 0) {
        fit.note = samples.empty() ? "no samples" : "empty window: the first sample already has N/N0 < " + fmt(in.min_fraction);
        return fit;
    }
    fit.window_s = samples[end - 1].time_s;
    fit.events = in.initial_particles - samples[end - 1].clusters;

    // f(t) = 1/2 T(t); y = V/N - V/N0 = 1/n - 1/n0.
    std::vector<double> f(end);
    double sum_ff = 0.0, sum_fy = 0.0;
    for (std::size_t i = 0; i < end; ++i) {
        f[i] = 0.5 * transient_integrated_time_s(samples[i].time_s, in.contact_distance_m,
                                                 in.relative_diffusion_m2_per_s);
        const double y = v / static_cast<double>(samples[i].clusters) - v / n0;
        sum_ff += f[i] * f[i];
        sum_fy += f[i] * y;
    }
    if (sum_ff == 0.0) {
        fit.note = "empty window: no sample after t = 0 with N/N0 >= " + fmt(in.min_fraction);
        return fit;
    }
    if (fit.events < min_events) {
        fit.note = "only " + std::to_string(fit.events) + " aggregation events by t = " + fmt(fit.window_s) +
                   " s (N/N0 >= " + fmt(in.min_fraction) + "); at least 5 are needed";
        return fit;
    }
    const double rate = sum_fy / sum_ff;

    // Design effect. y(t) - k f(t) is a martingale: each merger at count N adds V/(N(N-1)) to
    // y, at intensity k N(N-1)/V df/dt, so its variance grows by k V/(N(N-1)) df while the
    // count is N. With Q_m that variance up to sample m, Cov(y_i, y_j) = Q_min(i,j) and
    //   Var(k_hat) = sum_ij f_i f_j Q_min(i,j) / S^2 = sum_m dQ_m (sum_{i>=m} f_i)^2 / S^2,
    // S = sum f_i^2. Between samples the count is the earlier sample's (N0 before the first),
    // exact when every change is sampled. k_hat stands in for k.
    double suffix = 0.0, weighted = 0.0;
    for (std::size_t m = end; m-- > 0;) {
        suffix += f[m];
        const double before = m == 0 ? n0 : static_cast<double>(samples[m - 1].clusters);
        const double df = f[m] - (m == 0 ? 0.0 : f[m - 1]);
        if (before >= 2.0) weighted += rate * v / (before * (before - 1.0)) * df * suffix * suffix;
    }
    const double variance = weighted / (sum_ff * sum_ff);
    fit.design_effect = variance * static_cast<double>(fit.events) / (rate * rate);
    fit.rate_m3_per_s = rate;
    fit.ci95_m3_per_s = scaled_interval(rate, fit.events, fit.design_effect);
    fit.note = "Garwood 95 % interval for " + std::to_string(fit.events) +
               " events, widened by sqrt(design effect " + fmt(fit.design_effect) + ")";
    return fit;
}

RateEstimate monomer_pair_rate(std::int64_t events, double exposure_s_per_m3) {
    if (events < 0)
        throw InputError("pair rate: events = " + std::to_string(events) + ": must be >= 0");
    if (!(std::isfinite(exposure_s_per_m3) && exposure_s_per_m3 >= 0))
        throw InputError("pair rate: exposure_s_per_m3 = " + fmt(exposure_s_per_m3) + ": must be finite and >= 0");
    RateEstimate out;
    out.events = events;
    if (exposure_s_per_m3 == 0.0) {
        out.note = "zero exposure: the pair never coexisted";
        return out;
    }
    if (events < min_events) {
        out.note = "only " + std::to_string(events) + " events of this pair; at least 5 are needed";
        return out;
    }
    // Likelihood of a Poisson process of intensity k w(t): M ln k - k E, maximal at k = M/E;
    // M is Poisson with mean k E, so Garwood's interval for the mean divided by E bounds k.
    const std::array<double, 2> g = poisson_interval95(events);
    out.rate_m3_per_s = static_cast<double>(events) / exposure_s_per_m3;
    out.ci95_m3_per_s = std::array<double, 2>{g[0] / exposure_s_per_m3, g[1] / exposure_s_per_m3};
    out.note = "maximum likelihood; Garwood 95 % interval for " + std::to_string(events) + " events";
    return out;
}

double pair_exposure_s_per_m3(std::int64_t count_i, std::int64_t count_j, bool same_species, double volume_m3,
                              double t0_s, double t1_s, double contact_distance_m,
                              double relative_diffusion_m2_per_s) {
    assert(count_i >= 0 && count_j >= 0 && volume_m3 > 0 && 0 <= t0_s && t0_s <= t1_s);
    const double mi = static_cast<double>(count_i), mj = static_cast<double>(count_j);
    const double pairs = same_species ? 0.5 * mi * (mi - 1.0) : mi * mj;
    if (pairs <= 0.0) return 0.0;
    const double dt = transient_integrated_time_s(t1_s, contact_distance_m, relative_diffusion_m2_per_s) -
                      transient_integrated_time_s(t0_s, contact_distance_m, relative_diffusion_m2_per_s);
    return pairs / volume_m3 * dt;
}

}  // namespace brownfloc::sim
