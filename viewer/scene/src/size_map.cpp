// The size colour map: our own constant-chroma spiral in Oklab (see palettes.hpp).
#include <algorithm>
#include <cmath>
#include <numbers>
#include <stdexcept>
#include <string>

#include "oklab.hpp"
#include "scene/palettes.hpp"

namespace brownfloc::viewer {

namespace {

// Lightness and hue change linearly at constant chroma, so equal steps in the fraction are
// equal steps in Oklab distance: sqrt(dL^2 + (C dh)^2). Every point lies inside the sRGB gamut
// (checked at 2001 points when the map was designed; tests/viewer/scene checks the steps).
constexpr double dark_lightness = 0.44, light_lightness = 0.90;
constexpr double chroma = 0.15;
constexpr double dark_hue_deg = 280.0, light_hue_deg = 475.0;  // indigo -> rose -> orange -> yellow-green

}  // namespace

Rgb size_map_at(double fraction) {
    if (std::isnan(fraction)) throw std::invalid_argument("size_map_at: fraction is NaN: must be in [0, 1]");
    const double t = std::clamp(fraction, 0.0, 1.0);
    const double hue = (dark_hue_deg + (light_hue_deg - dark_hue_deg) * t) * std::numbers::pi / 180.0;
    return detail::oklab_to_srgb8(
        {dark_lightness + (light_lightness - dark_lightness) * t, chroma * std::cos(hue), chroma * std::sin(hue)});
}

Rgb size_colour(std::int64_t size, std::int64_t largest_size) {
    if (size < 1) {
        std::string message = "size_colour: size ";
        message += std::to_string(size);
        message += ": must be >= 1";
        throw std::invalid_argument(message);
    }
    if (largest_size <= 1) return size_map_at(0.0);
    return size_map_at(std::log10(double(size)) / std::log10(double(largest_size)));
}

}  // namespace brownfloc::viewer
