#pragma once
// Helpers for the pixel tests: the test font, an off-screen 1280 x 800 image, colour search.
#include "plots/plot_spec.hpp"

#include <SFML/Graphics/Font.hpp>
#include <SFML/Graphics/Image.hpp>
#include <SFML/Graphics/RenderTexture.hpp>

#include <memory>
#include <stdexcept>
#include <string>

namespace brownfloc::viewer::pixel_test {

inline const sf::Font& test_font() {
    static const std::unique_ptr<sf::Font> font = [] {
        auto loaded = std::make_unique<sf::Font>();
        if (!loaded->loadFromFile(BROWNFLOC_TEST_FONT)) {
            std::string message = "could not load the test font ";
            message += BROWNFLOC_TEST_FONT;
            message += " (Debian package fonts-dejavu-core)";
            throw std::runtime_error(message);
        }
        return loaded;
    }();
    return *font;
}

// A cleared width x height off-screen image in the scene background colour (22, 24, 30).
inline std::unique_ptr<sf::RenderTexture> blank_image(unsigned width_px = 1280, unsigned height_px = 800) {
    auto image = std::make_unique<sf::RenderTexture>();
    if (!image->create(width_px, height_px)) throw std::runtime_error("could not create an off-screen image");
    image->clear(sf::Color(22, 24, 30));
    return image;
}

inline sf::Image read_back(sf::RenderTexture& image) {
    image.display();
    return image.getTexture().copyToImage();
}

inline bool has_colour(const sf::Image& image, int x_px, int y_px, const PlotColour& colour) {
    const sf::Vector2u size = image.getSize();
    if (x_px < 0 || y_px < 0 || x_px >= static_cast<int>(size.x) || y_px >= static_cast<int>(size.y)) return false;
    const sf::Color pixel = image.getPixel(static_cast<unsigned>(x_px), static_cast<unsigned>(y_px));
    return pixel.r == colour.r && pixel.g == colour.g && pixel.b == colour.b;
}

// True when a pixel within +-radius of (x, y) has the colour.
inline bool colour_near(const sf::Image& image, int x_px, int y_px, const PlotColour& colour, int radius_px = 1) {
    for (int dy = -radius_px; dy <= radius_px; ++dy)
        for (int dx = -radius_px; dx <= radius_px; ++dx)
            if (has_colour(image, x_px + dx, y_px + dy, colour)) return true;
    return false;
}

inline bool same_pixels(const sf::Image& a, const sf::Image& b) {
    if (a.getSize() != b.getSize()) return false;
    const std::size_t bytes = std::size_t{a.getSize().x} * a.getSize().y * 4;
    const sf::Uint8* pa = a.getPixelsPtr();
    const sf::Uint8* pb = b.getPixelsPtr();
    for (std::size_t i = 0; i < bytes; ++i)
        if (pa[i] != pb[i]) return false;
    return true;
}

}  // namespace brownfloc::viewer::pixel_test
