#include <catch2/catch.hpp>

#include <algorithm>
#include <array>
#include <bit>
#include <cmath>
#include <cstdint>
#include <vector>

#include "sim/philox_noise.hpp"

using namespace brownfloc::sim;

namespace {

// Fixed seed and step of every statistical test below.
constexpr std::uint64_t test_seed = 0x5eed'2024'0601'0001ULL;
constexpr std::uint64_t test_step = 12345;

double normal_cdf(double z) { return 0.5 * std::erfc(-z / std::sqrt(2.0)); }
// Tail probability of |z| beyond z, accurate far out in either tail.
double normal_tail(double z) { return 0.5 * std::erfc(std::fabs(z) / std::sqrt(2.0)); }

// One pass over 2.5e6 blocks (1e7 normals) of the fast transform: moments, tail counts and
// the sums behind the correlations, computed once and shared by the tests below.
struct FastNormalSample {
    static constexpr std::uint32_t blocks = 2'500'000;
    static constexpr double n = 4.0 * blocks;  // normals
    long double sum[5] = {};                   // sum of x^k over all outputs, k = 0..4
    long double output_sum[4] = {}, output_sum_sq[4] = {};
    long double within[4][4] = {}, within_sq[4][4] = {};  // sum x_i x_j and x_i^2 x_j^2, one block
    long double next_body[4] = {};                        // sum x_i(body) x_i(body + 1)
    long double next_step[4] = {};                        // sum x_i(step) x_i(step + 1), same body
    std::int64_t above[5] = {}, below[5] = {};            // counts of x > k and x < -k, k = 0..4
};

const FastNormalSample& fast_normal_sample() {
    static const FastNormalSample s = [] {
        FastNormalSample r;
        std::array<double, 4> previous{};
        for (std::uint32_t body = 0; body < FastNormalSample::blocks; ++body) {
            const auto x = standard_normals(test_seed, test_step, body, NoiseStream::translation);
            const auto later = standard_normals(test_seed, test_step + 1, body, NoiseStream::translation);
            for (int i = 0; i < 4; ++i) {
                const long double v = x[i];
                long double power = 1;
                for (int k = 0; k < 5; ++k, power *= v) r.sum[k] += power;
                r.output_sum[i] += v;
                r.output_sum_sq[i] += v * v;
                for (int j = i + 1; j < 4; ++j) {
                    r.within[i][j] += v * x[j];
                    r.within_sq[i][j] += v * v * x[j] * x[j];
                }
                if (body > 0) r.next_body[i] += previous[i] * v;
                r.next_step[i] += v * later[i];
                for (int k = 0; k < 5; ++k) {
                    r.above[k] += x[i] > k;
                    r.below[k] += x[i] < -k;
                }
            }
            previous = x;
        }
        return r;
    }();
    return s;
}

}  // namespace

TEST_CASE("Philox4x32-10 reproduces the Random123 known-answer vectors", "[sim][noise]") {
    // Random123 1.14 kat_vectors: counter 0, key 0 -> 6627e8d5 e169c58d bc57ac4c 9b00dbd8.
    CHECK(philox_block(0, 0, 0, NoiseStream::translation) ==
          std::array<std::uint32_t, 4>{0x6627e8d5u, 0xe169c58du, 0xbc57ac4cu, 0x9b00dbd8u});
    // The "pi" vector: counter {243f6a88 85a308d3 13198a2e 03707344}, key {a4093822 299f31d0}
    // -> d16cfe09 94fdcceb 5001e420 24126ea1. In our layout: step = word1:word0, body = word2,
    // stream 0 with extra 0x3707344, seed = key1:key0. This pins the whole layout.
    CHECK(philox_block(0x299f31d0'a4093822ULL, 0x85a308d3'243f6a88ULL, 0x13198a2eu, NoiseStream::translation,
                       0x03707344u) ==
          std::array<std::uint32_t, 4>{0xd16cfe09u, 0x94fdccebu, 0x5001e420u, 0x24126ea1u});
}

TEST_CASE("noise is a pure function of seed, step, body, stream and extra", "[sim][noise]") {
    const auto reference = philox_block(test_seed, test_step, 17, NoiseStream::translation, 3);
    CHECK(philox_block(test_seed, test_step, 17, NoiseStream::translation, 3) == reference);
    CHECK(philox_block(test_seed + 1, test_step, 17, NoiseStream::translation, 3) != reference);
    CHECK(philox_block(test_seed, test_step + 1, 17, NoiseStream::translation, 3) != reference);
    CHECK(philox_block(test_seed, test_step + (1ULL << 32), 17, NoiseStream::translation, 3) != reference);
    CHECK(philox_block(test_seed, test_step, 18, NoiseStream::translation, 3) != reference);
    CHECK(philox_block(test_seed, test_step, 17, NoiseStream::rotation, 3) != reference);
    CHECK(philox_block(test_seed, test_step, 17, NoiseStream::translation, 4) != reference);
    CHECK(philox_block(test_seed ^ (1ULL << 40), test_step, 17, NoiseStream::translation, 3) != reference);

    const auto fast = standard_normals(test_seed, test_step, 17, NoiseStream::capture);
    const auto again = standard_normals(test_seed, test_step, 17, NoiseStream::capture);
    for (int i = 0; i < 4; ++i) CHECK(std::bit_cast<std::uint64_t>(fast[i]) == std::bit_cast<std::uint64_t>(again[i]));
}

TEST_CASE("normals computed on several threads in any order equal the serial ones bit for bit", "[sim][noise]") {
    constexpr int bodies = 100'000;
    std::vector<std::array<double, 4>> serial(bodies), parallel(bodies);
    for (int b = 0; b < bodies; ++b)
        serial[b] = standard_normals(test_seed, test_step, static_cast<std::uint32_t>(b), NoiseStream::translation);
    // Reverse order, dynamic schedule, 4 threads: the result must not notice.
#pragma omp parallel for num_threads(4) schedule(dynamic, 97)
    for (int b = bodies - 1; b >= 0; --b)
        parallel[b] = standard_normals(test_seed, test_step, static_cast<std::uint32_t>(b), NoiseStream::translation);
    int differing = 0;
    for (int b = 0; b < bodies; ++b)
        for (int i = 0; i < 4; ++i)
            differing += std::bit_cast<std::uint64_t>(serial[b][i]) != std::bit_cast<std::uint64_t>(parallel[b][i]);
    CHECK(differing == 0);
}

TEST_CASE("uniforms lie strictly inside (0, 1)", "[sim][noise]") {
    CHECK(uniform_open01(0u) == 0x1p-33);
    CHECK(uniform_open01(0xffffffffu) == 1.0 - 0x1p-33);
    CHECK(uniform_open01(0u, 0u) == 0x1p-53);
    CHECK(uniform_open01(0xffffffffu, 0xffffffffu) == 1.0 - 0x1p-53);
    CHECK(uniform_open01(0x80000000u) == 0.5 + 0x1p-33);
}

TEST_CASE("the inverse normal CDF inverts Phi to double precision", "[sim][noise]") {
    // Reference values of the quantile (17 significant digits, scipy.special.ndtri).
    CHECK_THAT(inverse_normal_cdf(0.975), Catch::Matchers::WithinRel(1.959963984540054, 1e-15));
    CHECK_THAT(inverse_normal_cdf(1e-10), Catch::Matchers::WithinRel(-6.361340902404056, 1e-15));
    CHECK_THAT(inverse_normal_cdf(1e-300), Catch::Matchers::WithinRel(-37.0470962993612, 1e-13));
    CHECK(inverse_normal_cdf(0.5) == 0.0);
    CHECK(std::isinf(inverse_normal_cdf(0.0)));
    CHECK(std::isnan(inverse_normal_cdf(1.5)));
    // Round trip through erfc over lower-tail probabilities 1e-300 .. 0.5. AS241 is accurate
    // to ~1e-16 relative in z; an error dz moves p by |z| dz relative, and erfc adds a few
    // ulp, so the bound is 4e-15 (1 + z^2) (measured worst: 8.4e-16 (1 + z^2)).
    double worst = 0;
    for (double log10_p = -300; log10_p <= std::log10(0.5); log10_p += 0.01) {
        const double p = std::pow(10.0, log10_p);
        const double z = inverse_normal_cdf(p);
        worst = std::max(worst, std::fabs(normal_cdf(z) - p) / p / (1 + z * z));
    }
    CHECK(worst < 4e-15);
}

TEST_CASE("the fast transform is within 2.3e-7 of the exact inverse CDF and increasing", "[sim][noise]") {
    // 65 points in each of the 4096 intervals (both ends and every 2^14-th fraction), the
    // CDF error |Phi(z(w)) - u(w)| taken on the side of the smaller tail so that erfc keeps
    // full relative precision. Bounds are those stated in philox_noise.hpp; measured worst
    // 2.26e-7 at |z| ~ 3.2-3.3; Phi itself is good to ~1e-16 here.
    double worst = 0, worst_below_2_6 = 0, worst_below_2 = 0;
    double previous = -1e300;
    bool increasing = true;
    for (std::uint32_t interval = 0; interval < 4096; ++interval) {
        for (std::uint32_t s = 0; s <= 64; ++s) {
            const std::uint32_t w = (interval << 20) | (s == 64 ? 0xfffffu : s << 14);
            const double z = standard_normal_from_bits(w);
            const double tail = w >> 31 ? uniform_open01(~w) : uniform_open01(w);
            const double error = std::fabs(normal_tail(z) - tail);
            worst = std::max(worst, error);
            if (std::fabs(z) < 2.6) worst_below_2_6 = std::max(worst_below_2_6, error);
            if (std::fabs(z) < 2.0) worst_below_2 = std::max(worst_below_2, error);
            increasing = increasing && z > previous;
            previous = z;
        }
    }
    CHECK(worst < 2.3e-7);
    CHECK(worst_below_2_6 < 1e-9);
    CHECK(worst_below_2 < 1e-11);
    CHECK(increasing);
    // Never infinite: the extreme words give |z| = Q(2^-33) = 6.3380 (not 0 or 1 in u).
    CHECK_THAT(standard_normal_from_bits(0u), Catch::Matchers::WithinRel(-6.3379577545537886, 1e-15));
    CHECK_THAT(standard_normal_from_bits(0xffffffffu), Catch::Matchers::WithinRel(6.3379577545537886, 1e-15));
    // Increasing across the whole range (every 997th word) and continuous where the table
    // hands over to the exact path: the step at the switch is no bigger than the cubic's
    // own error (2.3e-7 in u is at most 2.3e-7 / phi(3.3) = 1.3e-4 in z).
    previous = -1e300;
    for (std::uint64_t w = 0; w < (std::uint64_t{1} << 32); w += 997) {
        const double z = standard_normal_from_bits(static_cast<std::uint32_t>(w));
        increasing = increasing && z >= previous;
        previous = z;
    }
    CHECK(increasing);
    for (std::uint32_t boundary : {2u << 20, 4094u << 20}) {
        const double before = standard_normal_from_bits(boundary - 1), after = standard_normal_from_bits(boundary);
        CHECK(after > before);
        CHECK(after - before < 1.3e-4);
    }
}

TEST_CASE("fast normals have the moments of N(0, 1) over 1e7 seeded samples", "[sim][noise]") {
    // n = 1e7 normals (seed 0x5eed202406010001, step 12345, bodies 0 .. 2.5e6 - 1, stream
    // translation). Large-n standard errors of the sample statistics of a normal sample:
    // mean 1/sqrt(n) = 3.2e-4, variance sqrt(2/n) = 4.5e-4, skewness sqrt(6/n) = 7.7e-4,
    // excess kurtosis sqrt(24/n) = 1.5e-3 (e.g. D'Agostino, Belanger & D'Agostino (1990),
    // Am. Stat. 44, 316). Tolerances are 5 standard errors each.
    const FastNormalSample& s = fast_normal_sample();
    const double n = FastNormalSample::n;
    const double mean = static_cast<double>(s.sum[1] / n);
    const double m2 = static_cast<double>(s.sum[2] / n) - mean * mean;
    const double m3 = static_cast<double>(s.sum[3] / n) - 3 * mean * static_cast<double>(s.sum[2] / n) +
                      2 * mean * mean * mean;
    const double m4 = static_cast<double>(s.sum[4] / n) - 4 * mean * static_cast<double>(s.sum[3] / n) +
                      6 * mean * mean * static_cast<double>(s.sum[2] / n) - 3 * mean * mean * mean * mean;
    CHECK(std::fabs(mean) < 5 * std::sqrt(1 / n));
    CHECK(std::fabs(m2 - 1) < 5 * std::sqrt(2 / n));
    CHECK(std::fabs(m3 / std::pow(m2, 1.5)) < 5 * std::sqrt(6 / n));
    CHECK(std::fabs(m4 / (m2 * m2) - 3) < 5 * std::sqrt(24 / n));
}

TEST_CASE("fast normals fall beyond 3 and 4 standard deviations as often as N(0, 1)", "[sim][noise]") {
    // Counts over the same 1e7 samples on each side, against n P with binomial standard
    // error sqrt(n P (1 - P)); tolerance 5 of them. P(Z > 3) = 1.3499e-3 (13499 expected,
    // s.e. 116); P(Z > 4) = 3.167e-5 (317 expected, s.e. 18); beyond 3.297 every value comes
    // from the exact path, so the +-4 counts test that path.
    const FastNormalSample& s = fast_normal_sample();
    const double n = FastNormalSample::n;
    for (int k : {1, 2, 3, 4}) {
        const double p = normal_tail(k);
        const double expected = n * p, tolerance = 5 * std::sqrt(n * p * (1 - p));
        INFO("beyond " << k << ": expected " << expected << " +- " << tolerance << ", above " << s.above[k]
                       << ", below " << s.below[k]);
        CHECK(std::fabs(static_cast<double>(s.above[k]) - expected) < tolerance);
        CHECK(std::fabs(static_cast<double>(s.below[k]) - expected) < tolerance);
    }
}

TEST_CASE("the four normals of a block, of neighbouring bodies and of consecutive steps are uncorrelated",
          "[sim][noise]") {
    // Pearson correlations over m = 2.5e6 (or m - 1) pairs; for independent variables the
    // sample correlation has standard error 1/sqrt(m) = 6.3e-4, also for the squares
    // (a check beyond linear dependence). Tolerance 5 standard errors = 3.2e-3.
    const FastNormalSample& s = fast_normal_sample();
    const double m = FastNormalSample::blocks;
    const double tolerance = 5 / std::sqrt(m);
    double mean[4], sd[4];
    for (int i = 0; i < 4; ++i) {
        mean[i] = static_cast<double>(s.output_sum[i] / m);
        sd[i] = std::sqrt(static_cast<double>(s.output_sum_sq[i] / m) - mean[i] * mean[i]);
    }
    for (int i = 0; i < 4; ++i) {
        for (int j = i + 1; j < 4; ++j) {
            const double r = (static_cast<double>(s.within[i][j] / m) - mean[i] * mean[j]) / (sd[i] * sd[j]);
            // Squares: their sample means, and the variance 2 of the square of an N(0, 1).
            const double r_sq = (static_cast<double>(s.within_sq[i][j] / m) -
                                 static_cast<double>(s.output_sum_sq[i] / m * (s.output_sum_sq[j] / m))) /
                                2.0;
            INFO("outputs " << i << ", " << j << ": r = " << r << ", r of squares = " << r_sq);
            CHECK(std::fabs(r) < tolerance);
            CHECK(std::fabs(r_sq) < tolerance);
        }
        const double r_body = (static_cast<double>(s.next_body[i] / (m - 1)) - mean[i] * mean[i]) / (sd[i] * sd[i]);
        const double r_step = static_cast<double>(s.next_step[i] / m);  // both factors ~N(0, 1)
        INFO("output " << i << ": r(body, body + 1) = " << r_body << ", r(step, step + 1) = " << r_step);
        CHECK(std::fabs(r_body) < tolerance);
        CHECK(std::fabs(r_step) < tolerance);
    }
}

TEST_CASE("fast and Box-Muller normals pass a Kolmogorov-Smirnov test against Phi", "[sim][noise]") {
    // n = 1e6 normals (250000 blocks, seed as above, step 777). Kolmogorov (1933), Giorn. Ist.
    // Ital. Attuari 4, 83: P(sqrt(n) D > 1.95) = 2 sum_k (-1)^(k-1) exp(-2 k^2 1.95^2) = 0.0010,
    // so alpha = 0.001; the finite-n correction (Stephens (1970), J. R. Statist. Soc. B 32,
    // 115: sqrt(n) + 0.12 + 0.11/sqrt(n)) is 1e-4 relative here and ignored.
    auto ks_statistic = [](std::vector<double> x) {
        std::sort(x.begin(), x.end());
        const double n = static_cast<double>(x.size());
        double d = 0;
        for (std::size_t i = 0; i < x.size(); ++i) {
            const double f = normal_cdf(x[i]);
            d = std::max({d, static_cast<double>(i + 1) / n - f, f - static_cast<double>(i) / n});
        }
        return d * std::sqrt(n);
    };
    std::vector<double> fast, box_muller;
    fast.reserve(1'000'000);
    box_muller.reserve(1'000'000);
    for (std::uint32_t body = 0; body < 250'000; ++body) {
        for (double v : standard_normals(test_seed, 777, body, NoiseStream::translation)) fast.push_back(v);
        for (double v : box_muller_normals(test_seed, 777, body, NoiseStream::translation)) box_muller.push_back(v);
    }
    const double fast_ks = ks_statistic(fast), box_muller_ks = ks_statistic(box_muller);
    INFO("sqrt(n) D: fast " << fast_ks << ", Box-Muller " << box_muller_ks);
    CHECK(fast_ks < 1.95);
    CHECK(box_muller_ks < 1.95);
}

TEST_CASE("Box-Muller normals have the mean and variance of N(0, 1)", "[sim][noise]") {
    // n = 4e6 (1e6 blocks, seed as above, step 99); standard errors 1/sqrt(n) = 5e-4 for the
    // mean and sqrt(2/n) = 7.1e-4 for the variance; tolerance 5 of them.
    long double sum = 0, sum_sq = 0;
    for (std::uint32_t body = 0; body < 1'000'000; ++body)
        for (double v : box_muller_normals(test_seed, 99, body, NoiseStream::translation)) {
            sum += v;
            sum_sq += static_cast<long double>(v) * v;
        }
    const double n = 4e6;
    const double mean = static_cast<double>(sum / n), variance = static_cast<double>(sum_sq / n) - mean * mean;
    CHECK(std::fabs(mean) < 5 / std::sqrt(n));
    CHECK(std::fabs(variance - 1) < 5 * std::sqrt(2 / n));
}
