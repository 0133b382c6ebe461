#pragma once
// Small rigid clusters of equal touching spheres, described by their centre-to-centre
// distances in units of the sphere radius a: the doublet and the two triplets (linear chain
// and equilateral triangle) that stand for k = 2 and k = 3 in the z-average.
#include <span>

namespace brownfloc::shelf::detail {

struct RigidCluster {
    int beads;
    std::span<const double> pair_distances_over_a;  // r_ij / a for i < j, beads(beads-1)/2 of them
};

[[nodiscard]] RigidCluster doublet();
[[nodiscard]] RigidCluster linear_triplet();
[[nodiscard]] RigidCluster triangle_triplet();

// Kirkwood (1954), J. Polym. Sci. 12, 1: 1/R_h = 1/(N a) + (1/N²) Σ_{i≠j} 1/r_ij (the sum
// over ordered pairs, so twice the sum over i < j). Returns R_h / a.
[[nodiscard]] double kirkwood_radius_over_a(const RigidCluster& cluster);

// Debye (1915) sum for identical scatterers: S(q) = (1/N²) Σ_ij sin(q r_ij)/(q r_ij),
// the i = j terms giving N. qa = q a >= 0.
[[nodiscard]] double debye_structure_factor(const RigidCluster& cluster, double qa);

// sin(x)/x; 1 at x = 0 (a short series near 0).
[[nodiscard]] double sinc(double x);

}  // namespace brownfloc::shelf::detail
