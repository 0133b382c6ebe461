#pragma once
// The subcommands of `brownfloc`, free of CLI11 so that only main.cpp pays for it.
#include <cstdint>
#include <optional>
#include <string>
#include <vector>

namespace brownfloc::app {

// Exit codes (the project's INTERFACES): 0 ok, 1 internal error, 2 bad input,
// 3 environment or I/O.
inline constexpr int exit_ok = 0, exit_internal = 1, exit_bad_input = 2, exit_io = 3;

struct CommonOptions {
    std::string scenario_path;
    std::vector<std::string> set_overrides;  // "section.key=value"
    bool json = false;
};

struct DlvoOptions {
    CommonOptions common;
    std::string curve_path;  // empty: no curve file
};

struct RunCommandOptions {
    CommonOptions common;
    std::string output_dir;  // empty: runs/<scenario stem>-seed<S>
    std::optional<std::uint64_t> seed;
    int threads = 0;  // 0: OMP_NUM_THREADS, else all cores
    bool quiet = false;
    bool overwrite = false;
    std::string resume_dir;  // --resume RUN_DIR
    bool force = false;      // --force (with --resume)
};

struct ShelfLifeCommandOptions {
    CommonOptions common;
    std::string plot_path;  // empty: no plot
};

struct ExportOptions {
    std::string run_dir;
    std::string frame = "last";  // "last" or a frame number
    std::string format = "csv";
    std::string output_path;     // empty: standard output
};

// Each returns the exit code; input errors propagate as brownfloc::InputError.
int run_dlvo(const DlvoOptions& options);
int run_ccc(const CommonOptions& options);
int run_run(const RunCommandOptions& options);
int run_export(const ExportOptions& options);
int run_shelf_life(const ShelfLifeCommandOptions& options);

}  // namespace brownfloc::app
