#include "plot_text.hpp"

#include "draw_helpers.hpp"
#include "plots/plot_drawing.hpp"

#include <SFML/Graphics/VertexArray.hpp>

#include <algorithm>
#include <cmath>

namespace brownfloc::viewer::plot_text {
namespace {

using draw_helpers::AlignX;
using draw_helpers::AlignY;
using draw_helpers::draw_text;
using draw_helpers::text_width_px;
using draw_helpers::to_sf;

constexpr float row_height_px = 13.0f;    // one line of 11 px text
constexpr float swatch_width_px = 14.0f;  // legend sample of a series
constexpr float inset_px = 5.0f;          // legend and labels keep this far from the frame

}  // namespace

void draw_title(sf::RenderTarget& target, const PlotSpec& spec, const PixelRect& outer, const PixelRect& data,
                const sf::Font& font) {
    const int left = data.width_px > 0 ? data.x_px : outer.x_px + 2;
    draw_text(target, spec.title, font, plot_title_size_px, to_sf(plot_look::text), static_cast<float>(left),
              static_cast<float>(outer.y_px + 3), AlignX::left, AlignY::top);
}

void draw_tick_labels(sf::RenderTarget& target, const AxisMap& map, const std::vector<Tick>& x_ticks,
                      const std::vector<Tick>& y_ticks, const PixelRect& outer, const sf::Font& font) {
    const sf::Color colour = to_sf(plot_look::text);
    const PixelRect& d = map.data;
    const auto outer_right = static_cast<float>(outer.x_px + outer.width_px);
    for (const Tick& tick : x_ticks) {
        const double x = map.x_px(tick.value);
        if (!std::isfinite(x)) continue;
        // Centred under the tick, but kept inside the plot's outer rect.
        const float half_width = text_width_px(tick.label, font, plot_text_size_px) * 0.5f;
        const float centre = std::clamp(static_cast<float>(x), static_cast<float>(outer.x_px) + half_width,
                                        std::max(outer_right - half_width, static_cast<float>(outer.x_px) + half_width));
        draw_text(target, tick.label, font, plot_text_size_px, colour, centre,
                  static_cast<float>(d.y_px + d.height_px + 5), AlignX::centre, AlignY::top);
    }
    for (const Tick& tick : y_ticks) {
        const double y = map.y_px(tick.value);
        if (!std::isfinite(y)) continue;
        draw_text(target, tick.label, font, plot_text_size_px, colour, static_cast<float>(d.x_px - 7),
                  static_cast<float>(y), AlignX::right, AlignY::middle);
    }
}

void draw_axis_labels(sf::RenderTarget& target, const PlotSpec& spec, const PixelRect& outer, const PixelRect& data,
                      const sf::Font& font) {
    const sf::Color colour = to_sf(plot_look::text);
    draw_text(target, spec.x_label, font, plot_text_size_px, colour,
              static_cast<float>(data.x_px) + static_cast<float>(data.width_px) * 0.5f,
              static_cast<float>(data.y_px + data.height_px + 17), AlignX::centre, AlignY::top);
    // Rotated a quarter turn anticlockwise, reading upwards along the left edge.
    draw_text(target, spec.y_label, font, plot_text_size_px, colour, static_cast<float>(outer.x_px + 9),
              static_cast<float>(data.y_px) + static_cast<float>(data.height_px) * 0.5f, AlignX::centre, AlignY::middle,
              -90.0f);
}

void draw_marker_labels(sf::RenderTarget& target, const PlotSpec& spec, const AxisMap& map, const sf::Font& font) {
    const PixelRect& d = map.data;
    const auto right = static_cast<float>(d.x_px + d.width_px);
    int row = 0;
    for (const VerticalMarker& marker : spec.markers) {
        const double x = map.x_px(marker.x);
        if (marker.label.empty() || !std::isfinite(x)) continue;
        const double column = std::floor(x);
        if (column < d.x_px || column > d.x_px + d.width_px - 1) continue;
        const float width = text_width_px(marker.label, font, plot_text_size_px);
        float left = static_cast<float>(column) + 4.0f;
        if (left + width > right - 2.0f) left = static_cast<float>(column) - 3.0f - width;
        ++row;
        const float top = static_cast<float>(d.y_px + d.height_px) - 3.0f - row_height_px * static_cast<float>(row);
        draw_text(target, marker.label, font, plot_text_size_px, to_sf(marker.colour), left, top, AlignX::left,
                  AlignY::top);
    }
}

void draw_legend(sf::RenderTarget& target, const PlotSpec& spec, const PixelRect& data, const sf::Font& font) {
    std::vector<const Series*> entries;
    for (const Series& series : spec.series)
        if (!series.label.empty()) entries.push_back(&series);
    if (entries.empty() && spec.notes.empty()) return;

    float block_width = 0.0f;
    for (const Series* series : entries)
        block_width = std::max(block_width, swatch_width_px + 4.0f + text_width_px(series->label, font, plot_text_size_px));
    for (const std::string& note : spec.notes)
        block_width = std::max(block_width, text_width_px(note, font, plot_text_size_px));
    const auto rows = static_cast<float>(entries.size() + spec.notes.size());
    const float left = spec.legend_corner == LegendCorner::top_left
                           ? static_cast<float>(data.x_px) + inset_px
                           : std::round(static_cast<float>(data.x_px + data.width_px) - inset_px - block_width);
    const float top = static_cast<float>(data.y_px) + inset_px;

    // An opaque box keeps the legend readable where the data runs under it.
    sf::VertexArray shapes(sf::Triangles);
    draw_helpers::add_rect(shapes, left - 3.0f, top - 2.0f, block_width + 6.0f, rows * row_height_px + 3.0f,
                           to_sf(plot_look::background));
    for (std::size_t i = 0; i < entries.size(); ++i) {
        const float middle = top + row_height_px * (static_cast<float>(i) + 0.5f);
        const sf::Color colour = to_sf(entries[i]->colour);
        if (entries[i]->style == Series::Style::points)
            draw_helpers::add_rect(shapes, left + swatch_width_px * 0.5f - 1.0f, std::floor(middle) - 1.0f, 3.0f, 3.0f,
                                   colour);
        else if (entries[i]->style == Series::Style::dashed_line)
            for (float x = 0.0f; x < swatch_width_px; x += 10.0f)
                draw_helpers::add_rect(shapes, left + x, std::floor(middle), std::min(6.0f, swatch_width_px - x), 1.5f,
                                       colour);
        else
            draw_helpers::add_rect(shapes, left, std::floor(middle), swatch_width_px, 1.5f, colour);
    }
    target.draw(shapes);

    const sf::Color text_colour = to_sf(plot_look::text);
    for (std::size_t i = 0; i < entries.size(); ++i)
        draw_text(target, entries[i]->label, font, plot_text_size_px, text_colour, left + swatch_width_px + 4.0f,
                  top + row_height_px * (static_cast<float>(i) + 0.5f), AlignX::left, AlignY::middle);
    for (std::size_t j = 0; j < spec.notes.size(); ++j)
        draw_text(target, spec.notes[j], font, plot_text_size_px, text_colour, left,
                  top + row_height_px * (static_cast<float>(entries.size() + j) + 0.5f), AlignX::left, AlignY::middle);
}

}  // namespace brownfloc::viewer::plot_text
