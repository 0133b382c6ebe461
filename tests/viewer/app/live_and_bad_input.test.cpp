// --render against a trajectory that is still being written (--wait), and the inputs it must
// refuse with exit 2: a missing run, a damaged header, a trajectory with no frame yet, a frame
// number beyond the last, an unknown cluster id.
#include <catch2/catch.hpp>

#include <SFML/Graphics/Image.hpp>

#include <chrono>
#include <fstream>
#include <sstream>
#include <thread>

#include "../../support/temp_dir.hpp"
#include "documented_camera.hpp"
#include "hand_built_runs.hpp"
#include "headless_render.hpp"
#include "render_checks.hpp"
#include "run_view_data.hpp"
#include "view_options.hpp"
#include "viewer_errors.hpp"

using namespace brownfloc;
using test::PlacedSphere;
using viewer::ViewOptions;

namespace {

constexpr double c = test::hand_box_nm / 2;

ViewOptions options_for(const std::filesystem::path& run, const std::filesystem::path& png) {
    ViewOptions options;
    options.run = run;
    options.render_png = png;
    options.size = {640, 480};
    options.colour = viewer::ColourMode::species;
    return options;
}

int render_status(const ViewOptions& options, std::string& messages) {
    std::ostringstream out, err;
    try {
        const int status = viewer::render_headless(options, out, err);
        messages = err.str();
        return status;
    } catch (const viewer::ViewerInputError& error) {
        messages = error.what();
        return viewer::exit_bad_input;
    } catch (const viewer::ViewerUsageError& error) {
        messages = error.what();
        return viewer::exit_bad_input;
    }
}

}  // namespace

TEST_CASE("with --wait a render returns frame K while a writer is still appending it", "[viewer][live]") {
    const test::TempDir dir("bfview");
    std::filesystem::create_directories(dir / "run");
    // Frame k holds one sphere at x = c - 200 + 100 k: where it lands tells which frame was drawn.
    auto frame_spheres = [](int k) { return std::vector<PlacedSphere>{{c - 200 + 100.0 * k, c, c, 30.0, 0, 0}}; };
    trajectory::TrajectoryWriter writer =
        trajectory::TrajectoryWriter::create(dir / "run" / "trajectory.bftraj", test::hand_header(frame_spheres(0)), false);
    writer.append(test::hand_frame(frame_spheres(0), 0.0, 0));
    writer.sync();
    std::thread appender([&] {
        for (int k = 1; k <= 3; ++k) {
            std::this_thread::sleep_for(std::chrono::milliseconds(400));
            writer.append(test::hand_frame(frame_spheres(k), k * test::hand_half_life_s, k * 10));
            writer.sync();
        }
    });
    ViewOptions options = options_for(dir / "run", dir / "live.png");
    options.frame = viewer::FrameChoice{false, 3};
    options.wait_s = 20.0;
    options.camera = viewer::CameraPose{0.0, 0.0, 2.6, {}};
    std::string messages;
    const auto start = std::chrono::steady_clock::now();
    const int status = render_status(options, messages);
    const double waited_s = std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
    appender.join();
    REQUIRE(status == 0);
    CHECK(waited_s < 15.0);
    sf::Image image;
    REQUIRE(image.loadFromFile((dir / "live.png").string()));
    const test::Predicted p = test::predict(c + 100, c, c, 30.0, 0, 0, 2.6, test::hand_box_nm, 640, 480);
    const test::Blob blob = test::sphere_blob(image, int(p.x_px), int(p.y_px), int(p.radius_px) + 5);
    REQUIRE(blob.area > 0);
    CHECK(std::abs(blob.centre_x_px - p.x_px) <= 1.0);
}

TEST_CASE("with --wait a render gives up after its time with a clear error when the frame never comes", "[viewer][live]") {
    const test::TempDir dir("bfview");
    test::write_hand_run(dir / "run", {{PlacedSphere{c, c, c, 30.0, 0, 0}}});
    ViewOptions options = options_for(dir / "run", dir / "never.png");
    options.frame = viewer::FrameChoice{false, 5};
    options.wait_s = 0.3;
    std::string messages;
    CHECK(render_status(options, messages) == viewer::exit_bad_input);
    CHECK_THAT(messages, Catch::Contains("--frame 5") && Catch::Contains("1 intact frame"));
    CHECK_FALSE(std::filesystem::exists(dir / "never.png"));
}

TEST_CASE("a missing run or a damaged or empty trajectory is refused with exit 2", "[viewer][bad_input]") {
    const test::TempDir dir("bfview");
    std::string messages;
    CHECK(render_status(options_for(dir / "absent", dir / "x.png"), messages) == viewer::exit_bad_input);
    CHECK_THAT(messages, Catch::Contains("absent"));

    std::filesystem::create_directories(dir / "damaged");
    std::ofstream(dir / "damaged" / "trajectory.bftraj") << "this is not a trajectory file at all, just text";
    CHECK(render_status(options_for(dir / "damaged", dir / "x.png"), messages) == viewer::exit_bad_input);
    CHECK_THAT(messages, Catch::Contains("trajectory.bftraj"));

    std::filesystem::create_directories(dir / "empty");
    {
        auto writer = trajectory::TrajectoryWriter::create(dir / "empty" / "trajectory.bftraj",
                                                           test::hand_header({PlacedSphere{c, c, c, 30.0, 0, 0}}), false);
    }
    CHECK(render_status(options_for(dir / "empty", dir / "x.png"), messages) == viewer::exit_bad_input);
    CHECK_THAT(messages, Catch::Contains("no intact frame yet"));
    CHECK_FALSE(std::filesystem::exists(dir / "x.png"));
}

TEST_CASE("a cluster id that is not in the frame is refused naming the largest", "[viewer][bad_input]") {
    const test::TempDir dir("bfview");
    test::write_hand_run(dir / "run", {{PlacedSphere{c, c, c, 30.0, 0, 0}, PlacedSphere{c + 60, c, c, 30.0, 0, 0}}});
    ViewOptions options = options_for(dir / "run", dir / "x.png");
    options.select.cluster_id = 1;  // particle 1 belongs to cluster 0
    std::string messages;
    CHECK(render_status(options, messages) == viewer::exit_bad_input);
    CHECK_THAT(messages, Catch::Contains("--select 1") && Catch::Contains("largest cluster is 0"));
}

TEST_CASE("a sequence writes every K-th frame and never overwrites", "[viewer][sequence]") {
    const test::TempDir dir("bfview");
    std::vector<std::vector<PlacedSphere>> frames;
    for (int k = 0; k < 5; ++k) frames.push_back({PlacedSphere{c - 200 + 100.0 * k, c, c, 30.0, 0, 0}});
    test::write_hand_run(dir / "run", frames);
    ViewOptions options = options_for(dir / "run", dir / "last.png");
    options.sequence_dir = dir / "frames";
    options.sequence_every = 2;
    std::string messages;
    REQUIRE(render_status(options, messages) == 0);
    CHECK(std::filesystem::exists(dir / "frames" / "frame_000000.png"));
    CHECK(std::filesystem::exists(dir / "frames" / "frame_000002.png"));
    CHECK(std::filesystem::exists(dir / "frames" / "frame_000004.png"));
    CHECK_FALSE(std::filesystem::exists(dir / "frames" / "frame_000001.png"));
    const auto size_before = std::filesystem::file_size(dir / "frames" / "frame_000000.png");
    std::ostringstream out, err;
    CHECK_THROWS_WITH(viewer::render_headless(options, out, err), Catch::Contains("never overwritten"));
    CHECK(std::filesystem::file_size(dir / "frames" / "frame_000000.png") == size_before);
    // no temporary file left behind
    for (const auto& entry : std::filesystem::directory_iterator(dir / "frames"))
        CHECK(entry.path().filename().string().rfind("frame_", 0) == 0);
}

TEST_CASE("an interrupted or running run says so from its summary.json", "[viewer][live]") {
    const test::TempDir dir("bfview");
    test::write_hand_run(dir / "run", {{PlacedSphere{c, c, c, 30.0, 0, 0}}});
    CHECK_FALSE(viewer::run_status_note(*viewer::open_run(dir / "run")).has_value());  // no summary.json
    std::ofstream(dir / "run" / "summary.json") << R"({"status": "interrupted", "particles": 1})";
    CHECK_THAT(viewer::run_status_note(*viewer::open_run(dir / "run")).value_or(""),
               Catch::Contains("brownfloc run --resume"));
    std::ofstream(dir / "run" / "summary.json") << R"({"status": "running"})";
    CHECK(viewer::run_status_note(*viewer::open_run(dir / "run")).value_or("") == "run in progress");
    std::ofstream(dir / "run" / "summary.json") << R"({"status": "complete"})";
    CHECK_FALSE(viewer::run_status_note(*viewer::open_run(dir / "run")).has_value());
    std::ofstream(dir / "run" / "summary.json") << R"({"status": )";  // damaged: ignored
    CHECK_FALSE(viewer::run_status_note(*viewer::open_run(dir / "run")).has_value());
}

TEST_CASE("a trajectory file alone renders and a damaged frame is skipped with a note", "[viewer][bad_input]") {
    const test::TempDir dir("bfview");
    std::vector<std::vector<PlacedSphere>> frames;
    for (int k = 0; k < 3; ++k) frames.push_back({PlacedSphere{c - 100 + 100.0 * k, c, c, 30.0, 0, 0}});
    test::write_hand_run(dir / "alone", frames);
    const std::filesystem::path file = dir / "alone" / "trajectory.bftraj";
    // Flip one byte inside frame 1's payload. Layout (DEVELOPERS.md): a 32-byte file header whose
    // bytes 16-23 hold the header payload length; then frames of a 32-byte header and a payload,
    // all three the same size here.
    {
        std::fstream f(file, std::ios::in | std::ios::out | std::ios::binary);
        unsigned char length_bytes[8];
        f.seekg(16);
        f.read(reinterpret_cast<char*>(length_bytes), 8);
        std::uint64_t header_payload = 0;
        for (int i = 0; i < 8; ++i) header_payload |= std::uint64_t(length_bytes[i]) << (8 * i);
        const std::uint64_t frames_start = 32 + header_payload;
        const std::uint64_t frame_bytes = (std::filesystem::file_size(file) - frames_start) / 3;
        const auto at = std::streamoff(frames_start + frame_bytes + 32 + 5);
        char byte = 0;
        f.seekg(at);
        f.read(&byte, 1);
        byte = char(byte ^ 0x5A);
        f.seekp(at);
        f.write(&byte, 1);
    }
    const std::shared_ptr<viewer::LiveTrajectory> trajectory = viewer::open_run(file);
    CHECK(trajectory->frame_count() == 2);
    const std::vector<std::string> notes = viewer::trajectory_notes(*trajectory);
    REQUIRE(notes.size() == 1);
    CHECK(notes[0] == "1 damaged frame skipped");
    ViewOptions options = options_for(file, dir / "alone.png");
    std::string messages;
    REQUIRE(render_status(options, messages) == 0);
    CHECK_THAT(messages, Catch::Contains("warning:") && Catch::Contains("skipped"));
    CHECK(std::filesystem::exists(dir / "alone.png"));
}
