#include "uncertainty/least_squares.hpp"

#include <catch2/catch.hpp>
#include <cmath>
#include <limits>
#include <vector>

#include "uncertainty/ranks.hpp"
#include "uncertainty/uncertainty_error.hpp"

using namespace brownfloc::uncertainty;
using Catch::Matchers::WithinAbs;

TEST_CASE("least squares fits a straight line through four points", "[uncertainty][least-squares]") {
    // y = {1, 3, 2, 5} at x = {0, 1, 2, 3}: slope Sxy / Sxx = 5.5 / 5 = 1.1, intercept
    // 2.75 - 1.1 * 1.5 = 1.1, residuals -0.1, 0.8, -1.3, 0.6, RSS 2.7 (hand-computed).
    // Tolerance 1e-13: a well-conditioned 4 x 2 problem.
    const LeastSquaresFit fit = least_squares({{1.0, 1.0, 1.0, 1.0}, {0.0, 1.0, 2.0, 3.0}}, {1.0, 3.0, 2.0, 5.0});
    REQUIRE(fit.coefficients.size() == 2);
    CHECK_THAT(fit.coefficients[0], WithinAbs(1.1, 1e-13));
    CHECK_THAT(fit.coefficients[1], WithinAbs(1.1, 1e-13));
    CHECK_THAT(fit.residual_sum_of_squares, WithinAbs(2.7, 1e-13));
}

TEST_CASE("least squares recovers exact coefficients of three columns", "[uncertainty][least-squares]") {
    // b = 2 c0 - 3 c1 + 0.5 c2 exactly: the coefficients come back and RSS is rounding only.
    std::vector<std::vector<double>> columns(3, std::vector<double>(20));
    std::vector<double> b(20);
    for (std::size_t i = 0; i < 20; ++i) {
        const double x = static_cast<double>(i);
        columns[0][i] = 1.0;
        columns[1][i] = std::sin(x);
        columns[2][i] = x * x / 10.0;
        b[i] = 2.0 * columns[0][i] - 3.0 * columns[1][i] + 0.5 * columns[2][i];
    }
    const LeastSquaresFit fit = least_squares(columns, b);
    CHECK_THAT(fit.coefficients[0], WithinAbs(2.0, 1e-12));
    CHECK_THAT(fit.coefficients[1], WithinAbs(-3.0, 1e-12));
    CHECK_THAT(fit.coefficients[2], WithinAbs(0.5, 1e-12));
    CHECK(fit.residual_sum_of_squares < 1e-24);
    CHECK(least_squares({}, {3.0, 4.0}).residual_sum_of_squares == 25.0);
}

TEST_CASE("least squares names a dependent column and rejects bad shapes", "[uncertainty][least-squares][validation]") {
    try {
        (void)least_squares({{1.0, 2.0, 3.0}, {2.0, 4.0, 6.0}}, {1.0, 1.0, 2.0});
        FAIL("no exception");
    } catch (const RankDeficientError& error) {
        CHECK(error.column() == 1);
        CHECK_THAT(error.what(), Catch::Contains("column 1"));
    }
    CHECK_THROWS_AS(least_squares({{0.0, 0.0, 0.0}}, {1.0, 2.0, 3.0}), RankDeficientError);
    CHECK_THROWS_WITH(least_squares({{1.0, 2.0}, {3.0, 4.0}}, {1.0, 2.0}), Catch::Contains("more rows than columns"));
    CHECK_THROWS_WITH(least_squares({{1.0, 2.0}}, {1.0, 2.0, 3.0}), Catch::Contains("column 0 has 2 rows"));
    CHECK_THROWS_WITH(least_squares({{1.0, std::numeric_limits<double>::infinity(), 3.0}}, {1.0, 2.0, 3.0}),
                      Catch::Contains("not finite"));
}

TEST_CASE("ties get average ranks", "[uncertainty][ranks]") {
    // Mid-ranks (Conover 1999, section 5.4), hand-computed.
    CHECK(average_ranks({3.0, 1.0, 3.0, 2.0}) == std::vector<double>{3.5, 1.0, 3.5, 2.0});
    const double inf = std::numeric_limits<double>::infinity();
    CHECK(average_ranks({inf, 1.0, inf, 0.5, inf}) == std::vector<double>{4.0, 2.0, 4.0, 1.0, 4.0});
    CHECK(average_ranks({}).empty());
    CHECK_THROWS_WITH(average_ranks({1.0, std::nan("")}), Catch::Contains("value 1 is nan"));
    // Spearman rho of a monotone pair is 1, of a reversed pair -1 (definition).
    CHECK(spearman_rho({1.0, 2.0, 3.0, 4.0}, {10.0, 20.0, 25.0, 1e9}) == 1.0);
    CHECK(spearman_rho({1.0, 2.0, 3.0, 4.0}, {4.0, 3.0, 2.0, 1.0}) == -1.0);
    CHECK(spearman_rho({1.0, 1.0, 1.0}, {1.0, 2.0, 3.0}) == 0.0);
}
