#include <catch2/catch.hpp>

#include <cerrno>
#include <cmath>
#include <limits>

#include "io/io_error.hpp"
#include "io/write_faults.hpp"
#include "test_support.hpp"
#include "trajectory/trajectory_error.hpp"
#include "trajectory/trajectory_reader.hpp"
#include "trajectory/trajectory_writer.hpp"

using namespace brownfloc;
using Catch::Matchers::Contains;
using trajectory::TrajectoryFormatError;
using trajectory::TrajectoryReader;
using trajectory::TrajectoryWriter;

TEST_CASE("creating a trajectory refuses an existing path and leaves it alone", "[trajectory][writer]") {
    const test::TempDir dir;
    test::write_bytes(dir / "t.bftraj", std::as_bytes(std::span{"precious", 8}));
    CHECK_THROWS_WITH(TrajectoryWriter::create(dir / "t.bftraj", test::small_header(3), false), Contains("File exists"));
    CHECK(std::filesystem::file_size(dir / "t.bftraj") == 8);
}

TEST_CASE("a header that breaks a rule is refused, naming the field and the value", "[trajectory][writer][validation]") {
    const test::TempDir dir;
    auto refused = [&](test::TrajectoryHeader header) {
        try {
            (void)TrajectoryWriter::create(dir / "t.bftraj", header, false);
        } catch (const std::invalid_argument& error) {
            CHECK_FALSE(std::filesystem::exists(dir / "t.bftraj"));
            return std::string{error.what()};
        }
        return std::string{"accepted"};
    };
    test::TrajectoryHeader header = test::small_header(4);
    header.radius_nm[2] = -1.0;
    CHECK_THAT(refused(header), Contains("t.bftraj") && Contains("radius_nm[2] = -1: must be finite and > 0"));
    header = test::small_header(4);
    header.species[3] = 2;
    CHECK_THAT(refused(header), Contains("species[3] = 2: there are 2 species"));
    header = test::small_header(4);
    header.length_unit = "mm";
    CHECK_THAT(refused(header), Contains("length_unit is \"mm\""));
    header = test::small_header(4);
    header.radius_nm.clear();
    header.species.clear();
    CHECK_THAT(refused(header), Contains("at least one particle"));
    header = test::small_header(4);
    header.box_length_nm = std::numeric_limits<double>::quiet_NaN();
    CHECK_THAT(refused(header), Contains("box_length_nm = nan"));
    header = test::small_header(4);
    header.pairs[1].energy_kT.pop_back();
    CHECK_THAT(refused(header), Contains("pairs[1] has 8 gap_nm values but 7 energy_kT values"));
    header = test::small_header(4);
    header.pairs[0].gap_nm[3] = header.pairs[0].gap_nm[2];
    CHECK_THAT(refused(header), Contains("pairs[0].gap_nm[3]") && Contains("must be greater than"));
    header = test::small_header(4);
    header.pairs[0].stability_ratio = 0.0;
    CHECK_THAT(refused(header), Contains("pairs[0].stability_ratio = 0: must be > 0"));
}

TEST_CASE("appending refuses frames of the wrong size, bad values and earlier times", "[trajectory][writer][validation]") {
    const test::TempDir dir;
    const std::size_t n = 4;
    TrajectoryWriter writer = TrajectoryWriter::create(dir / "t.bftraj", test::small_header(n), false);
    writer.append(test::sample_frame(n, 1));
    const std::uint64_t bytes = writer.bytes();
    auto refused = [&](const test::TrajectoryFrame& frame) {
        try {
            writer.append(frame);
        } catch (const std::invalid_argument& error) {
            return std::string{error.what()};
        }
        return std::string{"accepted"};
    };
    test::TrajectoryFrame frame = test::sample_frame(n, 2);
    frame.positions_nm.pop_back();
    CHECK_THAT(refused(frame), Contains("frame 1: positions_nm has 11 values: 3 N = 12 are needed"));
    frame = test::sample_frame(n, 2);
    frame.cluster.push_back(0);
    CHECK_THAT(refused(frame), Contains("cluster has 5 entries: N = 4"));
    frame = test::sample_frame(n, 2);
    frame.positions_nm[4] = std::numeric_limits<double>::infinity();
    CHECK_THAT(refused(frame), Contains("positions_nm[4] (particle 1, y) = inf"));
    frame = test::sample_frame(n, 2);
    frame.positions_nm[0] = 1e39;  // beyond float32
    CHECK_THAT(refused(frame), Contains("fit in float32"));
    frame = test::sample_frame(n, 2);
    frame.cluster[2] = 4;
    CHECK_THAT(refused(frame), Contains("cluster[2] = 4: must be < N = 4"));
    frame = test::sample_frame(n, 2);
    frame.spanning_clusters = {9};
    CHECK_THAT(refused(frame), Contains("spanning_clusters[0] = 9"));
    frame = test::sample_frame(n, 2);
    frame.largest_cluster = 5;
    CHECK_THAT(refused(frame), Contains("largest_cluster = 5"));
    CHECK_THAT(refused(test::sample_frame(n, 0)), Contains("is earlier than the previous frame's"));
    CHECK(writer.bytes() == bytes);
    CHECK(writer.frames() == 1);
    writer.append(test::sample_frame(n, 1));  // an equal time is allowed
    CHECK(writer.frames() == 2);
}

TEST_CASE("resuming cuts the file back to the checkpoint and continues the frame numbers", "[trajectory][writer][resume]") {
    const test::TempDir dir;
    const std::size_t n = 5;
    std::uint64_t checkpoint_bytes = 0, checkpoint_frames = 0;
    {
        TrajectoryWriter writer = TrajectoryWriter::create(dir / "t.bftraj", test::small_header(n), true);
        writer.append(test::sample_frame(n, 0));
        writer.append(test::sample_frame(n, 1));
        writer.sync();
        checkpoint_bytes = writer.bytes();
        checkpoint_frames = writer.frames();
        writer.append(test::sample_frame(n, 2));  // written after the checkpoint: lost in the "crash"
    }
    const test::Bytes before = test::read_bytes(dir / "t.bftraj");
    test::write_bytes(dir / "t.bftraj", std::as_bytes(std::span{"torn", 4}), true);  // and a torn tail
    TrajectoryWriter resumed = TrajectoryWriter::reopen_for_append(dir / "t.bftraj", checkpoint_bytes, checkpoint_frames);
    CHECK(std::filesystem::file_size(dir / "t.bftraj") == checkpoint_bytes);
    CHECK(resumed.frames() == 2);
    CHECK(resumed.particle_count() == n);
    CHECK(resumed.positions_float64());
    test::TrajectoryFrame replacement = test::sample_frame(n, 2);
    replacement.step += 1;
    CHECK_THROWS_AS(resumed.append(test::sample_frame(n, 0)), std::invalid_argument);  // time runs backwards
    resumed.append(replacement);
    const test::Bytes after = test::read_bytes(dir / "t.bftraj");
    CHECK(std::equal(after.begin(), after.begin() + static_cast<std::ptrdiff_t>(checkpoint_bytes), before.begin()));

    const TrajectoryReader reader{dir / "t.bftraj"};
    CHECK(reader.warnings().empty());
    REQUIRE(reader.frame_count() == 3);
    for (std::size_t k = 0; k < 3; ++k) CHECK(reader.frame_info(k).frame_number == k);
    CHECK(reader.read_frame(2) == replacement);
}

TEST_CASE("resuming from a checkpoint with no frames keeps only the header", "[trajectory][writer][resume]") {
    const test::TempDir dir;
    std::uint64_t header_bytes = 0;
    {
        TrajectoryWriter writer = TrajectoryWriter::create(dir / "t.bftraj", test::small_header(2), false);
        header_bytes = writer.bytes();
        writer.append(test::sample_frame(2, 0));
    }
    TrajectoryWriter resumed = TrajectoryWriter::reopen_for_append(dir / "t.bftraj", header_bytes, 0);
    resumed.append(test::sample_frame(2, 3));
    const TrajectoryReader reader{dir / "t.bftraj"};
    REQUIRE(reader.frame_count() == 1);
    CHECK(reader.frame_info(0).frame_number == 0);
    CHECK(reader.frame_info(0).step == 3000);
}

TEST_CASE("resuming refuses a checkpoint that does not match the file", "[trajectory][writer][resume]") {
    const test::TempDir dir;
    const std::size_t n = 3;
    std::uint64_t one_frame = 0, two_frames = 0;
    {
        TrajectoryWriter writer = TrajectoryWriter::create(dir / "t.bftraj", test::small_header(n), false);
        writer.append(test::sample_frame(n, 0));
        one_frame = writer.bytes();
        writer.append(test::sample_frame(n, 1));
        two_frames = writer.bytes();
    }
    const auto size = std::filesystem::file_size(dir / "t.bftraj");
    CHECK_THROWS_WITH(TrajectoryWriter::reopen_for_append(dir / "t.bftraj", two_frames, 3),
                      Contains("t.bftraj") && Contains("expects frame 2 to end at byte") && Contains("frame 1"));
    CHECK_THROWS_WITH(TrajectoryWriter::reopen_for_append(dir / "t.bftraj", two_frames - 1, 2),
                      Contains("the last intact frame before it is frame 0"));
    CHECK_THROWS_WITH(TrajectoryWriter::reopen_for_append(dir / "t.bftraj", two_frames + 10, 2), Contains("only"));
    CHECK_THROWS_WITH(TrajectoryWriter::reopen_for_append(dir / "t.bftraj", one_frame, 0), Contains("expects no frames"));
    CHECK_THROWS_AS(TrajectoryWriter::reopen_for_append(dir / "t.bftraj", 20, 0), TrajectoryFormatError);
    CHECK(std::filesystem::file_size(dir / "t.bftraj") == size);  // nothing was cut
}

TEST_CASE("a full disk on the second write of a writer names the path and leaves the file at its last complete frame",
          "[trajectory][writer][faults]") {
    const test::TempDir dir;
    const test::WriteFaultGuard guard;
    const std::size_t n = 5;
    const std::filesystem::path path = dir / "t.bftraj";
    // Write 1 is the header, write 2 the first frame.
    io::testing::fail_nth_write(2, ENOSPC);
    TrajectoryWriter writer = TrajectoryWriter::create(path, test::small_header(n), false);
    const std::uint64_t header_bytes = writer.bytes();
    try {
        writer.append(test::sample_frame(n, 0));
        FAIL("the write did not fail");
    } catch (const io::IoError& error) {
        CHECK(error.error_number() == ENOSPC);
        CHECK_THAT(error.what(), Contains(path.string()) && Contains("No space left on device"));
    }
    CHECK(std::filesystem::file_size(path) == header_bytes);
    CHECK(writer.frames() == 0);

    // Later frames, with the disk filling up in the middle of a write: the partial frame is cut.
    writer.append(test::sample_frame(n, 0));
    const std::uint64_t one_frame = writer.bytes();
    io::testing::fail_nth_write(1, ENOSPC, 50);
    CHECK_THROWS_AS(writer.append(test::sample_frame(n, 1)), io::IoError);
    CHECK(std::filesystem::file_size(path) == one_frame);
    {
        const TrajectoryReader reader{path};
        CHECK(reader.frame_count() == 1);
        CHECK(reader.warnings().empty());
    }
    // Once there is room again the same frame goes in, under the next number.
    writer.append(test::sample_frame(n, 1));
    const TrajectoryReader reader{path};
    REQUIRE(reader.frame_count() == 2);
    CHECK(reader.frame_info(1).frame_number == 1);
    CHECK(reader.warnings().empty());
}

TEST_CASE("a full disk while writing the header leaves no file behind", "[trajectory][writer][faults]") {
    const test::TempDir dir;
    const test::WriteFaultGuard guard;
    io::testing::fail_nth_write(1, ENOSPC, 10);
    CHECK_THROWS_WITH(TrajectoryWriter::create(dir / "t.bftraj", test::small_header(3), false),
                      Contains("No space left on device"));
    CHECK_FALSE(std::filesystem::exists(dir / "t.bftraj"));
}
