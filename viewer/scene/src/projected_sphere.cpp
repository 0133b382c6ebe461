#include "projected_sphere.hpp"

#include <algorithm>
#include <cmath>

namespace brownfloc::viewer::detail {

std::optional<ProjectedSphere> project_sphere(const Sphere& sphere, std::uint32_t index, const Camera& camera) {
    const Vec3 c = camera.to_camera_nm(sphere.centre_nm);
    // viewer/README.md: points nearer than a tenth of a particle radius are not drawn.
    if (!(c.z >= 0.1 * sphere.radius_nm)) return std::nullopt;
    const ScreenPoint s = camera.project_camera_point(c);
    // A floor of 1e-6 px keeps 1 / rho finite for vanishing discs; such a disc covers only the
    // pixel holding its centre either way.
    const double rho = std::max(camera.focal_length_px() * sphere.radius_nm / c.z, 1e-6);
    if (!std::isfinite(s.x_px) || !std::isfinite(s.y_px) || !std::isfinite(rho)) return std::nullopt;

    // Pixel i is covered when |i + 0.5 - s_x| <= rho (on the centre row), so the candidates
    // are ceil(s_x - rho - 0.5) .. floor(s_x + rho - 0.5), plus the pixel holding the centre.
    // Everything is clipped in double before converting, since s_x may be far off screen.
    const double centre_i = std::floor(s.x_px), centre_j = std::floor(s.y_px);
    const double lo_x = std::min(std::ceil(s.x_px - rho - 0.5), centre_i);
    const double hi_x = std::max(std::floor(s.x_px + rho - 0.5), centre_i);
    const double lo_y = std::min(std::ceil(s.y_px - rho - 0.5), centre_j);
    const double hi_y = std::max(std::floor(s.y_px + rho - 0.5), centre_j);
    const Viewport& v = camera.viewport();
    const double first_x = v.x0_px, last_x = double(v.x0_px) + double(v.width_px) - 1.0;
    const double first_y = v.y0_px, last_y = double(v.y0_px) + double(v.height_px) - 1.0;
    if (hi_x < first_x || lo_x > last_x || hi_y < first_y || lo_y > last_y) return std::nullopt;

    ProjectedSphere p;
    p.centre_x_px = s.x_px;
    p.centre_y_px = s.y_px;
    p.radius_sq_px2 = rho * rho;
    p.inverse_radius_px = 1.0 / rho;
    p.depth_nm = c.z;
    p.radius_nm = sphere.radius_nm;
    p.nearest_depth_nm = float(c.z - sphere.radius_nm);
    p.x_begin = int(std::max(lo_x, first_x));
    p.x_end = int(std::min(hi_x, last_x)) + 1;
    p.y_begin = int(std::max(lo_y, first_y));
    p.y_end = int(std::min(hi_y, last_y)) + 1;
    // Only compared against pixels inside the viewport, so clamping an off-screen centre one
    // pixel outside keeps it off every candidate pixel while fitting in an int.
    p.centre_i = int(std::clamp(centre_i, first_x - 1.0, last_x + 1.0));
    p.centre_j = int(std::clamp(centre_j, first_y - 1.0, last_y + 1.0));
    p.index = index;
    p.colour = sphere.colour;
    return p;
}

}  // namespace brownfloc::viewer::detail
