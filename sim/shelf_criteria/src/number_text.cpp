#include "number_text.hpp"

#include <array>
#include <charconv>

namespace brownfloc::shelf::detail {

std::string number_text(double value) {
    std::array<char, 64> buffer{};
    const auto result = std::to_chars(buffer.data(), buffer.data() + buffer.size(), value);
    return std::string(buffer.data(), result.ptr);
}

}  // namespace brownfloc::shelf::detail
