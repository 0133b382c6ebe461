#include <algorithm>
#include <cmath>
#include <vector>

#include "potentials/extrema.hpp"
#include "potentials/stability_ratio.hpp"
#include "quadrature.hpp"

namespace brownfloc::potentials {

double honig_beta(double h_m, double a1_m, double a2_m) {
    // Honig, Roebersen & Wiersema (1971) [rational fit quoted from memory; its limits
    // beta -> 1 (u -> inf) and beta -> 1/(2u) (u -> 0) are exact]; a_bar = 2 a1 a2/(a1 + a2).
    const double u = h_m * (a1_m + a2_m) / (2.0 * a1_m * a2_m);
    return (6.0 * u * u + 13.0 * u + 2.0) / (6.0 * u * u + 4.0 * u);
}

namespace {

// Upper end of the first part of the integral (and of its extremum search).
double far_gap_m(const PairInteraction& pair) {
    return std::max(default_max_gap_m(pair), 10.0 * (pair.radius1_m() + pair.radius2_m()));
}

// ln W given the pair's extrema on [min_gap, far_gap_m(pair)].
double log_stability_ratio(const PairInteraction& pair, double min_gap_m, bool hydrodynamic, const Extrema& ext) {
    const double a1 = pair.radius1_m(), a2 = pair.radius2_m(), s = a1 + a2;
    const double contact = s + min_gap_m;  // R_c
    const double kT = pair.kT_J();
    const double far_gap = far_gap_m(pair);
    // Scale out the largest exp(U/kT) so that barriers of any height stay in range.
    const double reference = ext.has_maximum ? std::max(0.0, ext.local_maximum_J / kT) : 0.0;

    auto weight = [&](double h) {
        const double beta = hydrodynamic ? honig_beta(h, a1, a2) : 1.0;
        return beta * std::exp(pair.energy_J(h) / kT - reference);
    };
    // Part 1, min_gap .. far_gap in t = ln h: R_c e^{U} beta h / (s + h)^2 dt.
    auto near = [&](double t) {
        const double h = std::exp(t), r = s + h;
        return contact * weight(h) * h / (r * r);
    };
    std::vector<double> breaks;
    const double t0 = std::log(min_gap_m), t1 = std::log(far_gap);
    for (double t = t0; t < t1; t += 0.5) breaks.push_back(t);
    breaks.push_back(t1);
    for (double g : {ext.maximum_gap_m, ext.secondary_minimum_gap_m})
        if (g > min_gap_m && g < far_gap) breaks.push_back(std::log(g));
    // Around the maximum (also when it sits at min_gap) the integrand can fall by hundreds
    // of e-folds within 1e-4 of the gap (potentials of hundreds of mV, micron spheres), where
    // no Kronrod node of a 0.5-wide interval lands: break points at decades of distance in
    // ln h, from 1e-12 to 0.1, put nodes on every scale of the peak.
    if (ext.has_maximum)
        for (double d = 1e-12; d < 0.2; d *= 10)
            for (double t : {std::log(ext.maximum_gap_m) - d, std::log(ext.maximum_gap_m) + d})
                if (t > t0 && t < t1) breaks.push_back(t);
    std::sort(breaks.begin(), breaks.end());
    const auto inner = detail::integrate(near, breaks, 1e-11);
    // Part 2, r = s + far_gap .. inf in w = R_c / r on (0, w_far]: integrand e^{U} beta dw.
    const double w_far = contact / (s + far_gap);
    auto tail = [&](double w) { return weight(contact / w - s); };
    const auto outer = detail::integrate(tail, {0.0, w_far}, 1e-11);
    return reference + std::log(inner.value + outer.value);
}

}  // namespace

double log_stability_ratio(const PairInteraction& pair, double min_gap_m, bool hydrodynamic) {
    return log_stability_ratio(pair, min_gap_m, hydrodynamic, find_extrema(pair, min_gap_m, far_gap_m(pair)));
}

StabilityRatios stability_ratios(const PairInteraction& pair, double min_gap_m) {
    // One extremum search serves both integrals of the same pair.
    const Extrema ext = find_extrema(pair, min_gap_m, far_gap_m(pair));
    StabilityRatios out;
    out.log_w = log_stability_ratio(pair, min_gap_m, false, ext);
    out.log_w_hydrodynamic = log_stability_ratio(pair, min_gap_m, true, ext);
    out.log_w_hydrodynamic_vdw_only = log_stability_ratio(pair.van_der_waals_only(), min_gap_m, true);
    return out;
}

}  // namespace brownfloc::potentials
