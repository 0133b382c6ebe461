#include <catch2/catch.hpp>

#include <cmath>

#include "potentials/constants.hpp"
#include "potentials/electrolyte.hpp"
#include "potentials/grahame.hpp"
#include "potentials/input_error.hpp"
#include "potentials/medium.hpp"

using namespace brownfloc::potentials;
using Catch::Matchers::WithinRel;

TEST_CASE("the Grahame charge of a z:z salt is sqrt(8 eps kT n) sinh(z e psi / 2kT)", "[potentials][grahame]") {
    // Grahame 1947, Chem. Rev. 41, 441 (symmetric form; Hunter 2001, ch. 7 [memory for the chapter]).
    const Medium water = water_at(298.15);
    for (int z : {1, 2}) {
        for (double c_mM : {1.0, 10.0, 150.0}) {
            const Electrolyte salt = Electrolyte::symmetric(z, c_mM);
            const double n = c_mM * constants::avogadro_per_mol;
            for (double psi_mV : {-120.0, -30.0, 5.0, 60.0}) {
                const double psi = psi_mV * 1e-3;
                const double expected = std::sqrt(8 * water.permittivity_F_per_m() * water.thermal_energy_J() * n) *
                                        std::sinh(z * psi / (2 * water.thermal_voltage_V()));
                CHECK_THAT(grahame_surface_charge_C_per_m2(psi, salt, water), WithinRel(expected, 1e-12));
            }
        }
    }
}

TEST_CASE("at low potential the Grahame charge is eps kappa psi", "[potentials][grahame]") {
    // Debye-Hueckel limit of the Grahame equation (Hunter 2001 [memory]): sigma = eps kappa psi0.
    const Medium water = water_at(298.15);
    const Electrolyte mixture = Electrolyte::from_salt("CaCl2", 2.0).plus(Electrolyte::from_salt("NaCl", 10.0));
    // An asymmetric mixture has a first-order correction of relative size ~ (sum n z^3 / sum n z^2)
    // (e psi / kT) / 3 (expanding the Boltzmann factors one order further): 3e-6 at 1 uV.
    const double psi = 1e-6;
    const double expected = water.permittivity_F_per_m() * mixture.inverse_debye_length_per_m(water) * psi;
    CHECK_THAT(grahame_surface_charge_C_per_m2(psi, mixture, water), WithinRel(expected, 1e-5));
    CHECK_THAT(grahame_surface_charge_C_per_m2(-psi, mixture, water), WithinRel(-expected, 1e-5));
}

TEST_CASE("the potential for a given charge inverts the Grahame equation", "[potentials][grahame]") {
    const Medium cold = water_at(278.15), warm = water_at(313.15);
    const Electrolyte hard_water = Electrolyte::from_salt("CaCl2", 2.0).plus(Electrolyte::from_salt("NaCl", 5.0));
    for (double psi_mV : {-150.0, -45.0, -0.5, 20.0, 90.0}) {
        const double sigma = grahame_surface_charge_C_per_m2(psi_mV * 1e-3, hard_water, cold);
        CHECK_THAT(grahame_surface_potential_V(sigma, hard_water, cold), WithinRel(psi_mV * 1e-3, 1e-12));
        // The same charge at 40 degC sits at a different potential, of the same sign.
        const double psi_warm = grahame_surface_potential_V(sigma, hard_water, warm);
        CHECK(psi_warm * psi_mV > 0);
        CHECK_THAT(grahame_surface_charge_C_per_m2(psi_warm, hard_water, warm), WithinRel(sigma, 1e-12));
    }
    CHECK(grahame_surface_potential_V(0.0, hard_water, cold) == 0.0);
    CHECK_THROWS_AS(grahame_surface_potential_V(-0.01, Electrolyte(), cold), brownfloc::InputError);
    CHECK_THROWS_AS(grahame_surface_potential_V(NAN, hard_water, cold), brownfloc::InputError);
}
