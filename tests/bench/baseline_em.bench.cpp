// The speed baseline of the engine issue: a plain Verlet-list Euler-Maruyama loop with
// double-precision Box-Muller Philox noise (baseline_em_loop.hpp) on the shared speed case
// (speed_case.hpp: N = 1e5, volume fraction 0.05, a = 100 nm, -25 mV, 50 mM NaCl, 25 degC),
// one thread. The engine benchmark runs the same case; compare ns_per_particle_step from
// one run of this executable, as machine figures drift by +-25 % between runs.
// Run: build/bin/engine_bench --benchmark_filter=baseline
#include <benchmark/benchmark.h>

#include <chrono>
#include <cstdint>
#include <exception>

#include "baseline_em_loop.hpp"
#include "speed_case.hpp"

using brownfloc::bench::BaselineEmLoop;
using brownfloc::bench::SpeedCase;

namespace {

BaselineEmLoop make_loop(const SpeedCase& c) {
    const auto& s = brownfloc::bench::speed_case_setup();
    return BaselineEmLoop(c.particles, c.volume_fraction, c.radius_m, s.table, s.diffusion_m2_per_s, s.kT_J,
                          s.time_step_s, s.cutoff_gap_m, s.skin_m, c.seed);
}

// Steps of the baseline; the list is built in the constructor (untimed) and rebuilt inside
// the timed steps whenever a particle has moved skin/2 (counter list_builds). At this time
// step that happens every ~5 steps: pairs placed inside the 12 kT barrier (at 0.9 nm) reach
// contact, and with no capture the force clamped at its 0.2 nm value (~1.9 nN, a 2 nm drift
// per step) throws them through each other; rebuilds are about a quarter of the time.
void baseline_em_step(benchmark::State& state) {
    const SpeedCase c;
    const auto& s = brownfloc::bench::speed_case_setup();
    BaselineEmLoop loop = make_loop(c);
    const std::uint64_t builds_before = loop.list_builds();
    const double cpu_start_ns = brownfloc::bench::thread_cpu_time_ns();
    const auto wall_start = std::chrono::steady_clock::now();
    for (auto _ : state) loop.step();
    const double wall_ns = std::chrono::duration<double, std::nano>(std::chrono::steady_clock::now() - wall_start).count();
    const double cpu_ns = brownfloc::bench::thread_cpu_time_ns() - cpu_start_ns;
    try {
        loop.check_finite();
    } catch (const std::exception& e) {
        state.SkipWithError(e.what());
        return;
    }
    const double particle_steps = static_cast<double>(state.iterations()) * static_cast<double>(c.particles);
    state.counters["ns_per_particle_step"] = cpu_ns / particle_steps;  // thread CPU time
    state.counters["wall_ns_per_particle_step"] = wall_ns / particle_steps;
    state.counters["list_builds"] = static_cast<double>(loop.list_builds() - builds_before);
    state.counters["pairs_per_particle"] = static_cast<double>(loop.list_pairs()) / static_cast<double>(c.particles);
    state.counters["cutoff_nm"] = s.cutoff_gap_m * 1e9;
    state.counters["dt_ns"] = s.time_step_s * 1e9;
    state.SetItemsProcessed(static_cast<std::int64_t>(particle_steps));
}
BENCHMARK(baseline_em_step)->Unit(benchmark::kMillisecond)->Iterations(100);

// One build of the half Verlet list through the cell list: what each rebuild costs.
void baseline_list_build(benchmark::State& state) {
    const SpeedCase c;
    BaselineEmLoop loop = make_loop(c);
    const double cpu_start_ns = brownfloc::bench::thread_cpu_time_ns();
    for (auto _ : state) loop.build_list();
    state.counters["ns_per_particle"] = (brownfloc::bench::thread_cpu_time_ns() - cpu_start_ns) /
                                        (static_cast<double>(state.iterations()) * static_cast<double>(c.particles));
}
BENCHMARK(baseline_list_build)->Unit(benchmark::kMillisecond)->Iterations(10);

}  // namespace
