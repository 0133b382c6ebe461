#include <catch2/catch.hpp>
#include <cmath>

#include "potentials/ccc.hpp"
#include "potentials/extrema.hpp"

using namespace brownfloc::potentials;
using Catch::Matchers::WithinAbs;

namespace {
const Medium water = water_at(298.15);
}

TEST_CASE("the barrier sits where dU/dh vanishes and U is highest nearby", "[potentials][extrema]") {
    const PairInteraction pair({100e-9, 100e-9, 1e-20, -0.03, -0.03}, water, Electrolyte::from_salt("NaCl", 50));
    const Extrema e = find_extrema(pair, 0.2e-9, default_max_gap_m(pair));
    REQUIRE(e.has_barrier());
    CHECK_FALSE(e.maximum_at_min_gap);
    // Bisection to 1e-12 relative in h: the slope there is ~1e-12 of the force scale.
    const double scale = pair.kT_J() * pair.kappa_per_m();
    CHECK_THAT(pair.total(e.maximum_gap_m).slope_J_per_m / scale, WithinAbs(0.0, 1e-6));
    CHECK(pair.energy_J(e.maximum_gap_m * 1.01) < e.local_maximum_J);
    CHECK(pair.energy_J(e.maximum_gap_m * 0.99) < e.local_maximum_J);
    REQUIRE(e.has_secondary_minimum);
    CHECK(e.secondary_minimum_gap_m > e.maximum_gap_m);
    CHECK(e.secondary_minimum_J < 0);
    CHECK(e.primary_minimum_J == pair.energy_J(0.2e-9));
}

TEST_CASE("pure repulsion has its maximum at min_gap", "[potentials][extrema]") {
    const PairInteraction pair({100e-9, 100e-9, 0.0, -0.03, -0.03}, water, Electrolyte::from_salt("NaCl", 10));
    const Extrema e = find_extrema(pair, 0.2e-9, default_max_gap_m(pair));
    CHECK(e.has_barrier());
    CHECK(e.maximum_at_min_gap);
    CHECK(e.maximum_gap_m == 0.2e-9);
    CHECK_FALSE(e.has_secondary_minimum);
}

TEST_CASE("pure attraction has no maximum and no barrier", "[potentials][extrema]") {
    const PairInteraction pair({100e-9, 100e-9, 1e-20, 0.0, 0.0}, water, Electrolyte::from_salt("NaCl", 10));
    const Extrema e = find_extrema(pair, 0.2e-9, default_max_gap_m(pair));
    CHECK_FALSE(e.has_maximum);
    CHECK(e.barrier_J() == 0.0);
    CHECK(e.primary_minimum_J < 0);
}

TEST_CASE("a negative local maximum is still reported with its secondary minimum", "[potentials][extrema]") {
    // Just above the CCC the maximum dips below zero (so no barrier) but stays a maximum, and
    // the secondary minimum beyond it remains.
    const PairModel model{300e-9, 300e-9, 1e-20, -0.025, -0.025};
    const PairAtConcentration salt = [&](double c) { return PairInteraction(model, water, Electrolyte::from_salt("NaCl", c)); };
    const CccResult ccc = barrier_ccc(salt, 0.2e-9);
    REQUIRE(ccc.concentration_mol_per_m3);
    const PairInteraction pair = salt(1.02 * *ccc.concentration_mol_per_m3);
    const Extrema e = find_extrema(pair, 0.2e-9, default_max_gap_m(pair));
    REQUIRE(e.has_maximum);
    CHECK(e.local_maximum_J < 0);
    CHECK_FALSE(e.has_barrier());
    CHECK(e.barrier_J() == 0.0);
    CHECK(e.has_secondary_minimum);
}
