#include <catch2/catch.hpp>
#include <algorithm>
#include <cmath>
#include <random>

#include "potentials/pair_interaction.hpp"
#include "potentials/radius_free_interaction.hpp"

using namespace brownfloc::potentials;

namespace {

struct Case {
    const char* name;
    VdwForm vdw;
    DoubleLayerModel double_layer;
    Electrolyte electrolyte;
};

// Worst |F - F_exact| / max(|F_exact|, kappa kT) over random pairs: radii log-normal around
// 100 nm with sd 0.4 in ln a (truncated at +-3 sd), potentials -10 to -60 mV, Hamaker
// constants 0.5-5e-20 J, gaps log-uniform between the table ends. Fixed seed.
double worst_error(const Case& c, double start_gap_m, double end_gap_m) {
    const Medium water = water_at(298.15);
    const RadiusFreeInteraction table(c.vdw, c.double_layer, water, c.electrolyte, start_gap_m, end_gap_m);
    const double floor_N = table.kappa_per_m() * water.thermal_energy_J();
    std::mt19937_64 rng(2026);
    std::normal_distribution<double> z(0.0, 1.0);
    std::uniform_real_distribution<double> u(0.0, 1.0);
    auto radius = [&] { return 100e-9 * std::exp(0.4 * std::clamp(z(rng), -3.0, 3.0)); };
    double worst = 0;
    for (int pair_index = 0; pair_index < 200; ++pair_index) {
        PairModel model;
        model.radius1_m = radius();
        model.radius2_m = radius();
        model.hamaker_J = 0.5e-20 + 4.5e-20 * u(rng);
        model.surface_potential1_V = -0.01 - 0.05 * u(rng);
        model.surface_potential2_V = -0.01 - 0.05 * u(rng);
        model.vdw = c.vdw;
        model.double_layer = c.double_layer;
        const PairInteraction exact(model, water, c.electrolyte);
        const PairSurfaces surfaces{model.radius1_m, model.radius2_m, model.hamaker_J,
                                    table.double_layer_potential_V(model.surface_potential1_V),
                                    table.double_layer_potential_V(model.surface_potential2_V)};
        for (int k = 0; k < 1000; ++k) {
            const double h = start_gap_m * std::pow(end_gap_m / start_gap_m, u(rng));
            if (h >= end_gap_m) continue;
            const double f = exact.force_N(h);
            worst = std::max(worst, std::abs(table.force_N(h, surfaces) - f) / std::max(std::abs(f), floor_N));
        }
    }
    return worst;
}

}  // namespace

TEST_CASE("radius-free kernels give every pair's force within 1e-6 for continuous radii", "[potentials][table]") {
    // Foundation issue: with continuous radii tabulate only radius-free kernels (or bin
    // radii) and state the error. The error bound is the same as for one tabulated pair:
    // 1e-6 max(|F|, kappa kT), here for 2e5 random (radius pair, gap) samples per model.
    const Case cases[] = {
        {"superposition, full Hamaker", VdwForm::hamaker_full, DoubleLayerModel::linear_superposition,
         Electrolyte::from_salt("NaCl", 50)},
        {"superposition in CaCl2, retarded", VdwForm::gregory_retarded, DoubleLayerModel::linear_superposition,
         Electrolyte::from_salt("CaCl2", 5)},
        {"constant potential", VdwForm::hamaker_full, DoubleLayerModel::constant_potential,
         Electrolyte::from_salt("KNO3", 20)},
        {"constant charge, Derjaguin vdW", VdwForm::derjaguin, DoubleLayerModel::constant_charge,
         Electrolyte::from_salt("NaCl", 100)},
    };
    for (const Case& c : cases) {
        INFO(c.name);
        CHECK(worst_error(c, 0.3e-9, 40e-9) <= 1e-6);
    }
}

TEST_CASE("radius-free interaction is zero beyond the end gap and held below the start", "[potentials][table]") {
    const RadiusFreeInteraction table(VdwForm::hamaker_full, DoubleLayerModel::linear_superposition, water_at(298.15),
                                      Electrolyte::from_salt("NaCl", 10), 1e-9, 30e-9);
    const PairSurfaces pair{1e-7, 2e-7, 1e-20, -0.02, -0.02};
    CHECK(table.force_N(30e-9, pair) == 0.0);
    CHECK(table.force_N(0.5e-9, pair) == table.force_N(1e-9, pair));
}
