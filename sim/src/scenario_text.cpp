#include "scenario_text.hpp"

#include <algorithm>
#include <array>
#include <charconv>
#include <cmath>
#include <cstdint>
#include <cstdio>

namespace brownfloc::sim::detail {
namespace {

std::string hex_byte(unsigned char byte) {
    std::array<char, 8> buf{};
    std::snprintf(buf.data(), buf.size(), "%02X", static_cast<unsigned>(byte));
    return buf.data();
}

std::string code_point_name(char32_t cp) {
    std::array<char, 16> buf{};
    std::snprintf(buf.data(), buf.size(), "U+%04X", static_cast<unsigned>(cp));
    return buf.data();
}

// Length of the UTF-8 sequence starting at text[i] and its code point, or 0 when the bytes
// there are not well-formed UTF-8 (Unicode 15, table 3-7: no overlong forms, no surrogates,
// nothing above U+10FFFF).
std::size_t decode_utf8(std::string_view text, std::size_t i, char32_t& cp) {
    const auto byte = [&](std::size_t k) { return static_cast<unsigned char>(text[k]); };
    const unsigned char b0 = byte(i);
    if (b0 < 0x80) {
        cp = b0;
        return 1;
    }
    std::size_t length = 0;
    unsigned char lo = 0x80, hi = 0xBF;  // allowed range of the second byte
    if (b0 >= 0xC2 && b0 <= 0xDF) {
        length = 2;
        cp = b0 & 0x1Fu;
    } else if (b0 >= 0xE0 && b0 <= 0xEF) {
        length = 3;
        cp = b0 & 0x0Fu;
        if (b0 == 0xE0) lo = 0xA0;  // overlong
        if (b0 == 0xED) hi = 0x9F;  // surrogates D800-DFFF
    } else if (b0 >= 0xF0 && b0 <= 0xF4) {
        length = 4;
        cp = b0 & 0x07u;
        if (b0 == 0xF0) lo = 0x90;  // overlong
        if (b0 == 0xF4) hi = 0x8F;  // above U+10FFFF
    } else {
        return 0;
    }
    if (i + length > text.size()) return 0;
    for (std::size_t k = 1; k < length; ++k) {
        const unsigned char b = byte(i + k);
        if (k == 1 ? (b < lo || b > hi) : (b < 0x80 || b > 0xBF)) return 0;
        cp = (cp << 6) | (b & 0x3Fu);
    }
    return length;
}

}  // namespace

std::optional<TextProblem> find_text_problem(std::string_view text) {
    std::size_t line = 1, column = 1;
    for (std::size_t i = 0; i < text.size();) {
        char32_t cp = 0;
        const std::size_t length = decode_utf8(text, i, cp);
        if (length == 0)
            return TextProblem{line, column,
                               "byte 0x" + hex_byte(static_cast<unsigned char>(text[i])) +
                                   " is not valid UTF-8; save the file as UTF-8 text"};
        if (cp >= 0xFE00 && cp <= 0xFEFF)
            return TextProblem{line, column,
                               "character " + code_point_name(cp) +
                                   " is not allowed: toml++ 3.3.0 misreads code points U+FE00-U+FEFF "
                                   "(variation selectors, Arabic presentation forms, the invisible "
                                   "byte-order mark); delete it"};
        i += length;
        if (cp == U'\n') {
            ++line;
            column = 1;
        } else {
            ++column;
        }
    }
    return std::nullopt;
}

std::string_view strip_byte_order_mark(std::string_view text) {
    constexpr std::string_view bom = "\xEF\xBB\xBF";
    if (text.substr(0, bom.size()) == bom) text.remove_prefix(bom.size());
    return text;
}

// Escapes bytes (see escape_for_message) up to max_chars output characters; cut says
// whether anything was left off.
static std::string escape_cut(std::string_view bytes, std::size_t max_chars, bool& cut) {
    std::string out;
    cut = false;
    for (const char c : bytes) {
        const auto b = static_cast<unsigned char>(c);
        std::string piece;
        if (c == '"' || c == '\\')
            piece = std::string{'\\', c};
        else if (b >= 0x20 && b < 0x7F)
            piece = std::string{c};
        else
            piece = "\\x" + hex_byte(b);
        if (out.size() + piece.size() > max_chars) {
            cut = true;
            return out;
        }
        out += piece;
    }
    return out;
}

std::string escape_for_message(std::string_view bytes, std::size_t max_chars) {
    bool cut = false;
    std::string out = escape_cut(bytes, max_chars, cut);
    return cut ? out + "..." : out;
}

std::string quote_for_message(std::string_view bytes, std::size_t max_chars) {
    bool cut = false;
    const std::string inner = escape_cut(bytes, max_chars, cut);
    // The "..." goes outside the quotes: the quoted part is exactly what the input held.
    return '"' + inner + (cut ? "\"..." : "\"");
}

std::string printable_message(std::string_view text) {
    std::string out;
    for (const char c : text) {
        const auto b = static_cast<unsigned char>(c);
        out += (b >= 0x20 && b < 0x7F) ? std::string{c} : "\\x" + hex_byte(b);
    }
    return out;
}

std::string toml_string_literal(std::string_view text) {
    std::string out = "\"";
    for (const char c : text) {
        const auto b = static_cast<unsigned char>(c);
        if (c == '"' || c == '\\') {
            out += '\\';
            out += c;
        } else if (b < 0x20 || b == 0x7F) {
            std::array<char, 8> buf{};
            std::snprintf(buf.data(), buf.size(), "\\u%04X", static_cast<unsigned>(b));
            out += buf.data();
        } else {
            out += c;
        }
    }
    return out + '"';
}

std::string number_text(double v) {
    if (std::isnan(v)) return "nan";
    if (std::isinf(v)) return v > 0 ? "inf" : "-inf";
    // std::to_chars without a precision gives the shortest text that reads back bit for bit
    // (C++17 [charconv.to.chars]); take the fixed form unless it is much longer than the
    // scientific one ("100000" rather than "1e+05", but "1e-20" rather than 0.000...1).
    std::array<char, 512> buf{};
    const auto shortest = [&](std::chars_format format) {
        const auto end = std::to_chars(buf.data(), buf.data() + buf.size(), v, format).ptr;
        return std::string(buf.data(), end);
    };
    const std::string fixed = shortest(std::chars_format::fixed);
    const std::string scientific = shortest(std::chars_format::scientific);
    if (fixed.size() > scientific.size() + 2) return scientific;  // TOML accepts "1e-20", "1e+20"
    return fixed.find('.') == std::string::npos ? fixed + ".0" : fixed;  // TOML floats need '.' or 'e'
}

std::string bound_text(double v) {
    // Whole numbers in full up to 1e15 ("10000000", not "1e+07"): integer bounds read better so.
    if (v == std::trunc(v) && std::fabs(v) < 1e15) return std::to_string(static_cast<std::int64_t>(v));
    std::array<char, 64> buf{};
    const auto end = std::to_chars(buf.data(), buf.data() + buf.size(), v, std::chars_format::general, 6).ptr;
    std::string text(buf.data(), end);
    // "1e-06" -> "1e-6": to_chars pads the exponent to two digits, as printf does.
    const std::size_t e = text.find('e');
    if (e != std::string::npos && e + 2 < text.size() && text[e + 2] == '0') text.erase(e + 2, 1);
    return text;
}

std::size_t edit_distance(std::string_view a, std::string_view b) {
    const auto lower = [](char c) { return (c >= 'A' && c <= 'Z') ? static_cast<char>(c - 'A' + 'a') : c; };
    std::vector<std::size_t> previous(b.size() + 1), current(b.size() + 1);
    for (std::size_t j = 0; j <= b.size(); ++j) previous[j] = j;
    for (std::size_t i = 1; i <= a.size(); ++i) {
        current[0] = i;
        for (std::size_t j = 1; j <= b.size(); ++j) {
            const std::size_t substitution = previous[j - 1] + (lower(a[i - 1]) == lower(b[j - 1]) ? 0 : 1);
            current[j] = std::min({previous[j] + 1, current[j - 1] + 1, substitution});
        }
        std::swap(previous, current);
    }
    return previous[b.size()];
}

std::optional<std::string_view> nearest_name(std::string_view name,
                                             const std::vector<std::string_view>& candidates) {
    std::optional<std::string_view> best;
    std::size_t best_distance = 4;  // suggest only within 3 edits
    for (const std::string_view candidate : candidates) {
        const std::size_t d = edit_distance(name, candidate);
        if (d < best_distance && d < name.size()) {
            best = candidate;
            best_distance = d;
        }
    }
    return best;
}

std::string join_names(const std::vector<std::string_view>& names, std::string_view separator) {
    std::string out;
    for (std::size_t i = 0; i < names.size(); ++i) {
        if (i > 0) out += separator;
        out += names[i];
    }
    return out;
}

}  // namespace brownfloc::sim::detail
