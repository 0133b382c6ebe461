#pragma once
// `brownfloc run`: plans the run (time step, predicted steps), prepares the run directory,
// steps the engine with outputs, snapshots, checkpoints and progress, and writes the results:
//   scenario.toml (resolved), timeseries.csv, size_distribution.csv, trajectory.bftraj,
//   checkpoint.bfckpt, clusters.csv, summary.json (keys of the project's INTERFACES).
// `brownfloc run --resume` continues a run from its checkpoint, bit for bit.
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

struct ResumeOptions {
    std::string run_dir;
    int threads = 1;
    bool quiet = false;
    bool force = false;                // accept a checkpoint written by another build
    std::ostream* messages = nullptr;
};

struct RunResult {
    std::string output_dir;
    std::string summary_json;
    int interrupted_by = 0;      // SIGINT or SIGTERM: exit 128 + it
    bool checkpoint_written = false;  // ... after writing a checkpoint (not when set-up was cut short)
    bool already_complete = false;  // --resume of a finished run
};

// Checkpoints every this many seconds of wall-clock time unless [output]
// checkpoint_interval_wall_s says otherwise.
inline constexpr double default_checkpoint_interval_wall_s = 300.0;

// Throws InputError for bad input (exit 2), EnvironmentError or io::IoError for I/O problems
// (exit 3), CheckpointFormatError / TrajectoryFormatError for damaged files (exit 2).
RunResult execute_run(const Scenario& scenario, const RunOptions& options);
RunResult resume_run(const ResumeOptions& options);

// The exit code of a run interrupted by a signal: 128 + its number (130 SIGINT, 143 SIGTERM).
[[nodiscard]] inline int exit_code_for_interruption(int signal_number) { return 128 + signal_number; }

// The default run directory for a scenario path and seed.
[[nodiscard]] std::string default_run_directory(const std::string& scenario_path, std::uint64_t seed);

}  // namespace brownfloc::sim
