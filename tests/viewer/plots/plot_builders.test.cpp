#include "plots/plot_builders.hpp"
#include "plots/plot_error.hpp"

#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>
#include <limits>

using namespace brownfloc::viewer;

namespace {

const double nan_value = std::numeric_limits<double>::quiet_NaN();
const double inf_value = std::numeric_limits<double>::infinity();

bool same_colour(const PlotColour& a, const PlotColour& b) { return a.r == b.r && a.g == b.g && a.b == b.b; }

}  // namespace

TEST_CASE("the clusters plot spans 0 to the largest finite time and 0 to 1", "[viewer][plots][builders]") {
    const PlotSpec spec = clusters_plot({0.0, 1.0, nan_value, 2.5}, {1.0, 0.6, 0.5, 0.4}, {0.0, 2.0, 4.0, inf_value},
                                        {1.0, 1.0 / 3.0, 0.2, 0.0}, {}, 1.5);
    CHECK(spec.title == "Clusters / N0");
    CHECK(spec.x.lo == 0.0);
    CHECK(spec.x.hi == 4.0);  // inf_value and NaN times ignored
    CHECK_FALSE(spec.x.log10);
    CHECK(spec.y.lo == 0.0);
    CHECK(spec.y.hi == 1.0);
    REQUIRE(spec.current_x.has_value());
    CHECK(*spec.current_x == 1.5);
}

TEST_CASE("the clusters plot draws plain Smoluchowski solid the transient curve dashed and the measurements on top",
          "[viewer][plots][builders]") {
    const PlotSpec spec = clusters_plot({0.0, 1.0}, {1.0, 0.5}, {0.0, 1.0}, {1.0, 0.5}, {1.0, 0.45}, 0.5);
    REQUIRE(spec.series.size() == 3);
    CHECK(spec.series[0].style == Series::Style::line);
    CHECK(same_colour(spec.series[0].colour, plot_colours::smoluchowski));
    CHECK(spec.series[1].style == Series::Style::dashed_line);
    CHECK(same_colour(spec.series[1].colour, plot_colours::transient_corrected));
    CHECK(same_colour(spec.series[2].colour, plot_colours::measured));
}

TEST_CASE("the clusters plot of empty or unusable inputs spans 0 to 1 and has no current marker",
          "[viewer][plots][builders][validation]") {
    const PlotSpec empty = clusters_plot({}, {}, {}, {}, {}, nan_value);
    CHECK(empty.x.hi == 1.0);
    CHECK(empty.series.empty());
    CHECK_FALSE(empty.current_x.has_value());
    const PlotSpec negative = clusters_plot({-3.0, -1.0, nan_value}, {1.0, 1.0, 1.0}, {}, {}, {}, inf_value);
    CHECK(negative.x.hi == 1.0);
    CHECK_FALSE(negative.current_x.has_value());
}

TEST_CASE("the clusters plot refuses arrays of different lengths naming both lengths",
          "[viewer][plots][builders][validation]") {
    CHECK_THROWS_AS(clusters_plot({0.0, 1.0}, {1.0}, {}, {}, {}, 0.0), PlotError);
    CHECK_THROWS_WITH(clusters_plot({0.0, 1.0}, {1.0}, {}, {}, {}, 0.0),
                      Catch::Contains("2 measured times but 1 measured cluster fractions"));
    CHECK_THROWS_WITH(clusters_plot({}, {}, {0.0}, {1.0, 0.5}, {}, 0.0), Catch::Contains("clusters plot"));
    CHECK_THROWS_WITH(clusters_plot({}, {}, {0.0}, {1.0}, {1.0, 0.5}, 0.0),
                      Catch::Contains("transient-corrected values"));
}

TEST_CASE("the size distribution spans 0.8 to 1.25 times the largest size and count on log axes",
          "[viewer][plots][builders]") {
    const PlotSpec spec = size_distribution_plot({{1, 400}, {2, 90}, {0, 7}, {50, 1}, {3, -2}, {-4, 10}});
    CHECK(spec.x.log10);
    CHECK(spec.y.log10);
    CHECK(spec.x.lo == 0.8);
    CHECK(spec.x.hi == 62.5);  // 1.25 * 50
    CHECK(spec.y.lo == 0.8);
    CHECK(spec.y.hi == 500.0);  // 1.25 * 400
    REQUIRE(spec.series.size() == 1);
    CHECK(spec.series[0].style == Series::Style::points);
    CHECK(spec.series[0].x == std::vector<double>{1, 2, 50});  // sizes or counts < 1 dropped
    CHECK(spec.series[0].y == std::vector<double>{400, 90, 1});
}

TEST_CASE("an empty size distribution has the default ranges and no series", "[viewer][plots][builders]") {
    const PlotSpec spec = size_distribution_plot({});
    CHECK(spec.x.hi == 1.25);
    CHECK(spec.y.hi == 1.25);
    CHECK(spec.series.empty());
}

TEST_CASE("strided subsets keep everything when small and are even and deterministic when large",
          "[viewer][plots][builders]") {
    CHECK(strided_subset(3, 2000) == std::vector<std::size_t>{0, 1, 2});
    CHECK(strided_subset(10, 0).empty());
    CHECK(strided_subset(10, 4) == std::vector<std::size_t>{0, 2, 5, 7});  // floor(i * 10 / 4)
    // A count whose i * count would overflow 64 bits: 2^62 / 2000 is not whole, so the last
    // index floor(1999 * 2^62 / 2000) = 2^62 - ceil(2^62 / 2000).
    const std::size_t count = std::size_t{1} << 62;
    const auto big = strided_subset(count, 2000);
    REQUIRE(big.size() == 2000);
    CHECK(big.front() == 0);
    CHECK(big.back() == count - count / 2000 - 1);
    CHECK(std::is_sorted(big.begin(), big.end()));
    CHECK(std::adjacent_find(big.begin(), big.end()) == big.end());
}

TEST_CASE("the gyration plot draws at most 2000 evenly strided points", "[viewer][plots][builders]") {
    std::vector<std::int64_t> sizes;
    std::vector<double> rg;
    for (int i = 0; i < 5000; ++i) {
        sizes.push_back(1 + i);
        rg.push_back(std::pow(1.0 + i, 1.0 / 1.8));
    }
    const PlotSpec spec = gyration_plot(sizes, rg, std::nullopt, "");
    REQUIRE(spec.series.size() == 1);
    const Series& points = spec.series[0];
    REQUIRE(points.x.size() == max_gyration_points);
    REQUIRE(max_gyration_points == 2000);
    for (std::size_t i = 0; i < points.x.size(); ++i) CHECK(points.x[i] == static_cast<double>(1 + i * 5000 / 2000));
    CHECK(same_plot(spec, gyration_plot(sizes, rg, std::nullopt, "")));  // deterministic
    CHECK(spec.x.hi == 1.25 * 5000);  // the range uses every point, not only those drawn
}

TEST_CASE("the gyration plot drops unusable points and takes its y range from the rest",
          "[viewer][plots][builders][validation]") {
    const PlotSpec spec = gyration_plot({1, 2, 0, 8, 16, 32}, {0.5, nan_value, 3.0, 4.0, -1.0, inf_value}, std::nullopt, "");
    REQUIRE(spec.series.size() == 1);
    CHECK(spec.series[0].x == std::vector<double>{1, 8});
    CHECK(spec.x.hi == 10.0);  // 1.25 * 8
    CHECK(spec.y.lo == 0.4);   // 0.8 * 0.5
    CHECK(spec.y.hi == 5.0);   // 1.25 * 4
}

TEST_CASE("an empty gyration plot spans 1 to 10 in R_g over a", "[viewer][plots][builders]") {
    const PlotSpec spec = gyration_plot({}, {}, std::nullopt, "");
    CHECK(spec.y.lo == 1.0);
    CHECK(spec.y.hi == 10.0);
    CHECK(spec.x.hi == 1.25);
    CHECK(spec.series.empty());
    CHECK(spec.notes.empty());
}

TEST_CASE("the gyration fit line follows N = k0 (R_g/a)^d_f over the fitted sizes", "[viewer][plots][builders]") {
    // Fractal scaling N = k0 (R_g/a)^d_f (Forrest & Witten 1979, J. Phys. A 12, L109), solved
    // for R_g/a. d_f = 1.78 is the usual cluster-cluster value (Meakin 1983; from memory), here
    // only a number to draw.
    const FractalLine fit{1.78, 0.05, 1.3, 4, 400};
    const PlotSpec spec = gyration_plot({4, 400}, {2.0, 30.0}, fit, "");
    REQUIRE(spec.series.size() == 2);
    const Series& line = spec.series[1];
    CHECK(same_colour(line.colour, plot_colours::fit_line));
    CHECK(line.x == std::vector<double>{4, 400});
    // Tolerance: pow rounding only.
    CHECK_THAT(line.y[0], Catch::Matchers::WithinRel(std::pow(4.0 / 1.3, 1.0 / 1.78), 1e-12));
    CHECK_THAT(line.y[1], Catch::Matchers::WithinRel(std::pow(400.0 / 1.3, 1.0 / 1.78), 1e-12));
    REQUIRE(spec.notes.size() == 1);
    CHECK(spec.notes[0] == "d_f = 1.78 +- 0.05");
}

TEST_CASE("the gyration note is the caller's note when given and n/a for an unusable fit",
          "[viewer][plots][builders][validation]") {
    CHECK(gyration_plot({}, {}, FractalLine{1.78, 0.05, 1.3, 1, 9}, "fit over 12 frames").notes ==
          std::vector<std::string>{"fit over 12 frames"});
    const PlotSpec broken = gyration_plot({}, {}, FractalLine{nan_value, nan_value, 1.3, 1, 9}, "");
    CHECK(broken.series.empty());  // no line for an unusable fit
    CHECK(broken.notes == std::vector<std::string>{"d_f = n/a"});
    CHECK(gyration_plot({}, {}, FractalLine{2.0, 0.1, -1.0, 1, 9}, "").series.empty());
    CHECK(gyration_plot({}, {}, FractalLine{2.0, 0.1, 1.0, 9, 1}, "").series.empty());
    CHECK(fractal_dimension_note(2.5, inf_value) == "d_f = 2.50");
    CHECK(fractal_dimension_note(-0.001, 0.0) == "d_f = 0.00 +- 0.00");
}

TEST_CASE("the gyration plot refuses arrays of different lengths", "[viewer][plots][builders][validation]") {
    CHECK_THROWS_WITH(gyration_plot({1, 2}, {1.0}, std::nullopt, ""),
                      Catch::Contains("gyration plot: 2 cluster sizes but 1 R_g / a values"));
}

TEST_CASE("the interaction plot spans the gaps and a symmetric energy range with barrier and capture markers",
          "[viewer][plots][builders]") {
    PairCurve pair{"A-A", {0.5, 1.0, 3.0, 20.0}, {-40.0, 4.0, 12.0, 0.1}, 3.0, 12.0, 1.0};
    const PlotSpec spec = interaction_plot({pair});
    CHECK(spec.x.lo == 0.5);
    CHECK(spec.x.hi == 20.0);
    CHECK(spec.y.lo == -15.0);  // y_top = max(5, 1.25 * 12, 1.25 * 12)
    CHECK(spec.y.hi == 15.0);
    REQUIRE(spec.markers.size() == 2);
    CHECK(spec.markers[0].x == 3.0);
    CHECK(spec.markers[0].label == "barrier 12.0 kT");
    CHECK(same_colour(spec.markers[0].colour, plot_colours::barrier_marker));
    CHECK(spec.markers[1].x == 1.0);
    CHECK(spec.markers[1].label == "capture");
    REQUIRE(spec.series.size() == 1);
    CHECK(spec.series[0].label == "A-A");
}

TEST_CASE("the interaction plot ignores non-finite values for its ranges and keeps y_top at least 5",
          "[viewer][plots][builders][validation]") {
    PairCurve flat{"A-B", {nan_value, 2.0, 8.0, inf_value}, {inf_value, 1.0, 0.5, nan_value}, std::nullopt, std::nullopt, nan_value};
    PairCurve repulsive{"B-B", {1.0, 4.0}, {6.0, 2.0}, 1.0, nan_value, 1.0};
    const PlotSpec spec = interaction_plot({flat, repulsive});
    CHECK(spec.x.lo == 1.0);
    CHECK(spec.x.hi == 8.0);
    CHECK(spec.y.hi == 7.5);  // 1.25 * 6; the NaN barrier gives no marker
    REQUIRE(spec.markers.size() == 1);
    CHECK(spec.markers[0].label == "capture");
    const PlotSpec quiet = interaction_plot({PairCurve{"C-C", {1.0, 2.0}, {0.1, 0.0}, std::nullopt, std::nullopt, 1.0}});
    CHECK(quiet.y.hi == 5.0);
}

TEST_CASE("an interaction plot without gaps has default ranges and equal gaps are widened",
          "[viewer][plots][builders][validation]") {
    const PlotSpec none = interaction_plot({});
    CHECK(none.x.lo == 0.0);
    CHECK(none.x.hi == 1.0);
    CHECK(none.y.hi == 5.0);
    const PlotSpec single = interaction_plot({PairCurve{"A-A", {2.0}, {1.0}, std::nullopt, std::nullopt, 2.0}});
    CHECK(single.x.lo == 1.5);
    CHECK(single.x.hi == 2.5);
}

TEST_CASE("the interaction plot draws one capture marker per distinct capture gap", "[viewer][plots][builders]") {
    const PairCurve a{"A-A", {1.0, 2.0}, {1.0, 0.0}, std::nullopt, std::nullopt, 1.0};
    const PairCurve b{"A-B", {1.0, 2.0}, {1.0, 0.0}, std::nullopt, std::nullopt, 1.0};
    CHECK(interaction_plot({a, b}).markers.size() == 1);
}

TEST_CASE("the interaction plot refuses gaps and energies of different lengths", "[viewer][plots][builders][validation]") {
    CHECK_THROWS_WITH(interaction_plot({PairCurve{"A-A", {1.0, 2.0}, {1.0}, std::nullopt, std::nullopt, 1.0}}),
                      Catch::Contains("interaction plot: 2 gaps but 1 energies"));
}

TEST_CASE("the interaction plot keeps y finite for energies near the largest double",
          "[viewer][plots][builders][validation]") {
    const double big = std::numeric_limits<double>::max();
    const PlotSpec spec = interaction_plot({PairCurve{"A-A", {1.0, 2.0}, {big, 0.0}, 1.0, big, 1.0}});
    CHECK(std::isfinite(spec.y.hi));
    CHECK(std::isfinite(spec.y.lo));
}
