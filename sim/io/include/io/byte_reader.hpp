#pragma once
// A bounds-checked cursor over untrusted bytes. Every read checks the bytes left first, and
// every count is checked against the bytes left BEFORE anything is allocated for it, so a
// hostile length costs nothing. Failures throw TrajectoryFormatError naming the source, the
// absolute byte offset and the field, through the thrower the file's reader gives (each file
// kind has its own error type: TrajectoryFormatError, CheckpointFormatError).
#include <cstddef>
#include <cstdint>
#include <span>
#include <string>
#include <string_view>
#include <vector>

namespace brownfloc::io {

// Throws the caller's error for "<source>: byte <offset>: <problem>"; must not return.
using FormatThrower = void (*)(const std::string& source, std::uint64_t offset_bytes, const std::string& problem);

class ByteReader {
public:
    // bytes start at byte base_offset of source_name; region names them in messages
    // ("header payload", "frame payload").
    ByteReader(std::span<const std::byte> bytes, std::uint64_t base_offset, std::string_view source_name,
               std::string_view region, FormatThrower thrower);

    std::uint8_t u8(std::string_view field);
    std::uint32_t u32(std::string_view field);
    std::uint64_t u64(std::string_view field);
    std::int64_t i64(std::string_view field);
    float f32(std::string_view field);
    double f64(std::string_view field);
    bool boolean(std::string_view field);  // one byte, 0 or 1
    std::string string(std::string_view field);
    // A u64 item count, refused unless count * item_bytes fit in the bytes left.
    std::size_t count(std::string_view field, std::size_t item_bytes);
    // Arrays as ByteWriter writes them: a u64 count (checked as count() does) then the items;
    // u32_items reads `count` items without a stored count.
    std::vector<double> f64_array(std::string_view field);
    std::vector<std::uint32_t> u32_array(std::string_view field);
    std::vector<std::uint32_t> u32_items(std::size_t count, std::string_view field);
    // The next n bytes (checked), for arrays read item by item by the caller.
    const std::byte* take(std::size_t n, std::string_view field);

    [[nodiscard]] std::uint64_t offset() const { return base_offset_ + cursor_; }
    [[nodiscard]] std::size_t remaining() const { return bytes_.size() - cursor_; }
    [[nodiscard]] const std::string& source() const { return source_; }
    [[noreturn]] void fail(std::uint64_t offset_bytes, const std::string& problem) const;

private:
    std::span<const std::byte> bytes_;
    std::size_t cursor_ = 0;
    std::uint64_t base_offset_;
    std::string source_;
    std::string_view region_;
    FormatThrower thrower_;
};

}  // namespace brownfloc::io
