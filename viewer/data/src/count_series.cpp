#include "data/count_series.hpp"

#include <algorithm>
#include <cmath>
#include <string>

#include "data/viewer_input_error.hpp"
#include "io/message_text.hpp"

namespace brownfloc::viewer {
namespace {

std::vector<double> column_over(const run_files::CsvTable& table, int column, double n0) {
    std::vector<double> values;
    if (column < 0) return values;
    values.reserve(table.row_count);
    for (std::size_t row = 0; row < table.row_count; ++row)
        values.push_back(table.at(row, static_cast<std::size_t>(column)) / n0);
    return values;
}

int required_column(const run_files::CsvTable& table, std::string_view name, std::string_view source_name) {
    const int column = table.column_index(name);
    if (column >= 0) return column;
    std::string columns;
    for (const std::string& present : table.columns) {
        if (!columns.empty()) columns += ", ";
        columns += present;
    }
    throw ViewerInputError(io::message(source_name, ": has no column \"", name,
                                       "\", which the cluster-count plot needs (columns: ", columns, ")"));
}

}  // namespace

CountSeries count_series_from_timeseries(const run_files::CsvTable& table, std::size_t particle_count,
                                         std::string_view source_name) {
    if (particle_count == 0)
        throw ViewerInputError(io::message(source_name, ": cannot divide the cluster counts by N0 = 0 particles"));
    const double n0 = static_cast<double>(particle_count);
    CountSeries series;
    series.from_timeseries_csv = true;
    series.t_half_lives = column_over(table, required_column(table, "time_half_lives", source_name), 1.0);
    series.clusters_over_n0 = column_over(table, required_column(table, "clusters", source_name), n0);
    series.smoluchowski_over_n0 = column_over(table, table.column_index("smoluchowski_clusters"), n0);
    series.smoluchowski_transient_over_n0 = column_over(table, table.column_index("smoluchowski_clusters_transient"), n0);
    return series;
}

void FrameCountCollector::add(double time_s, std::uint32_t cluster_count) {
    if (!std::isfinite(time_s) || time_s < 0.0)
        throw ViewerInputError(io::message("frame cluster counts: time_s = ", time_s, ": must be finite and >= 0"));
    const auto at = std::lower_bound(counts_.begin(), counts_.end(), time_s,
                                     [](const std::pair<double, std::uint32_t>& entry, double t) { return entry.first < t; });
    if (at != counts_.end() && at->first == time_s)
        at->second = cluster_count;
    else
        counts_.insert(at, {time_s, cluster_count});
}

CountSeries FrameCountCollector::series(double fast_half_life_s, std::size_t particle_count) const {
    if (!std::isfinite(fast_half_life_s) || fast_half_life_s <= 0.0)
        throw ViewerInputError(
            io::message("frame cluster counts: fast_half_life_s = ", fast_half_life_s, ": must be finite and > 0"));
    if (particle_count == 0) throw ViewerInputError("frame cluster counts: cannot divide by N0 = 0 particles");
    const double n0 = static_cast<double>(particle_count);
    CountSeries series;
    for (const auto& [time_s, clusters] : counts_) {
        const double t = time_s / fast_half_life_s;
        if (!std::isfinite(t))
            throw ViewerInputError(io::message("frame cluster counts: time_s = ", time_s, " over fast_half_life_s = ",
                                               fast_half_life_s, " is not a finite number of half-lives"));
        series.t_half_lives.push_back(t);
        series.clusters_over_n0.push_back(static_cast<double>(clusters) / n0);
        series.smoluchowski_over_n0.push_back(1.0 / (1.0 + t));
    }
    return series;
}

}  // namespace brownfloc::viewer
