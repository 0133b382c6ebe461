// Golden images: a small hand-built run rendered with and without plots, compared with the
// PNGs checked in under golden/ with a stated tolerance and the text masked (font rendering
// may differ between FreeType builds; the pictures must not). Regenerate after an intended
// change of the look with BROWNFLOC_UPDATE_GOLDEN=1 (the test then writes the files and fails,
// so that nobody updates them by accident), and look at them before committing.
#include <catch2/catch.hpp>

#include <SFML/Graphics/Image.hpp>

#include <cmath>
#include <cstdlib>
#include <sstream>

#include "../../support/temp_dir.hpp"
#include "hand_built_runs.hpp"
#include "headless_render.hpp"
#include "render_checks.hpp"
#include "view_options.hpp"

using namespace brownfloc;
using test::PlacedSphere;

namespace {

// Tolerance: a channel may differ by 6 levels, and at most 0.2 % of the unmasked pixels may
// differ by more (a few edge pixels of a shifted line).
constexpr int channel_tolerance = 6;
constexpr double differing_fraction_allowed = 0.002;

std::vector<std::vector<PlacedSphere>> golden_frames() {
    // Three clusters and monomers of two species, in a 1000 nm box: a 7-particle chain, a triplet, a doublet.
    std::vector<PlacedSphere> spheres;
    for (int i = 0; i < 7; ++i) spheres.push_back({250.0 + 55.0 * i, 400.0 + 10.0 * i, 500.0 + 15.0 * std::sin(i), 28.0, std::uint32_t(i % 2), 0});
    for (int i = 0; i < 3; ++i) spheres.push_back({650.0, 300.0 + 56.0 * i, 300.0, 28.0, 1, 7});
    spheres.push_back({400.0, 700.0, 700.0, 28.0, 0, 10});
    spheres.push_back({456.0, 700.0, 700.0, 28.0, 0, 10});
    for (int i = 0; i < 8; ++i)
        spheres.push_back({120.0 + 110.0 * i, 850.0 - 60.0 * i, 150.0 + 90.0 * i, 28.0, std::uint32_t(i % 2),
                           std::uint32_t(12 + i)});
    return {spheres, spheres};
}

void compare_with_golden(const sf::Image& image, const std::string& name, const std::vector<test::MaskRect>& masks) {
    const std::string path = std::string(BROWNFLOC_GOLDEN_DIR) + "/" + name;
    if (const char* update = std::getenv("BROWNFLOC_UPDATE_GOLDEN"); update && std::string(update) == "1") {
        REQUIRE(image.saveToFile(path));
        FAIL("wrote " << path << " (BROWNFLOC_UPDATE_GOLDEN=1): look at it, then run the test again without the variable");
    }
    sf::Image golden;
    REQUIRE(golden.loadFromFile(path));
    REQUIRE(golden.getSize() == image.getSize());
    const int differing = test::differing_pixels(image, golden, channel_tolerance, masks);
    const double total = double(image.getSize().x) * double(image.getSize().y);
    INFO(name << ": " << differing << " pixels differ by more than " << channel_tolerance << " levels");
    CHECK(double(differing) <= differing_fraction_allowed * total);
}

sf::Image render(const test::TempDir& dir, bool plots) {
    test::write_hand_run(dir / "run", golden_frames());
    viewer::ViewOptions options;
    options.run = dir / "run";
    options.render_png = dir / "golden.png";
    options.size = {960, 600};
    options.plots = plots;
    options.camera = viewer::CameraPose{35.0, 25.0, 2.2, {}};
    std::ostringstream out, messages;
    REQUIRE(viewer::render_headless(options, out, messages) == 0);
    sf::Image image;
    REQUIRE(image.loadFromFile(options.render_png->string()));
    return image;
}

// The text over the scene: the lines at the top left.
const test::MaskRect scene_text{0, 0, 480, 110};

}  // namespace

TEST_CASE("the scene matches its golden image with the text masked", "[viewer][golden]") {
    const test::TempDir dir("bfview");
    compare_with_golden(render(dir, false), "scene-960x600.png", {scene_text});
}

TEST_CASE("the scene with plots matches its golden image with the text masked", "[viewer][golden]") {
    const test::TempDir dir("bfview");
    // Plot column: P = round(0.375 * 960) = 360 at x = 600, four plots of 150 px. Masked in each
    // plot: the margins (titles, tick labels, axis labels) and the legend corner and marker labels
    // along the top of the data rect.
    std::vector<test::MaskRect> masks{scene_text};
    for (int k = 0; k < 4; ++k) {
        const int top = 150 * k;
        masks.push_back({600, top, 360, 20});                // title
        masks.push_back({600, top, 58, 150});                // y ticks and label
        masks.push_back({600, top + 150 - 30, 360, 30});     // x ticks and label
        masks.push_back({600 + 58, top + 20, 302, 40});      // legend, notes, marker labels
    }
    compare_with_golden(render(dir, true), "scene-plots-960x600.png", masks);
}
