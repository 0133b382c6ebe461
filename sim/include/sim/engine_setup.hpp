#pragma once
// From a validated Scenario to a ready engine: the EngineModel (pair analysis, tables, time
// step) and the initial particles (radii drawn, box sized from them, random placement with
// every gap at least the capture gap). Everything is a pure function of (scenario, seed).
#include <cstdint>
#include <memory>
#include <string>

#include "sim/engine.hpp"
#include "sim/engine_model.hpp"
#include "sim/scenario.hpp"

namespace brownfloc::sim {

inline constexpr std::int64_t default_particles = 1000;
inline constexpr std::int64_t default_max_steps = 1'000'000'000;
inline constexpr double default_end_half_lives = 10.0;

struct RunPlan {
    std::shared_ptr<const EngineModel> model;
    InitialParticles particles;
    std::int64_t particle_count = 0;
    double number_density_per_m3 = 0;
    double half_life_fast_s = 0;       // 3 eta / (4 kT n0) at the median radius of species 1;
                                       // with several species from the mean fast kernel
    double mean_fast_rate_m3_per_s = 0;  // number-fraction average of k_ij (no 1/2 for i != j)
    double end_time_s = 0;
    std::int64_t total_steps = 0;      // predicted_steps
    double steps_per_half_life = 0;
    std::int64_t max_steps = default_max_steps;
};

// Builds the model and the initial state. Throws InputError (naming the scenario file and
// key) for a run that cannot be done: no [suspension], a capture gap below min_gap, a
// concentration at which random placement cannot succeed, predicted steps above max_steps.
// seed is the run's seed ([run] seed, or --seed). stop_requested, when given, is asked every
// few thousand particles during placement (seconds per million particles); when it answers
// true, plan_run throws SetupStopped and leaves nothing behind.
using StopRequested = bool (*)();
struct SetupStopped {};
[[nodiscard]] RunPlan plan_run(const Scenario& scenario, std::uint64_t seed, StopRequested stop_requested = nullptr);

}  // namespace brownfloc::sim
