#pragma once
// Cluster shapes and a seeded generator shared by the cluster-analysis tests. The generator
// is our own (SplitMix64, Steele, Lea & Flood 2014) so that the test inputs, and hence the
// tolerances checked against them, are the same with every standard library.
#include <cmath>
#include <cstdint>
#include <numbers>
#include <vector>

#include "analysis/cluster_geometry.hpp"

namespace brownfloc::test {

using analysis::Vec3;

class TestRandom {
public:
    explicit TestRandom(std::uint64_t seed) : state_{seed} {}
    std::uint64_t next() {
        std::uint64_t z = (state_ += 0x9E3779B97F4A7C15ULL);
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9ULL;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBULL;
        return z ^ (z >> 31);
    }
    // Uniform in [0, 1), 53 random bits.
    double uniform() { return static_cast<double>(next() >> 11) * 0x1.0p-53; }
    // Standard normal by Box & Muller (1958), Ann. Math. Statist. 29, 610.
    double normal() {
        const double u = 1.0 - uniform(), v = uniform();
        return std::sqrt(-2.0 * std::log(u)) * std::cos(2.0 * std::numbers::pi * v);
    }
    // Uniform direction on the unit sphere (Archimedes: z uniform in [-1, 1]).
    Vec3 direction() {
        const double z = 2.0 * uniform() - 1.0, phi = 2.0 * std::numbers::pi * uniform();
        const double s = std::sqrt(1.0 - z * z);
        return {s * std::cos(phi), s * std::sin(phi), z};
    }

private:
    std::uint64_t state_;
};

// n centres in a straight line, spacing step_m, starting at the origin along x.
inline std::vector<Vec3> straight_chain(std::size_t n, double step_m) {
    std::vector<Vec3> centres(n);
    for (std::size_t i = 0; i < n; ++i) centres[i] = {step_m * static_cast<double>(i), 0.0, 0.0};
    return centres;
}

// Ideal random walk of n centres with steps of step_m in uniform random directions: a loose,
// d_f = 2 object whose 1/r_ij spread is larger than a compact cluster's.
inline std::vector<Vec3> random_walk(std::size_t n, double step_m, std::uint64_t seed) {
    TestRandom random{seed};
    std::vector<Vec3> centres(n, Vec3{0.0, 0.0, 0.0});
    for (std::size_t i = 1; i < n; ++i) {
        const Vec3 d = random.direction();
        for (std::size_t k = 0; k < 3; ++k) centres[i][k] = centres[i - 1][k] + step_m * d[k];
    }
    return centres;
}

// Simple-cubic lattice sites (spacing spacing_m) within radius_m of `centre_m`: a filled,
// d_f = 3 ball. Moving the centre off a site changes which surface sites fall inside.
inline std::vector<Vec3> lattice_ball(double radius_m, double spacing_m, const Vec3& centre_m) {
    std::vector<Vec3> sites;
    const int reach = static_cast<int>(std::ceil(radius_m / spacing_m)) + 1;
    for (int i = -reach; i <= reach; ++i)
        for (int j = -reach; j <= reach; ++j)
            for (int k = -reach; k <= reach; ++k) {
                const Vec3 p{spacing_m * i, spacing_m * j, spacing_m * k};
                const double dx = p[0] - centre_m[0], dy = p[1] - centre_m[1], dz = p[2] - centre_m[2];
                if (dx * dx + dy * dy + dz * dz <= radius_m * radius_m) sites.push_back(p);
            }
    return sites;
}

// n nearly evenly spread points on a sphere of radius_m about the origin: the Fibonacci
// (golden-angle) spiral, e.g. Gonzalez (2010), Math. Geosci. 42, 49.
inline std::vector<Vec3> fibonacci_sphere(std::size_t n, double radius_m) {
    std::vector<Vec3> points(n);
    const double golden_angle = std::numbers::pi * (3.0 - std::sqrt(5.0));
    for (std::size_t i = 0; i < n; ++i) {
        const double z = 1.0 - (2.0 * static_cast<double>(i) + 1.0) / static_cast<double>(n);
        const double s = std::sqrt(1.0 - z * z), phi = golden_angle * static_cast<double>(i);
        points[i] = {radius_m * s * std::cos(phi), radius_m * s * std::sin(phi), radius_m * z};
    }
    return points;
}

}  // namespace brownfloc::test
