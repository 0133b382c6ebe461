#include "plots/plot_spec.hpp"

#include <bit>
#include <cstdint>

namespace brownfloc::viewer {
namespace {

bool same_bits(double a, double b) { return std::bit_cast<std::uint64_t>(a) == std::bit_cast<std::uint64_t>(b); }

bool same_values(const std::vector<double>& a, const std::vector<double>& b) {
    if (a.size() != b.size()) return false;
    for (std::size_t i = 0; i < a.size(); ++i)
        if (!same_bits(a[i], b[i])) return false;
    return true;
}

bool same_colour(const PlotColour& a, const PlotColour& b) { return a.r == b.r && a.g == b.g && a.b == b.b; }

bool same_range(const AxisRange& a, const AxisRange& b) {
    return same_bits(a.lo, b.lo) && same_bits(a.hi, b.hi) && a.log10 == b.log10;
}

bool same_series(const Series& a, const Series& b) {
    return a.label == b.label && a.style == b.style && same_colour(a.colour, b.colour) && same_values(a.x, b.x) &&
           same_values(a.y, b.y);
}

bool same_marker(const VerticalMarker& a, const VerticalMarker& b) {
    return same_bits(a.x, b.x) && a.label == b.label && same_colour(a.colour, b.colour);
}

template <typename T, typename Same>
bool same_lists(const std::vector<T>& a, const std::vector<T>& b, Same same) {
    if (a.size() != b.size()) return false;
    for (std::size_t i = 0; i < a.size(); ++i)
        if (!same(a[i], b[i])) return false;
    return true;
}

}  // namespace

bool same_plot(const PlotSpec& a, const PlotSpec& b) {
    if (a.title != b.title || a.x_label != b.x_label || a.y_label != b.y_label) return false;
    if (!same_range(a.x, b.x) || !same_range(a.y, b.y)) return false;
    if (a.current_x.has_value() != b.current_x.has_value()) return false;
    if (a.current_x && !same_bits(*a.current_x, *b.current_x)) return false;
    if (a.notes != b.notes || a.legend_corner != b.legend_corner) return false;
    return same_lists(a.series, b.series, same_series) && same_lists(a.markers, b.markers, same_marker);
}

}  // namespace brownfloc::viewer
