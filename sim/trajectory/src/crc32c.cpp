#include "trajectory/crc32c.hpp"

#include <array>

namespace brownfloc::trajectory {
namespace {

constexpr std::uint32_t reflected_polynomial = 0x82F63B78u;

// tables[0][b]: the CRC register after feeding byte b into a zero register; tables[k][b]: the
// same followed by k zero bytes. Slicing by 8 uses tables[7..0] for the 8 bytes of a word.
using Tables = std::array<std::array<std::uint32_t, 256>, 8>;

constexpr Tables make_tables() {
    Tables tables{};
    for (std::uint32_t byte = 0; byte < 256; ++byte) {
        std::uint32_t crc = byte;
        for (int bit = 0; bit < 8; ++bit) crc = (crc >> 1) ^ ((crc & 1u) ? reflected_polynomial : 0u);
        tables[0][byte] = crc;
    }
    for (std::size_t k = 1; k < 8; ++k)
        for (std::size_t byte = 0; byte < 256; ++byte) {
            const std::uint32_t previous = tables[k - 1][byte];
            tables[k][byte] = (previous >> 8) ^ tables[0][previous & 0xFFu];
        }
    return tables;
}

constexpr Tables tables = make_tables();

constexpr std::uint32_t byte_value(std::byte b) { return static_cast<std::uint32_t>(std::to_integer<unsigned char>(b)); }

}  // namespace

std::uint32_t crc32c(std::span<const std::byte> bytes, std::uint32_t crc_before) noexcept {
    std::uint32_t crc = ~crc_before;
    const std::byte* p = bytes.data();
    std::size_t left = bytes.size();
    // The word is assembled little-endian byte by byte, so this is right on any host; on x86
    // the compiler turns it into two plain loads.
    while (left >= 8) {
        const std::uint32_t low = crc ^ (byte_value(p[0]) | byte_value(p[1]) << 8 | byte_value(p[2]) << 16 |
                                         byte_value(p[3]) << 24);
        const std::uint32_t high = byte_value(p[4]) | byte_value(p[5]) << 8 | byte_value(p[6]) << 16 |
                                   byte_value(p[7]) << 24;
        crc = tables[7][low & 0xFFu] ^ tables[6][(low >> 8) & 0xFFu] ^ tables[5][(low >> 16) & 0xFFu] ^
              tables[4][low >> 24] ^ tables[3][high & 0xFFu] ^ tables[2][(high >> 8) & 0xFFu] ^
              tables[1][(high >> 16) & 0xFFu] ^ tables[0][high >> 24];
        p += 8;
        left -= 8;
    }
    for (; left > 0; --left, ++p) crc = (crc >> 8) ^ tables[0][(crc ^ byte_value(*p)) & 0xFFu];
    return ~crc;
}

std::uint32_t crc32c(std::string_view text, std::uint32_t crc_before) noexcept {
    return crc32c(std::as_bytes(std::span<const char>{text.data(), text.size()}), crc_before);
}

}  // namespace brownfloc::trajectory
