#pragma once
// The tests' own colour science, written from the published formulas so the palette tests do
// not trust the library's conversions:
// - sRGB transfer curve and D65 matrix: IEC 61966-2-1:1999.
// - CIELAB (D65 white 0.95047, 1, 1.08883) and CIEDE76 = Euclidean distance: CIE 15:2004.
// - Colour-vision deficiency: Machado, Oliveira & Fernandes (2009), IEEE TVCG 15(6) 1291,
//   severity 1.0 matrices, applied to linear RGB; results clamped to [0, 1] (common practice).
// - Oklab: Ottosson (2020), bottosson.github.io/posts/oklab (linear sRGB to LMS, cube root, Lab).
#include <algorithm>
#include <array>
#include <cmath>
#include <cstdint>
#include <string>

#include "scene/rgb.hpp"

namespace brownfloc::viewer::test {

using Matrix3 = std::array<std::array<double, 3>, 3>;
using Triple = std::array<double, 3>;

enum class Vision { normal, protanopia, deuteranopia, tritanopia };
inline constexpr std::array<Vision, 4> all_visions{Vision::normal, Vision::protanopia, Vision::deuteranopia,
                                                   Vision::tritanopia};

inline std::string vision_name(Vision v) {
    switch (v) {
        case Vision::normal: return "normal vision";
        case Vision::protanopia: return "protanopia";
        case Vision::deuteranopia: return "deuteranopia";
        case Vision::tritanopia: return "tritanopia";
    }
    return "?";
}

inline Triple multiply(const Matrix3& m, const Triple& v) {
    return {m[0][0] * v[0] + m[0][1] * v[1] + m[0][2] * v[2], m[1][0] * v[0] + m[1][1] * v[1] + m[1][2] * v[2],
            m[2][0] * v[0] + m[2][1] * v[1] + m[2][2] * v[2]};
}

inline Triple linear_rgb(Rgb c) {
    const auto decode = [](std::uint8_t value) {
        const double e = double(value) / 255.0;
        return e <= 0.04045 ? e / 12.92 : std::pow((e + 0.055) / 1.055, 2.4);
    };
    return {decode(c.r), decode(c.g), decode(c.b)};
}

// Machado, Oliveira & Fernandes (2009): the authors' published matrices for severity 1.0, linear RGB.
inline Triple simulate(Vision vision, const Triple& linear) {
    static const Matrix3 protanopia{{{0.152286, 1.052583, -0.204868},
                                     {0.114503, 0.786281, 0.099216},
                                     {-0.003882, -0.048116, 1.051998}}};
    static const Matrix3 deuteranopia{{{0.367322, 0.860646, -0.227968},
                                       {0.280085, 0.672501, 0.047413},
                                       {-0.011820, 0.042940, 0.968881}}};
    static const Matrix3 tritanopia{{{1.255528, -0.076749, -0.178779},
                                     {-0.078411, 0.930809, 0.147602},
                                     {0.004733, 0.691367, 0.303900}}};
    Triple out = linear;
    switch (vision) {
        case Vision::normal: return linear;
        case Vision::protanopia: out = multiply(protanopia, linear); break;
        case Vision::deuteranopia: out = multiply(deuteranopia, linear); break;
        case Vision::tritanopia: out = multiply(tritanopia, linear); break;
    }
    for (double& v : out) v = std::clamp(v, 0.0, 1.0);
    return out;
}

inline Triple cielab(Rgb colour, Vision vision = Vision::normal) {
    static const Matrix3 rgb_to_xyz{{{0.4124564, 0.3575761, 0.1804375},
                                     {0.2126729, 0.7151522, 0.0721750},
                                     {0.0193339, 0.1191920, 0.9503041}}};
    const Triple xyz = multiply(rgb_to_xyz, simulate(vision, linear_rgb(colour)));
    const auto f = [](double t) {
        constexpr double delta = 6.0 / 29.0;
        return t > delta * delta * delta ? std::cbrt(t) : t / (3.0 * delta * delta) + 4.0 / 29.0;
    };
    const double fx = f(xyz[0] / 0.95047), fy = f(xyz[1] / 1.0), fz = f(xyz[2] / 1.08883);
    return {116.0 * fy - 16.0, 500.0 * (fx - fy), 200.0 * (fy - fz)};
}

inline double distance(const Triple& p, const Triple& q) {
    return std::sqrt((p[0] - q[0]) * (p[0] - q[0]) + (p[1] - q[1]) * (p[1] - q[1]) + (p[2] - q[2]) * (p[2] - q[2]));
}

// CIEDE76 colour difference as seen with `vision`.
inline double delta_e76(Rgb p, Rgb q, Vision vision = Vision::normal) {
    return distance(cielab(p, vision), cielab(q, vision));
}

inline Triple oklab(Rgb colour) {
    static const Matrix3 rgb_to_lms{{{0.4122214708, 0.5363325363, 0.0514459929},
                                     {0.2119034982, 0.6806995451, 0.1073969566},
                                     {0.0883024619, 0.2817188376, 0.6299787005}}};
    static const Matrix3 lms_to_lab{{{0.2104542553, 0.7936177850, -0.0040720468},
                                     {1.9779984951, -2.4285922050, 0.4505937099},
                                     {0.0259040371, 0.7827717662, -0.8086757660}}};
    Triple lms = multiply(rgb_to_lms, linear_rgb(colour));
    for (double& v : lms) v = std::cbrt(v);
    return multiply(lms_to_lab, lms);
}

}  // namespace brownfloc::viewer::test
