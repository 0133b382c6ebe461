#include "uncertainty/physical_range.hpp"

#include <catch2/catch.hpp>
#include <limits>

using namespace brownfloc::uncertainty;

namespace {
constexpr double inf = std::numeric_limits<double>::infinity();
}

TEST_CASE("a normal radius with a large sd is reported with the key and a log-normal suggestion",
          "[uncertainty][physical-range][validation]") {
    // Mass below 0 of { mean = 10, sd = 4 }: Phi(-2.5) = 6.2e-3 (scipy.stats.norm.cdf, scipy 1.10),
    // above the 1e-6 limit. Suggested log-normal of the same mean and sd: sigma^2 = ln(1.16),
    // median = 10 / sqrt(1.16) = 9.28, factor = exp(sqrt(ln 1.16)) = 1.47 (hand-computed).
    const auto problem = physical_range_problem(Distribution::normal(10.0, 4.0), 0.0, inf, "radius_nm");
    REQUIRE(problem.has_value());
    CHECK_THAT(*problem, Catch::StartsWith("radius_nm = { mean = 10, sd = 4 }: probability 6.2e-03") &&
                             Catch::Contains("[0, inf)") && Catch::Contains("{ median = 9.28, factor = 1.47 }"));
}

TEST_CASE("a normal radius whose mass below zero is negligible passes", "[uncertainty][physical-range]") {
    // Phi(-10) = 7.6e-24 (scipy.stats.norm.cdf, scipy 1.10), far below 1e-6.
    CHECK_FALSE(physical_range_problem(Distribution::normal(10.0, 1.0), 0.0, inf, "radius_nm").has_value());
    CHECK_FALSE(physical_range_problem(Distribution::log_normal(10.0, 5.0), 0.0, inf, "radius_nm").has_value());
    CHECK_FALSE(physical_range_problem(Distribution::point(3.0), 0.0, inf, "radius_nm").has_value());
}

TEST_CASE("other range problems suggest narrowing", "[uncertainty][physical-range][validation]") {
    // A point outside the range: all of its mass.
    const auto point = physical_range_problem(Distribution::point(-2.0), 0.0, inf, "concentration_mM");
    REQUIRE(point.has_value());
    CHECK_THAT(*point, Catch::Contains("concentration_mM = -2: probability 1.0e+00") && Catch::Contains("move it inside"));
    // A bounded range: a log-normal is no fix.
    const auto bounded = physical_range_problem(Distribution::uniform(0.5, 1.5), 0.0, 1.0, "fraction");
    REQUIRE(bounded.has_value());
    CHECK_THAT(*bounded, Catch::Contains("[0, 1]") && Catch::Contains("narrow the distribution"));
    CHECK_THROWS(physical_range_problem(Distribution::point(1.0), 2.0, 1.0, "x"));
}
