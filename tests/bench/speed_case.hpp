#pragma once
// The speed case of the engine issue, shared by the baseline benchmark (baseline_em.bench.cpp)
// and the engine benchmark so that both time exactly the same system:
// one thread, N = 1e5 spheres of radius 100 nm at volume fraction 0.05, surface potential
// -25 mV in 50 mM NaCl, water at 25 degC, Hamaker constant 1e-20 J (polystyrene across water,
// as scenarios/001), linear superposition double layer, interaction tabulated from 0.2 nm.
//
//   const SpeedCaseSetup& s = speed_case_setup();   // built once
//   BaselineEmLoop loop(c.particles, c.volume_fraction, c.radius_m, s.table, s.diffusion_m2_per_s,
//                       s.kT_J, s.time_step_s, s.cutoff_gap_m, s.skin_m, c.seed);
//
// Derived numbers (provisional rules of the issue, until the engine's own rules replace them):
//   cutoff gap: beyond it |U| < 0.01 kT and |F| * Debye length < 0.01 kT, found by scanning
//               outward on a 0.1 % geometric grid of gaps;
//   time step:  sqrt(2 * 2D * dt) = Debye length / 10 (relative rms step of a pair);
//   skin:       0.3 * cutoff gap.
#include <cmath>
#include <cstddef>
#include <cstdint>
#include <stdexcept>
#include <algorithm>
#include <chrono>
#include <limits>
#include <time.h>  // clock_gettime (POSIX)

#include "potentials/electrolyte.hpp"
#include "potentials/kinetics.hpp"
#include "potentials/medium.hpp"
#include "potentials/pair_interaction.hpp"
#include "potentials/tabulated_interaction.hpp"

namespace brownfloc::bench {

struct SpeedCase {
    std::size_t particles = 100'000;
    double volume_fraction = 0.05;
    double radius_m = 100e-9;
    double surface_potential_V = -0.025;
    const char* salt = "NaCl";
    double salt_concentration_mM = 50.0;
    double temperature_K = 298.15;
    double hamaker_J = 1e-20;
    double min_gap_m = 0.2e-9;  // start of the force table
    std::uint64_t seed = 20240601;
    double cutoff_energy_kT = 0.01;             // |U| below this beyond the cutoff
    double cutoff_force_debye_kT = 0.01;        // |F| * Debye length below this beyond the cutoff
    double relative_step_per_debye_length = 0.1;  // sqrt(2 * 2D * dt) / Debye length
    double skin_per_cutoff = 0.3;
};

[[nodiscard]] inline potentials::PairInteraction speed_case_pair(const SpeedCase& c) {
    potentials::PairModel model;
    model.radius1_m = model.radius2_m = c.radius_m;
    model.hamaker_J = c.hamaker_J;
    model.surface_potential1_V = model.surface_potential2_V = c.surface_potential_V;
    model.double_layer = potentials::DoubleLayerModel::linear_superposition;
    return potentials::PairInteraction(model, potentials::water_at(c.temperature_K),
                                       potentials::Electrolyte::from_salt(c.salt, c.salt_concentration_mM));
}

// The smallest gap [m] beyond which |U| < energy_kT kT and |F| / kappa < force_kT kT. Scans
// outward from min_gap_m on a geometric grid (ratio 1.001) and stops once the criteria have
// held over a factor 2 in gap past the last gap where they failed (U and F decay
// monotonically that far out, as powers of h or faster).
[[nodiscard]] inline double speed_case_cutoff_gap_m(const potentials::PairInteraction& pair, double min_gap_m,
                                                    double energy_kT, double force_kT) {
    const double kT = pair.kT_J(), debye_m = 1.0 / pair.kappa_per_m();
    double last_failure_m = min_gap_m;
    for (double h = min_gap_m; h < 2.0 * last_failure_m || h < 4.0 * min_gap_m; h *= 1.001) {
        const potentials::EnergySlope es = pair.total(h);
        if (std::fabs(es.energy_J) >= energy_kT * kT || std::fabs(es.slope_J_per_m) * debye_m >= force_kT * kT)
            last_failure_m = h;
        if (h > 1.0) throw std::runtime_error("speed case: no cutoff below 1 m");
    }
    return last_failure_m * 1.001;
}

struct SpeedCaseSetup {
    potentials::PairInteraction pair;
    double kT_J;
    double debye_length_m;
    double diffusion_m2_per_s;  // Stokes-Einstein, one sphere
    double cutoff_gap_m;
    double time_step_s;
    double skin_m;
    potentials::TabulatedInteraction table;  // from min_gap_m to cutoff_gap_m
};

[[nodiscard]] inline SpeedCaseSetup make_speed_case_setup(const SpeedCase& c) {
    const potentials::PairInteraction pair = speed_case_pair(c);
    const potentials::Medium medium = pair.medium();
    const double debye_m = 1.0 / pair.kappa_per_m();
    const double diffusion = potentials::stokes_einstein_m2_per_s(c.radius_m, medium.temperature_K, medium.viscosity_Pa_s);
    const double cutoff = speed_case_cutoff_gap_m(pair, c.min_gap_m, c.cutoff_energy_kT, c.cutoff_force_debye_kT);
    const double relative_step_m = c.relative_step_per_debye_length * debye_m;
    const double dt = relative_step_m * relative_step_m / (2.0 * 2.0 * diffusion);
    return {pair,   pair.kT_J(), debye_m, diffusion, cutoff, dt, c.skin_per_cutoff * cutoff,
            potentials::TabulatedInteraction(pair, c.min_gap_m, cutoff)};
}

// The default case's set-up, built once (thread-safe static).
[[nodiscard]] inline const SpeedCaseSetup& speed_case_setup() {
    static const SpeedCaseSetup setup = make_speed_case_setup(SpeedCase{});
    return setup;
}

// CPU time of the calling thread [ns]. The per-particle-step figures of the single-threaded
// benchmarks use it: on the shared 2-core build machine wall time also counts the time the
// thread waits for a core (benchmarks also report wall time; a multi-threaded run must).
[[nodiscard]] inline double thread_cpu_time_ns() {
    timespec t{};
    clock_gettime(CLOCK_THREAD_CPUTIME_ID, &t);
    return static_cast<double>(t.tv_sec) * 1e9 + static_cast<double>(t.tv_nsec);
}

// The best (smallest) cost of a block of consecutive steps, by thread CPU time and by wall
// time. On a shared machine another job inflates some blocks; the best block of a run is
// the steady cost with the least interference, and the figure to compare between cases of
// one run. Call start() before a step and stop() after it.
class BestBlock {
public:
    explicit BestBlock(int steps_per_block) : steps_per_block_(steps_per_block) {}
    void start() {
        if (in_block_ == 0) {
            cpu0_ = thread_cpu_time_ns();
            wall0_ = std::chrono::steady_clock::now();
        }
    }
    void stop() {
        if (++in_block_ < steps_per_block_) return;
        const double cpu = thread_cpu_time_ns() - cpu0_;
        const double wall = std::chrono::duration<double, std::nano>(std::chrono::steady_clock::now() - wall0_).count();
        best_cpu_ns_ = std::min(best_cpu_ns_, cpu / steps_per_block_);
        best_wall_ns_ = std::min(best_wall_ns_, wall / steps_per_block_);
        in_block_ = 0;
    }
    // Per step [ns]; infinite before the first whole block.
    [[nodiscard]] double best_cpu_ns_per_step() const { return best_cpu_ns_; }
    [[nodiscard]] double best_wall_ns_per_step() const { return best_wall_ns_; }

private:
    int steps_per_block_;
    int in_block_ = 0;
    double cpu0_ = 0;
    std::chrono::steady_clock::time_point wall0_{};
    double best_cpu_ns_ = std::numeric_limits<double>::infinity();
    double best_wall_ns_ = std::numeric_limits<double>::infinity();
};

}  // namespace brownfloc::bench
