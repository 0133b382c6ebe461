#include "scene/camera.hpp"

#include <algorithm>
#include <cmath>
#include <numbers>
#include <stdexcept>
#include <string>

#include "vec3_math.hpp"

namespace brownfloc::viewer {

using detail::dot;
using detail::is_finite;
using detail::operator+;
using detail::operator-;
using detail::operator*;

namespace {

constexpr double radians_per_degree = std::numbers::pi / 180.0;

[[noreturn]] void reject(const std::string& what, double value, const std::string& allowed) {
    std::string message = "camera: ";
    message += what;
    message += " = ";
    message += std::to_string(value);
    message += ": ";
    message += allowed;
    throw std::invalid_argument(message);
}

void require_finite(const char* what, double value) {
    if (!std::isfinite(value)) reject(what, value, "must be finite");
}

}  // namespace

Camera::Camera(const CameraPose& pose, double box_length_nm, const Viewport& viewport)
    : pose_{pose}, box_length_nm_{box_length_nm}, viewport_{viewport} {
    if (!std::isfinite(box_length_nm) || box_length_nm <= 0)
        reject("box_length_nm", box_length_nm, "must be finite and > 0");
    if (viewport.width_px <= 0) reject("viewport width_px", viewport.width_px, "must be >= 1");
    if (viewport.height_px <= 0) reject("viewport height_px", viewport.height_px, "must be >= 1");
    require_finite("azimuth_deg", pose.azimuth_deg);
    require_finite("elevation_deg", pose.elevation_deg);
    require_finite("distance_box_lengths", pose.distance_box_lengths);
    if (pose.distance_box_lengths <= 0) reject("distance_box_lengths", pose.distance_box_lengths, "must be > 0");
    require_finite("pan_nm.x", pose.pan_nm.x);
    require_finite("pan_nm.y", pose.pan_nm.y);
    require_finite("pan_nm.z", pose.pan_nm.z);

    const double az = pose.azimuth_deg * radians_per_degree, el = pose.elevation_deg * radians_per_degree;
    const double sin_az = std::sin(az), cos_az = std::cos(az), sin_el = std::sin(el), cos_el = std::cos(el);
    towards_eye_ = {sin_az * cos_el, -cos_az * cos_el, sin_el};
    right_ = {cos_az, sin_az, 0.0};
    up_ = {-sin_az * sin_el, cos_az * sin_el, cos_el};
    const double half = 0.5 * box_length_nm;
    target_nm_ = Vec3{half, half, half} + pose.pan_nm;
    eye_nm_ = target_nm_ + (pose.distance_box_lengths * box_length_nm) * towards_eye_;
    focal_length_px_ =
        0.5 * double(viewport.height_px) / std::tan(0.5 * vertical_field_of_view_deg * radians_per_degree);
}

Vec3 Camera::to_camera_nm(const Vec3& point_nm) const {
    const Vec3 d = point_nm - eye_nm_;
    return {dot(d, right_), dot(d, up_), -dot(d, towards_eye_)};
}

ScreenPoint Camera::project_camera_point(const Vec3& c) const {
    const double scale = focal_length_px_ / c.z;
    return {double(viewport_.x0_px) + 0.5 * double(viewport_.width_px) + scale * c.x,
            double(viewport_.y0_px) + 0.5 * double(viewport_.height_px) - scale * c.y, c.z};
}

std::optional<ScreenPoint> Camera::project(const Vec3& point_nm) const {
    if (!is_finite(point_nm)) return std::nullopt;
    const Vec3 c = to_camera_nm(point_nm);
    if (!(c.z >= near_plane_nm())) return std::nullopt;
    return project_camera_point(c);
}

double Camera::near_plane_nm() const { return 1e-6 * box_length_nm_; }

double Camera::focal_length_px() const { return focal_length_px_; }

double Camera::sphere_radius_px(double radius_nm, double depth_nm) const {
    if (!std::isfinite(radius_nm)) reject("sphere radius_nm", radius_nm, "must be finite");
    if (!std::isfinite(depth_nm) || depth_nm <= 0) reject("sphere depth_nm", depth_nm, "must be finite and > 0");
    return focal_length_px_ * radius_nm / depth_nm;
}

CameraPose orbited(const CameraPose& pose, double delta_azimuth_deg, double delta_elevation_deg) {
    require_finite("orbit delta_azimuth_deg", delta_azimuth_deg);
    require_finite("orbit delta_elevation_deg", delta_elevation_deg);
    require_finite("azimuth_deg", pose.azimuth_deg);
    require_finite("elevation_deg", pose.elevation_deg);
    CameraPose next = pose;
    double azimuth = std::fmod(pose.azimuth_deg + delta_azimuth_deg, 360.0);
    if (azimuth < 0) azimuth += 360.0;
    if (azimuth >= 360.0) azimuth = 0.0;  // -1e-17 + 360 rounds to 360
    next.azimuth_deg = azimuth;
    next.elevation_deg = std::clamp(pose.elevation_deg + delta_elevation_deg, min_elevation_deg, max_elevation_deg);
    return next;
}

CameraPose zoomed(const CameraPose& pose, double factor) {
    if (!std::isfinite(factor) || factor <= 0) reject("zoom factor", factor, "must be finite and > 0");
    require_finite("distance_box_lengths", pose.distance_box_lengths);
    CameraPose next = pose;
    next.distance_box_lengths =
        std::clamp(pose.distance_box_lengths * factor, min_distance_box_lengths, max_distance_box_lengths);
    return next;
}

CameraPose panned(const CameraPose& pose, const Camera& camera, double delta_x_px, double delta_y_px) {
    require_finite("pan delta_x_px", delta_x_px);
    require_finite("pan delta_y_px", delta_y_px);
    // The target sits at depth D on the view axis, where one pixel spans D / f nm. Moving the
    // target by -dx r + dy u (in those units) puts the old target dx right and dy down on screen.
    const double nm_per_px = camera.pose().distance_box_lengths * camera.box_length_nm() / camera.focal_length_px();
    CameraPose next = pose;
    next.pan_nm = pose.pan_nm + (-delta_x_px * nm_per_px) * camera.right() + (delta_y_px * nm_per_px) * camera.up();
    return next;
}

}  // namespace brownfloc::viewer
