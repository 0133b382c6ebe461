#pragma once
// Looking at rendered pixels: the blob a sphere makes, colours with a tolerance, the shaded
// colour at a disc centre (viewer/README.md "Spheres"), hue comparison, image differences with
// masked rectangles (where text is drawn).
#include <SFML/Graphics/Image.hpp>

#include <algorithm>
#include <cmath>
#include <cstdint>
#include <vector>

#include "scene/sphere_image.hpp"

namespace brownfloc::test {

inline bool near_colour(const sf::Color& a, int r, int g, int b, int tolerance) {
    return std::abs(int(a.r) - r) <= tolerance && std::abs(int(a.g) - g) <= tolerance && std::abs(int(a.b) - b) <= tolerance;
}

inline bool close_to(const sf::Color& pixel, const viewer::Rgb& expected, int tolerance) {
    return near_colour(pixel, expected.r, expected.g, expected.b, tolerance);
}

// README "Spheres": at a disc centre n = (0, 0, 1): base * (0.35 + 0.65 * 0.866) + 255 * 0.25 * (n.h)^32.
inline viewer::Rgb shaded_centre(const viewer::Rgb& base) {
    const double lz = 0.866, hz = (lz + 1.0) / std::sqrt(0.3 * 0.3 + 0.4 * 0.4 + (lz + 1.0) * (lz + 1.0));
    const double diffuse = 0.35 + 0.65 * lz, highlight = 255.0 * 0.25 * std::pow(hz, 32);
    auto channel = [&](std::uint8_t v) {
        return static_cast<std::uint8_t>(std::clamp(std::lround(v * diffuse + highlight), 0L, 255L));
    };
    return {channel(base.r), channel(base.g), channel(base.b)};
}

// Pixels drawn by a sphere: neither the background (22, 24, 30) nor the box outline (120, 126, 140).
inline bool sphere_pixel(const sf::Color& p) {
    return !near_colour(p, 22, 24, 30, 3) && !near_colour(p, 120, 126, 140, 0);
}

// README "Spheres": the colour of pixel (i, j) of a disc centred at (cx, cy) with radius rho:
// n = (q_x, -q_y, sqrt(1 - q^2)) with q = (pixel centre - disc centre) / rho.
inline viewer::Rgb shaded_pixel(const viewer::Rgb& base, int i, int j, double cx, double cy, double rho) {
    double qx = (i + 0.5 - cx) / rho, qy = (j + 0.5 - cy) / rho;
    const double q2 = qx * qx + qy * qy;
    if (q2 > 1) {
        qx /= std::sqrt(q2);
        qy /= std::sqrt(q2);
    }
    const double nx = qx, ny = -qy, nz = std::sqrt(std::max(0.0, 1 - nx * nx - ny * ny));
    const double lx = -0.3, ly = 0.4, lz = 0.866;
    const double hn = std::sqrt(lx * lx + ly * ly + (lz + 1) * (lz + 1));
    const double hx = lx / hn, hy = ly / hn, hz = (lz + 1) / hn;
    const double diffuse = 0.35 + 0.65 * std::max(0.0, nx * lx + ny * ly + nz * lz);
    const double highlight = 255.0 * 0.25 * std::pow(std::max(0.0, nx * hx + ny * hy + nz * hz), 32);
    auto channel = [&](std::uint8_t v) {
        return static_cast<std::uint8_t>(std::clamp(std::lround(v * diffuse + highlight), 0L, 255L));
    };
    return {channel(base.r), channel(base.g), channel(base.b)};
}

struct Blob {
    int area = 0;
    double centre_x_px = 0, centre_y_px = 0;  // centroid of the pixel centres
};

// The sphere pixels in the square of half-width `half` about (x, y).
inline Blob sphere_blob(const sf::Image& image, int x, int y, int half) {
    Blob blob;
    const int w = int(image.getSize().x), h = int(image.getSize().y);
    for (int j = std::max(0, y - half); j <= std::min(h - 1, y + half); ++j)
        for (int i = std::max(0, x - half); i <= std::min(w - 1, x + half); ++i)
            if (sphere_pixel(image.getPixel(unsigned(i), unsigned(j)))) {
                ++blob.area;
                blob.centre_x_px += i + 0.5;
                blob.centre_y_px += j + 0.5;
            }
    if (blob.area > 0) {
        blob.centre_x_px /= blob.area;
        blob.centre_y_px /= blob.area;
    }
    return blob;
}

inline double hue_deg(double r, double g, double b) {
    const double mx = std::max({r, g, b}), mn = std::min({r, g, b}), d = mx - mn;
    if (d <= 0) return -1;  // grey: no hue
    double h = mx == r ? std::fmod((g - b) / d, 6.0) : mx == g ? (b - r) / d + 2 : (r - g) / d + 4;
    h *= 60;
    return h < 0 ? h + 360 : h;
}

// Same hue within 20 degrees (shading scales a colour and adds a little white).
inline bool same_hue(const sf::Color& pixel, const viewer::Rgb& base) {
    const double a = hue_deg(pixel.r, pixel.g, pixel.b), b = hue_deg(base.r, base.g, base.b);
    if (a < 0 || b < 0) return a < 0 && b < 0;
    const double d = std::fabs(a - b);
    return std::min(d, 360 - d) <= 20;
}

struct MaskRect {
    int x, y, w, h;
};

// Pixels differing by more than `tolerance` in some channel, outside the masked rectangles.
inline int differing_pixels(const sf::Image& a, const sf::Image& b, int tolerance, const std::vector<MaskRect>& masks) {
    int count = 0;
    for (unsigned j = 0; j < a.getSize().y; ++j)
        for (unsigned i = 0; i < a.getSize().x; ++i) {
            bool masked = false;
            for (const MaskRect& m : masks)
                masked = masked || (int(i) >= m.x && int(i) < m.x + m.w && int(j) >= m.y && int(j) < m.y + m.h);
            if (masked) continue;
            const sf::Color p = a.getPixel(i, j), q = b.getPixel(i, j);
            if (!near_colour(p, q.r, q.g, q.b, tolerance)) ++count;
        }
    return count;
}

}  // namespace brownfloc::test
