// wait_for_frame: for rendering a frame of a run that is still writing.
#include <catch2/catch.hpp>

#include <chrono>
#include <cmath>
#include <limits>
#include <thread>

#include "data/viewer_input_error.hpp"
#include "data/wait_for_frame.hpp"
#include "data_test_support.hpp"

using namespace brownfloc;
using Catch::Matchers::Contains;
using Clock = std::chrono::steady_clock;

namespace {

double seconds_since(Clock::time_point start) { return std::chrono::duration<double>(Clock::now() - start).count(); }

}  // namespace

TEST_CASE("waiting returns as soon as another thread appends the frame", "[viewer][data][wait]") {
    const test::TempDir dir{"viewer-wait"};
    trajectory::TrajectoryWriter writer = test::write_trajectory(dir / "trajectory.bftraj", 6, 1);
    viewer::LiveTrajectory live{viewer::locate_run(dir.path())};
    std::thread run{[&writer] {
        for (std::uint64_t k = 1; k < 3; ++k) {
            std::this_thread::sleep_for(std::chrono::milliseconds(150));
            writer.append(test::monomer_frame(6, k));
        }
    }};
    const Clock::time_point start = Clock::now();
    const bool arrived = viewer::wait_for_frame(live, 2, 20.0);
    const double waited_s = seconds_since(start);
    run.join();
    CHECK(arrived);
    CHECK(live.frame_count() == 3);
    // At least the writer's two pauses; far less than the timeout.
    CHECK(waited_s >= 0.29);
    CHECK(waited_s < 10.0);
}

TEST_CASE("waiting for a frame that never comes gives up at the timeout", "[viewer][data][wait]") {
    const test::TempDir dir{"viewer-wait"};
    (void)test::write_trajectory(dir / "trajectory.bftraj", 6, 2);
    viewer::LiveTrajectory live{viewer::locate_run(dir.path())};
    const Clock::time_point start = Clock::now();
    CHECK_FALSE(viewer::wait_for_frame(live, 5, 0.3));
    const double waited_s = seconds_since(start);
    CHECK(waited_s >= 0.3);
    CHECK(waited_s < 5.0);
}

TEST_CASE("a frame already there needs no wait", "[viewer][data][wait]") {
    const test::TempDir dir{"viewer-wait"};
    (void)test::write_trajectory(dir / "trajectory.bftraj", 6, 2);
    viewer::LiveTrajectory live{viewer::locate_run(dir.path())};
    CHECK(viewer::wait_for_frame(live, 1, 0.0));
    CHECK_FALSE(viewer::wait_for_frame(live, 2, 0.0));
}

TEST_CASE("a timeout that is not a finite number of seconds is refused", "[viewer][data][wait][validation]") {
    const test::TempDir dir{"viewer-wait"};
    (void)test::write_trajectory(dir / "trajectory.bftraj", 6, 1);
    viewer::LiveTrajectory live{viewer::locate_run(dir.path())};
    CHECK_THROWS_AS(viewer::wait_for_frame(live, 3, std::numeric_limits<double>::quiet_NaN()), viewer::ViewerInputError);
    CHECK_THROWS_WITH(viewer::wait_for_frame(live, 3, -1.0), Contains("timeout = -1 s: must be a finite number"));
    CHECK_THROWS_WITH(viewer::wait_for_frame(live, 3, std::numeric_limits<double>::infinity()), Contains("timeout = inf"));
}
