#pragma once
// The pixels the sphere renderer fills: colour (RGBA8, row-major, alpha 255), the id of the
// particle that owns each pixel (picking reads it) and the depth of its visible surface.
// Pixel (x, y) is element y * width_px + x of owner and depth_nm, and bytes 4 (y * width_px + x)
// .. +3 of rgba. The image may be larger than the camera's viewport (plots beside the scene).
#include <cstdint>
#include <vector>

#include "scene/rgb.hpp"

namespace brownfloc::viewer {

inline constexpr std::uint32_t no_particle = 0xFFFFFFFFu;

struct SphereImage {
    int width_px = 0, height_px = 0;
    std::vector<std::uint8_t> rgba;    // 4 * width * height
    std::vector<std::uint32_t> owner;  // particle id per pixel or no_particle
    std::vector<float> depth_nm;       // per pixel, +inf where empty

    // Sets the size and clears: black opaque pixels, no owners, infinite depth. Throws
    // std::invalid_argument for a negative size or one over max_pixels.
    void resize(int width_px, int height_px);
    // Throw std::out_of_range outside [0, width) x [0, height).
    [[nodiscard]] Rgb pixel(int x, int y) const;
    [[nodiscard]] std::uint32_t owner_at(int x, int y) const;
    [[nodiscard]] float depth_at(int x, int y) const;

    static constexpr long long max_pixels = 1LL << 28;  // 16384 x 16384
};

}  // namespace brownfloc::viewer
