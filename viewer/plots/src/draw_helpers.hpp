#pragma once
// SFML helpers for drawing plots (private to the plots library): rectangles and line quads
// batched into triangle arrays, and text placed on whole pixels.
#include "plots/plot_spec.hpp"
#include "plots/polyline_geometry.hpp"

#include <SFML/Graphics/Color.hpp>
#include <SFML/Graphics/Font.hpp>
#include <SFML/Graphics/RenderTarget.hpp>
#include <SFML/Graphics/VertexArray.hpp>
#include <SFML/Graphics/View.hpp>

#include <string>

namespace brownfloc::viewer::draw_helpers {

[[nodiscard]] sf::Color to_sf(const PlotColour& colour);

// Puts the target's default view (one unit = one pixel) in place and restores the caller's
// view when it goes out of scope, also when drawing throws.
class DefaultViewScope {
public:
    explicit DefaultViewScope(sf::RenderTarget& target) : target_(target), saved_(target.getView()) {
        target_.setView(target_.getDefaultView());
    }
    ~DefaultViewScope() { target_.setView(saved_); }
    DefaultViewScope(const DefaultViewScope&) = delete;
    DefaultViewScope& operator=(const DefaultViewScope&) = delete;

private:
    sf::RenderTarget& target_;
    sf::View saved_;
};

// Appends the axis-aligned rectangle [x, x + w) x [y, y + h) (pixels) as two triangles.
void add_rect(sf::VertexArray& triangles, float x_px, float y_px, float width_px, float height_px, sf::Color colour);

// Appends a quad of the given width centred on the segment (nothing for a zero-length one).
void add_thick_segment(sf::VertexArray& triangles, const PixelSegment& segment, float width_px, sf::Color colour);

enum class AlignX { left, centre, right };
enum class AlignY { top, middle };

// Width in pixels of the text as SFML lays it out (local bounds' right edge).
[[nodiscard]] float text_width_px(const std::string& utf8, const sf::Font& font, unsigned size_px);

// Draws UTF-8 text so that the anchor given by the alignments lands at (x, y), rounded to
// whole pixels. AlignY::top puts the top of the line box (the character size) at y;
// AlignY::middle centres digits and capitals on y. rotation_deg turns it about that anchor.
void draw_text(sf::RenderTarget& target, const std::string& utf8, const sf::Font& font, unsigned size_px,
               sf::Color colour, float x_px, float y_px, AlignX align_x, AlignY align_y, float rotation_deg = 0.0f);

}  // namespace brownfloc::viewer::draw_helpers
