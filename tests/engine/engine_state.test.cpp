// An engine rebuilt from a saved state continues bit for bit (what checkpoint and resume
// rely on): the state after N steps of one engine equals that of an engine restored at step
// M < N and stepped to N, compared with operator== on every array (exact doubles).
#include <catch2/catch.hpp>
#include <omp.h>

#include <cstdint>
#include <cstring>
#include <memory>
#include <string>

#include "engine_test_support.hpp"
#include "sim/engine.hpp"
#include "sim/engine_state.hpp"

using brownfloc::engine_test::plan_from_toml;
using brownfloc::engine_test::sticky_spheres;
using brownfloc::sim::Engine;
using brownfloc::sim::EngineState;

namespace {

// Steps a fresh engine to `total` steps, and another one restored from the first's state at
// `restore_at` on `threads_after` threads; returns both final states.
std::pair<EngineState, EngineState> straight_and_restored(const brownfloc::sim::RunPlan& plan, std::int64_t restore_at,
                                                          std::int64_t total, int threads_after) {
    auto model = std::make_shared<brownfloc::sim::EngineModel>(*plan.model);
    model->parallel_min_items = 1;  // exercise the parallel loops on a small system
    omp_set_num_threads(1);
    Engine straight(model, plan.particles);
    EngineState saved;
    while (straight.steps_taken() < total) {
        if (straight.steps_taken() == restore_at) saved = straight.state();
        straight.step();
    }
    omp_set_num_threads(threads_after);
    Engine restored(model, saved);
    while (restored.steps_taken() < total) restored.step();
    omp_set_num_threads(1);
    return {straight.state(), restored.state()};
}

}  // namespace

TEST_CASE("a restored engine continues sticky-sphere aggregation bit for bit", "[engine]") {
    // 400 sticky spheres at volume fraction 0.05: clusters form, rotate and merge within
    // the steps run, and the list is rebuilt several times before and after the restore.
    const auto plan = plan_from_toml(sticky_spheres("volume_fraction = 0.05", 400, 3));
    const auto [straight, restored] = straight_and_restored(plan, 3000, 6000, 2);
    CHECK(straight.captures.size() > 20);
    CHECK(straight.list_builds > 2);
    CHECK(straight == restored);
}

TEST_CASE("a restored engine continues aggregation of attracting polydisperse spheres bit for bit", "[engine]") {
    // Interacting spheres (forces, the radius-free tables) with radius_spread 0.2.
    const std::string toml = R"([particle]
radius_nm = 20
hamaker_J = 1e-20
surface_potential_mV = -10
radius_spread = 0.2
[suspension]
volume_fraction = 0.05
[electrolyte]
salt = "NaCl"
concentration_mM = 50
[run]
particles = 300
seed = 4
)";
    const auto plan = plan_from_toml(toml);
    const auto [straight, restored] = straight_and_restored(plan, 500, 1500, 3);
    CHECK(straight.captures.size() > 5);
    CHECK(straight == restored);
}

TEST_CASE("a state that does not fit the model is refused", "[engine]") {
    const auto plan = plan_from_toml(sticky_spheres("volume_fraction = 0.01", 50, 1));
    Engine engine(plan.model, plan.particles);
    EngineState s = engine.state();
    s.species[3] = 7;  // one species only
    CHECK_THROWS_WITH(Engine(plan.model, s), Catch::Contains("particle 3"));
    s = engine.state();
    s.offset_x_m.pop_back();
    CHECK_THROWS_AS(Engine(plan.model, s), std::invalid_argument);
}
