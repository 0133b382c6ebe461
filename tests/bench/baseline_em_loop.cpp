#include "baseline_em_loop.hpp"

#include <algorithm>
#include <cmath>
#include <numbers>
#include <sstream>
#include <stdexcept>

#include "sim/philox_noise.hpp"

namespace brownfloc::bench {

namespace {

// A periodic grid of cubic cells of side >= min_side_m over a box of side box_m, with the
// particles of each cell chained through head/next (-1 ends a chain).
struct CellGrid {
    int per_side = 0;
    double inverse_side = 0;
    std::vector<std::int32_t> head, next;

    CellGrid(double box_m, double min_side_m, std::size_t particles)
        : per_side(std::max(1, static_cast<int>(box_m / min_side_m))),
          inverse_side(per_side / box_m),
          head(static_cast<std::size_t>(per_side) * per_side * per_side, -1),
          next(particles, -1) {}

    [[nodiscard]] int coordinate(double x) const { return std::min(per_side - 1, static_cast<int>(x * inverse_side)); }
    [[nodiscard]] std::size_t index(int cx, int cy, int cz) const {
        return (static_cast<std::size_t>(cx) * per_side + cy) * per_side + cz;
    }
    void insert(std::uint32_t i, const std::array<double, 3>& x) {
        const std::size_t c = index(coordinate(x[0]), coordinate(x[1]), coordinate(x[2]));
        next[i] = head[c];
        head[c] = static_cast<std::int32_t>(i);
    }
    // Calls visit(j) for every particle j in the 27 cells around x (periodic; with fewer than
    // 3 cells per side, every particle once).
    template <class Visit>
    void for_each_near(const std::array<double, 3>& x, Visit&& visit) const {
        if (per_side < 3) {
            for (std::int32_t c_head : head)
                for (std::int32_t j = c_head; j >= 0; j = next[j]) visit(static_cast<std::uint32_t>(j));
            return;
        }
        // The neighbouring cell coordinates along each axis, wrapped without a division.
        auto around = [this](int c) {
            return std::array<int, 3>{c == 0 ? per_side - 1 : c - 1, c, c == per_side - 1 ? 0 : c + 1};
        };
        const std::array<int, 3> xs = around(coordinate(x[0])), ys = around(coordinate(x[1])),
                                 zs = around(coordinate(x[2]));
        for (int cx : xs)
            for (int cy : ys)
                for (int cz : zs)
                    for (std::int32_t j = head[index(cx, cy, cz)]; j >= 0; j = next[j]) visit(static_cast<std::uint32_t>(j));
    }
};

}  // namespace

BaselineEmLoop::BaselineEmLoop(std::size_t particles, double volume_fraction, double radius_m,
                               const potentials::TabulatedInteraction& interaction, double diffusion_m2_per_s,
                               double kT_J, double time_step_s, double cutoff_gap_m, double skin_m, std::uint64_t seed)
    : particles_(particles),
      forces_N_(particles),
      interaction_(interaction),
      radius_m_(radius_m),
      box_m_(std::cbrt(static_cast<double>(particles) * 4.0 / 3.0 * std::numbers::pi * radius_m * radius_m * radius_m /
                       volume_fraction)),
      half_box_m_(0.5 * box_m_),
      mobility_dt_m_per_N_(diffusion_m2_per_s / kT_J * time_step_s),
      noise_sigma_m_(std::sqrt(2.0 * diffusion_m2_per_s * time_step_s)),
      force_range_m_(2.0 * radius_m + cutoff_gap_m),
      list_range_m_(2.0 * radius_m + cutoff_gap_m + skin_m),
      rebuild_distance_m_(0.5 * skin_m),
      seed_(seed) {
    if (particles == 0 || particles > 0xffffffffu || !(volume_fraction > 0 && volume_fraction < 0.5) ||
        !(list_range_m_ < half_box_m_))
        throw std::runtime_error("baseline EM loop: needs 1 <= N < 2^32, 0 < volume fraction < 0.5 and a list range "
                                 "2a + cutoff + skin below half the box");
    place();
    build_list();
}

void BaselineEmLoop::place() {
    // Random sequential insertion: trial positions from Philox (stream placement, step =
    // attempt number, body = particle), kept when no earlier sphere is closer than
    // 2a + the table's start gap.
    const double min_distance = 2.0 * radius_m_ + interaction_.start_gap_m();
    const double min_distance2 = min_distance * min_distance;
    CellGrid grid(box_m_, min_distance, particles_.size());
    constexpr std::uint64_t max_attempts = 100'000;
    for (std::uint32_t i = 0; i < particles_.size(); ++i) {
        bool placed = false;
        for (std::uint64_t attempt = 0; attempt < max_attempts && !placed; ++attempt) {
            const auto bits = sim::philox_block(seed_, attempt, i, sim::NoiseStream::placement);
            const std::array<double, 3> x = {sim::uniform_open01(bits[0]) * box_m_, sim::uniform_open01(bits[1]) * box_m_,
                                             sim::uniform_open01(bits[2]) * box_m_};
            bool free = true;
            grid.for_each_near(x, [&](std::uint32_t j) {
                double r2 = 0;
                for (int c = 0; c < 3; ++c) {
                    const double d = minimum_image(particles_[j].position_m[c] - x[c]);
                    r2 += d * d;
                }
                free = free && r2 >= min_distance2;
            });
            if (free) {
                particles_[i].position_m = x;
                grid.insert(i, x);
                placed = true;
            }
        }
        if (!placed) {
            std::ostringstream message;
            message << "baseline EM loop: particle " << i << " found no free place in " << max_attempts
                    << " attempts; lower the volume fraction";
            throw std::runtime_error(message.str());
        }
    }
}

void BaselineEmLoop::build_list() {
    // A cell list sorted by cell (counting sort), so that the candidates of one cell are
    // contiguous: cells of side >= the list range, the 27 around each particle's cell.
    const std::size_t n = particles_.size();
    const double range2 = list_range_m_ * list_range_m_;
    const int m = std::max(1, static_cast<int>(box_m_ / list_range_m_));  // cells per side
    list_start_.assign(n + 1, 0);
    list_owner_.resize(n);
    neighbours_.clear();
    auto add_if_near = [&](const std::array<double, 3>& xi, std::uint32_t j, const std::array<double, 3>& xj) {
        double r2 = 0;
        for (int c = 0; c < 3; ++c) {
            const double d = minimum_image(xj[c] - xi[c]);
            r2 += d * d;
        }
        if (r2 < range2) neighbours_.push_back(j);
    };
    if (m < 3) {  // small box: every pair
        for (std::uint32_t i = 0; i < n; ++i) {
            list_owner_[i] = i;
            list_start_[i] = static_cast<std::uint32_t>(neighbours_.size());
            for (std::uint32_t j = i + 1; j < n; ++j) add_if_near(particles_[i].position_m, j, particles_[j].position_m);
        }
    } else {
        const double inverse_side = m / box_m_;
        auto coordinate = [&](double x) { return std::min(m - 1, static_cast<int>(x * inverse_side)); };
        auto cell_index = [m](int cx, int cy, int cz) { return (static_cast<std::size_t>(cx) * m + cy) * m + cz; };
        std::vector<std::uint32_t> cell_of(n), cell_start(static_cast<std::size_t>(m) * m * m + 1, 0);
        std::vector<std::array<double, 3>> sorted(n);
        for (std::uint32_t i = 0; i < n; ++i) {
            const auto& x = particles_[i].position_m;
            cell_of[i] = static_cast<std::uint32_t>(cell_index(coordinate(x[0]), coordinate(x[1]), coordinate(x[2])));
            ++cell_start[cell_of[i] + 1];
        }
        for (std::size_t c = 1; c < cell_start.size(); ++c) cell_start[c] += cell_start[c - 1];
        {
            std::vector<std::uint32_t> fill(cell_start.begin(), cell_start.end() - 1);
            for (std::uint32_t i = 0; i < n; ++i) {
                const std::uint32_t k = fill[cell_of[i]]++;
                list_owner_[k] = i;
                sorted[k] = particles_[i].position_m;
            }
        }
        // Particles in cell order, so that neighbouring cells stay in cache from one to the next.
        auto around = [m](int c) { return std::array<int, 3>{c == 0 ? m - 1 : c - 1, c, c == m - 1 ? 0 : c + 1}; };
        for (std::uint32_t k = 0; k < n; ++k) {
            list_start_[k] = static_cast<std::uint32_t>(neighbours_.size());
            const std::uint32_t i = list_owner_[k];
            const auto& x = sorted[k];
            for (int cx : around(coordinate(x[0])))
                for (int cy : around(coordinate(x[1])))
                    for (int cz : around(coordinate(x[2]))) {
                        const std::size_t c = cell_index(cx, cy, cz);
                        for (std::uint32_t q = cell_start[c]; q < cell_start[c + 1]; ++q)
                            if (list_owner_[q] > i) add_if_near(x, list_owner_[q], sorted[q]);
                    }
        }
    }
    list_start_[n] = static_cast<std::uint32_t>(neighbours_.size());
    positions_at_build_m_.resize(n);
    for (std::size_t i = 0; i < n; ++i) positions_at_build_m_[i] = particles_[i].position_m;
    ++list_builds_;
    list_stale_ = false;
}

void BaselineEmLoop::step() {
    if (list_stale_) build_list();
    const std::size_t n = particles_.size();
    std::fill(forces_N_.begin(), forces_N_.end(), std::array<double, 3>{});

    // Pair forces: F = -dU/dh > 0 pushes the pair apart along the centre line.
    const double force_range2 = force_range_m_ * force_range_m_;
    for (std::size_t row = 0; row < n; ++row) {
        const std::uint32_t i = list_owner_[row];
        const std::array<double, 3> xi = particles_[i].position_m;
        std::array<double, 3> fi{};
        for (std::uint32_t k = list_start_[row]; k < list_start_[row + 1]; ++k) {
            const std::uint32_t j = neighbours_[k];
            const std::array<double, 3> d = {minimum_image(particles_[j].position_m[0] - xi[0]),
                                             minimum_image(particles_[j].position_m[1] - xi[1]),
                                             minimum_image(particles_[j].position_m[2] - xi[2])};
            const double r2 = d[0] * d[0] + d[1] * d[1] + d[2] * d[2];
            if (r2 >= force_range2 || r2 == 0.0) continue;
            const double r = std::sqrt(r2);
            const double f_over_r = interaction_.force_N(r - 2.0 * radius_m_) / r;
            for (int c = 0; c < 3; ++c) {
                fi[c] -= f_over_r * d[c];
                forces_N_[j][c] += f_over_r * d[c];
            }
        }
        for (int c = 0; c < 3; ++c) forces_N_[i][c] += fi[c];
    }

    // Euler-Maruyama update, wrap, and the largest displacement since the list was built.
    double max_moved2 = 0;
    for (std::size_t i = 0; i < n; ++i) {
        const std::array<double, 4> xi =
            sim::box_muller_normals(seed_, step_, static_cast<std::uint32_t>(i), sim::NoiseStream::translation);
        double moved2 = 0;
        for (int c = 0; c < 3; ++c) {
            double x = particles_[i].position_m[c] + mobility_dt_m_per_N_ * forces_N_[i][c] + noise_sigma_m_ * xi[c];
            if (x < 0) x += box_m_;
            if (x >= box_m_) x -= box_m_;
            particles_[i].position_m[c] = x;
            const double d = minimum_image(x - positions_at_build_m_[i][c]);
            moved2 += d * d;
        }
        max_moved2 = std::max(max_moved2, moved2);
    }
    ++step_;
    list_stale_ = max_moved2 > rebuild_distance_m_ * rebuild_distance_m_;
}

void BaselineEmLoop::check_finite() const {
    for (std::size_t i = 0; i < particles_.size(); ++i) {
        const std::array<double, 3>& x = particles_[i].position_m;
        if (std::isfinite(x[0]) && std::isfinite(x[1]) && std::isfinite(x[2])) continue;
        std::ostringstream message;
        message << "baseline EM loop: step " << step_ << ": particle " << i << " at (" << x[0] << ", " << x[1] << ", "
                << x[2] << ") m";
        throw std::runtime_error(message.str());
    }
}

}  // namespace brownfloc::bench
