#pragma once
// Error and warning texts built piece by piece. Appending (rather than `"literal" +
// std::string`) avoids a false -Wrestrict in g++ 12 at -O3 (GCC bug 105651), which would fail
// builds with BROWNFLOC_WARNINGS_AS_ERRORS. Doubles print in shortest round-trip form, so a
// message shows the exact value that was refused.
#include <charconv>
#include <concepts>
#include <cstdint>
#include <string>
#include <string_view>

namespace brownfloc::io {

inline void append_piece(std::string& text, std::string_view piece) { text.append(piece); }
inline void append_piece(std::string& text, const char* piece) { text.append(piece); }
inline void append_piece(std::string& text, const std::string& piece) { text.append(piece); }
inline void append_piece(std::string& text, char c) { text += c; }
inline void append_piece(std::string& text, std::integral auto value) { text.append(std::to_string(value)); }
inline void append_piece(std::string& text, double value) {
    char buffer[32];
    const auto result = std::to_chars(buffer, buffer + sizeof buffer, value);
    text.append(buffer, result.ptr);
}

// message("radius_nm[", 3, "] = ", -1.0) == "radius_nm[3] = -1"
template <class... Pieces>
std::string message(const Pieces&... pieces) {
    std::string text;
    (append_piece(text, pieces), ...);
    return text;
}

// "<source>: byte <offset>: <problem>", the form of every error and warning.
inline std::string located(std::string_view source, std::uint64_t offset_bytes, std::string_view problem) {
    return message(source, ": byte ", offset_bytes, ": ", problem);
}

// Text from the file, safe to print: in double quotes, printable ASCII as is (with \" and \\),
// every other byte as \xNN; cut after 80 characters of escaped text, marked by "...".
inline std::string quoted(std::string_view raw) {
    constexpr std::size_t max_characters = 80;
    constexpr char hex[] = "0123456789ABCDEF";
    std::string text = "\"";
    std::size_t used = 0;
    for (const char c : raw) {
        const auto byte = static_cast<unsigned char>(c);
        char piece[4];
        std::size_t length;
        if (byte == '"' || byte == '\\') {
            piece[0] = '\\';
            piece[1] = c;
            length = 2;
        } else if (byte >= 0x20 && byte < 0x7F) {
            piece[0] = c;
            length = 1;
        } else {
            piece[0] = '\\';
            piece[1] = 'x';
            piece[2] = hex[byte >> 4];
            piece[3] = hex[byte & 0x0F];
            length = 4;
        }
        if (used + length > max_characters) {
            text += "\"...";
            return text;
        }
        text.append(piece, length);
        used += length;
    }
    text += '"';
    return text;
}

}  // namespace brownfloc::io
