#pragma once
// viewer/README.md's camera and shading formulas, re-derived here so that tests predict pixels
// without calling the code under test ("Tests never call the viewer's own projection").
#include <algorithm>
#include <cmath>
#include <numbers>

#include "scene/camera.hpp"
#include "scene/rgb.hpp"

namespace brownfloc::viewer::test {

inline double radians(double degrees) { return degrees * std::numbers::pi / 180.0; }
inline double dot(const Vec3& a, const Vec3& b) { return a.x * b.x + a.y * b.y + a.z * b.z; }
inline Vec3 minus(const Vec3& a, const Vec3& b) { return {a.x - b.x, a.y - b.y, a.z - b.z}; }
inline Vec3 cross(const Vec3& a, const Vec3& b) {
    return {a.y * b.z - a.z * b.y, a.z * b.x - a.x * b.z, a.x * b.y - a.y * b.x};
}

// "Coordinates and camera": w, r, u, eye, f and the projection s_x, s_y.
struct ReadmeCamera {
    Vec3 w, r, u, eye;
    double f;
    double x0, y0, width, height;

    ReadmeCamera(double az_deg, double el_deg, double dist, double box, Vec3 pan, double x0_px, double y0_px,
                 double width_px, double height_px)
        : x0{x0_px}, y0{y0_px}, width{width_px}, height{height_px} {
        const double az = radians(az_deg), el = radians(el_deg);
        w = {std::sin(az) * std::cos(el), -std::cos(az) * std::cos(el), std::sin(el)};
        r = {std::cos(az), std::sin(az), 0.0};
        u = {-std::sin(az) * std::sin(el), std::cos(az) * std::sin(el), std::cos(el)};
        const Vec3 c{box / 2 + pan.x, box / 2 + pan.y, box / 2 + pan.z};
        const double d = dist * box;
        eye = {c.x + d * w.x, c.y + d * w.y, c.z + d * w.z};
        f = (height_px / 2) / std::tan(radians(20.0));
    }
    double z_c(const Vec3& p) const { return -dot(minus(p, eye), w); }
    double s_x(const Vec3& p) const { return x0 + width / 2 + f * dot(minus(p, eye), r) / z_c(p); }
    double s_y(const Vec3& p) const { return y0 + height / 2 - f * dot(minus(p, eye), u) / z_c(p); }
    double rho(const Vec3& p, double radius) const { return f * radius / z_c(p); }
};

// "Spheres": the shaded colour of a pixel whose centre is offset (q_x, q_y) rho from the disc
// centre (image axes, y down), q <= 1.
inline Rgb readme_shade(Rgb base, double q_x, double q_y) {
    const double nz = std::sqrt(std::max(0.0, 1.0 - q_x * q_x - q_y * q_y));
    const double lx = -0.3, ly = 0.4, lz = 0.866;
    const double hn = std::sqrt(lx * lx + ly * ly + (lz + 1) * (lz + 1));
    const double n_dot_l = q_x * lx - q_y * ly + nz * lz;
    const double n_dot_h = (q_x * lx - q_y * ly + nz * (lz + 1)) / hn;
    const double diffuse = 0.35 + 0.65 * std::max(0.0, n_dot_l);
    const double highlight = 255 * 0.25 * std::pow(std::max(0.0, n_dot_h), 32);
    const auto channel = [&](std::uint8_t c) {
        return std::uint8_t(std::clamp(std::round(double(c) * diffuse + highlight), 0.0, 255.0));
    };
    return {channel(base.r), channel(base.g), channel(base.b)};
}

}  // namespace brownfloc::viewer::test
