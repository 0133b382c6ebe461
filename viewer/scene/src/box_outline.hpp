#pragma once
// The 12 edges of the periodic box [0, L)^3 as 2-D segments in image coordinates, clipped to
// the eye's near plane and to the viewport, and drawn as 1 px lines.
#include <vector>

#include "parallel_bands.hpp"
#include "scene/camera.hpp"
#include "scene/sphere_image.hpp"

namespace brownfloc::viewer::detail {

struct ImageSegment {
    double x0_px, y0_px, x1_px, y1_px;  // continuous image coordinates, inside the viewport
};

// Visible parts of the box edges (none for an edge wholly behind the eye or off screen).
[[nodiscard]] std::vector<ImageSegment> box_outline_segments(const Camera& camera);

// Draws each segment with a DDA: ceil(max(|dx|, |dy|)) equal steps, marking the pixel holding
// every step point. Only rows in `rows` and columns of the viewport are written, so bands can
// draw in parallel and the union is the same for any banding.
void draw_segments(const std::vector<ImageSegment>& segments, const Viewport& viewport, RowRange rows, Rgb colour,
                   SphereImage& image);

}  // namespace brownfloc::viewer::detail
