// No two particles overlap by more than 1 % of the smaller radius at the end of any step while
// particles aggregate, with and without forces (the issue's requirement). Overlap is a
// property of every step, not a statistic: the bound is checked after each one.
#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>
#include <cstdint>
#include <limits>
#include <string>

#include "engine_test_support.hpp"
#include "sim/engine.hpp"

using brownfloc::engine_test::plan_from_toml;
using brownfloc::engine_test::sticky_spheres;
using brownfloc::sim::Engine;

namespace {

// Steps the engine, checking after every step that no two particles overlap by more than
// 1 % of the smaller radius; returns the smallest relative gap seen.
double smallest_gap_while_stepping(Engine& engine, std::int64_t steps) {
    double smallest = std::numeric_limits<double>::infinity();
    for (std::int64_t s = 0; s < steps; ++s) {
        engine.step();
        const double gap = engine.smallest_relative_gap();
        smallest = std::min(smallest, gap);
        if (gap < -0.01) {
            FAIL("step " << engine.steps_taken() << ": relative gap " << gap);
        }
    }
    return smallest;
}

}  // namespace

TEST_CASE("no two particles overlap by more than 1 % of the radius while sticky spheres aggregate",
          "[engine][validation]") {
    // 1000 sticky spheres at volume fraction 0.05, seed 3, for three fast half-lives: clusters
    // meet clusters and most particles end in a few large ones (981 captures when written).
    const auto plan = plan_from_toml(sticky_spheres("volume_fraction = 0.05", 1000, 3));
    Engine engine(plan.model, plan.particles);
    const auto steps = static_cast<std::int64_t>(std::ceil(3.0 * plan.steps_per_half_life));
    const double smallest = smallest_gap_while_stepping(engine, steps);
    INFO("smallest relative gap " << smallest << " over " << steps << " steps, " << engine.captures().size()
                                  << " captures");
    CHECK(smallest >= -0.01);
    CHECK(engine.captures().size() > 300);
}

TEST_CASE("no two particles overlap by more than 1 % of the radius while attracting spheres aggregate",
          "[engine][validation]") {
    // a = 100 nm, A = 1e-20 J, psi = -10 mV in 50 mM NaCl: no barrier, the van der Waals
    // attraction pulls particles in over the last few nanometres. Volume fraction 0.05, 1000
    // particles, seed 4. The Debye length sets a step of ~2 ns, so a fast half-life is ~7e6
    // steps: 20000 steps (0.003 half-lives) catch the pairs that start close together (86
    // captures when written), pulled in by the steepest forces of the run.
    const std::string toml = R"([particle]
radius_nm = 100
hamaker_J = 1e-20
surface_potential_mV = -10
[suspension]
volume_fraction = 0.05
[medium]
temperature_K = 298.15
viscosity_mPa_s = 0.89
[electrolyte]
salt = "NaCl"
concentration_mM = 50
[run]
particles = 1000
seed = 4
)";
    const auto plan = plan_from_toml(toml);
    REQUIRE(plan.model->pair_kinds[0].barrier_kT == 0);
    Engine engine(plan.model, plan.particles);
    const std::int64_t steps = 20000;
    const double smallest = smallest_gap_while_stepping(engine, steps);
    INFO("smallest relative gap " << smallest << " over " << steps << " steps ("
                                  << double(steps) / plan.steps_per_half_life << " fast half-lives), "
                                  << engine.captures().size() << " captures");
    CHECK(smallest >= -0.01);
    CHECK(engine.captures().size() > 0);
}

TEST_CASE("no two particles overlap by more than 1 % of the radius while small attracting spheres form clusters",
          "[engine][validation][slow]") {
    // The same surfaces at a = 10 nm (kappa a = 7.4, still no barrier): the run reaches a
    // fast half-life in a test's time, so clusters meet clusters under forces and torques.
    // Volume fraction 0.05, 1000 particles, seed 8.
    const std::string toml = R"([particle]
radius_nm = 10
hamaker_J = 1e-20
surface_potential_mV = -10
[suspension]
volume_fraction = 0.05
[medium]
temperature_K = 298.15
viscosity_mPa_s = 0.89
[electrolyte]
salt = "NaCl"
concentration_mM = 50
[run]
particles = 1000
seed = 8
)";
    const auto plan = plan_from_toml(toml);
    REQUIRE(plan.model->pair_kinds[0].barrier_kT == 0);
    Engine engine(plan.model, plan.particles);
    const auto steps = static_cast<std::int64_t>(std::ceil(1.0 * plan.steps_per_half_life));
    const double smallest = smallest_gap_while_stepping(engine, steps);
    std::uint32_t largest = 0;
    for (std::uint32_t b : engine.bodies()) largest = std::max(largest, engine.body_size(b));
    INFO("smallest relative gap " << smallest << " over " << steps << " steps, " << engine.captures().size()
                                  << " captures, largest cluster " << largest);
    CHECK(smallest >= -0.01);
    CHECK(largest >= 5);
}
