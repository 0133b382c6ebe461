#include "box_outline.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <optional>

namespace brownfloc::viewer::detail {

namespace {

// Liang & Barsky (1984), "A new concept and method for line clipping", ACM TOG 3(1), 1:
// clip the parametric segment p0 + t (p1 - p0), t in [0, 1], against an axis-aligned box.
std::optional<ImageSegment> clip_to_rectangle(ImageSegment s, double x_min, double y_min, double x_max,
                                              double y_max) {
    const double dx = s.x1_px - s.x0_px, dy = s.y1_px - s.y0_px;
    double t_enter = 0.0, t_leave = 1.0;
    const std::array<double, 4> p{-dx, dx, -dy, dy};
    const std::array<double, 4> q{s.x0_px - x_min, x_max - s.x0_px, s.y0_px - y_min, y_max - s.y0_px};
    for (std::size_t k = 0; k < 4; ++k) {
        if (p[k] == 0.0) {
            if (q[k] < 0.0) return std::nullopt;
            continue;
        }
        const double t = q[k] / p[k];
        if (p[k] < 0.0)
            t_enter = std::max(t_enter, t);
        else
            t_leave = std::min(t_leave, t);
    }
    if (t_enter > t_leave) return std::nullopt;
    return ImageSegment{s.x0_px + t_enter * dx, s.y0_px + t_enter * dy, s.x0_px + t_leave * dx,
                        s.y0_px + t_leave * dy};
}

}  // namespace

std::vector<ImageSegment> box_outline_segments(const Camera& camera) {
    const double box = camera.box_length_nm();
    std::array<Vec3, 8> corners;
    for (int k = 0; k < 8; ++k)
        corners[std::size_t(k)] = camera.to_camera_nm({(k & 1) ? box : 0.0, (k & 2) ? box : 0.0, (k & 4) ? box : 0.0});
    // Edges join corners that differ in one coordinate bit.
    const double near_nm = camera.near_plane_nm();
    const Viewport& v = camera.viewport();
    std::vector<ImageSegment> segments;
    for (int a = 0; a < 8; ++a) {
        for (int bit = 1; bit < 8; bit <<= 1) {
            if (a & bit) continue;
            Vec3 p = corners[std::size_t(a)], q = corners[std::size_t(a | bit)];
            if (p.z < near_nm && q.z < near_nm) continue;
            // Cut the part behind the near plane off in camera space, before dividing by z.
            if (p.z < near_nm || q.z < near_nm) {
                const double t = (near_nm - p.z) / (q.z - p.z);
                const Vec3 cut{p.x + t * (q.x - p.x), p.y + t * (q.y - p.y), near_nm};
                (p.z < near_nm ? p : q) = cut;
            }
            const ScreenPoint s0 = camera.project_camera_point(p), s1 = camera.project_camera_point(q);
            if (auto clipped = clip_to_rectangle({s0.x_px, s0.y_px, s1.x_px, s1.y_px}, v.x0_px, v.y0_px,
                                                 double(v.x0_px) + v.width_px, double(v.y0_px) + v.height_px))
                segments.push_back(*clipped);
        }
    }
    return segments;
}

void draw_segments(const std::vector<ImageSegment>& segments, const Viewport& viewport, RowRange rows, Rgb colour,
                   SphereImage& image) {
    const int x_end = viewport.x0_px + viewport.width_px;
    for (const ImageSegment& s : segments) {
        const double dx = s.x1_px - s.x0_px, dy = s.y1_px - s.y0_px;
        const long steps = std::max(1L, long(std::ceil(std::max(std::abs(dx), std::abs(dy)))));
        for (long k = 0; k <= steps; ++k) {
            const double t = double(k) / double(steps);
            const int i = int(std::floor(s.x0_px + t * dx)), j = int(std::floor(s.y0_px + t * dy));
            // The clipped end can sit on the viewport's far edge: that pixel is outside.
            if (j < rows.begin || j >= rows.end || i < viewport.x0_px || i >= x_end) continue;
            const std::size_t k4 = 4 * (std::size_t(j) * std::size_t(image.width_px) + std::size_t(i));
            image.rgba[k4] = colour.r;
            image.rgba[k4 + 1] = colour.g;
            image.rgba[k4 + 2] = colour.b;
        }
    }
}

}  // namespace brownfloc::viewer::detail
