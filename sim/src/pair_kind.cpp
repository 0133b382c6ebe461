#include "sim/pair_kind.hpp"

#include <algorithm>
#include <cmath>
#include <vector>

#include "potentials/extrema.hpp"
#include "potentials/stability_ratio.hpp"

namespace brownfloc::sim {

using potentials::PairInteraction;

namespace {

constexpr double capture_depth_kT = 10.0;   // capture where U is this far below the barrier top
constexpr double cutoff_energy_kT = 0.01;   // |U| below this beyond the cutoff
constexpr double cutoff_scan_radii = 20.0;  // scan for the cutoff out to this many radii
constexpr int grid_per_decade = 400;

// Log-spaced gaps from lo to hi inclusive.
std::vector<double> log_grid(double lo_m, double hi_m) {
    const int n = std::max(2, static_cast<int>(std::ceil(std::log10(hi_m / lo_m) * grid_per_decade)) + 1);
    std::vector<double> h(static_cast<std::size_t>(n));
    for (int k = 0; k < n; ++k) h[static_cast<std::size_t>(k)] = lo_m * std::pow(hi_m / lo_m, double(k) / (n - 1));
    h.back() = hi_m;
    return h;
}

// Gap in [lo, hi] where U(h) = level_kT, given that U - level changes sign there (bisection
// to 1e-12 relative in h).
double solve_level(const PairInteraction& pair, double level_kT, double lo_m, double hi_m) {
    const double f_lo = pair.energy_kT(lo_m) - level_kT;
    for (int it = 0; it < 200 && (hi_m - lo_m) > 1e-12 * hi_m; ++it) {
        const double mid = 0.5 * (lo_m + hi_m);
        const double f_mid = pair.energy_kT(mid) - level_kT;
        if ((f_mid < 0) == (f_lo < 0)) lo_m = mid; else hi_m = mid;
    }
    return 0.5 * (lo_m + hi_m);
}

// Coming inward from start_m towards stop_m (< start_m), the first gap where U <= level_kT.
std::optional<double> first_inward_below(const PairInteraction& pair, double level_kT, double start_m, double stop_m) {
    if (start_m <= stop_m) return std::nullopt;
    const std::vector<double> grid = log_grid(stop_m, start_m);
    for (std::size_t k = grid.size() - 1; k-- > 0;) {
        if (pair.energy_kT(grid[k]) <= level_kT) return solve_level(pair, level_kT, grid[k], grid[k + 1]);
    }
    return std::nullopt;
}

// Going outward from start_m, the first gap (before limit_m) where U crosses level_kT
// from the side it is on at start_m.
std::optional<double> first_outward_crossing(const PairInteraction& pair, double level_kT, double start_m, double limit_m) {
    const std::vector<double> grid = log_grid(start_m, limit_m);
    const bool below = pair.energy_kT(start_m) < level_kT;
    for (std::size_t k = 1; k < grid.size(); ++k) {
        if ((pair.energy_kT(grid[k]) < level_kT) != below) return solve_level(pair, level_kT, grid[k - 1], grid[k]);
    }
    return std::nullopt;
}

// ln of the Fuchs W from the capture distance R_c = a1 + a2 + h_c, relative to the fast
// rate 4 pi D_rel (a1 + a2): W = (a1 + a2) int_{R_c}^inf e^(U/kT) r^-2 dr.
double log_ratio_at_capture(const PairInteraction& pair, double capture_gap_m) {
    const double contact = pair.radius1_m() + pair.radius2_m();
    return potentials::log_stability_ratio(pair, capture_gap_m, false) + std::log(contact / (contact + capture_gap_m));
}

// The gap inside which capture is at least 99 % certain (see PairKind::commit_gap_m):
// p_capture(h) = [W(h)/r] / [W(h_c)/R_c] with W(h) = r int_r^inf e^(U/kT) r'^-2 dr' the
// Fuchs integral taken from gap h (no hydrodynamics). Bisection in ln h to 1e-6.
double commitment_gap(const PairInteraction& pair, double capture_gap_m, double cutoff_gap_m) {
    constexpr double certain = 0.99;
    const double contact = pair.radius1_m() + pair.radius2_m();
    const double log_tail_c = potentials::log_stability_ratio(pair, capture_gap_m, false) - std::log(contact + capture_gap_m);
    auto capture_probability = [&](double h) {
        return std::exp(potentials::log_stability_ratio(pair, h, false) - std::log(contact + h) - log_tail_c);
    };
    double lo = capture_gap_m, hi = std::max(cutoff_gap_m, capture_gap_m * 1.001);
    if (capture_probability(hi) >= certain) return hi;
    for (int it = 0; it < 60 && hi / lo > 1 + 1e-6; ++it) {
        const double mid = std::sqrt(lo * hi);
        if (capture_probability(mid) >= certain) lo = mid; else hi = mid;
    }
    return lo;
}

}  // namespace

PairKind analyse_pair_kind(const PairInteraction& pair, std::size_t species_i, std::size_t species_j, double min_gap_m,
                           std::optional<double> capture_gap_override_m, std::optional<double> cluster_gap_override_m) {
    PairKind kind;
    kind.species_i = species_i;
    kind.species_j = species_j;
    const double a_max = std::max(pair.radius1_m(), pair.radius2_m());
    kind.interacting = !pair.is_zero();

    if (!kind.interacting) {
        kind.capture_gap_m = capture_gap_override_m.value_or(min_gap_m);
        kind.capture_gap_rule = capture_gap_override_m ? "given in [run] capture_gap_nm" : "U = 0: the minimum gap";
        kind.cutoff_gap_m = kind.capture_gap_m;
        kind.log_stability_ratio = potentials::log_stability_ratio(pair, min_gap_m, false);
        kind.log_stability_ratio_at_capture = log_ratio_at_capture(pair, kind.capture_gap_m);
        return kind;
    }

    const double scan_end_m = std::max(potentials::default_max_gap_m(pair), cutoff_scan_radii * a_max);
    const potentials::Extrema ex = potentials::find_extrema(pair, min_gap_m, potentials::default_max_gap_m(pair));
    kind.barrier_kT = ex.barrier_J() / pair.kT_J();
    if (ex.has_secondary_minimum) {
        kind.secondary_minimum_kT = ex.secondary_minimum_J / pair.kT_J();
        kind.secondary_minimum_gap_m = ex.secondary_minimum_gap_m;
    }

    // Capture gap.
    if (capture_gap_override_m) {
        kind.capture_gap_m = *capture_gap_override_m;
        kind.capture_gap_rule = "given in [run] capture_gap_nm";
    } else if (ex.has_barrier()) {
        const double level = kind.barrier_kT - capture_depth_kT;
        const auto h = first_inward_below(pair, level, ex.maximum_gap_m, min_gap_m);
        kind.capture_gap_m = h.value_or(min_gap_m);
        kind.capture_gap_rule = h ? "where U falls 10 kT below the barrier top inside the barrier"
                                  : "the minimum gap: U does not fall 10 kT below the barrier top inside it";
    } else {
        const auto h = first_inward_below(pair, -capture_depth_kT, scan_end_m, min_gap_m);
        kind.capture_gap_m = h.value_or(min_gap_m);
        kind.capture_gap_rule = h ? "no barrier: where U first reaches -10 kT" : "no barrier and U > -10 kT: the minimum gap";
    }
    kind.capture_gap_m = std::max(kind.capture_gap_m, min_gap_m);

    // Cutoff: the outermost grid gap with |U| > 0.01 kT, one grid point further out.
    const std::vector<double> grid = log_grid(kind.capture_gap_m, scan_end_m);
    std::size_t last_significant = 0;
    for (std::size_t k = 0; k < grid.size(); ++k)
        if (std::abs(pair.energy_kT(grid[k])) > cutoff_energy_kT) last_significant = k;
    kind.cutoff_gap_m = grid[std::min(last_significant + 1, grid.size() - 1)];
    kind.interacting = kind.cutoff_gap_m > kind.capture_gap_m;
    kind.commit_gap_m = commitment_gap(pair, kind.capture_gap_m, kind.cutoff_gap_m);
    for (double h : grid) {
        if (h > kind.cutoff_gap_m) break;
        if (h >= kind.commit_gap_m) kind.max_force_N = std::max(kind.max_force_N, std::abs(pair.force_N(h)));
    }
    kind.max_force_N = std::max(kind.max_force_N, std::abs(pair.force_N(kind.commit_gap_m)));

    // Length scales.
    const auto& model = pair.model();
    if (model.include_double_layer && (model.surface_potential1_V != 0.0 || model.surface_potential2_V != 0.0))
        kind.debye_length_m = 1.0 / pair.kappa_per_m();
    if (kind.barrier_kT >= 1.0 && !ex.maximum_at_min_gap) {
        const double level = ex.local_maximum_J / pair.kT_J() - 1.0;
        const auto inner = first_inward_below(pair, level, ex.maximum_gap_m, min_gap_m);
        const auto outer = first_outward_crossing(pair, level, ex.maximum_gap_m, scan_end_m);
        kind.barrier_width_m = outer.value_or(scan_end_m) - inner.value_or(min_gap_m);
    }
    if (ex.has_secondary_minimum && kind.secondary_minimum_kT <= -1.0) {
        const double level = kind.secondary_minimum_kT + 1.0;
        const double gap = ex.secondary_minimum_gap_m;
        const double inner_limit = ex.has_maximum ? ex.maximum_gap_m : min_gap_m;
        std::optional<double> inner;
        if (pair.energy_kT(inner_limit) > level) {
            // inward from the minimum: the first gap where U rises above the level
            const std::vector<double> g = log_grid(inner_limit, gap);
            for (std::size_t k = g.size() - 1; k-- > 0;)
                if (pair.energy_kT(g[k]) > level) { inner = solve_level(pair, level, g[k], g[k + 1]); break; }
        }
        const auto outer = first_outward_crossing(pair, level, gap, scan_end_m);
        kind.well_width_m = outer.value_or(scan_end_m) - inner.value_or(inner_limit);
        if (cluster_gap_override_m) {
            kind.cluster_gap_m = cluster_gap_override_m;
        } else {
            const auto half = first_outward_crossing(pair, 0.5 * kind.secondary_minimum_kT, gap, scan_end_m);
            if (half) kind.cluster_gap_m = half;
        }
    } else if (cluster_gap_override_m) {
        kind.cluster_gap_m = cluster_gap_override_m;
    }

    kind.log_stability_ratio = potentials::log_stability_ratio(pair, min_gap_m, false);
    kind.log_stability_ratio_at_capture = log_ratio_at_capture(pair, kind.capture_gap_m);
    return kind;
}

}  // namespace brownfloc::sim
