// analyse_frame on hand-built clusters, and the run's seed from the resolved scenario text.
#include <catch2/catch.hpp>

#include <cmath>
#include <limits>

#include "analysis/fractal_fit.hpp"
#include "data/frame_analysis.hpp"
#include "data/viewer_input_error.hpp"
#include "data_test_support.hpp"

using namespace brownfloc;
using Catch::Matchers::Contains;
using Catch::Matchers::WithinRel;
using viewer::analyse_frame;
using viewer::FrameAnalysis;
using viewer::run_seed_from_scenario_text;

namespace {

constexpr double a_nm = 50.0;

// 8 particles of radius 50 nm: a doublet {0, 1} at contact along x, a triplet {2, 3, 4} in a
// row, a doublet {5, 6} that spans the box, and the monomer 7.
trajectory::TrajectoryFrame hand_built_frame() {
    trajectory::TrajectoryFrame frame = test::monomer_frame(8, 0);
    const double p[8][3] = {{100, 100, 100}, {200, 100, 100},                   // doublet, centres 2a apart
                            {300, 500, 500}, {400, 500, 500}, {500, 500, 500},  // triplet
                            {10, 800, 800},  {-90, 800, 800},                   // spanning doublet
                            {700, 200, 200}};
    for (std::size_t i = 0; i < 8; ++i)
        for (std::size_t c = 0; c < 3; ++c) frame.positions_nm[3 * i + c] = p[i][c];
    frame.cluster = {0, 0, 2, 2, 2, 5, 5, 7};
    frame.spanning_clusters = {5};
    frame.cluster_count = 4;
    frame.largest_cluster = 3;
    return frame;
}

}  // namespace

TEST_CASE("cluster sizes and the size histogram come from the cluster ids", "[viewer][data][analysis]") {
    const FrameAnalysis a = analyse_frame(test::viewer_header(8, a_nm), hand_built_frame(), 7);
    REQUIRE(a.clusters.size() == 4);
    CHECK(a.clusters[0].id == 0);
    CHECK(a.clusters[0].size == 2);
    CHECK(a.clusters[1].id == 2);
    CHECK(a.clusters[1].size == 3);
    CHECK(a.clusters[2].id == 5);
    CHECK(a.clusters[2].size == 2);
    CHECK(a.clusters[3].id == 7);
    CHECK(a.clusters[3].size == 1);
    using Count = std::pair<std::int64_t, std::int64_t>;
    CHECK(a.size_count == std::vector<Count>{{1, 1}, {2, 2}, {3, 1}});
    CHECK(a.largest_cluster_id == 2);
    CHECK(a.largest_size == 3);
    CHECK_THAT(a.mean_radius_nm, WithinRel(a_nm, 1e-15));
    REQUIRE(a.find(2) != nullptr);
    CHECK(a.find(2)->size == 3);
    CHECK(a.find(3) == nullptr);  // a member, not a cluster id
    CHECK(a.find(100) == nullptr);
}

TEST_CASE("R_g of a doublet at contact is the radius and a spanning cluster has none", "[viewer][data][analysis]") {
    const FrameAnalysis a = analyse_frame(test::viewer_header(8, a_nm), hand_built_frame(), 7);
    // Geometry (from memory): two centres 2a apart lie a from their mean, so R_g = a; three in
    // a row 2a apart: R_g^2 = (4a^2 + 0 + 4a^2)/3. Tolerance: nm -> m -> nm rounding only.
    REQUIRE(a.find(0)->radius_of_gyration_nm);
    CHECK_THAT(*a.find(0)->radius_of_gyration_nm, WithinRel(a_nm, 1e-12));
    CHECK_THAT(*a.find(2)->radius_of_gyration_nm, WithinRel(a_nm * std::sqrt(8.0 / 3.0), 1e-12));
    CHECK(a.find(5)->spans_box);
    CHECK_FALSE(a.find(5)->radius_of_gyration_nm);
    REQUIRE(a.find(7)->radius_of_gyration_nm);
    CHECK(*a.find(7)->radius_of_gyration_nm == 0.0);
    CHECK_FALSE(a.fractal.dimension);  // 0 clusters of >= 10 particles: no fit, and the note says so
    CHECK_THAT(a.fractal.note, Contains("clusters qualify"));
}

TEST_CASE("the largest cluster ties to the smallest id", "[viewer][data][analysis]") {
    trajectory::TrajectoryFrame frame = test::monomer_frame(6, 0);
    frame.cluster = {0, 1, 2, 1, 2, 5};  // {0}, {1, 3}, {2, 4}, {5}
    const FrameAnalysis a = analyse_frame(test::viewer_header(6), frame, 1);
    CHECK(a.largest_cluster_id == 1);
    CHECK(a.largest_size == 2);
}

TEST_CASE("the fractal fit gets each cluster's R_g in metres and the mean radius", "[viewer][data][analysis][fractal]") {
    // 30 clusters of n = 10, 12, ..., 68 particles, half of each at x - r and half at x + r,
    // so R_g = r exactly; r = a sqrt(n) makes N = k0 (R_g/a)^d_f hold with d_f = 2, k0 = 1
    // (constructed, not measured). Tolerance: rounding in the logarithms and the fit.
    std::size_t particles = 0;
    for (int j = 0; j < 30; ++j) particles += static_cast<std::size_t>(10 + 2 * j);
    trajectory::TrajectoryFrame frame = test::monomer_frame(particles, 0);
    std::size_t next = 0;
    for (int j = 0; j < 30; ++j) {
        const std::size_t n = static_cast<std::size_t>(10 + 2 * j);
        const double r = a_nm * std::sqrt(static_cast<double>(n));
        const double x = 5000.0 * j;
        for (std::size_t m = 0; m < n; ++m) {
            frame.cluster[next + m] = static_cast<std::uint32_t>(next);
            frame.positions_nm[3 * (next + m)] = x + (m % 2 == 0 ? -r : r);
            frame.positions_nm[3 * (next + m) + 1] = 0.0;
            frame.positions_nm[3 * (next + m) + 2] = 0.0;
        }
        next += n;
    }
    frame.cluster_count = 30;
    const trajectory::TrajectoryHeader header = test::viewer_header(particles, a_nm);
    const FrameAnalysis a = analyse_frame(header, frame, 7);
    REQUIRE(a.fractal.dimension);
    CHECK_THAT(*a.fractal.dimension, WithinRel(2.0, 1e-9));
    REQUIRE(a.fractal.prefactor);
    CHECK_THAT(*a.fractal.prefactor, WithinRel(1.0, 1e-9));
    CHECK(a.fractal.clusters_used == 30);

    // The same function with the same inputs: equal to the last bit, bootstrap error included.
    std::vector<analysis::ClusterShape> shapes;
    for (const viewer::ClusterSummary& c : a.clusters)
        shapes.push_back({c.size, c.radius_of_gyration_nm.value_or(0.0) * 1e-9, c.spans_box});
    const analysis::FractalFit direct = analysis::fit_fractal_dimension(shapes, a_nm * 1e-9, 7);
    CHECK(a.fractal.dimension == direct.dimension);
    CHECK(a.fractal.dimension_error == direct.dimension_error);
    CHECK(a.fractal.note == direct.note);
}

TEST_CASE("a forged frame gives an empty fit with a reason rather than NaN", "[viewer][data][analysis][validation]") {
    // 30 clusters of 10 particles all on one point: R_g = 0, which the fit refuses.
    trajectory::TrajectoryFrame frame = test::monomer_frame(300, 0);
    for (std::size_t i = 0; i < 300; ++i) {
        frame.cluster[i] = static_cast<std::uint32_t>(i - i % 10);
        for (std::size_t c = 0; c < 3; ++c) frame.positions_nm[3 * i + c] = static_cast<double>(i / 10);
    }
    const FrameAnalysis a = analyse_frame(test::viewer_header(300), frame, 7);
    CHECK_FALSE(a.fractal.dimension);
    CHECK_THAT(a.fractal.note, Contains("no fit:"));

    // Positions near the largest double: R_g overflows.
    trajectory::TrajectoryFrame huge = test::monomer_frame(2, 0);
    huge.cluster = {0, 0};
    huge.positions_nm[0] = 1e300;
    huge.positions_nm[3] = -1e300;
    const FrameAnalysis b = analyse_frame(test::viewer_header(2), huge, 7);
    CHECK_FALSE(b.find(0)->radius_of_gyration_nm);
    CHECK_THAT(b.fractal.note, Contains("cluster 0 is not finite"));
}

TEST_CASE("a frame that does not fit its header is refused naming what is wrong", "[viewer][data][analysis][validation]") {
    const trajectory::TrajectoryHeader header = test::viewer_header(4);
    trajectory::TrajectoryFrame short_frame = test::monomer_frame(3, 0);
    CHECK_THROWS_AS(analyse_frame(header, short_frame, 0), viewer::ViewerInputError);
    CHECK_THROWS_WITH(analyse_frame(header, short_frame, 0), Contains("9 position values") && Contains("need 12"));
    trajectory::TrajectoryFrame bad_id = test::monomer_frame(4, 0);
    bad_id.cluster[2] = 4;
    CHECK_THROWS_WITH(analyse_frame(header, bad_id, 0), Contains("cluster[2] = 4: must be < N = 4"));
    trajectory::TrajectoryFrame not_finite = test::monomer_frame(4, 0);
    not_finite.positions_nm[7] = std::numeric_limits<double>::quiet_NaN();
    CHECK_THROWS_WITH(analyse_frame(header, not_finite, 0), Contains("particle 2 has a position that is not finite"));
}

TEST_CASE("the run's seed is the seed line of the [run] table", "[viewer][data][seed]") {
    CHECK(run_seed_from_scenario_text("[particle]\nradius_nm = 50\n\n[run]\nparticles = 10\nseed = 42\n") == 42);
    CHECK(run_seed_from_scenario_text("[run]\r\nseed = 9  # from the command line\r\n") == 9);
    CHECK(run_seed_from_scenario_text("[ run ]\nseed=1_000\n") == 1000);
    CHECK(run_seed_from_scenario_text("[run]\nseed = 9223372036854775807\n") == 9223372036854775807ull);
    // The run writes its uint64 seed as an int64 (sim/src/resolved_scenario.cpp): a seed of
    // 2^63 or more reads as negative there, and is cast back here.
    CHECK(run_seed_from_scenario_text("[run]\nseed = -1\n") == 18446744073709551615ull);
}

TEST_CASE("a scenario text without a [run] seed gives seed 0", "[viewer][data][seed]") {
    CHECK(run_seed_from_scenario_text("") == 0);
    CHECK(run_seed_from_scenario_text("[run]\nparticles = 10\n") == 0);
    CHECK(run_seed_from_scenario_text("[output]\nseed = 5\n[run]\nparticles = 3\n") == 0);
    CHECK(run_seed_from_scenario_text("# seed = 5\n[run]\n# seed = 6\n") == 0);
    CHECK(run_seed_from_scenario_text("[[species]]\nseed = 5\n") == 0);
}

TEST_CASE("a [run] seed that is not a whole number is refused naming its line", "[viewer][data][seed][validation]") {
    CHECK_THROWS_AS(run_seed_from_scenario_text("[run]\nparticles = 3\nseed = \"x\"\n"), viewer::ViewerInputError);
    CHECK_THROWS_WITH(run_seed_from_scenario_text("[run]\nparticles = 3\nseed = \"x\"\n"),
                      Contains("line 3: [run] seed = \"\\\"x\\\"\": expected a whole number"));
    CHECK_THROWS_WITH(run_seed_from_scenario_text("[run]\nseed = 1.5\n"), Contains("line 2"));
    CHECK_THROWS_WITH(run_seed_from_scenario_text("[run]\nseed = 99999999999999999999\n"), Contains("line 2"));
    CHECK_THROWS_WITH(run_seed_from_scenario_text("[run]\nseed =\n"), Contains("line 2"));
}
