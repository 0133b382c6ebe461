#pragma once
// The viewer's orbiting perspective camera (viewer/README.md, "Coordinates and camera").
//
// World coordinates are the trajectory's (nm, box [0, L)^3, z up). The camera orbits the
// target c = box centre + pan at azimuth az, elevation el and distance D = dist * L:
//     w = (sin az cos el, -cos az cos el, sin el)   target -> eye      eye = c + D w
//     r = (cos az, sin az, 0)                        screen right
//     u = (-sin az sin el, cos az sin el, cos el)    screen up          (r x u = w)
// A point p with d = p - eye has camera coordinates x_c = d.r, y_c = d.u, z_c = -d.w and lands
// at s_x = X0 + W/2 + f x_c / z_c, s_y = Y0 + H/2 - f y_c / z_c with f = (H/2) / tan(20 deg).
//
//     const Camera camera(CameraPose{}, box_length_nm, Viewport{0, 0, 800, 600});
//     if (auto p = camera.project({0, 0, 0})) draw_marker(p->x_px, p->y_px);
//
// A Camera is an immutable value: every const member is safe to call from any thread.
#include <optional>

namespace brownfloc::viewer {

struct Vec3 {
    double x = 0, y = 0, z = 0;
};

// The scene's rectangle inside the image, in pixels; (x0_px, y0_px) is its top-left corner.
struct Viewport {
    int x0_px = 0, y0_px = 0, width_px = 1, height_px = 1;
};

// Where the camera is: angles in degrees, distance in box lengths, pan in nm.
struct CameraPose {
    double azimuth_deg = 30.0, elevation_deg = 20.0, distance_box_lengths = 2.6;
    Vec3 pan_nm{};  // offset of the orbit target from the box centre
};

inline constexpr double vertical_field_of_view_deg = 40.0;

// Continuous image coordinates (x right, y down; pixel (i, j) covers [i, i+1) x [j, j+1)) and
// the camera depth z_c in nm.
struct ScreenPoint {
    double x_px, y_px, depth_nm;
};

class Camera {
public:
    // Throws std::invalid_argument for a box length that is not finite and > 0, a viewport of
    // zero or negative width or height, or a pose with a non-finite value or distance <= 0.
    Camera(const CameraPose& pose, double box_length_nm, const Viewport& viewport);

    // Camera coordinates (x_c, y_c, z_c) of a world point in nm; z_c > 0 in front of the eye.
    [[nodiscard]] Vec3 to_camera_nm(const Vec3& point_nm) const;
    // Image position of a world point (nm); nullopt when it is not finite or its depth is below
    // near_plane_nm() (behind or too close to the eye).
    [[nodiscard]] std::optional<ScreenPoint> project(const Vec3& point_nm) const;
    // Image position of a point given in camera coordinates (nm); caller ensures z_c > 0.
    [[nodiscard]] ScreenPoint project_camera_point(const Vec3& camera_nm) const;
    // The smallest depth project() accepts: 1e-6 box lengths (keeps x_c / z_c finite).
    [[nodiscard]] double near_plane_nm() const;

    // f = (H/2) / tan(vertical_field_of_view_deg / 2), in pixels.
    [[nodiscard]] double focal_length_px() const;
    // Disc radius f * a / z_c in pixels of a sphere of radius_nm at depth_nm; throws
    // std::invalid_argument unless both are finite and depth_nm > 0.
    [[nodiscard]] double sphere_radius_px(double radius_nm, double depth_nm) const;

    [[nodiscard]] Vec3 eye_nm() const { return eye_nm_; }
    [[nodiscard]] Vec3 right() const { return right_; }
    [[nodiscard]] Vec3 up() const { return up_; }
    [[nodiscard]] Vec3 towards_eye() const { return towards_eye_; }
    [[nodiscard]] Vec3 target_nm() const { return target_nm_; }
    [[nodiscard]] const CameraPose& pose() const { return pose_; }
    [[nodiscard]] const Viewport& viewport() const { return viewport_; }
    [[nodiscard]] double box_length_nm() const { return box_length_nm_; }

private:
    CameraPose pose_;
    double box_length_nm_;
    Viewport viewport_;
    double focal_length_px_;
    Vec3 target_nm_, eye_nm_, right_, up_, towards_eye_;
};

// Interaction helpers: each returns a new pose and throws std::invalid_argument on a
// non-finite argument. Elevation is clamped to [-89, 89] deg, azimuth wrapped into [0, 360)
// deg, distance clamped to [0.05, 50] box lengths.
inline constexpr double min_elevation_deg = -89.0, max_elevation_deg = 89.0;
inline constexpr double min_distance_box_lengths = 0.05, max_distance_box_lengths = 50.0;

[[nodiscard]] CameraPose orbited(const CameraPose& pose, double delta_azimuth_deg, double delta_elevation_deg);
// distance *= factor (factor > 0 and finite).
[[nodiscard]] CameraPose zoomed(const CameraPose& pose, double factor);
// Moves the target in the screen plane so that the old target point, seen by the new pose,
// lies (delta_x_px, delta_y_px) from where it was: the scene follows the mouse at the target's
// depth. `camera` must be the camera of `pose`.
[[nodiscard]] CameraPose panned(const CameraPose& pose, const Camera& camera, double delta_x_px, double delta_y_px);

}  // namespace brownfloc::viewer
