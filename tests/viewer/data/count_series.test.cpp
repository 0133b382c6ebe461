// The clusters/N0 series, from timeseries.csv or from the frames.
#include <catch2/catch.hpp>

#include <cmath>
#include <limits>
#include <span>
#include <string_view>

#include "data/count_series.hpp"
#include "data/viewer_input_error.hpp"
#include "run_files/csv_table.hpp"

using namespace brownfloc;
using Catch::Matchers::Contains;
using Catch::Matchers::WithinRel;
using viewer::CountSeries;

namespace {

run_files::CsvTable table_of(std::string_view text) {
    return run_files::parse_csv_table(std::as_bytes(std::span{text.data(), text.size()}), "runs/a/timeseries.csv");
}

}  // namespace

TEST_CASE("the count series from timeseries.csv divides every count by N0", "[viewer][data][counts]") {
    // The run's columns (sim/src/run_recorder.cpp), a row still being written at the end.
    const run_files::CsvTable table = table_of(
        "time_s,time_half_lives,clusters,monomers,smoluchowski_clusters,smoluchowski_clusters_transient\n"
        "0,0,200,200,200,200\n"
        "0.01,1,110,60,100,104.5\n"
        "0.02,2,70,25,66.666666666666667,70.25\n"
        "0.03,3,5");
    REQUIRE(table.torn_last_line);
    const CountSeries s = viewer::count_series_from_timeseries(table, 200);
    CHECK(s.from_timeseries_csv);
    CHECK(s.t_half_lives == std::vector<double>{0.0, 1.0, 2.0});
    // Tolerance: one division each (common practice: a few units of rounding).
    REQUIRE(s.clusters_over_n0.size() == 3);
    CHECK_THAT(s.clusters_over_n0[1], WithinRel(0.55, 1e-15));
    REQUIRE(s.smoluchowski_over_n0.size() == 3);
    CHECK_THAT(s.smoluchowski_over_n0[2], WithinRel(1.0 / 3.0, 1e-15));
    REQUIRE(s.smoluchowski_transient_over_n0.size() == 3);
    CHECK_THAT(s.smoluchowski_transient_over_n0[1], WithinRel(0.5225, 1e-15));
}

TEST_CASE("missing reference columns leave their curves empty", "[viewer][data][counts]") {
    const CountSeries s = viewer::count_series_from_timeseries(table_of("time_half_lives,clusters\n0,10\n1,6\n"), 10);
    CHECK(s.clusters_over_n0 == std::vector<double>{1.0, 0.6});
    CHECK(s.smoluchowski_over_n0.empty());
    CHECK(s.smoluchowski_transient_over_n0.empty());
}

TEST_CASE("a timeseries without the needed columns is refused naming the file and column",
          "[viewer][data][counts][validation]") {
    CHECK_THROWS_AS(viewer::count_series_from_timeseries(table_of("time_s,clusters\n0,10\n"), 10, "runs/a/timeseries.csv"),
                    viewer::ViewerInputError);
    CHECK_THROWS_WITH(viewer::count_series_from_timeseries(table_of("time_s,clusters\n0,10\n"), 10, "runs/a/timeseries.csv"),
                      Contains("runs/a/timeseries.csv: has no column \"time_half_lives\"") &&
                          Contains("(columns: time_s, clusters)"));
    CHECK_THROWS_WITH(viewer::count_series_from_timeseries(table_of("time_half_lives,clusters\n0,10\n"), 0),
                      Contains("N0 = 0"));
}

TEST_CASE("frame counts are sorted by time with the plain Smoluchowski reference", "[viewer][data][counts]") {
    viewer::FrameCountCollector collector;
    collector.add(0.02, 40);
    collector.add(0.0, 100);
    collector.add(0.01, 70);
    collector.add(0.01, 65);  // the same frame read again replaces its count
    CHECK(collector.size() == 3);
    const CountSeries s = collector.series(0.01, 100);
    CHECK_FALSE(s.from_timeseries_csv);
    REQUIRE(s.t_half_lives.size() == 3);
    CHECK(s.t_half_lives[0] == 0.0);
    CHECK_THAT(s.t_half_lives[2], WithinRel(2.0, 1e-15));
    CHECK(s.clusters_over_n0 == std::vector<double>{1.0, 0.65, 0.4});
    // Smoluchowski (1917), constant kernel: N/N0 = 1/(1 + t/t_half). Tolerance: rounding.
    CHECK_THAT(s.smoluchowski_over_n0[1], WithinRel(0.5, 1e-15));
    CHECK_THAT(s.smoluchowski_over_n0[2], WithinRel(1.0 / 3.0, 1e-15));
    CHECK(s.smoluchowski_transient_over_n0.empty());
    collector.clear();
    CHECK(collector.series(0.01, 100).t_half_lives.empty());
}

TEST_CASE("frame counts refuse times and half-lives that would give NaN", "[viewer][data][counts][validation]") {
    viewer::FrameCountCollector collector;
    CHECK_THROWS_WITH(collector.add(std::numeric_limits<double>::quiet_NaN(), 3), Contains("time_s = nan"));
    CHECK_THROWS_WITH(collector.add(-1.0, 3), Contains("time_s = -1: must be finite and >= 0"));
    collector.add(1.0, 3);
    CHECK_THROWS_WITH(collector.series(0.0, 10), Contains("fast_half_life_s = 0: must be finite and > 0"));
    CHECK_THROWS_WITH(collector.series(1.0, 0), Contains("N0 = 0"));
}
