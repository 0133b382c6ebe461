#pragma once
// Little-endian packing by explicit shifts, so the file is the same from any host and reading
// never depends on alignment. On x86-64 each store/load compiles to one move.
#include <bit>
#include <cstddef>
#include <cstdint>
#include <span>
#include <string_view>
#include <vector>

namespace brownfloc::io {

inline void store_u32(std::byte* at, std::uint32_t value) {
    for (int i = 0; i < 4; ++i) at[i] = static_cast<std::byte>((value >> (8 * i)) & 0xFFu);
}
inline void store_u64(std::byte* at, std::uint64_t value) {
    for (int i = 0; i < 8; ++i) at[i] = static_cast<std::byte>((value >> (8 * i)) & 0xFFu);
}
inline std::uint32_t load_u32(const std::byte* at) {
    std::uint32_t value = 0;
    for (int i = 0; i < 4; ++i) value |= static_cast<std::uint32_t>(std::to_integer<unsigned char>(at[i])) << (8 * i);
    return value;
}
inline std::uint64_t load_u64(const std::byte* at) {
    std::uint64_t value = 0;
    for (int i = 0; i < 8; ++i) value |= static_cast<std::uint64_t>(std::to_integer<unsigned char>(at[i])) << (8 * i);
    return value;
}

// Appends little-endian values to a byte vector.
class ByteWriter {
public:
    explicit ByteWriter(std::vector<std::byte>& out) : out_{out} {}

    void u8(std::uint8_t value) { *grow(1) = static_cast<std::byte>(value); }
    void u32(std::uint32_t value) { store_u32(grow(4), value); }
    void u64(std::uint64_t value) { store_u64(grow(8), value); }
    void i64(std::int64_t value) { u64(static_cast<std::uint64_t>(value)); }
    // Raw IEEE bits: infinities and signed zeros survive; NaN payloads too.
    void f64(double value) { u64(std::bit_cast<std::uint64_t>(value)); }
    void f32(float value) { u32(std::bit_cast<std::uint32_t>(value)); }
    void string(std::string_view text) {
        u32(static_cast<std::uint32_t>(text.size()));  // callers check size <= 2^32 - 1
        std::byte* at = grow(text.size());
        for (std::size_t i = 0; i < text.size(); ++i) at[i] = static_cast<std::byte>(text[i]);
    }
    void f64_array(std::span<const double> values) {
        u64(values.size());
        std::byte* at = grow(8 * values.size());
        for (std::size_t i = 0; i < values.size(); ++i) store_u64(at + 8 * i, std::bit_cast<std::uint64_t>(values[i]));
    }
    void u32_array(std::span<const std::uint32_t> values) {
        u64(values.size());
        u32_items(values);
    }
    // Items without a count, for arrays whose length the format fixes (N per frame).
    void u32_items(std::span<const std::uint32_t> values) {
        std::byte* at = grow(4 * values.size());
        for (std::size_t i = 0; i < values.size(); ++i) store_u32(at + 4 * i, values[i]);
    }

    // Room for n more bytes at the end; the pointer is valid until the next call.
    std::byte* grow(std::size_t n) {
        const std::size_t old_size = out_.size();
        out_.resize(old_size + n);
        return out_.data() + old_size;
    }

private:
    std::vector<std::byte>& out_;
};

}  // namespace brownfloc::io
