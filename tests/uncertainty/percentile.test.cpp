#include "uncertainty/percentile.hpp"

#include <algorithm>
#include <catch2/catch.hpp>
#include <cmath>
#include <cstdint>
#include <limits>
#include <vector>

#include "uncertainty/sample_draw.hpp"
#include "uncertainty/uncertainty_error.hpp"

using namespace brownfloc::uncertainty;
using Catch::Matchers::WithinAbs;
using Catch::Matchers::WithinRel;

namespace {
constexpr double inf = std::numeric_limits<double>::infinity();
}

TEST_CASE("percentiles interpolate linearly between order statistics as in Hyndman and Fan type 7",
          "[uncertainty][percentile]") {
    // Hand-computed with h = (n - 1) p + 1 (Hyndman & Fan 1996, definition 7; numpy's default).
    // Tolerance 1e-14: one rounding in (n - 1) p and one in the interpolation.
    const std::vector<double> five{1.0, 2.0, 3.0, 4.0, 5.0};
    CHECK(percentile(five, 0.5) == 3.0);
    CHECK(percentile(five, 0.0) == 1.0);
    CHECK(percentile(five, 1.0) == 5.0);
    CHECK_THAT(percentile(five, 0.1), WithinAbs(1.4, 1e-14));   // h = 1.4
    CHECK_THAT(percentile(five, 0.9), WithinAbs(4.6, 1e-14));   // h = 4.6
    const std::vector<double> four{10.0, 20.0, 40.0, 80.0};
    CHECK_THAT(percentile(four, 0.25), WithinAbs(17.5, 1e-14));  // h = 1.75: 10 + 0.75 * 10
    CHECK_THAT(percentile(four, 0.75), WithinAbs(50.0, 1e-14));  // h = 3.25: 40 + 0.25 * 40
    CHECK(percentile(std::vector<double>{7.0}, 0.3) == 7.0);
    CHECK(percentile(std::vector<double>{2.0, 2.0, 2.0}, 0.4) == 2.0);
}

TEST_CASE("percentiles of times that include never-aggregating samples stay ordered and never NaN",
          "[uncertainty][percentile]") {
    const std::vector<double> times{1.0, 2.0, 3.0, inf, inf};
    CHECK(percentile(times, 0.5) == 3.0);   // h = 3: exactly x(3)
    CHECK(percentile(times, 0.6) == inf);   // h = 3.4: between 3 and inf
    CHECK(percentile(times, 0.75) == inf);  // h = 4: x(4)
    CHECK(percentile(times, 1.0) == inf);
    CHECK_THAT(percentile(times, 0.25), WithinAbs(2.0, 1e-15));
    const std::vector<double> all_inf{inf, inf, inf};
    CHECK(percentile(all_inf, 0.3) == inf);
}

TEST_CASE("percentile input is checked", "[uncertainty][percentile][validation]") {
    CHECK_THROWS_WITH(percentile(std::vector<double>{}, 0.5), Catch::Contains("at least one sample"));
    CHECK_THROWS_WITH(percentile(std::vector<double>{3.0, 1.0}, 0.5), Catch::Contains("not sorted"));
    CHECK_THROWS_WITH(percentile(std::vector<double>{1.0, std::nan("")}, 0.5), Catch::Contains("value 1 is nan"));
    CHECK_THROWS_WITH(percentile(std::vector<double>{1.0, 2.0}, 50.0), Catch::Contains("not per cent"));
    CHECK_THROWS_AS(percentile(std::vector<double>{-inf, inf}, 0.5), UncertaintyError);
}

TEST_CASE("the order-statistic interval matches the exact binomial", "[uncertainty][percentile]") {
    // n = 10, median: P(B <= 1) = 11/1024 <= 0.025 < P(B <= 2) = 56/1024, so (x(2), x(9)) with
    // coverage 1 - 22/1024 = 0.978515625 (hand-computed; the classic small-sample median
    // interval, Conover (1999), section 3.2).
    const OrderStatisticInterval ten = order_statistic_interval(10, 0.5);
    CHECK(ten.lower_rank == 2);
    CHECK(ten.upper_rank == 9);
    CHECK_THAT(ten.coverage, WithinRel(0.978515625, 1e-13));
    // Larger n, checked with scipy.stats.binom (scipy 1.10) by the same symmetric-tail rule:
    // (500, 0.5) -> (228, 273), coverage 0.9559365304210727; (500, 0.1) -> (37, 65), 0.963395297002785;
    // (500, 0.9) -> (436, 464); (1e5, 0.05) -> (4865, 5137), 0.9515407240832302.
    // Tolerance 1e-10: the recurrence accumulates about 1e-16 per term.
    const OrderStatisticInterval median = order_statistic_interval(500, 0.5);
    CHECK(median.lower_rank == 228);
    CHECK(median.upper_rank == 273);
    CHECK_THAT(median.coverage, WithinRel(0.9559365304210727, 1e-10));
    const OrderStatisticInterval tenth = order_statistic_interval(500, 0.1);
    CHECK(tenth.lower_rank == 37);
    CHECK(tenth.upper_rank == 65);
    CHECK_THAT(tenth.coverage, WithinRel(0.963395297002785, 1e-10));
    const OrderStatisticInterval ninetieth = order_statistic_interval(500, 0.9);
    CHECK(ninetieth.lower_rank == 436);
    CHECK(ninetieth.upper_rank == 464);
    const OrderStatisticInterval large = order_statistic_interval(100000, 0.05);
    CHECK(large.lower_rank == 4865);
    CHECK(large.upper_rank == 5137);
    CHECK_THAT(large.coverage, WithinRel(0.9515407240832302, 1e-10));
    // Ten million samples: no underflow, still fast.
    const OrderStatisticInterval huge = order_statistic_interval(10000000, 0.5);
    CHECK(huge.coverage >= 0.95);
    CHECK(huge.lower_rank < 5000000);
    CHECK(huge.upper_rank > 5000001);
}

TEST_CASE("too few samples leave the interval open on that side", "[uncertainty][percentile]") {
    // n = 5, median: P(B = 0) = P(B = 5) = 1/32 > 0.025, so no order statistic qualifies on
    // either side (hand-computed).
    const OrderStatisticInterval five = order_statistic_interval(5, 0.5);
    CHECK(five.lower_rank == 0);
    CHECK(five.upper_rank == 6);
    CHECK(five.coverage == 1.0);
    const PercentileEstimate estimate = estimate_percentile({1.0, 2.0, 3.0, 4.0, 5.0}, 0.5);
    CHECK(estimate.value == 3.0);
    CHECK(estimate.lower == -inf);
    CHECK(estimate.upper == inf);
    CHECK(order_statistic_interval(7, 0.0).upper_rank == 1);
    CHECK(order_statistic_interval(7, 1.0).lower_rank == 7);
    CHECK_THROWS_WITH(order_statistic_interval(0, 0.5), Catch::Contains("at least one sample"));
    CHECK_THROWS_WITH(order_statistic_interval(10, 0.5, 1.0), Catch::Contains("confidence = 1"));
}

TEST_CASE("the 95 percent order-statistic interval covers the true percentile in at least 93 percent of samples",
          "[uncertainty][percentile]") {
    // 2000 simulated samples of size 500 from { median = 100, factor = 2 }, seed 20240611.
    // Nominal coverage >= 0.95 (exact binomial); with 2000 trials its standard error is 0.5 %,
    // so 93 % is 4 standard errors below (common practice).
    const Distribution d = Distribution::log_normal(100.0, 2.0);
    constexpr std::uint64_t trials = 2000, n = 500, seed = 20240611;
    for (double p : {0.1, 0.5, 0.9}) {
        const double truth = d.quantile(p);
        std::uint64_t covered = 0;
        std::vector<double> x(n);
        for (std::uint64_t t = 0; t < trials; ++t) {
            for (std::uint64_t i = 0; i < n; ++i) x[i] = draw(d, seed, t * n + i, 0);
            std::sort(x.begin(), x.end());
            const PercentileEstimate e = estimate_percentile(x, p);
            if (e.lower <= truth && truth <= e.upper) ++covered;
        }
        const double coverage = static_cast<double>(covered) / static_cast<double>(trials);
        CAPTURE(p, coverage);
        CHECK(coverage >= 0.93);
    }
}

TEST_CASE("intervals over times with infinities are ordered and never NaN", "[uncertainty][percentile]") {
    // 1000 times, the top 300 never aggregating (+inf), seed 5.
    std::vector<double> times(1000);
    for (std::uint64_t i = 0; i < times.size(); ++i)
        times[i] = i < 700 ? draw(Distribution::log_normal(3600.0, 3.0), 5, i, 0) : inf;
    std::sort(times.begin(), times.end());
    const PercentileEstimate median = estimate_percentile(times, 0.5);
    CHECK(std::isfinite(median.value));
    CHECK(median.lower <= median.value);
    CHECK(median.value <= median.upper);
    CHECK(std::isfinite(median.upper));
    const PercentileEstimate high = estimate_percentile(times, 0.9);
    CHECK(high.value == inf);
    CHECK(high.lower == inf);
    CHECK(high.upper == inf);
    const PercentileEstimate edge = estimate_percentile(times, 0.7);  // the interval straddles the first inf
    CHECK(std::isfinite(edge.lower));
    CHECK(edge.upper == inf);
}
