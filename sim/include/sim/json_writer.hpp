#pragma once
// A small JSON value and its writer. Objects keep the insertion order of their keys so
// outputs are stable and diff-able. Numbers are written in the shortest form that reads
// back to the same double; JSON has no NaN or inf, so a non-finite number is written as
// null (callers add a `<key>_note` saying why; see Json::number_or_null).
#include <cstdint>
#include <optional>
#include <string>
#include <utility>
#include <variant>
#include <vector>

namespace brownfloc::sim {

class Json {
public:
    using Array = std::vector<Json>;
    using Object = std::vector<std::pair<std::string, Json>>;

    Json() = default;  // null
    Json(std::nullptr_t) {}
    Json(bool b) : value_(b) {}
    Json(double d) : value_(d) {}
    Json(int i) : value_(static_cast<double>(i)) {}
    Json(std::int64_t i) : value_(i) {}
    Json(std::uint64_t i) : value_(static_cast<std::int64_t>(i)) {}
    Json(const char* s) : value_(std::string(s)) {}
    Json(std::string s) : value_(std::move(s)) {}
    Json(Array a) : value_(std::move(a)) {}
    Json(Object o) : value_(std::move(o)) {}
    Json(const std::vector<std::string>& strings);

    [[nodiscard]] static Json object() { return Json(Object{}); }
    [[nodiscard]] static Json array() { return Json(Array{}); }

    // Appends key: value to an object (asserts that this is an object).
    Json& set(const std::string& key, Json value);
    // Appends key: number, or key: null plus key_note: note when the number is absent or
    // not finite.
    Json& set_number_or_null(const std::string& key, std::optional<double> number, const std::string& note);
    // Appends to an array.
    Json& push(Json value);

    [[nodiscard]] std::string dump(int indent = 2) const;

private:
    void write(std::string& out, int indent, int depth) const;
    std::variant<std::nullptr_t, bool, double, std::int64_t, std::string, Array, Object> value_{nullptr};
};

// Shortest round-trip decimal form of a finite double ("1e-20", "0.2", "276.128...").
[[nodiscard]] std::string format_number(double value);

}  // namespace brownfloc::sim
