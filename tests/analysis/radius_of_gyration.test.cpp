#include <catch2/catch.hpp>

#include <cmath>
#include <numbers>
#include <stdexcept>
#include <vector>

#include "analysis/cluster_geometry.hpp"
#include "test_support.hpp"

using namespace brownfloc::analysis;
using Catch::Matchers::WithinAbs;
using Catch::Matchers::WithinRel;

TEST_CASE("a doublet at contact has a centre radius of gyration equal to the sphere radius", "[analysis][geometry]") {
    // Centres 2a apart, each a from the midpoint: R_g = a exactly. Tolerance: rounding only.
    const double a = 150e-9;
    const std::vector<Vec3> doublet{{0.0, 0.0, 0.0}, {2 * a, 0.0, 0.0}};
    CHECK_THAT(radius_of_gyration_m(doublet), WithinRel(a, 1e-14));
    CHECK(radius_of_gyration_m(std::vector<Vec3>{{1.0, 2.0, 3.0}}) == 0.0);
}

TEST_CASE("regular polyhedra and rings have the circumradius as radius of gyration", "[analysis][geometry]") {
    // Every vertex lies at the circumradius from the centroid, so R_g equals it (geometry).
    // Tolerance: rounding only.
    const double side = 2.0;  // spheres of radius 1 touching along each edge
    // Regular tetrahedron: circumradius = side sqrt(6)/4 (e.g. Coxeter, Regular Polytopes, table I).
    const double s = side / (2.0 * std::sqrt(2.0));
    const std::vector<Vec3> tetrahedron{{s, s, s}, {s, -s, -s}, {-s, s, -s}, {-s, -s, s}};
    CHECK_THAT(radius_of_gyration_m(tetrahedron), WithinRel(side * std::sqrt(6.0) / 4.0, 1e-14));
    // Ring of 12 touching spheres: circumradius = side / (2 sin(pi/12)).
    const double ring_radius = side / (2.0 * std::sin(std::numbers::pi / 12.0));
    std::vector<Vec3> ring;
    for (int k = 0; k < 12; ++k) {
        const double phi = 2.0 * std::numbers::pi * k / 12.0;
        ring.push_back({ring_radius * std::cos(phi), ring_radius * std::sin(phi), 0.0});
    }
    CHECK_THAT(radius_of_gyration_m(ring), WithinRel(ring_radius, 1e-14));
}

TEST_CASE("the radius of gyration does not change when the cluster is moved far away", "[analysis][geometry]") {
    // Two-pass mean: a shift of 1e4 cluster sizes costs ~1e4 eps in the deviations, so 1e-10
    // relative. Seed 5, random walk of 200 steps of 2a with a = 1 um.
    const std::vector<Vec3> walk = brownfloc::test::random_walk(200, 2e-6, 5);
    std::vector<Vec3> moved = walk;
    for (Vec3& c : moved) c = {c[0] + 0.01, c[1] - 0.02, c[2] + 0.03};
    CHECK_THAT(radius_of_gyration_m(moved), WithinRel(radius_of_gyration_m(walk), 1e-10));
}

TEST_CASE("the radius of gyration with spheres adds each sphere's own three fifths a squared", "[analysis][geometry]") {
    // Solid sphere about its centre: R_g^2 = (3/5) a^2 (moment of inertia (2/5) M a^2 about an
    // axis, three axes halved: any mechanics text). Doublet at contact: a^2 + (3/5) a^2.
    // Tolerance: rounding only.
    const double a = 1e-6;
    CHECK_THAT(radius_of_gyration_with_spheres_m(std::vector<Vec3>{{0, 0, 0}}, std::vector<double>{a}),
               WithinRel(a * std::sqrt(0.6), 1e-14));
    CHECK_THAT(radius_of_gyration_with_spheres_m(std::vector<Vec3>{{0, 0, 0}, {2 * a, 0, 0}},
                                                 std::vector<double>{a, a}),
               WithinRel(a * std::sqrt(1.6), 1e-14));
    // Unequal pair at contact, radii a and 2a (masses 1 and 8), centres 3a apart: the centre of
    // mass sits 8/3 a from the small one, so R_g^2 = [1 (64/9 + 3/5) + 8 (1/9 + 12/5)] a^2 / 9
    // = (8/9 + 3/5 * 33/9) a^2, by hand.
    const double expected = a * std::sqrt(8.0 / 9.0 + 0.6 * 33.0 / 9.0);
    CHECK_THAT(radius_of_gyration_with_spheres_m(std::vector<Vec3>{{0, 0, 0}, {3 * a, 0, 0}},
                                                 std::vector<double>{a, 2 * a}),
               WithinRel(expected, 1e-14));
}

TEST_CASE("radius of gyration rejects empty clusters and bad radii", "[analysis][geometry][validation]") {
    CHECK_THROWS_WITH(radius_of_gyration_m(std::vector<Vec3>{}), Catch::Contains("need at least one sphere"));
    CHECK_THROWS_WITH(radius_of_gyration_with_spheres_m(std::vector<Vec3>{{0, 0, 0}, {1, 0, 0}},
                                                        std::vector<double>{1.0, -2.0}),
                      Catch::Contains("radius 1 = -2") && Catch::Contains("> 0"));
    CHECK_THROWS_WITH(radius_of_gyration_with_spheres_m(std::vector<Vec3>{{0, 0, 0}}, std::vector<double>{}),
                      Catch::Contains("0 radii for 1 centres"));
}
