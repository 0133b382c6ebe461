#pragma once
// Per-pixel sphere shading of viewer/README.md ("Spheres"), in camera space (x right, y up,
// z towards the eye). Lambert diffuse with a 0.35 ambient floor plus a Blinn-Phong highlight:
//     colour = base (0.35 + 0.65 max(0, n.l)) + 255 * 0.25 * max(0, n.h)^32
// Half-vector highlight: Blinn (1977), "Models of light reflection for computer synthesized
// pictures", Computer Graphics 11(2), 192. l = (-0.3, 0.4, 0.866) is used as written (|l| = 0.99998),
// which gives the README's disc-centre factor 0.91290.
#include <algorithm>
#include <cmath>
#include <cstdint>

#include "scene/rgb.hpp"

namespace brownfloc::viewer::detail {

inline constexpr double light_x = -0.3, light_y = 0.4, light_z = 0.866;
inline constexpr double ambient = 0.35, diffuse = 0.65, highlight_level = 255.0 * 0.25;

struct HalfVector {
    double x, y, z;
};
// h = (l + v) / |l + v| with the view direction v = (0, 0, 1).
inline HalfVector half_vector() {
    const double z = light_z + 1.0;
    const double norm = std::sqrt(light_x * light_x + light_y * light_y + z * z);
    return {light_x / norm, light_y / norm, z / norm};
}

inline std::uint8_t to_channel(double value) {
    return static_cast<std::uint8_t>(std::clamp(std::floor(value + 0.5), 0.0, 255.0));
}

// (q_x, q_y): the pixel centre's offset from the disc centre over rho, image axes (y down),
// with q_x^2 + q_y^2 <= 1. normal_z = sqrt(1 - q^2).
inline Rgb shade(Rgb base, double q_x, double q_y, double normal_z, const HalfVector& h) {
    const double n_x = q_x, n_y = -q_y;
    const double n_dot_l = std::max(0.0, n_x * light_x + n_y * light_y + normal_z * light_z);
    double n_dot_h = std::max(0.0, n_x * h.x + n_y * h.y + normal_z * h.z);
    for (int k = 0; k < 5; ++k) n_dot_h *= n_dot_h;  // ^32
    const double diffuse_factor = ambient + diffuse * n_dot_l, added = highlight_level * n_dot_h;
    return {to_channel(double(base.r) * diffuse_factor + added), to_channel(double(base.g) * diffuse_factor + added),
            to_channel(double(base.b) * diffuse_factor + added)};
}

}  // namespace brownfloc::viewer::detail
