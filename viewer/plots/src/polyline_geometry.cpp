#include "plots/polyline_geometry.hpp"

#include <algorithm>
#include <cmath>

namespace brownfloc::viewer {

std::optional<PixelSegment> clip_segment(PixelPoint a, PixelPoint b, double left_px, double top_px, double right_px,
                                         double bottom_px) {
    const double dx = b.x_px - a.x_px, dy = b.y_px - a.y_px;
    if (!std::isfinite(dx) || !std::isfinite(dy) || !std::isfinite(left_px) || !std::isfinite(top_px) ||
        !std::isfinite(right_px) || !std::isfinite(bottom_px))
        return std::nullopt;
    // Liang-Barsky: for each edge, p * t <= q must hold for the part of a + t (b - a) inside.
    // Edges: 0 left, 1 right, 2 top, 3 bottom.
    const double p[4] = {-dx, dx, -dy, dy};
    const double q[4] = {a.x_px - left_px, right_px - a.x_px, a.y_px - top_px, bottom_px - a.y_px};
    const double edge_value[4] = {left_px, right_px, top_px, bottom_px};
    double t_enter = 0.0, t_leave = 1.0;
    int enter_edge = -1, leave_edge = -1;
    for (int edge = 0; edge < 4; ++edge) {
        if (p[edge] == 0.0) {
            if (q[edge] < 0.0) return std::nullopt;  // parallel to this edge and outside it
            continue;
        }
        const double t = q[edge] / p[edge];
        if (p[edge] < 0.0 && t > t_enter) {
            t_enter = t;
            enter_edge = edge;
        } else if (p[edge] > 0.0 && t < t_leave) {
            t_leave = t;
            leave_edge = edge;
        }
    }
    if (!(t_enter <= t_leave)) return std::nullopt;  // also catches NaN
    // Interpolate from the nearer end and put the clipped coordinate exactly on its edge, so a
    // segment from a point 1e300 px away keeps its visible part.
    const auto point_at = [&](double t, int edge, PixelPoint end) {
        if (edge < 0) return end;
        PixelPoint point = t <= 0.5 ? PixelPoint{a.x_px + t * dx, a.y_px + t * dy}
                                    : PixelPoint{b.x_px - (1.0 - t) * dx, b.y_px - (1.0 - t) * dy};
        if (edge < 2)
            point.x_px = edge_value[edge];
        else
            point.y_px = edge_value[edge];
        point.x_px = std::clamp(point.x_px, left_px, right_px);
        point.y_px = std::clamp(point.y_px, top_px, bottom_px);
        return point;
    };
    return PixelSegment{point_at(t_enter, enter_edge, a), point_at(t_leave, leave_edge, b)};
}

std::vector<PixelSegment> dash_segment(PixelPoint a, PixelPoint b, const DashPattern& pattern, double& phase_px) {
    const double dx = b.x_px - a.x_px, dy = b.y_px - a.y_px;
    const double length_px = std::hypot(dx, dy);
    const bool usable_pattern = std::isfinite(pattern.on_px) && pattern.on_px > 0.0 && std::isfinite(pattern.off_px) &&
                                pattern.off_px > 0.0;
    if (!usable_pattern || !std::isfinite(length_px)) return {PixelSegment{a, b}};

    const double period_px = pattern.on_px + pattern.off_px;
    if (!std::isfinite(phase_px) || phase_px < 0.0 || phase_px >= period_px) phase_px = 0.0;
    std::vector<PixelSegment> pieces;
    // Each pass consumes at least min(on_px, off_px) of the length; a segment many periods
    // long (a line far outside the screen is clipped before it gets here) stops at 100000
    // pieces rather than allocating without bound.
    double along_px = 0.0;
    for (int guard = 0; along_px < length_px && guard < 100000; ++guard) {
        const bool drawing = phase_px < pattern.on_px;
        const double run_px = std::min((drawing ? pattern.on_px : period_px) - phase_px, length_px - along_px);
        if (drawing && run_px > 0.0) {
            const double t0 = along_px / length_px, t1 = (along_px + run_px) / length_px;
            pieces.push_back(PixelSegment{{a.x_px + t0 * dx, a.y_px + t0 * dy}, {a.x_px + t1 * dx, a.y_px + t1 * dy}});
        }
        along_px += run_px;
        phase_px += run_px;
        if (phase_px >= period_px) phase_px -= period_px;
    }
    return pieces;
}

}  // namespace brownfloc::viewer
