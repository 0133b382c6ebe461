#pragma once
// UTF-8 as RFC 3629 defines it (Table 3-7 of the Unicode Standard, "well-formed UTF-8 byte
// sequences"): no overlong forms, no encoded surrogates (U+D800..U+DFFF), nothing above
// U+10FFFF.
#include <cstddef>
#include <string>
#include <string_view>

namespace brownfloc::run_files::detail {

// The length (2 to 4) of the well-formed multi-byte sequence starting at text[at] (a byte
// >= 0x80), or 0 if there is none; then bad_at is the offset of the first byte that breaks it.
[[nodiscard]] std::size_t utf8_sequence_length(std::string_view text, std::size_t at, std::size_t& bad_at);

// Appends code point (at most U+10FFFF, not a surrogate) to out in UTF-8.
void append_utf8(std::string& out, char32_t code_point);

}  // namespace brownfloc::run_files::detail
