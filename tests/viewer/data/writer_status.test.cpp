// Whether a run still writes: the lock seen in /proc/locks, and what it means for a torn tail.
#include <sys/file.h>
#include <unistd.h>

#include <catch2/catch.hpp>

#include "data/live_trajectory.hpp"
#include "data/writer_status.hpp"
#include "data_test_support.hpp"
#include "io/unique_fd.hpp"

using namespace brownfloc;
using Catch::Matchers::Contains;
using viewer::LiveTrajectory;
using viewer::locate_run;
using viewer::TailState;
using viewer::writer_holds_lock;

namespace {

// A run directory whose trajectory ends 40 bytes into its third frame.
void write_torn_run(const test::TempDir& dir) {
    std::uint64_t two_frames_bytes = 0;
    {
        trajectory::TrajectoryWriter writer = test::write_trajectory(dir / "whole.bftraj", 6, 2);
        two_frames_bytes = writer.bytes();
        writer.append(test::monomer_frame(6, 2));
    }
    const std::string whole = test::read_text(dir / "whole.bftraj");
    test::write_text(dir / "trajectory.bftraj", whole.substr(0, static_cast<std::size_t>(two_frames_bytes) + 40));
    std::filesystem::remove(dir / "whole.bftraj");
}

// The lock as `brownfloc run` takes it (sim/src/run_directory.cpp): the PID in the file and
// an exclusive flock held on it, here by this test process.
io::UniqueFd hold_lock(const std::filesystem::path& lock_file) {
    test::write_text(lock_file, std::to_string(::getpid()) + "\n");
    io::UniqueFd fd{::open(lock_file.c_str(), O_RDWR | O_CLOEXEC)};
    REQUIRE(fd);
    REQUIRE(::flock(fd.get(), LOCK_EX | LOCK_NB) == 0);
    return fd;
}

}  // namespace

TEST_CASE("a torn tail without a writer is an incomplete last frame", "[viewer][data][lock]") {
    const test::TempDir dir{"viewer-lock"};
    write_torn_run(dir);
    const LiveTrajectory live{locate_run(dir.path())};
    CHECK(live.frame_count() == 2);
    CHECK(live.tail_state() == TailState::incomplete_last_frame);
    CHECK_FALSE(live.writer_active());
    REQUIRE(live.warnings().size() == 1);
    CHECK_THAT(live.warnings()[0], Contains("frame 2 is torn"));
}

TEST_CASE("a torn tail while the writer holds its lock is a frame being written", "[viewer][data][lock]") {
    const test::TempDir dir{"viewer-lock"};
    write_torn_run(dir);
    io::UniqueFd lock = hold_lock(dir / ".lock");
    const LiveTrajectory live{locate_run(dir.path())};
    CHECK(writer_holds_lock(dir / ".lock"));
    CHECK(viewer::lock_file_pid(dir / ".lock") == ::getpid());
    CHECK(live.writer_active());
    CHECK(live.tail_state() == TailState::writing);

    REQUIRE(::flock(lock.get(), LOCK_UN) == 0);
    CHECK_FALSE(writer_holds_lock(dir / ".lock"));
    CHECK(viewer::lock_file_pid(dir / ".lock") == ::getpid());  // a finished run's PID stays in the file
    CHECK(live.tail_state() == TailState::incomplete_last_frame);
}

TEST_CASE("a file that ends with an intact frame is complete whether or not a writer is at work",
          "[viewer][data][lock]") {
    const test::TempDir dir{"viewer-lock"};
    (void)test::write_trajectory(dir / "trajectory.bftraj", 6, 2);
    const LiveTrajectory live{locate_run(dir.path())};
    CHECK(live.tail_state() == TailState::complete);
    const io::UniqueFd lock = hold_lock(dir / ".lock");
    CHECK(live.writer_active());
    CHECK(live.tail_state() == TailState::complete);
}

TEST_CASE("no lock is seen on a missing, unlocked or odd lock file", "[viewer][data][lock]") {
    const test::TempDir dir{"viewer-lock"};
    CHECK_FALSE(writer_holds_lock(""));
    CHECK_FALSE(writer_holds_lock(dir / ".lock"));
    CHECK_FALSE(viewer::lock_file_pid(dir / ".lock"));
    test::write_text(dir / ".lock", "not a pid\n");
    CHECK_FALSE(writer_holds_lock(dir / ".lock"));
    CHECK_FALSE(viewer::lock_file_pid(dir / ".lock"));
    CHECK_FALSE(writer_holds_lock(dir.path()));  // a directory
    // A lock on another file with the same PID is not this file's lock.
    const io::UniqueFd other = hold_lock(dir / "other.lock");
    test::write_text(dir / ".lock", std::to_string(::getpid()) + "\n");
    CHECK_FALSE(writer_holds_lock(dir / ".lock"));
}

TEST_CASE("a lone trajectory file has no writer to ask", "[viewer][data][lock]") {
    const test::TempDir dir{"viewer-lock"};
    write_torn_run(dir);
    std::filesystem::rename(dir / "trajectory.bftraj", dir / "lone.bftraj");
    const LiveTrajectory live{locate_run(dir / "lone.bftraj")};
    CHECK_FALSE(live.writer_active());
    CHECK(live.tail_state() == TailState::incomplete_last_frame);
}
