#pragma once
// Numbers in messages: the shortest text that reads back to the same double ("10", "0.1",
// "6.2e-03" for a probability), and "inf"/"-inf"/"nan" for the rest.
#include <string>

namespace brownfloc::uncertainty::detail {

// Shortest round-trip form (std::to_chars without a precision).
[[nodiscard]] std::string number_text(double value);

// Scientific with `significant` digits, e.g. 6.2e-03 for (0.0062, 2).
[[nodiscard]] std::string scientific_text(double value, int significant);

}  // namespace brownfloc::uncertainty::detail
