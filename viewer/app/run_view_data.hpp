#pragma once
// What both the window and --render need from a run before drawing: the followed trajectory,
// the seed for the fractal fit's bootstrap, the count series for the clusters plot, and the
// state notes ("writing...", damaged frames skipped).
#include <filesystem>
#include <memory>
#include <optional>
#include <string>
#include <vector>

#include "data/count_series.hpp"
#include "data/frame_loader.hpp"
#include "data/live_trajectory.hpp"

namespace brownfloc::viewer {

// Opens the run directory or trajectory file; ViewerInputError (exit 2) when it cannot be shown.
[[nodiscard]] std::shared_ptr<LiveTrajectory> open_run(const std::filesystem::path& run);

// The clusters/N0 series: from timeseries.csv when the run has one, else from every frame's
// cluster count (read one frame at a time).
[[nodiscard]] CountSeries load_count_series(const LiveTrajectory& trajectory);

// Reads frame k and analyses it now, on the calling thread (for --render and exports; the
// window's browsing goes through FrameLoader). Throws what reading or analysis throws.
[[nodiscard]] LoadedFrame load_frame_now(const LiveTrajectory& trajectory, std::size_t k, std::uint64_t seed);

// Notes on the state of the file, for the warning lines of the scene.
[[nodiscard]] std::vector<std::string> trajectory_notes(const LiveTrajectory& trajectory);

// From summary.json, when the run directory has one: "run interrupted: continue it with
// brownfloc run --resume", "run in progress", or nothing for a complete run (or a summary
// that cannot be read: the trajectory is what the viewer shows).
[[nodiscard]] std::optional<std::string> run_status_note(const LiveTrajectory& trajectory);

}  // namespace brownfloc::viewer
