// Files made to hurt the reader: lengths and counts that claim far more than the file holds,
// text with control bytes, and paths that are not files at all.
#include <catch2/catch.hpp>

#include <sys/stat.h>
#include <tuple>
#include <unistd.h>

#include "allocation_probe.hpp"
#include "io/io_error.hpp"
#include "test_support.hpp"
#include "trajectory/trajectory_error.hpp"
#include "trajectory/trajectory_reader.hpp"
#include "trajectory/trajectory_writer.hpp"

using namespace brownfloc;
using Catch::Matchers::Contains;
using Catch::Matchers::EndsWith;
using trajectory::TrajectoryFormatError;
using trajectory::TrajectoryReader;
using trajectory::TrajectoryWriter;

namespace {

test::Bytes valid_file(std::size_t particles = 5, std::uint64_t frames = 2) {
    const test::TempDir dir;
    {
        TrajectoryWriter writer = TrajectoryWriter::create(dir / "t.bftraj", test::small_header(particles), false);
        for (std::uint64_t k = 0; k < frames; ++k) writer.append(test::sample_frame(particles, k));
    }
    return test::read_bytes(dir / "t.bftraj");
}

// The message of the TrajectoryFormatError that reading bytes throws, and the largest
// allocation made meanwhile.
std::pair<std::string, std::size_t> refusal(std::span<const std::byte> bytes) {
    test::reset_largest_allocation();
    try {
        (void)TrajectoryReader::from_bytes(bytes, "hostile.bftraj");
    } catch (const TrajectoryFormatError& error) {
        return {error.what(), test::largest_allocation_bytes()};
    }
    return {"accepted", test::largest_allocation_bytes()};
}

constexpr std::size_t allocation_limit_bytes = 1 << 20;

}  // namespace

TEST_CASE("a header claiming 2^60 particles is refused before anything is allocated for them", "[trajectory][hostile]") {
    test::Bytes bytes = valid_file();
    const std::size_t count_at = test::radius_count_offset(test::small_header(5));
    REQUIRE(test::load_u64(bytes, count_at) == 5);
    test::store_u64(bytes, count_at, std::uint64_t{1} << 60);
    test::reseal_file_header(bytes);
    const auto [message, largest] = refusal(bytes);
    CHECK_THAT(message, Contains("hostile.bftraj: byte " + std::to_string(count_at)) &&
                            Contains("radius_nm: 1152921504606846976 items of at least 8 bytes are claimed"));
    CHECK(largest < allocation_limit_bytes);
}

TEST_CASE("a string length of 2^32 - 1 is refused before anything is allocated for it", "[trajectory][hostile]") {
    test::Bytes bytes = valid_file();
    test::store_u32(bytes, 32, 0xFFFFFFFFu);  // length_unit, the first field of the header payload
    test::reseal_file_header(bytes);
    const auto [message, largest] = refusal(bytes);
    CHECK_THAT(message, Contains("byte 32: length_unit: a string of 4294967295 bytes is claimed"));
    CHECK(largest < allocation_limit_bytes);
}

TEST_CASE("counts of species and pairs far beyond the file are refused", "[trajectory][hostile]") {
    test::Bytes bytes = valid_file();
    const std::size_t species_count_at = 32 + 6 + 5 + 6 + 32;
    REQUIRE(test::load_u64(bytes, species_count_at) == 2);
    test::store_u64(bytes, species_count_at, ~std::uint64_t{0});
    test::reseal_file_header(bytes);
    const auto [message, largest] = refusal(bytes);
    CHECK_THAT(message, Contains("species_names: 18446744073709551615 items"));
    CHECK(largest < allocation_limit_bytes);
}

TEST_CASE("a header payload longer than the file or than the format's limit is refused", "[trajectory][hostile]") {
    test::Bytes bytes = valid_file();
    test::store_u64(bytes, 16, std::uint64_t{1} << 40);
    test::store_u32(bytes, 28, trajectory::crc32c(std::span<const std::byte>{bytes}.first(28)));
    auto [message, largest] = refusal(bytes);
    CHECK_THAT(message, Contains("byte 16: the header payload would be 1099511627776 bytes, more than the format's limit"));
    CHECK(largest < allocation_limit_bytes);

    test::store_u64(bytes, 16, bytes.size());
    test::store_u32(bytes, 28, trajectory::crc32c(std::span<const std::byte>{bytes}.first(28)));
    std::tie(message, largest) = refusal(bytes);
    CHECK_THAT(message, Contains("byte 32: the header payload should have") && Contains("but the file has only"));
}

TEST_CASE("a frame header with a valid CRC claiming an enormous payload is skipped without allocating it",
          "[trajectory][hostile]") {
    test::Bytes bytes = valid_file(5, 2);
    const TrajectoryReader honest = TrajectoryReader::from_bytes(bytes);
    const std::size_t frame0 = static_cast<std::size_t>(honest.frame_info(0).offset_bytes);
    test::store_u64(bytes, frame0 + 16, std::uint64_t{1} << 62);
    test::store_u32(bytes, frame0 + 28, trajectory::crc32c(std::span<const std::byte>{bytes}.subspan(frame0, 28)));
    test::reset_largest_allocation();
    const TrajectoryReader reader = TrajectoryReader::from_bytes(bytes);
    CHECK(test::largest_allocation_bytes() < allocation_limit_bytes);
    REQUIRE(reader.frame_count() == 1);
    CHECK(reader.frame_info(0).frame_number == 1);
    REQUIRE(reader.warnings().size() == 1);
    CHECK_THAT(reader.warnings()[0], Contains("frame 0 claims a payload of 4611686018427387904 bytes"));
}

TEST_CASE("text quoted from a hostile file is escaped and cut at 80 characters", "[trajectory][hostile][errors]") {
    test::Bytes bytes = valid_file();
    // The magic, with control bytes.
    test::Bytes magic = bytes;
    for (std::size_t i = 0; i < 8; ++i) magic[i] = static_cast<std::byte>("PK\x03\x04\"\\\x7F\xFF"[i]);
    CHECK(refusal(magic).first ==
          "hostile.bftraj: byte 0: not a brownfloc trajectory: the file starts with \"PK\\x03\\x04\\\"\\\\\\x7F\\xFF\", "
          "not \"BFLOCTRJ\"");

    // length_unit replaced by 200 bytes of mixed text, the payload length adjusted to match.
    test::Bytes unit(bytes.begin(), bytes.begin() + 32);
    std::string long_unit;
    for (int i = 0; i < 50; ++i) long_unit += "ab\n\x01";
    unit.resize(unit.size() + 4);
    test::store_u32(unit, 32, static_cast<std::uint32_t>(long_unit.size()));
    for (const char c : long_unit) unit.push_back(static_cast<std::byte>(c));
    unit.insert(unit.end(), bytes.begin() + 32 + 4 + 2, bytes.end());
    test::store_u64(unit, 16, test::load_u64(bytes, 16) + long_unit.size() - 2);
    test::reseal_file_header(unit);
    const std::string message = refusal(unit).first;
    CHECK_THAT(message, Contains("byte 32: header payload: length_unit is \"ab\\x0A\\x01ab\\x0A\\x01"));
    const std::size_t open = message.find('"'), close = message.find('"', open + 1);
    CHECK(close - open - 1 <= 80);
    CHECK(message.substr(close, 4) == "\"...");
}

TEST_CASE("files that are not trajectories at all are refused with what is wrong", "[trajectory][hostile][errors]") {
    const test::Bytes bytes = valid_file();
    CHECK(refusal({}).first == "hostile.bftraj: byte 0: the file has 0 bytes, fewer than the 32-byte file header");
    CHECK_THAT(refusal(std::as_bytes(std::span{"hello", 5})).first, Contains("byte 0: not a brownfloc trajectory"));
    CHECK_THAT(refusal(std::span{bytes}.first(20)).first, Contains("byte 20: the file has 20 bytes, fewer than"));

    test::Bytes version = bytes;
    test::store_u32(version, 8, 2);
    test::store_u32(version, 28, trajectory::crc32c(std::span<const std::byte>{version}.first(28)));
    CHECK_THAT(refusal(version).first, Contains("byte 8: format version 2 is not supported (this build reads version 1)"));

    test::Bytes flags = bytes;
    test::store_u32(flags, 12, 0x11);
    test::store_u32(flags, 28, trajectory::crc32c(std::span<const std::byte>{flags}.first(28)));
    CHECK_THAT(refusal(flags).first, Contains("byte 12: unknown flags 0x00000010"));

    test::Bytes damaged = bytes;
    damaged[9] ^= std::byte{0x40};
    CHECK_THAT(refusal(damaged).first, Contains("byte 28: the file header is damaged"));
}

TEST_CASE("a FIFO, /dev/zero and a directory given as the trajectory path are refused at once",
          "[trajectory][hostile]") {
    const test::TempDir dir;
    REQUIRE(::mkfifo((dir / "pipe.bftraj").c_str(), 0600) == 0);
    ::alarm(10);  // a blocking open or an endless read would kill the test run here
    CHECK_THROWS_WITH(TrajectoryReader{dir / "pipe.bftraj"}, Contains("pipe.bftraj") && Contains("(a FIFO)"));
    CHECK_THROWS_WITH(TrajectoryReader{"/dev/zero"}, Contains("/dev/zero") && Contains("(a character device)"));
    CHECK_THROWS_AS(TrajectoryReader{dir.path()}, io::IoError);
    CHECK_THROWS_AS(TrajectoryWriter::reopen_for_append(dir / "pipe.bftraj", 0, 0), io::IoError);
    ::alarm(0);
}
