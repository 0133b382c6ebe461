#include "report_format.hpp"

#include <cmath>
#include <cstdio>

#include "sim/json_writer.hpp"

namespace brownfloc::sim {

std::string format_fixed(double value, int decimals) {
    char buffer[64];
    std::snprintf(buffer, sizeof buffer, "%.*f", decimals, value);
    return buffer;
}

std::string format_general(double value) { return format_number(value); }

std::string format_significant(double value, int significant) {
    char buffer[64];
    std::snprintf(buffer, sizeof buffer, "%.*g", significant, value);
    return buffer;
}

void write_row(std::ostream& out, const std::string& label, const std::string& value, std::size_t width) {
    out << label << std::string(label.size() < width ? width - label.size() : 1, ' ') << value << "\n";
}

std::string format_duration(double seconds) {
    struct Unit { const char* name; double seconds; };
    static constexpr Unit units[] = {{"years", 365.25 * 86400}, {"days", 86400}, {"hours", 3600},
                                     {"minutes", 60}};
    std::string out = format_significant(seconds, 3) + " s";
    for (const Unit& u : units)
        if (seconds >= u.seconds) {
            out += " (" + format_significant(seconds / u.seconds, 3) + " " + u.name + ")";
            break;
        }
    return out;
}

}  // namespace brownfloc::sim
