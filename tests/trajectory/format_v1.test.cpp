// The version-1 layout, pinned: a small file checked in under data/ must keep loading in every
// later build, and today's writer must still produce it byte for byte (which also shows that
// nothing in the file depends on the time, the host or the path).
#include <catch2/catch.hpp>

#include "test_support.hpp"
#include "trajectory/trajectory_format.hpp"
#include "trajectory/trajectory_reader.hpp"
#include "trajectory/trajectory_writer.hpp"

using namespace brownfloc;
using trajectory::TrajectoryReader;
using trajectory::TrajectoryWriter;

namespace {

const std::filesystem::path sample_path = std::filesystem::path{BROWNFLOC_TRAJECTORY_TEST_DATA} / "format-v1.bftraj";
constexpr std::size_t sample_particles = 5;
constexpr std::uint64_t sample_frames = 3;

// The sample: 5 particles, curves of 8 samples, float32 positions, frames 0-2.
void write_sample(const std::filesystem::path& path) {
    TrajectoryWriter writer = TrajectoryWriter::create(path, test::small_header(sample_particles), false);
    for (std::uint64_t k = 0; k < sample_frames; ++k) writer.append(test::sample_frame(sample_particles, k));
}

}  // namespace

TEST_CASE("the checked-in version-1 file still loads with its header and frames", "[trajectory][format]") {
    const TrajectoryReader reader{sample_path};
    CHECK(reader.header() == test::small_header(sample_particles));
    CHECK(reader.warnings().empty());
    REQUIRE(reader.frame_count() == sample_frames);
    for (std::size_t k = 0; k < sample_frames; ++k) {
        const test::TrajectoryFrame original = test::sample_frame(sample_particles, k);
        test::TrajectoryFrame stored = reader.read_frame(k);
        for (std::size_t i = 0; i < original.positions_nm.size(); ++i)
            CHECK(test::within_float32_rounding(stored.positions_nm[i], original.positions_nm[i]));
        stored.positions_nm = original.positions_nm;
        CHECK(stored == original);
    }
}

TEST_CASE("the writer reproduces the checked-in version-1 file byte for byte", "[trajectory][format]") {
    const test::TempDir dir;
    write_sample(dir / "again.bftraj");
    CHECK(test::read_bytes(dir / "again.bftraj") == test::read_bytes(sample_path));
}

TEST_CASE("the file and frame headers hold the documented fields at the documented offsets", "[trajectory][format]") {
    const test::Bytes file = test::read_bytes(sample_path);
    const TrajectoryReader reader{sample_path};
    const std::size_t frames_at = static_cast<std::size_t>(reader.frames_offset_bytes());
    CHECK(std::string(reinterpret_cast<const char*>(file.data()), 8) == "BFLOCTRJ");
    CHECK(test::load_u32(file, 8) == 1);
    CHECK(test::load_u32(file, 12) == 0);  // float32 positions
    CHECK(test::load_u64(file, 16) == frames_at - 32);
    CHECK(test::load_u32(file, 24) == trajectory::crc32c(std::span{file}.subspan(32, frames_at - 32)));
    CHECK(test::load_u32(file, 28) == trajectory::crc32c(std::span{file}.first(28)));
    const std::size_t n = sample_particles;
    std::size_t at = frames_at;
    for (std::uint64_t k = 0; k < sample_frames; ++k) {
        CHECK(std::string(reinterpret_cast<const char*>(file.data() + at), 4) == "1MRF");
        CHECK(test::load_u32(file, at + 4) == 0);
        CHECK(test::load_u64(file, at + 8) == k);
        const std::size_t spanning = test::sample_frame(n, k).spanning_clusters.size();
        const std::size_t payload = 32 + 3 * n * 4 + 4 * n + 4 * spanning;
        CHECK(test::load_u64(file, at + 16) == payload);
        CHECK(test::load_u64(file, at + 32 + 16 + 3 * n * 4 + 4 * n) == spanning);  // the spanning count, at B
        at += 32 + payload;
    }
    CHECK(at == file.size());
}

TEST_CASE("write the checked-in version-1 sample file (by hand, only for a new format version)", "[.][generate]") {
    write_sample(sample_path);
}
