#pragma once
// A JSON value as read from a run file (summary.json), and a strict RFC 8259 parser for it.
//
//   const JsonValue summary = read_json_file("runs/a/summary.json");
//   if (const JsonValue* w = summary.find("stability_ratio"); w && w->is_number()) show(w->as_number());
//
// Objects keep their members in file order; numbers are doubles, and an integer literal that
// fits in int64 also keeps its exact value (seeds above 2^53 would not survive a double).
// Each value remembers the line and column (from 1, in bytes) of its first byte, so that
// checks made after parsing can still name the place.
//
// The parser accepts exactly one value with optional whitespace (space, tab, CR, LF) around it
// and refuses, with a RunFileError naming line and column: nesting deeper than 64 arrays and
// objects, strings that are not UTF-8 (overlong forms, encoded surrogates, code points above
// U+10FFFF) or hold unescaped control characters, bad escapes and lone \u surrogates, numbers
// outside the JSON grammar (leading zeros, '+', NaN, Infinity) or beyond the range of a double
// (a number too small for one becomes 0), and a key repeated in one object.
#include <cstddef>
#include <cstdint>
#include <filesystem>
#include <optional>
#include <span>
#include <string>
#include <string_view>
#include <variant>
#include <vector>

namespace brownfloc::run_files {

inline constexpr std::size_t max_json_depth = 64;  // nested arrays and objects
inline constexpr std::uint64_t max_json_file_bytes = 16ull * 1024 * 1024;

enum class JsonKind { null, boolean, number, string, array, object };

struct JsonMember;

class JsonValue {
public:
    using Array = std::vector<JsonValue>;
    using Object = std::vector<JsonMember>;  // file order; keys unique when parsed

    struct Number {
        double value = 0;
        std::optional<std::int64_t> exact_integer;  // for an integer literal within int64
    };

    // The constructors are defined below JsonMember: each needs the variant's destructor, and
    // so a complete JsonMember (clang 14 insists even in the class body).
    JsonValue() = default;  // null
    explicit JsonValue(bool b);
    explicit JsonValue(double number);
    explicit JsonValue(Number number);
    explicit JsonValue(std::string s);
    explicit JsonValue(Array a);
    explicit JsonValue(Object o);

    [[nodiscard]] JsonKind kind() const { return static_cast<JsonKind>(value_.index()); }
    [[nodiscard]] bool is_null() const { return kind() == JsonKind::null; }
    [[nodiscard]] bool is_bool() const { return kind() == JsonKind::boolean; }
    [[nodiscard]] bool is_number() const { return kind() == JsonKind::number; }
    [[nodiscard]] bool is_string() const { return kind() == JsonKind::string; }
    [[nodiscard]] bool is_array() const { return kind() == JsonKind::array; }
    [[nodiscard]] bool is_object() const { return kind() == JsonKind::object; }

    // Each accessor needs its kind (is_...() first): std::get throws std::bad_variant_access.
    [[nodiscard]] bool as_bool() const { return std::get<bool>(value_); }
    [[nodiscard]] double as_number() const { return std::get<Number>(value_).value; }
    [[nodiscard]] std::optional<std::int64_t> exact_integer() const { return std::get<Number>(value_).exact_integer; }
    [[nodiscard]] const std::string& as_string() const { return std::get<std::string>(value_); }
    [[nodiscard]] const Array& as_array() const { return std::get<Array>(value_); }
    [[nodiscard]] const Object& as_object() const { return std::get<Object>(value_); }

    // The member named key of an object; nullptr if there is none or this is not an object.
    [[nodiscard]] const JsonValue* find(std::string_view key) const;

    // Where the value starts in its file (0 for a value not from a file).
    [[nodiscard]] std::uint64_t line() const { return line_; }
    [[nodiscard]] std::uint64_t column() const { return column_; }
    void set_position(std::uint64_t line, std::uint64_t column) {
        line_ = line;
        column_ = column;
    }

private:
    // Alternatives in the order of JsonKind.
    std::variant<std::monostate, bool, Number, std::string, Array, Object> value_;
    std::uint64_t line_ = 0;
    std::uint64_t column_ = 0;
};

struct JsonMember {
    std::string key;
    JsonValue value;
};

inline JsonValue::JsonValue(bool b) : value_{b} {}
inline JsonValue::JsonValue(double number) : value_{Number{number, std::nullopt}} {}
inline JsonValue::JsonValue(Number number) : value_{number} {}
inline JsonValue::JsonValue(std::string s) : value_{std::move(s)} {}
inline JsonValue::JsonValue(Array a) : value_{std::move(a)} {}
inline JsonValue::JsonValue(Object o) : value_{std::move(o)} {}

// "null", "a boolean", "a number", "a string", "an array", "an object": for messages.
[[nodiscard]] std::string_view json_kind_name(JsonKind kind);

// Parses one JSON text; source_name is for messages only. Throws RunFileError. Memory: up to
// about 30 bytes per byte of text (an array of one-digit numbers: 0.5 GB for 16 MiB).
[[nodiscard]] JsonValue parse_json(std::span<const std::byte> bytes, std::string_view source_name);

// Reads and parses path: io::IoError if it cannot be opened or read, is not a regular file or
// is larger than max_json_file_bytes; RunFileError for its content.
[[nodiscard]] JsonValue read_json_file(const std::filesystem::path& path);

}  // namespace brownfloc::run_files
