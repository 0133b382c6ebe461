#include <catch2/catch.hpp>

#include <cmath>
#include <limits>
#include <numeric>
#include <stdexcept>
#include <vector>

#include "colour_science.hpp"
#include "scene/palettes.hpp"

using namespace brownfloc::viewer;
using namespace brownfloc::viewer::test;

namespace {

constexpr int steps = 64;

std::vector<Triple> map_in_oklab() {
    std::vector<Triple> points;
    for (int k = 0; k < steps; ++k) points.push_back(oklab(size_map_at(double(k) / (steps - 1))));
    return points;
}

}  // namespace

TEST_CASE("the size map grows strictly lighter from the small end to the large end", "[viewer][scene][palette]") {
    // Oklab lightness (Ottosson 2020) of the 8-bit colours the map returns, over 64 steps.
    const std::vector<Triple> points = map_in_oklab();
    for (int k = 1; k < steps; ++k) {
        CAPTURE(k, points[std::size_t(k - 1)][0], points[std::size_t(k)][0]);
        CHECK(points[std::size_t(k)][0] > points[std::size_t(k - 1)][0]);
    }
    // Dark end clearly above the background, light end near white but not white (our design:
    // 0.44 and 0.90 before rounding; 0.01 covers 8-bit rounding).
    CHECK_THAT(points.front()[0], Catch::Matchers::WithinAbs(0.44, 0.01));
    CHECK_THAT(points.back()[0], Catch::Matchers::WithinAbs(0.90, 0.01));
}

TEST_CASE("the size map takes equal steps in Oklab within 20 percent", "[viewer][scene][palette]") {
    // Step sizes are Euclidean distances in Oklab (Ottosson 2020), 63 steps between 64 samples;
    // +-20 % of their mean is the brief's uniformity requirement; the map's own design is exactly
    // uniform and 8-bit rounding brings it to about +-13 %.
    const std::vector<Triple> points = map_in_oklab();
    std::vector<double> sizes;
    for (int k = 1; k < steps; ++k) sizes.push_back(distance(points[std::size_t(k)], points[std::size_t(k - 1)]));
    const double mean = std::accumulate(sizes.begin(), sizes.end(), 0.0) / double(sizes.size());
    for (std::size_t k = 0; k < sizes.size(); ++k) {
        CAPTURE(k, sizes[k], mean);
        CHECK(std::abs(sizes[k] / mean - 1.0) <= 0.20);
    }
}

TEST_CASE("cluster sizes map over log10 size from 1 to the largest", "[viewer][scene][palette]") {
    CHECK(size_colour(1, 1000) == size_map_at(0.0));
    CHECK(size_colour(1000, 1000) == size_map_at(1.0));
    CHECK(size_colour(10, 1000) == size_map_at(1.0 / 3.0));
    CHECK(size_colour(10, 100) == size_map_at(0.5));
    CHECK(size_colour(5000, 1000) == size_map_at(1.0));  // beyond the largest: the light end
    CHECK(size_colour(1, 1) == size_map_at(0.0));
    CHECK(size_colour(3, 0) == size_map_at(0.0));  // no meaningful range: the dark end
    CHECK(size_map_at(-0.5) == size_map_at(0.0));
    CHECK(size_map_at(7.0) == size_map_at(1.0));
    CHECK_THROWS_WITH(size_colour(0, 10), Catch::Contains("size 0"));
    CHECK_THROWS_AS(size_map_at(std::numeric_limits<double>::quiet_NaN()), std::invalid_argument);
}
