#include <catch2/catch.hpp>

#include <cmath>
#include <stdexcept>
#include <utility>
#include <vector>

#include "analysis/cluster_geometry.hpp"

using namespace brownfloc::analysis;
using Catch::Matchers::WithinAbs;
using Bond = std::pair<std::size_t, std::size_t>;

namespace {
double wrap_m(double x, double box_m) { return x - box_m * std::floor(x / box_m); }
double distance_m(const Vec3& a, const Vec3& b) {
    return std::sqrt((a[0] - b[0]) * (a[0] - b[0]) + (a[1] - b[1]) * (a[1] - b[1]) + (a[2] - b[2]) * (a[2] - b[2]));
}
}  // namespace

TEST_CASE("a chain crossing the periodic boundary unwraps to unit bond lengths", "[analysis][unwrap]") {
    // A diagonal chain of 12 unit bonds starting near the upper corner of a box of 5 crosses
    // every face; wrapped, its bonds jump by ~L. Unwrapped, every bond is 1 again and member 0
    // stays put. Tolerance: one wrap and one unwrap of numbers below 20, ~1e-14.
    const double box_m = 5.0;
    const double step = 1.0 / std::sqrt(3.0);
    std::vector<Vec3> truth, wrapped;
    for (int i = 0; i < 12; ++i) {
        const Vec3 p{4.2 + step * i, 4.7 + step * i, 3.9 - step * i};
        truth.push_back(p);
        wrapped.push_back({wrap_m(p[0], box_m), wrap_m(p[1], box_m), wrap_m(p[2], box_m)});
    }
    // Bonds in scrambled order and orientation: the walk must not depend on either.
    std::vector<Bond> bonds;
    for (std::size_t i = 0; i + 1 < 12; i += 2) bonds.emplace_back(i + 1, i);
    for (std::size_t i = 1; i + 1 < 12; i += 2) bonds.emplace_back(i, i + 1);

    const std::vector<Vec3> unwrapped = unwrap_cluster(wrapped, bonds, box_m);
    REQUIRE(unwrapped.size() == 12);
    CHECK(unwrapped[0] == wrapped[0]);
    for (const auto& [u, v] : bonds) CHECK_THAT(distance_m(unwrapped[u], unwrapped[v]), WithinAbs(1.0, 1e-13));
    for (std::size_t i = 0; i < 12; ++i)
        for (std::size_t k = 0; k < 3; ++k) CHECK_THAT(unwrapped[i][k], WithinAbs(truth[i][k], 1e-13));
}

TEST_CASE("a branched cluster with a loop unwraps consistently", "[analysis][unwrap]") {
    // Square of four members straddling the x = 0 face plus a branch; the loop closes with no
    // stretch because every bond is shorter than L/2.
    const double box_m = 10.0;
    const std::vector<Vec3> wrapped{{9.5, 1, 1}, {0.5, 1, 1}, {0.5, 2, 1}, {9.5, 2, 1}, {0.5, 2, 2}};
    const std::vector<Bond> bonds{{0, 1}, {1, 2}, {2, 3}, {3, 0}, {4, 2}};
    const std::vector<Vec3> unwrapped = unwrap_cluster(wrapped, bonds, box_m);
    CHECK(unwrapped[1] == Vec3{10.5, 1, 1});
    CHECK(unwrapped[2] == Vec3{10.5, 2, 1});
    CHECK(unwrapped[3] == Vec3{9.5, 2, 1});
    CHECK(unwrapped[4] == Vec3{10.5, 2, 2});
}

TEST_CASE("unwrapping names the unreached member and bad bonds", "[analysis][unwrap][validation]") {
    const std::vector<Vec3> three{{0, 0, 0}, {1, 0, 0}, {3, 0, 0}};
    CHECK_THROWS_AS(unwrap_cluster(three, std::vector<Bond>{{0, 1}}, 10.0), std::invalid_argument);
    CHECK_THROWS_WITH(unwrap_cluster(three, std::vector<Bond>{{0, 1}}, 10.0),
                      Catch::Contains("member 2 of 3 is not connected"));
    CHECK_THROWS_WITH(unwrap_cluster(three, std::vector<Bond>{{0, 1}, {1, 3}}, 10.0),
                      Catch::Contains("bond 1 = (1, 3)") && Catch::Contains("< 3"));
    CHECK_THROWS_WITH(unwrap_cluster(three, std::vector<Bond>{{0, 1}, {1, 2}}, 0.0),
                      Catch::Contains("box_length_m = 0"));
    CHECK(unwrap_cluster(std::vector<Vec3>{}, std::vector<Bond>{}, 1.0).empty());
}
