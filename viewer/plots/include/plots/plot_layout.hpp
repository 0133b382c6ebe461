#pragma once
// Where the scene and the four plots go in the viewer's image, and how a plot maps data to
// pixels. Plain C++ (no SFML). viewer/README.md "Layout" fixes the column; this header fixes
// everything inside it, and the tests compute pixels from the rules written here.
//
// Pixels: x grows to the right, y downwards; pixel (i, j) covers [i, i+1) x [j, j+1).
//
// Column: with plots shown, the plot column is P = round(0.375 * W_image) pixels wide (halves
// round away from zero) at the right of the image; the scene is {0, 0, W_image - P, H_image}.
// The column holds four plots of equal height floor(H_image / 4), stacked from y = 0 in the
// order clusters, size distribution, R_g, interaction; the H_image mod 4 rows left at the
// bottom stay empty. With plots off the scene is the whole image and every plot rect is zero.
//
// Margins of each plot's data rectangle inside its outer rectangle (plot_margins): left 58
// (y tick labels and the rotated y label), right 10, top 20 (the title), bottom 30 (x tick
// labels and the x label). A rect too small for its margins gets a data rect of zero width or
// height at the margin's corner, and nothing is drawn in it.
//
// AxisMap: a linear axis maps x in [lo, hi] onto [data.x_px, data.x_px + data.width_px]
// (lo to the left edge, hi to the right edge); a log10 axis does the same with log10 of the
// value and of the bounds. The y axis maps lo to the bottom edge data.y_px + data.height_px
// and hi to the top edge data.y_px. Results are continuous coordinates: the value lands in
// pixel floor(x_px). Values outside [lo, hi] map outside the rect (callers clip).
//
// Range rules (plot_builders.hpp applies them; values that are non-finite, or not positive
// on a log axis, are ignored when finding the largest/smallest):
//   plot 1 (clusters / N0 against t / t_half): x linear in [0, x_end], x_end = the largest
//           finite time in half-lives among all its series (1 if there is none or it is <= 0);
//           y linear in [0, 1]. The current time does not widen the range.
//   plot 2 (size distribution): x log10 in [0.8, 1.25 * largest size], y log10 in
//           [0.8, 1.25 * largest count] (largest = 1 when there are no points).
//   plot 3 (R_g / a against size): x log10 in [0.8, 1.25 * largest size] (largest = 1 when
//           empty), y log10 in [0.8 * smallest R_g/a, 1.25 * largest R_g/a], or exactly
//           [1, 10] when there are no points. The fit line does not widen the range.
//   plot 4 (U/kT against gap h in nm): x linear in [first gap, last gap], the smallest and the
//           largest finite gap among all curves ([0, 1] when there is none, [g - 0.5, g + 0.5]
//           when all are equal to g); y linear in [-y_top, y_top] with y_top = max(5,
//           1.25 * largest finite U/kT among the curves, 1.25 * largest finite barrier in kT).
#include <array>

namespace brownfloc::viewer {

struct PixelRect {
    int x_px = 0, y_px = 0, width_px = 0, height_px = 0;
};

struct ViewerLayout {
    PixelRect scene;
    bool plots_shown = false;
    std::array<PixelRect, 4> plot_outer;  // clusters, size distribution, R_g, interaction
    std::array<PixelRect, 4> plot_data;   // the same plots' data rectangles (plot_margins)
};

struct PlotMargins {
    int left_px, right_px, top_px, bottom_px;
};
inline constexpr PlotMargins plot_margins{58, 10, 20, 30};

// Fraction of the image width taken by the plot column (viewer/README.md "Layout").
inline constexpr double plot_column_fraction = 0.375;

// Index of each plot in ViewerLayout's arrays and in PlotPanel's specs.
inline constexpr int clusters_plot_index = 0;
inline constexpr int size_distribution_plot_index = 1;
inline constexpr int gyration_plot_index = 2;
inline constexpr int interaction_plot_index = 3;

// Layout of a W x H image (pixels). Throws PlotError naming the value unless both are in
// [1, 65535].
[[nodiscard]] ViewerLayout layout_viewer(int image_width_px, int image_height_px, bool plots_shown);

// The data rect of a plot whose outer rect is `outer` (plot_margins inside it).
[[nodiscard]] PixelRect plot_data_rect(const PixelRect& outer);

struct AxisRange {
    double lo = 0, hi = 1;
    bool log10 = false;
};

// Data -> continuous pixel coordinate inside a data rect; y grows downwards on screen.
// NaN for a non-finite value, a non-positive value on a log axis, or a range that is not
// usable (a non-finite bound, a non-positive bound on a log axis); a range with lo == hi
// maps every usable value to the middle of the rect. Cheap and pure: call it per point.
struct AxisMap {
    AxisRange x, y;
    PixelRect data;
    [[nodiscard]] double x_px(double x_value) const;
    [[nodiscard]] double y_px(double y_value) const;
};

}  // namespace brownfloc::viewer
