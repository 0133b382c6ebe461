#include "uncertainty/sample_draw.hpp"

#include <algorithm>
#include <array>
#include <catch2/catch.hpp>
#include <cmath>
#include <cstdint>
#include <numeric>
#include <thread>
#include <vector>

#include "uncertainty/ranks.hpp"

using namespace brownfloc::uncertainty;

TEST_CASE("Philox4x32-10 reproduces the Random123 known-answer vectors", "[uncertainty][draw]") {
    // Random123 1.14, tests/kat_vectors, philox4x32 10 rounds (Salmon et al. 2011): counter 0,
    // key 0 -> 6627e8d5 e169c58d bc57ac4c 9b00dbd8 (also in /work/shared/TOOLCHAIN.md); the
    // all-ones and pi-digit vectors from the same file [memory].
    CHECK(philox4x32_10({0, 0, 0, 0}, {0, 0}) ==
          std::array<std::uint32_t, 4>{0x6627e8d5u, 0xe169c58du, 0xbc57ac4cu, 0x9b00dbd8u});
    CHECK(philox4x32_10({0xffffffffu, 0xffffffffu, 0xffffffffu, 0xffffffffu}, {0xffffffffu, 0xffffffffu}) ==
          std::array<std::uint32_t, 4>{0x408f276du, 0x41c83b0eu, 0xa20bc7c6u, 0x6d5451fdu});
    CHECK(philox4x32_10({0x243f6a88u, 0x85a308d3u, 0x13198a2eu, 0x03707344u}, {0xa4093822u, 0x299f31d0u}) ==
          std::array<std::uint32_t, 4>{0xd16cfe09u, 0x94fdccebu, 0x5001e420u, 0x24126ea1u});
}

TEST_CASE("uniform draws use the documented counter and key layout", "[uncertainty][draw]") {
    const std::uint64_t seed = 0x0123456789abcdefu, sample = 0xfedcba9876543210u;
    const std::uint32_t input = 7;
    const auto block = philox4x32_10({0x76543210u, 0xfedcba98u, 7u, 0u}, {0x89abcdefu, 0x01234567u});
    CHECK(uniform_draw(seed, sample, input) == uniform_from_bits(block[0], block[1]));
    // Top 53 bits of (high, low): k = 1 when only bit 11 of low is set.
    CHECK(uniform_from_bits(0u, 0x800u) == 0x1p-53);
    CHECK(uniform_from_bits(0x80000000u, 0u) == 0.5);
}

TEST_CASE("uniform draws lie strictly inside 0 to 1", "[uncertainty][draw]") {
    // k = 0 is taken as 1/2 and k = 2^53 - 1 gives 1 - 2^-53: both ends excluded.
    CHECK(uniform_from_bits(0u, 0u) == 0x1p-54);
    CHECK(uniform_from_bits(0u, 0x7ffu) == 0x1p-54);
    CHECK(uniform_from_bits(0xffffffffu, 0xffffffffu) == 1.0 - 0x1p-53);
    for (std::uint64_t i = 0; i < 10000; ++i) {
        const double u = uniform_draw(42, i, 3);
        REQUIRE(u > 0.0);
        REQUIRE(u < 1.0);
    }
}

TEST_CASE("draws are a pure function of seed sample and input at any order and thread count", "[uncertainty][draw]") {
    const Distribution radius = Distribution::log_normal(50.0, 1.2);
    constexpr std::uint64_t seed = 20240611, samples = 2000;
    constexpr std::uint32_t inputs = 5;
    std::vector<double> forward(samples * inputs);
    for (std::uint64_t i = 0; i < samples; ++i)
        for (std::uint32_t j = 0; j < inputs; ++j) forward[i * inputs + j] = draw(radius, seed, i, j);

    std::vector<double> backward(samples * inputs);
    for (std::uint64_t i = samples; i-- > 0;)
        for (std::uint32_t j = inputs; j-- > 0;) backward[i * inputs + j] = draw(radius, seed, i, j);
    CHECK(backward == forward);

    std::vector<double> threaded(samples * inputs);
    std::vector<std::thread> threads;
    for (std::uint64_t t = 0; t < 3; ++t)
        threads.emplace_back([&, t] {
            for (std::uint64_t i = t; i < samples; i += 3)
                for (std::uint32_t j = 0; j < inputs; ++j) threaded[i * inputs + j] = draw(radius, seed, i, j);
        });
    for (std::thread& thread : threads) thread.join();
    CHECK(threaded == forward);

    CHECK(draw(radius, seed + 1, 0, 0) != draw(radius, seed, 0, 0));
    CHECK(draw(radius, seed, 0, 1) != draw(radius, seed, 0, 0));
    CHECK(draw(radius, seed, 1, 0) != draw(radius, seed, 0, 0));
    CHECK(draw(radius, seed, std::uint64_t{1} << 32, 0) != draw(radius, seed, 0, 0));
}

TEST_CASE("draws of different inputs are uncorrelated", "[uncertainty][draw]") {
    // For independent inputs the sample Spearman rho has standard error 1 / sqrt(n - 1)
    // (common practice); 4 standard errors with n = 1e4 is 0.04. Seed 7.
    constexpr std::uint64_t n = 10000;
    std::vector<double> a(n), b(n), c(n);
    for (std::uint64_t i = 0; i < n; ++i) {
        a[i] = uniform_draw(7, i, 0);
        b[i] = uniform_draw(7, i, 1);
        c[i] = uniform_draw(8, i, 0);
    }
    CHECK(std::fabs(spearman_rho(a, b)) < 0.04);
    CHECK(std::fabs(spearman_rho(a, c)) < 0.04);
}

TEST_CASE("the mean and sd of 1e5 draws lie within 4 standard errors", "[uncertainty][draw]") {
    // Standard errors (common practice, delta method): of the mean sd / sqrt(n); of the sd
    // sd sqrt((kurtosis - 1) / (4 n)), with kurtosis 3 (normal), 1.8 (uniform) and, for the
    // log-normal, e^(4s2) + 2 e^(3s2) + 3 e^(2s2) - 3 with s2 = ln(factor)^2 (standard moments).
    constexpr std::uint64_t n = 100000, seed = 99;
    const double s2 = std::log(1.5) * std::log(1.5);
    const struct {
        Distribution distribution;
        double kurtosis;
    } cases[] = {{Distribution::normal(10.0, 2.0), 3.0},
                 {Distribution::uniform(-1.0, 3.0), 1.8},
                 {Distribution::log_normal(100.0, 1.5),
                  std::exp(4 * s2) + 2 * std::exp(3 * s2) + 3 * std::exp(2 * s2) - 3}};
    std::uint32_t input = 0;
    for (const auto& c : cases) {
        CAPTURE(c.distribution.text());
        double sum = 0.0;
        std::vector<double> x(n);
        for (std::uint64_t i = 0; i < n; ++i) sum += x[i] = draw(c.distribution, seed, i, input);
        const double mean = sum / static_cast<double>(n);
        double squares = 0.0;
        for (double v : x) squares += (v - mean) * (v - mean);
        const double sd = std::sqrt(squares / static_cast<double>(n - 1));
        const double true_sd = c.distribution.standard_deviation();
        CHECK(std::fabs(mean - c.distribution.mean()) < 4.0 * true_sd / std::sqrt(static_cast<double>(n)));
        CHECK(std::fabs(sd - true_sd) < 4.0 * true_sd * std::sqrt((c.kurtosis - 1.0) / (4.0 * static_cast<double>(n))));
        ++input;
    }
}

TEST_CASE("a point value is drawn as itself", "[uncertainty][draw]") {
    for (std::uint64_t i = 0; i < 100; ++i) CHECK(draw(Distribution::normal(298.15, 0.0), 1, i, 0) == 298.15);
}
