#pragma once
// An 8-bit sRGB colour (gamma-encoded, as stored in images and shown on screen).
#include <cstdint>

namespace brownfloc::viewer {

struct Rgb {
    std::uint8_t r = 0, g = 0, b = 0;
    bool operator==(const Rgb&) const = default;
};

}  // namespace brownfloc::viewer
