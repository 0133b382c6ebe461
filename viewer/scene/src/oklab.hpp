#pragma once
// Oklab to 8-bit sRGB, for the size map. Ottosson (2020), "A perceptual color space for image
// processing", bottosson.github.io/posts/oklab (matrices M1, M2 and their inverses, linear sRGB).
// sRGB transfer curve: IEC 61966-2-1:1999.
#include "scene/rgb.hpp"

namespace brownfloc::viewer::detail {

struct Oklab {
    double lightness, a, b;
};

// Rounds each channel to nearest after clamping the linear value to [0, 1].
[[nodiscard]] Rgb oklab_to_srgb8(const Oklab& colour);

}  // namespace brownfloc::viewer::detail
