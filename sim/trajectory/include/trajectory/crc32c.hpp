#pragma once
// CRC-32C (Castagnoli; reflected polynomial 0x82F63B78, initial value and final XOR all ones),
// the checksum of every header and frame in a trajectory file. Known answer:
// crc32c("123456789") == 0xE3069283 (RFC 3720, iSCSI, appendix B.4).
//
// Incremental: crc32c(b, crc32c(a)) == crc32c(a followed by b), so a long payload can be
// checked in pieces. Software tables (slicing by 8; Kounavis & Berry 2005, Intel), about
// 1-2 GB/s on one core: no CPU-specific instructions, so the result and the build are the same
// on every machine. Thread-safe: the tables are constants.
#include <cstddef>
#include <cstdint>
#include <span>
#include <string_view>

namespace brownfloc::trajectory {

// The CRC-32C of bytes, continuing from the CRC of what came before them (0 for a start).
[[nodiscard]] std::uint32_t crc32c(std::span<const std::byte> bytes, std::uint32_t crc_before = 0) noexcept;
[[nodiscard]] std::uint32_t crc32c(std::string_view text, std::uint32_t crc_before = 0) noexcept;

}  // namespace brownfloc::trajectory
