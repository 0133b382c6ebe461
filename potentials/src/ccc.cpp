#include "potentials/ccc.hpp"

#include <cmath>
#include <limits>

#include "potentials/extrema.hpp"
#include "potentials/stability_ratio.hpp"

namespace brownfloc::potentials {
namespace {

// Finds the root of f(ln c) between the search limits by bisection, given f(lo) > 0 > f(hi).
template <class F>
double bisect_log(const F& f, double lo, double hi, double rel_tol) {
    double a = std::log(lo), b = std::log(hi);
    while (b - a > rel_tol) {
        const double mid = 0.5 * (a + b);
        if (f(std::exp(mid)) > 0) a = mid;
        else b = mid;
    }
    return std::exp(0.5 * (a + b));
}

}  // namespace

CccResult barrier_ccc(const PairAtConcentration& make_pair, double min_gap_m) {
    auto highest_maximum_kT = [&](double c) {
        const PairInteraction pair = make_pair(c);
        const Extrema e = find_extrema(pair, min_gap_m, default_max_gap_m(pair));
        return e.has_maximum ? e.local_maximum_J / pair.kT_J() : -std::numeric_limits<double>::infinity();
    };
    CccResult out;
    if (!(highest_maximum_kT(ccc_lowest_mol_per_m3) > 0)) {
        out.status = CccStatus::no_barrier_anywhere;
        out.note = "no energy barrier even at 1 uM of the varied salt: the dispersion is not "
                   "charge-stabilised in this model";
        return out;
    }
    if (highest_maximum_kT(ccc_highest_mol_per_m3) > 0) {
        out.status = CccStatus::barrier_everywhere;
        out.note = "the energy barrier survives up to 5 M of the varied salt: no CCC in range";
        return out;
    }
    const double c = bisect_log(highest_maximum_kT, ccc_lowest_mol_per_m3, ccc_highest_mol_per_m3, 1e-8);
    out.concentration_mol_per_m3 = c;
    const PairInteraction pair = make_pair(c);
    const Extrema e = find_extrema(pair, min_gap_m, default_max_gap_m(pair));
    out.gap_m = e.maximum_gap_m;
    out.maximum_at_min_gap = e.maximum_at_min_gap;
    if (e.maximum_at_min_gap)
        out.note = "at the CCC the maximum sits at min_gap, so U = 0 there but dU/dh != 0: the "
                   "CCC depends on min_gap_nm";
    return out;
}

KineticCccResult kinetic_ccc(const PairAtConcentration& make_pair, double min_gap_m) {
    constexpr double ln10 = 2.302585092994046;
    auto log10_w_minus_2 = [&](double c) {
        return stability_ratios(make_pair(c), min_gap_m).log_w_experimental() / ln10 - 2.0;
    };
    KineticCccResult out;
    if (!(log10_w_minus_2(ccc_lowest_mol_per_m3) > 0)) {
        out.note = "W_experimental is below 100 even at 1 uM of the varied salt";
        return out;
    }
    if (log10_w_minus_2(ccc_highest_mol_per_m3) > 0) {
        out.note = "W_experimental stays above 100 up to 5 M of the varied salt";
        return out;
    }
    const double c100 = bisect_log(log10_w_minus_2, ccc_lowest_mol_per_m3, ccc_highest_mol_per_m3, 1e-7);
    // Central difference over +-1 % in c: W is smooth there and the step is far above the
    // quadrature's 1e-11 relative noise.
    const double step = 0.01;
    const double slope = (log10_w_minus_2(c100 * std::exp(step)) - log10_w_minus_2(c100 * std::exp(-step))) /
                         (2.0 * step / ln10);
    out.w100_concentration_mol_per_m3 = c100;
    out.dlog10w_dlog10c = slope;
    if (!(slope < 0)) {
        out.note = "log W does not fall with salt where W = 100: no kinetic CCC";
        return out;
    }
    out.concentration_mol_per_m3 = c100 * std::pow(10.0, -2.0 / slope);
    return out;
}

double log_log_slope(const double* x, const double* y, int n) {
    double mx = 0, my = 0;
    for (int i = 0; i < n; ++i) {
        mx += std::log(x[i]);
        my += std::log(y[i]);
    }
    mx /= n;
    my /= n;
    double sxy = 0, sxx = 0;
    for (int i = 0; i < n; ++i) {
        const double dx = std::log(x[i]) - mx;
        sxy += dx * (std::log(y[i]) - my);
        sxx += dx * dx;
    }
    return sxy / sxx;
}

}  // namespace brownfloc::potentials
