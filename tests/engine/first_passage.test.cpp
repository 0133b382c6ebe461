// Two-body first passage: the engine's integrator and capture rule against the Fuchs
// stability ratio of the same potential and capture gap (no hydrodynamic interactions).
//
// Method of Northrup, Allison & McCammon (1984), J. Chem. Phys. 80, 1517: pairs start at
// centre distance b, beyond which U = 0 (the engine's cutoff); each trajectory ends when the
// pair is captured (probability beta) or reaches q > b. With Omega = b/q the probability
// that free diffusion returns from q to b,
//   k = k_D(b) beta / (1 - (1 - beta) Omega),  k_D(b) = 4 pi D_rel b,
// and the measured stability ratio relative to the fast rate 4 pi D_rel (a1 + a2) is
//   W = ((a1 + a2) / b) (1 - (1 - beta) Omega) / beta.
// Each trajectory moves the two particles with the engine's Ermak-McCammon monomer update
// (monomer_displacement), the engine's tabulated force, time step and Philox noise streams,
// and captures with the engine's rule (capture_rule.hpp).
#include <omp.h>

#include <catch2/catch.hpp>
#include <algorithm>
#include <cmath>
#include <cstdint>

#include "engine_test_support.hpp"
#include "potentials/constants.hpp"
#include "sim/brownian_update.hpp"
#include "sim/capture_rule.hpp"
#include "sim/engine_setup.hpp"
#include "sim/philox_noise.hpp"

namespace {

using namespace brownfloc::sim;

struct PassageResult {
    std::int64_t trajectories = 0, captured = 0;
    double b_m = 0, q_m = 0;
};

PassageResult run_pairs(const EngineModel& model, std::int64_t trajectories, double q_over_b, std::uint64_t seed) {
    const PairKind& kind = model.pair_kind(0, 0);
    const auto& table = *model.pair_tables.at(0);
    const double a = model.species_median_radius_m[0];
    const double dt = model.time_step.time_step_s;
    const double d = model.kT_J / (6 * brownfloc::potentials::constants::pi * model.viscosity_Pa_s * a);
    const double mobility_dt = d / model.kT_J * dt, amplitude = std::sqrt(2 * d * dt);
    PassageResult out;
    out.trajectories = trajectories;
    // Start where U has vanished (the cutoff), and at least 20 % beyond contact so that a
    // pair without forces does not start on the capture sphere.
    out.b_m = std::max(2 * a + kind.cutoff_gap_m, 1.2 * 2 * a);
    out.q_m = q_over_b * out.b_m;
    const double q2 = out.q_m * out.q_m;
    std::int64_t captured = 0;
#pragma omp parallel for schedule(dynamic, 64) reduction(+ : captured)
    for (std::int64_t t = 0; t < trajectories; ++t) {
        const std::uint64_t path_seed = seed + static_cast<std::uint64_t>(t);
        // Second particle at distance b in a random direction from the first.
        const auto u = philox_block(path_seed, 0, 0, NoiseStream::placement);
        const double cos_theta = 2 * uniform_open01(u[0]) - 1, phi = 2 * brownfloc::potentials::constants::pi * uniform_open01(u[1]);
        const double sin_theta = std::sqrt(1 - cos_theta * cos_theta);
        Vec3 p1{0, 0, 0}, p2{out.b_m * sin_theta * std::cos(phi), out.b_m * sin_theta * std::sin(phi), out.b_m * cos_theta};
        double h_prev = out.b_m - 2 * a;
        for (std::uint64_t step = 0;; ++step) {
            Vec3 sep{p2[0] - p1[0], p2[1] - p1[1], p2[2] - p1[2]};
            const double r = std::sqrt(sep[0] * sep[0] + sep[1] * sep[1] + sep[2] * sep[2]);
            const double h = r - 2 * a;
            const double f = h < kind.cutoff_gap_m ? table.force_N(h) : 0.0;  // > 0 pushes apart
            const Vec3 f2{f * sep[0] / r, f * sep[1] / r, f * sep[2] / r};
            const Vec3 f1{-f2[0], -f2[1], -f2[2]};
            const auto n1 = standard_normals3(path_seed, step, 0, NoiseStream::translation);
            const auto n2 = standard_normals3(path_seed, step, 1, NoiseStream::translation);
            const Vec3 d1 = monomer_displacement(mobility_dt, amplitude, f1, n1);
            const Vec3 d2 = monomer_displacement(mobility_dt, amplitude, f2, n2);
            for (int c = 0; c < 3; ++c) {
                p1[c] += d1[c];
                p2[c] += d2[c];
            }
            sep = {p2[0] - p1[0], p2[1] - p1[1], p2[2] - p1[2]};
            const double r2 = sep[0] * sep[0] + sep[1] * sep[1] + sep[2] * sep[2];
            const double h1 = std::sqrt(r2) - 2 * a;
            const double x0 = h_prev - kind.capture_gap_m, x1 = h1 - kind.capture_gap_m;
            if (x1 <= 0) { ++captured; break; }
            if (bridge_crossing_possible(x1, 2 * d, dt)) {
                const auto bits = philox_block(path_seed, step, 0, NoiseStream::capture, 1);
                if (uniform_open01(bits[0]) < bridge_crossing_probability(x0, x1, 2 * d, dt)) { ++captured; break; }
            }
            if (r2 > q2) break;
            h_prev = h1;
        }
    }
    out.captured = captured;
    return out;
}

double measured_stability_ratio(const PassageResult& r, double contact_m) {
    const double beta = double(r.captured) / double(r.trajectories);
    const double omega = r.b_m / r.q_m;
    return contact_m / r.b_m * (1 - (1 - beta) * omega) / beta;
}

}  // namespace

TEST_CASE("two-body first passage through a barrier reproduces the Fuchs stability ratio", "[engine][validation][slow]") {
    // Case: a = 20 nm, A = 1e-20 J, psi = -24 mV, 14.79 mM NaCl (Debye length 2.5 nm, kappa a = 8):
    // barrier 4.7 kT, Fuchs W from the capture distance (no hydrodynamics) 4.7.
    const RunPlan plan = brownfloc::engine_test::plan_from_toml(R"(
        [particle]
        radius_nm = 20
        hamaker_J = 1e-20
        surface_potential_mV = -24
        [suspension]
        volume_fraction = 0.01
        [electrolyte]
        salt = "NaCl"
        concentration_mM = 14.7866
        [run]
        particles = 2
        steps = 1
    )");
    const EngineModel& model = *plan.model;
    const PairKind& kind = model.pair_kind(0, 0);
    const double w_fuchs = std::exp(kind.log_stability_ratio_at_capture);
    REQUIRE(kind.barrier_kT > 3.0);
    REQUIRE(w_fuchs > 3.0);
    REQUIRE(w_fuchs < 30.0);

    // 1e5 trajectories with q = 1.25 b: beta ~ 0.03 (about 3000 captures), so the relative
    // standard error of W is about 1.8 %; the 5 % tolerance of the issue is 2.8 standard
    // errors (the seed is fixed, so the outcome is reproducible).
    const PassageResult r = run_pairs(model, 100000, 1.25, 20261201);
    const double w = measured_stability_ratio(r, 2 * model.species_median_radius_m[0]);
    INFO("captured " << r.captured << " of " << r.trajectories << "; W measured " << w << ", Fuchs " << w_fuchs
                     << ", barrier " << kind.barrier_kT << " kT");
    CHECK(std::abs(w / w_fuchs - 1) < 0.05);
}

TEST_CASE("two-body first passage of sticky spheres gives the Smoluchowski rate", "[engine][validation]") {
    // U = 0: W from the capture distance is (a1 + a2)/(a1 + a2 + min_gap), 1 to 0.1 %.
    const RunPlan plan = brownfloc::engine_test::plan_from_toml(R"(
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
        particles = 2
        steps = 1
    )");
    const EngineModel& model = *plan.model;
    const double w_fuchs = std::exp(model.pair_kind(0, 0).log_stability_ratio_at_capture);
    // b = 1.2 (2a), q = 1.5 b: beta ~ 0.6, relative standard error of W ~ 0.5 % at 4e4
    // trajectories; tolerance 5 %, as for the barrier case.
    const PassageResult r = run_pairs(model, 40000, 1.5, 7);
    const double w = measured_stability_ratio(r, 2 * model.species_median_radius_m[0]);
    INFO("captured " << r.captured << " of " << r.trajectories << "; W measured " << w << ", Fuchs " << w_fuchs);
    CHECK(std::abs(w / w_fuchs - 1) < 0.05);
}
