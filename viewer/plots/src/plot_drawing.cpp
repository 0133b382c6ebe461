// draw_plot: the order of layers and the geometry of series, markers, frame and ticks. Text
// (tick labels, titles, legend, marker labels) is in plot_text.cpp.
#include "plots/plot_drawing.hpp"

#include "draw_helpers.hpp"
#include "plot_text.hpp"
#include "plots/polyline_geometry.hpp"
#include "plots/ticks.hpp"

#include <algorithm>
#include <cmath>

namespace brownfloc::viewer {
namespace {

using draw_helpers::add_rect;
using draw_helpers::to_sf;

constexpr DashPattern series_dash{6.0, 4.0};
constexpr float tick_length_px = 4.0f;

// Column holding continuous x coordinate x_px, if it lies inside the data rect.
std::optional<int> column_inside(const PixelRect& data, double x_px) {
    if (!std::isfinite(x_px)) return std::nullopt;
    const double column = std::floor(x_px);
    if (column < data.x_px || column > data.x_px + data.width_px - 1) return std::nullopt;
    return static_cast<int>(column);
}

std::optional<int> row_inside(const PixelRect& data, double y_px) {
    if (!std::isfinite(y_px)) return std::nullopt;
    const double row = std::floor(y_px);
    if (row < data.y_px || row > data.y_px + data.height_px - 1) return std::nullopt;
    return static_cast<int>(row);
}

void add_points(sf::VertexArray& triangles, const Series& series, const AxisMap& map) {
    const sf::Color colour = to_sf(series.colour);
    const std::size_t count = std::min(series.x.size(), series.y.size());
    for (std::size_t i = 0; i < count; ++i) {
        const auto column = column_inside(map.data, map.x_px(series.x[i]));
        const auto row = row_inside(map.data, map.y_px(series.y[i]));
        if (!column || !row) continue;
        add_rect(triangles, static_cast<float>(*column - 1), static_cast<float>(*row - 1), 3.0f, 3.0f, colour);
    }
}

void add_line(sf::VertexArray& triangles, const Series& series, const AxisMap& map) {
    const sf::Color colour = to_sf(series.colour);
    const PixelRect& d = map.data;
    const double left = d.x_px, top = d.y_px, right = d.x_px + d.width_px, bottom = d.y_px + d.height_px;
    const double period = series_dash.on_px + series_dash.off_px;
    const std::size_t count = std::min(series.x.size(), series.y.size());
    double phase_px = 0.0;  // dash phase at the previous point, continued along the line
    std::optional<PixelPoint> previous;
    for (std::size_t i = 0; i < count; ++i) {
        const PixelPoint point{map.x_px(series.x[i]), map.y_px(series.y[i])};
        if (!std::isfinite(point.x_px) || !std::isfinite(point.y_px)) {
            previous.reset();  // the line breaks at a point that cannot be drawn
            continue;
        }
        if (previous) {
            const auto clipped = clip_segment(*previous, point, left, top, right, bottom);
            if (clipped && series.style == Series::Style::dashed_line) {
                // Keep the pattern tied to the unclipped line: start at the clipped part's offset.
                double phase_at_clip =
                    std::fmod(phase_px + std::hypot(clipped->from.x_px - previous->x_px, clipped->from.y_px - previous->y_px),
                              period);
                for (const PixelSegment& dash : dash_segment(clipped->from, clipped->to, series_dash, phase_at_clip))
                    draw_helpers::add_thick_segment(triangles, dash, plot_line_width_px, colour);
            } else if (clipped) {
                draw_helpers::add_thick_segment(triangles, *clipped, plot_line_width_px, colour);
            }
            const double length = std::hypot(point.x_px - previous->x_px, point.y_px - previous->y_px);
            phase_px = std::isfinite(length) ? std::fmod(phase_px + length, period) : 0.0;
        }
        previous = point;
    }
}

void add_marker_column(sf::VertexArray& triangles, const AxisMap& map, double x_value, const PlotColour& colour) {
    const auto column = column_inside(map.data, map.x_px(x_value));
    if (!column) return;
    add_rect(triangles, static_cast<float>(*column), static_cast<float>(map.data.y_px), 1.0f,
             static_cast<float>(map.data.height_px), to_sf(colour));
}

// Grid lines at the ticks (inside the data rect) and tick marks outside the frame.
void add_ticks(sf::VertexArray& grid, sf::VertexArray& marks, const AxisMap& map, const std::vector<Tick>& x_ticks,
               const std::vector<Tick>& y_ticks) {
    const PixelRect& d = map.data;
    const sf::Color grid_colour = to_sf(plot_look::grid), axis_colour = to_sf(plot_look::axis);
    for (const Tick& tick : x_ticks) {
        const double x = map.x_px(tick.value);
        if (!std::isfinite(x)) continue;
        const int column = std::clamp(static_cast<int>(std::floor(x)), d.x_px - 1, d.x_px + d.width_px);
        if (column >= d.x_px && column < d.x_px + d.width_px)
            add_rect(grid, static_cast<float>(column), static_cast<float>(d.y_px), 1.0f, static_cast<float>(d.height_px),
                     grid_colour);
        add_rect(marks, static_cast<float>(column), static_cast<float>(d.y_px + d.height_px + 1), 1.0f, tick_length_px,
                 axis_colour);
    }
    for (const Tick& tick : y_ticks) {
        const double y = map.y_px(tick.value);
        if (!std::isfinite(y)) continue;
        const int row = std::clamp(static_cast<int>(std::floor(y)), d.y_px - 1, d.y_px + d.height_px);
        if (row >= d.y_px && row < d.y_px + d.height_px)
            add_rect(grid, static_cast<float>(d.x_px), static_cast<float>(row), static_cast<float>(d.width_px), 1.0f,
                     grid_colour);
        add_rect(marks, static_cast<float>(d.x_px - 1) - tick_length_px, static_cast<float>(row), tick_length_px, 1.0f,
                 axis_colour);
    }
}

void add_frame(sf::VertexArray& triangles, const PixelRect& d) {
    const sf::Color colour = to_sf(plot_look::axis);
    const auto x = static_cast<float>(d.x_px), y = static_cast<float>(d.y_px);
    const auto w = static_cast<float>(d.width_px), h = static_cast<float>(d.height_px);
    add_rect(triangles, x - 1.0f, y - 1.0f, w + 2.0f, 1.0f, colour);  // top
    add_rect(triangles, x - 1.0f, y + h, w + 2.0f, 1.0f, colour);     // bottom
    add_rect(triangles, x - 1.0f, y, 1.0f, h, colour);                // left
    add_rect(triangles, x + w, y, 1.0f, h, colour);                   // right
}

std::vector<Tick> axis_ticks(const AxisRange& range, int max_ticks) {
    return range.log10 ? log10_ticks(range.lo, range.hi, max_ticks) : linear_ticks(range.lo, range.hi, max_ticks);
}

}  // namespace

void draw_plot(sf::RenderTarget& target, const PlotSpec& spec, const PixelRect& outer, const PixelRect& data,
               const sf::Font& font) {
    if (outer.width_px <= 0 || outer.height_px <= 0) return;
    const draw_helpers::DefaultViewScope view_scope(target);

    sf::VertexArray background(sf::Triangles);
    add_rect(background, static_cast<float>(outer.x_px), static_cast<float>(outer.y_px),
             static_cast<float>(outer.width_px), static_cast<float>(outer.height_px), to_sf(plot_look::background));
    target.draw(background);
    plot_text::draw_title(target, spec, outer, data, font);
    if (data.width_px <= 0 || data.height_px <= 0) return;

    const AxisMap map{spec.x, spec.y, data};
    // About one x tick per 70 px and one y tick per 30 px, between 2 and 6.
    const std::vector<Tick> x_ticks = axis_ticks(spec.x, std::clamp(data.width_px / 70, 2, 6));
    const std::vector<Tick> y_ticks = axis_ticks(spec.y, std::clamp(data.height_px / 30, 2, 6));

    sf::VertexArray grid(sf::Triangles), marks(sf::Triangles), plotted(sf::Triangles), frame(sf::Triangles);
    add_ticks(grid, marks, map, x_ticks, y_ticks);
    for (const Series& series : spec.series) {
        if (series.style == Series::Style::points)
            add_points(plotted, series, map);
        else
            add_line(plotted, series, map);
    }
    for (const VerticalMarker& marker : spec.markers) add_marker_column(plotted, map, marker.x, marker.colour);
    if (spec.current_x) add_marker_column(plotted, map, *spec.current_x, plot_colours::current_time);
    add_frame(frame, data);

    target.draw(grid);
    target.draw(plotted);
    target.draw(frame);
    target.draw(marks);
    plot_text::draw_tick_labels(target, map, x_ticks, y_ticks, outer, font);
    plot_text::draw_axis_labels(target, spec, outer, data, font);
    plot_text::draw_marker_labels(target, spec, map, font);
    plot_text::draw_legend(target, spec, data, font);
}

}  // namespace brownfloc::viewer
