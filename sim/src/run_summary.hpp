#pragma once
// summary.json of a finished run (keys of the project's INTERFACES, run directory section).
#include <cstdint>
#include <string>
#include <vector>

#include "sim/engine.hpp"
#include "sim/engine_setup.hpp"
#include "sim/json_writer.hpp"
#include "sim/run_recorder.hpp"
#include "sim/scenario.hpp"

namespace brownfloc::sim {

// The run's bookkeeping: not a function of (scenario, seed, binary) except the trajectory
// figures.
struct RunTiming {
    double wall_time_s = 0;     // cumulative over the run and its resumptions
    std::int64_t session_particle_steps = 0;  // done by this process, for particle_steps_per_s
    double session_wall_time_s = 0;
    int threads = 1;
    std::string status = "complete";  // running | interrupted | complete
    std::int64_t resumes = 0;
    std::string trajectory_file;      // name inside the run directory
    std::uint64_t trajectory_bytes = 0, trajectory_frames = 0;
};

[[nodiscard]] Json run_summary_json(const Scenario& scenario, const RunPlan& plan, const Engine& engine,
                                    const RunRecorder& recorder, const std::vector<ClusterRow>& rows,
                                    const std::string& scenario_sha256, const RunTiming& timing);

}  // namespace brownfloc::sim
