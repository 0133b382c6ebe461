#pragma once
// The speed baseline the engine is judged against: a plain Verlet-list Euler-Maruyama loop
// with double-precision Box-Muller Philox noise, single-threaded, no captures, no clusters.
//
//   BaselineEmLoop loop(100'000, 0.05, 100e-9, table, D, kT, dt, cutoff, skin, seed);
//   for (int s = 0; s < 100; ++s) loop.step();
//   loop.check_finite();
//
// Each step: zero the forces; for each pair of the half Verlet list (minimum image) within
// 2a + cutoff, add the tabulated force -dU/dh along the centre line; then
// x += (D / kT) F dt + sqrt(2 D dt) xi with xi = 3 of the 4 box_muller_normals(seed, step, i,
// translation); wrap into the periodic box. The list holds pairs within 2a + cutoff + skin,
// built through a cell list sorted by cell (its rows, and so the pair loop, run in cell
// order; particle arrays keep their order), and is rebuilt before a step once any particle
// has moved more than skin/2 since the last build. The same seed gives the same trajectory
// bit for bit.
#include <array>
#include <cstddef>
#include <cstdint>
#include <span>
#include <vector>

#include "potentials/tabulated_interaction.hpp"

namespace brownfloc::bench {

struct BaselineParticle {
    std::array<double, 3> position_m;  // inside [0, box length)
};

class BaselineEmLoop {
public:
    // particles: N; volume_fraction: N (4/3) pi a^3 / box volume; radius_m: a [m];
    // interaction: the pair force by gap [N] (copied); diffusion_m2_per_s: D of one sphere;
    // kT_J [J]; time_step_s [s]; cutoff_gap_m and skin_m [m]; seed of all noise. Places the
    // spheres at random without overlap (centre distance >= 2a + the table's start gap) and
    // builds the list. Throws std::runtime_error if the spheres cannot be placed.
    BaselineEmLoop(std::size_t particles, double volume_fraction, double radius_m,
                   const potentials::TabulatedInteraction& interaction, double diffusion_m2_per_s, double kT_J,
                   double time_step_s, double cutoff_gap_m, double skin_m, std::uint64_t seed);

    // One Euler-Maruyama step of every particle.
    void step();
    // Builds the Verlet list now (step() does this by itself when it is needed).
    void build_list();

    [[nodiscard]] std::span<const BaselineParticle> particles() const { return particles_; }
    [[nodiscard]] std::uint64_t steps_taken() const { return step_; }
    [[nodiscard]] std::uint64_t list_builds() const { return list_builds_; }
    [[nodiscard]] std::size_t list_pairs() const { return neighbours_.size(); }
    [[nodiscard]] double box_length_m() const { return box_m_; }

    // Throws std::runtime_error naming the first particle with a non-finite position and the
    // step count, e.g. "baseline EM loop: step 40: particle 17 at (nan, 1e-06, 2e-06) m".
    void check_finite() const;

private:
    void place();
    [[nodiscard]] double minimum_image(double d) const {
        if (d > half_box_m_) return d - box_m_;
        if (d < -half_box_m_) return d + box_m_;
        return d;
    }

    std::vector<BaselineParticle> particles_;
    std::vector<std::array<double, 3>> forces_N_;
    std::vector<std::array<double, 3>> positions_at_build_m_;
    // Row r of the half list: particle i = list_owner_[r] (rows in cell order) and its partners
    // j > i in neighbours_[list_start_[r] .. list_start_[r + 1]).
    std::vector<std::uint32_t> list_owner_;
    std::vector<std::uint32_t> list_start_;
    std::vector<std::uint32_t> neighbours_;
    potentials::TabulatedInteraction interaction_;
    double radius_m_, box_m_, half_box_m_;
    double mobility_dt_m_per_N_, noise_sigma_m_;
    double force_range_m_, list_range_m_, rebuild_distance_m_;
    std::uint64_t seed_;
    std::uint64_t step_ = 0, list_builds_ = 0;
    bool list_stale_ = false;
};

}  // namespace brownfloc::bench
