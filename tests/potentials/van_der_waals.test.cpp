#include <catch2/catch.hpp>
#include <cmath>

#include "potentials/van_der_waals.hpp"
#include "test_support.hpp"

using namespace brownfloc::potentials;
using brownfloc::test::central_slope;
using Catch::Matchers::WithinRel;

namespace {
constexpr double A = 1e-20;
// The textbook form of Hamaker (1937), written out directly,, for comparison where it does not cancel.
double hamaker_direct(double a1, double a2, double h) {
    const double r = a1 + a2 + h, s2 = (a1 + a2) * (a1 + a2), d2 = (a1 - a2) * (a1 - a2);
    return -A / 6 * (2 * a1 * a2 / (r * r - s2) + 2 * a1 * a2 / (r * r - d2) + std::log((r * r - s2) / (r * r - d2)));
}
}  // namespace

TEST_CASE("the full Hamaker form approaches the Derjaguin limit at small gaps", "[potentials][vdw][validation]") {
    // Hamaker (1937): U -> -A a1 a2 / (6 h (a1 + a2)) as h/a -> 0, with a relative correction
    // of order (h/a) ln(h/a): 1.2e-4 at h/a = 1e-5, so the tolerance is 1e-3.
    for (double a2 : {100e-9, 37e-9}) {
        const double a1 = 100e-9, h = 1e-5 * std::min(a1, a2);
        CHECK_THAT(vdw_hamaker_full(A, a1, a2, h).energy_J, WithinRel(vdw_derjaguin(A, a1, a2, h).energy_J, 1e-3));
    }
}

TEST_CASE("the full Hamaker form is markedly weaker than Derjaguin at barrier gaps", "[potentials][vdw][validation]") {
    // PHYSICS notes (from Hamaker 1937 evaluated directly): for a = 100 nm the full form is
    // 8.5 % weaker at 1 nm and 27 % weaker at 5 nm. Tolerance: the quoted rounding.
    const double a = 100e-9;
    CHECK_THAT(vdw_hamaker_full(A, a, a, 1e-9).energy_J / vdw_derjaguin(A, a, a, 1e-9).energy_J,
               WithinRel(1 - 0.085, 0.002));
    CHECK_THAT(vdw_hamaker_full(A, a, a, 5e-9).energy_J / vdw_derjaguin(A, a, a, 5e-9).energy_J,
               WithinRel(1 - 0.27, 0.01));
}

TEST_CASE("the full Hamaker form decays as -(16/9) A a1^3 a2^3 / r^6 far away", "[potentials][vdw][validation]") {
    // Far-field limit of Hamaker (1937) (London r^-6 between point-like volumes). The next
    // term is O((a/r)^2): at r = 200 a it is < 1e-4 relative.
    const double a1 = 50e-9, a2 = 80e-9, r = 200 * a2, h = r - a1 - a2;
    const double expected = -16.0 / 9.0 * A * std::pow(a1 * a2, 3) / std::pow(r, 6);
    CHECK_THAT(vdw_hamaker_full(A, a1, a2, h).energy_J, WithinRel(expected, 1e-3));
}

TEST_CASE("the cancellation-free Hamaker form equals the textbook expression where that is exact", "[potentials][vdw]") {
    // Same formula, different algebra; at moderate gaps both are exact to ~1e-13.
    for (double h : {0.3e-9, 2e-9, 20e-9, 150e-9})
        CHECK_THAT(vdw_hamaker_full(A, 120e-9, 45e-9, h).energy_J, WithinRel(hamaker_direct(120e-9, 45e-9, h), 1e-10));
}

TEST_CASE("van der Waals slopes agree with finite differences", "[potentials][vdw]") {
    // Central differences with step 1e-5 h: truncation and rounding both < 1e-7 relative.
    for (VdwForm form : {VdwForm::hamaker_full, VdwForm::derjaguin, VdwForm::gregory_retarded})
        for (double h : {0.2e-9, 1e-9, 7e-9, 60e-9, 900e-9, 30e-6}) {
            auto energy = [&](double x) { return van_der_waals(form, A, 150e-9, 60e-9, x).energy_J; };
            INFO("form " << static_cast<int>(form) << ", h = " << h);
            CHECK_THAT(van_der_waals(form, A, 150e-9, 60e-9, h).slope_J_per_m, WithinRel(central_slope(energy, h), 1e-6));
        }
}

TEST_CASE("Gregory's retarded form reduces to Derjaguin at small gaps and is weaker beyond", "[potentials][vdw][validation]") {
    // Gregory (1981) [equation number not checked]: the factor 1 - (bh/lambda) ln(1 + lambda/(bh)) -> 1 as h -> 0.
    // At h = 0.01 nm the factor is 1 - 5.3e-4 * ln(1881) = 0.996: tolerance 0.5 %.
    const double a = 200e-9;
    CHECK_THAT(vdw_gregory_retarded(A, a, a, 1e-11).energy_J, WithinRel(vdw_derjaguin(A, a, a, 1e-11).energy_J, 5e-3));
    for (double h : {1e-9, 10e-9, 50e-9}) {
        const double ratio = vdw_gregory_retarded(A, a, a, h).energy_J / vdw_derjaguin(A, a, a, h).energy_J;
        CHECK(ratio < 1.0);
        CHECK(ratio > 0.0);
    }
}

TEST_CASE("a zero Hamaker constant gives no attraction", "[potentials][vdw]") {
    const EnergySlope zero = vdw_hamaker_full(0.0, 1e-7, 1e-7, 1e-9);
    CHECK(zero.energy_J == 0.0);
    CHECK(zero.slope_J_per_m == 0.0);
}
