#include "oklab.hpp"

#include <algorithm>
#include <cmath>
#include <cstdint>

namespace brownfloc::viewer::detail {

namespace {

std::uint8_t encode_srgb(double linear) {
    const double c = std::clamp(linear, 0.0, 1.0);
    const double encoded = c <= 0.0031308 ? 12.92 * c : 1.055 * std::pow(c, 1.0 / 2.4) - 0.055;
    return static_cast<std::uint8_t>(std::lround(255.0 * encoded));
}

}  // namespace

Rgb oklab_to_srgb8(const Oklab& c) {
    const double l_root = c.lightness + 0.3963377774 * c.a + 0.2158037573 * c.b;
    const double m_root = c.lightness - 0.1055613458 * c.a - 0.0638541728 * c.b;
    const double s_root = c.lightness - 0.0894841775 * c.a - 1.2914855480 * c.b;
    const double l = l_root * l_root * l_root, m = m_root * m_root * m_root, s = s_root * s_root * s_root;
    const double red = 4.0767416621 * l - 3.3077115913 * m + 0.2309699292 * s;
    const double green = -1.2684380046 * l + 2.6097574011 * m - 0.3413193965 * s;
    const double blue = -0.0041960863 * l - 0.7034186147 * m + 1.7076147010 * s;
    return {encode_srgb(red), encode_srgb(green), encode_srgb(blue)};
}

}  // namespace brownfloc::viewer::detail
