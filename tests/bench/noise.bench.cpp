// Cost of one Philox4x32-10 block turned into 4 normals: the fast inverse-CDF transform
// (standard_normals) against double Box-Muller (box_muller_normals), and the bare block.
// Each iteration fills the normals of 1024 consecutive bodies into an array, as the
// integrator does. Target (engine issue): block + 4 fast normals <= ~15 ns on one core.
// Run: build/bin/engine_bench --benchmark_filter=noise
#include <benchmark/benchmark.h>

#include <array>
#include <cstdint>
#include <vector>

#include "sim/philox_noise.hpp"
#include "speed_case.hpp"

using namespace brownfloc::sim;

namespace {

constexpr std::uint32_t bodies = 1024;
constexpr std::uint64_t seed = 20240601;  // fixed

template <class Block, class Value>
void run_blocks(benchmark::State& state, Block&& block, std::vector<std::array<Value, 4>>& out) {
    std::uint64_t step = 0;
    const double cpu_start_ns = brownfloc::bench::thread_cpu_time_ns();
    for (auto _ : state) {
        for (std::uint32_t b = 0; b < bodies; ++b) out[b] = block(step, b);
        benchmark::DoNotOptimize(out.data());
        benchmark::ClobberMemory();
        ++step;
    }
    const double blocks = static_cast<double>(state.iterations()) * bodies;
    state.counters["ns_per_block"] = (brownfloc::bench::thread_cpu_time_ns() - cpu_start_ns) / blocks;  // CPU time
    state.SetItemsProcessed(static_cast<std::int64_t>(blocks));
}

void noise_philox_block(benchmark::State& state) {
    std::vector<std::array<std::uint32_t, 4>> out(bodies);
    auto block = [](std::uint64_t step, std::uint32_t b) {
        return philox_block(seed, step, b, NoiseStream::translation);
    };
    run_blocks(state, block, out);
}
BENCHMARK(noise_philox_block);

void noise_fast_normals(benchmark::State& state) {
    std::vector<std::array<double, 4>> out(bodies);
    auto block = [](std::uint64_t step, std::uint32_t b) {
        return standard_normals(seed, step, b, NoiseStream::translation);
    };
    run_blocks(state, block, out);
}
BENCHMARK(noise_fast_normals);

void noise_box_muller_normals(benchmark::State& state) {
    std::vector<std::array<double, 4>> out(bodies);
    auto block = [](std::uint64_t step, std::uint32_t b) {
        return box_muller_normals(seed, step, b, NoiseStream::translation);
    };
    run_blocks(state, block, out);
}
BENCHMARK(noise_box_muller_normals);

}  // namespace
