// The plots beside the scene, as --render --plots draws them: clusters/N0 = 0.5 at t = t1/2
// on the plain Smoluchowski curve falls on the pixel the layout rules give, and the barrier
// marker stands at the barrier gap. Pixels computed here from the rules written in
// plots/plot_layout.hpp (column, margins, ranges), not by calling the viewer's AxisMap.
#include <catch2/catch.hpp>

#include <SFML/Graphics/Image.hpp>

#include <algorithm>
#include <cmath>
#include <vector>
#include <cstdio>
#include <fstream>
#include <sstream>

#include "../../support/temp_dir.hpp"
#include "hand_built_runs.hpp"
#include "headless_render.hpp"
#include "plots/plot_spec.hpp"
#include "render_checks.hpp"
#include "view_options.hpp"

using namespace brownfloc;
using test::PlacedSphere;

namespace {

constexpr double c = test::hand_box_nm / 2;

// timeseries.csv as a run writes it (INTERFACES.md columns), for N0 = 4 particles, t in [0, 4]
// half-lives: the plain Smoluchowski curve N/N0 = 1/(1 + t/t1/2) (Smoluchowski 1917, constant
// kernel), a made-up transient curve and made-up "measured" counts that stay away from it at t = 1.
void write_timeseries(const std::filesystem::path& path) {
    std::ofstream out(path);
    out << "time_s,time_half_lives,clusters,monomers,doublets,triplets,mean_size,weight_mean_size,largest,"
           "smoluchowski_clusters,smoluchowski_clusters_transient\n";
    for (int k = 0; k <= 80; ++k) {
        const double t = 0.05 * k;
        char row[512];
        std::snprintf(row, sizeof row, "%.17g,%.17g,%.17g,4,0,0,1,1,1,%.17g,%.17g\n", t * test::hand_half_life_s, t,
                      4.0 / (1.0 + 0.4 * t), 4.0 / (1.0 + t), 4.0 / (1.0 + 1.3 * t));
        out << row;
    }
}

bool has_colour_near(const sf::Image& image, int x, int y, const viewer::PlotColour& colour, int reach, int tolerance) {
    for (int j = y - reach; j <= y + reach; ++j)
        for (int i = x - reach; i <= x + reach; ++i)
            if (test::near_colour(image.getPixel(unsigned(i), unsigned(j)), colour.r, colour.g, colour.b, tolerance))
                return true;
    return false;
}

}  // namespace

TEST_CASE("clusters over N0 of one half at one half-life falls on the computed plot pixel", "[viewer][plots]") {
    const test::TempDir dir("bfview");
    std::vector<std::vector<PlacedSphere>> frames;
    for (int k = 0; k < 4; ++k)
        frames.push_back({{c - 100, c, c, 30.0, 0, 0}, {c, c, c, 30.0, 0, 1}, {c + 100, c, c, 30.0, 1, 2},
                          {c, c + 100, c, 30.0, 1, 3}});
    test::write_hand_run(dir / "run", frames);
    write_timeseries(dir / "run" / "timeseries.csv");
    viewer::ViewOptions options;
    options.run = dir / "run";
    options.render_png = dir / "plots.png";
    options.size = {1280, 800};
    options.plots = true;
    options.frame = viewer::FrameChoice{false, 3};  // t = 3 t1/2: the time marker stays clear of t = 1
    std::ostringstream out, messages;
    REQUIRE(viewer::render_headless(options, out, messages) == 0);
    sf::Image image;
    REQUIRE(image.loadFromFile(options.render_png->string()));

    // Column: P = round(0.375 * 1280) = 480 at x = 800; plots floor(800 / 4) = 200 high.
    // Plot 1 data rect: x 800 + 58 = 858, width 480 - 58 - 10 = 412; y 0 + 20 = 20, height 200 - 20 - 30 = 150.
    // Ranges: x in [0, 4] (the largest time), y in [0, 1].
    const double x = 858 + 412 * (1.0 / 4.0), y = 20 + 150 * (1.0 - 0.5);
    CHECK(has_colour_near(image, int(std::floor(x)), int(std::floor(y)), viewer::plot_colours::smoluchowski, 1, 12));
    // ... and not the transient curve's or the measured series' colour there (they pass elsewhere).
    CHECK_FALSE(has_colour_near(image, int(std::floor(x)), int(std::floor(y)), viewer::plot_colours::transient_corrected, 1, 12));
    // The measured series at t = 1: 1/(1 + 0.4) = 0.714.
    const double y_measured = 20 + 150 * (1.0 - 1.0 / 1.4);
    CHECK(has_colour_near(image, int(std::floor(x)), int(std::floor(y_measured)), viewer::plot_colours::measured, 1, 12));
    // The current-time marker at t = 3.
    CHECK(has_colour_near(image, int(std::floor(858 + 412 * 0.75)), 20 + 120, viewer::plot_colours::current_time, 1, 12));

    // Plot 4 (interaction): outer y = 600, data rect x 858 width 412, y 620 height 150; x range from the
    // first gap, 0.2 nm, to the sample after the last one with |U| >= 1 % of the largest |U|, and at
    // least twice the barrier gap (viewer/README.md "Layout"); the barrier at 3 nm.
    std::vector<double> gap, energy;
    for (int k = 0; k < 512; ++k) {
        gap.push_back(0.2 + 29.8 * double(k) / 511.0);
        energy.push_back(12.0 * std::exp(-std::pow((gap.back() - 3.0) / 1.2, 2)) - 1.0 / gap.back());
    }
    double largest = 0;
    for (double u : energy) largest = std::max(largest, std::fabs(u));
    std::size_t last = 0;
    for (std::size_t k = 0; k < energy.size(); ++k)
        if (std::fabs(energy[k]) >= 0.01 * largest) last = k;
    double x_end = gap[std::min(last + 1, gap.size() - 1)];
    REQUIRE(x_end > 6.0);  // beyond twice the barrier gap already
    const double barrier_x = 858 + 412 * (3.0 - 0.2) / (x_end - 0.2);
    int rows_with_marker = 0;
    for (int j = 620 + 20; j < 620 + 150 - 5; ++j)
        if (has_colour_near(image, int(std::floor(barrier_x)), j, viewer::plot_colours::barrier_marker, 1, 12))
            ++rows_with_marker;
    CHECK(rows_with_marker >= (150 - 25) * 8 / 10);
    // ... and not three pixels to either side
    int rows_beside = 0;
    for (int j = 620 + 20; j < 620 + 150 - 5; ++j)
        if (has_colour_near(image, int(std::floor(barrier_x)) + 4, j, viewer::plot_colours::barrier_marker, 0, 12) ||
            has_colour_near(image, int(std::floor(barrier_x)) - 4, j, viewer::plot_colours::barrier_marker, 0, 12))
            ++rows_beside;
    CHECK(rows_beside <= 5);
}
