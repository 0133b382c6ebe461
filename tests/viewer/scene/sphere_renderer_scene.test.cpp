// Renderer behaviour at the scene level: thread counts, viewport edges, the eye, the box outline
// and bad input.
#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>
#include <limits>
#include <random>
#include <stdexcept>

#include "readme_formulas.hpp"
#include "render_helpers.hpp"
#include "scene/sphere_renderer.hpp"

using namespace brownfloc::viewer;
using namespace brownfloc::viewer::test;

namespace {

// Spheres scattered in and around the box, some overlapping, plus exact duplicates with other
// ids (depth ties). Seed 20240611; std::mt19937 is fully specified, and the values only need
// to be the same within one run of the test.
std::vector<Sphere> random_spheres(std::size_t count) {
    std::mt19937 generator(20240611u);
    std::uniform_real_distribution<double> position(-10.0, 110.0), radius(0.5, 9.0);
    std::uniform_int_distribution<int> channel(0, 255);
    std::vector<Sphere> spheres;
    for (std::size_t k = 0; k < count; ++k) {
        spheres.push_back({{position(generator), position(generator), position(generator)}, radius(generator),
                           {std::uint8_t(channel(generator)), std::uint8_t(channel(generator)),
                            std::uint8_t(channel(generator))},
                           std::uint32_t(count - k)});
        if (k % 50 == 0) {
            Sphere twin = spheres.back();
            twin.id = std::uint32_t(10 * count + k);
            twin.colour = {255, 255, 255};
            spheres.push_back(twin);
        }
    }
    return spheres;
}

bool is_one_of(Rgb c, Rgb a, Rgb b) { return c == a || c == b; }

}  // namespace

TEST_CASE("1 2 and 3 threads give identical images", "[viewer][scene][render][threads]") {
    const std::vector<Sphere> spheres = random_spheres(3000);
    for (const CameraPose pose : {CameraPose{}, CameraPose{200.0, -50.0, 0.6, {10.0, 0.0, -5.0}}}) {
        const Camera camera(pose, box_nm, Viewport{13, 7, 301, 263});
        RenderSettings settings;
        settings.threads = 1;
        const SphereImage one = render_image(spheres, camera, settings, 330, 280);
        for (int threads : {2, 3, 7, 0}) {
            CAPTURE(threads);
            settings.threads = threads;
            const SphereImage other = render_image(spheres, camera, settings, 330, 280);
            CHECK(other.rgba == one.rgba);
            CHECK(other.owner == one.owner);
            // Compare depth bit for bit (+inf compares equal to itself).
            CHECK(std::equal(other.depth_nm.begin(), other.depth_nm.end(), one.depth_nm.begin()));
        }
        std::vector<Sphere> reversed(spheres.rbegin(), spheres.rend());
        settings.threads = 2;
        const SphereImage backwards = render_image(reversed, camera, settings, 330, 280);
        CHECK(backwards.rgba == one.rgba);
        CHECK(backwards.owner == one.owner);
    }
}

TEST_CASE("a sphere straddling the viewport edge is clipped to the viewport", "[viewer][scene][render]") {
    // A 200 x 200 viewport at x0 = 100 of a 300 x 260 image (plots on the left and below).
    const Viewport viewport{100, 30, 200, 200};
    const Camera camera(front_pose, box_nm, viewport);
    const ReadmeCamera readme(0, 0, 2.6, box_nm, {}, 100, 30, 200, 200);
    SphereImage image;
    image.resize(300, 260);
    const Rgb sentinel{1, 2, 3};
    for (std::size_t k = 0; k < image.owner.size(); ++k) {
        image.rgba[4 * k] = sentinel.r;
        image.rgba[4 * k + 1] = sentinel.g;
        image.rgba[4 * k + 2] = sentinel.b;
        image.owner[k] = 42;
    }
    // Centre projected onto the viewport's left edge (s_x = 100): x_c = -f^-1 * 100 * z_c.
    const double depth = 230.0;
    const double x_c = -100.0 * depth / readme.f;
    const Sphere s{{50 + x_c, depth - 210.0, 50}, 15.0, {240, 200, 40}, 5};
    REQUIRE_THAT(readme.s_x(s.centre_nm), Catch::Matchers::WithinAbs(100.0, 1e-9));
    for (int threads : {1, 2}) {
        render_spheres({&s, 1}, camera, settings_with(threads), image);
        const int row = 130;  // the centre row (s_y = 130 is a row boundary; dy = 0.5)
        const double rho = readme.rho(s.centre_nm, s.radius_nm);
        CHECK(owned_in_row(image, row, 5) ==
              expected_row_count(readme.s_x(s.centre_nm), readme.s_y(s.centre_nm), rho, row, 100, 299));
        for (int j = 0; j < 260; ++j)
            for (int i = 0; i < 300; ++i) {
                const bool inside = i >= 100 && j >= 30 && j < 230;
                if (!inside) {
                    REQUIRE(image.owner_at(i, j) == 42);
                    REQUIRE(image.pixel(i, j) == sentinel);
                }
            }
    }
}

TEST_CASE("spheres behind or too close to the eye are skipped", "[viewer][scene][render]") {
    // front_pose: the eye is at y = -210 nm, so depth z_c = y + 210.
    const Camera camera(front_pose, box_nm, Viewport{0, 0, 160, 120});
    const std::vector<Sphere> hidden{
        {{50, -300, 50}, 20.0, {255, 0, 0}, 1},   // z_c = -90: behind
        {{50, -215, 50}, 20.0, {255, 0, 0}, 2},   // z_c = -5: centre behind, surface reaching in front
        {{50, -209.5, 50}, 20.0, {255, 0, 0}, 3},  // z_c = 0.5 < a / 10 = 2 (README: not drawn)
    };
    const SphereImage empty = render_image({}, camera, settings_with(2, true), 160, 120);
    const SphereImage skipped = render_image(hidden, camera, settings_with(2, true), 160, 120);
    CHECK(skipped.rgba == empty.rgba);
    CHECK(skipped.owner == empty.owner);

    // Just beyond a / 10 the sphere is drawn, and its huge disc (rho = 10 f) fills the viewport.
    const SphereImage close = render_image({Sphere{{50, -207.5, 50}, 20.0, {255, 0, 0}, 4}}, camera,
                                           settings_with(2, true), 160, 120);
    CHECK(std::all_of(close.owner.begin(), close.owner.end(), [](std::uint32_t id) { return id == 4; }));
}

TEST_CASE("an empty sphere list gives the background and the box lines only", "[viewer][scene][render]") {
    const int width = 400, height = 300;
    const Camera camera(CameraPose{}, box_nm, Viewport{0, 0, width, height});
    const ReadmeCamera readme(30, 20, 2.6, box_nm, {}, 0, 0, width, height);
    const SphereImage image = render_image({}, camera, settings_with(2, true), width, height);

    int line_pixels = 0;
    for (int j = 0; j < height; ++j)
        for (int i = 0; i < width; ++i) {
            const Rgb c = image.pixel(i, j);
            REQUIRE(is_one_of(c, background, box_colour));
            line_pixels += c == box_colour ? 1 : 0;
        }
    CHECK(std::all_of(image.owner.begin(), image.owner.end(), [](std::uint32_t id) { return id == no_particle; }));
    CHECK(std::all_of(image.depth_nm.begin(), image.depth_nm.end(), [](float d) { return std::isinf(d); }));

    const auto near_line = [&](double x, double y) {
        for (int dj = -1; dj <= 1; ++dj)
            for (int di = -1; di <= 1; ++di) {
                const int i = int(std::floor(x)) + di, j = int(std::floor(y)) + dj;
                if (i >= 0 && j >= 0 && i < width && j < height && image.pixel(i, j) == box_colour) return true;
            }
        return false;
    };
    // The 12 edges join corners differing in one coordinate; each is 1 px wide and about
    // max(|dx|, |dy|) pixels long, so the line pixels number about the sum of those lengths
    // (less where edges cross on screen).
    double drawn_length = 0;
    for (int a = 0; a < 8; ++a) {
        const Vec3 p{(a & 1) ? box_nm : 0, (a & 2) ? box_nm : 0, (a & 4) ? box_nm : 0};
        CAPTURE(a);
        CHECK(near_line(readme.s_x(p), readme.s_y(p)));
        for (int bit = 1; bit < 8; bit <<= 1) {
            if (a & bit) continue;
            const int b = a | bit;
            const Vec3 q{(b & 1) ? box_nm : 0, (b & 2) ? box_nm : 0, (b & 4) ? box_nm : 0};
            CHECK(near_line((readme.s_x(p) + readme.s_x(q)) / 2, (readme.s_y(p) + readme.s_y(q)) / 2));
            drawn_length += std::max(std::abs(readme.s_x(q) - readme.s_x(p)), std::abs(readme.s_y(q) - readme.s_y(p)));
        }
    }
    CHECK(line_pixels >= int(0.9 * drawn_length));
    CHECK(line_pixels <= int(drawn_length) + 24);

    const SphereImage plain = render_image({}, camera, settings_with(2, false), width, height);
    for (std::size_t k = 0; k < plain.owner.size(); ++k)
        REQUIRE(Rgb{plain.rgba[4 * k], plain.rgba[4 * k + 1], plain.rgba[4 * k + 2]} == background);
}

TEST_CASE("box lines are drawn behind the spheres", "[viewer][scene][render]") {
    const Camera camera(CameraPose{}, box_nm, Viewport{0, 0, 300, 300});
    const ReadmeCamera readme(30, 20, 2.6, box_nm, {}, 0, 0, 300, 300);
    // A sphere on the corner nearest the eye (x = L, y = 0, z = L for az 30, el 20), which puts
    // it in front of that corner's three edges.
    const Vec3 corner{box_nm, 0, box_nm};
    const Sphere s{corner, 6.0, {200, 60, 60}, 11};
    const SphereImage image = render_image({s}, camera, settings_with(1, true), 300, 300);
    const int i = int(std::floor(readme.s_x(corner))), j = int(std::floor(readme.s_y(corner)));
    CHECK(image.owner_at(i, j) == 11);
    CHECK(image.pixel(i, j) != box_colour);
}

TEST_CASE("render_spheres rejects bad input with a message naming the sphere or the size",
          "[viewer][scene][render][validation]") {
    const Camera camera(front_pose, box_nm, Viewport{0, 0, 50, 40});
    SphereImage image;
    image.resize(50, 40);
    const double nan = std::numeric_limits<double>::quiet_NaN(), inf = std::numeric_limits<double>::infinity();
    const Sphere good{{50, 50, 50}, 3.0, {1, 2, 3}, 0};
    const auto with = [&](Sphere bad) { return std::vector<Sphere>{good, bad}; };
    CHECK_THROWS_WITH(render_spheres(with({{nan, 0, 0}, 3.0, {}, 77}), camera, RenderSettings{}, image),
                      Catch::Contains("sphere 1") && Catch::Contains("id 77") && Catch::Contains("centre_nm"));
    CHECK_THROWS_WITH(render_spheres(with({{0, inf, 0}, 3.0, {}, 5}), camera, RenderSettings{}, image),
                      Catch::Contains("must be finite"));
    CHECK_THROWS_WITH(render_spheres(with({{0, 0, 0}, 0.0, {}, 5}), camera, RenderSettings{}, image),
                      Catch::Contains("radius_nm") && Catch::Contains("> 0"));
    CHECK_THROWS_AS(render_spheres(with({{0, 0, 0}, -1.0, {}, 5}), camera, RenderSettings{}, image),
                    std::invalid_argument);
    CHECK_THROWS_AS(render_spheres(with({{0, 0, 0}, nan, {}, 5}), camera, RenderSettings{}, image),
                    std::invalid_argument);
    CHECK_THROWS_WITH(render_spheres(with({{0, 0, 0}, 1.0, {}, no_particle}), camera, RenderSettings{}, image),
                      Catch::Contains("reserved"));
    RenderSettings negative;
    negative.threads = -1;
    CHECK_THROWS_WITH(render_spheres(with(good), camera, negative, image), Catch::Contains("threads = -1"));

    SphereImage small;
    small.resize(49, 40);
    CHECK_THROWS_WITH(render_spheres(with(good), camera, RenderSettings{}, small),
                      Catch::Contains("does not fit") && Catch::Contains("49 x 40"));
    const Camera shifted(front_pose, box_nm, Viewport{-1, 0, 10, 10});
    CHECK_THROWS_AS(render_spheres(with(good), shifted, RenderSettings{}, image), std::invalid_argument);
    SphereImage broken = image;
    broken.owner.pop_back();
    CHECK_THROWS_WITH(render_spheres(with(good), camera, RenderSettings{}, broken), Catch::Contains("buffers"));
}

TEST_CASE("the default thread count is the hardware's at most 8 and never more than the rows",
          "[viewer][scene][render][threads]") {
    RenderSettings settings;
    CHECK(render_thread_count(settings, 600) >= 1);
    CHECK(render_thread_count(settings, 600) <= 8);
    settings.threads = 5;
    CHECK(render_thread_count(settings, 600) == 5);
    CHECK(render_thread_count(settings, 3) == 3);
    settings.threads = 1000;
    CHECK(render_thread_count(settings, 600) == 64);
}

TEST_CASE("extreme cameras and sphere sizes give finite depths and valid owners", "[viewer][scene][render]") {
    // Cameras inside the box and far away, spheres from 1e-6 to 1e4 nm, centres inside,
    // around and far outside the box. Seed 99 (std::mt19937, fully specified).
    std::mt19937 generator(99u);
    std::uniform_real_distribution<double> unit(0.0, 1.0);
    std::vector<Sphere> spheres;
    for (std::uint32_t k = 0; k < 400; ++k) {
        const double spread = k % 4 == 0 ? 1e5 : 150.0;
        spheres.push_back({{(unit(generator) - 0.3) * spread, (unit(generator) - 0.3) * spread,
                            (unit(generator) - 0.3) * spread},
                           std::pow(10.0, -6.0 + 10.0 * unit(generator)), {200, 100, 50}, k});
    }
    for (const CameraPose pose : {CameraPose{10.0, 80.0, 0.05, {}}, CameraPose{300.0, -89.0, 50.0, {}},
                                  CameraPose{45.0, 0.0, 0.3, {40.0, -40.0, 0.0}}, CameraPose{}}) {
        const Camera camera(pose, box_nm, Viewport{0, 0, 120, 90});
        const SphereImage image = render_image(spheres, camera, settings_with(3, true), 120, 90);
        for (std::size_t k = 0; k < image.owner.size(); ++k) {
            if (image.owner[k] == no_particle) {
                REQUIRE(std::isinf(image.depth_nm[k]));
            } else {
                REQUIRE(image.owner[k] < 400);
                REQUIRE(std::isfinite(image.depth_nm[k]));
            }
        }
        const SphereImage single = render_image(spheres, camera, settings_with(1, true), 120, 90);
        CHECK(single.rgba == image.rgba);
    }
}
