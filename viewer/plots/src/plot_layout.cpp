#include "plots/plot_layout.hpp"

#include "plots/plot_error.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <string>

namespace brownfloc::viewer {
namespace {

constexpr int largest_image_side_px = 65535;

void require_image_side(const char* name, int value_px) {
    if (value_px >= 1 && value_px <= largest_image_side_px) return;
    std::string message = "viewer layout: ";
    message += name;
    message += " = ";
    message += std::to_string(value_px);
    message += " px; must be in [1, ";
    message += std::to_string(largest_image_side_px);
    message += "]";
    throw PlotError(message);
}

// Fraction of the way from lo to hi, or 0.5 when lo == hi; NaN when unusable.
double axis_fraction(const AxisRange& range, double value) {
    constexpr double nan = std::numeric_limits<double>::quiet_NaN();
    if (!std::isfinite(value) || !std::isfinite(range.lo) || !std::isfinite(range.hi)) return nan;
    double lo = range.lo, hi = range.hi, v = value;
    if (range.log10) {
        if (!(v > 0.0) || !(lo > 0.0) || !(hi > 0.0)) return nan;
        lo = std::log10(lo);
        hi = std::log10(hi);
        v = std::log10(v);
    }
    if (lo == hi) return 0.5;
    // Halves keep the difference finite for bounds near +-DBL_MAX.
    const double fraction = (0.5 * v - 0.5 * lo) / (0.5 * hi - 0.5 * lo);
    return std::isfinite(fraction) ? fraction : nan;
}

}  // namespace

PixelRect plot_data_rect(const PixelRect& outer) {
    PixelRect data;
    data.x_px = outer.x_px + plot_margins.left_px;
    data.y_px = outer.y_px + plot_margins.top_px;
    data.width_px = std::max(0, outer.width_px - plot_margins.left_px - plot_margins.right_px);
    data.height_px = std::max(0, outer.height_px - plot_margins.top_px - plot_margins.bottom_px);
    return data;
}

ViewerLayout layout_viewer(int image_width_px, int image_height_px, bool plots_shown) {
    require_image_side("image width", image_width_px);
    require_image_side("image height", image_height_px);
    ViewerLayout layout;
    layout.plots_shown = plots_shown;
    if (!plots_shown) {
        layout.scene = PixelRect{0, 0, image_width_px, image_height_px};
        return layout;
    }
    const int column_width_px = static_cast<int>(std::lround(plot_column_fraction * image_width_px));
    const int scene_width_px = image_width_px - column_width_px;
    layout.scene = PixelRect{0, 0, scene_width_px, image_height_px};
    const int plot_height_px = image_height_px / 4;
    for (int i = 0; i < 4; ++i) {
        const PixelRect outer{scene_width_px, i * plot_height_px, column_width_px, plot_height_px};
        layout.plot_outer[static_cast<std::size_t>(i)] = outer;
        layout.plot_data[static_cast<std::size_t>(i)] = plot_data_rect(outer);
    }
    return layout;
}

double AxisMap::x_px(double x_value) const {
    return data.x_px + axis_fraction(x, x_value) * data.width_px;
}

double AxisMap::y_px(double y_value) const {
    return data.y_px + (1.0 - axis_fraction(y, y_value)) * data.height_px;
}

}  // namespace brownfloc::viewer
