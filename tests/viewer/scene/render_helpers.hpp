#pragma once
// Shared set-up for the renderer tests: a camera looking along +y (azimuth 0, elevation 0) at a
// 100 nm box from 2.6 box lengths, so a point (x, y, z) has x_c = x - 50, y_c = z - 50 and
// depth z_c = y + 210 nm (README camera formulas with the eye at (50, -210, 50)).
#include <algorithm>
#include <cmath>
#include <cstdint>
#include <vector>

#include "scene/camera.hpp"
#include "scene/sphere_image.hpp"
#include "scene/sphere_renderer.hpp"

namespace brownfloc::viewer::test {

inline constexpr double box_nm = 100.0;
inline const CameraPose front_pose{0.0, 0.0, 2.6, {}};
inline constexpr Rgb background{22, 24, 30};
inline constexpr Rgb box_colour{120, 126, 140};

inline RenderSettings settings_with(int threads, bool outline = false) {
    RenderSettings s;
    s.threads = threads;
    s.box_outline = outline;
    return s;
}

inline SphereImage render_image(const std::vector<Sphere>& spheres, const Camera& camera,
                                const RenderSettings& settings, int image_width_px, int image_height_px) {
    SphereImage image;
    image.resize(image_width_px, image_height_px);
    render_spheres(spheres, camera, settings, image);
    return image;
}

// Pixels of row j owned by `id`.
inline int owned_in_row(const SphereImage& image, int j, std::uint32_t id) {
    int count = 0;
    for (int i = 0; i < image.width_px; ++i) count += image.owner_at(i, j) == id ? 1 : 0;
    return count;
}

// README: pixel (i, j) is covered when its centre lies within rho of (s_x, s_y). Counts the
// covered pixels of row j for a disc, restricted to columns [first, last].
inline int expected_row_count(double s_x, double s_y, double rho, int j, int first = -100000, int last = 100000) {
    int count = 0;
    const double dy = j + 0.5 - s_y;
    for (int i = std::max(first, int(std::floor(s_x - rho)) - 2); i <= std::min(last, int(std::ceil(s_x + rho)) + 2);
         ++i) {
        const double dx = i + 0.5 - s_x;
        count += dx * dx + dy * dy <= rho * rho ? 1 : 0;
    }
    return count;
}

}  // namespace brownfloc::viewer::test
