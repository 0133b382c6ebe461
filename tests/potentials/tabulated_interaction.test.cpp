#include <catch2/catch.hpp>
#include <algorithm>
#include <cmath>
#include <random>
#include <vector>

#include "potentials/extrema.hpp"
#include "potentials/tabulated_interaction.hpp"

using namespace brownfloc::potentials;

namespace {

struct Case {
    const char* name;
    PairModel model;
    Electrolyte electrolyte;
    double start_gap_m, end_gap_m;
};

// Worst |F_tab - F| / max(|F|, kappa kT) over random gaps (log-uniform) and a dense comb
// around every zero of F (the barrier top and the secondary minimum).
double worst_error(const Case& c) {
    const PairInteraction pair(c.model, water_at(298.15), c.electrolyte);
    const TabulatedInteraction table(pair, c.start_gap_m, c.end_gap_m);
    const double floor_N = std::max(pair.kappa_per_m(), 1.0 / c.end_gap_m) * pair.kT_J();
    std::vector<double> gaps;
    std::mt19937_64 rng(12345);  // fixed seed
    std::uniform_real_distribution<double> u(std::log(c.start_gap_m), std::log(c.end_gap_m));
    for (int i = 0; i < 200000; ++i) gaps.push_back(std::exp(u(rng)));
    const Extrema e = find_extrema(pair, c.start_gap_m, c.end_gap_m);
    for (double centre : {e.maximum_gap_m, e.secondary_minimum_gap_m})
        if (centre > c.start_gap_m)
            for (int k = -500; k <= 500; ++k) gaps.push_back(centre * (1 + 1e-4 * k));
    double worst = 0;
    for (double h : gaps) {
        if (h < c.start_gap_m || h >= c.end_gap_m) continue;
        const double f = pair.force_N(h);
        worst = std::max(worst, std::abs(table.force_N(h) - f) / std::max(std::abs(f), floor_N));
    }
    return worst;
}

}  // namespace

TEST_CASE("tabulated forces stay within 1e-6 of the analytic force from capture gap to cutoff", "[potentials][table]") {
    // Requirement of the foundation issue: |F_tab - F| <= 1e-6 max(|F|, kappa kT). The cases
    // span a barrier (F crosses zero twice), pure attraction, constant charge near contact,
    // retarded attraction, unequal radii and a thick double layer.
    const Case cases[] = {
        {"latex, barrier", {100e-9, 100e-9, 1e-20, -0.03, -0.03}, Electrolyte::from_salt("NaCl", 50), 0.5e-9, 40e-9},
        {"near contact", {100e-9, 100e-9, 1e-20, -0.03, -0.03}, Electrolyte::from_salt("NaCl", 50), 0.2e-9, 40e-9},
        {"no barrier", {250e-9, 250e-9, 4e-20, -0.01, -0.01}, Electrolyte::from_salt("CaCl2", 100), 0.3e-9, 30e-9},
        {"constant charge",
         {60e-9, 60e-9, 1e-20, -0.025, -0.025, VdwForm::hamaker_full, DoubleLayerModel::constant_charge},
         Electrolyte::from_salt("KCl", 20), 0.2e-9, 60e-9},
        {"retarded, unequal",
         {40e-9, 400e-9, 2e-20, -0.04, -0.02, VdwForm::gregory_retarded},
         Electrolyte::from_salt("NaCl", 30), 0.4e-9, 50e-9},
        {"thick double layer", {20e-9, 20e-9, 1e-20, -0.05, -0.05}, Electrolyte::from_salt("NaCl", 0.1), 0.2e-9, 900e-9},
    };
    for (const Case& c : cases) {
        INFO(c.name);
        CHECK(worst_error(c) <= 1e-6);
    }
}

TEST_CASE("tabulated forces vanish beyond the end gap and hold their value below the start", "[potentials][table]") {
    const PairInteraction pair({100e-9, 100e-9, 1e-20, -0.03, -0.03}, water_at(298.15), Electrolyte::from_salt("NaCl", 50));
    const TabulatedInteraction table(pair, 1e-9, 20e-9);
    CHECK(table.force_N(20.001e-9) == 0.0);
    CHECK(table.force_N(1e-3) == 0.0);
    CHECK(table.energy_J(25e-9) == 0.0);
    CHECK(table.force_N(0.5e-9) == pair.force_N(1e-9));
    CHECK(table.energy_J(0.5e-9) == pair.energy_J(1e-9));
    // 128 intervals per octave over 20x: ceil(log2 20) = 5 octaves.
    CHECK(table.intervals() == 5 * 128);
}
