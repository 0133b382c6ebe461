// Tabulated force look-ups on gaps drawn like the pair gaps of a dispersion: centre
// distances uniform in volume between the capture gap and the cutoff (p(r) ~ r^2), shuffled
// so the table is hit in random order. Target (foundation issue): >= 1e8 look-ups/s/core.
#include <benchmark/benchmark.h>

#include <cmath>
#include <random>
#include <vector>

#include "potentials/extrema.hpp"
#include "potentials/pair_interaction.hpp"
#include "potentials/radius_free_interaction.hpp"
#include "potentials/tabulated_interaction.hpp"

using namespace brownfloc::potentials;

namespace {

struct Setup {
    PairInteraction pair;
    TabulatedInteraction table;
    std::vector<double> gaps;
};

Setup make_setup() {
    // The latex demo (scenarios/001): 100 nm, 1e-20 J, -35 mV, 50 mM NaCl; capture near 1 nm,
    // cutoff at 30 Debye lengths.
    PairInteraction pair({100e-9, 100e-9, 1e-20, -0.035, -0.035}, water_at(298.15), Electrolyte::from_salt("NaCl", 50));
    const double start = 1e-9, end = default_max_gap_m(pair), s = 200e-9;
    TabulatedInteraction table(pair, start, end);
    std::mt19937_64 rng(7);  // fixed seed
    std::uniform_real_distribution<double> u(0.0, 1.0);
    const double r0 = s + start, r1 = s + end;
    std::vector<double> gaps(1 << 20);
    for (double& g : gaps) {
        const double r = std::cbrt(r0 * r0 * r0 + u(rng) * (r1 * r1 * r1 - r0 * r0 * r0));
        g = r - s;
    }
    return {pair, table, gaps};
}

const Setup& setup() {
    static const Setup instance = make_setup();
    return instance;
}

void tabulated_force_lookup(benchmark::State& state) {
    const Setup& s = setup();
    for (auto _ : state) {
        double sum = 0;
        for (double h : s.gaps) sum += s.table.force_N(h);
        benchmark::DoNotOptimize(sum);
    }
    state.SetItemsProcessed(state.iterations() * static_cast<std::int64_t>(s.gaps.size()));
}
BENCHMARK(tabulated_force_lookup);

void analytic_force(benchmark::State& state) {
    const Setup& s = setup();
    for (auto _ : state) {
        double sum = 0;
        for (std::size_t i = 0; i < s.gaps.size(); i += 16) sum += s.pair.force_N(s.gaps[i]);
        benchmark::DoNotOptimize(sum);
    }
    state.SetItemsProcessed(state.iterations() * static_cast<std::int64_t>(s.gaps.size() / 16));
}
BENCHMARK(analytic_force);

// Polydisperse pairs: radius-free kernel tables plus the analytic radius factors and full
// Hamaker force, for random radius pairs (log-normal, sd 0.3) at the same gaps.
void radius_free_force_lookup(benchmark::State& state) {
    const Setup& s = setup();
    const Medium water = water_at(298.15);
    const RadiusFreeInteraction table(VdwForm::hamaker_full, DoubleLayerModel::linear_superposition, water,
                                      Electrolyte::from_salt("NaCl", 50), s.table.start_gap_m(), s.table.end_gap_m());
    std::mt19937_64 rng(11);  // fixed seed
    std::lognormal_distribution<double> radius(std::log(100e-9), 0.3);
    const double psi = table.double_layer_potential_V(-0.035);
    std::vector<PairSurfaces> pairs(1024);
    for (auto& p : pairs) p = {radius(rng), radius(rng), 1e-20, psi, psi};
    for (auto _ : state) {
        double sum = 0;
        for (std::size_t i = 0; i < s.gaps.size(); ++i) sum += table.force_N(s.gaps[i], pairs[i & 1023]);
        benchmark::DoNotOptimize(sum);
    }
    state.SetItemsProcessed(state.iterations() * static_cast<std::int64_t>(s.gaps.size()));
}
BENCHMARK(radius_free_force_lookup);

}  // namespace
