#include "sim/json_writer.hpp"

#include <cassert>
#include <charconv>
#include <cmath>
#include <cstdio>

namespace brownfloc::sim {

std::string format_number(double value) {
    char buffer[64];
    const auto result = std::to_chars(buffer, buffer + sizeof buffer, value);
    return std::string(buffer, result.ptr);
}

Json::Json(const std::vector<std::string>& strings) : value_(Array{}) {
    for (const auto& s : strings) push(Json(s));
}

Json& Json::set(const std::string& key, Json value) {
    auto* object = std::get_if<Object>(&value_);
    assert(object);
    object->emplace_back(key, std::move(value));
    return *this;
}

Json& Json::set_number_or_null(const std::string& key, std::optional<double> number, const std::string& note) {
    if (number && std::isfinite(*number)) return set(key, *number);
    set(key, nullptr);
    return set(key + "_note", note);
}

Json& Json::push(Json value) {
    auto* array = std::get_if<Array>(&value_);
    assert(array);
    array->push_back(std::move(value));
    return *this;
}

namespace {

void write_string(std::string& out, const std::string& s) {
    out += '"';
    for (const unsigned char c : s) {
        switch (c) {
            case '"': out += "\\\""; break;
            case '\\': out += "\\\\"; break;
            case '\n': out += "\\n"; break;
            case '\t': out += "\\t"; break;
            case '\r': out += "\\r"; break;
            default:
                if (c < 0x20) {
                    char buffer[8];
                    std::snprintf(buffer, sizeof buffer, "\\u%04x", c);
                    out += buffer;
                } else {
                    out += static_cast<char>(c);
                }
        }
    }
    out += '"';
}

void newline(std::string& out, int indent, int depth) {
    if (indent <= 0) return;
    out += '\n';
    out.append(static_cast<std::size_t>(indent * depth), ' ');
}

}  // namespace

void Json::write(std::string& out, int indent, int depth) const {
    if (std::holds_alternative<std::nullptr_t>(value_)) {
        out += "null";
    } else if (const bool* b = std::get_if<bool>(&value_)) {
        out += *b ? "true" : "false";
    } else if (const double* d = std::get_if<double>(&value_)) {
        out += std::isfinite(*d) ? format_number(*d) : "null";
    } else if (const std::int64_t* i = std::get_if<std::int64_t>(&value_)) {
        out += std::to_string(*i);
    } else if (const std::string* s = std::get_if<std::string>(&value_)) {
        write_string(out, *s);
    } else if (const Array* a = std::get_if<Array>(&value_)) {
        out += '[';
        for (std::size_t k = 0; k < a->size(); ++k) {
            if (k) out += ',';
            newline(out, indent, depth + 1);
            (*a)[k].write(out, indent, depth + 1);
        }
        if (!a->empty()) newline(out, indent, depth);
        out += ']';
    } else if (const Object* o = std::get_if<Object>(&value_)) {
        out += '{';
        for (std::size_t k = 0; k < o->size(); ++k) {
            if (k) out += ',';
            newline(out, indent, depth + 1);
            write_string(out, (*o)[k].first);
            out += indent > 0 ? ": " : ":";
            (*o)[k].second.write(out, indent, depth + 1);
        }
        if (!o->empty()) newline(out, indent, depth);
        out += '}';
    }
}

std::string Json::dump(int indent) const {
    std::string out;
    write(out, indent, 0);
    return out;
}

}  // namespace brownfloc::sim
