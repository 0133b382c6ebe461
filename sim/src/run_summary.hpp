#pragma once
// summary.json of a finished run (keys of the project's INTERFACES, run directory section).
#include <string>
#include <vector>

#include "sim/engine.hpp"
#include "sim/engine_setup.hpp"
#include "sim/json_writer.hpp"
#include "sim/run_recorder.hpp"
#include "sim/scenario.hpp"

namespace brownfloc::sim {

struct RunTiming {
    double wall_time_s = 0;
    int threads = 1;
};

[[nodiscard]] Json run_summary_json(const Scenario& scenario, const RunPlan& plan, const Engine& engine,
                                    const RunRecorder& recorder, const std::vector<ClusterRow>& rows,
                                    const std::string& scenario_sha256, const RunTiming& timing);

}  // namespace brownfloc::sim
