#pragma once
// Where the pieces of a run are, from what the user named: a run directory (as written by
// `brownfloc run`) or a trajectory file.
//
//   const RunLocation where = locate_run("runs/flocs-seed1");
//   where.trajectory      == "runs/flocs-seed1/trajectory.bftraj"
//   where.timeseries_csv  == "runs/flocs-seed1/timeseries.csv"   (empty if the run has none)
//
// A file named trajectory.bftraj whose directory also holds summary.json, timeseries.csv or
// .lock is taken as part of that run directory (so `brownfloc-view runs/a/trajectory.bftraj`
// shows the same plots as `brownfloc-view runs/a`); any other file is a lone trajectory with
// an empty run_directory. The optional files are looked for once, here.
#include <filesystem>

namespace brownfloc::viewer {

// The trajectory's name inside a run directory (sim/src/run_directory.hpp writes it).
inline constexpr const char* run_trajectory_file_name = "trajectory.bftraj";

struct RunLocation {
    std::filesystem::path trajectory;      // always set
    std::filesystem::path run_directory;   // empty for a lone trajectory file
    std::filesystem::path timeseries_csv;  // these three are empty when absent
    std::filesystem::path summary_json;
    std::filesystem::path lock_file;       // the writer's lock (run_directory/.lock)
};

// Throws ViewerInputError naming the path and what is expected: a path that does not exist, a
// directory without trajectory.bftraj, or something that is neither a directory nor a regular
// file (a FIFO, a device). Whether the trajectory's content is valid is checked when it is
// opened (LiveTrajectory), not here.
[[nodiscard]] RunLocation locate_run(const std::filesystem::path& run_dir_or_trajectory);

}  // namespace brownfloc::viewer
