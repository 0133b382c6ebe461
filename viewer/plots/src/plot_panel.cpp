// PlotPanel: each plot is rendered into its own off-screen image and re-rendered only when
// its spec, its rects or the font change; every frame then just copies the four images.
#include "plots/plot_drawing.hpp"

#include "draw_helpers.hpp"
#include "plots/plot_error.hpp"

#include <SFML/Graphics/Sprite.hpp>

#include <string>

namespace brownfloc::viewer {
namespace {

bool same_rect(const PixelRect& a, const PixelRect& b) {
    return a.x_px == b.x_px && a.y_px == b.y_px && a.width_px == b.width_px && a.height_px == b.height_px;
}

bool same_size(const PixelRect& a, const PixelRect& b) { return a.width_px == b.width_px && a.height_px == b.height_px; }

PixelRect relative_to(const PixelRect& rect, const PixelRect& origin) {
    return PixelRect{rect.x_px - origin.x_px, rect.y_px - origin.y_px, rect.width_px, rect.height_px};
}

}  // namespace

void PlotPanel::draw(sf::RenderTarget& target, const ViewerLayout& layout, const std::array<PlotSpec, 4>& specs,
                     const sf::Font& font) {
    if (!layout.plots_shown) return;
    const draw_helpers::DefaultViewScope view_scope(target);
    for (std::size_t i = 0; i < cache_.size(); ++i) {
        CachedPlot& cached = cache_[i];
        const PixelRect& outer = layout.plot_outer[i];
        const PixelRect& data = layout.plot_data[i];
        if (outer.width_px <= 0 || outer.height_px <= 0) continue;

        // The image depends on the plot's size, not its place: a move only moves the sprite.
        const bool resized = !cached.image || !same_size(outer, cached.outer);
        if (resized) {
            cached.image = std::make_unique<sf::RenderTexture>();
            if (!cached.image->create(static_cast<unsigned>(outer.width_px), static_cast<unsigned>(outer.height_px))) {
                cached.image.reset();
                std::string message = "plot panel: could not create a ";
                message += std::to_string(outer.width_px);
                message += " x ";
                message += std::to_string(outer.height_px);
                message += " px off-screen image for plot ";
                message += std::to_string(i + 1);
                throw PlotError(message);
            }
        }
        const PixelRect data_in_image = relative_to(data, outer);
        if (resized || !same_rect(data_in_image, cached.data) || cached.font != &font || !cached.drawn_spec ||
            !same_plot(*cached.drawn_spec, specs[i])) {
            cached.image->clear(sf::Color(plot_look::background.r, plot_look::background.g, plot_look::background.b));
            draw_plot(*cached.image, specs[i], PixelRect{0, 0, outer.width_px, outer.height_px}, data_in_image, font);
            cached.image->display();
            cached.data = data_in_image;
            cached.font = &font;
            cached.drawn_spec = specs[i];
            ++redraw_count_;
        }
        cached.outer = outer;
        sf::Sprite sprite(cached.image->getTexture());
        sprite.setPosition(static_cast<float>(outer.x_px), static_cast<float>(outer.y_px));
        target.draw(sprite);
    }
}

}  // namespace brownfloc::viewer
