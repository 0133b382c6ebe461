#pragma once
// Text helpers for scenario input (private to brownfloc::sim): the checks made before toml++
// sees any text, the escaping used when input is quoted back in an error message, number
// formatting that round-trips, and "did you mean" suggestions. No toml++ here.
#include <cstddef>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace brownfloc::sim::detail {

// Where and why text was refused; line and column are 1-based, the column counts characters
// (code points), not bytes.
struct TextProblem {
    std::size_t line = 0;
    std::size_t column = 0;
    std::string what;
};

// The first problem in text, if any: invalid UTF-8 (overlong forms, surrogates and code
// points above U+10FFFF included) or a code point in U+FE00-U+FEFF. toml++ 3.3.0 has
// undefined behaviour on some code points in that block (e.g. U+FEDF after a value; found
// by fuzzing, see shared/TOOLCHAIN.md), so such text must never reach it.
[[nodiscard]] std::optional<TextProblem> find_text_problem(std::string_view text);

// text without a leading UTF-8 byte-order mark (EF BB BF), which editors on Windows write.
// It is U+FEFF, but at offset 0 it is harmless to drop before toml++ sees the text.
[[nodiscard]] std::string_view strip_byte_order_mark(std::string_view text);

// bytes for an error message: printable ASCII kept, '"' and '\' escaped with a backslash,
// every other byte as \xNN; cut after max_chars output characters (never inside an escape)
// with "..." appended.
[[nodiscard]] std::string escape_for_message(std::string_view bytes, std::size_t max_chars = 80);
// The same in double quotes: "text", or "tex"... when cut.
[[nodiscard]] std::string quote_for_message(std::string_view bytes, std::size_t max_chars = 80);

// A message written by a library (toml++, the salt formula parser) that may quote input: bytes
// outside printable ASCII become \xNN, so it stays on one line; quotes are kept as they are.
[[nodiscard]] std::string printable_message(std::string_view text);

// A TOML basic string ("...") holding text exactly: '"', '\' and control characters escaped,
// everything else (UTF-8 included) kept. For writing TOML, not for messages.
[[nodiscard]] std::string toml_string_literal(std::string_view text);

// The shortest decimal that reads back as exactly v, in TOML float syntax: "0.2", "1e-20",
// "25.0", "inf", "-inf", "nan". Locale-independent (std::to_chars).
[[nodiscard]] std::string number_text(double v);
// A bound quoted in "what is allowed" texts: 6 significant digits, "0.64", "1e-17", "5000";
// whole numbers below 1e15 in full ("10000000").
[[nodiscard]] std::string bound_text(double v);

// Levenshtein distance between a and b, ignoring ASCII case.
[[nodiscard]] std::size_t edit_distance(std::string_view a, std::string_view b);
// The candidate closest to name if it is within 3 edits (and fewer edits than name has
// characters, so "x" does not suggest "seed"); nullopt otherwise.
[[nodiscard]] std::optional<std::string_view> nearest_name(std::string_view name,
                                                           const std::vector<std::string_view>& candidates);
// "a, b, c"
[[nodiscard]] std::string join_names(const std::vector<std::string_view>& names, std::string_view separator = ", ");

}  // namespace brownfloc::sim::detail
