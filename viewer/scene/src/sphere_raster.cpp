#include "sphere_raster.hpp"

#include <algorithm>
#include <cmath>

#include "sphere_shading.hpp"

namespace brownfloc::viewer::detail {

namespace {

// Calls visit(i, j, d2) for the candidate pixels of row j of a disc, d2 being the squared
// distance of the pixel centre from the disc centre in px^2. Candidates are the pixels the
// README covers (d2 <= rho^2) plus, on its row, the pixel holding the centre; a few outside the
// disc may be visited too, so callers test d2 (or ownership) themselves.
template <class Visit>
inline void for_each_candidate(const ProjectedSphere& p, RowRange rows, Visit&& visit) {
    const int j_begin = std::max(p.y_begin, rows.begin), j_end = std::min(p.y_end, rows.end);
    for (int j = j_begin; j < j_end; ++j) {
        const double dy = double(j) + 0.5 - p.centre_y_px, dy2 = dy * dy;
        int i_begin = p.x_begin, i_end = p.x_end;
        if (dy2 > p.radius_sq_px2) {
            if (j != p.centre_j) continue;
            i_begin = std::max(i_begin, p.centre_i);  // only the pixel holding the centre
            i_end = std::min(i_end, p.centre_i + 1);
        } else if (p.radius_sq_px2 > 16.0) {
            // One sqrt per row narrows the span of a large disc; the exact per-pixel test still
            // decides, so a one-pixel margin absorbs the rounding. Clamped in double first:
            // the centre may lie far outside the viewport.
            const double half = std::sqrt(p.radius_sq_px2 - dy2);
            i_begin = int(std::max(double(i_begin), std::ceil(p.centre_x_px - half - 0.5) - 1.0));
            i_end = int(std::min(double(i_end), std::floor(p.centre_x_px + half - 0.5) + 2.0));
        }
        for (int i = i_begin; i < i_end; ++i) {
            const double dx = double(i) + 0.5 - p.centre_x_px;
            visit(i, j, dx * dx + dy2);
        }
    }
}

// Whether sphere `candidate` at `depth` beats the current owner at `stored_depth`.
inline bool wins(float depth, float stored_depth, std::uint32_t candidate, std::uint32_t stored,
                 std::span<const std::uint32_t> ids) {
    if (depth != stored_depth) return depth < stored_depth;
    if (stored == no_particle) return true;
    return ids[candidate] != ids[stored] ? ids[candidate] < ids[stored] : candidate < stored;
}

}  // namespace

void rasterise_band(std::span<const ProjectedSphere> spheres, std::span<const std::uint32_t> ids, RowRange rows,
                    SphereImage& image) {
    const std::size_t width = std::size_t(image.width_px);
    float* depth_buffer = image.depth_nm.data();
    std::uint32_t* owner_buffer = image.owner.data();
    for (const ProjectedSphere& p : spheres) {
        const std::uint32_t index = p.index;
        for_each_candidate(p, rows, [&](int i, int j, double d2) {
            if (d2 > p.radius_sq_px2 && !(i == p.centre_i && j == p.centre_j)) return;
            const std::size_t pixel = std::size_t(j) * width + std::size_t(i);
            const float stored_depth = depth_buffer[pixel];
            if (p.nearest_depth_nm > stored_depth) return;  // cannot win: skip the sqrt
            // README: depth z_c - a sqrt(1 - q^2), q = distance / rho clamped to 1.
            const double q2 = std::min(1.0, d2 * p.inverse_radius_px * p.inverse_radius_px);
            const float depth = float(p.depth_nm - p.radius_nm * std::sqrt(1.0 - q2));
            if (wins(depth, stored_depth, index, owner_buffer[pixel], ids)) {
                depth_buffer[pixel] = depth;
                owner_buffer[pixel] = index;
            }
        });
    }
}

void shade_band(std::span<const ProjectedSphere> spheres, RowRange rows, SphereImage& image) {
    const HalfVector h = half_vector();
    const std::size_t width = std::size_t(image.width_px);
    const std::uint32_t* owner_buffer = image.owner.data();
    std::uint8_t* rgba = image.rgba.data();
    for (const ProjectedSphere& p : spheres) {
        const std::uint32_t index = p.index;
        for_each_candidate(p, rows, [&](int i, int j, double d2) {
            const std::size_t pixel = std::size_t(j) * width + std::size_t(i);
            if (owner_buffer[pixel] != index) return;
            double q_x = (double(i) + 0.5 - p.centre_x_px) * p.inverse_radius_px;
            double q_y = (double(j) + 0.5 - p.centre_y_px) * p.inverse_radius_px;
            double q2 = d2 * p.inverse_radius_px * p.inverse_radius_px;
            if (q2 > 1.0) {  // the centre pixel of a sub-pixel disc: shaded as the rim point
                const double scale = 1.0 / std::sqrt(q2);
                q_x *= scale;
                q_y *= scale;
                q2 = 1.0;
            }
            const Rgb c = shade(p.colour, q_x, q_y, std::sqrt(1.0 - q2), h);
            std::uint8_t* out = rgba + 4 * pixel;
            out[0] = c.r;
            out[1] = c.g;
            out[2] = c.b;
        });
    }
}

void resolve_owner_ids(std::span<const std::uint32_t> ids, const Viewport& viewport, RowRange rows,
                       SphereImage& image) {
    const std::size_t width = std::size_t(image.width_px);
    for (int j = rows.begin; j < rows.end; ++j) {
        std::uint32_t* owner = image.owner.data() + std::size_t(j) * width + std::size_t(viewport.x0_px);
        for (int i = 0; i < viewport.width_px; ++i)
            if (owner[i] != no_particle) owner[i] = ids[owner[i]];
    }
}

}  // namespace brownfloc::viewer::detail
