#pragma once
// CPU sphere renderer with a depth buffer and an id buffer (viewer/README.md, "Spheres").
//
// Each sphere is drawn as a disc of radius rho = f a / z_c about its projected centre; a pixel
// is covered when its centre lies within rho of the disc centre, and the pixel holding the disc
// centre is always covered (so sub-pixel spheres stay visible). The visible surface per pixel is
// the nearest one, depth z_c - a sqrt(1 - q^2) with q = distance / rho clamped to 1; equal
// depths go to the lower id, so the result does not depend on the order of the spheres or on
// the thread count. Shading: base (0.35 + 0.65 max(0, n.l)) + 63.75 max(0, n.h)^32 per channel.
//
//     SphereImage image;
//     image.resize(800, 600);
//     const Camera camera(CameraPose{}, box_length_nm, Viewport{0, 0, 800, 600});
//     render_spheres(spheres, camera, RenderSettings{}, image);
//     const std::uint32_t picked = image.owner_at(mouse_x, mouse_y);
//
// Threads: the viewport is cut into one horizontal band of rows per thread; each thread clears,
// draws the box outline and rasterises only its band, so no pixel is written by two threads.
#include <cstdint>
#include <span>

#include "scene/camera.hpp"
#include "scene/rgb.hpp"
#include "scene/sphere_image.hpp"

namespace brownfloc::viewer {

struct Sphere {
    Vec3 centre_nm;
    double radius_nm;
    Rgb colour;
    std::uint32_t id;  // written to the owner buffer; any value but no_particle
};

struct RenderSettings {
    Rgb background{22, 24, 30};
    bool box_outline = true;
    Rgb box_colour{120, 126, 140};
    int threads = 0;  // 0 = hardware_concurrency, capped at 8; otherwise as given, capped at 64 and the viewport height
};

inline constexpr int max_default_render_threads = 8, max_render_threads = 64;

// Clears the viewport's pixels of `image` (the image may be larger than the viewport: plots
// beside it) to the background, draws the 12 box edges of [0, L)^3 as 1 px lines (behind),
// then the spheres. Pixels outside the viewport are left untouched. Spheres closer than a
// tenth of their radius to the eye plane, or behind it, are skipped; spheres whose disc lies
// wholly outside the viewport cost one projection. Throws std::invalid_argument when the
// viewport does not fit in the image, the image buffers do not match its size, settings.threads
// < 0, or a sphere has a non-finite centre, a radius that is not finite and > 0, or the id
// no_particle (the message names the sphere's index and id). Identical output for any thread count.
void render_spheres(std::span<const Sphere> spheres, const Camera& camera, const RenderSettings& settings,
                    SphereImage& image);

// The thread count render_spheres will use for these settings and viewport height.
[[nodiscard]] int render_thread_count(const RenderSettings& settings, int viewport_height_px);

}  // namespace brownfloc::viewer
