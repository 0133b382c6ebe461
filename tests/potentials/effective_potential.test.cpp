#include <catch2/catch.hpp>
#include <cmath>

#include "potentials/effective_potential.hpp"

using namespace brownfloc::potentials;
using Catch::Matchers::WithinRel;

TEST_CASE("the effective potential of a z:z salt is 4(kT/ze) tanh(ze psi/4kT)", "[potentials][double-layer][validation]") {
    // Closed form of the planar Gouy-Chapman far field (Verwey & Overbeek 1948; Gregory 1975).
    // Tolerance 1e-10: adaptive quadrature at 1e-13 relative.
    const Medium water = water_at(298.15);
    const double kT_e = water.thermal_voltage_V();
    for (int z : {1, 2, 3})
        for (double psi_mV : {-200.0, -60.0, -5.0, 1.0, 25.0, 100.0, 300.0}) {
            INFO("z = " << z << ", psi = " << psi_mV << " mV");
            const double psi = psi_mV * 1e-3;
            const double expected = 4.0 * kT_e / z * std::tanh(z * psi / (4.0 * kT_e));
            CHECK_THAT(effective_surface_potential_V(psi, Electrolyte::symmetric(z, 3.0), water),
                       WithinRel(expected, 1e-10));
        }
}

TEST_CASE("the effective potential in a 2:1 salt matches Ohshima, Healy and White's closed form", "[potentials][double-layer][validation]") {
    // Ohshima, Healy & White (1982), J. Colloid Interface Sci. 90, 17, planar 2-1 electrolyte
    // (divalent cation): Y_eff = 6 (w - 1)/(w + 1), w = sqrt((2 e^y + 1)/3), y = e psi/kT
    // [equation number from memory; the form follows from integrating the planar PB first
    // integral by hand]. Tolerance 1e-10: quadrature only.
    const Medium water = water_at(298.15);
    const double kT_e = water.thermal_voltage_V();
    for (double psi_mV : {-150.0, -40.0, -2.0, 3.0, 50.0, 150.0}) {
        INFO("psi = " << psi_mV << " mV");
        const double y = psi_mV * 1e-3 / kT_e;
        const double w = std::sqrt((2.0 * std::exp(y) + 1.0) / 3.0);
        const double expected = 6.0 * (w - 1.0) / (w + 1.0) * kT_e;
        CHECK_THAT(effective_surface_potential_V(psi_mV * 1e-3, Electrolyte::from_salt("CaCl2", 2.0), water),
                   WithinRel(expected, 1e-10));
    }
}

TEST_CASE("at low potential the effective potential equals the surface potential", "[potentials][double-layer]") {
    // Debye-Hueckel limit: psi_eff = psi (1 + O(y)) for asymmetric salts (O(y^2) for z:z),
    // y = e psi/kT; at 1 uV, y = 4e-5, so the correction is < 1e-5.
    const Medium water = water_at(298.15);
    const Electrolyte mixed = Electrolyte::from_salt("Na2SO4", 1.0).plus(Electrolyte::from_salt("LaCl3", 0.2));
    CHECK_THAT(effective_surface_potential_V(1e-6, mixed, water), WithinRel(1e-6, 1e-5));
    CHECK(effective_surface_potential_V(0.0, mixed, water) == 0.0);
}
