#include <catch2/catch.hpp>
#include <cmath>

#include "potentials/constants.hpp"
#include "potentials/double_layer.hpp"
#include "potentials/effective_potential.hpp"
#include "potentials/medium.hpp"
#include "test_support.hpp"

using namespace brownfloc::potentials;
using brownfloc::test::central_slope;
using Catch::Matchers::WithinRel;

namespace {
const Medium water = water_at(298.15);
const double eps = water.permittivity_F_per_m();
}  // namespace

TEST_CASE("constant potential equals the Verwey-Overbeek form for equal potentials", "[potentials][double-layer][validation]") {
    // For psi1 = psi2, Hogg, Healy & Fuerstenau (1966) reduce to the Derjaguin result
    // U = 2 pi eps a psi^2 ln(1 + exp(-kappa h)) for equal spheres (Verwey & Overbeek 1948).
    // Closed form against closed form: rounding only.
    const double a = 150e-9, kappa = 1e9, psi = -0.02;
    for (double h : {0.3e-9, 1e-9, 4e-9}) {
        const double expected = 2 * constants::pi * eps * a * psi * psi * std::log1p(std::exp(-kappa * h));
        CHECK_THAT(double_layer_constant_potential(eps, kappa, psi, psi, a, a, h).energy_J, WithinRel(expected, 1e-12));
    }
}

TEST_CASE("constant potential approaches linear superposition at large kappa a and low potential", "[potentials][double-layer][validation]") {
    // Gregory (1975): superposition is the weak-overlap limit of both; for equal potentials
    // HHF / LSA = ln(1+e)/e with e = exp(-kappa h) -> 1 - e/2: 0.9 % at kappa h = 4. The
    // effective potential at 10 mV is 0.3 % below psi, and a1 a2/r vs a1 a2/(a1+a2) differ by
    // h/2a = 0.2 %: tolerance 2 %.
    const double a = 1e-6, kappa = 1e9, psi = 0.010;  // kappa a = 1000
    const Electrolyte salt = Electrolyte::symmetric(1, 92.0);
    const double psi_eff = effective_surface_potential_V(psi, salt, water);
    for (double kh : {4.0, 6.0}) {
        const double h = kh / kappa;
        const double hhf = double_layer_constant_potential(eps, kappa, psi, psi, a, a, h).energy_J;
        const double lsa = double_layer_superposition(eps, kappa, psi_eff, psi_eff, a, a, h, SuperpositionGeometry::sphere).energy_J;
        CHECK_THAT(hhf, WithinRel(lsa, 0.02));
    }
}

TEST_CASE("constant charge is at least as repulsive as constant potential", "[potentials][double-layer][validation]") {
    // Wiese & Healy (1970) vs Hogg et al. (1966): the difference -2 pi eps R (psi1^2+psi2^2)
    // ln(1 - e^-2kh) is positive at every gap and grows without bound as h -> 0.
    const double kappa = 3e8;
    double previous_gap = 0;
    for (double h : {0.1e-9, 0.5e-9, 2e-9, 10e-9}) {
        const double cc = double_layer_constant_charge(eps, kappa, 0.03, 0.015, 80e-9, 200e-9, h).energy_J;
        const double cp = double_layer_constant_potential(eps, kappa, 0.03, 0.015, 80e-9, 200e-9, h).energy_J;
        CHECK(cc >= cp);
        const double gap = cc - cp;
        if (previous_gap > 0) CHECK(gap < previous_gap);
        previous_gap = gap;
    }
}

TEST_CASE("opposite potentials attract under every double-layer model", "[potentials][double-layer]") {
    // Heteroaggregation: psi1 psi2 < 0 makes the cross term negative (Hogg et al. 1966).
    const double kappa = 1e8, h = 5e-9;
    CHECK(double_layer_superposition(eps, kappa, 0.02, -0.02, 1e-7, 5e-8, h, SuperpositionGeometry::sphere).energy_J < 0);
    CHECK(double_layer_constant_potential(eps, kappa, 0.02, -0.02, 1e-7, 5e-8, h).energy_J < 0);
}

TEST_CASE("double-layer slopes agree with finite differences", "[potentials][double-layer]") {
    // Central differences, step 1e-5 h: error < 1e-7 relative.
    const double kappa = 5e8, a1 = 90e-9, a2 = 300e-9;
    for (double h : {0.2e-9, 1e-9, 5e-9, 40e-9}) {
        auto lsa = [&](double x) {
            return double_layer_superposition(eps, kappa, -0.04, -0.02, a1, a2, x, SuperpositionGeometry::sphere).energy_J;
        };
        auto cp = [&](double x) { return double_layer_constant_potential(eps, kappa, -0.04, -0.02, a1, a2, x).energy_J; };
        auto cc = [&](double x) { return double_layer_constant_charge(eps, kappa, -0.04, -0.02, a1, a2, x).energy_J; };
        INFO("h = " << h);
        CHECK_THAT(double_layer_superposition(eps, kappa, -0.04, -0.02, a1, a2, h, SuperpositionGeometry::sphere).slope_J_per_m,
                   WithinRel(central_slope(lsa, h), 1e-6));
        CHECK_THAT(double_layer_constant_potential(eps, kappa, -0.04, -0.02, a1, a2, h).slope_J_per_m,
                   WithinRel(central_slope(cp, h), 1e-6));
        CHECK_THAT(double_layer_constant_charge(eps, kappa, -0.04, -0.02, a1, a2, h).slope_J_per_m,
                   WithinRel(central_slope(cc, h), 1e-6));
    }
}

TEST_CASE("the superposition prefactor equals 64 pi eps (kT/ze)^2 gamma^2 for a z:z salt", "[potentials][double-layer][validation]") {
    // Gregory (1975): U = 64 pi eps (kT/ze)^2 gamma1 gamma2 a1 a2/(a1+a2+h) e^-kh,
    // gamma = tanh(ze psi/4kT). Rounding plus the 1e-10 of the effective-potential quadrature.
    const int z = 2;
    const double psi = -0.05, a = 100e-9, h = 2e-9, kT_e = water.thermal_voltage_V();
    const Electrolyte salt = Electrolyte::symmetric(z, 1.0);
    const double kappa = salt.inverse_debye_length_per_m(water);
    const double gamma = std::tanh(z * psi / (4 * kT_e));
    const double expected = 64 * constants::pi * eps * std::pow(kT_e / z, 2) * gamma * gamma * a * a / (2 * a + h) *
                            std::exp(-kappa * h);
    const double psi_eff = effective_surface_potential_V(psi, salt, water);
    CHECK_THAT(double_layer_superposition(eps, kappa, psi_eff, psi_eff, a, a, h, SuperpositionGeometry::sphere).energy_J,
               WithinRel(expected, 1e-9));
}
