// z-average diameter of the constant-kernel distribution and the time to a z-average growth
// (shelf_criteria/z_average.hpp, criterion_time.hpp).
#include <catch2/catch.hpp>
#include <cmath>
#include <numbers>
#include <vector>

#include "error_message.hpp"
#include "shelf_criteria/cluster_optics.hpp"
#include "shelf_criteria/criterion_time.hpp"
#include "shelf_criteria/z_average.hpp"

using namespace brownfloc::shelf;
using Catch::Matchers::Contains;
using Catch::Matchers::WithinAbs;
using Catch::Matchers::WithinRel;
using test::message_of;

namespace {

constexpr double primary_radius_m = 100e-9;

ScatteringSetup rayleigh() { return {}; }

ScatteringSetup rgd(double angle_deg) {
    ScatteringSetup setup;
    setup.optics = Optics::rgd;
    setup.scattering_angle_deg = angle_deg;
    return setup;
}

// D_z/D_1 straight from its definition (issue 6): Σ n_k I_k / Σ (n_k I_k / D_k), with
// n_k/N0 = x^(k-1)/(1+x)^(k+1) = p^(k-1)/(1+x)² with p = x/(1+x) (Smoluchowski 1917; the
// second form does not overflow), summed to k = 4000 (p^4000 < 1e-300 for the x used here).
double z_average_by_definition(const ScatteringSetup& setup, double d_f, double x, double radius_m) {
    const double qa = setup.optics == Optics::rgd ? scattering_vector_per_m(setup) * radius_m : 0.0;
    double scattered = 0.0, over_diameter = 0.0;
    for (int k = 1; k <= 4000; ++k) {
        const double n_k = std::pow(x / (1.0 + x), k - 1) / ((1.0 + x) * (1.0 + x));
        const double intensity = cluster_intensity_over_primary(k, setup.optics, qa, d_f);
        scattered += n_k * intensity;
        over_diameter += n_k * intensity / cluster_hydrodynamic_radius_over_a(k, d_f);
    }
    return scattered / over_diameter;
}

}  // namespace

TEST_CASE("the z-average of a fresh dispersion is the primary diameter", "[shelf][z-average]") {
    CHECK(z_average_diameter_ratio(rayleigh(), 2.1, 0.0, primary_radius_m) == 1.0);
    CHECK(z_average_diameter_ratio(rgd(173.0), 2.1, 0.0, primary_radius_m) == 1.0);
}

TEST_CASE("the z-average matches its definition summed term by term", "[shelf][z-average]") {
    // Issue 6's definition with Smoluchowski 1917's n_k; the library sums with truncation and
    // compensated sums. Tolerance: rounding of ~1000 terms in the plain sum here.
    for (const ScatteringSetup& setup : {rayleigh(), rgd(90.0), rgd(173.0)})
        for (const double d_f : {1.78, 2.1, 3.0})
            for (const double x : {0.01, 0.3, 1.0, 5.0})
                CHECK_THAT(z_average_diameter_ratio(setup, d_f, x, primary_radius_m),
                           WithinRel(z_average_by_definition(setup, d_f, x, primary_radius_m), 1e-12));
}

namespace {

void check_increasing(const ScatteringSetup& setup, double d_f, double radius_m, const std::vector<double>& grid) {
    double previous = 0.0;
    for (std::size_t i = 0; i < grid.size(); ++i) {
        const double ratio = z_average_diameter_ratio(setup, d_f, grid[i], radius_m);
        if (i > 0) CHECK(ratio > previous);
        previous = ratio;
    }
}

}  // namespace

TEST_CASE("the z-average diameter grows monotonically with time", "[shelf][z-average]") {
    // Derived in DEVELOPERS.md: the weights I_k p^(k-1) shift to larger k as t grows and
    // D_k rises with k, so D_z(t)/D_z(0) increases. Checked on a geometric grid of t/τ from
    // 1e-8 to 100 for both optics, a small and a large primary radius and d_f 1 to 3; and
    // on to the largest t/τ allowed for d_f = 2.1 (each point there sums ~5e5 sizes).
    std::vector<double> early{0.0};
    for (double x = 1e-8; x <= 100.0; x *= 1.5) early.push_back(x);
    std::vector<double> late;
    for (double x = 100.0; x < max_z_average_t_over_tau; x *= 2.0) late.push_back(x);
    late.push_back(max_z_average_t_over_tau);
    for (const ScatteringSetup& setup : {rayleigh(), rgd(90.0), rgd(173.0)})
        for (const double radius_m : {20e-9, 500e-9}) {
            for (const double d_f : {1.0, 2.1, 3.0}) check_increasing(setup, d_f, radius_m, early);
            check_increasing(setup, 2.1, radius_m, late);
        }
}

TEST_CASE("the initial slope of the z-average growth is I2 over I1 times 1 minus a over R_h2", "[shelf][z-average]") {
    // Derived in DEVELOPERS.md: d(D_z/D_1)/d(t/τ) at 0 = (I_2/I_1)(1 - a/R_h,2). Rayleigh:
    // 4·(1 - 3/4) = 1; rgd: I_2/I_1 = 4 S_2 = 2(1 + sinc 2qa) (Debye sum), so (1 + sinc 2qa)/2.
    // Finite difference: one-sided second order, (4 f(h) - f(2h))/(2h) with f(0) = 0 and
    // h = 1e-5; truncation O(h²) ~ 1e-10, rounding ~1e-16/h ~ 1e-11, so 1e-6 is ample.
    const double h = 1e-5;
    for (const ScatteringSetup& setup : {rayleigh(), rgd(30.0), rgd(90.0), rgd(173.0)})
        for (const double d_f : {1.78, 2.1}) {
            double expected = 1.0;
            if (setup.optics == Optics::rgd) {
                const double two_qa = 2.0 * scattering_vector_per_m(setup) * primary_radius_m;
                expected = (1.0 + std::sin(two_qa) / two_qa) / 2.0;
            }
            const double f_h = z_average_growth(setup, d_f, h, primary_radius_m);
            const double f_2h = z_average_growth(setup, d_f, 2.0 * h, primary_radius_m);
            CHECK_THAT((4.0 * f_h - f_2h) / (2.0 * h), WithinRel(expected, 1e-6));
            CHECK_THAT(z_average_initial_slope(setup, d_f, primary_radius_m), WithinRel(expected, 1e-14));
        }
}

TEST_CASE("rgd optics tend to the rayleigh result as q goes to zero", "[shelf][z-average]") {
    // All S_k -> 1 as q -> 0 (Debye sums; Fisher & Burford 1967). At 1e-4 degrees q a ≈ 2e-8
    // and S_k - 1 ≈ (q R_g)²/3 < 1e-13 for the sizes that matter, so 1e-9 is ample.
    for (const double d_f : {1.78, 2.1, 3.0})
        for (const double x : {1e-6, 0.01, 0.1, 1.0, 10.0, 100.0})
            CHECK_THAT(z_average_diameter_ratio(rgd(1e-4), d_f, x, primary_radius_m),
                       WithinRel(z_average_diameter_ratio(rayleigh(), d_f, x, primary_radius_m), 1e-9));
}

TEST_CASE("the time to a z-average growth reads back the growth", "[shelf][z-average][round-trip]") {
    // Root search to a relative 1e-10 in t; growth rises at most ~linearly in t near the root,
    // so criterion_at(t) is within 1e-9 of the target. Derived in DEVELOPERS.md.
    for (const ScatteringSetup& setup : {rayleigh(), rgd(90.0), rgd(173.0)})
        for (const double g : {1e-12, 1e-6, 0.01, 0.1, 0.5, 1.0, 3.0, 20.0}) {
            CriterionSpec spec;
            spec.criterion = Criterion::z_average_growth;
            spec.value = g;
            spec.scattering = setup;
            const double tau_s = 3.0e7;
            const double t_s = time_to_criterion_s(spec, tau_s, primary_radius_m);
            CHECK(t_s > 0.0);
            CHECK_THAT(criterion_at(spec, t_s / tau_s, primary_radius_m), WithinRel(g, 1e-9));
        }
}

TEST_CASE("the time to a z-average growth is bracketed to 1e-10 relative in t", "[shelf][z-average]") {
    // Issue 6 asks for the root to a relative 1e-10 in t. Since the growth rises with t
    // (derived in DEVELOPERS.md), the target lies between the growths at t(1 - 2e-10) and
    // t(1 + 2e-10); the factor 2 leaves room for the stopping rule's few ulps.
    for (const ScatteringSetup& setup : {rayleigh(), rgd(173.0)})
        for (const double g : {1e-6, 0.1, 1.0, 20.0}) {
            const double x = t_over_tau_for_z_average_growth(setup, 2.1, g, primary_radius_m);
            CHECK(z_average_growth(setup, 2.1, x * (1.0 - 2e-10), primary_radius_m) < g);
            CHECK(z_average_growth(setup, 2.1, x * (1.0 + 2e-10), primary_radius_m) > g);
        }
}

TEST_CASE("a small z-average growth is reached at growth over the initial slope", "[shelf][z-average]") {
    // Derived in DEVELOPERS.md: g ≈ slope · t/τ for small t; the next order is O(g²).
    CriterionSpec spec;
    spec.criterion = Criterion::z_average_growth;
    spec.value = 1e-9;
    CHECK_THAT(criterion_t_over_tau(spec, primary_radius_m), WithinRel(1e-9, 1e-7));
}

TEST_CASE("z-average growth beyond the evaluated range is refused with the growth reached", "[shelf][z-average][errors]") {
    CriterionSpec spec;
    spec.criterion = Criterion::z_average_growth;
    spec.value = 1e6;
    CHECK_THAT(message_of([&] { (void)criterion_t_over_tau(spec, primary_radius_m); }),
               Contains("z-average-growth = 1e+06 is not reached by t/tau = 10000") && Contains("the growth there is"));
    CHECK_THAT(message_of([&] { (void)criterion_at(spec, 2e4, primary_radius_m); }),
               Contains("t/tau = 20000") && Contains("[0, 10000]"));
    // A wavelength so short that q a overflows is refused, not turned into NaN.
    spec.value = 0.1;
    spec.scattering = rgd(90.0);
    spec.scattering.wavelength_nm = 1e-310;
    CHECK_THAT(message_of([&] { (void)criterion_t_over_tau(spec, primary_radius_m); }),
               Contains("q a = inf") && Contains("wavelength_nm"));
}

TEST_CASE("the z-average stays finite for large clusters at large angles", "[shelf][z-average]") {
    // 1 µm spheres at 173°: q a ≈ 26; structure factors of big clusters fall towards zero.
    for (const double x : {0.0, 1e-3, 1.0, 100.0, max_z_average_t_over_tau}) {
        const double ratio = z_average_diameter_ratio(rgd(173.0), 2.1, x, 1e-6);
        CHECK(std::isfinite(ratio));
        CHECK(ratio >= 1.0);
    }
}
