// draw_plot puts data where plot_layout.hpp says. Expected pixels are computed here from the
// documented layout and range rules, never by calling AxisMap.
#include "pixel_support.hpp"
#include "plots/plot_builders.hpp"
#include "plots/plot_drawing.hpp"

#include <catch2/catch.hpp>

#include <cmath>
#include <vector>

using namespace brownfloc::viewer;
using namespace brownfloc::viewer::pixel_test;

namespace {

// Layout of a 1280 x 800 image with plots (viewer/README.md "Layout", plot_layout.hpp):
// column P = round(0.375 * 1280) = 480 from x = 800; plots 800 / 4 = 200 px high; data rect
// inside margins left 58, right 10, top 20, bottom 30.
constexpr double data_left_px = 800 + 58;           // 858
constexpr double data_width_px = 480 - 58 - 10;     // 412
constexpr double data_height_px = 200 - 20 - 30;    // 150
double data_top_px(int plot) { return 200.0 * plot + 20.0; }

// Smoluchowski (1917), Z. Phys. Chem. 92, 129: for the constant kernel the number of clusters
// falls as N/N0 = 1 / (1 + t / t_half).
PlotSpec smoluchowski_clusters_plot(double current_t_half_lives) {
    std::vector<double> t, n_over_n0;
    for (int i = 0; i <= 200; ++i) {
        t.push_back(4.0 * i / 200.0);
        n_over_n0.push_back(1.0 / (1.0 + t.back()));
    }
    return clusters_plot({}, {}, t, n_over_n0, {}, current_t_half_lives);
}

// A smooth curve with a 12 kT barrier at h = 3 nm (a made-up shape, not physics), capture at 1 nm.
PairCurve bump_curve() {
    PairCurve curve{"A-A", {}, {}, 3.0, 12.0, 1.0};
    for (int i = 0; i <= 390; ++i) {
        const double h = 0.5 + 0.05 * i;  // 0.5 .. 20 nm
        curve.gap_nm.push_back(h);
        curve.energy_kT.push_back(12.0 * std::exp(-0.5 * (h - 3.0) * (h - 3.0)));
    }
    return curve;
}

sf::Image draw_one(const PlotSpec& spec, int plot) {
    const ViewerLayout layout = layout_viewer(1280, 800, true);
    auto image = blank_image();
    draw_plot(*image, spec, layout.plot_outer[static_cast<std::size_t>(plot)],
              layout.plot_data[static_cast<std::size_t>(plot)], test_font());
    return read_back(*image);
}

}  // namespace

TEST_CASE("the plain Smoluchowski curve passes through its pixel at one half-life", "[viewer][plots][display]") {
    const sf::Image image = draw_one(smoluchowski_clusters_plot(2.5), 0);
    // Range rule plot 1: x in [0, 4] (largest time), y in [0, 1].
    const auto pixel_of = [](double t, double n_over_n0) {
        return sf::Vector2i(static_cast<int>(std::floor(data_left_px + t / 4.0 * data_width_px)),
                            static_cast<int>(std::floor(data_top_px(0) + (1.0 - n_over_n0) * data_height_px)));
    };
    const sf::Vector2i one_half_life = pixel_of(1.0, 0.5);  // (961, 95)
    CHECK(one_half_life == sf::Vector2i(961, 95));
    CHECK(colour_near(image, one_half_life.x, one_half_life.y, plot_colours::smoluchowski));
    const sf::Vector2i three_half_lives = pixel_of(3.0, 0.25);
    CHECK(colour_near(image, three_half_lives.x, three_half_lives.y, plot_colours::smoluchowski));
    // The curve is not drawn where it does not pass: well above it at t = 1.
    const sf::Vector2i above = pixel_of(1.0, 0.85);
    CHECK_FALSE(colour_near(image, above.x, above.y, plot_colours::smoluchowski, 3));
    // Nothing outside the data rect: the scene side is untouched.
    CHECK(has_colour(image, 400, 95, PlotColour{22, 24, 30}));
}

TEST_CASE("the current time marker fills its pixel column in the clusters plot", "[viewer][plots][display]") {
    const sf::Image image = draw_one(smoluchowski_clusters_plot(2.5), 0);
    const int column = static_cast<int>(std::floor(data_left_px + 2.5 / 4.0 * data_width_px));  // 1115
    for (int row = static_cast<int>(data_top_px(0)) + 40; row < static_cast<int>(data_top_px(0) + data_height_px); row += 7)
        CHECK(has_colour(image, column, row, plot_colours::current_time));
    CHECK_FALSE(has_colour(image, column - 2, 100, plot_colours::current_time));
    CHECK_FALSE(has_colour(image, column + 2, 100, plot_colours::current_time));
}

TEST_CASE("the interaction plot's barrier marker lies at the barrier gap's pixel column", "[viewer][plots][display]") {
    const sf::Image image = draw_one(interaction_plot({bump_curve()}), 3);
    // Range rule plot 4: x in [0.5, 20] nm; y in [-15, 15] (y_top = 1.25 * 12).
    const int barrier_column = static_cast<int>(std::floor(data_left_px + (3.0 - 0.5) / 19.5 * data_width_px));
    const int capture_column = static_cast<int>(std::floor(data_left_px + (1.0 - 0.5) / 19.5 * data_width_px));
    CHECK(barrier_column == 910);
    // Rows below U = 0 (the curve stays above): only the markers are there.
    const int zero_row = static_cast<int>(data_top_px(3) + 0.5 * data_height_px);
    for (int row = zero_row + 5; row <= zero_row + 40; row += 5) {
        INFO("row " << row);
        CHECK(has_colour(image, barrier_column, row, plot_colours::barrier_marker));
        CHECK_FALSE(has_colour(image, barrier_column - 1, row, plot_colours::barrier_marker));
        CHECK_FALSE(has_colour(image, barrier_column + 1, row, plot_colours::barrier_marker));
        CHECK(has_colour(image, capture_column, row, plot_colours::capture_marker));
    }
    // The curve's top is at the barrier: (3 nm, 12 kT).
    const int top_row = static_cast<int>(std::floor(data_top_px(3) + (15.0 - 12.0) / 30.0 * data_height_px));
    CHECK(colour_near(image, barrier_column + 3, top_row, plot_colours::pair_curves[0]));
}

TEST_CASE("drawing the same plots twice gives identical pixels", "[viewer][plots][display]") {
    const ViewerLayout layout = layout_viewer(1280, 800, true);
    std::vector<std::int64_t> sizes;
    std::vector<double> rg;
    for (int i = 1; i <= 3000; ++i) {
        sizes.push_back(i);
        rg.push_back(0.9 * std::pow(i, 1.0 / 1.78));
    }
    const std::array<PlotSpec, 4> specs{
        smoluchowski_clusters_plot(1.2),
        size_distribution_plot({{1, 500}, {2, 120}, {3, 40}, {10, 3}, {40, 1}}),
        gyration_plot(sizes, rg, FractalLine{1.78, 0.05, 1.2, 10, 3000}, ""),
        interaction_plot({bump_curve()}),
    };
    const auto draw_all = [&] {
        auto image = blank_image();
        for (std::size_t i = 0; i < 4; ++i) draw_plot(*image, specs[i], layout.plot_outer[i], layout.plot_data[i], test_font());
        return read_back(*image);
    };
    const sf::Image first = draw_all();
    const sf::Image second = draw_all();
    CHECK(same_pixels(first, second));
}

TEST_CASE("plots with empty or non-finite data draw without failing", "[viewer][plots][display][validation]") {
    const double nan = std::nan(""), inf = HUGE_VAL;
    const ViewerLayout layout = layout_viewer(1280, 800, true);
    auto image = blank_image();
    CHECK_NOTHROW(draw_plot(*image, clusters_plot({}, {}, {}, {}, {}, nan), layout.plot_outer[0], layout.plot_data[0],
                            test_font()));
    CHECK_NOTHROW(draw_plot(*image, clusters_plot({nan, 1, inf, 2}, {0.5, nan, 1, -inf}, {}, {}, {}, inf),
                            layout.plot_outer[0], layout.plot_data[0], test_font()));
    PlotSpec hostile;
    hostile.x = AxisRange{nan, inf, true};
    hostile.y = AxisRange{-1.0, -1.0, true};
    hostile.series.push_back(Series{"", {1.0, 2.0, 3.0}, {1.0}, Series::Style::dashed_line, PlotColour{1, 2, 3}});
    hostile.markers.push_back(VerticalMarker{nan, "x", PlotColour{1, 2, 3}});
    hostile.title = "\xff\xfe broken UTF-8 \xc3";
    CHECK_NOTHROW(draw_plot(*image, hostile, layout.plot_outer[1], layout.plot_data[1], test_font()));
    CHECK_NOTHROW(draw_plot(*image, hostile, PixelRect{0, 0, 0, 0}, PixelRect{0, 0, 0, 0}, test_font()));
    CHECK_NOTHROW(draw_plot(*image, hostile, PixelRect{5, 5, 30, 30}, plot_data_rect(PixelRect{5, 5, 30, 30}), test_font()));
}
