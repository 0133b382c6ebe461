#pragma once
// `brownfloc run`: plans the run (time step, predicted steps), prepares the run directory,
// steps the engine with outputs and progress, and writes the results:
//   scenario.toml (resolved), timeseries.csv, size_distribution.csv, clusters.csv,
//   summary.json (keys of the project's INTERFACES).
#include <cstdint>
#include <optional>
#include <ostream>
#include <string>

#include "sim/scenario.hpp"

namespace brownfloc::sim {

struct RunOptions {
    std::string output_dir;           // empty: runs/<scenario stem>-seed<S>
    bool overwrite = false;           // replace a directory that holds another run
    std::optional<std::uint64_t> seed;  // replaces [run] seed
    int threads = 1;
    bool quiet = false;               // no progress lines
    std::ostream* messages = nullptr;  // progress and notices (stderr); null: none
};

struct RunResult {
    std::string output_dir;
    std::string summary_json;
};

// Throws InputError for bad input (exit 2) and EnvironmentError for I/O problems (exit 3).
RunResult execute_run(const Scenario& scenario, const RunOptions& options);

// The default run directory for a scenario path and seed.
[[nodiscard]] std::string default_run_directory(const std::string& scenario_path, std::uint64_t seed);

}  // namespace brownfloc::sim
