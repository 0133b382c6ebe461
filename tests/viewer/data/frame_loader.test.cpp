// FrameLoader: frames read and analysed on its thread, the newest request first, a small cache.
#include <catch2/catch.hpp>

#include <chrono>
#include <memory>
#include <stdexcept>
#include <thread>

#include "data/frame_loader.hpp"
#include "data_test_support.hpp"
#include "trajectory/trajectory_format.hpp"

using namespace brownfloc;
using Catch::Matchers::Contains;
using viewer::FrameLoader;
using viewer::LiveTrajectory;
using viewer::LoadedFrame;

namespace {

std::shared_ptr<LiveTrajectory> open_live(const test::TempDir& dir) {
    return std::make_shared<LiveTrajectory>(viewer::locate_run(dir.path()));
}

std::optional<LoadedFrame> next_ready(FrameLoader& loader) {
    return test::eventually([&] { return loader.take_ready(); });
}

}  // namespace

TEST_CASE("a requested frame arrives decoded and analysed", "[viewer][data][loader]") {
    const test::TempDir dir{"viewer-loader"};
    (void)test::write_trajectory(dir / "trajectory.bftraj", 10, 4);
    const auto live = open_live(dir);
    FrameLoader loader{live};
    loader.request(3);
    const std::optional<LoadedFrame> loaded = next_ready(loader);
    REQUIRE(loaded);
    CHECK(loaded->index == 3);
    CHECK(loaded->info.frame_number == 3);
    REQUIRE(loaded->frame);
    CHECK(*loaded->frame == test::monomer_frame(10, 3));  // float64 storage: exact
    REQUIRE(loaded->analysis);
    CHECK(loaded->analysis->clusters.size() == 10);
    CHECK(loaded->analysis->largest_size == 1);
    CHECK_FALSE(loader.take_ready());  // handed out once
    CHECK_FALSE(loader.take_error());
    CHECK(loader.frames_read() == 1);
}

TEST_CASE("a frame asked for again comes from the cache at once", "[viewer][data][loader][cache]") {
    const test::TempDir dir{"viewer-loader"};
    (void)test::write_trajectory(dir / "trajectory.bftraj", 10, 8);
    const auto live = open_live(dir);
    FrameLoader loader{live};
    for (std::size_t k = 0; k < 5; ++k) {
        loader.request(k);
        REQUIRE(next_ready(loader));
    }
    CHECK(loader.frames_read() == 5);
    // The last four are cached: ready as soon as request() returns, without the worker.
    loader.request(2);
    std::optional<LoadedFrame> again = loader.take_ready();
    REQUIRE(again);
    CHECK(again->index == 2);
    CHECK(*again->frame == test::monomer_frame(10, 2));
    // Frame 0 was the least recently used of five: dropped, so it is read again.
    loader.request(0);
    REQUIRE(next_ready(loader));
    CHECK(loader.frames_read() == 6);
}

TEST_CASE("the newest request wins and older ones not yet started are dropped", "[viewer][data][loader]") {
    const test::TempDir dir{"viewer-loader"};
    // 4000 particles: each frame takes the worker far longer to read than 40 requests take.
    (void)test::write_trajectory(dir / "trajectory.bftraj", 4000, 40);
    const auto live = open_live(dir);
    FrameLoader loader{live};
    for (std::size_t k = 0; k < 40; ++k) loader.request(k);
    std::optional<LoadedFrame> last;
    const bool newest_arrived = static_cast<bool>(test::eventually([&]() -> std::optional<bool> {
        if (std::optional<LoadedFrame> loaded = loader.take_ready()) last = loaded;
        if (last && last->index == 39) return true;
        return std::nullopt;
    }));
    REQUIRE(newest_arrived);
    CHECK(*last->frame == test::monomer_frame(4000, 39));
    // Nothing older turns up after the newest.
    std::this_thread::sleep_for(std::chrono::milliseconds(200));
    CHECK_FALSE(loader.take_ready());
    // Requests overtaken before the worker took them up were never read. (The worker could
    // only read all 40 if this thread were descheduled after every single request.)
    CHECK(loader.frames_read() < 40);
}

TEST_CASE("a frame damaged after it was indexed gives an error and is skipped", "[viewer][data][loader][validation]") {
    const test::TempDir dir{"viewer-loader"};
    (void)test::write_trajectory(dir / "trajectory.bftraj", 10, 3);
    const auto live = open_live(dir);
    const trajectory::FrameInfo info = live->frame_info(1);
    test::flip_byte(dir / "trajectory.bftraj", info.offset_bytes + trajectory::format::frame_header_bytes + 20);
    FrameLoader loader{live};
    loader.request(1);
    const std::optional<std::string> error = test::eventually([&] { return loader.take_error(); });
    REQUIRE(error);
    CHECK_THAT(*error, Contains((dir / "trajectory.bftraj").string() + ": byte " + std::to_string(info.offset_bytes)) &&
                           Contains("frame 1 (index 1) is damaged or changed since it was indexed"));
    CHECK_FALSE(loader.take_ready());
    loader.request(2);  // the others still load
    const std::optional<LoadedFrame> loaded = next_ready(loader);
    REQUIRE(loaded);
    CHECK(loaded->index == 2);
}

TEST_CASE("after a reload the loader reads the new file, not its cache", "[viewer][data][loader][live]") {
    const test::TempDir dir{"viewer-loader"};
    (void)test::write_trajectory(dir / "trajectory.bftraj", 10, 2);
    const auto live = open_live(dir);
    FrameLoader loader{live};
    loader.request(0);
    REQUIRE(next_ready(loader));

    // Another run with other positions, renamed over the file: same frame number, same offset.
    {
        trajectory::TrajectoryWriter other =
            trajectory::TrajectoryWriter::create(dir / "other.bftraj", test::viewer_header(10), true);
        trajectory::TrajectoryFrame shifted = test::monomer_frame(10, 0);
        shifted.positions_nm[0] += 1.0;
        other.append(shifted);
    }
    std::filesystem::rename(dir / "other.bftraj", dir / "trajectory.bftraj");
    REQUIRE(live->poll().reloaded);
    loader.request(0);
    const std::optional<LoadedFrame> loaded = next_ready(loader);
    REQUIRE(loaded);
    CHECK(loaded->frame->positions_nm[0] == test::monomer_frame(10, 0).positions_nm[0] + 1.0);
}

TEST_CASE("a request past the last frame is refused", "[viewer][data][loader][validation]") {
    const test::TempDir dir{"viewer-loader"};
    (void)test::write_trajectory(dir / "trajectory.bftraj", 10, 2);
    FrameLoader loader{open_live(dir)};
    CHECK_THROWS_AS(loader.request(2), std::out_of_range);
    CHECK_THROWS_AS(FrameLoader{nullptr}, std::invalid_argument);
}
