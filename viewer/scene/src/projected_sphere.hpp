#pragma once
// A sphere after projection: its disc on the image and the pixel rectangle it may cover,
// already clipped to the viewport. Computed once per sphere per frame.
#include <cstdint>
#include <optional>

#include "scene/camera.hpp"
#include "scene/sphere_renderer.hpp"

namespace brownfloc::viewer::detail {

struct ProjectedSphere {
    double centre_x_px, centre_y_px;  // continuous image coordinates of the disc centre
    double radius_sq_px2, inverse_radius_px;  // rho^2 and 1 / rho
    double depth_nm, radius_nm;        // z_c of the centre and the sphere radius a
    float nearest_depth_nm;            // float(z_c - a): no pixel of this sphere is nearer
    int x_begin, x_end, y_begin, y_end;  // candidate pixels [x_begin, x_end) x [y_begin, y_end), in the viewport
    int centre_i, centre_j;            // the pixel holding the disc centre (always covered)
    std::uint32_t index;  // position in the input list (owner buffer value until ids are resolved)
    Rgb colour;
};

// nullopt when the sphere is behind the eye, closer than radius / 10 to the eye plane, or its
// disc misses the viewport. The sphere must be valid (finite centre, finite radius > 0).
[[nodiscard]] std::optional<ProjectedSphere> project_sphere(const Sphere& sphere, std::uint32_t index,
                                                          const Camera& camera);

}  // namespace brownfloc::viewer::detail
