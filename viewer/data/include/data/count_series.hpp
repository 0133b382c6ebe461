#pragma once
// The clusters/N0 against t/t_half plot's data: the run's cluster count with the Smoluchowski
// references beside it.
//
// From timeseries.csv when the run directory has one (the run writes a row at every output
// time, with its own Smoluchowski curves, the plain and the transient-corrected one), else
// from the cluster_count of the frames, with the plain Smoluchowski curve as the reference.
//
//   CountSeries s = where.timeseries_csv.empty()
//       ? collector.series(live.header().fast_half_life_s, live.header().radius_nm.size())
//       : count_series_from_timeseries(run_files::read_csv_table(where.timeseries_csv), N0, where.timeseries_csv.string());
#include <cstddef>
#include <cstdint>
#include <string_view>
#include <utility>
#include <vector>

#include "run_files/csv_table.hpp"

namespace brownfloc::viewer {

struct CountSeries {
    std::vector<double> t_half_lives;                     // t / t_half (the fast half-life)
    std::vector<double> clusters_over_n0;                 // the run's clusters / N0
    std::vector<double> smoluchowski_over_n0;             // the reference; as many values as t_half_lives
    std::vector<double> smoluchowski_transient_over_n0;   // empty when not known (no CSV, or no such column)
    bool from_timeseries_csv = false;
};

// From timeseries.csv's columns time_half_lives and clusters (required) and
// smoluchowski_clusters, smoluchowski_clusters_transient (each left empty if the column is
// missing), every count divided by N0 = particle_count (the header's particle count). The
// CSV reader has already left out an unterminated last line. Throws ViewerInputError naming
// source_name and the missing column, or for particle_count 0.
[[nodiscard]] CountSeries count_series_from_timeseries(const run_files::CsvTable& table, std::size_t particle_count,
                                                       std::string_view source_name = "timeseries.csv");

// Cluster counts gathered from frames as they are read, in any order; a frame added again
// (same time) replaces the earlier value. Memory: one pair per distinct frame time.
class FrameCountCollector {
public:
    // time_s: the frame's time (finite, >= 0); cluster_count: its TrajectoryFrame::cluster_count.
    // Throws ViewerInputError for a time that is not finite or negative.
    void add(double time_s, std::uint32_t cluster_count);
    // Forget everything (after the trajectory was reloaded).
    void clear() { counts_.clear(); }
    [[nodiscard]] std::size_t size() const { return counts_.size(); }

    // Ascending in time. Reference: the constant-kernel Smoluchowski solution
    // N(t)/N0 = 1/(1 + t/t_half) (Smoluchowski 1917, Z. phys. Chem. 92, 129; t_half = the
    // fast half-life 2/(k N0)); no transient curve. fast_half_life_s finite and > 0,
    // particle_count > 0, else ViewerInputError.
    [[nodiscard]] CountSeries series(double fast_half_life_s, std::size_t particle_count) const;

private:
    std::vector<std::pair<double, std::uint32_t>> counts_;  // sorted by time
};

}  // namespace brownfloc::viewer
