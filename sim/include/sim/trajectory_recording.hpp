#pragma once
// What a run writes to its trajectory file: the self-contained header (units, box, species,
// particles, the resolved scenario, the interaction curve of every species pair) and one
// frame per snapshot, and the steps at which snapshots are taken. The file format itself is
// the trajectory library's (trajectory/trajectory_format.hpp); this is the engine's side.
#include <cstdint>
#include <string>
#include <vector>

#include "sim/engine.hpp"
#include "sim/engine_setup.hpp"
#include "sim/scenario.hpp"
#include "trajectory/trajectory_data.hpp"

namespace brownfloc::sim {

// Snapshots when neither [output] snapshots nor snapshot_interval_s is given: t = 0, the end
// and 19 evenly spaced times between.
inline constexpr std::int64_t default_snapshots = 21;
// Samples of each pair's interaction curve in the header (geometric in the gap).
inline constexpr int curve_samples = 512;

// The steps after which a snapshot is written: for each requested time, the first step
// boundary at or after it (t = 0 is step 0). `snapshots = K`: K times evenly spaced from 0 to
// the end time, both included; `snapshot_interval_s = T`: 0, T, 2T, ... up to the end time,
// and the end itself. Ascending, without repeats. The schedule only reads the engine's
// state: it never changes the step sequence.
[[nodiscard]] std::vector<std::int64_t> snapshot_steps(const Scenario& scenario, const RunPlan& plan);

[[nodiscard]] trajectory::TrajectoryHeader trajectory_header(const Scenario& scenario, const RunPlan& plan,
                                                             const std::string& resolved_scenario_toml);

// The engine's state now: positions in nm with every cluster stored whole (its centre
// wrapped into the box, its members at centre + offset, so a cluster may reach past the box
// faces), the cluster id (smallest member id) of every particle, and the spanning clusters.
[[nodiscard]] trajectory::TrajectoryFrame trajectory_frame(const Engine& engine);

}  // namespace brownfloc::sim
