// LiveTrajectory following a file that a run appends to, cuts back, or replaces.
#include <catch2/catch.hpp>

#include <filesystem>

#include "data/live_trajectory.hpp"
#include "data_test_support.hpp"
#include "trajectory/trajectory_error.hpp"

using namespace brownfloc;
using Catch::Matchers::Contains;
using viewer::LiveTrajectory;
using viewer::locate_run;
using viewer::PollResult;

TEST_CASE("poll reports the frames a run appends and costs nothing when the file did not change",
          "[viewer][data][live]") {
    const test::TempDir dir{"viewer-live"};
    trajectory::TrajectoryWriter writer = test::write_trajectory(dir / "trajectory.bftraj", 6, 2);
    LiveTrajectory live{locate_run(dir.path())};
    CHECK(live.frame_count() == 2);
    CHECK(live.header() == test::viewer_header(6));
    PollResult nothing = live.poll();
    CHECK(nothing.frames_added == 0);
    CHECK_FALSE(nothing.reloaded);

    for (std::uint64_t k = 2; k < 5; ++k) writer.append(test::monomer_frame(6, k));
    const PollResult grown = live.poll();
    CHECK(grown.frames_added == 3);
    CHECK_FALSE(grown.reloaded);
    REQUIRE(live.frame_count() == 5);
    CHECK(live.read_frame(4) == test::monomer_frame(6, 4));
    CHECK(live.frame_info(4).time_s == test::monomer_frame(6, 4).time_s);
    CHECK(live.poll().frames_added == 0);
    CHECK(live.generation() == 0);
    CHECK(live.warnings().empty());
}

TEST_CASE("a file cut back by a resumed run is reloaded", "[viewer][data][live][resume]") {
    const test::TempDir dir{"viewer-live"};
    std::uint64_t two_frames_bytes = 0;
    {
        trajectory::TrajectoryWriter writer = test::write_trajectory(dir / "trajectory.bftraj", 6, 2);
        two_frames_bytes = writer.bytes();
        for (std::uint64_t k = 2; k < 5; ++k) writer.append(test::monomer_frame(6, k));
    }
    LiveTrajectory live{locate_run(dir.path())};
    REQUIRE(live.frame_count() == 5);

    SECTION("cut back only") {
        std::filesystem::resize_file(dir / "trajectory.bftraj", two_frames_bytes);
        const PollResult result = live.poll();
        CHECK(result.reloaded);
        CHECK(result.frames_added == 2);  // on a reload every frame of the new index counts
        CHECK(live.frame_count() == 2);
        CHECK(live.generation() == 1);
    }
    SECTION("cut back and appended past the old end before the next poll") {
        trajectory::TrajectoryWriter resumed =
            trajectory::TrajectoryWriter::reopen_for_append(dir / "trajectory.bftraj", two_frames_bytes, 2);
        // Frames that differ from the ones cut off (a resume with other settings), so that
        // the frame that was last before has changed too.
        for (std::uint64_t k = 2; k < 7; ++k) {
            trajectory::TrajectoryFrame different = test::monomer_frame(6, k);
            different.positions_nm[0] += 0.5;
            resumed.append(different);
        }
        const PollResult result = live.poll();
        CHECK(result.reloaded);
        CHECK(result.frames_added == 7);
        REQUIRE(live.frame_count() == 7);
        CHECK(live.read_frame(2).positions_nm[0] == test::monomer_frame(6, 2).positions_nm[0] + 0.5);
    }
}

TEST_CASE("a file replaced by another (a new inode) is reopened", "[viewer][data][live]") {
    const test::TempDir dir{"viewer-live"};
    (void)test::write_trajectory(dir / "trajectory.bftraj", 6, 3);
    LiveTrajectory live{locate_run(dir.path())};
    REQUIRE(live.frame_count() == 3);
    const viewer::FileIdentity before = live.file_identity();

    // Another run of 9 particles, written beside it and renamed over it.
    (void)test::write_trajectory(dir / "other.bftraj", 9, 1);
    std::filesystem::rename(dir / "other.bftraj", dir / "trajectory.bftraj");
    const PollResult result = live.poll();
    CHECK(result.reloaded);
    CHECK(result.frames_added == 1);
    CHECK(live.frame_count() == 1);
    CHECK(live.header().radius_nm.size() == 9);
    CHECK_FALSE(live.file_identity() == before);
    CHECK(live.generation() == 1);
    CHECK(live.read_frame(0) == test::monomer_frame(9, 0));
}

TEST_CASE("a replacement that is not a trajectory yet keeps the old frames and says why", "[viewer][data][live]") {
    const test::TempDir dir{"viewer-live"};
    (void)test::write_trajectory(dir / "trajectory.bftraj", 6, 3);
    LiveTrajectory live{locate_run(dir.path())};
    test::write_text(dir / "other.bftraj", "BFLOC");  // a header still being written
    std::filesystem::rename(dir / "other.bftraj", dir / "trajectory.bftraj");
    const PollResult result = live.poll();
    CHECK_FALSE(result.reloaded);
    CHECK(live.frame_count() == 3);
    REQUIRE_FALSE(live.warnings().empty());
    CHECK_THAT(live.warnings().back(), Contains("trajectory.bftraj: was replaced, and the new file cannot be read (yet)"));

    (void)test::write_trajectory(dir / "third.bftraj", 5, 2);
    std::filesystem::rename(dir / "third.bftraj", dir / "trajectory.bftraj");
    CHECK(live.poll().reloaded);
    CHECK(live.frame_count() == 2);
    CHECK(live.warnings().empty());
}

TEST_CASE("a file that vanishes keeps its frames with a warning", "[viewer][data][live]") {
    const test::TempDir dir{"viewer-live"};
    (void)test::write_trajectory(dir / "trajectory.bftraj", 6, 3);
    LiveTrajectory live{locate_run(dir.path())};
    std::filesystem::remove(dir / "trajectory.bftraj");
    CHECK(live.poll().frames_added == 0);
    CHECK(live.frame_count() == 3);
    CHECK(live.read_frame(1) == test::monomer_frame(6, 1));  // the open descriptor still reads it
    REQUIRE_FALSE(live.warnings().empty());
    CHECK_THAT(live.warnings().back(), Contains("the file is gone"));
}

TEST_CASE("a file that is not a trajectory is refused when opened", "[viewer][data][live][validation]") {
    const test::TempDir dir{"viewer-live"};
    test::write_text(dir / "trajectory.bftraj", "PK\x03\x04 a zip archive");
    CHECK_THROWS_AS(LiveTrajectory{locate_run(dir.path())}, trajectory::TrajectoryFormatError);
    CHECK_THROWS_WITH(LiveTrajectory{locate_run(dir.path())},
                      Contains("trajectory.bftraj: byte 0: not a brownfloc trajectory"));
}
