// parse_json: a recursive-descent parser of RFC 8259 JSON, strict in everything (see
// run_files/json_value.hpp). Newlines occur only in whitespace in a valid text (strings must
// escape them), so the line count is kept there and a column is "offset - line start + 1".
#include <algorithm>
#include <charconv>
#include <cstdint>
#include <numeric>
#include <system_error>

#include "io/message_text.hpp"
#include "run_files/json_value.hpp"
#include "run_files/run_file_error.hpp"
#include "utf8.hpp"

namespace brownfloc::run_files {

namespace {

using io::message;

constexpr std::string_view value_rule = "a JSON value is an object, array, string, number, true, false or null";
constexpr std::string_view number_rule = "numbers are -?(0|[1-9][0-9]*)(.[0-9]+)?([eE][+-]?[0-9]+)?";

// Where a string, array or object starts, for "the file ends inside ..." messages.
struct Place {
    std::uint64_t line, column;
};

std::string opened_at(Place place) { return message("opened at line ", place.line, " column ", place.column); }

bool is_digit(char c) { return c >= '0' && c <= '9'; }

int hex_digit(char c) {
    if (c >= '0' && c <= '9') return c - '0';
    if (c >= 'a' && c <= 'f') return c - 'a' + 10;
    if (c >= 'A' && c <= 'F') return c - 'A' + 10;
    return -1;
}

class JsonParser {
public:
    JsonParser(std::span<const std::byte> bytes, std::string_view source)
        : text_{reinterpret_cast<const char*>(bytes.data()), bytes.size()}, source_{source} {}

    JsonValue parse_document() {
        skip_whitespace();
        JsonValue value = parse_value(0);
        skip_whitespace();
        if (at_ < text_.size())
            fail(at_, message("unexpected ", io::quoted(text_.substr(at_, 1)),
                              " after the JSON value; only whitespace may follow it"));
        return value;
    }

private:
    JsonValue parse_value(std::size_t depth) {
        if (at_ >= text_.size()) fail(at_, message("the file ends where a value should start; ", value_rule));
        const std::uint64_t line = line_number_, column = column_of(at_);
        JsonValue value;
        const char c = text_[at_];
        if (c == '{' || c == '[') {
            if (depth == max_json_depth)
                fail(at_, message("more than ", max_json_depth, " nested arrays and objects; ", max_json_depth,
                                  " is the limit"));
            value = c == '{' ? parse_object(depth + 1) : parse_array(depth + 1);
        } else if (c == '"') {
            value = JsonValue(parse_string());
        } else if (c == '-' || is_digit(c)) {
            value = JsonValue(parse_number());
        } else if (c == 't') {
            expect_word("true");
            value = JsonValue(true);
        } else if (c == 'f') {
            expect_word("false");
            value = JsonValue(false);
        } else if (c == 'n') {
            expect_word("null");
        } else {
            fail(at_, message("unexpected ", io::quoted(text_.substr(at_, 1)), "; ", value_rule));
        }
        value.set_position(line, column);
        return value;
    }

    JsonValue parse_array(std::size_t depth) {
        const Place opened = here();
        ++at_;
        JsonValue::Array items;
        skip_whitespace();
        if (at_ < text_.size() && text_[at_] == ']') {
            ++at_;
            return JsonValue(std::move(items));
        }
        while (true) {
            items.push_back(parse_value(depth));
            skip_whitespace();
            expect_more("array", opened);
            if (text_[at_] == ']') break;
            if (text_[at_] != ',')
                fail(at_, message("expected , or ] after an element of the array ", opened_at(opened), ", found ",
                                  io::quoted(text_.substr(at_, 1))));
            ++at_;
            skip_whitespace();
        }
        ++at_;
        return JsonValue(std::move(items));
    }

    JsonValue parse_object(std::size_t depth) {
        const Place opened = here();
        ++at_;
        JsonValue::Object members;
        std::vector<std::pair<std::uint64_t, std::uint64_t>> key_positions;
        skip_whitespace();
        if (at_ < text_.size() && text_[at_] == '}') {
            ++at_;
            return JsonValue(std::move(members));
        }
        while (true) {
            expect_more("object", opened);
            if (text_[at_] != '"')
                fail(at_, message("expected a key (a string) in the object ", opened_at(opened), ", found ",
                                  io::quoted(text_.substr(at_, 1))));
            key_positions.emplace_back(line_number_, column_of(at_));
            std::string key = parse_string();
            skip_whitespace();
            expect_more("object", opened);
            if (text_[at_] != ':')
                fail(at_, message("expected : after the key ", io::quoted(key), ", found ",
                                  io::quoted(text_.substr(at_, 1))));
            ++at_;
            skip_whitespace();
            JsonValue value = parse_value(depth);
            members.push_back(JsonMember{std::move(key), std::move(value)});
            skip_whitespace();
            expect_more("object", opened);
            if (text_[at_] == '}') break;
            if (text_[at_] != ',')
                fail(at_, message("expected , or } after a member of the object ", opened_at(opened), ", found ",
                                  io::quoted(text_.substr(at_, 1))));
            ++at_;
            skip_whitespace();
        }
        ++at_;
        refuse_repeated_keys(members, key_positions);
        return JsonValue(std::move(members));
    }

    // Names the repeat that comes first in the file. Sorting keeps this O(n log n) for an object
    // of a million keys, where comparing each key with all before it would not finish.
    void refuse_repeated_keys(const JsonValue::Object& members,
                              const std::vector<std::pair<std::uint64_t, std::uint64_t>>& positions) const {
        if (members.size() < 2) return;
        std::vector<std::size_t> order(members.size());
        std::iota(order.begin(), order.end(), std::size_t{0});
        std::stable_sort(order.begin(), order.end(),
                         [&](std::size_t a, std::size_t b) { return members[a].key < members[b].key; });
        std::size_t repeat = members.size(), first = 0;
        for (std::size_t k = 1; k < order.size(); ++k) {
            // order[k-1] < order[k] within a run of equal keys (stable sort); the run's first
            // repeat is its second entry.
            if (members[order[k]].key != members[order[k - 1]].key) continue;
            if (k >= 2 && members[order[k - 2]].key == members[order[k]].key) continue;
            if (order[k] < repeat) {
                repeat = order[k];
                first = order[k - 1];
            }
        }
        if (repeat == members.size()) return;
        throw RunFileError(
            source_, positions[repeat].first, positions[repeat].second,
            message("the key ", io::quoted(members[repeat].key), " repeats the key at line ", positions[first].first,
                    " column ", positions[first].second, "; keys in an object are unique"));
    }

    std::string parse_string() {
        const Place opened = here();
        ++at_;
        std::string out;
        while (true) {
            if (at_ >= text_.size()) fail(at_, message("the file ends inside the string ", opened_at(opened)));
            const auto byte = static_cast<unsigned char>(text_[at_]);
            if (byte == '"') {
                ++at_;
                return out;
            }
            if (byte == '\\') {
                parse_escape(out, opened);
            } else if (byte < 0x20) {
                fail(at_, message("control character ", io::quoted(text_.substr(at_, 1)),
                                  " in a string; strings escape them (\\n, \\t, \\u001F)"));
            } else if (byte < 0x80) {
                std::size_t stop = at_;
                while (stop < text_.size()) {
                    const auto b = static_cast<unsigned char>(text_[stop]);
                    if (b < 0x20 || b >= 0x80 || b == '"' || b == '\\') break;
                    ++stop;
                }
                out.append(text_.substr(at_, stop - at_));
                at_ = stop;
            } else {
                std::size_t bad_at = 0;
                const std::size_t length = detail::utf8_sequence_length(text_, at_, bad_at);
                if (length == 0) {
                    if (bad_at >= text_.size())
                        fail(bad_at, message("the file ends inside the string ", opened_at(opened)));
                    fail(bad_at, message("byte ", io::quoted(text_.substr(bad_at, 1)),
                                         " is not valid UTF-8 here; strings are UTF-8 without overlong forms, "
                                         "surrogates or code points above U+10FFFF"));
                }
                out.append(text_.substr(at_, length));
                at_ += length;
            }
        }
    }

    // At a backslash inside a string.
    void parse_escape(std::string& out, Place opened) {
        const std::size_t escape_at = at_;
        if (++at_ >= text_.size()) fail(at_, message("the file ends inside the string ", opened_at(opened)));
        const char c = text_[at_++];
        switch (c) {
            case '"': out += '"'; return;
            case '\\': out += '\\'; return;
            case '/': out += '/'; return;
            case 'b': out += '\b'; return;
            case 'f': out += '\f'; return;
            case 'n': out += '\n'; return;
            case 'r': out += '\r'; return;
            case 't': out += '\t'; return;
            case 'u': break;
            default:
                fail(escape_at, message("unknown escape ", io::quoted(text_.substr(escape_at, 2)),
                                        "; escapes are \\\" \\\\ \\/ \\b \\f \\n \\r \\t and \\uXXXX"));
        }
        char32_t code_point = read_hex4(opened);
        if (code_point >= 0xDC00 && code_point <= 0xDFFF)
            fail(escape_at, message("lone low surrogate ", io::quoted(text_.substr(escape_at, 6)),
                                    "; a \\uDC00-\\uDFFF escape must follow a \\uD800-\\uDBFF escape"));
        if (code_point >= 0xD800 && code_point <= 0xDBFF) {
            const std::size_t low_at = at_;
            if (text_.substr(at_, 2) != "\\u")
                fail(escape_at, message("lone high surrogate ", io::quoted(text_.substr(escape_at, 6)),
                                        "; a \\uD800-\\uDBFF escape must be followed by a \\uDC00-\\uDFFF escape"));
            at_ += 2;
            const char32_t low = read_hex4(opened);
            if (low < 0xDC00 || low > 0xDFFF)
                fail(low_at,
                     message("high surrogate ", io::quoted(text_.substr(escape_at, 6)), " followed by ",
                             io::quoted(text_.substr(low_at, 6)), "; it must be followed by a \\uDC00-\\uDFFF escape"));
            code_point = 0x10000 + ((code_point - 0xD800) << 10) + (low - 0xDC00);
        }
        detail::append_utf8(out, code_point);
    }

    // At the first of the four hex digits after \u.
    char32_t read_hex4(Place opened) {
        char32_t value = 0;
        for (int i = 0; i < 4; ++i, ++at_) {
            if (at_ >= text_.size()) fail(at_, message("the file ends inside the string ", opened_at(opened)));
            const int digit = hex_digit(text_[at_]);
            if (digit < 0)
                fail(at_,
                     message("found ", io::quoted(text_.substr(at_, 1)), " in a \\u escape; \\u takes 4 hex digits"));
            value = value * 16 + static_cast<char32_t>(digit);
        }
        return value;
    }

    JsonValue::Number parse_number() {
        const std::size_t start = at_;
        const bool negative = text_[at_] == '-';
        if (negative) ++at_;
        const std::size_t integer_start = at_;
        need_digit("where the digits of a number start");
        if (text_[at_] == '0') {
            ++at_;
            if (at_ < text_.size() && is_digit(text_[at_]))
                fail(start, message("leading zero in ", io::quoted(number_text(start)), "; ", number_rule));
        } else {
            skip_digits();
        }
        const std::size_t integer_end = at_;
        bool integer_literal = true;
        if (at_ < text_.size() && text_[at_] == '.') {
            integer_literal = false;
            ++at_;
            need_digit("after the decimal point");
            skip_digits();
        }
        std::int64_t exponent = 0;
        if (at_ < text_.size() && (text_[at_] == 'e' || text_[at_] == 'E')) {
            integer_literal = false;
            ++at_;
            bool exponent_negative = false;
            if (at_ < text_.size() && (text_[at_] == '+' || text_[at_] == '-')) exponent_negative = text_[at_++] == '-';
            need_digit("in the exponent");
            for (; at_ < text_.size() && is_digit(text_[at_]); ++at_)
                exponent = std::min<std::int64_t>(exponent * 10 + (text_[at_] - '0'), 1'000'000'000);  // saturates
            if (exponent_negative) exponent = -exponent;
        }
        const std::string_view literal = text_.substr(start, at_ - start);
        JsonValue::Number number;
        const auto [end, error] = std::from_chars(literal.data(), literal.data() + literal.size(), number.value);
        if (error == std::errc::result_out_of_range) {
            if (decimal_magnitude(integer_start, integer_end, exponent) >= 0)
                fail(start, message("the number ", io::quoted(literal), " is beyond the range of a double"));
            number.value = negative ? -0.0 : 0.0;  // too small for a double: rounds to zero
        } else if (error != std::errc() || end != literal.data() + literal.size()) {
            fail(start, message("cannot convert the number ", io::quoted(literal), "; ", number_rule));  // not expected
        }
        if (integer_literal) {
            std::int64_t exact = 0;
            const auto [int_end, int_error] = std::from_chars(literal.data(), literal.data() + literal.size(), exact);
            if (int_error == std::errc() && int_end == literal.data() + literal.size()) number.exact_integer = exact;
        }
        return number;
    }

    // The power of ten of the first significant digit of a grammatical number that from_chars
    // found out of range (so it has one): >= 0 means it overflowed, < 0 that it underflowed.
    std::int64_t decimal_magnitude(std::size_t integer_start, std::size_t integer_end, std::int64_t exponent) const {
        if (text_[integer_start] != '0') return static_cast<std::int64_t>(integer_end - integer_start) - 1 + exponent;
        std::int64_t position = 0;
        for (std::size_t k = integer_end + 1; k < text_.size() && is_digit(text_[k]); ++k) {
            --position;
            if (text_[k] != '0') break;
        }
        return position + exponent;
    }

    std::string_view number_text(std::size_t start) const {
        std::size_t end = start + 1;
        while (end < text_.size() && (is_digit(text_[end]) || text_[end] == '.' || text_[end] == 'e' ||
                                      text_[end] == 'E' || text_[end] == '+' || text_[end] == '-'))
            ++end;
        return text_.substr(start, end - start);
    }

    void need_digit(std::string_view where) {
        if (at_ >= text_.size()) fail(at_, message("the file ends ", where, "; ", number_rule));
        if (!is_digit(text_[at_]))
            fail(at_,
                 message("expected a digit ", where, ", found ", io::quoted(text_.substr(at_, 1)), "; ", number_rule));
    }

    void skip_digits() {
        while (at_ < text_.size() && is_digit(text_[at_])) ++at_;
    }

    void expect_word(std::string_view word) {
        for (std::size_t i = 0; i < word.size(); ++i, ++at_) {
            if (at_ >= text_.size()) fail(at_, message("the file ends inside ", io::quoted(word)));
            if (text_[at_] != word[i])
                fail(at_, message("expected ", io::quoted(word), ", found ", io::quoted(text_.substr(at_, 1)), "; ",
                                  value_rule));
        }
    }

    void expect_more(std::string_view container, Place opened) const {
        if (at_ >= text_.size()) fail(at_, message("the file ends inside the ", container, " ", opened_at(opened)));
    }

    void skip_whitespace() {
        for (; at_ < text_.size(); ++at_) {
            const char c = text_[at_];
            if (c == '\n') {
                ++line_number_;
                line_start_ = at_ + 1;
            } else if (c != ' ' && c != '\t' && c != '\r') {
                return;
            }
        }
    }

    std::uint64_t column_of(std::size_t offset) const { return offset - line_start_ + 1; }
    Place here() const { return Place{line_number_, column_of(at_)}; }

    [[noreturn]] void fail(std::size_t offset, const std::string& problem) const {
        throw RunFileError(source_, line_number_, column_of(offset), problem);
    }

    std::string_view text_;
    std::string_view source_;
    std::size_t at_ = 0;
    std::uint64_t line_number_ = 1;
    std::size_t line_start_ = 0;
};

}  // namespace

JsonValue parse_json(std::span<const std::byte> bytes, std::string_view source_name) {
    return JsonParser(bytes, source_name).parse_document();
}

}  // namespace brownfloc::run_files
