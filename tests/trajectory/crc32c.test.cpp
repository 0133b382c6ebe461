#include <catch2/catch.hpp>

#include <array>
#include <cstdint>
#include <vector>

#include "trajectory/crc32c.hpp"

using brownfloc::trajectory::crc32c;

namespace {

// The definition, one bit at a time: reflected polynomial 0x82F63B78, all-ones start and end.
std::uint32_t crc32c_bitwise(std::span<const std::byte> bytes) {
    std::uint32_t crc = 0xFFFFFFFFu;
    for (const std::byte b : bytes) {
        crc ^= std::to_integer<std::uint32_t>(b);
        for (int bit = 0; bit < 8; ++bit) crc = (crc >> 1) ^ ((crc & 1u) ? 0x82F63B78u : 0u);
    }
    return ~crc;
}

std::vector<std::byte> pattern(std::size_t n, unsigned start, int step) {
    std::vector<std::byte> bytes(n);
    for (std::size_t i = 0; i < n; ++i)
        bytes[i] = static_cast<std::byte>((start + static_cast<unsigned>(step) * static_cast<unsigned>(i)) & 0xFFu);
    return bytes;
}

}  // namespace

TEST_CASE("CRC-32C of \"123456789\" is 0xE3069283", "[trajectory][crc][validation]") {
    // The check value of CRC-32C (Castagnoli); also the project's INTERFACES test vector.
    CHECK(crc32c("123456789") == 0xE3069283u);
    CHECK(crc32c("") == 0u);
}

TEST_CASE("CRC-32C matches the iSCSI examples of RFC 3720", "[trajectory][crc][validation]") {
    // RFC 3720 (2004), appendix B.4: 32 bytes of zeros, of 0xFF, ascending and descending.
    CHECK(crc32c(pattern(32, 0x00, 0)) == 0x8A9136AAu);
    CHECK(crc32c(pattern(32, 0xFF, 0)) == 0x62A8AB43u);
    CHECK(crc32c(pattern(32, 0x00, 1)) == 0x46DD794Eu);
    CHECK(crc32c(pattern(32, 0x1F, -1)) == 0x113FDB5Cu);
}

TEST_CASE("the table-driven CRC-32C agrees with the bitwise definition at every length and alignment",
          "[trajectory][crc]") {
    const std::vector<std::byte> data = pattern(200, 0x5A, 73);
    for (std::size_t start = 0; start < 9; ++start)
        for (std::size_t length = 0; start + length <= data.size(); ++length) {
            const std::span<const std::byte> piece = std::span{data}.subspan(start, length);
            REQUIRE(crc32c(piece) == crc32c_bitwise(piece));
        }
}

TEST_CASE("CRC-32C computed in pieces equals CRC-32C in one go", "[trajectory][crc]") {
    const std::vector<std::byte> data = pattern(100, 3, 29);
    const std::uint32_t whole = crc32c(data);
    for (std::size_t split = 0; split <= data.size(); ++split)
        REQUIRE(crc32c(std::span{data}.subspan(split), crc32c(std::span{data}.first(split))) == whole);
}
