#pragma once
// One plot as plain data: titles, axis ranges, series, vertical markers, notes. Plain C++ (no
// SFML): plot_builders.hpp fills these from run data, plot_drawing.hpp draws them.
//
// Text is UTF-8. Series and markers keep every value they are given: the drawing skips
// non-finite points (a line breaks there) and, on a log axis, non-positive ones.
#include "plots/plot_layout.hpp"

#include <cstdint>
#include <optional>
#include <string>
#include <vector>

namespace brownfloc::viewer {

struct PlotColour {
    std::uint8_t r, g, b;
};

struct Series {
    enum class Style { line, dashed_line, points };
    std::string label;  // shown in the legend; empty: not listed
    std::vector<double> x, y;
    Style style = Style::line;
    PlotColour colour{200, 200, 200};
};

struct VerticalMarker {
    double x;           // data units of the x axis
    std::string label;  // written beside the marker near the top of the data rect
    PlotColour colour;
};

// Where the legend (labelled series, then notes) goes inside the data rect.
enum class LegendCorner { top_right, top_left };

struct PlotSpec {
    std::string title, x_label, y_label;
    AxisRange x, y;
    std::vector<Series> series;          // drawn in order: later ones on top
    std::vector<VerticalMarker> markers;
    std::optional<double> current_x;     // the current time, drawn as its own marker
    std::vector<std::string> notes;      // one line each, under the legend
    LegendCorner legend_corner = LegendCorner::top_right;
};

// True when a and b would draw the same picture: every field equal, doubles compared bit for
// bit (so NaN equals the same NaN, and 0 differs from -0). PlotPanel redraws on a difference.
[[nodiscard]] bool same_plot(const PlotSpec& a, const PlotSpec& b);

// Fixed colours, our own, for a dark background (22, 24, 30). The kinds differ in lightness as
// well as hue, so they stay apart in grey and for most colour-vision deficiencies (not tested).
namespace plot_colours {
inline constexpr PlotColour measured{236, 236, 240};              // measured data: near white
inline constexpr PlotColour smoluchowski{92, 170, 240};           // plain Smoluchowski: blue
inline constexpr PlotColour transient_corrected{240, 150, 40};    // with the transient term: orange
inline constexpr PlotColour cluster_points{236, 236, 240};        // per-cluster points (plots 2, 3)
inline constexpr PlotColour fit_line{220, 110, 170};              // fitted d_f line: pink
inline constexpr PlotColour current_time{250, 225, 80};           // current-time marker: yellow
inline constexpr PlotColour barrier_marker{235, 90, 60};          // barrier gap: red
inline constexpr PlotColour capture_marker{60, 190, 130};         // capture gap: green
// Interaction curves, one per species pair, in pair order (repeats after four).
inline constexpr PlotColour pair_curves[4]{{92, 170, 240}, {236, 236, 240}, {240, 150, 40}, {170, 130, 240}};
}  // namespace plot_colours

// Plot frame colours (our own look).
namespace plot_look {
inline constexpr PlotColour background{31, 34, 42};   // a step lighter than the scene (22, 24, 30)
inline constexpr PlotColour grid{44, 48, 58};
inline constexpr PlotColour axis{176, 181, 192};       // frame, tick marks
inline constexpr PlotColour text{208, 212, 220};
}  // namespace plot_look

}  // namespace brownfloc::viewer
