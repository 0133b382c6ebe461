#pragma once
// Error and note texts built piece by piece. Appending (rather than `"literal" + std::string`)
// avoids a false -Wrestrict in g++ 12 at -O3 (GCC bug 105651), which would fail builds with
// BROWNFLOC_WARNINGS_AS_ERRORS; doubles print with 6 significant digits (std::to_string's
// fixed 6 decimals would show a radius of 1e-7 m as 0.000000).
#include <concepts>
#include <cstdio>
#include <string>
#include <string_view>

#include "analysis/cluster_geometry.hpp"

namespace brownfloc::analysis::detail {

inline void append_piece(std::string& text, std::string_view piece) { text.append(piece); }
inline void append_piece(std::string& text, const char* piece) { text.append(piece); }
inline void append_piece(std::string& text, const std::string& piece) { text.append(piece); }
inline void append_piece(std::string& text, std::integral auto value) { text.append(std::to_string(value)); }
inline void append_piece(std::string& text, double value) {
    char buffer[32];
    std::snprintf(buffer, sizeof buffer, "%.6g", value);
    text.append(buffer);
}
inline void append_piece(std::string& text, const Vec3& v) {
    text.append("(");
    append_piece(text, v[0]);
    text.append(", ");
    append_piece(text, v[1]);
    text.append(", ");
    append_piece(text, v[2]);
    text.append(")");
}

// message("cluster ", 7, " has R_g ", -1.0) == "cluster 7 has R_g -1"
template <class... Pieces>
std::string message(const Pieces&... pieces) {
    std::string text;
    (append_piece(text, pieces), ...);
    return text;
}

}  // namespace brownfloc::analysis::detail
