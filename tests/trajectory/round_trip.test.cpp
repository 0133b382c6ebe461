#include <catch2/catch.hpp>

#include <limits>

#include "test_support.hpp"
#include "trajectory/trajectory_reader.hpp"
#include "trajectory/trajectory_writer.hpp"

using namespace brownfloc;
using trajectory::TrajectoryReader;
using trajectory::TrajectoryWriter;

TEST_CASE("a header and frames written with float64 positions read back exactly", "[trajectory][round_trip]") {
    const test::TempDir dir;
    const std::size_t n = 7;
    const test::TrajectoryHeader header = test::small_header(n);
    {
        TrajectoryWriter writer = TrajectoryWriter::create(dir / "t.bftraj", header, true);
        for (std::uint64_t k = 0; k < 4; ++k) writer.append(test::sample_frame(n, k));
        writer.sync();
        CHECK(writer.frames() == 4);
        CHECK(writer.bytes() == std::filesystem::file_size(dir / "t.bftraj"));
    }
    const TrajectoryReader reader{dir / "t.bftraj"};
    CHECK(reader.header() == header);
    CHECK(reader.particle_count() == n);
    CHECK(reader.positions_float64());
    CHECK(reader.warnings().empty());
    REQUIRE(reader.frame_count() == 4);
    for (std::size_t k = 0; k < 4; ++k) CHECK(reader.read_frame(k) == test::sample_frame(n, k));
}

TEST_CASE("float32 positions read back within 2^-24 relative error, everything else exactly", "[trajectory][round_trip]") {
    const test::TempDir dir;
    const std::size_t n = 9;
    const test::TrajectoryHeader header = test::small_header(n);
    {
        TrajectoryWriter writer = TrajectoryWriter::create(dir / "t.bftraj", header, false);
        for (std::uint64_t k = 0; k < 3; ++k) writer.append(test::sample_frame(n, k));
    }
    const TrajectoryReader reader{dir / "t.bftraj"};
    CHECK_FALSE(reader.positions_float64());
    CHECK(reader.header() == header);
    REQUIRE(reader.frame_count() == 3);
    for (std::size_t k = 0; k < 3; ++k) {
        const test::TrajectoryFrame original = test::sample_frame(n, k);
        test::TrajectoryFrame stored = reader.read_frame(k);
        REQUIRE(stored.positions_nm.size() == original.positions_nm.size());
        bool some_rounded = false;
        for (std::size_t i = 0; i < original.positions_nm.size(); ++i) {
            CHECK(test::within_float32_rounding(stored.positions_nm[i], original.positions_nm[i]));
            some_rounded = some_rounded || stored.positions_nm[i] != original.positions_nm[i];
        }
        CHECK(some_rounded);  // the check above is not vacuous
        stored.positions_nm = original.positions_nm;
        CHECK(stored == original);
    }
}

TEST_CASE("a header with 512-sample curves, an infinite stability ratio and non-ASCII text survives the round trip",
          "[trajectory][round_trip]") {
    const test::TempDir dir;
    test::TrajectoryHeader header = test::small_header(3, 512);
    header.species_names[1] = "latex \xC2\xB5-sphere";  // UTF-8 "µ"
    header.scenario_toml += std::string("nul\0byte", 8);
    REQUIRE(header.pairs[2].stability_ratio == std::numeric_limits<double>::infinity());
    { (void)TrajectoryWriter::create(dir / "t.bftraj", header, false); }
    const TrajectoryReader reader{dir / "t.bftraj"};
    CHECK(reader.header() == header);
    CHECK(reader.frame_count() == 0);
    CHECK(reader.warnings().empty());
}

TEST_CASE("frame numbers rise from 0 by one per frame, and the frame index matches the frames", "[trajectory][round_trip]") {
    const test::TempDir dir;
    const std::size_t n = 4;
    TrajectoryWriter writer = TrajectoryWriter::create(dir / "t.bftraj", test::small_header(n), false);
    for (std::uint64_t k = 0; k < 6; ++k) writer.append(test::sample_frame(n, k));
    const TrajectoryReader reader{dir / "t.bftraj"};
    REQUIRE(reader.frame_count() == 6);
    std::uint64_t expected_offset = reader.frames_offset_bytes();
    for (std::size_t k = 0; k < 6; ++k) {
        const trajectory::FrameInfo& info = reader.frame_info(k);
        CHECK(info.frame_number == k);
        CHECK(info.offset_bytes == expected_offset);
        CHECK(info.step == test::sample_frame(n, k).step);
        CHECK(info.time_s == test::sample_frame(n, k).time_s);
        expected_offset += 32 + info.payload_bytes;
    }
    CHECK(expected_offset == writer.bytes());
    CHECK_THROWS_AS(reader.frame_info(6), std::out_of_range);
    CHECK_THROWS_AS(reader.read_frame(6), std::out_of_range);
}
