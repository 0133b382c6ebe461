#include "scene/sphere_renderer.hpp"

#include <catch2/catch.hpp>

#include <cmath>
#include <limits>

#include "readme_formulas.hpp"
#include "render_helpers.hpp"

using namespace brownfloc::viewer;
using namespace brownfloc::viewer::test;

namespace {

void check_colour_within(Rgb actual, Rgb expected, int levels) {
    CAPTURE(int(actual.r), int(actual.g), int(actual.b), int(expected.r), int(expected.g), int(expected.b));
    CHECK(std::abs(int(actual.r) - int(expected.r)) <= levels);
    CHECK(std::abs(int(actual.g) - int(expected.g)) <= levels);
    CHECK(std::abs(int(actual.b) - int(expected.b)) <= levels);
}

}  // namespace

TEST_CASE("equal spheres at different depths are drawn with radii in the inverse ratio of their depths",
          "[viewer][scene][render]") {
    const Camera camera(front_pose, box_nm, Viewport{0, 0, 400, 400});
    const ReadmeCamera readme(0, 0, 2.6, box_nm, {}, 0, 0, 400, 400);
    const double radius = 8.0;
    const Vec3 near_centre{30, 20, 50}, far_centre{70, 120, 50};  // depths 230 and 330 nm
    const Sphere near{near_centre, radius, {200, 80, 60}, 1};
    const Sphere far{far_centre, radius, {60, 80, 200}, 2};
    const SphereImage image = render_image({near, far}, camera, settings_with(1), 400, 400);

    // Both centres have y_c = 0, so they sit on the boundary between rows 199 and 200.
    const int row = 200;
    const int near_count = owned_in_row(image, row, 1), far_count = owned_in_row(image, row, 2);
    CHECK(near_count == expected_row_count(readme.s_x(near_centre), readme.s_y(near_centre),
                                           readme.rho(near_centre, radius), row));
    CHECK(far_count == expected_row_count(readme.s_x(far_centre), readme.s_y(far_centre),
                                          readme.rho(far_centre, radius), row));
    // rho = f a / z_c: widths in the ratio 330 / 230, up to one pixel of quantisation per edge
    // (so +-2 px on the far count, relative to it).
    const double ratio = double(near_count) / double(far_count);
    CHECK(std::abs(ratio - 330.0 / 230.0) <= 2.0 / far_count * ratio);
}

TEST_CASE("a near sphere hides a far one where their discs overlap", "[viewer][scene][render]") {
    const Camera camera(front_pose, box_nm, Viewport{0, 0, 400, 400});
    const ReadmeCamera readme(0, 0, 2.6, box_nm, {}, 0, 0, 400, 400);
    // The near sphere gets the higher id, so the tie rule cannot explain the result.
    const Sphere near{{50, 0, 50}, 10.0, {230, 120, 40}, 7};
    const Sphere far{{55, 60, 50}, 10.0, {40, 120, 230}, 3};
    for (int threads : {1, 2}) {
        const SphereImage image = render_image({far, near}, camera, settings_with(threads), 400, 400);
        // Pixel (205, 200) lies inside both discs (near: s_x = 200, rho = 26.2 px; far:
        // s_x = 210.2, rho = 20.4 px).
        const int i = 205, j = 200;
        const double near_rho = readme.rho(near.centre_nm, near.radius_nm);
        REQUIRE(std::hypot(i + 0.5 - readme.s_x(far.centre_nm), j + 0.5 - readme.s_y(far.centre_nm)) <
                readme.rho(far.centre_nm, far.radius_nm));
        CHECK(image.owner_at(i, j) == 7);
        const double q_x = (i + 0.5 - readme.s_x(near.centre_nm)) / near_rho;
        const double q_y = (j + 0.5 - readme.s_y(near.centre_nm)) / near_rho;
        // README shading, rounded: the renderer may differ by one level (brief).
        check_colour_within(image.pixel(i, j), readme_shade(near.colour, q_x, q_y), 1);
        // Depth of the covered point: z_c - a sqrt(1 - q^2) (float buffer: 1e-4 nm).
        CHECK_THAT(double(image.depth_at(i, j)),
                   Catch::Matchers::WithinAbs(210.0 - 10.0 * std::sqrt(1 - q_x * q_x - q_y * q_y), 1e-4));
        // Right of the near disc, only the far sphere is there.
        CHECK(image.owner_at(228, 200) == 3);
    }
}

TEST_CASE("intersecting spheres meet where their surfaces cross", "[viewer][scene][render]") {
    // Two spheres of radius 10 nm at depths 250 and 256 nm, side by side: along the centre row,
    // the owner switches where z_c1 - a sqrt(1 - q1^2) = z_c2 - a sqrt(1 - q2^2).
    const Camera camera(front_pose, box_nm, Viewport{0, 0, 400, 400});
    const ReadmeCamera readme(0, 0, 2.6, box_nm, {}, 0, 0, 400, 400);
    const Sphere a{{45, 40, 50}, 10.0, {200, 200, 200}, 1}, b{{53, 46, 50}, 10.0, {100, 100, 100}, 2};
    const SphereImage image = render_image({a, b}, camera, settings_with(2), 400, 400);
    for (int i = 170; i < 240; ++i) {
        const auto surface = [&](const Sphere& s) {
            const double rho = readme.rho(s.centre_nm, s.radius_nm);
            const double q = std::hypot(i + 0.5 - readme.s_x(s.centre_nm), 200.5 - readme.s_y(s.centre_nm)) / rho;
            return q <= 1 ? readme.z_c(s.centre_nm) - s.radius_nm * std::sqrt(1 - q * q)
                          : std::numeric_limits<double>::infinity();
        };
        const double depth_a = surface(a), depth_b = surface(b);
        if (std::abs(depth_a - depth_b) < 1e-3) continue;  // within float rounding of the crossing
        const std::uint32_t expected = depth_a == depth_b ? no_particle : (depth_a < depth_b ? 1u : 2u);
        CAPTURE(i);
        CHECK(image.owner_at(i, 200) == expected);
    }
}

TEST_CASE("the disc centre is shaded base x 0.91290 + 21.04", "[viewer][scene][render]") {
    const Camera camera(front_pose, box_nm, Viewport{0, 0, 400, 400});
    const ReadmeCamera readme(0, 0, 2.6, box_nm, {}, 0, 0, 400, 400);
    // Centre the disc on the centre (200.5, 200.5) of pixel (200, 200): x_c = 0.5 z_c / f,
    // y_c = -0.5 z_c / f, so that pixel has q = 0 and n = (0, 0, 1).
    const double depth = 150.0;
    const Vec3 centre{50 + 0.5 * depth / readme.f, depth - 210.0, 50 - 0.5 * depth / readme.f};
    REQUIRE_THAT(readme.s_x(centre), Catch::Matchers::WithinAbs(200.5, 1e-9));
    REQUIRE_THAT(readme.s_y(centre), Catch::Matchers::WithinAbs(200.5, 1e-9));
    for (const Rgb base : {Rgb{200, 100, 50}, Rgb{0, 0, 0}, Rgb{255, 255, 255}, Rgb{150, 150, 150}}) {
        const SphereImage image = render_image({Sphere{centre, 30.0, base, 0}}, camera, settings_with(1), 400, 400);
        // README "Spheres": at a disc centre the base is scaled by 0.91290 and 21.04 is added.
        // (Recomputed: 0.35 + 0.65 * 0.866 = 0.91290, but 63.75 * (n.h)^32 = 21.02 for the l
        // given, so the README's 21.04 is 0.02 high; the brief allows one level.)
        const auto expected = [](std::uint8_t c) {
            return std::uint8_t(std::min(255.0, std::round(double(c) * 0.91290 + 21.04)));
        };
        check_colour_within(image.pixel(200, 200), Rgb{expected(base.r), expected(base.g), expected(base.b)}, 1);
    }
}

TEST_CASE("shading across a disc follows the README formula within one level", "[viewer][scene][render]") {
    const Camera camera(front_pose, box_nm, Viewport{0, 0, 400, 400});
    const ReadmeCamera readme(0, 0, 2.6, box_nm, {}, 0, 0, 400, 400);
    const Sphere s{{48, 10, 53}, 25.0, {90, 200, 140}, 4};
    const SphereImage image = render_image({s}, camera, settings_with(3), 400, 400);
    const double rho = readme.rho(s.centre_nm, s.radius_nm);
    int checked = 0;
    for (int j = 0; j < 400; j += 3)
        for (int i = 0; i < 400; i += 3) {
            const double q_x = (i + 0.5 - readme.s_x(s.centre_nm)) / rho, q_y = (j + 0.5 - readme.s_y(s.centre_nm)) / rho;
            if (q_x * q_x + q_y * q_y > 1.0) continue;
            REQUIRE(image.owner_at(i, j) == 4);
            check_colour_within(image.pixel(i, j), readme_shade(s.colour, q_x, q_y), 1);
            ++checked;
        }
    CHECK(checked > 500);
}

TEST_CASE("a sub-pixel sphere covers exactly the pixel holding its centre", "[viewer][scene][render]") {
    const Camera camera(front_pose, box_nm, Viewport{0, 0, 400, 400});
    const ReadmeCamera readme(0, 0, 2.6, box_nm, {}, 0, 0, 400, 400);
    for (const double radius : {0.05, 0.12, 0.2}) {
        const Vec3 centre{53.1, 40.0, 47.3};
        CAPTURE(radius, readme.rho(centre, radius));
        REQUIRE(readme.rho(centre, radius) < 0.5);
        const SphereImage image = render_image({Sphere{centre, radius, {255, 0, 0}, 9}}, camera, settings_with(1), 400, 400);
        int owned = 0;
        for (int j = 0; j < 400; ++j) owned += owned_in_row(image, j, 9);
        CHECK(owned == 1);
        CHECK(image.owner_at(int(std::floor(readme.s_x(centre))), int(std::floor(readme.s_y(centre)))) == 9);
    }
}

TEST_CASE("equal depths go to the lower id whatever the order", "[viewer][scene][render]") {
    const Camera camera(front_pose, box_nm, Viewport{0, 0, 200, 200});
    const Sphere a{{50, 20, 50}, 12.0, {255, 0, 0}, 5}, b{{50, 20, 50}, 12.0, {0, 0, 255}, 9};
    const SphereImage ab = render_image({a, b}, camera, settings_with(1), 200, 200);
    const SphereImage ba = render_image({b, a}, camera, settings_with(2), 200, 200);
    CHECK(ab.owner_at(100, 100) == 5);
    CHECK(owned_in_row(ab, 100, 9) == 0);
    CHECK(ab.rgba == ba.rgba);
    CHECK(ab.owner == ba.owner);
}
