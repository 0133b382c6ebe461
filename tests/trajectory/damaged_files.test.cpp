// Every way a small valid file can be cut short or have one bit flipped: the reader must give
// only intact frames with their right content, or refuse the file with TrajectoryFormatError;
// never crash, hang or allocate what a damaged length claims.
#include <catch2/catch.hpp>

#include <bit>
#include <optional>

#include "allocation_probe.hpp"
#include "test_support.hpp"
#include "trajectory/trajectory_error.hpp"
#include "trajectory/trajectory_reader.hpp"
#include "trajectory/trajectory_writer.hpp"

using namespace brownfloc;
using Catch::Matchers::Contains;
using trajectory::TrajectoryFormatError;
using trajectory::TrajectoryReader;
using trajectory::TrajectoryWriter;

namespace {

// Far above anything a ~1 kB file needs (the sync search reads 64 KiB windows at most), far
// below what any damaged length field would claim.
constexpr std::size_t allocation_limit_bytes = 1 << 20;

struct SmallFile {
    test::Bytes bytes;
    std::vector<test::TrajectoryFrame> frames;  // as stored (float32 positions already rounded)
    std::vector<std::size_t> frame_offsets;    // and the end of the last frame
    std::size_t frames_offset = 0;
};

// 5 particles, 3 frames, curves of 8 samples.
SmallFile make_small_file(bool positions_float64) {
    const test::TempDir dir;
    {
        TrajectoryWriter writer = TrajectoryWriter::create(dir / "t.bftraj", test::small_header(5), positions_float64);
        for (std::uint64_t k = 0; k < 3; ++k) writer.append(test::sample_frame(5, k));
    }
    SmallFile file;
    file.bytes = test::read_bytes(dir / "t.bftraj");
    const TrajectoryReader reader{dir / "t.bftraj"};
    file.frames_offset = static_cast<std::size_t>(reader.frames_offset_bytes());
    for (std::size_t k = 0; k < reader.frame_count(); ++k) {
        file.frames.push_back(reader.read_frame(k));
        file.frame_offsets.push_back(static_cast<std::size_t>(reader.frame_info(k).offset_bytes));
    }
    file.frame_offsets.push_back(file.bytes.size());
    return file;
}

// Reads damaged bytes: either refused, or frames each equal to the original with its number.
// Returns the intact frames' numbers, or nothing when the file was refused.
std::optional<std::vector<std::uint64_t>> read_damaged(const SmallFile& original, std::span<const std::byte> bytes) {
    test::reset_largest_allocation();
    std::optional<std::vector<std::uint64_t>> numbers;
    try {
        const TrajectoryReader reader = TrajectoryReader::from_bytes(bytes, "damaged.bftraj");
        numbers.emplace();
        for (std::size_t k = 0; k < reader.frame_count(); ++k) {
            const std::uint64_t number = reader.frame_info(k).frame_number;
            REQUIRE(number < original.frames.size());
            REQUIRE(reader.read_frame(k) == original.frames[number]);
            numbers->push_back(number);
        }
    } catch (const TrajectoryFormatError& error) {
        REQUIRE_THAT(error.what(), Contains("damaged.bftraj: byte "));
    }
    REQUIRE(test::largest_allocation_bytes() < allocation_limit_bytes);
    return numbers;
}

}  // namespace

TEST_CASE("cutting a small file at every byte length leaves exactly its complete frames, or refuses it",
          "[trajectory][damage]") {
    for (const bool positions_float64 : {false, true}) {
        const SmallFile file = make_small_file(positions_float64);
        REQUIRE(file.frames.size() == 3);
        for (std::size_t length = 0; length <= file.bytes.size(); ++length) {
            INFO("float64 " << positions_float64 << ", cut at " << length << " of " << file.bytes.size() << " bytes");
            const auto numbers = read_damaged(file, std::span{file.bytes}.first(length));
            if (length < file.frames_offset) {
                CHECK_FALSE(numbers);
                continue;
            }
            REQUIRE(numbers);
            std::size_t complete = 0;
            while (complete < 3 && file.frame_offsets[complete + 1] <= length) ++complete;
            CHECK(numbers->size() == complete);
            const TrajectoryReader reader = TrajectoryReader::from_bytes(std::span{file.bytes}.first(length));
            const bool at_boundary = length == file.frame_offsets[complete];
            CHECK(reader.warnings().size() == (at_boundary ? 0u : 1u));
        }
    }
}

TEST_CASE("flipping any bit of the file header or header payload makes the file unusable", "[trajectory][damage]") {
    const SmallFile file = make_small_file(false);
    test::Bytes bytes = file.bytes;
    for (std::size_t at = 0; at < file.frames_offset; ++at)
        for (int bit = 0; bit < 8; ++bit) {
            INFO("bit " << bit << " of byte " << at);
            bytes[at] ^= std::byte{1} << bit;
            CHECK_FALSE(read_damaged(file, bytes));
            bytes[at] ^= std::byte{1} << bit;
        }
}

TEST_CASE("flipping any bit of the first two frames loses only that frame, with a warning at its offset",
          "[trajectory][damage]") {
    for (const bool positions_float64 : {false, true}) {
        const SmallFile file = make_small_file(positions_float64);
        test::Bytes bytes = file.bytes;
        for (std::size_t damaged = 0; damaged < 2; ++damaged)
            for (std::size_t at = file.frame_offsets[damaged]; at < file.frame_offsets[damaged + 1]; ++at)
                for (int bit = 0; bit < 8; ++bit) {
                    INFO("float64 " << positions_float64 << ", bit " << bit << " of byte " << at << " (frame " << damaged
                                    << ")");
                    bytes[at] ^= std::byte{1} << bit;
                    const auto numbers = read_damaged(file, bytes);
                    REQUIRE(numbers);
                    const std::vector<std::uint64_t> expected =
                        damaged == 0 ? std::vector<std::uint64_t>{1, 2} : std::vector<std::uint64_t>{0, 2};
                    CHECK(*numbers == expected);
                    const std::vector<std::string> warnings = TrajectoryReader::from_bytes(bytes).warnings();
                    REQUIRE(warnings.size() == 1);
                    CHECK_THAT(warnings[0], Contains("byte " + std::to_string(file.frame_offsets[damaged]) + ":"));
                    bytes[at] ^= std::byte{1} << bit;
                }
    }
}

TEST_CASE("garbage between frames is skipped and reading resumes at the next frame", "[trajectory][damage]") {
    const SmallFile file = make_small_file(false);
    test::Bytes bytes(file.bytes.begin(), file.bytes.begin() + static_cast<std::ptrdiff_t>(file.frame_offsets[1]));
    // Includes a lone sync marker ("1MRF") that is not followed by a valid header.
    constexpr std::string_view garbage = "garbage 1MRF and more garbage, long enough to hide a whole header";
    for (const char c : garbage) bytes.push_back(static_cast<std::byte>(c));
    bytes.insert(bytes.end(), file.bytes.begin() + static_cast<std::ptrdiff_t>(file.frame_offsets[1]), file.bytes.end());
    const auto numbers = read_damaged(file, bytes);
    REQUIRE(numbers);
    CHECK(*numbers == std::vector<std::uint64_t>{0, 1, 2});
    const std::vector<std::string> warnings = TrajectoryReader::from_bytes(bytes).warnings();
    REQUIRE(warnings.size() == 1);
    CHECK_THAT(warnings[0], Contains("byte " + std::to_string(file.frame_offsets[1]) + ": no frame sync marker") &&
                                Contains("\"garb\"") &&
                                Contains("skipped " + std::to_string(garbage.size()) + " bytes"));
}

TEST_CASE("a repeated frame and a frame whose time runs backwards are skipped with warnings", "[trajectory][damage]") {
    const SmallFile file = make_small_file(true);
    const std::span<const std::byte> all{file.bytes};
    // Frames 0, 1, 1 again, 2.
    test::Bytes repeated(all.begin(), all.begin() + static_cast<std::ptrdiff_t>(file.frame_offsets[2]));
    repeated.insert(repeated.end(), all.begin() + static_cast<std::ptrdiff_t>(file.frame_offsets[1]), all.end());
    auto numbers = read_damaged(file, repeated);
    REQUIRE(numbers);
    CHECK(*numbers == std::vector<std::uint64_t>{0, 1, 2});
    std::vector<std::string> warnings = TrajectoryReader::from_bytes(repeated).warnings();
    REQUIRE(warnings.size() == 1);
    CHECK_THAT(warnings[0], Contains("frame 1 skipped: its number does not rise after frame 1"));

    // Frame 1's time set after frame 2's, with its CRCs re-sealed as a forger would: frame 2 goes.
    test::Bytes backwards = file.bytes;
    const std::size_t frame1 = file.frame_offsets[1];
    test::store_u64(backwards, frame1 + 32 + 8, std::bit_cast<std::uint64_t>(1.0));
    test::reseal_frame(backwards, frame1);
    const TrajectoryReader reader = TrajectoryReader::from_bytes(backwards, "backwards.bftraj");
    REQUIRE(reader.frame_count() == 2);
    CHECK(reader.frame_info(1).time_s == 1.0);
    warnings = reader.warnings();
    REQUIRE(warnings.size() == 1);
    CHECK_THAT(warnings[0], Contains("backwards.bftraj: byte " + std::to_string(file.frame_offsets[2])) &&
                                Contains("frame 2 skipped: time_s = 0.005 is earlier than frame 1's 1"));
}

TEST_CASE("a frame with a valid CRC but a cluster id >= N is skipped, naming the field", "[trajectory][damage]") {
    const SmallFile file = make_small_file(false);
    test::Bytes bytes = file.bytes;
    const std::size_t frame0 = file.frame_offsets[0];
    const std::size_t cluster_at = frame0 + 32 + 16 + 3 * 5 * 4;
    test::store_u32(bytes, cluster_at + 4 * 3, 5);
    test::reseal_frame(bytes, frame0);
    const TrajectoryReader reader = TrajectoryReader::from_bytes(bytes, "ids.bftraj");
    CHECK(reader.frame_count() == 2);
    REQUIRE(reader.warnings().size() == 1);
    CHECK_THAT(reader.warnings()[0], Contains("frame 0 skipped: cluster[3] = 5: must be < N = 5"));
}
