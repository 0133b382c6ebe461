// Structure of diffusion-limited aggregates grown by the engine.
#include <omp.h>

#include <catch2/catch.hpp>
#include <cmath>

#include "analysis/cluster_geometry.hpp"
#include "analysis/fractal_fit.hpp"
#include "engine_test_support.hpp"
#include "sim/engine.hpp"

using namespace brownfloc;

TEST_CASE("sticky spheres grow clusters of fractal dimension 1.8", "[engine][validation][slow][structure]") {
    // Diffusion-limited cluster-cluster aggregation: d_f = 1.78 +- 0.05 in 3D (Jullien, Kolb &
    // Botet 1984, J. Physique Lett. 45, L211; simulations); 1.75-1.85 measured for gold, silica
    // and polystyrene (Lin et al. 1989, Nature 339, 360). The issue's tolerance: 1.8 +- 0.1.
    // Case: 10^4 sticky spheres (U = 0, capture at min_gap), volume fraction 0.01, rigid clusters
    // with Kirkwood mobility; seed 11. The issue asks for a number-average size of at least
    // 30. The apparent d_f of a population still rich in small clusters is lower than the
    // asymptotic one (this run, fit over n >= 10: 1.69 +- 0.04 at mean size 20 and 30, 1.71 at
    // 45, 1.77 +- 0.05 at 60), so the clusters are grown to a mean size of 60 (about 10 fast
    // half-lives, some 4 minutes on one core), where the fit is dominated by clusters in the
    // scaling regime.
    const sim::RunPlan plan = engine_test::plan_from_toml(R"(
        [particle]
        radius_nm = 100
        hamaker_J = 0
        surface_potential_mV = 0
        [suspension]
        volume_fraction = 0.01
        [electrolyte]
        salt = "NaCl"
        concentration_mM = 10
        [run]
        particles = 10000
        seed = 11
        end_half_lives = 1000
        max_steps = 100000000000
    )");
    // One thread: the test runs beside others under ctest, and most loops here are too short
    // to pay for a parallel region on shared cores (the results do not depend on it).
    const int saved_threads = omp_get_max_threads();
    omp_set_num_threads(1);
    sim::Engine engine(plan.model, plan.particles);
    const double n = double(engine.particle_count());
    while (n / double(engine.bodies().size()) < 60.0) {
        for (int k = 0; k < 1000; ++k) engine.step();
        REQUIRE(engine.time_s() < 200 * plan.half_life_fast_s);  // far beyond what DLCA needs
    }
    std::vector<analysis::ClusterShape> shapes;
    for (std::uint32_t b : engine.bodies()) {
        const auto centres = engine.unwrapped_members_m(b);
        shapes.push_back({engine.body_size(b), engine.spans_box(b) ? 0.0 : analysis::radius_of_gyration_m(centres),
                          engine.spans_box(b)});
    }
    omp_set_num_threads(saved_threads);
    const analysis::FractalFit fit = analysis::fit_fractal_dimension(shapes, 100e-9, 11);
    INFO("d_f = " << fit.dimension.value_or(0.0) << " +- " << fit.dimension_error.value_or(0.0) << ", k0 = "
                  << fit.prefactor.value_or(0.0) << "; " << fit.note << "; reached mean size 60 at " << engine.time_s() / plan.half_life_fast_s << " fast half-lives");
    REQUIRE(fit.dimension.has_value());
    CHECK(std::abs(*fit.dimension - 1.8) <= 0.1);
}
