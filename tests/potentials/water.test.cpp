#include <catch2/catch.hpp>

#include "potentials/medium.hpp"
#include "potentials/water.hpp"

using namespace brownfloc::potentials;
using Catch::Matchers::WithinAbs;
using Catch::Matchers::WithinRel;

TEST_CASE("water viscosity matches the reference values at 20 and 25 degC", "[potentials][water][validation]") {
    // Patek et al. (2009) quote the NBS datum 1.0020 mPa s at 20 degC (their fit reproduces it
    // within their stated 0.1 % uncertainty near room temperature).
    CHECK_THAT(water_viscosity_Pa_s(293.15), WithinRel(1.0020e-3, 1e-3));
    // IAPWS 2008 (Huber et al. 2009, J. Phys. Chem. Ref. Data 38, 101): 890.0 uPa s at
    // 298.15 K and 0.1 MPa [memory]; same 0.1 % tolerance.
    CHECK_THAT(water_viscosity_Pa_s(298.15), WithinRel(0.8900e-3, 1e-3));
}

TEST_CASE("water viscosity falls with temperature", "[potentials][water]") {
    double previous = water_viscosity_Pa_s(273.15);
    for (double t = 278.15; t <= 373.15; t += 5) {
        const double eta = water_viscosity_Pa_s(t);
        CHECK(eta < previous);
        previous = eta;
    }
}

TEST_CASE("water permittivity matches Malmberg and Maryott's table", "[potentials][water][validation]") {
    // Malmberg & Maryott (1956), their table [number from memory]: 78.30 at 25 degC, 80.10 at 20 degC, 87.74 at 0 degC.
    // Tolerance: the table is printed to 0.01.
    CHECK_THAT(water_relative_permittivity(298.15), WithinAbs(78.30, 0.01));
    CHECK_THAT(water_relative_permittivity(293.15), WithinAbs(80.10, 0.01));
    CHECK_THAT(water_relative_permittivity(273.15), WithinAbs(87.74, 0.01));
}

TEST_CASE("water_at combines both correlations", "[potentials][water]") {
    const Medium m = water_at(310.15);
    CHECK(m.viscosity_Pa_s == water_viscosity_Pa_s(310.15));
    CHECK(m.relative_permittivity == water_relative_permittivity(310.15));
    // kT at 25 degC = 4.116e-21 J (CODATA k_B, exact); rounding only.
    CHECK_THAT(water_at(298.15).thermal_energy_J(), WithinRel(1.380649e-23 * 298.15, 1e-15));
}
