// locate_run: a run directory, a trajectory file named directly, and what is refused.
#include <sys/stat.h>

#include <catch2/catch.hpp>

#include "data/run_location.hpp"
#include "data/viewer_input_error.hpp"
#include "data_test_support.hpp"

using namespace brownfloc;
using Catch::Matchers::Contains;
using viewer::locate_run;
using viewer::RunLocation;
using viewer::ViewerInputError;

TEST_CASE("a run directory gives its trajectory and the run files it holds", "[viewer][data][location]") {
    const test::TempDir dir{"viewer-location"};
    (void)test::write_trajectory(dir / "trajectory.bftraj", 4, 1);
    test::write_text(dir / "timeseries.csv", "time_s,clusters\n0,4\n");
    test::write_text(dir / "summary.json", "{}\n");
    test::write_text(dir / ".lock", "12345\n");
    const RunLocation where = locate_run(dir.path());
    CHECK(where.trajectory == dir / "trajectory.bftraj");
    CHECK(where.run_directory == dir.path());
    CHECK(where.timeseries_csv == dir / "timeseries.csv");
    CHECK(where.summary_json == dir / "summary.json");
    CHECK(where.lock_file == dir / ".lock");
}

TEST_CASE("run files a directory does not hold are left empty", "[viewer][data][location]") {
    const test::TempDir dir{"viewer-location"};
    (void)test::write_trajectory(dir / "trajectory.bftraj", 4, 1);
    const RunLocation where = locate_run(dir.path());
    CHECK(where.run_directory == dir.path());
    CHECK(where.timeseries_csv.empty());
    CHECK(where.summary_json.empty());
    CHECK(where.lock_file.empty());
}

TEST_CASE("a trajectory file elsewhere is a lone trajectory without a run directory", "[viewer][data][location]") {
    const test::TempDir dir{"viewer-location"};
    (void)test::write_trajectory(dir / "copy.bftraj", 4, 1);
    test::write_text(dir / "timeseries.csv", "time_s,clusters\n0,4\n");  // not its run: another name
    const RunLocation where = locate_run(dir / "copy.bftraj");
    CHECK(where.trajectory == dir / "copy.bftraj");
    CHECK(where.run_directory.empty());
    CHECK(where.timeseries_csv.empty());
    CHECK(where.summary_json.empty());
    CHECK(where.lock_file.empty());
}

TEST_CASE("a run's trajectory named directly keeps its run directory", "[viewer][data][location]") {
    const test::TempDir dir{"viewer-location"};
    (void)test::write_trajectory(dir / "trajectory.bftraj", 4, 1);
    test::write_text(dir / "summary.json", "{}\n");
    const RunLocation where = locate_run(dir / "trajectory.bftraj");
    CHECK(where.trajectory == dir / "trajectory.bftraj");
    CHECK(where.run_directory == dir.path());
    CHECK(where.summary_json == dir / "summary.json");
}

TEST_CASE("a directory without trajectory.bftraj is refused naming the directory and what is expected",
          "[viewer][data][location][validation]") {
    const test::TempDir dir{"viewer-location"};
    test::write_text(dir / "summary.json", "{}\n");
    CHECK_THROWS_MATCHES(locate_run(dir.path()), ViewerInputError,
                         Catch::Matchers::Predicate<ViewerInputError>([&](const ViewerInputError& e) {
                             const std::string text = e.what();
                             return text.find(dir.path().string()) == 0 &&
                                    text.find("not a run directory: it has no trajectory.bftraj") != std::string::npos &&
                                    text.find("give a run directory") != std::string::npos;
                         }));
}

TEST_CASE("a path that does not exist is refused naming it", "[viewer][data][location][validation]") {
    const test::TempDir dir{"viewer-location"};
    CHECK_THROWS_WITH(locate_run(dir / "nothing-here"),
                      Contains((dir / "nothing-here").string()) && Contains("no such file or directory"));
    CHECK_THROWS_WITH(locate_run(""), Contains("no run given"));
}

TEST_CASE("a FIFO is refused without opening it", "[viewer][data][location][validation]") {
    const test::TempDir dir{"viewer-location"};
    REQUIRE(::mkfifo((dir / "pipe").c_str(), 0600) == 0);
    CHECK_THROWS_WITH(locate_run(dir / "pipe"), Contains("pipe: a FIFO, neither a directory nor a regular file"));
}
