#pragma once
// Fractal dimension d_f and prefactor k0 of a population of clusters, from
//   N = k0 (R_g / a)^d_f
// (fractal aggregates; Jullien, Kolb & Botet 1984, J. Physique Lett. 45, 211, find
// d_f = 1.78 +- 0.05 for diffusion-limited cluster aggregation in 3D), with R_g the radius of
// gyration of the sphere CENTRES (radius_of_gyration_m, without each sphere's (3/5) a^2) and a
// the primary radius.
//
// Method (the project's rules, one set of choices stated once):
//  1. Use the clusters that do not span the box and have at least fractal_min_cluster_size
//     particles; need fractal_min_clusters of them, and largest/smallest size >= 5.
//  2. Bin by size on a fixed grid of width ln 2 in ln n: bin k holds 2^k <= n < 2^(k+1).
//     A fixed grid (not one anchored at the smallest cluster) keeps resamples comparable.
//  3. In each populated bin take the means of ln n and of ln R_g.
//  4. Unweighted least squares of ln R_g on ln n over the bin means: each populated bin counts
//     once, so the many small clusters do not outvote the few large ones. Regressing ln R_g on
//     ln n (not the reverse) is unbiased when R_g scatters at exact n; binning adds no bias
//     for a straight line, since bin means of a linear relation lie on it.
//  5. d_f = 1/slope; k0 from the intercept c: ln k0 = d_f (ln a - c).
//  6. dimension_error = sample standard deviation of d_f over fractal_bootstrap_resamples
//     resamples (with replacement) of the qualifying clusters (Efron 1979, Ann. Statist. 7, 1),
//     drawn by our own SplitMix64 generator seeded from `seed`.
// When a rule fails, the optionals stay empty and the note says which rule and the numbers.
// Pure function of (clusters, primary radius, seed); thread-safe.
#include <cstdint>
#include <optional>
#include <span>
#include <string>

namespace brownfloc::analysis {

inline constexpr std::int64_t fractal_min_cluster_size = 10;
inline constexpr std::size_t fractal_min_clusters = 30;
inline constexpr double fractal_min_size_span = 5.0;  // largest / smallest qualifying size
inline constexpr int fractal_bootstrap_resamples = 400;

struct ClusterShape {
    std::int64_t size = 0;               // number of primary particles
    double radius_of_gyration_m = 0.0;   // of the sphere centres, m
    bool spans_box = false;              // connected to its own periodic image
};

struct FractalFit {
    std::optional<double> dimension;        // d_f
    std::optional<double> dimension_error;  // bootstrap standard deviation of d_f
    std::optional<double> prefactor;        // k0
    // On success, the method and data in one line ("R_g from sphere centres; 57 clusters,
    // sizes 10-812, 7 bins ..."); otherwise why no fit was made.
    std::string note;
    std::int64_t clusters_used = 0;  // clusters that passed rule 1
};

// Fit over `clusters`; primary_radius_m (m, > 0) is a in N = k0 (R_g/a)^d_f. Throws
// std::invalid_argument if the radius is not > 0 or a qualifying cluster has R_g <= 0.
[[nodiscard]] FractalFit fit_fractal_dimension(std::span<const ClusterShape> clusters,
                                               double primary_radius_m, std::uint64_t seed);

}  // namespace brownfloc::analysis
