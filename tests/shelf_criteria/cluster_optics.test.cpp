// Per-size optics and hydrodynamic radii (shelf_criteria/cluster_optics.hpp) and the
// scattering vector (shelf_criteria/scattering_setup.hpp).
#include <catch2/catch.hpp>
#include <cmath>
#include <numbers>

#include "error_message.hpp"
#include "shelf_criteria/cluster_optics.hpp"

using namespace brownfloc::shelf;
using Catch::Matchers::Contains;
using Catch::Matchers::WithinAbs;
using Catch::Matchers::WithinRel;
using test::message_of;

TEST_CASE("the sphere form factor has its small-angle expansion and its first zero", "[shelf][optics]") {
    // Bohren & Huffman 1983 (sphere form factor): P(x) = [3(sin x - x cos x)/x³]²,
    // P = 1 - x²/5 + 3x⁴/175 + O(x⁶) (the square of 1 - x²/10 + x⁴/280).
    CHECK(sphere_form_factor(0.0) == 1.0);
    for (const double x : {1e-8, 1e-4, 1e-2, 0.05, 0.0999, 0.1001}) {
        const double x2 = x * x;
        // Tolerance: the omitted x⁶ term, 8.5e-4 x⁶ <= 8.6e-10 at x = 0.1001.
        CHECK_THAT(sphere_form_factor(x), WithinAbs(1.0 - x2 / 5.0 + 3.0 * x2 * x2 / 175.0, 1e-9));
    }
    // At x = π: sin π = 0, cos π = -1, so P = (3/π²)². Tolerance: rounding.
    CHECK_THAT(sphere_form_factor(std::numbers::pi), WithinRel(9.0 / std::pow(std::numbers::pi, 4), 1e-12));
    // First zero where tan x = x, x = 4.493409457909064 (Bohren & Huffman 1983, from memory;
    // the root of tan x = x to 16 digits). P ∝ (x - x0)² there, so 1e-20 is rounding.
    CHECK_THAT(sphere_form_factor(4.493409457909064), WithinAbs(0.0, 1e-20));
    // The series and the closed form meet at x = 1. Tolerance: a few ulps of each.
    CHECK_THAT(sphere_form_factor(std::nextafter(1.0, 0.0)), WithinRel(sphere_form_factor(1.0), 1e-14));
}

TEST_CASE("Kirkwood radii of the doublet and the triplets", "[shelf][hydrodynamics]") {
    // Kirkwood 1954 (PHYSICS.md): 1/R_h = 1/(N a) + (1/N²) Σ_{i≠j} 1/r_ij.
    // Doublet (r = 2a): 1/(2a) + (2/4)/(2a) = 3/(4a) -> R_h = 4a/3.
    // Linear triplet (2a 2a 4a): 1/(3a) + (2/9)(5/(4a)) = 11/(18a); triangle (2a 2a 2a):
    // 1/(3a) + (2/9)(3/(2a)) = 2/(3a). Mean of 18/11 and 3/2: 69/44. Tolerance: rounding.
    CHECK(cluster_hydrodynamic_radius_over_a(1, 2.1) == 1.0);
    CHECK_THAT(cluster_hydrodynamic_radius_over_a(2, 2.1), WithinRel(4.0 / 3.0, 1e-15));
    CHECK_THAT(cluster_hydrodynamic_radius_over_a(3, 2.1), WithinRel(69.0 / 44.0, 1e-15));
    // k >= 4: R_h = a k^(1/d_f) (issue 6's model; PHYSICS.md "Clusters").
    CHECK_THAT(cluster_hydrodynamic_radius_over_a(100, 2.0), WithinRel(10.0, 1e-15));
}

TEST_CASE("hydrodynamic radius rises with size for every allowed fractal dimension", "[shelf][hydrodynamics]") {
    // Needed for D_z(t) to rise (derived in DEVELOPERS.md); the tightest step is k = 3 -> 4
    // at d_f = 3: 69/44 = 1.568 < 4^(1/3) = 1.587.
    for (const double d_f : {1.0, 1.78, 2.1, 2.5, 3.0})
        for (int k = 1; k < 2000; ++k)
            CHECK(cluster_hydrodynamic_radius_over_a(k + 1, d_f) > cluster_hydrodynamic_radius_over_a(k, d_f));
}

TEST_CASE("structure factors are the Debye sums for the rigid clusters", "[shelf][optics]") {
    // Debye sum S = (1/k²) Σ_ij sin(q r_ij)/(q r_ij): doublet (1 + sinc 2qa)/2; the mean of
    // the linear and triangular triplets (3 + 5 sinc 2qa + sinc 4qa)/9. Tolerance: rounding.
    const auto sinc = [](double x) { return std::sin(x) / x; };
    for (const double qa : {0.3, 1.0, 2.5, 7.0}) {
        CHECK_THAT(cluster_structure_factor(2, qa, 2.1), WithinRel((1.0 + sinc(2.0 * qa)) / 2.0, 1e-14));
        CHECK_THAT(cluster_structure_factor(3, qa, 2.1),
                   WithinRel((3.0 + 5.0 * sinc(2.0 * qa) + sinc(4.0 * qa)) / 9.0, 1e-14));
        CHECK(cluster_structure_factor(1, qa, 2.1) == 1.0);
    }
}

TEST_CASE("structure factors tend to one at zero angle and obey the Guinier limit", "[shelf][optics]") {
    // Every S_k -> 1 as q -> 0; at small q R_g the Fisher–Burford form (Fisher & Burford
    // 1967) is 1 - q²R_g²/3 (Guinier), with R_g = a k^(1/d_f). Tolerance: the next term,
    // O((q R_g)⁴) < 1e-12 at q R_g <= 1e-3.
    for (int k = 1; k <= 50; ++k) CHECK(cluster_structure_factor(k, 0.0, 2.1) == 1.0);
    const double qa = 1e-4;
    for (const int k : {4, 10, 100}) {
        const double rg = std::pow(k, 1.0 / 2.1);
        CHECK_THAT(cluster_structure_factor(k, qa, 2.1), WithinAbs(1.0 - qa * qa * rg * rg / 3.0, 1e-12));
    }
    // Large q: S ≈ [2 q² R_g²/(3 d_f)]^(-d_f/2), falling as 1/k at fixed q (a mass fractal).
    const double s_1000 = cluster_structure_factor(1000, 50.0, 2.1);
    const double s_2000 = cluster_structure_factor(2000, 50.0, 2.1);
    CHECK_THAT(s_2000 / s_1000, WithinRel(0.5, 1e-3));  // from the form itself; O(1/(qR_g)²) off
}

TEST_CASE("cluster intensity is k squared for rayleigh and k squared S_k for rgd", "[shelf][optics]") {
    // Issue 6: rayleigh I_k ∝ k² (mass squared); rgd I_k ∝ k² P_sphere S_k, P cancelling.
    for (int k = 1; k <= 10; ++k) {
        CHECK(cluster_intensity_over_primary(k, Optics::rayleigh, 3.0, 2.1) == k * k);
        CHECK_THAT(cluster_intensity_over_primary(k, Optics::rgd, 3.0, 2.1),
                   WithinRel(k * k * cluster_structure_factor(k, 3.0, 2.1), 1e-15));
    }
}

TEST_CASE("scattering vector is 4 pi n sin half the angle over the wavelength", "[shelf][optics]") {
    // Common practice (definition of q). 90°, 633 nm, n = 1.33: q = 4π·1.33·sin 45°/633e-9.
    ScatteringSetup setup;
    setup.optics = Optics::rgd;
    CHECK_THAT(scattering_vector_per_m(setup),
               WithinRel(4.0 * std::numbers::pi * 1.33 * std::sqrt(0.5) / 633e-9, 1e-14));
    setup.scattering_angle_deg = 180.0;
    CHECK_THAT(scattering_vector_per_m(setup), WithinRel(4.0 * std::numbers::pi * 1.33 / 633e-9, 1e-14));
}

TEST_CASE("bad sizes and arguments of the optics functions are refused", "[shelf][optics][errors]") {
    CHECK_THAT(message_of([] { (void)cluster_structure_factor(0, 1.0, 2.1); }), Contains("k = 0") && Contains(">= 1"));
    CHECK_THAT(message_of([] { (void)cluster_hydrodynamic_radius_over_a(-3, 2.1); }), Contains("k = -3"));
    CHECK_THAT(message_of([] { (void)sphere_form_factor(-1.0); }), Contains("q a = -1"));
    CHECK_THAT(message_of([] { (void)cluster_structure_factor(5, 1.0, 0.5); }), Contains("fractal_dimension = 0.5"));
}
