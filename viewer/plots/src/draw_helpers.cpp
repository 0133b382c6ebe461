#include "draw_helpers.hpp"

#include <SFML/Graphics/Text.hpp>

#include <cmath>

namespace brownfloc::viewer::draw_helpers {
namespace {

// SFML puts the first baseline at the character size below the text's position; digits and
// capitals of DejaVu Sans rise about 0.73 em above it, so their middle sits ~0.63 em down.
constexpr float ink_middle_em = 0.63f;
// The line box's top: SFML leaves about 0.2 em above the capitals at position y.
constexpr float line_top_em = 0.2f;

sf::String from_utf8(const std::string& utf8) { return sf::String::fromUtf8(utf8.begin(), utf8.end()); }

void add_vertex(sf::VertexArray& triangles, float x, float y, sf::Color colour) {
    triangles.append(sf::Vertex(sf::Vector2f(x, y), colour));
}

}  // namespace

sf::Color to_sf(const PlotColour& colour) { return sf::Color(colour.r, colour.g, colour.b); }

void add_rect(sf::VertexArray& triangles, float x_px, float y_px, float width_px, float height_px, sf::Color colour) {
    if (!(width_px > 0.0f) || !(height_px > 0.0f)) return;
    const float x1 = x_px + width_px, y1 = y_px + height_px;
    add_vertex(triangles, x_px, y_px, colour);
    add_vertex(triangles, x1, y_px, colour);
    add_vertex(triangles, x1, y1, colour);
    add_vertex(triangles, x_px, y_px, colour);
    add_vertex(triangles, x1, y1, colour);
    add_vertex(triangles, x_px, y1, colour);
}

void add_thick_segment(sf::VertexArray& triangles, const PixelSegment& segment, float width_px, sf::Color colour) {
    const double dx = segment.to.x_px - segment.from.x_px, dy = segment.to.y_px - segment.from.y_px;
    const double length = std::hypot(dx, dy);
    if (!(length > 0.0) || !std::isfinite(length)) return;
    // Half-width normal, and a half-width extension along the line so joints have no gaps.
    const double nx = -dy / length * 0.5 * width_px, ny = dx / length * 0.5 * width_px;
    const double ex = dx / length * 0.5 * width_px * 0.5, ey = dy / length * 0.5 * width_px * 0.5;
    const auto corner = [&](double x, double y) { add_vertex(triangles, static_cast<float>(x), static_cast<float>(y), colour); };
    const double ax = segment.from.x_px - ex, ay = segment.from.y_px - ey;
    const double bx = segment.to.x_px + ex, by = segment.to.y_px + ey;
    corner(ax + nx, ay + ny);
    corner(bx + nx, by + ny);
    corner(bx - nx, by - ny);
    corner(ax + nx, ay + ny);
    corner(bx - nx, by - ny);
    corner(ax - nx, ay - ny);
}

float text_width_px(const std::string& utf8, const sf::Font& font, unsigned size_px) {
    const sf::Text text(from_utf8(utf8), font, size_px);
    const sf::FloatRect bounds = text.getLocalBounds();
    return bounds.left + bounds.width;
}

void draw_text(sf::RenderTarget& target, const std::string& utf8, const sf::Font& font, unsigned size_px,
               sf::Color colour, float x_px, float y_px, AlignX align_x, AlignY align_y, float rotation_deg) {
    if (utf8.empty()) return;
    sf::Text text(from_utf8(utf8), font, size_px);
    text.setFillColor(colour);
    const sf::FloatRect bounds = text.getLocalBounds();
    const float width = bounds.left + bounds.width;
    const float size = static_cast<float>(size_px);
    float origin_x = 0.0f;
    if (align_x == AlignX::centre) origin_x = std::round(width * 0.5f);
    if (align_x == AlignX::right) origin_x = std::round(width);
    const float origin_y = std::round(align_y == AlignY::top ? line_top_em * size : ink_middle_em * size);
    text.setOrigin(origin_x, origin_y);
    text.setRotation(rotation_deg);
    text.setPosition(std::round(x_px), std::round(y_px));
    target.draw(text);
}

}  // namespace brownfloc::viewer::draw_helpers
