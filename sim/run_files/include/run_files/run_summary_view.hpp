#pragma once
// The keys of a run's summary.json that the viewer shows, checked for type and range. The
// run writes many more (see README.md); those are ignored here.
//
//   const RunSummaryView s = read_run_summary("runs/a/summary.json");
//   if (s.status == RunStatus::running && s.stability_ratio) show(*s.stability_ratio);
//
// A key that is missing or null leaves its field empty (the run writes null, with a
// `<key>_note`, for a value it could not compute, and a running run has not written some
// yet). A key of the wrong type or out of range is a RunFileError naming the key, its line
// and column, what it holds and what is allowed.
#include <cstdint>
#include <filesystem>
#include <optional>
#include <string>
#include <string_view>

#include "run_files/json_value.hpp"

namespace brownfloc::run_files {

enum class RunStatus { running, interrupted, complete };

struct RunSummaryView {
    std::optional<RunStatus> status;         // "running" | "interrupted" | "complete"
    std::optional<std::int64_t> particles;   // >= 1
    std::optional<std::uint64_t> seed;       // >= 0
    std::optional<std::int64_t> steps;       // >= 0
    std::optional<double> half_life_fast_s;  // > 0; the fast (Smoluchowski) half-life
    std::optional<double> time_step_s;       // > 0
    std::optional<double> box_length_nm;     // > 0
    std::optional<double> debye_length_nm;   // > 0
    std::optional<double> barrier_kT;
    std::optional<double> stability_ratio;           // Fuchs W
    std::optional<double> measured_stability_ratio;  // from the measured rate
    std::optional<double> fractal_dimension;
    std::optional<double> fractal_dimension_error;
    std::optional<double> fractal_prefactor;
    std::optional<std::string> fractal_dimension_note;
    std::optional<bool> percolating;
    std::optional<double> gel_time_s;
    std::optional<double> wall_time_s;
    std::optional<std::string> brownfloc_version;
};

// "running", "interrupted" or "complete".
[[nodiscard]] std::string_view run_status_name(RunStatus status);

// The view of a parsed summary (which must be an object); source_name is for messages only.
// Throws RunFileError.
[[nodiscard]] RunSummaryView run_summary_from_json(const JsonValue& summary, std::string_view source_name);

// read_json_file(path) (io::IoError, RunFileError), then run_summary_from_json.
[[nodiscard]] RunSummaryView read_run_summary(const std::filesystem::path& path);

}  // namespace brownfloc::run_files
