#include <catch2/catch.hpp>
#include <cmath>

#include "potentials/extrema.hpp"
#include "potentials/water.hpp"
#include "sim/association_constant.hpp"

using namespace brownfloc;
using Catch::Matchers::Contains;
using Catch::Matchers::WithinAbs;
using Catch::Matchers::WithinRel;

namespace {
constexpr double pi = 3.14159265358979323846;

potentials::PairInteraction latex_pair(double a1_m, double a2_m, double psi1_V, double psi2_V, double nacl_mM) {
    return {{a1_m, a2_m, 1e-20, psi1_V, psi2_V}, potentials::water_at(298.15),
            potentials::Electrolyte::from_salt("NaCl", nacl_mM)};
}
}  // namespace

TEST_CASE("a square well integrates to its closed form", "[sim][kinetics]") {
    // 4 pi int_{r1}^{r2} (e^eps - 1) r^2 dr = (4 pi / 3)(r2^3 - r1^3)(e^eps - 1). Gauss-Kronrod is
    // exact for r^2, so only rounding is allowed.
    const double r1 = 1.0e-6, r2 = 1.02e-6;
    for (double eps : {0.1, 3.0, 12.0}) {
        const double k = sim::integrate_well([eps](double) { return -eps; }, r1, r2);
        CHECK_THAT(k, WithinRel(4.0 * pi / 3.0 * (r2 * r2 * r2 - r1 * r1 * r1) * std::expm1(eps), 1e-13));
    }
}

TEST_CASE("the well integrator resolves a step and a smooth non-polynomial well", "[sim][kinetics]") {
    // A step at rm inside [r1, r2]: the panel holding it is bisected down to ~1e-14 of r, so
    // the error is of that order times the integrand (allowed 1e-10).
    const double r1 = 1.0e-6, rm = 1.013e-6, r2 = 1.05e-6;
    const double step = sim::integrate_well([rm](double r) { return r < rm ? -4.0 : 0.0; }, r1, r2);
    CHECK_THAT(step, WithinRel(4.0 * pi / 3.0 * (rm * rm * rm - r1 * r1 * r1) * std::expm1(4.0), 1e-10));
    // u = -ln(1 + c/r^2) makes (e^-u - 1) r^2 = c: the integral is 4 pi c (r2 - r1) (1e-12 for
    // the adaptive tolerance of 1e-11 on a smooth integrand).
    const double c = 3e-12;
    const double smooth = sim::integrate_well([c](double r) { return -std::log1p(c / (r * r)); }, r1, 3 * r1);
    CHECK_THAT(smooth, WithinRel(4.0 * pi * c * 2 * r1, 1e-12));
}

TEST_CASE("association constants of DLVO secondary minima agree with scipy", "[sim][kinetics][validation]") {
    // Expected K from tests/reference/association_reference.py (scipy.integrate.quad on the
    // same closed-form potential: full Hamaker + linear superposition, NaCl, 25 C, A = 1e-20 J),
    // computed 2026-12-01; that script re-checks scipy against these same lines under ctest
    // (reference.association_constant_against_scipy). Tolerance 1e-8: both quadratures reach
    // ~1e-10 and agreed to 3e-12 when the values were taken.
    struct Case {
        double a1_m, a2_m, psi1_V, psi2_V, nacl_mM, expected_m3, min_kT;
    };
    const Case cases[] = {
        {500e-9, 500e-9, -0.050, -0.050, 100.0,
         1.190625149596e-14,  // scipy-reference
         -13.091699},
        {500e-9, 500e-9, -0.050, -0.050, 10.0,
         4.462882996699e-18,  // scipy-reference
         -2.712243},
        {300e-9, 800e-9, -0.050, -0.040, 20.0,
         9.405484355581e-18,  // scipy-reference
         -3.923230},
    };
    for (const Case& c : cases) {
        const auto pair = latex_pair(c.a1_m, c.a2_m, c.psi1_V, c.psi2_V, c.nacl_mM);
        const potentials::Extrema e = potentials::find_extrema(pair, 0.2e-9, potentials::default_max_gap_m(pair));
        REQUIRE(e.has_barrier());
        REQUIRE(e.has_secondary_minimum);
        const sim::SecondaryMinimumAssociation k = sim::secondary_minimum_association(pair, 0.2e-9);
        REQUIRE(k.constant_m3);
        INFO("K = " << *k.constant_m3 << " m^3, note '" << k.note << "'");
        CHECK(k.note.empty());
        CHECK_THAT(*k.constant_m3, WithinRel(c.expected_m3, 1e-8));
        CHECK(k.well_start_gap_m == e.maximum_gap_m);
        CHECK(k.minimum_gap_m == e.secondary_minimum_gap_m);
        // The depth as scipy's optimiser found it, printed to 1e-6 kT.
        CHECK_THAT(k.minimum_kT, WithinAbs(c.min_kT, 1e-6));
        CHECK(std::fabs(pair.energy_kT(k.well_end_gap_m)) < 1e-12);
    }
}

TEST_CASE("association needs a barrier, a secondary minimum and an integrable van der Waals tail",
          "[sim][kinetics]") {
    const auto attraction = latex_pair(500e-9, 500e-9, 0.0, 0.0, 10.0);
    auto k = sim::secondary_minimum_association(attraction, 0.2e-9);
    CHECK_FALSE(k.constant_m3);
    CHECK_THAT(k.note, Contains("no maximum"));

    const potentials::PairInteraction repulsion({500e-9, 500e-9, 0.0, -0.05, -0.05}, potentials::water_at(298.15),
                                                potentials::Electrolyte::from_salt("NaCl", 10));
    k = sim::secondary_minimum_association(repulsion, 0.2e-9);
    CHECK_FALSE(k.constant_m3);
    CHECK_THAT(k.note, Contains("no secondary minimum"));

    potentials::PairModel derjaguin{500e-9, 500e-9, 1e-20, -0.05, -0.05};
    derjaguin.vdw = potentials::VdwForm::derjaguin;
    k = sim::secondary_minimum_association(
        potentials::PairInteraction(derjaguin, potentials::water_at(298.15), potentials::Electrolyte::from_salt("NaCl", 10)),
        0.2e-9);
    CHECK_FALSE(k.constant_m3);
    CHECK_THAT(k.note, Contains("full Hamaker"));
}

TEST_CASE("the expected doublet fraction solves the mass action law with particle conservation",
          "[sim][kinetics]") {
    // x = K n0 = 0.75: K n_M^2 + n_M - n0 = 0 gives n_M = 2/3 n0, so 1/3 of the particles pair;
    // x = 2: n_M = n0/2, half pair. Dilute: the fraction tends to K n0. Rounding only.
    const double n0 = 1e16;
    CHECK_THAT(sim::doublet_fraction_expected(0.75 / n0, n0), WithinRel(1.0 / 3.0, 1e-15));
    CHECK_THAT(sim::doublet_fraction_expected(2.0 / n0, n0), WithinRel(0.5, 1e-15));
    CHECK_THAT(sim::doublet_fraction_expected(1e-12 / n0, n0), WithinRel(1e-12, 1e-11));
    CHECK(sim::doublet_fraction_expected(-1e-18, n0) == 0.0);
    CHECK(sim::doublet_fraction_expected(1e-18, 0.0) == 0.0);
    // n_D = 1/2 K n_M^2 for identical particles, with n_M + 2 n_D = n0.
    const double k = 4.462882996699e-18, fraction = sim::doublet_fraction_expected(k, n0);
    const double n_m = n0 * (1.0 - fraction), n_d = 0.5 * n0 * fraction;
    CHECK_THAT(n_d, WithinRel(0.5 * k * n_m * n_m, 1e-12));
}
