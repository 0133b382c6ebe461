#pragma once
// The clusters of one frame, as the plots and the picking panel show them: size, whether the
// cluster spans the periodic box, radius of gyration; the size histogram; the largest cluster;
// and the fractal fit d_f, k0 of N = k0 (R_g/a)^d_f, computed exactly as the run computes
// summary.json's fractal_dimension (sim/src/run_recorder.cpp, cluster_rows() and fractal()):
//   - R_g of each non-spanning cluster's sphere centres (analysis::radius_of_gyration_m) in
//     metres, from the stored positions (clusters are stored whole, so no unwrapping),
//   - ClusterShape{size, R_g, spans} for every cluster in ascending id order (the engine's
//     order of bodies), spanning clusters with R_g 0,
//   - primary radius a = the mean radius of all particles, seed = the run's seed,
//   - analysis::fit_fractal_dimension.
// On the last frame of a run written in float64 this gives summary.json's numbers; from a
// float32 trajectory the positions carry a relative rounding of 2^-24, and so does R_g.
//
//   const FrameAnalysis a = analyse_frame(live.header(), frame, run_seed_from_scenario_text(live.header().scenario_toml));
//   if (const ClusterSummary* c = a.find(picked_cluster)) show(c->size, c->radius_of_gyration_nm);
//
// Pure functions of their arguments; thread-safe.
#include <cstdint>
#include <optional>
#include <string_view>
#include <utility>
#include <vector>

#include "analysis/fractal_fit.hpp"
#include "trajectory/trajectory_data.hpp"

namespace brownfloc::viewer {

struct ClusterSummary {
    std::uint32_t id = 0;  // canonical id = smallest member id
    std::int64_t size = 0;  // particles
    bool spans_box = false;
    // R_g of the member centres (nm; 0 for a monomer); none for a spanning cluster, whose
    // stored positions cannot be made continuous.
    std::optional<double> radius_of_gyration_nm;
};

struct FrameAnalysis {
    std::vector<ClusterSummary> clusters;                           // sorted by id
    std::vector<std::pair<std::int64_t, std::int64_t>> size_count;  // (size, clusters of that size), ascending size
    std::uint32_t largest_cluster_id = 0;                           // the largest; ties to the smallest id
    std::int64_t largest_size = 0;
    analysis::FractalFit fractal;  // same function and inputs as summary.json's fit
    double mean_radius_nm = 0.0;   // the primary radius a of the fit

    // The cluster with this id, or nullptr (an id that is no cluster's: not a canonical id).
    [[nodiscard]] const ClusterSummary* find(std::uint32_t cluster_id) const;
};

// Throws ViewerInputError if the frame's arrays do not fit the header (3N positions, N cluster
// ids each < N), a position is not finite, or the header has no particles or a radius that
// is not finite and > 0. (Frames from TrajectoryReader always fit.) A fit the analysis
// library refuses (coincident centres, an R_g that overflows) leaves the fit empty with its
// reason in fractal.note rather than throwing. seed: only the bootstrap error depends on it.
[[nodiscard]] FrameAnalysis analyse_frame(const trajectory::TrajectoryHeader& header,
                                          const trajectory::TrajectoryFrame& frame, std::uint64_t seed);

// The run's seed from the header's resolved scenario text: the line `seed = N` in the [run]
// table (written by the run from its int64 value), or 0 if there is none. Throws
// ViewerInputError naming the line when the value is not a whole number.
[[nodiscard]] std::uint64_t run_seed_from_scenario_text(std::string_view resolved_scenario_toml);

}  // namespace brownfloc::viewer
