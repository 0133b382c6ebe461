#pragma once
// Constants and number text shared by the shelf-life sources (private to brownfloc::sim).
#include <cstdio>
#include <string>

namespace brownfloc::sim::detail {

inline constexpr double seconds_per_day = 86400.0;
inline constexpr double max_total_salt_mM = 5000.0;  // as the scenario schema allows

// Four significant digits, as the text report and the messages show numbers: "1.362", "4.21e+12".
inline std::string g4(double v) {
    char buffer[32];
    std::snprintf(buffer, sizeof buffer, "%.4g", v);
    return buffer;
}

}  // namespace brownfloc::sim::detail
