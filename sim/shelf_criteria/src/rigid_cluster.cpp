#include "rigid_cluster.hpp"

#include <array>
#include <cmath>

namespace brownfloc::shelf::detail {
namespace {

constexpr std::array<double, 1> doublet_distances{2.0};
constexpr std::array<double, 3> linear_distances{2.0, 2.0, 4.0};
constexpr std::array<double, 3> triangle_distances{2.0, 2.0, 2.0};

}  // namespace

RigidCluster doublet() { return {2, doublet_distances}; }
RigidCluster linear_triplet() { return {3, linear_distances}; }
RigidCluster triangle_triplet() { return {3, triangle_distances}; }

double kirkwood_radius_over_a(const RigidCluster& cluster) {
    const double n = static_cast<double>(cluster.beads);
    double inverse_distance_sum = 0.0;
    for (const double r : cluster.pair_distances_over_a) inverse_distance_sum += 1.0 / r;
    const double inverse_radius = 1.0 / n + 2.0 * inverse_distance_sum / (n * n);
    return 1.0 / inverse_radius;
}

double debye_structure_factor(const RigidCluster& cluster, double qa) {
    const double n = static_cast<double>(cluster.beads);
    double pair_sum = 0.0;
    for (const double r : cluster.pair_distances_over_a) pair_sum += sinc(qa * r);
    return (n + 2.0 * pair_sum) / (n * n);
}

double sinc(double x) {
    // Below 1e-3 the series 1 - x²/6 + x⁴/120 is exact to rounding (next term x⁶/5040).
    if (std::abs(x) < 1e-3) {
        const double x2 = x * x;
        return 1.0 - x2 / 6.0 * (1.0 - x2 / 20.0);
    }
    return std::sin(x) / x;
}

}  // namespace brownfloc::shelf::detail
