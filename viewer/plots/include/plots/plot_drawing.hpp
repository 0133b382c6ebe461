#pragma once
// Drawing plots with SFML 2.5. The only public header of the plots library that includes SFML.
//
// What lands where (the pixel tests compute from this):
//  - The outer rect is filled with plot_look::background; grid lines at the ticks.
//  - Series are drawn in order, clipped to the data rect. A value maps to pixels by AxisMap
//    (plot_layout.hpp). Lines are 1.5 px wide quads along the mapped points; a non-finite
//    point, or a non-positive one on a log axis, breaks the line. Dashed lines use
//    DashPattern{6, 4} continued along the line. Points are 3 x 3 px squares centred on the
//    pixel holding the mapped point, drawn when that pixel is inside the data rect.
//  - A vertical marker (and the current-x marker, plot_colours::current_time) at continuous
//    x coordinate X fills the one-pixel column floor(X) over the data rect's full height, when
//    that column is inside the data rect. Marker labels are written to the right of the column
//    (left when there is no room) near the bottom of the data rect, one row per marker.
//  - The frame is the one-pixel outline just outside the data rect (columns data.x - 1 and
//    data.x + width, rows data.y - 1 and data.y + height); tick marks 4 px long outside it.
//  - Text (title 12 px, the rest 11 px, plot_look::text) with the font passed in; the title at
//    the top left above the data rect, the x label under the tick labels, the y label rotated
//    along the left edge, the legend (labelled series) and notes inside the data rect at
//    spec.legend_corner.
// Drawing uses the target's default view (one unit = one pixel) and restores the view after.
// Nothing is anti-aliased, so the same spec draws the same pixels every time.
#include "plots/plot_layout.hpp"
#include "plots/plot_spec.hpp"

#include <SFML/Graphics/Font.hpp>
#include <SFML/Graphics/RenderTarget.hpp>
#include <SFML/Graphics/RenderTexture.hpp>

#include <array>
#include <memory>
#include <optional>

namespace brownfloc::viewer {

inline constexpr float plot_line_width_px = 1.5f;
inline constexpr unsigned plot_title_size_px = 12;
inline constexpr unsigned plot_text_size_px = 11;

// Draws one plot: outer is its whole rect, data its data rect (normally plot_data_rect(outer)).
// A rect with no area draws nothing.
void draw_plot(sf::RenderTarget& target, const PlotSpec& spec, const PixelRect& outer, const PixelRect& data,
               const sf::Font& font);

// The four plots of the viewer's column, each cached in its own sf::RenderTexture and
// re-rendered only when its spec (same_plot), its size, its data rect within it or the font
// changed; a plot that only moves is copied to its new place. Not thread-safe
// (SFML's GL context belongs to one thread); needs a GL context, so an X display.
class PlotPanel {
public:
    // Draws the plots at layout.plot_outer[i] (nothing when !layout.plots_shown); specs in the
    // order of plot_layout.hpp's *_plot_index. Throws PlotError when an off-screen image of a
    // plot's size cannot be created.
    void draw(sf::RenderTarget& target, const ViewerLayout& layout, const std::array<PlotSpec, 4>& specs,
              const sf::Font& font);

    // How many plot images were re-rendered so far.
    [[nodiscard]] int redraw_count() const { return redraw_count_; }

private:
    struct CachedPlot {
        std::unique_ptr<sf::RenderTexture> image;
        std::optional<PlotSpec> drawn_spec;
        PixelRect outer;  // where the image was last shown
        PixelRect data;   // the data rect inside the image (relative to its top-left corner)
        const sf::Font* font = nullptr;
    };
    std::array<CachedPlot, 4> cache_;
    int redraw_count_ = 0;
};

}  // namespace brownfloc::viewer
