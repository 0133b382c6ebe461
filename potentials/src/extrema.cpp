#include "potentials/extrema.hpp"

#include <algorithm>
#include <cmath>
#include <vector>

namespace brownfloc::potentials {
namespace {

// Bisection on the sign of dU/dh between lo (sign s_lo) and hi, to 1e-12 relative in h.
double refine_root(const PairInteraction& pair, double lo, double hi) {
    const bool lo_positive = pair.total(lo).slope_J_per_m > 0;
    for (int i = 0; i < 200 && (hi - lo) > 1e-12 * hi; ++i) {
        const double mid = std::sqrt(lo * hi);  // geometric: the grid is logarithmic
        if ((pair.total(mid).slope_J_per_m > 0) == lo_positive) lo = mid;
        else hi = mid;
    }
    return 0.5 * (lo + hi);
}

}  // namespace

double default_max_gap_m(const PairInteraction& pair) {
    const double kappa = pair.kappa_per_m();
    return std::max(kappa > 0 ? 30.0 / kappa : 0.0, 100e-9);
}

Extrema find_extrema(const PairInteraction& pair, double min_gap_m, double max_gap_m, int samples) {
    Extrema out;
    out.min_gap_m = min_gap_m;
    out.primary_minimum_J = pair.energy_J(min_gap_m);

    std::vector<double> gaps(static_cast<std::size_t>(samples)), slopes(gaps.size());
    const double ratio = std::log(max_gap_m / min_gap_m) / (samples - 1);
    for (std::size_t i = 0; i < gaps.size(); ++i) {
        gaps[i] = i == 0 ? min_gap_m : min_gap_m * std::exp(ratio * static_cast<double>(i));
        slopes[i] = pair.total(gaps[i]).slope_J_per_m;
    }

    // A falling start is a maximum at min_gap; each + to - sign change is an interior maximum.
    struct Point { double gap, energy; };
    std::vector<Point> maxima, minima;
    if (slopes[0] < 0) maxima.push_back({min_gap_m, out.primary_minimum_J});
    for (std::size_t i = 0; i + 1 < gaps.size(); ++i) {
        const bool rising = slopes[i] > 0, next_rising = slopes[i + 1] > 0;
        if (slopes[i] == 0 && slopes[i + 1] == 0) continue;  // flat (U = 0)
        if (rising == next_rising) continue;
        const double gap = refine_root(pair, gaps[i], gaps[i + 1]);
        (rising ? maxima : minima).push_back({gap, pair.energy_J(gap)});
    }
    if (maxima.empty()) return out;

    const auto top = std::max_element(maxima.begin(), maxima.end(),
                                      [](const Point& a, const Point& b) { return a.energy < b.energy; });
    out.has_maximum = true;
    out.local_maximum_J = top->energy;
    out.maximum_gap_m = top->gap;
    out.maximum_at_min_gap = top->gap == min_gap_m;
    for (const Point& m : minima)
        if (m.gap > top->gap && m.energy < 0 &&
            (!out.has_secondary_minimum || m.energy < out.secondary_minimum_J)) {
            out.has_secondary_minimum = true;
            out.secondary_minimum_J = m.energy;
            out.secondary_minimum_gap_m = m.gap;
        }
    return out;
}

}  // namespace brownfloc::potentials
