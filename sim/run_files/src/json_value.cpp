#include "run_files/json_value.hpp"

#include "whole_file.hpp"

namespace brownfloc::run_files {

const JsonValue* JsonValue::find(std::string_view key) const {
    const auto* object = std::get_if<Object>(&value_);
    if (object == nullptr) return nullptr;
    for (const JsonMember& member : *object)
        if (member.key == key) return &member.value;
    return nullptr;
}

std::string_view json_kind_name(JsonKind kind) {
    switch (kind) {
        case JsonKind::null: return "null";
        case JsonKind::boolean: return "a boolean";
        case JsonKind::number: return "a number";
        case JsonKind::string: return "a string";
        case JsonKind::array: return "an array";
        case JsonKind::object: return "an object";
    }
    return "a JSON value";
}

JsonValue read_json_file(const std::filesystem::path& path) {
    const std::vector<std::byte> bytes = detail::read_whole_file(path, max_json_file_bytes);
    return parse_json(bytes, path.string());
}

}  // namespace brownfloc::run_files
