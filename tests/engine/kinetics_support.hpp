#pragma once
// Helpers for the kinetics validation tests: a start from the Fuchs steady-state pair
// structure, and a monomer-pair rate tally with the long-time transient of that start.
//
// Why a steady-state start. Fuchs' W (1934, Z. Physik 89, 736) is the ratio of the
// steady-state diffusive flux without and with the potential. The engine places particles
// uniformly (t = 0 is the moment salt is added), so with a long-range double layer (kappa a
// of order 1, reach ~5 Debye lengths, several radii) the pairs that sit on the repulsive
// flank at t = 0 are either captured or pushed out over the time a pair needs to diffuse
// across the reach, which is of the order of the fast half-life. Measured (a = 20 nm, kappa
// a = 1.14, Fuchs W = 8.0, volume fraction 0.03): W = 2.4 from a uniform start against 3.7
// from the steady start below, the rest of the gap being crowding at that concentration
// (kinetics.test.cpp). Pair rates with a barrier are therefore measured from the structure
// the theory assumes: the steady-state pair density
//   rho(r) / n = exp(-U(r)/kT) [1 - I(r)/I(R_c)],  I(r) = int_r^inf exp(U/kT) r'^-2 dr',
// (the solution of the Smoluchowski equation with an absorbing capture sphere R_c), applied
// within the cutoff by a Metropolis Monte Carlo with pair-product weights. Beyond the cutoff
// rho = 1 - R*/r with R* = 1/I(R_c) = (a1 + a2)/W, which the start leaves uniform; that
// far-field part relaxes as the long-time transient k(t) = k [1 + R*/sqrt(pi D_rel t)]
// (Smoluchowski 1917 for sticky spheres, where R* = R_c; the same form holds for a partially
// absorbing or interacting sink with R* = k/(4 pi D_rel): Collins & Kimball 1949, J. Colloid
// Sci. 4, 425 [memory for the general-potential form]). The tally below uses that transient.
// The start is for barriers, where R* << a1 + a2. With attraction R* exceeds a1 + a2 and the
// uniform far field left beyond the cutoff is a large jump: measured for opposite charges
// (Fuchs W = 0.49), W = 0.67 from the steady start against 0.45 from a uniform start at
// volume fraction 0.002 (0.57 and 0.51 at 0.0005). A uniform start is Smoluchowski's
// problem for the far field, with R*, and is what the attractive cases use.
#include <algorithm>
#include <cmath>
#include <cstdint>
#include <limits>
#include <string>
#include <vector>

#include "sim/engine.hpp"
#include "sim/engine_model.hpp"
#include "sim/philox_noise.hpp"
#include "sim/rate_fit.hpp"

namespace brownfloc::engine_test {

// The barrier case of the kinetics tests: a = 20 nm, A = 1e-20 J, psi = -15.5 mV in 0.25 mM
// NaCl at 25 degC (Debye length 19.2 nm, kappa a = 1.04; linear superposition double layer,
// full Hamaker van der Waals, min_gap 0.2 nm). Barrier 3.3 kT at a gap of 3.2 nm; capture
// gap 0.31 nm; Fuchs W from the capture distance 5.07. A low-salt, small-particle case keeps
// the time step (set by the 1 kT barrier width) large against the half-life.
[[nodiscard]] inline std::string barrier_case_toml(double volume_fraction, int particles, int seed,
                                                   double surface_potential_mV = -15.5) {
    return "[particle]\nradius_nm = 20\nhamaker_J = 1e-20\nsurface_potential_mV = " +
           std::to_string(surface_potential_mV) + "\n[suspension]\nvolume_fraction = " + std::to_string(volume_fraction) +
           "\n[electrolyte]\nsalt = \"NaCl\"\nconcentration_mM = 0.25\n[run]\nparticles = " + std::to_string(particles) +
           "\nseed = " + std::to_string(seed) + "\nsteps = 1\n";
}

// ln of the Fuchs steady-state pair density rho(h)/n of one species pair, tabulated on
// log-spaced gaps from the capture gap to the cutoff (-inf at and below the capture gap, 0
// beyond the cutoff), from the engine's own tabulated energy.
class SteadyPairDensity {
public:
    SteadyPairDensity(const sim::EngineModel& model, std::size_t pair_index) {
        const sim::PairKind& kind = model.pair_kinds[pair_index];
        const auto& table = model.pair_tables[pair_index];
        contact_m_ = model.species_median_radius_m[kind.species_i] + model.species_median_radius_m[kind.species_j];
        capture_gap_m_ = kind.capture_gap_m;
        cutoff_gap_m_ = std::max(kind.cutoff_gap_m, capture_gap_m_ * (1 + 1e-6));
        const std::size_t n = grid_points;
        log_density_.resize(n);
        std::vector<double> u(n), tail(n);
        for (std::size_t k = 0; k < n; ++k) u[k] = table ? table->energy_J(gap_at(k)) / model.kT_J : 0.0;
        // I(r): 1/r at the cutoff (U = 0 beyond it), trapezoids inward on 4000 log-spaced
        // gaps. Against the library's log_stability_ratio_at_capture: 6e-5 for the barrier
        // case, 8e-4 with van der Waals alone (U falls 10 kT within 1 nm of the capture gap).
        tail[n - 1] = 1.0 / (contact_m_ + gap_at(n - 1));
        for (std::size_t k = n - 1; k-- > 0;) {
            const double r0 = contact_m_ + gap_at(k), r1 = contact_m_ + gap_at(k + 1);
            tail[k] = tail[k + 1] + 0.5 * (std::exp(u[k]) / (r0 * r0) + std::exp(u[k + 1]) / (r1 * r1)) * (r1 - r0);
        }
        tail_at_capture_ = tail[0];
        tail_ = tail;
        for (std::size_t k = 0; k < n; ++k) {
            const double unabsorbed = 1.0 - tail[k] / tail_at_capture_;
            log_density_[k] = unabsorbed > 0 ? -u[k] + std::log(unabsorbed) : -std::numeric_limits<double>::infinity();
        }
    }

    // W relative to the fast rate 4 pi D_rel (a1 + a2), from this quadrature: (a1 + a2) I(R_c).
    [[nodiscard]] double stability_ratio() const { return contact_m_ * tail_at_capture_; }

    // ln(rho/n) at gap h_m [m], linear in ln h between grid points.
    [[nodiscard]] double log_density(double h_m) const {
        if (h_m >= cutoff_gap_m_) return 0.0;
        if (h_m <= capture_gap_m_) return -std::numeric_limits<double>::infinity();
        const double x = std::log(h_m / capture_gap_m_) / std::log(cutoff_gap_m_ / capture_gap_m_) * double(grid_points - 1);
        const std::size_t k = std::min(static_cast<std::size_t>(x), grid_points - 2);
        const double t = x - double(k);
        if (!std::isfinite(log_density_[k])) return log_density_[k + 1];  // the first interval
        return log_density_[k] * (1 - t) + log_density_[k + 1] * t;
    }

    [[nodiscard]] double cutoff_gap_m() const { return cutoff_gap_m_; }

    // I(r) = int_r^inf exp(U/kT) r'^-2 dr' [1/m] at gap h_m >= the capture gap (linear
    // between grid points; 1/r beyond the cutoff).
    [[nodiscard]] double tail_integral_per_m(double h_m) const {
        if (h_m >= cutoff_gap_m_) return 1.0 / (contact_m_ + h_m);
        const double x = std::max(0.0, std::log(h_m / capture_gap_m_) / std::log(cutoff_gap_m_ / capture_gap_m_)) *
                         double(grid_points - 1);
        const std::size_t k = std::min(static_cast<std::size_t>(x), grid_points - 2);
        const double t = x - double(k);
        return tail_[k] * (1 - t) + tail_[k + 1] * t;
    }

private:
    static constexpr std::size_t grid_points = 4000;
    [[nodiscard]] double gap_at(std::size_t k) const {
        return capture_gap_m_ * std::pow(cutoff_gap_m_ / capture_gap_m_, double(k) / double(grid_points - 1));
    }
    double contact_m_ = 0, capture_gap_m_ = 0, cutoff_gap_m_ = 0, tail_at_capture_ = 0;
    std::vector<double> log_density_, tail_;
};

// ln of the Boltzmann factor exp(-U(h)/kT) of one species pair beyond its barrier top (beyond
// the capture gap when U has no maximum inside the cutoff), -inf inside it, 0 beyond the
// cutoff: the equilibrium pair weight of a reversible run, in which no pair climbs the
// barrier. Tabulated like SteadyPairDensity from the engine's table.
class BoltzmannPairWeight {
public:
    BoltzmannPairWeight(const sim::EngineModel& model, std::size_t pair_index) {
        const sim::PairKind& kind = model.pair_kinds[pair_index];
        const auto& table = model.pair_tables[pair_index];
        cutoff_gap_m_ = std::max(kind.cutoff_gap_m, kind.capture_gap_m * (1 + 1e-6));
        std::vector<double> h(grid_points), u(grid_points);
        double u_max = -std::numeric_limits<double>::infinity();
        start_gap_m_ = kind.capture_gap_m;
        for (std::size_t k = 0; k < grid_points; ++k) {
            h[k] = kind.capture_gap_m * std::pow(cutoff_gap_m_ / kind.capture_gap_m, double(k) / double(grid_points - 1));
            u[k] = table ? table->energy_J(h[k]) / model.kT_J : 0.0;
            if (u[k] > u_max) {
                u_max = u[k];
                start_gap_m_ = h[k];
            }
        }
        log_weight_.resize(grid_points);
        for (std::size_t k = 0; k < grid_points; ++k)
            log_weight_[k] = h[k] <= start_gap_m_ ? -std::numeric_limits<double>::infinity() : -u[k];
        grid_start_m_ = kind.capture_gap_m;
    }

    [[nodiscard]] double log_density(double h_m) const {
        if (h_m >= cutoff_gap_m_) return 0.0;
        if (h_m <= start_gap_m_) return -std::numeric_limits<double>::infinity();
        const double x = std::log(h_m / grid_start_m_) / std::log(cutoff_gap_m_ / grid_start_m_) * double(grid_points - 1);
        const std::size_t k = std::min(static_cast<std::size_t>(x), grid_points - 2);
        const double t = x - double(k);
        if (!std::isfinite(log_weight_[k])) return log_weight_[k + 1];
        return log_weight_[k] * (1 - t) + log_weight_[k + 1] * t;
    }
    [[nodiscard]] double cutoff_gap_m() const { return cutoff_gap_m_; }
    // The barrier top: pairs are kept outside this gap [m].
    [[nodiscard]] double excluded_below_gap_m() const { return start_gap_m_; }

private:
    static constexpr std::size_t grid_points = 4000;
    double grid_start_m_ = 0, start_gap_m_ = 0, cutoff_gap_m_ = 0;
    std::vector<double> log_weight_;
};

// Metropolis Monte Carlo (Metropolis et al. 1953, J. Chem. Phys. 21, 1087) of the positions
// with weight prod_pairs w(h_ij) (Weight: SteadyPairDensity or BoltzmannPairWeight, one per
// species pair kind): `sweeps` passes over the particles in id order. Each trial is a move
// uniform in a cube of half-side step_m or, with probability teleport_fraction, to a uniform
// random point of the box (which lets pairs form and part in a few sweeps, where local moves
// would need as long as the dynamics); either is symmetric, so acceptance is min(1, weight
// ratio). For pairwise-additive U and BoltzmannPairWeight this samples exactly the
// equilibrium of the engine's reversible run. Deterministic: trial numbers from the
// placement stream keyed by (seed, sweep, particle, extra 1 and 2).
struct MonteCarloResult {
    sim::InitialParticles particles;
    double acceptance = 0;
};

template <class Weight>
[[nodiscard]] MonteCarloResult metropolis_positions(const sim::EngineModel& model, sim::InitialParticles p, int sweeps,
                                                   double step_m, double teleport_fraction, std::uint64_t seed) {
    const std::size_t n = p.radii_m.size();
    const double box = p.box_length_m;
    std::vector<Weight> weight;
    double reach = 0;
    const double a_max = *std::max_element(p.radii_m.begin(), p.radii_m.end());
    for (std::size_t k = 0; k < model.pair_kinds.size(); ++k) {
        weight.emplace_back(model, k);
        reach = std::max(reach, 2 * a_max + weight.back().cutoff_gap_m());
    }
    // Cells at least one reach wide, at most ~2 per particle.
    const double max_per_edge = std::max(3.0, std::floor(std::cbrt(2.0 * double(n))));
    const int m = std::max(1, static_cast<int>(std::min(std::floor(box / reach), max_per_edge)));
    const bool cells_on = m >= 3;
    auto coord = [&](double v) { return std::min(m - 1, static_cast<int>(v / box * m)); };
    auto cell_of = [&](const sim::Vec3& x) {
        return cells_on ? static_cast<std::size_t>((coord(x[2]) * m + coord(x[1])) * m + coord(x[0])) : std::size_t{0};
    };
    std::vector<std::vector<std::uint32_t>> cells(cells_on ? static_cast<std::size_t>(m) * m * m : 1);
    for (std::uint32_t i = 0; i < n; ++i) cells[cell_of(p.positions_m[i])].push_back(i);
    auto fold = [&](double d) { return d - box * std::nearbyint(d / box); };
    const double minus_inf = -std::numeric_limits<double>::infinity();
    auto log_weight = [&](std::uint32_t i, const sim::Vec3& x) {
        double sum = 0;
        auto visit_cell = [&](std::size_t c) {
            for (std::uint32_t j : cells[c]) {
                if (j == i) continue;
                const double dx = fold(p.positions_m[j][0] - x[0]), dy = fold(p.positions_m[j][1] - x[1]),
                             dz = fold(p.positions_m[j][2] - x[2]);
                const double h = std::sqrt(dx * dx + dy * dy + dz * dz) - p.radii_m[i] - p.radii_m[j];
                sum += weight[model.pair_index(p.species[i], p.species[j])].log_density(h);
                if (sum == minus_inf) return;
            }
        };
        if (!cells_on) {
            visit_cell(0);
            return sum;
        }
        const int cx = coord(x[0]), cy = coord(x[1]), cz = coord(x[2]);
        for (int dz = -1; dz <= 1; ++dz)
            for (int dy = -1; dy <= 1; ++dy)
                for (int dx = -1; dx <= 1; ++dx) {
                    visit_cell(static_cast<std::size_t>((((cz + dz + m) % m) * m + (cy + dy + m) % m) * m + (cx + dx + m) % m));
                    if (sum == minus_inf) return sum;
                }
        return sum;
    };
    std::int64_t accepted = 0;
    for (int s = 0; s < sweeps; ++s)
        for (std::uint32_t i = 0; i < n; ++i) {
            const auto bits = sim::philox_block(seed, static_cast<std::uint64_t>(s), i, sim::NoiseStream::placement, 1);
            const auto more = sim::philox_block(seed, static_cast<std::uint64_t>(s), i, sim::NoiseStream::placement, 2);
            sim::Vec3 x = p.positions_m[i];
            const bool teleport = sim::uniform_open01(more[0]) < teleport_fraction;
            for (std::size_t c = 0; c < 3; ++c) {
                if (teleport) x[c] = sim::uniform_open01(bits[c]) * box;
                else x[c] += (2 * sim::uniform_open01(bits[c]) - 1) * step_m;
                x[c] -= box * std::floor(x[c] / box);
                if (x[c] >= box) x[c] = 0;
            }
            const double delta = log_weight(i, x) - log_weight(i, p.positions_m[i]);
            if (!(delta >= 0 || sim::uniform_open01(bits[3]) < std::exp(delta))) continue;
            const std::size_t c0 = cell_of(p.positions_m[i]), c1 = cell_of(x);
            if (c0 != c1) {
                auto& from = cells[c0];
                from.erase(std::find(from.begin(), from.end(), i));
                cells[c1].push_back(i);
            }
            p.positions_m[i] = x;
            ++accepted;
        }
    return {std::move(p), sweeps > 0 && n > 0 ? double(accepted) / (double(n) * sweeps) : 0.0};
}

// The start from the Fuchs steady-state structure (see the top of the file).
[[nodiscard]] inline MonteCarloResult steady_state_start(const sim::EngineModel& model, sim::InitialParticles p,
                                                         int sweeps, double step_m, std::uint64_t seed) {
    return metropolis_positions<SteadyPairDensity>(model, std::move(p), sweeps, step_m, 0.0, seed);
}

// Monomer-monomer captures of each species pair and their exposure, with the long-time
// transient k(t) = k [1 + R*/sqrt(pi D_rel t)], R* = (a1 + a2)/W (W the Fuchs ratio at
// capture; see the top of this file), D_rel = D_i + D_j (Stokes-Einstein monomers). Call
// after every step; rate() is the maximum-likelihood k_ij = M_ij / E_ij (rate_fit.hpp).
class MonomerPairTally {
public:
    explicit MonomerPairTally(const sim::Engine& engine) : model_(engine.model()) {
        const sim::EngineModel& m = model_;
        monomers_.assign(m.species_count, 0);
        for (std::uint32_t i = 0; i < engine.particle_count(); ++i)
            if (engine.body_size(engine.body_of(i)) == 1) ++monomers_[engine.species(i)];
        events_.assign(m.pair_kinds.size(), 0);
        exposure_.assign(m.pair_kinds.size(), 0.0);
        const double box = engine.box_length_m();
        volume_m3_ = box * box * box;
        last_time_s_ = engine.time_s();
    }

    void after_step(const sim::Engine& engine) {
        const sim::EngineModel& m = model_;
        const double t1 = engine.time_s();
        for (const sim::PairKind& kind : m.pair_kinds) {
            const std::size_t k = m.pair_index(kind.species_i, kind.species_j);
            const double ai = m.species_median_radius_m[kind.species_i], aj = m.species_median_radius_m[kind.species_j];
            const double d_rel = m.kT_J / (6 * pi * m.viscosity_Pa_s) * (1 / ai + 1 / aj);
            const double r_star = (ai + aj) * std::exp(-kind.log_stability_ratio_at_capture);
            exposure_[k] += sim::pair_exposure_s_per_m3(monomers_[kind.species_i], monomers_[kind.species_j],
                                                        kind.species_i == kind.species_j, volume_m3_, last_time_s_, t1,
                                                        r_star, d_rel);
        }
        last_time_s_ = t1;
        const auto& captures = engine.captures();
        for (; seen_ < captures.size(); ++seen_) {
            const sim::CaptureEvent& e = captures[seen_];
            const std::uint32_t si = engine.species(e.particle_i), sj = engine.species(e.particle_j);
            if (e.size_i == 1 && e.size_j == 1) ++events_[m.pair_index(si, sj)];
            if (e.size_i == 1) --monomers_[si];
            if (e.size_j == 1) --monomers_[sj];
        }
    }

    [[nodiscard]] std::int64_t events(std::size_t si, std::size_t sj) const { return events_[model_.pair_index(si, sj)]; }
    [[nodiscard]] sim::RateEstimate rate(std::size_t si, std::size_t sj) const {
        const std::size_t k = model_.pair_index(si, sj);
        return sim::monomer_pair_rate(events_[k], exposure_[k]);
    }
    [[nodiscard]] std::int64_t monomers(std::size_t s) const { return monomers_[s]; }

private:
    static constexpr double pi = 3.14159265358979323846;
    const sim::EngineModel& model_;
    std::vector<std::int64_t> monomers_;
    std::vector<std::int64_t> events_;
    std::vector<double> exposure_;
    double volume_m3_ = 0, last_time_s_ = 0;
    std::size_t seen_ = 0;
};

}  // namespace brownfloc::engine_test
