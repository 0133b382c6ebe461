// Reading a file while a run writes it, and after a resumed run has cut it back.
#include <catch2/catch.hpp>

#include "test_support.hpp"
#include "trajectory/trajectory_reader.hpp"
#include "trajectory/trajectory_writer.hpp"

using namespace brownfloc;
using Catch::Matchers::Contains;
using trajectory::TrajectoryReader;
using trajectory::TrajectoryWriter;

TEST_CASE("a reader sees the frames appended after it was opened once it refreshes", "[trajectory][live]") {
    const test::TempDir dir;
    const std::size_t n = 6;
    TrajectoryWriter writer = TrajectoryWriter::create(dir / "t.bftraj", test::small_header(n), false);
    TrajectoryReader reader{dir / "t.bftraj"};
    CHECK(reader.frame_count() == 0);
    writer.append(test::sample_frame(n, 0));
    CHECK(reader.frame_count() == 0);  // nothing changes until refresh()
    CHECK(reader.refresh() == 1);
    writer.append(test::sample_frame(n, 1));
    writer.append(test::sample_frame(n, 2));
    CHECK(reader.refresh() == 2);
    CHECK(reader.refresh() == 0);
    REQUIRE(reader.frame_count() == 3);
    CHECK(reader.read_frame(2).step == test::sample_frame(n, 2).step);
    CHECK(reader.file_bytes() == writer.bytes());
    CHECK(reader.warnings().empty());
}

TEST_CASE("a torn last frame is a warning, is not counted, and becomes a frame once complete", "[trajectory][live]") {
    const test::TempDir dir;
    const std::size_t n = 5;
    std::uint64_t two_frames = 0;
    {
        TrajectoryWriter writer = TrajectoryWriter::create(dir / "whole.bftraj", test::small_header(n), false);
        writer.append(test::sample_frame(n, 0));
        writer.append(test::sample_frame(n, 1));
        two_frames = writer.bytes();
        writer.append(test::sample_frame(n, 2));
    }
    const test::Bytes whole = test::read_bytes(dir / "whole.bftraj");
    const std::span<const std::byte> all{whole};
    // Cut inside the third frame's header, then inside its payload, then complete it.
    test::write_bytes(dir / "t.bftraj", all.first(two_frames + 10));
    TrajectoryReader reader{dir / "t.bftraj"};
    CHECK(reader.frame_count() == 2);
    REQUIRE(reader.warnings().size() == 1);
    CHECK_THAT(reader.warnings()[0], Contains("t.bftraj: byte " + std::to_string(two_frames)) &&
                                         Contains("ends 10 bytes into a frame header") && Contains("torn"));

    test::write_bytes(dir / "t.bftraj", all.subspan(two_frames + 10, 40), true);
    CHECK(reader.refresh() == 0);
    REQUIRE(reader.warnings().size() == 1);
    CHECK_THAT(reader.warnings()[0], Contains("frame 2 is torn: the file ends 18 bytes into its"));

    test::write_bytes(dir / "t.bftraj", all.subspan(two_frames + 50), true);
    CHECK(reader.refresh() == 1);
    CHECK(reader.warnings().empty());
    REQUIRE(reader.frame_count() == 3);
    CHECK(reader.read_frame(2).step == test::sample_frame(n, 2).step);
}

TEST_CASE("a reader rebuilds its index when a resumed run cuts the file back", "[trajectory][live][resume]") {
    const test::TempDir dir;
    const std::size_t n = 4;
    std::uint64_t checkpoint_bytes = 0;
    {
        TrajectoryWriter writer = TrajectoryWriter::create(dir / "t.bftraj", test::small_header(n), true);
        writer.append(test::sample_frame(n, 0));
        checkpoint_bytes = writer.bytes();
        writer.append(test::sample_frame(n, 1));
        writer.append(test::sample_frame(n, 2));
    }
    TrajectoryReader reader{dir / "t.bftraj"};
    REQUIRE(reader.frame_count() == 3);

    TrajectoryWriter resumed = TrajectoryWriter::reopen_for_append(dir / "t.bftraj", checkpoint_bytes, 1);
    test::TrajectoryFrame different = test::sample_frame(n, 5);
    resumed.append(different);
    CHECK(reader.refresh() == 2);  // rebuilt: both frames count as new
    REQUIRE(reader.frame_count() == 2);
    CHECK(reader.read_frame(1) == different);
    CHECK(reader.warnings().empty());
}

TEST_CASE("a frame that changed after indexing is reported, not misread", "[trajectory][live]") {
    const test::TempDir dir;
    const std::size_t n = 3;
    {
        TrajectoryWriter writer = TrajectoryWriter::create(dir / "t.bftraj", test::small_header(n), true);
        writer.append(test::sample_frame(n, 0));
    }
    const TrajectoryReader reader{dir / "t.bftraj"};
    test::Bytes bytes = test::read_bytes(dir / "t.bftraj");
    bytes.back() ^= std::byte{0x01};
    test::write_bytes(dir / "t.bftraj", bytes);
    CHECK_THROWS_WITH(reader.read_frame(0), Contains("frame 0 has changed since it was indexed"));
}
