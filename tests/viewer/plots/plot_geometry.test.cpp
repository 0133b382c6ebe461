#include "plots/plot_spec.hpp"
#include "plots/polyline_geometry.hpp"

#include <catch2/catch.hpp>

#include <cmath>
#include <limits>

using namespace brownfloc::viewer;

TEST_CASE("a segment inside the rect is kept whole", "[viewer][plots][geometry]") {
    const auto clipped = clip_segment({10, 10}, {20, 30}, 0, 0, 100, 100);
    REQUIRE(clipped);
    CHECK(clipped->from.x_px == 10.0);
    CHECK(clipped->to.y_px == 30.0);
}

TEST_CASE("a segment crossing the rect is cut at its edges", "[viewer][plots][geometry]") {
    const auto clipped = clip_segment({-50, 50}, {150, 50}, 0, 0, 100, 100);
    REQUIRE(clipped);
    CHECK(clipped->from.x_px == 0.0);
    CHECK(clipped->to.x_px == 100.0);
    const auto diagonal = clip_segment({-10, -10}, {10, 10}, 0, 0, 100, 100);
    REQUIRE(diagonal);
    CHECK(diagonal->from.x_px == 0.0);
    CHECK(diagonal->from.y_px == 0.0);
}

TEST_CASE("segments outside the rect or with non-finite ends give nothing", "[viewer][plots][geometry][validation]") {
    const double inf = std::numeric_limits<double>::infinity(), nan = std::numeric_limits<double>::quiet_NaN();
    CHECK_FALSE(clip_segment({-10, 200}, {-5, 300}, 0, 0, 100, 100));
    CHECK_FALSE(clip_segment({-10, 50}, {-10, 60}, 0, 0, 100, 100));  // parallel to an edge, outside
    CHECK_FALSE(clip_segment({nan, 50}, {10, 60}, 0, 0, 100, 100));
    CHECK_FALSE(clip_segment({-inf, 50}, {10, 60}, 0, 0, 100, 100));
    CHECK_FALSE(clip_segment({-1e308, 50}, {1.7e308, 60}, 0, 0, 100, 100));  // extent overflows
    const auto far = clip_segment({-1e300, 50}, {50, 50}, 0, 0, 100, 100);
    REQUIRE(far);
    CHECK(far->from.x_px == 0.0);
    CHECK(far->to.x_px == 50.0);  // the visible part survives the far end's rounding
}

TEST_CASE("dashes repeat the on and off lengths and carry the phase to the next segment",
          "[viewer][plots][geometry]") {
    double phase = 0.0;
    const auto first = dash_segment({0, 0}, {13, 0}, DashPattern{6, 4}, phase);
    REQUIRE(first.size() == 2);
    CHECK(first[0].from.x_px == 0.0);
    CHECK(first[0].to.x_px == 6.0);
    CHECK(first[1].from.x_px == 10.0);
    CHECK(first[1].to.x_px == 13.0);
    CHECK(phase == 3.0);
    const auto second = dash_segment({13, 0}, {23, 0}, DashPattern{6, 4}, phase);
    REQUIRE(second.size() == 2);
    CHECK(second[0].to.x_px == 16.0);  // the dash begun at 10 ends at 16
    CHECK(second[1].from.x_px == 20.0);
}

TEST_CASE("an unusable dash pattern draws the segment solid", "[viewer][plots][geometry][validation]") {
    double phase = 0.0;
    CHECK(dash_segment({0, 0}, {10, 0}, DashPattern{0, 4}, phase).size() == 1);
    CHECK(dash_segment({0, 0}, {10, 0}, DashPattern{std::nan(""), 4}, phase).size() == 1);
    CHECK(dash_segment({0, 0}, {0, 0}, DashPattern{6, 4}, phase).empty());
}

TEST_CASE("same_plot treats equal NaNs as equal and any changed value as a change", "[viewer][plots][spec]") {
    PlotSpec a;
    a.series.push_back(Series{"s", {0.0, std::nan("")}, {1.0, 2.0}, Series::Style::line, PlotColour{1, 2, 3}});
    PlotSpec b = a;
    CHECK(same_plot(a, b));
    b.series[0].y[1] = 2.5;
    CHECK_FALSE(same_plot(a, b));
    b = a;
    b.current_x = 1.0;
    CHECK_FALSE(same_plot(a, b));
    b = a;
    b.series[0].colour.g = 9;
    CHECK_FALSE(same_plot(a, b));
    b = a;
    b.notes.push_back("note");
    CHECK_FALSE(same_plot(a, b));
}
