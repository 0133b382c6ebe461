// Text for SVG documents: xml_escaped, and the UTF-8 decoding it checks the text with.
#include "sim/shelf_life_plot.hpp"

#include <cstddef>
#include <string>

namespace brownfloc::sim {

namespace {

// One code point from UTF-8 at text[i], advancing i; -1 for an invalid sequence (one byte eaten).
long next_code_point(const std::string& text, std::size_t& i) {
    const auto byte = [&](std::size_t k) { return static_cast<unsigned char>(text[k]); };
    const unsigned char b0 = byte(i);
    if (b0 < 0x80) {
        ++i;
        return b0;
    }
    const int length = b0 >= 0xF0 && b0 <= 0xF4 ? 4 : b0 >= 0xE0 ? (b0 < 0xF0 ? 3 : 0) : b0 >= 0xC2 ? 2 : 0;
    const auto invalid = [&i] {
        ++i;  // one byte eaten, so every later byte is looked at again
        return -1L;
    };
    if (length == 0 || i + static_cast<std::size_t>(length) > text.size()) return invalid();
    long cp = b0 & (0x7F >> length);
    for (int k = 1; k < length; ++k) {
        const unsigned char b = byte(i + static_cast<std::size_t>(k));
        if ((b & 0xC0) != 0x80) return invalid();
        cp = (cp << 6) | (b & 0x3F);
    }
    const long smallest[] = {0, 0, 0x80, 0x800, 0x10000};
    if (cp < smallest[length] || cp > 0x10FFFF || (cp >= 0xD800 && cp <= 0xDFFF)) return invalid();
    i += static_cast<std::size_t>(length);
    return cp;
}

}  // namespace

std::string xml_escaped(const std::string& text) {
    std::string out;
    out.reserve(text.size());
    for (std::size_t i = 0; i < text.size();) {
        const std::size_t start = i;
        const long cp = next_code_point(text, i);
        if (cp < 0 || cp == 0xFFFE || cp == 0xFFFF) out += "\xEF\xBF\xBD";  // U+FFFD
        else if (cp < 0x20 || (cp >= 0x7F && cp <= 0x9F)) out += ' ';   // XML 1.0 forbids most C0 controls
        else if (cp == '&') out += "&amp;";
        else if (cp == '<') out += "&lt;";
        else if (cp == '>') out += "&gt;";
        else if (cp == '"') out += "&quot;";
        else if (cp == '\'') out += "&apos;";
        else out.append(text, start, i - start);
    }
    return out;
}

}  // namespace brownfloc::sim
