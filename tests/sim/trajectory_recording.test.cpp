// What a run writes to its trajectory: the snapshot schedule, the header and the frames.
#include <catch2/catch.hpp>

#include <cmath>
#include <cstdio>
#include <string>

#include "sim/engine.hpp"
#include "sim/engine_setup.hpp"
#include "sim/scenario.hpp"
#include "sim/trajectory_recording.hpp"

using namespace brownfloc::sim;

namespace {

const std::string attracting = R"([particle]
radius_nm = 50
hamaker_J = 1e-20
surface_potential_mV = -15
[suspension]
volume_fraction = 0.02
[electrolyte]
salt = "NaCl"
concentration_mM = 50
[run]
particles = 50
steps = 1000
)";

}  // namespace

TEST_CASE("snapshots fall on the first step boundary at or after each requested time", "[sim]") {
    Scenario s = parse_scenario(attracting, "<test>", {"output.snapshots=4"});
    const RunPlan plan = plan_run(s, 1);
    REQUIRE(plan.total_steps == 1000);
    // 0, 1/3, 2/3 and 1 of the end time: steps 0, ceil(333.33) = 334, ceil(666.67) = 667, 1000.
    CHECK(snapshot_steps(s, plan) == std::vector<std::int64_t>{0, 334, 667, 1000});

    const double dt = plan.model->time_step.time_step_s;
    char interval[64];
    std::snprintf(interval, sizeof interval, "output.snapshot_interval_s=%.17g", 250.5 * dt);
    s = parse_scenario(attracting, "<test>", {interval});
    // 0, 250.5 dt, 501 dt, 751.5 dt, then the end.
    CHECK(snapshot_steps(s, plan) == std::vector<std::int64_t>{0, 251, 501, 752, 1000});

    s = parse_scenario(attracting, "<test>");
    CHECK(snapshot_steps(s, plan).size() == std::size_t(default_snapshots));
}

TEST_CASE("the trajectory header describes the run and its interaction curve", "[sim]") {
    const Scenario s = parse_scenario(attracting, "<test>");
    const RunPlan plan = plan_run(s, 1);
    const auto h = trajectory_header(s, plan, "resolved text");
    CHECK(h.radius_nm.size() == 50);
    CHECK(h.species.size() == 50);
    CHECK(h.box_length_nm == Approx(plan.particles.box_length_m * 1e9));
    CHECK(h.scenario_toml == "resolved text");
    REQUIRE(h.pairs.size() == 1);
    CHECK(h.pairs[0].gap_nm.size() == std::size_t(curve_samples));
    CHECK(h.pairs[0].gap_nm.front() == Approx(0.2));
    // Debye length of 50 mM NaCl at 25 degC: 0.304 / sqrt(0.05) nm = 1.36 nm (Israelachvili
    // 2011, eq. 14.37, from memory).
    CHECK(h.debye_length_nm == Approx(1.36).epsilon(0.01));
    // Energy at the closest gap is the curve's own U(0.2 nm): attractive van der Waals wins.
    CHECK(h.pairs[0].energy_kT.front() < 0);
}

TEST_CASE("a frame stores every cluster whole with its smallest member id", "[sim]") {
    const Scenario s = parse_scenario(attracting, "<test>", {"suspension.volume_fraction=0.2"});
    const RunPlan plan = plan_run(s, 2);
    Engine engine(plan.model, plan.particles);
    while (engine.bodies().size() == 50 && engine.steps_taken() < 20000) engine.step();
    REQUIRE(engine.bodies().size() < 50);
    const auto f = trajectory_frame(engine);
    CHECK(f.cluster_count == engine.bodies().size());
    for (std::uint32_t i = 0; i < 50; ++i) {
        const std::uint32_t b = f.cluster[i];
        CHECK(b <= i);
        CHECK(engine.body_of(i) == b);
        // Bonded members are within a few radii of each other in the stored (unwrapped) frame.
        if (b != i) {
            const double dx = f.positions_nm[3 * i] - f.positions_nm[3 * b];
            const double dy = f.positions_nm[3 * i + 1] - f.positions_nm[3 * b + 1];
            const double dz = f.positions_nm[3 * i + 2] - f.positions_nm[3 * b + 2];
            CHECK(std::sqrt(dx * dx + dy * dy + dz * dz) < 100.0 * engine.body_size(b));
        }
    }
}
