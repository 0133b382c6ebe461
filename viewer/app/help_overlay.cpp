#include "help_overlay.hpp"

#include <SFML/Graphics/RectangleShape.hpp>
#include <SFML/Graphics/Text.hpp>

#include <algorithm>

namespace brownfloc::viewer {

const std::vector<std::pair<std::string_view, std::string_view>>& viewer_bindings() {
    static const std::vector<std::pair<std::string_view, std::string_view>> bindings = {
        {"drag (left button)", "orbit the camera about the box"},
        {"drag (right button) or Shift+drag", "pan"},
        {"mouse wheel", "zoom"},
        {"click a particle", "select its cluster (size, R_g, id); click empty space to clear"},
        {"R", "reset the camera"},
        {"Space", "play / pause"},
        {"Left / Right", "previous / next frame"},
        {"Home / End", "first / last frame"},
        {"+ / -", "play faster / slower"},
        {"click or drag the timeline", "go to a frame"},
        {"C", "colour by cluster, size, species"},
        {"W", "clusters wrapped into the box / whole"},
        {"L", "only the largest cluster"},
        {"G", "select the largest cluster"},
        {"P", "plots beside the scene on / off"},
        {"S", "save the view as PNG (current directory)"},
        {"E", "export every frame as PNG in the background"},
        {"Esc", "clear the selection, cancel an export, close this help"},
        {"H or F1", "this help"},
        {"Q", "quit"},
    };
    return bindings;
}

void draw_help_overlay(sf::RenderTarget& target, const PixelRect& scene, const sf::Font& font) {
    const auto& bindings = viewer_bindings();
    const float line_px = 19.0f, pad = 16.0f;
    const float width = std::min(float(scene.width_px) - 40.0f, 560.0f);
    const float height = pad * 2 + line_px * float(bindings.size() + 1);
    sf::RectangleShape panel({width, height});
    panel.setPosition(float(scene.x_px) + (float(scene.width_px) - width) / 2,
                      float(scene.y_px) + std::max(10.0f, (float(scene.height_px) - height) / 2));
    panel.setFillColor(sf::Color(10, 12, 18, 225));
    panel.setOutlineColor(sf::Color(120, 126, 140));
    panel.setOutlineThickness(1.0f);
    target.draw(panel);
    sf::Text text("Keys and mouse", font, 14);
    text.setFillColor(sf::Color(245, 190, 90));
    const sf::Vector2f origin = panel.getPosition() + sf::Vector2f(pad, pad);
    text.setPosition(origin);
    target.draw(text);
    text.setCharacterSize(13);
    float y = origin.y + line_px;
    for (const auto& [keys, action] : bindings) {
        text.setFillColor(sf::Color(190, 215, 255));
        text.setString(std::string(keys));
        text.setPosition(origin.x, y);
        target.draw(text);
        text.setFillColor(sf::Color(225, 228, 235));
        text.setString(std::string(action));
        text.setPosition(origin.x + 230.0f, y);
        target.draw(text);
        y += line_px;
    }
}

}  // namespace brownfloc::viewer
