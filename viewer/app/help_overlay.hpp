#pragma once
// The key and mouse bindings of the window, shown by H (or F1) over the scene. The README's
// table lists the same bindings.
#include <SFML/Graphics/Font.hpp>
#include <SFML/Graphics/RenderTarget.hpp>

#include <string_view>
#include <utility>
#include <vector>

#include "plots/plot_layout.hpp"

namespace brownfloc::viewer {

// (what to press, what it does), in the order shown.
[[nodiscard]] const std::vector<std::pair<std::string_view, std::string_view>>& viewer_bindings();

void draw_help_overlay(sf::RenderTarget& target, const PixelRect& scene, const sf::Font& font);

}  // namespace brownfloc::viewer
