#pragma once
// Shortest round-trip text of a double for error messages ("0.1", "1e+300", "nan", "inf").
#include <string>

namespace brownfloc::shelf::detail {

[[nodiscard]] std::string number_text(double value);

}  // namespace brownfloc::shelf::detail
