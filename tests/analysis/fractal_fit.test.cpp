#include <catch2/catch.hpp>

#include <cmath>
#include <cstdint>
#include <numbers>
#include <vector>

#include "analysis/cluster_geometry.hpp"
#include "analysis/fractal_fit.hpp"
#include "test_support.hpp"

using namespace brownfloc::analysis;
using Catch::Matchers::Contains;
using Catch::Matchers::WithinAbs;
using Catch::Matchers::WithinRel;

namespace {

// K clusters with sizes log-uniform in [10, 2000] and R_g = a (n/k0)^(1/d_f) exp(sigma xi),
// xi standard normal: the fractal law with log-normal scatter at exact n.
std::vector<ClusterShape> synthetic_clusters(std::size_t count, double dimension, double prefactor, double sigma,
                                             double primary_radius_m, std::uint64_t seed) {
    brownfloc::test::TestRandom random{seed};
    std::vector<ClusterShape> clusters;
    for (std::size_t i = 0; i < count; ++i) {
        const double log_size = std::log(10.0) + random.uniform() * std::log(200.0);
        const std::int64_t size = std::llround(std::exp(log_size));
        const double rg_m = primary_radius_m * std::pow(static_cast<double>(size) / prefactor, 1.0 / dimension) *
                            std::exp(sigma * random.normal());
        clusters.push_back({size, rg_m, false});
    }
    return clusters;
}

}  // namespace

TEST_CASE("the fractal fit recovers d_f and k0 of synthetic clusters with log-normal scatter", "[analysis][fractal][validation]") {
    // Common practice for checking a fit: data drawn from the model. d_f = 1.8, k0 = 1.3,
    // sigma = 0.1 in ln R_g, K = 300 clusters, data seeds 1-3.
    // Expected errors (least squares on ln n, slope beta = 1/d_f): se(beta) = sigma /
    // (sqrt(K) sd(ln n)), sd(ln n) = ln(200)/sqrt(12) = 1.53 for log-uniform sizes, so
    // se(beta) = 0.0038 and se(d_f) = d_f^2 se(beta) = 0.012. For k0, ln k0 = ln n_bar - d_f
    // (y_bar - ln a) at the centroid: sqrt((d_f sigma/sqrt(K))^2 + (2.6 se(d_f))^2) = 0.034.
    // Tolerances: 4 standard errors (0.05 on d_f, 0.14 on ln k0). The bootstrap error must
    // agree with se(d_f) within a factor 2 (400 resamples estimate an sd to ~4 %; the binned
    // unweighted fit is somewhat less efficient than plain least squares).
    const double a = 100e-9;
    for (std::uint64_t seed = 1; seed <= 3; ++seed) {
        INFO("data seed " << seed);
        const FractalFit fit = fit_fractal_dimension(synthetic_clusters(300, 1.8, 1.3, 0.1, a, seed), a, 99);
        REQUIRE(fit.dimension.has_value());
        CHECK_THAT(*fit.dimension, WithinAbs(1.8, 0.05));
        CHECK_THAT(std::log(*fit.prefactor), WithinAbs(std::log(1.3), 0.14));
        REQUIRE(fit.dimension_error.has_value());
        CHECK(*fit.dimension_error > 0.006);
        CHECK(*fit.dimension_error < 0.024);
        CHECK(fit.clusters_used == 300);
        CHECK_THAT(fit.note, Contains("R_g from sphere centres") && Contains("300 clusters"));
    }
}

TEST_CASE("the fractal fit is a pure function of its inputs and seed", "[analysis][fractal]") {
    // d_f and k0 do not use the seed at all; the bootstrap error does, reproducibly.
    const double a = 100e-9;
    const std::vector<ClusterShape> clusters = synthetic_clusters(100, 2.1, 1.0, 0.15, a, 8);
    const FractalFit first = fit_fractal_dimension(clusters, a, 5), again = fit_fractal_dimension(clusters, a, 5),
                     other = fit_fractal_dimension(clusters, a, 6);
    CHECK(*again.dimension == *first.dimension);
    CHECK(*again.dimension_error == *first.dimension_error);
    CHECK(*other.dimension == *first.dimension);
    CHECK(*other.prefactor == *first.prefactor);
    CHECK(*other.dimension_error != *first.dimension_error);
}

TEST_CASE("straight chains have fractal dimension one and prefactor root three", "[analysis][fractal][validation]") {
    // n centres spaced 2a on a line: R_g^2 = (2a)^2 (n^2 - 1)/12 (discrete uniform variance),
    // so n -> sqrt(3) R_g / a: d_f = 1, k0 = sqrt(3). Sizes 10..400 in steps of 10. Tolerance:
    // the (n^2 - 1) term bends the line by < 1/(2n^2) = 0.5 % at n = 10; allow 1 % on both.
    const double a = 50e-9;
    std::vector<ClusterShape> chains;
    for (std::int64_t n = 10; n <= 400; n += 10)
        chains.push_back({n, radius_of_gyration_m(brownfloc::test::straight_chain(static_cast<std::size_t>(n), 2 * a)), false});
    const FractalFit fit = fit_fractal_dimension(chains, a, 1);
    REQUIRE(fit.dimension.has_value());
    CHECK_THAT(*fit.dimension, WithinRel(1.0, 0.01));
    CHECK_THAT(*fit.prefactor, WithinRel(std::sqrt(3.0), 0.01));
}

TEST_CASE("filled lattice balls have fractal dimension three", "[analysis][fractal][validation]") {
    // Simple-cubic sites (spacing 2a) inside balls of 1.5-6 spacings, centres offset by seed 3:
    // sizes 15-900. A solid ball has R_g^2 = (3/5) rho^2 and n = (pi/6)(rho/a)^3 sites, so
    // d_f = 3 and k0 = (pi/6) / 0.6^(3/2) = 1.127. Tolerance: lattice surface roughness moves
    // the small balls' R_g by several per cent; 0.1 on d_f and 10 % on k0 cover it.
    const double a = 50e-9;
    brownfloc::test::TestRandom random{3};
    std::vector<ClusterShape> balls;
    for (int i = 0; i < 40; ++i) {
        const double radius_m = 2 * a * (1.5 + 4.5 * i / 39.0);
        const Vec3 offset_m{a * random.uniform(), a * random.uniform(), a * random.uniform()};
        const std::vector<Vec3> ball = brownfloc::test::lattice_ball(radius_m, 2 * a, offset_m);
        balls.push_back({static_cast<std::int64_t>(ball.size()), radius_of_gyration_m(ball), false});
    }
    const FractalFit fit = fit_fractal_dimension(balls, a, 1);
    REQUIRE(fit.dimension.has_value());
    CHECK_THAT(*fit.dimension, WithinAbs(3.0, 0.1));
    CHECK_THAT(*fit.prefactor, WithinRel(std::numbers::pi / 6.0 / std::pow(0.6, 1.5), 0.10));
}

TEST_CASE("the fractal fit declines with a note when too few clusters or too narrow a size range", "[analysis][fractal]") {
    const double a = 100e-9;
    // 29 qualifying clusters (plus spanning and small ones, which do not count).
    std::vector<ClusterShape> clusters = synthetic_clusters(29, 1.8, 1.3, 0.1, a, 4);
    clusters.push_back({500, 40 * a, true});
    clusters.push_back({9, 3 * a, false});
    FractalFit fit = fit_fractal_dimension(clusters, a, 1);
    CHECK_FALSE(fit.dimension.has_value());
    CHECK_FALSE(fit.dimension_error.has_value());
    CHECK_FALSE(fit.prefactor.has_value());
    CHECK(fit.clusters_used == 29);
    CHECK_THAT(fit.note, Contains("only 29 clusters qualify") && Contains("1 spanning") && Contains("need at least 30"));

    // 40 clusters of sizes 10-40: a factor 4.
    std::vector<ClusterShape> narrow;
    for (std::int64_t i = 0; i < 40; ++i) {
        const std::int64_t n = 10 + (i * 30) / 39;
        narrow.push_back({n, a * std::pow(static_cast<double>(n), 1 / 1.8), false});
    }
    fit = fit_fractal_dimension(narrow, a, 1);
    CHECK_FALSE(fit.dimension.has_value());
    CHECK(fit.clusters_used == 40);
    CHECK_THAT(fit.note, Contains("10-40") && Contains("factor 4.00"));

    // R_g falling with size: no positive slope.
    std::vector<ClusterShape> shrinking;
    for (std::int64_t n = 10; n < 50 * 10; n += 10) shrinking.push_back({n, a * 1000.0 / static_cast<double>(n), false});
    fit = fit_fractal_dimension(shrinking, a, 1);
    CHECK_FALSE(fit.dimension.has_value());
    CHECK_THAT(fit.note, Contains("not positive"));
}

TEST_CASE("the fractal fit rejects a non-positive primary radius or radius of gyration", "[analysis][fractal][validation]") {
    std::vector<ClusterShape> clusters(40, ClusterShape{20, 1e-6, false});
    CHECK_THROWS_WITH(fit_fractal_dimension(clusters, 0.0, 1), Contains("primary_radius_m = 0"));
    clusters[7].radius_of_gyration_m = -1.0;
    CHECK_THROWS_WITH(fit_fractal_dimension(clusters, 1e-7, 1), Contains("cluster 7 (size 20)"));
}
