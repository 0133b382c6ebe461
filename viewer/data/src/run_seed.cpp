// The run's seed from the resolved scenario text. Not a TOML parser: the resolved text is
// written by the run itself (sim/src/resolved_scenario.cpp) with one `key = value` per line,
// plain table headers and decimal integers, and the viewer must not link toml++. Anything
// else in a [run] seed line is refused with its line number.
#include <charconv>
#include <cstdint>
#include <optional>
#include <string>
#include <string_view>

#include "data/frame_analysis.hpp"
#include "data/viewer_input_error.hpp"
#include "io/message_text.hpp"

namespace brownfloc::viewer {
namespace {

std::string_view trimmed(std::string_view text) {
    const std::size_t begin = text.find_first_not_of(" \t\r");
    if (begin == std::string_view::npos) return {};
    const std::size_t end = text.find_last_not_of(" \t\r");
    return text.substr(begin, end - begin + 1);
}

// The table a header line opens ("run" for "[run]" or "[ run ]"), or nothing for an array of
// tables ("[[species]]") or a line that is not a header.
std::optional<std::string_view> table_name(std::string_view line) {
    if (line.size() < 2 || line.front() != '[') return std::nullopt;
    if (line[1] == '[') return std::string_view{};  // [[...]]: some other table
    const std::size_t close = line.find(']');
    if (close == std::string_view::npos) return std::nullopt;
    return trimmed(line.substr(1, close - 1));
}

[[noreturn]] void refuse(std::size_t line_number, std::string_view value) {
    throw ViewerInputError(io::message("resolved scenario (trajectory header), line ", line_number, ": [run] seed = ",
                                       io::quoted(value), ": expected a whole number"));
}

// A TOML decimal integer (optional sign, digits, single underscores between digits), as an
// int64. The run writes its uint64 seed cast to int64 (TomlWriter::integer), so a seed of
// 2^63 or more appears negative; casting back gives the seed the run used.
std::uint64_t parse_seed(std::string_view value, std::size_t line_number) {
    std::string digits;
    std::size_t at = 0;
    if (at < value.size() && (value[at] == '+' || value[at] == '-')) digits += value[at++];
    bool previous_was_digit = false;
    for (; at < value.size(); ++at) {
        const char c = value[at];
        if (c >= '0' && c <= '9') {
            digits += c;
            previous_was_digit = true;
        } else if (c == '_' && previous_was_digit && at + 1 < value.size() && value[at + 1] >= '0' && value[at + 1] <= '9') {
            previous_was_digit = false;
        } else {
            refuse(line_number, value);
        }
    }
    if (digits.empty() || digits == "+" || digits == "-") refuse(line_number, value);
    const std::size_t skip = digits.front() == '+' ? 1 : 0;
    std::int64_t seed = 0;
    const char* begin = digits.data() + skip;
    const char* end = digits.data() + digits.size();
    const auto [stop, error] = std::from_chars(begin, end, seed);
    if (error != std::errc{} || stop != end) refuse(line_number, value);
    return static_cast<std::uint64_t>(seed);
}

}  // namespace

std::uint64_t run_seed_from_scenario_text(std::string_view text) {
    bool in_run = false;
    std::size_t line_number = 0;
    while (!text.empty()) {
        const std::size_t newline = text.find('\n');
        const std::string_view raw = text.substr(0, newline);
        text = newline == std::string_view::npos ? std::string_view{} : text.substr(newline + 1);
        ++line_number;
        const std::string_view line = trimmed(raw);
        if (line.empty() || line.front() == '#') continue;
        if (const std::optional<std::string_view> table = table_name(line)) {
            in_run = *table == "run";
            continue;
        }
        if (!in_run) continue;
        const std::size_t equals = line.find('=');
        if (equals == std::string_view::npos) continue;
        const std::string_view key = trimmed(line.substr(0, equals));
        if (key != "seed" && key != "\"seed\"") continue;
        std::string_view value = line.substr(equals + 1);
        value = trimmed(value.substr(0, value.find('#')));
        return parse_seed(value, line_number);
    }
    return 0;
}

}  // namespace brownfloc::viewer
