#include "io/byte_reader.hpp"

#include <bit>

#include "io/byte_packing.hpp"
#include "io/message_text.hpp"
#include <cstdlib>

namespace brownfloc::io {

ByteReader::ByteReader(std::span<const std::byte> bytes, std::uint64_t base_offset, std::string_view source_name,
                       std::string_view region, FormatThrower thrower)
    : bytes_{bytes}, base_offset_{base_offset}, source_{source_name}, region_{region}, thrower_{thrower} {}

void ByteReader::fail(std::uint64_t offset_bytes, const std::string& problem) const {
    thrower_(source_, offset_bytes, problem);
    std::abort();  // a thrower that returns breaks its contract
}

const std::byte* ByteReader::take(std::size_t n, std::string_view field) {
    if (n > remaining())
        fail(offset(), message("the ", region_, " ends inside ", field, ": ", n, " bytes needed, ", remaining(), " left"));
    const std::byte* at = bytes_.data() + cursor_;
    cursor_ += n;
    return at;
}

std::uint8_t ByteReader::u8(std::string_view field) { return std::to_integer<std::uint8_t>(*take(1, field)); }
std::uint32_t ByteReader::u32(std::string_view field) { return load_u32(take(4, field)); }
std::uint64_t ByteReader::u64(std::string_view field) { return load_u64(take(8, field)); }
std::int64_t ByteReader::i64(std::string_view field) { return static_cast<std::int64_t>(u64(field)); }
float ByteReader::f32(std::string_view field) { return std::bit_cast<float>(u32(field)); }
double ByteReader::f64(std::string_view field) { return std::bit_cast<double>(u64(field)); }

bool ByteReader::boolean(std::string_view field) {
    const std::uint64_t at = offset();
    const std::uint8_t value = u8(field);
    if (value > 1) fail(at, message(field, " is ", static_cast<unsigned>(value), ": must be 0 or 1"));
    return value == 1;
}

std::string ByteReader::string(std::string_view field) {
    const std::uint64_t at = offset();
    const std::uint32_t length = u32(field);
    if (length > remaining())
        fail(at, message(field, ": a string of ", length, " bytes is claimed, only ", remaining(), " bytes are left in the ",
                         region_));
    const std::byte* text = take(length, field);
    return std::string(reinterpret_cast<const char*>(text), length);
}

std::size_t ByteReader::count(std::string_view field, std::size_t item_bytes) {
    const std::uint64_t at = offset();
    const std::uint64_t claimed = u64(field);
    // Division, not claimed * item_bytes: the product could overflow.
    if (claimed > remaining() / item_bytes)
        fail(at, message(field, ": ", claimed, " items of at least ", item_bytes, " bytes are claimed, only ", remaining(),
                         " bytes are left in the ", region_));
    return static_cast<std::size_t>(claimed);
}

std::vector<double> ByteReader::f64_array(std::string_view field) {
    const std::size_t n = count(field, 8);
    const std::byte* at = take(8 * n, field);
    std::vector<double> values(n);
    for (std::size_t i = 0; i < n; ++i) values[i] = std::bit_cast<double>(load_u64(at + 8 * i));
    return values;
}

std::vector<std::uint32_t> ByteReader::u32_array(std::string_view field) { return u32_items(count(field, 4), field); }

std::vector<std::uint32_t> ByteReader::u32_items(std::size_t n, std::string_view field) {
    const std::byte* at = take(4 * n, field);
    std::vector<std::uint32_t> values(n);
    for (std::size_t i = 0; i < n; ++i) values[i] = load_u32(at + 4 * i);
    return values;
}

}  // namespace brownfloc::io
