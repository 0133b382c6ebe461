// Real rendered pixels of `brownfloc-view --render` (run in-process, under xvfb-run): where
// spheres land, how big they are, what hides what, the colours, the selection, determinism.
// Expected positions and sizes come from the camera formulas of viewer/README.md, written out
// again in documented_camera.hpp, never from the viewer's projection.
#include <catch2/catch.hpp>

#include <SFML/Graphics/Image.hpp>

#include <cmath>
#include <sstream>

#include "../../support/temp_dir.hpp"
#include "documented_camera.hpp"
#include "hand_built_runs.hpp"
#include "headless_render.hpp"
#include "render_checks.hpp"
#include "scene/palettes.hpp"
#include "view_options.hpp"

using namespace brownfloc;
using test::PlacedSphere;
using viewer::ViewOptions;

namespace {

constexpr double L = test::hand_box_nm;
constexpr double c = L / 2;

ViewOptions scene_only(const std::filesystem::path& run, const std::filesystem::path& png, int w, int h) {
    ViewOptions options;
    options.run = run;
    options.render_png = png;
    options.size = {w, h};
    options.colour = viewer::ColourMode::species;
    return options;
}

// The pixel holding the predicted centre of sphere s, and the colour the README's shading
// gives that pixel for base colour `base`.
struct CentrePixel {
    unsigned x, y;
    viewer::Rgb expected;
};
CentrePixel centre_pixel(const PlacedSphere& s, const viewer::Rgb& base, double az, double el, int w, int h) {
    const test::Predicted p = test::predict(s.x_nm, s.y_nm, s.z_nm, s.radius_nm, az, el, 2.6, L, w, h);
    const int i = int(std::floor(p.x_px)), j = int(std::floor(p.y_px));
    return {unsigned(i), unsigned(j), test::shaded_pixel(base, i, j, p.x_px, p.y_px, p.radius_px)};
}

sf::Image render(const ViewOptions& options) {
    std::ostringstream out, messages;
    REQUIRE(viewer::render_headless(options, out, messages) == 0);
    sf::Image image;
    REQUIRE(image.loadFromFile(options.render_png->string()));
    return image;
}

}  // namespace

TEST_CASE("a particle at the box centre lands at the scene centre", "[viewer][pixels]") {
    const test::TempDir dir("bfview");
    test::write_hand_run(dir / "run", {{PlacedSphere{c, c, c, 30.0, 0, 0}}});
    const sf::Image image = render(scene_only(dir / "run", dir / "centre.png", 800, 600));
    const test::Blob blob = test::sphere_blob(image, 400, 300, 40);
    REQUIRE(blob.area > 0);
    CHECK(std::abs(blob.centre_x_px - 400.0) <= 1.0);
    CHECK(std::abs(blob.centre_y_px - 300.0) <= 1.0);
    // Its size: rho = f a / z_c with z_c = 2.6 L (README "Spheres").
    const test::Predicted p = test::predict(c, c, c, 30.0, 30, 20, 2.6, L, 800, 600);
    CHECK(std::sqrt(blob.area / 3.14159265358979) == Approx(p.radius_px).epsilon(0.05));
}

TEST_CASE("after a 90 degree orbit particles at +x and +y land where the camera formulas say", "[viewer][pixels]") {
    const test::TempDir dir("bfview");
    // species 0 at +x, species 1 at +y (different colours tell them apart)
    test::write_hand_run(dir / "run", {{PlacedSphere{c + 300, c, c + 100, 25.0, 0, 0},
                                        PlacedSphere{c, c + 300, c - 100, 25.0, 1, 1}}});
    for (const double el : {0.0, 35.0}) {
        ViewOptions options = scene_only(dir / "run", dir / "orbit.png", 800, 600);
        options.camera = viewer::CameraPose{90.0, el, 2.6, {}};
        const sf::Image image = render(options);
        for (const PlacedSphere& s : {PlacedSphere{c + 300, c, c + 100, 25.0, 0, 0},
                                      PlacedSphere{c, c + 300, c - 100, 25.0, 1, 1}}) {
            const test::Predicted p = test::predict(s.x_nm, s.y_nm, s.z_nm, s.radius_nm, 90.0, el, 2.6, L, 800, 600);
            const test::Blob blob = test::sphere_blob(image, int(p.x_px), int(p.y_px), int(p.radius_px) + 6);
            INFO("elevation " << el << " species " << s.species << " predicted " << p.x_px << ", " << p.y_px);
            REQUIRE(blob.area > 0);
            CHECK(std::abs(blob.centre_x_px - p.x_px) <= 1.0);
            CHECK(std::abs(blob.centre_y_px - p.y_px) <= 1.0);
        }
    }
}

TEST_CASE("two equal spheres at different depths show radii in the ratio of their depths", "[viewer][pixels]") {
    const test::TempDir dir("bfview");
    // Camera at azimuth 0, elevation 0 looks along +y: depth grows with y.
    const PlacedSphere near{c - 250, c - 300, c, 40.0, 0, 0}, far{c + 250, c + 300, c, 40.0, 1, 1};
    test::write_hand_run(dir / "run", {{near, far}});
    ViewOptions options = scene_only(dir / "run", dir / "depth.png", 1200, 900);
    options.camera = viewer::CameraPose{0.0, 0.0, 2.6, {}};
    const sf::Image image = render(options);
    const test::Predicted pn = test::predict(near.x_nm, near.y_nm, near.z_nm, 40, 0, 0, 2.6, L, 1200, 900);
    const test::Predicted pf = test::predict(far.x_nm, far.y_nm, far.z_nm, 40, 0, 0, 2.6, L, 1200, 900);
    const test::Blob bn = test::sphere_blob(image, int(pn.x_px), int(pn.y_px), int(pn.radius_px) + 6);
    const test::Blob bf = test::sphere_blob(image, int(pf.x_px), int(pf.y_px), int(pf.radius_px) + 6);
    REQUIRE(bn.area > 0);
    REQUIRE(bf.area > 0);
    // radius from the covered area, rho = sqrt(area / pi); predicted ratio z_far / z_near = 2900 / 2300
    const double measured = std::sqrt(double(bn.area) / double(bf.area));
    CHECK(measured == Approx(pf.depth_nm / pn.depth_nm).epsilon(0.02));
    CHECK(pf.depth_nm / pn.depth_nm == Approx(2900.0 / 2300.0));
}

TEST_CASE("a near sphere hides a far one", "[viewer][pixels]") {
    const test::TempDir dir("bfview");
    // Both on the line of sight through the scene centre (azimuth 0, elevation 0), the far one larger.
    const PlacedSphere near{c, c - 200, c, 30.0, 0, 0}, far{c, c + 200, c, 60.0, 1, 1};
    test::write_hand_run(dir / "run", {{near, far}});
    ViewOptions options = scene_only(dir / "run", dir / "hide.png", 800, 600);
    options.camera = viewer::CameraPose{0.0, 0.0, 2.6, {}};
    const sf::Image image = render(options);
    // The centre pixel is the near sphere's disc centre: species 0's colour, shaded.
    const CentrePixel centre = centre_pixel(near, viewer::species_colour(0), 0, 0, 800, 600);
    CHECK(test::close_to(image.getPixel(centre.x, centre.y), centre.expected, 2));
    // Just outside the near disc but inside the far one: the far sphere's colour (species 1's hue).
    const test::Predicted pn = test::predict(near.x_nm, near.y_nm, near.z_nm, 30, 0, 0, 2.6, L, 800, 600);
    const test::Predicted pf = test::predict(far.x_nm, far.y_nm, far.z_nm, 60, 0, 0, 2.6, L, 800, 600);
    REQUIRE(pf.radius_px > pn.radius_px + 4);
    const int x = 400 + int((pn.radius_px + pf.radius_px) / 2);
    CHECK(test::same_hue(image.getPixel(unsigned(x), 300), viewer::species_colour(1)));
    CHECK_FALSE(test::same_hue(image.getPixel(unsigned(x), 300), viewer::species_colour(0)));
}

TEST_CASE("colours follow the chosen colouring", "[viewer][pixels]") {
    const test::TempDir dir("bfview");
    // A doublet (cluster 0) of species 0 and 1, a doublet (cluster 2) of species 0, a monomer (4) of species 1.
    const std::vector<PlacedSphere> spheres{
        {c - 250, c, c, 30.0, 0, 0}, {c - 190, c, c, 30.0, 1, 0},
        {c + 60, c, c, 30.0, 0, 2},  {c + 120, c, c, 30.0, 0, 2},
        {c + 300, c, c + 200, 30.0, 1, 4}};
    test::write_hand_run(dir / "run", {spheres});
    auto check_colour = [&](const sf::Image& image, const PlacedSphere& s, const viewer::Rgb& base) {
        const CentrePixel at = centre_pixel(s, base, 0, 0, 800, 600);
        const sf::Color got = image.getPixel(at.x, at.y);
        INFO("sphere at x = " << s.x_nm << ": got " << int(got.r) << " " << int(got.g) << " " << int(got.b)
                              << ", expected " << int(at.expected.r) << " " << int(at.expected.g) << " "
                              << int(at.expected.b));
        CHECK(test::close_to(got, at.expected, 2));
    };
    ViewOptions options = scene_only(dir / "run", dir / "colours.png", 800, 600);
    options.camera = viewer::CameraPose{0.0, 0.0, 2.6, {}};

    options.colour = viewer::ColourMode::species;
    sf::Image image = render(options);
    for (const PlacedSphere& s : spheres) check_colour(image, s, viewer::species_colour(s.species));

    options.colour = viewer::ColourMode::cluster;
    image = render(options);
    check_colour(image, spheres[0], viewer::cluster_colour(0, 2));  // one cluster, one colour
    check_colour(image, spheres[1], viewer::cluster_colour(0, 2));
    check_colour(image, spheres[2], viewer::cluster_colour(2, 2));
    check_colour(image, spheres[3], viewer::cluster_colour(2, 2));
    check_colour(image, spheres[4], viewer::monomer_grey);
    CHECK_FALSE(viewer::cluster_colour(0, 2) == viewer::cluster_colour(2, 2));

    options.colour = viewer::ColourMode::size;
    image = render(options);
    check_colour(image, spheres[4], viewer::size_colour(1, 2));
    check_colour(image, spheres[0], viewer::size_colour(2, 2));
}

TEST_CASE("a selected cluster keeps its colour and the rest is dimmed", "[viewer][pixels]") {
    const test::TempDir dir("bfview");
    const std::vector<PlacedSphere> spheres{{c - 200, c, c, 30.0, 0, 0}, {c - 140, c, c, 30.0, 0, 0},
                                            {c + 200, c, c, 30.0, 1, 2}};
    test::write_hand_run(dir / "run", {spheres});
    ViewOptions options = scene_only(dir / "run", dir / "select.png", 800, 600);
    options.camera = viewer::CameraPose{0.0, 0.0, 2.6, {}};
    options.select.cluster_id = 2;
    const sf::Image image = render(options);
    auto check_colour = [&](const PlacedSphere& s, const viewer::Rgb& base) {
        const CentrePixel at = centre_pixel(s, base, 0, 0, 800, 600);
        CHECK(test::close_to(image.getPixel(at.x, at.y), at.expected, 2));
    };
    const viewer::Rgb background{22, 24, 30};
    check_colour(spheres[2], viewer::species_colour(1));
    // README "Spheres": every other sphere at background + 0.35 (colour - background), then shaded.
    check_colour(spheres[0], viewer::dimmed(viewer::species_colour(0), background));
    check_colour(spheres[1], viewer::dimmed(viewer::species_colour(0), background));
    const viewer::Rgb expected_dim = viewer::dimmed(viewer::Rgb{200, 100, 50}, background);
    CHECK(expected_dim == viewer::Rgb{uint8_t(std::lround(22 + 0.35 * 178)), uint8_t(std::lround(24 + 0.35 * 76)),
                                      uint8_t(std::lround(30 + 0.35 * 20))});
}

TEST_CASE("two renders of the same input are pixel-identical", "[viewer][pixels]") {
    const test::TempDir dir("bfview");
    std::vector<PlacedSphere> spheres;
    for (int i = 0; i < 60; ++i)
        spheres.push_back({100.0 + 13.0 * i, 500.0 + 300.0 * std::sin(i * 0.7), 500.0 + 300.0 * std::cos(i * 1.3), 25.0,
                           std::uint32_t(i % 2), std::uint32_t(i - i % 3)});
    test::write_hand_run(dir / "run", {spheres});
    ViewOptions options = scene_only(dir / "run", dir / "a.png", 640, 480);
    options.plots = true;
    options.colour = viewer::ColourMode::cluster;
    const sf::Image a = render(options);
    options.render_png = dir / "b.png";
    const sf::Image b = render(options);
    REQUIRE(a.getSize() == b.getSize());
    CHECK(test::differing_pixels(a, b, 0, {}) == 0);
}
