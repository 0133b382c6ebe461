// Aggregation kinetics of the engine against published rate theory: Smoluchowski's fast
// coagulation of sticky spheres, and Fuchs' stability ratio for a double-layer barrier, for
// van der Waals attraction alone and for oppositely charged spheres.
//
// Rates are measured from monomer-monomer captures: the maximum-likelihood k = M / E with E
// the monomer-pair exposure including the long-time transient k(t) = k [1 + R*/sqrt(pi D_rel
// t)], R* = (a1 + a2)/W (kinetics_support.hpp). The run's own figure (RunRecorder, what
// `brownfloc run` writes to summary.json) is printed beside it; for interacting pairs it
// takes the transient with the capture distance, which is right for sticky spheres only.
//
// Measured effects beyond the dilute pair theory (not engine errors: two-body runs of the same
// rules agree with it, see time_step_convergence.test.cpp and first_passage.test.cpp):
// - sticky spheres, finite concentration (N = 4000, 3 seeds each): N/N0 at 0.5 t1/2 below
//   the transient-corrected Smoluchowski curve by 13 % at volume fraction 0.01, 8.5 % at
//   0.005, 5.5 % at 0.002, 5 % at 0.001, about 1.2 sqrt(phi): diffusion-limited reactions
//   speed up with the density of sinks as its square root (Felderhof & Deutch 1976, J. Chem.
//   Phys. 64, 4551 [memory]). At 0.01 the run's total fit gives W = 0.84-0.88 and the
//   monomer-pair rate W = 0.88-0.95; at 0.001 (4 seeds) W = 0.90-0.97 and 0.93-1.00.
// - sticky spheres, size dependence of the kernel: at t1/2 N/N0 is 8.5 % below the curve at
//   phi = 0.001 and 9.4 % at 0.0005 (seed 11), no longer falling with phi: the mean Brownian
//   kernel grows above the monomer kernel as the distribution widens, which the constant
//   kernel leaves out. It uses most of the issue's 10 % at t1/2.
// - soft repulsion and crowding: with a double layer reaching ~5 Debye lengths (2.5 radii
//   at kappa a = 1) the effective hard-sphere volume fraction is 5.6 phi, and crowding raises
//   the contact density: measured W = 3.66 for Fuchs 4.00 at phi = 0.0055 (psi = -14.7 mV,
//   0.231 mM), W = 4.70 and 4.81 for the case below (Fuchs 5.07) at 0.004 and 0.002, and at
//   phi = 0.03 (Fuchs W = 8.0) half the Fuchs W.
#include <catch2/catch.hpp>
#include <cmath>
#include <cstdint>
#include <string>
#include <vector>

#include "engine_test_support.hpp"
#include "kinetics_support.hpp"
#include "sim/coagulation_reference.hpp"
#include "sim/engine.hpp"
#include "sim/engine_setup.hpp"
#include "sim/rate_fit.hpp"
#include "sim/run_recorder.hpp"

namespace {

using namespace brownfloc::sim;
using brownfloc::engine_test::MonomerPairTally;
using brownfloc::engine_test::plan_from_toml;

constexpr double pi = 3.14159265358979323846;
constexpr double boltzmann_J_per_K = 1.380649e-23;  // exact (SI 2019)

// Fast (Smoluchowski) rate of two spheres [m^3/s]: 4 pi (D1 + D2)(a1 + a2), Stokes-Einstein D.
double fast_rate(const EngineModel& m, std::size_t si, std::size_t sj) {
    const double ai = m.species_median_radius_m[si], aj = m.species_median_radius_m[sj];
    return 4 * pi * m.kT_J / (6 * pi * m.viscosity_Pa_s) * (1 / ai + 1 / aj) * (ai + aj);
}

struct PairRateRun {
    std::int64_t steps = 0;
    double time_s = 0, final_fraction = 1, monte_carlo_acceptance = 0;
    std::vector<RateEstimate> own;        // per pair kind (MonomerPairTally)
    std::vector<PairRate> recorder;       // the run's own estimate
};

// Steps the engine until the cluster count falls below stop_fraction of N (or max_steps),
// tallying monomer-pair captures. steady_start: first move the particles to the Fuchs
// steady-state pair structure (100 Monte Carlo sweeps of trial moves up to one radius).
PairRateRun run_pair_rates(const RunPlan& plan, bool steady_start, double stop_fraction, std::int64_t max_steps) {
    const EngineModel& m = *plan.model;
    InitialParticles start = plan.particles;
    PairRateRun out;
    if (steady_start) {
        auto mc = brownfloc::engine_test::steady_state_start(m, start, 100, m.species_median_radius_m[0], m.seed + 1000);
        start = std::move(mc.particles);
        out.monte_carlo_acceptance = mc.acceptance;
    }
    Engine engine(plan.model, start);
    MonomerPairTally tally(engine);
    RunRecorder recorder(plan, engine);
    const double n0 = double(engine.particle_count());
    while (double(engine.bodies().size()) >= stop_fraction * n0 && engine.steps_taken() < max_steps) {
        engine.step();
        tally.after_step(engine);
        recorder.after_step(engine);
    }
    out.steps = engine.steps_taken();
    out.time_s = engine.time_s();
    out.final_fraction = double(engine.bodies().size()) / n0;
    for (const PairKind& kind : m.pair_kinds) out.own.push_back(tally.rate(kind.species_i, kind.species_j));
    out.recorder = recorder.pair_rates();
    return out;
}

// Measured W relative to the fast rate, and its 95 % interval, from a rate estimate.
struct MeasuredRatio {
    double w = 0, lower = 0, upper = 0;
    std::int64_t events = 0;
};
MeasuredRatio measured_ratio(const RateEstimate& r, double fast_rate_m3_per_s) {
    REQUIRE(r.rate_m3_per_s);
    REQUIRE(r.ci95_m3_per_s);
    return {fast_rate_m3_per_s / *r.rate_m3_per_s, fast_rate_m3_per_s / (*r.ci95_m3_per_s)[1],
            fast_rate_m3_per_s / (*r.ci95_m3_per_s)[0], r.events};
}

}  // namespace

TEST_CASE("sticky spheres coagulate at the Smoluchowski rate and follow the constant-kernel solution to the half-life",
          "[engine][validation][slow]") {
    // Case: a = 100 nm, U = 0 (capture at min_gap 0.2 nm), 298.15 K, eta = 0.89 mPa s, volume
    // fraction 0.001, N = 4000, seed 11; run to one fast half-life (2.7e5 steps).
    const RunPlan plan = plan_from_toml(brownfloc::engine_test::sticky_spheres("volume_fraction = 0.001", 4000, 11));
    const EngineModel& model = *plan.model;
    const PairKind& kind = model.pair_kind(0, 0);
    REQUIRE_FALSE(kind.interacting);
    Engine engine(plan.model, plan.particles);
    RunRecorder recorder(plan, engine);

    // Smoluchowski (1917), Z. Phys. Chem. 92, 129: k = 8 kT/(3 eta) for equal spheres, from
    // the contact distance; captured at R = 2a + min_gap the rate is k (2a + h)/(2a), i.e.
    // k / W at capture (0.1 % more).
    const double temperature_K = 298.15, viscosity_Pa_s = 0.89e-3, a = 100e-9;
    const double kT_J = boltzmann_J_per_K * temperature_K;
    const double k_smoluchowski = 8 * kT_J / (3 * viscosity_Pa_s);
    const double k_ref = k_smoluchowski / std::exp(kind.log_stability_ratio_at_capture);
    const double box = engine.box_length_m(), n0_total = double(engine.particle_count());
    const double n0 = n0_total / (box * box * box);
    const double half_life_s = 2 / (k_smoluchowski * n0);
    const double capture_m = 2 * a + kind.capture_gap_m, d_rel = 2 * kT_J / (6 * pi * viscosity_Pa_s * a);
    const double tau_s = 2 / (k_ref * n0);  // half-life of the constant kernel at rate k_ref

    const std::vector<double> checkpoints = {0.25, 0.5, 0.75, 1.0};  // in fast half-lives
    struct Counts {
        double t_s, clusters, n1, n2, n3;
    };
    std::vector<Counts> counts;
    for (double c : checkpoints) {
        while (engine.time_s() < c * half_life_s) {
            engine.step();
            recorder.after_step(engine);
        }
        Counts k{engine.time_s(), double(engine.bodies().size()), 0, 0, 0};
        for (std::uint32_t b : engine.bodies()) {
            const std::uint32_t size = engine.body_size(b);
            if (size == 1) k.n1 += 1;
            else if (size == 2) k.n2 += 1;
            else if (size == 3) k.n3 += 1;
        }
        counts.push_back(k);
    }

    // Rates. The issue's tolerance is 10 %. Measured here: total fit 3 % fast, monomer pairs
    // 0.4 %. Over 4 seeds at this concentration the total fit ran 3-10 % fast (mean 6 %):
    // besides the finite concentration, its window (N/N0 >= 0.7) holds collisions of doublets,
    // whose Brownian kernel exceeds the monomer one, and of clusters fresh from a merger,
    // whose neighbourhood is not yet depleted. The 95 % counting interval of the total fit
    // (1200 events) is +-6 %, of the monomer-pair rate (850 events) +-7 %.
    const RateFit total = recorder.total_rate();
    REQUIRE(total.rate_m3_per_s);
    const std::vector<PairRate> pairs = recorder.pair_rates();
    REQUIRE(pairs.size() == 1);
    REQUIRE(pairs[0].rate.rate_m3_per_s);
    INFO("k_ref " << k_ref << " m^3/s; total fit " << *total.rate_m3_per_s << " (W " << k_ref / *total.rate_m3_per_s
                  << ", " << total.events << " events); monomer pairs " << *pairs[0].rate.rate_m3_per_s << " (W "
                  << k_ref / *pairs[0].rate.rate_m3_per_s << ", " << pairs[0].monomer_events << " events)");
    CHECK(std::abs(*total.rate_m3_per_s / k_ref - 1) < 0.10);
    CHECK(std::abs(*pairs[0].rate.rate_m3_per_s / k_ref - 1) < 0.10);

    // The size distribution against the constant-kernel solution with Smoluchowski's
    // time-dependent rate, i.e. time t replaced by T(t) = t + 2R sqrt(t/(pi D_rel)) (exact for
    // a kernel that depends on time but not on size).
    // N/N0: the issue's 10 %; measured -0.4, -4.1, -5.5 and -8.5 % at 0.25, 0.5, 0.75 and 1
    // t1/2 (see the top of the file); the count itself scatters by ~1 %.
    // n_k (k = 1-3): 15 % plus three standard errors of the count (Poisson, 1/sqrt(n_k)).
    // The constant kernel stands for the Brownian kernel of compact clusters, which is
    // (r_i + r_j)(1/r_i + 1/r_j)/4 times k: 1.04 for a monomer and a doublet, 1.10 for a
    // monomer and a triplet (r ~ size^(1/1.8)), so monomers and small clusters are consumed
    // a few % faster; each new cluster also starts with its own transient (triplets ran 30 %
    // above the curve at 0.2 t1/2 in 2 of 3 seeds), and the deficit of N/N0 doubles in n1
    // (measured at t1/2: n1 -14 %, n2 -11 %, n3 -10 %, against allowances of 25, 29 and 34 %).
    for (const Counts& c : counts) {
        const double fraction_ref = transient_corrected_fraction(c.t_s, k_ref, n0, capture_m, d_rel);
        const double t_eff = transient_integrated_time_s(c.t_s, capture_m, d_rel);
        INFO("t = " << c.t_s / half_life_s << " t1/2: N/N0 " << c.clusters / n0_total << " (reference " << fraction_ref
                    << "); n1, n2, n3 / N0 " << c.n1 / n0_total << ", " << c.n2 / n0_total << ", " << c.n3 / n0_total
                    << " (reference " << constant_kernel_size_fraction(1, t_eff, tau_s) << ", "
                    << constant_kernel_size_fraction(2, t_eff, tau_s) << ", "
                    << constant_kernel_size_fraction(3, t_eff, tau_s) << ")");
        CHECK(std::abs(c.clusters / n0_total / fraction_ref - 1) < 0.10);
        const double observed[3] = {c.n1, c.n2, c.n3};
        for (int k = 1; k <= 3; ++k) {
            const double expected_count = n0_total * constant_kernel_size_fraction(k, t_eff, tau_s);
            CHECK(std::abs(observed[k - 1] / expected_count - 1) < 0.15 + 3 / std::sqrt(expected_count));
        }
    }
}

TEST_CASE("a double-layer barrier slows capture by its Fuchs stability ratio, and van der Waals attraction alone speeds it",
          "[engine][validation][slow]") {
    SECTION("barrier: kappa a = 1.04, barrier 3.3 kT, Fuchs W at capture 5.07") {
        // Case: barrier_case_toml (kinetics_support.hpp): a = 20 nm, A = 1e-20 J, psi = -15.5
        // mV, 0.25 mM NaCl. Volume fraction 0.002 (effective 0.011 with the double layer's
        // reach, see the top of the file), N = 3000, seed 3, steady-state start; run until
        // 15 % of the particles have aggregated (~1.6e5 steps, ~400 monomer captures).
        const RunPlan plan = plan_from_toml(brownfloc::engine_test::barrier_case_toml(0.002, 3000, 3));
        const EngineModel& model = *plan.model;
        const PairKind& kind = model.pair_kind(0, 0);
        const double w_fuchs = std::exp(kind.log_stability_ratio_at_capture);
        REQUIRE(kind.debye_length_m);
        REQUIRE(model.species_median_radius_m[0] / *kind.debye_length_m < 10);  // kappa a <= 10
        REQUIRE(kind.barrier_kT > 3);
        REQUIRE(w_fuchs > 3);
        REQUIRE(w_fuchs < 30);
        // The start's quadrature of W agrees with the library's Fuchs integral.
        CHECK(std::abs(brownfloc::engine_test::SteadyPairDensity(model, 0).stability_ratio() / w_fuchs - 1) < 1e-3);

        const PairRateRun run = run_pair_rates(plan, true, 0.85, 2'000'000);
        const MeasuredRatio w = measured_ratio(run.own[0], fast_rate(model, 0, 0));
        INFO("barrier " << kind.barrier_kT << " kT; Fuchs W at capture " << w_fuchs << "; measured W " << w.w << " [" << w.lower
                        << ", " << w.upper << "] from " << w.events << " monomer captures in " << run.steps
                        << " steps; the run's own (transient from the capture distance) "
                        << fast_rate(model, 0, 0) / run.recorder[0].rate.rate_m3_per_s.value_or(NAN)
                        << "; Monte Carlo acceptance " << run.monte_carlo_acceptance);
        // The issue's 20 %: the 95 % counting interval is +-10 % and crowding (-5 % at this
        // volume fraction, measured) takes part of the rest.
        CHECK(std::abs(w.w / w_fuchs - 1) < 0.20);
    }
    SECTION("negative control: the same spheres without the double layer, Fuchs W at capture 0.91") {
        // Same case with psi = 0: van der Waals attraction only (capture where U = -10 kT).
        // Uniform start (see kinetics_support.hpp): the attraction is short (U = -0.12 kT at
        // 8 nm) and the transient is Smoluchowski's with R* = (a1 + a2)/W. Volume fraction
        // 0.002, N = 3000, seed 4; run until 20 % have aggregated (~470 monomer captures).
        const RunPlan plan = plan_from_toml(brownfloc::engine_test::barrier_case_toml(0.002, 3000, 4, 0.0));
        const EngineModel& model = *plan.model;
        const PairKind& kind = model.pair_kind(0, 0);
        const double w_fuchs = std::exp(kind.log_stability_ratio_at_capture);
        REQUIRE_FALSE(kind.debye_length_m);
        REQUIRE(w_fuchs < 1);
        const PairRateRun run = run_pair_rates(plan, false, 0.80, 2'000'000);
        const MeasuredRatio w = measured_ratio(run.own[0], fast_rate(model, 0, 0));
        INFO("Fuchs W at capture " << w_fuchs << " (capture gap " << kind.capture_gap_m * 1e9 << " nm); measured W " << w.w
                                   << " [" << w.lower << ", " << w.upper << "] from " << w.events << " monomer captures in "
                                   << run.steps << " steps; the run's own "
                                   << fast_rate(model, 0, 0) / run.recorder[0].rate.rate_m3_per_s.value_or(NAN));
        // 20 % as for the barrier; the counting interval is +-9 %.
        CHECK(std::abs(w.w / w_fuchs - 1) < 0.20);
    }
}

TEST_CASE("oppositely charged spheres heteroaggregate at the Fuchs rate of the attracting pair",
          "[engine][validation][slow]") {
    // Case: two species of a = 20 nm, psi = +25 and -25 mV, no van der Waals (A = 0), number
    // fractions 0.5, 0.25 mM NaCl (kappa a = 1.04). Like pairs: repulsion of 12.5 kT at
    // min_gap (W ~ 7e3, no captures); unlike pairs: attraction, capture where U = -10 kT
    // (3 nm), Fuchs W_AB at capture 0.49. Volume fraction 0.0005, N = 4000, seed 7; uniform
    // start; run until 20 % have aggregated (~600 A-B monomer captures).
    const RunPlan plan = plan_from_toml(R"(
        [[species]]
        name = "plus"
        radius_nm = 20
        hamaker_J = 0
        surface_potential_mV = 25
        number_fraction = 0.5
        [[species]]
        name = "minus"
        radius_nm = 20
        hamaker_J = 0
        surface_potential_mV = -25
        number_fraction = 0.5
        [suspension]
        volume_fraction = 0.0005
        [electrolyte]
        salt = "NaCl"
        concentration_mM = 0.25
        [run]
        particles = 4000
        seed = 7
        steps = 1
    )");
    const EngineModel& model = *plan.model;
    const PairKind& unlike = model.pair_kind(0, 1);
    const double w_fuchs = std::exp(unlike.log_stability_ratio_at_capture);
    REQUIRE(w_fuchs < 1);
    REQUIRE(std::exp(model.pair_kind(0, 0).log_stability_ratio_at_capture) > 1000);
    const PairRateRun run = run_pair_rates(plan, false, 0.80, 2'000'000);
    const MeasuredRatio w = measured_ratio(run.own[model.pair_index(0, 1)], fast_rate(model, 0, 1));
    const PairRate& recorded = run.recorder[model.pair_index(0, 1)];
    INFO("Fuchs W_AB at capture " << w_fuchs << " (capture gap " << unlike.capture_gap_m * 1e9 << " nm); measured W_AB "
                                  << w.w << " [" << w.lower << ", " << w.upper << "] from " << w.events
                                  << " A-B monomer captures in " << run.steps << " steps; the run's own pairs entry "
                                  << recorded.fast_rate_m3_per_s / recorded.rate.rate_m3_per_s.value_or(NAN));
    // The issue's 20 %; the counting interval is +-8 %.
    CHECK(std::abs(w.w / w_fuchs - 1) < 0.20);
}
