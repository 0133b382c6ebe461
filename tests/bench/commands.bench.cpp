// The work behind `brownfloc dlvo` and `brownfloc ccc` on the demo scenarios, in process
// (parsing included). Target (foundation issue): each command end to end under 100 ms; the
// process start-up on top is measured by scripts/time-commands.sh.
#include <benchmark/benchmark.h>

#include <string>

#include "sim/ccc_report.hpp"
#include "sim/dlvo_report.hpp"
#include "sim/scenario.hpp"

namespace {

const char* const scenarios[] = {"001-latex-in-salt.toml", "002-pigment-coating.toml",
                                 "003-oxide-heteroaggregation.toml", "004-nanocarrier-in-saline.toml"};

void dlvo_report(benchmark::State& state) {
    const std::string path = std::string(BROWNFLOC_SCENARIO_DIR) + "/" + scenarios[state.range(0)];
    state.SetLabel(scenarios[state.range(0)]);
    for (auto _ : state) {
        const auto scenario = brownfloc::sim::load_scenario(path);
        benchmark::DoNotOptimize(brownfloc::sim::compute_dlvo_report(scenario));
    }
}
BENCHMARK(dlvo_report)->DenseRange(0, 3)->Unit(benchmark::kMillisecond);

void ccc_report(benchmark::State& state) {
    const std::string path = std::string(BROWNFLOC_SCENARIO_DIR) + "/" + scenarios[state.range(0)];
    state.SetLabel(scenarios[state.range(0)]);
    for (auto _ : state) {
        const auto scenario = brownfloc::sim::load_scenario(path);
        benchmark::DoNotOptimize(brownfloc::sim::compute_ccc_report(scenario));
    }
}
BENCHMARK(ccc_report)->DenseRange(0, 2)->Unit(benchmark::kMillisecond);

}  // namespace
