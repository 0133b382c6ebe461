// The shelf-life Monte Carlo on the demo scenario (006): W, tau and the time to the criterion
// at its four storage temperatures for 10 000 samples. Target (issue 6): under 5 s on the 2
// CI cores. Beside it, in the same run, the whole report (margins over the band samples, CCC
// percentiles, model-choice table; target: margins and band within 30 s). The careful W costs
// about 15 times the fast one per call (potentials/fast_stability_ratio.hpp).
// Run: build/bin/potentials_bench --benchmark_filter=shelf_life
#include <benchmark/benchmark.h>

#include <cmath>
#include <string>

#include "sim/scenario.hpp"
#include "sim/shelf_life_report.hpp"
#include "sim/shelf_life_samples.hpp"

namespace {

const std::string demo = std::string(BROWNFLOC_SCENARIO_DIR) + "/006-latex-paint-shelf-life.toml";

std::vector<double> temperatures_K(const brownfloc::sim::Scenario& s) {
    std::vector<double> out;
    for (double t : s.storage.temperatures_C) out.push_back(t + 273.15);
    return out;
}

void shelf_life_samples(benchmark::State& state) {
    using namespace brownfloc::sim;
    const Scenario s = load_scenario(demo);
    const ShelfLifeSampler sampler(s, nullptr);
    const std::uint64_t n = static_cast<std::uint64_t>(state.range(0));
    const SurfaceHold hold = s.storage.surface_hold == "charge" ? SurfaceHold::charge : SurfaceHold::potential;
    for (auto _ : state) {
        const SampledConditions c = sample_conditions(sampler, n, temperatures_K(s), hold,
                                                      s.storage.hydrodynamic_correction,
                                                      [](double log10_tau) { return std::pow(10.0, log10_tau); });
        benchmark::DoNotOptimize(c.time_s.data());
    }
    state.SetLabel(std::to_string(n) + " samples x " + std::to_string(s.storage.temperatures_C.size()) +
                   " temperatures (fast W)");
}
BENCHMARK(shelf_life_samples)->Arg(10000)->Unit(benchmark::kMillisecond)->UseRealTime()->Iterations(3);

void shelf_life_report(benchmark::State& state) {
    using namespace brownfloc::sim;
    const Scenario s = load_scenario(demo);
    for (auto _ : state) benchmark::DoNotOptimize(compute_shelf_life(s));
    state.SetLabel("whole report: 10000 samples, margins and CCC over 1000");
}
BENCHMARK(shelf_life_report)->Unit(benchmark::kMillisecond)->UseRealTime()->Iterations(1);

}  // namespace
