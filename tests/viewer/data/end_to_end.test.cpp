// The viewer's fractal fit of a run's last frame equals the run's own (summary.json): the same
// function on the same inputs, read back from a float64 trajectory.
#include <sys/wait.h>

#include <catch2/catch.hpp>

#include <cstdlib>
#include <string>

#include "data/frame_analysis.hpp"
#include "data/live_trajectory.hpp"
#include "data_test_support.hpp"
#include "run_files/run_summary_view.hpp"

using namespace brownfloc;
using Catch::Matchers::WithinRel;

namespace {

// 2000 sticky spheres without forces (hamaker_J = 0, no charge), volume fraction 0.02, for 2.5
// fast half-lives, seed 11. Clusters grow faster than the constant-kernel Smoluchowski curve
// (about 200 clusters at the end rather than 570), and longer runs or denser suspensions gel
// into one spanning cluster (measured: 15 half-lives at 0.02 and 2 at 0.1 both percolate). At
// 2.5 half-lives the fit's rules (analysis/fractal_fit.hpp: >= 30 non-spanning clusters of
// >= 10 particles, sizes over a factor 5) hold with room: 61 clusters of sizes 10-96.
// Positions stored as float64, so the frame holds exactly the nm values the engine wrote. About 5 s in Release with 2 threads on the 2-core build machine (g++ 12, -O3).
constexpr const char* scenario_toml = R"(# The viewer's fractal fit against the run's (tests/viewer/data/end_to_end.test.cpp).
[particle]
radius_nm = 100
hamaker_J = 0
surface_potential_mV = 0

[suspension]
volume_fraction = 0.02

[electrolyte]
salt = "NaCl"
concentration_mM = 10

[run]
particles = 2000
seed = 11
end_half_lives = 2.5

[output]
trajectory_precision = "float64"
)";

std::string quoted_for_shell(const std::string& text) {
    std::string quoted = "'";
    for (const char c : text) {
        if (c == '\'')
            quoted += "'\\''";
        else
            quoted += c;
    }
    quoted += '\'';
    return quoted;
}

}  // namespace

TEST_CASE("the fractal fit of a run's last frame equals summary.json's", "[viewer][data][fractal][slow]") {
    const test::TempDir dir{"viewer-end-to-end"};
    test::write_text(dir / "sticky.toml", scenario_toml);
    std::string command = quoted_for_shell(BROWNFLOC_EXE);
    command += " run ";
    command += quoted_for_shell((dir / "sticky.toml").string());
    command += " -o ";
    command += quoted_for_shell((dir / "run").string());
    command += " --quiet --threads 2";
    const int status = std::system(command.c_str());
    REQUIRE(WIFEXITED(status));
    REQUIRE(WEXITSTATUS(status) == 0);

    const viewer::RunLocation where = viewer::locate_run(dir / "run");
    REQUIRE_FALSE(where.summary_json.empty());
    const run_files::RunSummaryView summary = run_files::read_run_summary(where.summary_json);
    REQUIRE(summary.status == run_files::RunStatus::complete);
    INFO("summary.json fractal_dimension_note: " << summary.fractal_dimension_note.value_or("(none)"));
    REQUIRE(summary.fractal_dimension);

    const viewer::LiveTrajectory live{where};
    REQUIRE(live.frame_count() > 0);
    CHECK(live.tail_state() == viewer::TailState::complete);
    CHECK(live.warnings().empty());
    const trajectory::TrajectoryFrame last = live.read_frame(live.frame_count() - 1);
    const std::uint64_t seed = viewer::run_seed_from_scenario_text(live.header().scenario_toml);
    CHECK(seed == 11);
    CHECK(summary.seed == seed);
    const viewer::FrameAnalysis analysis = viewer::analyse_frame(live.header(), last, seed);
    INFO("viewer fit note: " << analysis.fractal.note);
    REQUIRE(analysis.fractal.dimension);
    // Same code, same inputs: only the nm <-> m conversions of the stored positions (a relative
    // 1e-16 in R_g) separate them. 1e-9 leaves room for that and nothing else.
    CHECK_THAT(*analysis.fractal.dimension, WithinRel(*summary.fractal_dimension, 1e-9));
    REQUIRE(summary.fractal_dimension_error);
    REQUIRE(analysis.fractal.dimension_error);
    CHECK_THAT(*analysis.fractal.dimension_error, WithinRel(*summary.fractal_dimension_error, 1e-9));
    REQUIRE(summary.fractal_prefactor);
    REQUIRE(analysis.fractal.prefactor);
    CHECK_THAT(*analysis.fractal.prefactor, WithinRel(*summary.fractal_prefactor, 1e-9));
    CHECK(analysis.largest_size == static_cast<std::int64_t>(last.largest_cluster));
    CHECK(analysis.clusters.size() == last.cluster_count);
}
