#include "potentials/fast_stability_ratio.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <limits>
#include <sstream>
#include <vector>

#include "potentials/extrema.hpp"
#include "potentials/input_error.hpp"
#include "potentials/stability_ratio.hpp"

namespace brownfloc::potentials {
namespace {

// Chosen on ~20 000 pairs of the checked range (random draws and a grid of its corners, also
// unequal radii, 5-45 degC and min_gap 0.1-1 nm) against the careful routine: the worst
// |ln W error| was 2e-9 with ~200 evaluations of U per call. Six Gauss points left 2e-7,
// panels of 0.5 or a scan step of 0.1 cost more and gained nothing measurable.
constexpr int gauss_order = 8;
constexpr double scan_step = 0.2;      // grid step of the peak scan, in t = ln h
constexpr double widest_panel = 1.0;   // in t, away from peaks
constexpr double negligible_e_folds = 40.0;  // peaks this far below the top add < e^-40
constexpr double narrowest_peak = 1e-12;     // in t: near the resolution of a double there

struct GaussLegendreRule {
    std::array<double, gauss_order> nodes{}, weights{};
};

// Roots of P_n by Newton's method on the recurrence (k+1) P_{k+1} = (2k+1) x P_k - k P_{k-1},
// starting from cos(pi (i + 3/4)/(n + 1/2)) (Tricomi's asymptotic form, common practice);
// weights 2 / ((1 - x^2) P_n'(x)^2) (Abramowitz & Stegun 1964, eq. 25.4.29 [from memory]).
GaussLegendreRule make_gauss_legendre() {
    constexpr double pi = 3.14159265358979323846;
    constexpr int n = gauss_order;
    GaussLegendreRule rule;
    for (int i = 0; i < n; ++i) {
        double x = std::cos(pi * (i + 0.75) / (n + 0.5)), derivative = 0.0;
        for (int iteration = 0; iteration < 100; ++iteration) {
            double p = 1.0, p_previous = 0.0;
            for (int k = 0; k < n; ++k) {
                const double p_next = ((2.0 * k + 1.0) * x * p - k * p_previous) / (k + 1.0);
                p_previous = p;
                p = p_next;
            }
            derivative = n * (x * p - p_previous) / (x * x - 1.0);
            const double step = p / derivative;
            x -= step;
            if (std::abs(step) < 1e-16) break;
        }
        rule.nodes[static_cast<std::size_t>(i)] = x;
        rule.weights[static_cast<std::size_t>(i)] = 2.0 / ((1.0 - x * x) * derivative * derivative);
    }
    return rule;
}

const GaussLegendreRule& gauss_legendre() {
    static const GaussLegendreRule rule = make_gauss_legendre();
    return rule;
}

// ln(sum factor_i e^{log_i}) accumulated term by term, rescaled whenever a larger log turns
// up, so that no e^{log} is ever formed above e^0.
class LogSum {
public:
    explicit LogSum(double expected_max) : max_(expected_max) {}
    void add(double log_value, double factor) {
        if (log_value > max_) {
            sum_ = sum_ * std::exp(max_ - log_value) + factor;
            max_ = log_value;
        } else {
            sum_ += factor * std::exp(log_value - max_);
        }
    }
    [[nodiscard]] double log() const { return max_ + std::log(sum_); }

private:
    double max_;
    double sum_ = 0.0;
};

struct LogValueSlope {
    double value;  // g
    double slope;  // dg/dt
};

// The Fuchs integrand in logs: near part in t = ln h, far part in w = R_c / r.
class FuchsIntegrand {
public:
    FuchsIntegrand(const PairInteraction& pair, double min_gap_m, bool hydrodynamic)
        : pair_(pair), hydrodynamic_(hydrodynamic), sum_radii_m_(pair.radius1_m() + pair.radius2_m()),
          contact_m_(sum_radii_m_ + min_gap_m),
          mean_radius_m_(2.0 * pair.radius1_m() * pair.radius2_m() / sum_radii_m_),
          inverse_kT_(1.0 / pair.kT_J()), log_contact_(std::log(contact_m_)) {}

    // g(t) = ln[R_c beta e^{U/kT} h / (a1 + a2 + h)^2], h = e^t.
    [[nodiscard]] double near(double t) const {
        const double h = std::exp(t);
        return log_contact_ + pair_.energy_J(h) * inverse_kT_ + log_beta(h) + t - 2.0 * std::log(sum_radii_m_ + h);
    }
    [[nodiscard]] LogValueSlope near_with_slope(double t) const {
        const double h = std::exp(t);
        const EnergySlope u = pair_.total(h);
        const double value = log_contact_ + u.energy_J * inverse_kT_ + log_beta(h) + t -
                             2.0 * std::log(sum_radii_m_ + h);
        const double slope = h * (u.slope_J_per_m * inverse_kT_ + log_beta_slope_per_m(h)) + 1.0 -
                             2.0 * h / (sum_radii_m_ + h);
        return {value, slope};
    }
    // ln[beta e^{U/kT}] at w = R_c / r: the integrand of the far part in w.
    [[nodiscard]] double far(double w) const {
        const double h = contact_m_ / w - sum_radii_m_;
        return pair_.energy_J(h) * inverse_kT_ + log_beta(h);
    }
    [[nodiscard]] double contact_m() const { return contact_m_; }
    [[nodiscard]] double sum_radii_m() const { return sum_radii_m_; }

private:
    [[nodiscard]] double log_beta(double h) const {
        return hydrodynamic_ ? std::log(honig_beta(h, pair_.radius1_m(), pair_.radius2_m())) : 0.0;
    }
    // d ln(beta)/dh of Honig's rational form beta = N/D, N = 6u^2+13u+2, D = 6u^2+4u, u = h/a_bar.
    [[nodiscard]] double log_beta_slope_per_m(double h) const {
        if (!hydrodynamic_) return 0.0;
        const double u = h / mean_radius_m_;
        const double n = (6.0 * u + 13.0) * u + 2.0, d = (6.0 * u + 4.0) * u;
        return ((12.0 * u + 13.0) / n - (12.0 * u + 4.0) / d) / mean_radius_m_;
    }

    const PairInteraction& pair_;
    bool hydrodynamic_;
    double sum_radii_m_, contact_m_, mean_radius_m_, inverse_kT_, log_contact_;
};

// A local maximum of g: where it is, its height and the distance in t over which it falls.
struct Peak {
    double t, log_value, width;
};

// Bisection on the sign of g' between lo (g' > 0) and hi (g' <= 0) until the bracket is a
// hundredth of the peak width, the width taken from the slope's secant across the bracket.
Peak refine_peak(const FuchsIntegrand& f, double lo, double hi, double slope_lo, double slope_hi) {
    for (int i = 0; i < 80; ++i) {
        const double curvature = (slope_lo - slope_hi) / (hi - lo);  // -g'' > 0
        if (hi - lo < 0.01 / std::sqrt(curvature)) break;
        const double mid = 0.5 * (lo + hi);
        if (!(mid > lo && mid < hi)) break;
        const double slope = f.near_with_slope(mid).slope;
        if (slope > 0) {
            lo = mid;
            slope_lo = slope;
        } else {
            hi = mid;
            slope_hi = slope;
        }
    }
    const double t = 0.5 * (lo + hi);
    const double curvature = (slope_lo - slope_hi) / (hi - lo);
    return {t, f.near(t), std::clamp(1.0 / std::sqrt(curvature), narrowest_peak, widest_panel)};
}

// A maximum at an end of the range, where g falls away inwards with slope g'. The fall is
// quadratic where g' is small but g'' large (a barrier just outside the range), so the width
// is the smaller of 1/|g'| and 1/sqrt(-g''), g'' from the slope a step of 1e-3 inwards.
Peak end_peak(const FuchsIntegrand& f, double t, const LogValueSlope& at_end, double inwards) {
    constexpr double step = 1e-3;
    const double curvature = (at_end.slope - f.near_with_slope(t + inwards * step).slope) * inwards / step;
    double width = std::min(widest_panel, 1.0 / std::max(std::abs(at_end.slope), 1e-300));
    if (curvature > 0) width = std::min(width, 1.0 / std::sqrt(curvature));
    return {t, at_end.value, std::max(width, narrowest_peak)};
}

std::vector<Peak> find_peaks(const FuchsIntegrand& f, double t0, double t1) {
    const int steps = std::max(2, static_cast<int>(std::ceil((t1 - t0) / scan_step)));
    std::vector<double> grid(static_cast<std::size_t>(steps) + 1);
    std::vector<LogValueSlope> scan(grid.size());
    for (std::size_t i = 0; i < grid.size(); ++i) {
        grid[i] = i + 1 == grid.size() ? t1 : t0 + (t1 - t0) * static_cast<double>(i) / steps;
        scan[i] = f.near_with_slope(grid[i]);
    }
    std::vector<Peak> peaks;
    if (scan.front().slope < 0) peaks.push_back(end_peak(f, t0, scan.front(), 1.0));
    for (std::size_t i = 0; i + 1 < grid.size(); ++i)
        if (scan[i].slope > 0 && scan[i + 1].slope <= 0)
            peaks.push_back(refine_peak(f, grid[i], grid[i + 1], scan[i].slope, scan[i + 1].slope));
    if (scan.back().slope > 0) peaks.push_back(end_peak(f, t1, scan.back(), -1.0));
    return peaks;
}

// Panel ends in t: every peak's doubling widths out to widest_panel, then a uniform grid
// of at most widest_panel spacing.
std::vector<double> panel_breaks(const std::vector<Peak>& peaks, double top, double t0, double t1) {
    std::vector<double> breaks{t0, t1};
    const int coarse = static_cast<int>(std::ceil((t1 - t0) / widest_panel));
    for (int i = 1; i < coarse; ++i) breaks.push_back(t0 + (t1 - t0) * i / coarse);
    for (const Peak& p : peaks) {
        if (p.log_value < top - negligible_e_folds) continue;
        breaks.push_back(p.t);
        for (double direction : {-1.0, 1.0}) {
            double offset = 0.0;
            for (double width = p.width; width < widest_panel; width *= 2.0) {
                offset += width;
                const double t = p.t + direction * offset;
                if (t <= t0 || t >= t1) break;
                breaks.push_back(t);
            }
        }
    }
    std::sort(breaks.begin(), breaks.end());
    breaks.erase(std::unique(breaks.begin(), breaks.end()), breaks.end());
    return breaks;
}

// ln W by the method of the header; NaN if anything on the way was not finite.
double fast_log_w(const PairInteraction& pair, double min_gap_m, bool hydrodynamic) {
    const FuchsIntegrand f(pair, min_gap_m, hydrodynamic);
    // The careful routine's far gap, so that both split the integral at the same place.
    // (A min_gap beyond it, far outside any checked range, still gets a near part.)
    const double far_gap_m = std::max({default_max_gap_m(pair), 10.0 * f.sum_radii_m(), 10.0 * min_gap_m});
    const double t0 = std::log(min_gap_m), t1 = std::log(far_gap_m);
    const std::vector<Peak> peaks = find_peaks(f, t0, t1);
    double top = -std::numeric_limits<double>::infinity();
    for (const Peak& p : peaks) top = std::max(top, p.log_value);
    if (!std::isfinite(top)) top = f.near(t0);

    const GaussLegendreRule& rule = gauss_legendre();
    LogSum sum(top);
    const std::vector<double> breaks = panel_breaks(peaks, top, t0, t1);
    for (std::size_t i = 0; i + 1 < breaks.size(); ++i) {
        const double centre = 0.5 * (breaks[i] + breaks[i + 1]), half = 0.5 * (breaks[i + 1] - breaks[i]);
        for (std::size_t k = 0; k < rule.nodes.size(); ++k)
            sum.add(f.near(centre + half * rule.nodes[k]), half * rule.weights[k]);
    }
    // Far part: w = R_c / r on (0, w_far]; the Gauss nodes never touch w = 0.
    const double w_far = f.contact_m() / (f.sum_radii_m() + far_gap_m);
    for (std::size_t k = 0; k < rule.nodes.size(); ++k)
        sum.add(f.far(0.5 * w_far * (1.0 + rule.nodes[k])), 0.5 * w_far * rule.weights[k]);
    return sum.log();
}

}  // namespace

double log_stability_ratio_fast(const PairInteraction& pair, double min_gap_m, bool hydrodynamic) {
    if (!(std::isfinite(min_gap_m) && min_gap_m > 0.0)) {
        std::ostringstream message;
        message << "log_stability_ratio_fast: min_gap_m = " << min_gap_m << ": must be finite and > 0";
        throw InputError(message.str());
    }
    const double log_w = fast_log_w(pair, min_gap_m, hydrodynamic);
    if (std::isfinite(log_w)) return log_w;
    return log_stability_ratio(pair, min_gap_m, hydrodynamic);  // pathological pair: the careful way
}

}  // namespace brownfloc::potentials
