// PlotPanel caches each plot and re-renders only the one whose spec changed.
#include "pixel_support.hpp"
#include "plots/plot_builders.hpp"
#include "plots/plot_drawing.hpp"

#include <catch2/catch.hpp>

#include <cmath>

using namespace brownfloc::viewer;
using namespace brownfloc::viewer::pixel_test;

namespace {

std::array<PlotSpec, 4> example_specs(std::int64_t largest_size) {
    std::vector<double> t, n;
    for (int i = 0; i <= 40; ++i) {
        t.push_back(0.1 * i);
        n.push_back(1.0 / (1.0 + t.back()));  // Smoluchowski (1917) constant kernel: N/N0 = 1/(1 + t/t_half)
    }
    PairCurve curve{"A-A", {0.5, 1.0, 2.0, 4.0, 8.0}, {-20.0, 3.0, 8.0, 2.0, 0.1}, 2.0, 8.0, 1.0};
    return {clusters_plot({0.0, 1.0, 2.0}, {1.0, 0.52, 0.35}, t, n, {}, 2.0),
            size_distribution_plot({{1, 200}, {largest_size, 1}}),
            gyration_plot({1, 10, 100}, {0.8, 3.5, 13.0}, std::nullopt, ""),
            interaction_plot({curve})};
}

}  // namespace

TEST_CASE("the plot panel redraws only the plot whose spec changed", "[viewer][plots][display]") {
    const ViewerLayout layout = layout_viewer(1280, 800, true);
    auto target = blank_image();
    PlotPanel panel;
    CHECK(panel.redraw_count() == 0);
    panel.draw(*target, layout, example_specs(30), test_font());
    CHECK(panel.redraw_count() == 4);
    panel.draw(*target, layout, example_specs(30), test_font());  // equal specs, rebuilt
    CHECK(panel.redraw_count() == 4);
    panel.draw(*target, layout, example_specs(31), test_font());  // only the size distribution differs
    CHECK(panel.redraw_count() == 5);
    panel.draw(*target, layout, example_specs(31), test_font());
    CHECK(panel.redraw_count() == 5);
    panel.draw(*target, layout_viewer(1000, 700, true), example_specs(31), test_font());  // new sizes: all
    CHECK(panel.redraw_count() == 9);
    panel.draw(*target, layout_viewer(1000, 700, false), example_specs(40), test_font());  // hidden: nothing
    CHECK(panel.redraw_count() == 9);
}

TEST_CASE("the plot panel shows the same pixels as drawing each plot directly", "[viewer][plots][display]") {
    const ViewerLayout layout = layout_viewer(1280, 800, true);
    const auto specs = example_specs(30);
    auto direct = blank_image();
    for (std::size_t i = 0; i < 4; ++i) draw_plot(*direct, specs[i], layout.plot_outer[i], layout.plot_data[i], test_font());
    auto cached = blank_image();
    PlotPanel panel;
    panel.draw(*cached, layout, specs, test_font());
    panel.draw(*cached, layout, specs, test_font());  // second time from the cache
    CHECK(same_pixels(read_back(*direct), read_back(*cached)));
}

TEST_CASE("the plot panel moves a plot without re-rendering it", "[viewer][plots][display]") {
    ViewerLayout layout = layout_viewer(1280, 800, true);
    auto target = blank_image();
    PlotPanel panel;
    panel.draw(*target, layout, example_specs(30), test_font());
    for (std::size_t i = 0; i < 4; ++i) {
        layout.plot_outer[i].x_px -= 10;
        layout.plot_data[i].x_px -= 10;
    }
    panel.draw(*target, layout, example_specs(30), test_font());
    CHECK(panel.redraw_count() == 4);
    layout.plot_data[2].width_px -= 1;  // the data rect inside the image changed
    panel.draw(*target, layout, example_specs(30), test_font());
    CHECK(panel.redraw_count() == 5);
}
