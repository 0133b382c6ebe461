#pragma once
// The font for every label: --font FILE, else DejaVu Sans from fonts-dejavu-core at its Debian
// paths. A font that cannot be found or loaded is ViewerEnvironmentError naming the paths tried.
#include <SFML/Graphics/Font.hpp>

#include <filesystem>
#include <optional>

namespace brownfloc::viewer {

void load_viewer_font(sf::Font& font, const std::optional<std::filesystem::path>& requested);

}  // namespace brownfloc::viewer
