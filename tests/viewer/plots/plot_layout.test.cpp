#include "plots/plot_error.hpp"
#include "plots/plot_layout.hpp"

#include <catch2/catch.hpp>

#include <cmath>
#include <limits>

using namespace brownfloc::viewer;

namespace {

bool same(const PixelRect& r, int x, int y, int w, int h) {
    return r.x_px == x && r.y_px == y && r.width_px == w && r.height_px == h;
}

}  // namespace

TEST_CASE("with plots shown a 1280 by 800 image gives an 800 px scene and four 480 by 200 plots",
          "[viewer][plots][layout]") {
    // viewer/README.md "Layout": P = round(0.375 * 1280) = 480; margins 58/10/20/30.
    const ViewerLayout layout = layout_viewer(1280, 800, true);
    CHECK(layout.plots_shown);
    CHECK(same(layout.scene, 0, 0, 800, 800));
    for (int i = 0; i < 4; ++i) {
        INFO("plot " << i);
        CHECK(same(layout.plot_outer[static_cast<std::size_t>(i)], 800, 200 * i, 480, 200));
        CHECK(same(layout.plot_data[static_cast<std::size_t>(i)], 858, 200 * i + 20, 412, 150));
    }
}

TEST_CASE("with plots off the scene fills the image and the plot rects are empty", "[viewer][plots][layout]") {
    const ViewerLayout layout = layout_viewer(1280, 800, false);
    CHECK_FALSE(layout.plots_shown);
    CHECK(same(layout.scene, 0, 0, 1280, 800));
    for (const PixelRect& rect : layout.plot_outer) CHECK(same(rect, 0, 0, 0, 0));
    for (const PixelRect& rect : layout.plot_data) CHECK(same(rect, 0, 0, 0, 0));
}

TEST_CASE("the plot column width rounds half away from zero and odd heights leave rows at the bottom",
          "[viewer][plots][layout]") {
    // 0.375 * 1001 = 375.375 -> 375; 803 / 4 = 200 rows each, 3 rows left.
    const ViewerLayout odd = layout_viewer(1001, 803, true);
    CHECK(same(odd.scene, 0, 0, 626, 803));
    CHECK(same(odd.plot_outer[3], 626, 600, 375, 200));
    // 0.375 * 4 = 1.5 -> 2.
    CHECK(layout_viewer(4, 4, true).scene.width_px == 2);
}

TEST_CASE("a plot too small for its margins gets an empty data rect", "[viewer][plots][layout]") {
    const ViewerLayout tiny = layout_viewer(40, 40, true);
    for (const PixelRect& data : tiny.plot_data) {
        CHECK(data.width_px == 0);
        CHECK(data.height_px == 0);
    }
}

TEST_CASE("image sizes that are not positive are refused with the value in the message",
          "[viewer][plots][layout][validation]") {
    CHECK_THROWS_AS(layout_viewer(0, 800, true), PlotError);
    CHECK_THROWS_WITH(layout_viewer(0, 800, true), Catch::Contains("image width = 0 px"));
    CHECK_THROWS_WITH(layout_viewer(1280, -5, false), Catch::Contains("image height = -5 px"));
    CHECK_THROWS_WITH(layout_viewer(70000, 800, true), Catch::Contains("must be in [1, 65535]"));
}

TEST_CASE("a linear axis map puts lo at the left and bottom edges and hi at the right and top edges",
          "[viewer][plots][layout]") {
    const AxisMap map{AxisRange{0.0, 4.0, false}, AxisRange{0.0, 1.0, false}, PixelRect{858, 20, 412, 150}};
    CHECK(map.x_px(0.0) == 858.0);
    CHECK(map.x_px(4.0) == 1270.0);
    CHECK(map.x_px(1.0) == 961.0);
    CHECK(map.y_px(0.0) == 170.0);
    CHECK(map.y_px(1.0) == 20.0);
    CHECK(map.y_px(0.5) == 95.0);
    CHECK(map.x_px(-4.0) == 446.0);  // outside the range: outside the rect
}

TEST_CASE("a log axis map puts the geometric middle at the middle of the rect", "[viewer][plots][layout]") {
    const AxisMap map{AxisRange{1.0, 100.0, true}, AxisRange{0.1, 1000.0, true}, PixelRect{0, 0, 200, 400}};
    // Tolerance: log10 rounding only.
    CHECK_THAT(map.x_px(10.0), Catch::Matchers::WithinAbs(100.0, 1e-9));
    CHECK_THAT(map.y_px(10.0), Catch::Matchers::WithinAbs(200.0, 1e-9));
    CHECK(std::isnan(map.x_px(0.0)));
    CHECK(std::isnan(map.x_px(-3.0)));
    CHECK(std::isnan(map.y_px(0.0)));
}

TEST_CASE("an axis map gives NaN for non-finite values and unusable ranges", "[viewer][plots][layout][validation]") {
    const double nan = std::numeric_limits<double>::quiet_NaN(), inf = std::numeric_limits<double>::infinity();
    const AxisMap map{AxisRange{0.0, 1.0, false}, AxisRange{0.0, 1.0, false}, PixelRect{0, 0, 100, 100}};
    CHECK(std::isnan(map.x_px(nan)));
    CHECK(std::isnan(map.x_px(inf)));
    CHECK(std::isnan(map.y_px(-inf)));
    const AxisMap broken{AxisRange{nan, 1.0, false}, AxisRange{0.0, inf, false}, PixelRect{0, 0, 100, 100}};
    CHECK(std::isnan(broken.x_px(0.5)));
    CHECK(std::isnan(broken.y_px(0.5)));
    const AxisMap bad_log{AxisRange{0.0, 10.0, true}, AxisRange{-1.0, 10.0, true}, PixelRect{0, 0, 100, 100}};
    CHECK(std::isnan(bad_log.x_px(1.0)));
    CHECK(std::isnan(bad_log.y_px(1.0)));
}

TEST_CASE("an axis map with lo equal to hi maps to the middle of the rect", "[viewer][plots][layout]") {
    const AxisMap map{AxisRange{2.0, 2.0, false}, AxisRange{5.0, 5.0, true}, PixelRect{10, 20, 100, 50}};
    CHECK(map.x_px(2.0) == 60.0);
    CHECK(map.x_px(7.0) == 60.0);
    CHECK(map.y_px(5.0) == 45.0);
}

TEST_CASE("an axis map over the whole double range stays finite", "[viewer][plots][layout][validation]") {
    const double big = std::numeric_limits<double>::max();
    const AxisMap map{AxisRange{-big, big, false}, AxisRange{-big, big, false}, PixelRect{0, 0, 100, 100}};
    CHECK(map.x_px(0.0) == 50.0);
    CHECK(map.x_px(big) == 100.0);
    CHECK(map.y_px(-big) == 100.0);
}
