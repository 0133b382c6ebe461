#include "uncertainty/rank_sensitivity.hpp"

#include <catch2/catch.hpp>
#include <cmath>
#include <cstdint>
#include <limits>
#include <vector>

#include "uncertainty/ranks.hpp"
#include "uncertainty/sample_draw.hpp"
#include "uncertainty/uncertainty_error.hpp"

using namespace brownfloc::uncertainty;

namespace {

constexpr std::uint64_t seed = 314159;
constexpr std::size_t n = 1000;

std::vector<double> uniform_column(std::uint32_t input) {
    std::vector<double> x(n);
    for (std::uint64_t i = 0; i < n; ++i) x[i] = uniform_draw(seed, i, input);
    return x;
}

// y = 3 rank(x1) - 1 rank(x2) + noise, noise normal with sd 300 (about the sd of one rank,
// n / sqrt(12) = 289); x3 does not enter.
struct Synthetic {
    std::vector<SampledInput> inputs;
    std::vector<double> y;
};

Synthetic synthetic() {
    Synthetic s{{{"x1", uniform_column(0)}, {"x2", uniform_column(1)}, {"x3", uniform_column(2)}}, std::vector<double>(n)};
    const std::vector<double> r1 = average_ranks(s.inputs[0].values), r2 = average_ranks(s.inputs[1].values);
    const Distribution noise = Distribution::normal(0.0, 300.0);
    for (std::uint64_t i = 0; i < n; ++i) s.y[i] = 3.0 * r1[i] - 1.0 * r2[i] + draw(noise, seed, i, 3);
    return s;
}

}  // namespace

TEST_CASE("SRRC recover the ordering and sign of a synthetic rank model", "[uncertainty][sensitivity]") {
    // Signal sd sqrt(9 + 1) * 289 = 913 against noise 300: expected R^2 of about
    // 913^2 / (913^2 + 300^2) = 0.90 and SRRC about 0.95 * (3, -1, 0) / sqrt(10) = (0.90, -0.30, 0)
    // (hand-computed for a linear model; Saltelli et al. 2004, section 1.2.5: SRRC^2 sum to R^2
    // for independent inputs). Seed 314159, n = 1000. Tolerance on x3: |SRRC| < 0.1, about
    // 3 standard errors of a null coefficient (sqrt((1 - R^2) / n) = 0.01; common practice, generous).
    const Synthetic s = synthetic();
    const RankSensitivity result = rank_sensitivity(s.inputs, s.y);
    REQUIRE(result.output_varied);
    REQUIRE(result.by_influence == std::vector<std::size_t>{0, 1, 2});
    const double srrc1 = *result.inputs[0].srrc, srrc2 = *result.inputs[1].srrc, srrc3 = *result.inputs[2].srrc;
    CAPTURE(srrc1, srrc2, srrc3, result.r_squared);
    CHECK(srrc1 > 0.8);
    CHECK(srrc2 < -0.2);
    CHECK(srrc2 > -0.4);
    CHECK(std::fabs(srrc3) < 0.1);
    CHECK(result.r_squared > 0.8);
    CHECK(result.reliable);
    CHECK(*result.inputs[0].spearman_rho > 0.8);
    CHECK(*result.inputs[1].spearman_rho < -0.2);
    // For independent inputs, SRRC^2 add up to about R^2 (Saltelli et al. 2004, section 1.2.5);
    // 0.05: sampling correlations between the inputs (common practice).
    CHECK(std::fabs(srrc1 * srrc1 + srrc2 * srrc2 + srrc3 * srrc3 - result.r_squared) < 0.05);
}

TEST_CASE("any increasing transform of the output gives the same sensitivities", "[uncertainty][sensitivity]") {
    // Ranks of log10(time) are the ranks of time: the report is the same bit for bit.
    const Synthetic s = synthetic();
    std::vector<double> times_s(n);
    for (std::size_t i = 0; i < n; ++i) times_s[i] = std::pow(10.0, s.y[i] / 1000.0);
    const RankSensitivity of_y = rank_sensitivity(s.inputs, s.y);
    const RankSensitivity of_time = rank_sensitivity(s.inputs, times_s);
    CHECK(of_y.r_squared == of_time.r_squared);
    for (std::size_t j = 0; j < 3; ++j) CHECK(*of_y.inputs[j].srrc == *of_time.inputs[j].srrc);
}

TEST_CASE("pure noise gives a rank R squared below 0.7 and is not reliable", "[uncertainty][sensitivity]") {
    // y independent of every input: E[R^2] = k / (n - 1) = 0.003 here (common practice).
    const Synthetic s = synthetic();
    std::vector<double> noise(n);
    for (std::uint64_t i = 0; i < n; ++i) noise[i] = uniform_draw(seed + 1, i, 9);
    const RankSensitivity result = rank_sensitivity(s.inputs, noise);
    CHECK(result.r_squared < 0.7);
    CHECK(result.r_squared < 0.05);
    CHECK_FALSE(result.reliable);
}

TEST_CASE("inputs of zero width are excluded and reported as such", "[uncertainty][sensitivity]") {
    const Synthetic s = synthetic();
    std::vector<SampledInput> with_point = s.inputs;
    with_point.insert(with_point.begin() + 1, SampledInput{"temperature_offset_K", std::vector<double>(n, 0.0)});
    const RankSensitivity without = rank_sensitivity(s.inputs, s.y);
    const RankSensitivity with = rank_sensitivity(with_point, s.y);
    REQUIRE(with.inputs.size() == 4);
    CHECK(with.inputs[1].name == "temperature_offset_K");
    CHECK_FALSE(with.inputs[1].varied);
    CHECK_FALSE(with.inputs[1].srrc.has_value());
    CHECK_FALSE(with.inputs[1].spearman_rho.has_value());
    CHECK(with.by_influence == std::vector<std::size_t>{0, 2, 3});
    // The regression of the others is untouched, bit for bit.
    CHECK(with.r_squared == without.r_squared);
    CHECK(*with.inputs[0].srrc == *without.inputs[0].srrc);
    CHECK(*with.inputs[3].srrc == *without.inputs[2].srrc);
}

TEST_CASE("outputs that never vary give no sensitivity instead of NaN", "[uncertainty][sensitivity]") {
    const Synthetic s = synthetic();
    const std::vector<double> never(n, std::numeric_limits<double>::infinity());
    const RankSensitivity result = rank_sensitivity(s.inputs, never);
    CHECK_FALSE(result.output_varied);
    CHECK_FALSE(result.reliable);
    CHECK(result.r_squared == 0.0);
    CHECK(result.by_influence.empty());
    CHECK(result.inputs[0].varied);
    CHECK_FALSE(result.inputs[0].srrc.has_value());
}

TEST_CASE("infinite times rank above every finite time", "[uncertainty][sensitivity]") {
    // The slowest 20 % of the synthetic outputs become +inf (never aggregating): ranks tie at
    // the top, the ordering of inputs survives.
    Synthetic s = synthetic();
    std::vector<double> sorted = s.y;
    std::sort(sorted.begin(), sorted.end());
    const double cut = sorted[800];
    for (double& y : s.y)
        if (y >= cut) y = std::numeric_limits<double>::infinity();
    const RankSensitivity result = rank_sensitivity(s.inputs, s.y);
    CHECK(result.by_influence == std::vector<std::size_t>{0, 1, 2});
    CHECK(*result.inputs[0].srrc > 0.0);
    CHECK(*result.inputs[1].srrc < 0.0);
}

TEST_CASE("sensitivity input problems are named", "[uncertainty][sensitivity][validation]") {
    const Synthetic s = synthetic();
    std::vector<SampledInput> twice = s.inputs;
    twice.push_back(SampledInput{"x1_again", s.inputs[0].values});
    CHECK_THROWS_WITH(rank_sensitivity(twice, s.y), Catch::Contains("input x1_again") && Catch::Contains("linear combination"));
    std::vector<SampledInput> short_input = s.inputs;
    short_input[2].values.pop_back();
    CHECK_THROWS_WITH(rank_sensitivity(short_input, s.y), Catch::Contains("input x3 has 999 samples"));
    std::vector<double> with_nan = s.y;
    with_nan[17] = std::nan("");
    CHECK_THROWS_WITH(rank_sensitivity(s.inputs, with_nan), Catch::Contains("sample 17 is nan"));
    CHECK_THROWS_WITH(rank_sensitivity({{"a", {1.0, 2.0, 3.0}}, {"b", {3.0, 1.0, 2.0}}}, {1.0, 2.0, 3.0}),
                      Catch::Contains("needs at least 4 samples"));
}
