#include "uncertainty/distribution.hpp"

#include <catch2/catch.hpp>
#include <cmath>
#include <limits>

#include "uncertainty/uncertainty_error.hpp"

using namespace brownfloc::uncertainty;
using Catch::Matchers::WithinAbs;
using Catch::Matchers::WithinRel;

namespace {
constexpr double z_975 = 1.959963984540054;  // Phi^-1(0.975), standard table value (see standard_normal.test.cpp)
constexpr double phi_1 = 0.8413447460685429;  // Phi(1), scipy.stats.norm.cdf (scipy 1.10)
}  // namespace

TEST_CASE("a normal distribution has the quantiles and CDF of mean plus sd times z", "[uncertainty][distribution]") {
    const Distribution d = Distribution::normal(10.0, 2.0);
    // Closed form: Q(p) = mean + sd z(p), F(x) = Phi((x - mean) / sd) (common practice).
    // Tolerance: 1e-12 relative, the accuracy of z(p) times one rounding.
    CHECK_THAT(d.quantile(0.975), WithinRel(10.0 + 2.0 * z_975, 1e-12));
    CHECK(d.quantile(0.5) == 10.0);
    CHECK_THAT(d.cdf(12.0), WithinRel(phi_1, 1e-15));
    CHECK(d.cdf(10.0) == 0.5);
    CHECK(d.mean() == 10.0);
    CHECK(d.standard_deviation() == 2.0);
    CHECK(d.text() == "{ mean = 10, sd = 2 }");
}

TEST_CASE("a uniform distribution has linear quantiles and CDF", "[uncertainty][distribution]") {
    const Distribution d = Distribution::uniform(2.0, 6.0);
    // Closed form: Q(p) = low + p (high - low), F(x) = (x - low) / (high - low), mean (low+high)/2,
    // sd (high - low)/sqrt(12) (common practice). Exact in binary for these numbers.
    CHECK(d.quantile(0.25) == 3.0);
    CHECK(d.quantile(0.0) == 2.0);
    CHECK(d.quantile(1.0) == 6.0);
    CHECK(d.cdf(5.0) == 0.75);
    CHECK(d.cdf(1.0) == 0.0);
    CHECK(d.cdf(7.0) == 1.0);
    CHECK(d.mean() == 4.0);
    CHECK_THAT(d.standard_deviation(), WithinRel(4.0 / std::sqrt(12.0), 1e-15));
    CHECK(d.text() == "{ low = 2, high = 6 }");
}

TEST_CASE("a log-normal distribution has median times factor to the power z", "[uncertainty][distribution]") {
    const Distribution d = Distribution::log_normal(100.0, 2.0);
    // Closed form: Q(p) = median factor^z(p), F(x) = Phi(ln(x / median) / ln factor),
    // mean = median exp(ln(factor)^2 / 2) = 127.15371297141405 (numpy), sd = mean sqrt(exp(ln(factor)^2) - 1)
    // (standard log-normal moments; common practice). Tolerance 1e-12 relative: z(p) accuracy.
    CHECK_THAT(d.quantile(0.5), WithinRel(100.0, 1e-15));
    CHECK_THAT(d.quantile(phi_1), WithinRel(200.0, 1e-12));
    CHECK_THAT(d.quantile(0.975), WithinRel(100.0 * std::pow(2.0, z_975), 1e-12));
    CHECK_THAT(d.cdf(200.0), WithinRel(phi_1, 1e-15));
    CHECK_THAT(d.cdf(50.0), WithinRel(1.0 - phi_1, 1e-14));
    CHECK(d.cdf(0.0) == 0.0);
    CHECK(d.cdf(-1.0) == 0.0);
    CHECK_THAT(d.mean(), WithinRel(127.15371297141405, 1e-14));
    const double s2 = std::log(2.0) * std::log(2.0);
    CHECK_THAT(d.standard_deviation(), WithinRel(127.15371297141405 * std::sqrt(std::exp(s2) - 1.0), 1e-13));
    CHECK(d.text() == "{ median = 100, factor = 2 }");
}

TEST_CASE("cdf of quantile gives p back for every kind", "[uncertainty][distribution]") {
    // Round trip F(Q(p)) = p (common practice). Normal and log-normal: 1e-12 relative, the
    // accuracy of z(p). Upper tail through P(X > Q(1 - q)) = q, with q a power of 2 so that
    // 1 - q is exact. Uniform: low + p (high - low) rounds to about 1e-16 absolute, so the
    // round trip holds to 1e-15 absolute, not relative.
    const Distribution smooth[] = {Distribution::normal(-3.0, 0.5), Distribution::log_normal(40.0, 1.3)};
    for (const Distribution& d : smooth) {
        for (double p : {1e-12, 1e-6, 0.001, 0.025, 0.3, 0.5, 0.7, 0.975}) {
            CAPTURE(d.text(), p);
            CHECK_THAT(d.cdf(d.quantile(p)), WithinRel(p, 1e-12));
        }
        for (double q : {0x1p-40, 0x1p-20, 0x1p-6}) {
            CAPTURE(d.text(), q);
            CHECK_THAT(d.probability_above(d.quantile(1.0 - q)), WithinRel(q, 1e-12));
        }
    }
    const Distribution uniform = Distribution::uniform(-1.0, 7.0);
    for (double p : {1e-12, 1e-6, 0.001, 0.025, 0.3, 0.5, 0.7, 0.975, 1.0 - 1e-9}) {
        CAPTURE(p);
        CHECK_THAT(uniform.cdf(uniform.quantile(p)), WithinAbs(p, 1e-15));
        CHECK_THAT(uniform.probability_above(uniform.quantile(p)), WithinAbs(1.0 - p, 1e-15));
    }
}

TEST_CASE("zero-width distributions of every kind are points", "[uncertainty][distribution]") {
    const Distribution points[] = {Distribution::point(5.0), Distribution::normal(5.0, 0.0),
                                   Distribution::uniform(5.0, 5.0), Distribution::log_normal(5.0, 1.0)};
    for (const Distribution& d : points) {
        CAPTURE(d.text());
        CHECK(d.is_point());
        for (double p : {0.0, 1e-9, 0.5, 1.0}) CHECK(d.quantile(p) == 5.0);
        CHECK(d.mean() == 5.0);
        CHECK(d.standard_deviation() == 0.0);
        CHECK(d.cdf(4.999) == 0.0);
        CHECK(d.cdf(5.0) == 1.0);
        CHECK(d.probability_outside(5.0, 5.0) == 0.0);
        CHECK(d.probability_outside(6.0, 7.0) == 1.0);
    }
    CHECK(Distribution::point(5.0).text() == "5");
    CHECK_FALSE(Distribution::normal(5.0, 1e-300).is_point());
}

TEST_CASE("probability outside a range adds both tails without cancellation", "[uncertainty][distribution]") {
    // Phi(-2.5) = 6.209665325776132e-3 and Phi(-10) = 7.61985302416047e-24 (scipy.stats.norm.cdf,
    // scipy 1.10). Tolerance 1e-12 relative: erfc accuracy.
    const double inf = std::numeric_limits<double>::infinity();
    CHECK_THAT(Distribution::normal(10.0, 4.0).probability_outside(0.0, inf), WithinRel(6.209665325776132e-3, 1e-12));
    CHECK_THAT(Distribution::normal(10.0, 1.0).probability_outside(0.0, inf), WithinRel(7.61985302416047e-24, 1e-12));
    CHECK_THAT(Distribution::normal(0.0, 1.0).probability_outside(-10.0, 10.0),
               WithinRel(2.0 * 7.61985302416047e-24, 1e-12));
    CHECK(Distribution::log_normal(1.0, 3.0).probability_outside(0.0, inf) == 0.0);
    CHECK_THAT(Distribution::uniform(-1.0, 3.0).probability_outside(0.0, inf), WithinAbs(0.25, 1e-16));
    CHECK_THROWS_WITH(Distribution::normal(1.0, 1.0).probability_outside(2.0, 1.0), Catch::Contains("[2, 1]"));
}

TEST_CASE("invalid parameters are rejected with the parameter and the rule named", "[uncertainty][distribution][validation]") {
    const double inf = std::numeric_limits<double>::infinity();
    CHECK_THROWS_WITH(Distribution::normal(10.0, -4.0),
                      Catch::Contains("{ mean = 10, sd = -4 }") && Catch::Contains("sd = -4: must be >= 0"));
    CHECK_THROWS_WITH(Distribution::normal(std::nan(""), 1.0), Catch::Contains("mean = nan: must be a finite number"));
    CHECK_THROWS_WITH(Distribution::normal(1.0, inf), Catch::Contains("sd = inf"));
    CHECK_THROWS_WITH(Distribution::normal(0.0, 1e308), Catch::Contains("too wide"));
    CHECK_THROWS_WITH(Distribution::uniform(5.0, 1.0), Catch::Contains("high = 1: must be >= low"));
    CHECK_THROWS_WITH(Distribution::uniform(-1e308, 1e308), Catch::Contains("overflows"));
    CHECK_THROWS_WITH(Distribution::uniform(-inf, 1.0), Catch::Contains("low = -inf: must be a finite number"));
    CHECK_THROWS_WITH(Distribution::log_normal(10.0, 0.5), Catch::Contains("factor = 0.5: must be >= 1"));
    CHECK_THROWS_WITH(Distribution::log_normal(0.0, 2.0), Catch::Contains("median = 0: must be > 0"));
    CHECK_THROWS_WITH(Distribution::log_normal(-3.0, 2.0), Catch::Contains("median = -3: must be > 0"));
    CHECK_THROWS_WITH(Distribution::log_normal(1.0, 1e300), Catch::Contains("factor = 1e+300: too wide"));
    CHECK_THROWS_WITH(Distribution::point(std::nan("")), Catch::Contains("value = nan"));
    CHECK_THROWS_AS(Distribution::normal(1.0, 1.0).quantile(1.5), UncertaintyError);
    CHECK_THROWS_WITH(Distribution::uniform(1.0, 2.0).quantile(-0.5), Catch::Contains("p = -0.5"));
    CHECK_THROWS_AS(Distribution::normal(1.0, 1.0).cdf(std::nan("")), UncertaintyError);
    // A wide but sane log-normal is accepted.
    CHECK_NOTHROW(Distribution::log_normal(1.0, 100.0));
}
