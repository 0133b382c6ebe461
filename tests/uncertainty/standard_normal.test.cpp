#include "uncertainty/standard_normal.hpp"

#include <catch2/catch.hpp>
#include <cmath>
#include <limits>

#include "uncertainty/uncertainty_error.hpp"

using namespace brownfloc::uncertainty;
using Catch::Matchers::WithinAbs;
using Catch::Matchers::WithinRel;

TEST_CASE("the standard normal quantile matches published percentage points to 1e-12", "[uncertainty][normal]") {
    // 1.959963984540054 (p = 0.975) and 3.090232306167813 (p = 0.999) are the standard
    // percentage points (e.g. Abramowitz & Stegun (1964), table 26.5, to fewer digits);
    // the 16-digit values here were cross-checked with scipy.stats.norm.ppf (scipy 1.10).
    // Tolerance 1e-12: the brief's target; the method reaches about 1e-15.
    CHECK_THAT(standard_normal_quantile(0.975), WithinAbs(1.959963984540054, 1e-12));
    CHECK(standard_normal_quantile(0.5) == 0.0);
    CHECK_THAT(standard_normal_quantile(0.001), WithinAbs(-3.090232306167813, 1e-12));
    CHECK_THAT(standard_normal_quantile(0.025), WithinAbs(-1.959963984540054, 1e-12));
    // scipy.stats.norm.ppf (scipy 1.10): 0.9 -> 1.2815515655446004, 1e-10 -> -6.361340902404056,
    // 0.999999 -> 4.753424308817087 (upper tail, through 1 - p), 1e-300 -> -37.0470962993612.
    CHECK_THAT(standard_normal_quantile(0.9), WithinAbs(1.2815515655446004, 1e-12));
    CHECK_THAT(standard_normal_quantile(1e-10), WithinRel(-6.361340902404056, 1e-13));
    CHECK_THAT(standard_normal_quantile(0.999999), WithinRel(4.753424308817087, 1e-12));
    CHECK_THAT(standard_normal_quantile(1e-300), WithinRel(-37.0470962993612, 1e-13));
}

TEST_CASE("the standard normal quantile is antisymmetric and infinite at the ends", "[uncertainty][normal]") {
    // Phi^-1(1 - p) = -Phi^-1(p): exact by symmetry of the normal (common practice), for p
    // whose 1 - p is exact in binary.
    for (double p : {0x1p-27, 0x1p-7, 0.1875, 0.375, 0.484375}) CHECK(standard_normal_quantile(1.0 - p) == -standard_normal_quantile(p));
    CHECK(standard_normal_quantile(0.0) == -std::numeric_limits<double>::infinity());
    CHECK(standard_normal_quantile(1.0) == std::numeric_limits<double>::infinity());
}

TEST_CASE("the standard normal quantile inverts the CDF in both tails", "[uncertainty][normal]") {
    // Round trip Phi(Phi^-1(p)) = p. Tolerance: relative 1e-13 in the lower tail, where p is
    // resolved finely; in the upper half q = 1 - p (a power of 2, so 1 - q is exact) is
    // compared through the survival function.
    for (double p : {1e-300, 1e-100, 1e-20, 1e-8, 1e-3, 0.02425, 0.1, 0.3, 0.5})
        CHECK_THAT(standard_normal_cdf(standard_normal_quantile(p)), WithinRel(p, 1e-13));
    for (double q : {0x1p-52, 0x1p-40, 0x1p-27, 0x1p-10, 0x1p-4, 0x1p-2})
        CHECK_THAT(standard_normal_survival(standard_normal_quantile(1.0 - q)), WithinRel(q, 1e-13));
}

TEST_CASE("the standard normal CDF and survival function keep their tails", "[uncertainty][normal]") {
    // Phi(1) = 0.8413447460685429, Phi(-10) = 7.61985302416047e-24 (scipy.stats.norm.cdf,
    // scipy 1.10; Phi(1) = 0.841344746 in Abramowitz & Stegun (1964), table 26.1).
    CHECK_THAT(standard_normal_cdf(1.0), WithinRel(0.8413447460685429, 1e-15));
    CHECK_THAT(standard_normal_cdf(-10.0), WithinRel(7.61985302416047e-24, 1e-13));
    CHECK_THAT(standard_normal_survival(10.0), WithinRel(7.61985302416047e-24, 1e-13));
}

TEST_CASE("the standard normal quantile rejects probabilities outside 0 to 1", "[uncertainty][normal][validation]") {
    CHECK_THROWS_WITH(standard_normal_quantile(1.5), Catch::Contains("p = 1.5") && Catch::Contains("[0, 1]"));
    CHECK_THROWS_AS(standard_normal_quantile(-0.1), UncertaintyError);
    CHECK_THROWS_WITH(standard_normal_quantile(std::nan("")), Catch::Contains("p = nan"));
}
