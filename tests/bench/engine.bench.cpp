// The engine's speed on the issue's case (speed_case.hpp: a = 100 nm, volume fraction 0.05,
// -25 mV, 50 mM NaCl, 25 degC, A = 1e-20 J) at the engine's own automatic time step, cutoff
// and skin, against the plain baseline loop run with those same three numbers in the same
// process. Counters: ns_per_particle_step (steady steps, construction excluded),
// bytes_per_particle (peak resident set of the process over the particles; meaningful for
// the largest N, run it alone: --benchmark_filter=engine_step/1000000).
// Run: build/bin/engine_bench --benchmark_filter='engine|baseline_at_engine'
#include <benchmark/benchmark.h>
#include <omp.h>
#include <sys/resource.h>

#include <chrono>
#include <ctime>
#include <string>

#include "baseline_em_loop.hpp"
#include "sim/engine.hpp"
#include "sim/engine_setup.hpp"
#include "sim/scenario.hpp"
#include "speed_case.hpp"

namespace {

using namespace brownfloc::sim;

RunPlan speed_plan(std::int64_t particles) {
    const std::string toml = R"(
        [particle]
        radius_nm = 100
        hamaker_J = 1e-20
        surface_potential_mV = -25
        [suspension]
        volume_fraction = 0.05
        [electrolyte]
        salt = "NaCl"
        concentration_mM = 50
        [run]
        steps = 1000
        particles = )" + std::to_string(particles) + "\n";
    return plan_run(parse_scenario(toml, "<speed case>"), 20240601);
}

double peak_resident_bytes() {
    rusage usage{};
    getrusage(RUSAGE_SELF, &usage);
    return double(usage.ru_maxrss) * 1024.0;  // Linux: kilobytes
}

void engine_step(benchmark::State& state) {
    const auto particles = static_cast<std::int64_t>(state.range(0));
    const int threads = static_cast<int>(state.range(1));
    omp_set_num_threads(threads);
    const RunPlan plan = speed_plan(particles);
    Engine engine(plan.model, plan.particles);
    for (int k = 0; k < 5; ++k) engine.step();  // first list rebuilds and early captures
    const std::int64_t builds0 = engine.list_builds();
    const std::clock_t cpu0 = std::clock();
    const auto start = std::chrono::steady_clock::now();
    for (auto _ : state) engine.step();
    const double ns = std::chrono::duration<double, std::nano>(std::chrono::steady_clock::now() - start).count();
    const double cpu_ns = double(std::clock() - cpu0) * 1e9 / CLOCKS_PER_SEC;
    const double particle_steps = double(state.iterations()) * double(particles);
    state.counters["ns_per_particle_step"] = ns / particle_steps;
    // Process CPU time (all threads): robust to other load on a shared machine.
    state.counters["cpu_ns_per_particle_step"] = cpu_ns / particle_steps;
    state.counters["list_builds"] = double(engine.list_builds() - builds0);
    state.counters["bytes_per_particle"] = peak_resident_bytes() / double(particles);
    state.counters["dt_ns"] = plan.model->time_step.time_step_s * 1e9;
    state.counters["cutoff_nm"] = plan.model->max_cutoff_gap_m() * 1e9;
    state.counters["threads"] = threads;
    omp_set_num_threads(1);
}
BENCHMARK(engine_step)->Args({100000, 1})->Args({100000, 2})->Args({10000, 1})->Unit(benchmark::kMillisecond)->Iterations(200);
BENCHMARK(engine_step)->Args({1000000, 1})->Unit(benchmark::kMillisecond)->Iterations(20);

// The baseline loop with the engine's time step, cutoff and skin for this case.
void baseline_at_engine_step(benchmark::State& state) {
    const brownfloc::bench::SpeedCase c;
    const RunPlan plan = speed_plan(static_cast<std::int64_t>(c.particles));
    const auto& s = brownfloc::bench::speed_case_setup();
    const brownfloc::potentials::TabulatedInteraction table(s.pair, c.min_gap_m, plan.model->max_cutoff_gap_m());
    brownfloc::bench::BaselineEmLoop loop(c.particles, c.volume_fraction, c.radius_m, table, s.diffusion_m2_per_s, s.kT_J,
                                          plan.model->time_step.time_step_s, plan.model->max_cutoff_gap_m(),
                                          plan.model->skin_m, c.seed);
    const std::clock_t cpu0 = std::clock();
    const auto start = std::chrono::steady_clock::now();
    for (auto _ : state) loop.step();
    const double ns = std::chrono::duration<double, std::nano>(std::chrono::steady_clock::now() - start).count();
    const double cpu_ns = double(std::clock() - cpu0) * 1e9 / CLOCKS_PER_SEC;
    state.counters["ns_per_particle_step"] = ns / (double(state.iterations()) * double(c.particles));
    state.counters["cpu_ns_per_particle_step"] = cpu_ns / (double(state.iterations()) * double(c.particles));
}
BENCHMARK(baseline_at_engine_step)->Unit(benchmark::kMillisecond)->Iterations(100);

}  // namespace
