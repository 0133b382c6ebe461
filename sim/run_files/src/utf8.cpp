#include "utf8.hpp"

#include <cassert>

namespace brownfloc::run_files::detail {

std::size_t utf8_sequence_length(std::string_view text, std::size_t at, std::size_t& bad_at) {
    const auto byte = [&](std::size_t i) { return static_cast<unsigned char>(text[i]); };
    const unsigned lead = byte(at);
    // Length and the allowed range of the second byte (Unicode Table 3-7); the third and fourth
    // are always 0x80..0xBF.
    std::size_t length = 0;
    unsigned second_low = 0x80, second_high = 0xBF;
    if (lead >= 0xC2 && lead <= 0xDF) {
        length = 2;
    } else if (lead >= 0xE0 && lead <= 0xEF) {
        length = 3;
        if (lead == 0xE0) second_low = 0xA0;   // below: overlong
        if (lead == 0xED) second_high = 0x9F;  // above: surrogates
    } else if (lead >= 0xF0 && lead <= 0xF4) {
        length = 4;
        if (lead == 0xF0) second_low = 0x90;   // below: overlong
        if (lead == 0xF4) second_high = 0x8F;  // above: beyond U+10FFFF
    } else {
        bad_at = at;  // a continuation byte, C0/C1 (always overlong) or F5..FF
        return 0;
    }
    for (std::size_t i = 1; i < length; ++i) {
        const std::size_t k = at + i;
        const unsigned low = i == 1 ? second_low : 0x80u, high = i == 1 ? second_high : 0xBFu;
        if (k >= text.size() || byte(k) < low || byte(k) > high) {
            bad_at = k;
            return 0;
        }
    }
    return length;
}

void append_utf8(std::string& out, char32_t code_point) {
    assert(code_point <= 0x10FFFF && (code_point < 0xD800 || code_point > 0xDFFF));
    const auto put = [&](char32_t bits) { out += static_cast<char>(static_cast<unsigned char>(bits)); };
    if (code_point < 0x80) {
        put(code_point);
    } else if (code_point < 0x800) {
        put(0xC0 | (code_point >> 6));
        put(0x80 | (code_point & 0x3F));
    } else if (code_point < 0x10000) {
        put(0xE0 | (code_point >> 12));
        put(0x80 | ((code_point >> 6) & 0x3F));
        put(0x80 | (code_point & 0x3F));
    } else {
        put(0xF0 | (code_point >> 18));
        put(0x80 | ((code_point >> 12) & 0x3F));
        put(0x80 | ((code_point >> 6) & 0x3F));
        put(0x80 | (code_point & 0x3F));
    }
}

}  // namespace brownfloc::run_files::detail
