// The same bits at any thread count (the engine's promise, sim/engine.hpp): positions and
// bonds after N steps compared byte for byte between runs with 1, 2 and 3 OpenMP threads.
#include <catch2/catch.hpp>
#include <omp.h>

#include <cmath>
#include <cstdint>
#include <cstring>
#include <memory>
#include <string>
#include <vector>

#include "engine_test_support.hpp"
#include "sim/engine.hpp"
#include "sim/engine_model.hpp"
#include "sim/engine_setup.hpp"

using brownfloc::engine_test::plan_from_toml;
using brownfloc::engine_test::sticky_spheres;
using brownfloc::sim::Engine;
using brownfloc::sim::Vec3;

namespace {

struct EngineState {
    std::vector<double> coordinates;  // x, y, z of every particle
    std::vector<std::uint32_t> body;
    std::size_t captures = 0;
};

// Runs the plan on `threads` OpenMP threads. Every loop of the engine is made parallel
// (parallel_min_items = 1; by default loops under 8192 items stay on one thread, which would
// leave these small systems untested).
EngineState run_with_threads(const brownfloc::sim::RunPlan& plan, int threads, std::int64_t steps) {
    omp_set_num_threads(threads);
    REQUIRE(omp_get_max_threads() == threads);
    auto model = std::make_shared<brownfloc::sim::EngineModel>(*plan.model);
    model->parallel_min_items = 1;
    Engine engine(model, plan.particles);
    for (std::int64_t s = 0; s < steps; ++s) engine.step();
    EngineState state;
    for (std::uint32_t i = 0; i < engine.particle_count(); ++i) {
        const Vec3 p = engine.position_m(i);
        state.coordinates.insert(state.coordinates.end(), p.begin(), p.end());
        state.body.push_back(engine.body_of(i));
    }
    state.captures = engine.captures().size();
    return state;
}

// Same length and the same bytes (memcmp: -0.0 and 0.0 differ, as they should here).
bool same_bits(const std::vector<double>& a, const std::vector<double>& b) {
    return a.size() == b.size() && std::memcmp(a.data(), b.data(), a.size() * sizeof(double)) == 0;
}

}  // namespace

TEST_CASE("a run gives the same bits with one and two threads, and other bits with another seed",
          "[engine][validation]") {
    // Sticky spheres at volume fraction 0.05, 1000 particles, seed 9 (and 10), for about half a
    // fast half-life: clusters form, so captures, merges and cluster rotation are covered. Three
    // threads split the 256-particle blocks unevenly, which two do not.
    const int saved = omp_get_max_threads();
    const auto plan = plan_from_toml(sticky_spheres("volume_fraction = 0.05", 1000, 9));
    const auto steps = static_cast<std::int64_t>(std::ceil(0.5 * plan.steps_per_half_life));
    const EngineState one = run_with_threads(plan, 1, steps);
    const EngineState two = run_with_threads(plan, 2, steps);
    const EngineState three = run_with_threads(plan, 3, steps);
    const auto other_plan = plan_from_toml(sticky_spheres("volume_fraction = 0.05", 1000, 10));
    const EngineState other = run_with_threads(other_plan, 1, steps);
    omp_set_num_threads(saved);
    INFO(one.captures << " captures in " << steps << " steps");
    REQUIRE(one.captures > 50);
    // Exact comparison: the engine promises the same bits, not nearly the same numbers.
    CHECK(same_bits(one.coordinates, two.coordinates));
    CHECK(same_bits(one.coordinates, three.coordinates));
    CHECK(one.body == two.body);
    CHECK(one.body == three.body);
    CHECK(one.captures == two.captures);
    CHECK(!same_bits(one.coordinates, other.coordinates));
}

TEST_CASE("forces give the same bits with one and two threads", "[engine][validation]") {
    // The attracting spheres of the overlap test (a = 100 nm, A = 1e-20 J, psi = -10 mV,
    // 50 mM NaCl), volume fraction 0.05, 1000 particles, seed 6, 3000 steps: forces are
    // summed per particle, so the bits must not depend on the thread count.
    const std::string toml = R"([particle]
radius_nm = 100
hamaker_J = 1e-20
surface_potential_mV = -10
[suspension]
volume_fraction = 0.05
[electrolyte]
salt = "NaCl"
concentration_mM = 50
[run]
particles = 1000
seed = 6
)";
    const int saved = omp_get_max_threads();
    const auto plan = plan_from_toml(toml);
    const EngineState one = run_with_threads(plan, 1, 3000);
    const EngineState two = run_with_threads(plan, 2, 3000);
    omp_set_num_threads(saved);
    CHECK(same_bits(one.coordinates, two.coordinates));
    CHECK(one.body == two.body);
}
