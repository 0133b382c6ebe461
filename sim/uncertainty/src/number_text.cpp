#include "number_text.hpp"

#include <array>
#include <charconv>
#include <cmath>

namespace brownfloc::uncertainty::detail {

namespace {

std::string non_finite_text(double value) {
    if (std::isnan(value)) return "nan";
    return value > 0 ? "inf" : "-inf";
}

}  // namespace

std::string number_text(double value) {
    if (!std::isfinite(value)) return non_finite_text(value);
    std::array<char, 32> buffer{};
    const auto result = std::to_chars(buffer.data(), buffer.data() + buffer.size(), value);
    return std::string(buffer.data(), result.ptr);
}

std::string scientific_text(double value, int significant) {
    if (!std::isfinite(value)) return non_finite_text(value);
    std::array<char, 48> buffer{};
    const int precision = significant > 1 ? significant - 1 : 0;
    const auto result =
        std::to_chars(buffer.data(), buffer.data() + buffer.size(), value, std::chars_format::scientific, precision);
    return std::string(buffer.data(), result.ptr);
}

}  // namespace brownfloc::uncertainty::detail
