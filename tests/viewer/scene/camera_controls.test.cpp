#include <catch2/catch.hpp>

#include <cmath>
#include <limits>
#include <stdexcept>

#include "readme_formulas.hpp"
#include "scene/camera.hpp"

using namespace brownfloc::viewer;
using brownfloc::viewer::test::ReadmeCamera;
using Catch::Matchers::WithinAbs;

TEST_CASE("orbiting wraps the azimuth into 0 to 360 degrees and clamps the elevation",
          "[viewer][scene][camera]") {
    const CameraPose start{350.0, 80.0, 2.6, {}};
    CHECK(orbited(start, 20.0, 0.0).azimuth_deg == 10.0);
    CHECK(orbited(start, -350.0, 0.0).azimuth_deg == 0.0);
    CHECK(orbited(start, -360.0 * 3 + 15.0, 0.0).azimuth_deg == 5.0);
    CHECK(orbited(CameraPose{0.0, 0.0, 1.0, {}}, -1e-17, 0.0).azimuth_deg < 360.0);
    CHECK(orbited(start, 0.0, 30.0).elevation_deg == 89.0);
    CHECK(orbited(start, 0.0, -500.0).elevation_deg == -89.0);
    CHECK(orbited(start, 0.0, -5.0).elevation_deg == 75.0);
    CHECK(orbited(start, 0.0, 0.0).distance_box_lengths == 2.6);
    CHECK_THROWS_AS(orbited(start, std::numeric_limits<double>::quiet_NaN(), 0.0), std::invalid_argument);
    CHECK_THROWS_AS(orbited(start, 0.0, std::numeric_limits<double>::infinity()), std::invalid_argument);
}

TEST_CASE("zooming scales the distance and clamps it to 0.05 to 50 box lengths", "[viewer][scene][camera]") {
    const CameraPose start{};
    CHECK_THAT(zoomed(start, 0.5).distance_box_lengths, WithinAbs(1.3, 1e-15));
    CHECK(zoomed(start, 1e-6).distance_box_lengths == 0.05);
    CHECK(zoomed(start, 1e6).distance_box_lengths == 50.0);
    CHECK(zoomed(start, 2.0).azimuth_deg == start.azimuth_deg);
    CHECK_THROWS_WITH(zoomed(start, 0.0), Catch::Contains("zoom factor"));
    CHECK_THROWS_AS(zoomed(start, -2.0), std::invalid_argument);
    CHECK_THROWS_AS(zoomed(start, std::numeric_limits<double>::quiet_NaN()), std::invalid_argument);
}

TEST_CASE("panning moves the old target with the mouse at the target's depth", "[viewer][scene][camera]") {
    const double box = 120.0;
    const Viewport viewport{10, 20, 640, 480};
    for (const CameraPose pose : {CameraPose{}, CameraPose{250.0, -40.0, 1.1, {4.0, -3.0, 2.0}}}) {
        const Camera before(pose, box, viewport);
        const Vec3 old_target = before.target_nm();
        const double dx = 37.0, dy = -12.5;
        const CameraPose moved = panned(pose, before, dx, dy);
        CHECK(moved.azimuth_deg == pose.azimuth_deg);
        CHECK(moved.elevation_deg == pose.elevation_deg);
        CHECK(moved.distance_box_lengths == pose.distance_box_lengths);
        // Predict with the README projection of the new pose: the old target must sit (dx, dy)
        // from the viewport centre, at the unchanged depth D (it moved within the screen plane).
        const ReadmeCamera after(moved.azimuth_deg, moved.elevation_deg, moved.distance_box_lengths, box, moved.pan_nm,
                                 10, 20, 640, 480);
        CHECK_THAT(after.s_x(old_target), WithinAbs(10 + 320.0 + dx, 1e-9));
        CHECK_THAT(after.s_y(old_target), WithinAbs(20 + 240.0 + dy, 1e-9));
        CHECK_THAT(after.z_c(old_target), WithinAbs(pose.distance_box_lengths * box, 1e-9));
    }
    const Camera camera(CameraPose{}, box, viewport);
    CHECK_THROWS_AS(panned(CameraPose{}, camera, std::numeric_limits<double>::quiet_NaN(), 0.0),
                    std::invalid_argument);
}
