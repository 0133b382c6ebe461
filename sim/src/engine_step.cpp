// One engine step: forces and the Ermak-McCammon update of every body, then captures.
//
// Positions are double-buffered: pos_ holds the start of the step and is only read while
// the new positions go to start_; the two are swapped at the end of the move, so that
// start_ then holds the start of the step for the capture check. This lets a monomer be
// moved in the same pass that sums its force (no force array written and read back, no
// copy of the old position); members of clusters keep their forces for a second pass over
// the clusters, which need every member's force before they move.
#include <cmath>
#include <stdexcept>
#include <string>
#include <utility>

#include "sim/brownian_update.hpp"
#include "sim/engine.hpp"
#include "sim/philox_noise.hpp"

namespace brownfloc::sim {

namespace {
constexpr int omp_block = 256;
constexpr std::uint32_t npos = 0xFFFFFFFFu;

}  // namespace

void Engine::step() {
    // The list is rebuilt once some particle has moved more than half the skin since the
    // last build. The exact check runs only when the running bound allows such a move; the
    // relative margin of 1e-9 far exceeds the rounding of the bound.
    const double limit = 0.5 * model_->skin_m;
    if (displacement_bound_m_ > limit * (1 - 1e-9)) {
        const double largest2 = largest_squared_displacement_since_build();
        if (largest2 > limit * limit) build_neighbour_list();
        else displacement_bound_m_ = std::sqrt(largest2);
    }
    move_bodies();
    detect_captures(candidates_);
    if (!candidates_.empty()) apply_captures(candidates_);
    ++step_;
}

void Engine::move_bodies() {
    const EngineModel& m = *model_;
    const bool forces = m.any_interaction;
    const std::uint64_t seed = seed_, step = static_cast<std::uint64_t>(step_);
    const std::int64_t n = static_cast<std::int64_t>(radius_.size());
    // One tabulated species pair and equal radii: the common case, without per-pair dispatch.
    const bool single = m.species_count == 1 && !m.radius_free && m.pair_tables[0] && min_radius_m_ == max_radius_m_;
    const potentials::TabulatedInteraction* table = single ? &*m.pair_tables[0] : nullptr;
    const double contact = 2 * max_radius_m_;
    const double reach = single ? contact + m.pair_kinds[0].cutoff_gap_m : 0.0;
    const double reach2 = reach * reach;
    std::int64_t bad = -1;
    double largest_move2 = 0;  // largest squared move of a particle in this step (bound) [m^2]

    // Pass 1, over particles: the force on each from members of other bodies (full list, list
    // order); a monomer moves at once, a cluster member keeps its force for pass 2.
#pragma omp parallel for schedule(static, omp_block) reduction(max : bad) reduction(max : largest_move2) if (n >= m.parallel_min_items)
    for (std::int64_t ii = 0; ii < n; ++ii) {
        const std::size_t i = static_cast<std::size_t>(ii);
        const std::uint32_t bi = pos_[i].body;
        const double xi = pos_[i].x, yi = pos_[i].y, zi = pos_[i].z, ai = radius_[i];
        double fx = 0, fy = 0, fz = 0;
        if (forces) {
            for (std::uint64_t k = nbr_start_[i]; k < nbr_start_[i + 1]; ++k) {
                prefetch_neighbour(k);
                const std::uint32_t j = nbr_[k];
                const double dx = fold(pos_[j].x - xi), dy = fold(pos_[j].y - yi), dz = fold(pos_[j].z - zi);
                const double r2 = dx * dx + dy * dy + dz * dz;
                if (single && r2 >= reach2) continue;
                if (pos_[j].body == bi) continue;
                const double r = std::sqrt(r2);
                const double f = single ? table->force_N(r - contact)
                                        : force_between(static_cast<std::uint32_t>(i), j, r - ai - radius_[j]);
                if (f == 0.0) continue;
                const double s = f / r;  // repulsive f pushes i away from j
                fx -= s * dx;
                fy -= s * dy;
                fz -= s * dz;
            }
        }
        if (size_[bi] != 1) {
            fx_[i] = fx;
            fy_[i] = fy;
            fz_[i] = fz;
            continue;
        }
        const std::uint32_t b = bi;  // == i
        const auto noise = standard_normals3(seed, step, b, NoiseStream::translation);
        const Vec3 dr = monomer_displacement(mob_t_[b], amp_t_[b], {fx, fy, fz}, noise);
        // A monomer's centre is its position (cx_ is left stale: sync_monomer_centre).
        const double nx = wrap(xi + dr[0]), ny = wrap(yi + dr[1]), nz = wrap(zi + dr[2]);
        if (!std::isfinite(nx + ny + nz)) bad = std::max(bad, std::int64_t(b));
        start_[i] = {nx, ny, nz, bi, pos_[i].species};
        largest_move2 = std::max(largest_move2, dr[0] * dr[0] + dr[1] * dr[1] + dr[2] * dr[2]);
    }

    // Pass 2, over clusters: force and torque summed over members in id order, then the
    // rigid move (Rodrigues' rotation of the offsets about the summed rotation vector).
    const std::int64_t nb = static_cast<std::int64_t>(bodies_.size());
#pragma omp parallel for schedule(static, omp_block) reduction(max : bad) reduction(max : largest_move2) if (nb >= m.parallel_min_items)
    for (std::int64_t kk = 0; kk < nb; ++kk) {
        const std::uint32_t b = bodies_[static_cast<std::size_t>(kk)];
        if (size_[b] == 1) continue;
        const auto xi = standard_normals3(seed, step, b, NoiseStream::translation);
        double f[3] = {0, 0, 0}, t[3] = {0, 0, 0};
        double reach_b2 = 0;  // largest squared member offset: a rotation by angle moves none farther than angle * reach
        for (std::uint32_t k = b; k != npos; k = next_[k]) {
            reach_b2 = std::max(reach_b2, ox_[k] * ox_[k] + oy_[k] * oy_[k] + oz_[k] * oz_[k]);
            if (!forces) continue;
            f[0] += fx_[k];
            f[1] += fy_[k];
            f[2] += fz_[k];
            t[0] += oy_[k] * fz_[k] - oz_[k] * fy_[k];
            t[1] += oz_[k] * fx_[k] - ox_[k] * fz_[k];
            t[2] += ox_[k] * fy_[k] - oy_[k] * fx_[k];
        }
        const auto xr = standard_normals3(seed, step, b, NoiseStream::rotation);
        double th[3];
        for (int c = 0; c < 3; ++c) th[c] = mob_r_[b] * t[c] + amp_r_[b] * xr[static_cast<std::size_t>(c)];
        const double angle = std::sqrt(th[0] * th[0] + th[1] * th[1] + th[2] * th[2]);
        if (angle > 0) {
            // Rodrigues' rotation of every offset about the unit axis k by the angle.
            const double kx = th[0] / angle, ky = th[1] / angle, kz = th[2] / angle;
            const double cs = std::cos(angle), sn = std::sin(angle), one_c = 1 - cs;
            for (std::uint32_t k = b; k != npos; k = next_[k]) {
                const double vx = ox_[k], vy = oy_[k], vz = oz_[k];
                const double kv = kx * vx + ky * vy + kz * vz;
                ox_[k] = vx * cs + (ky * vz - kz * vy) * sn + kx * kv * one_c;
                oy_[k] = vy * cs + (kz * vx - kx * vz) * sn + ky * kv * one_c;
                oz_[k] = vz * cs + (kx * vy - ky * vx) * sn + kz * kv * one_c;
            }
        }
        cx_[b] = wrap(cx_[b] + mob_t_[b] * f[0] + amp_t_[b] * xi[0]);
        cy_[b] = wrap(cy_[b] + mob_t_[b] * f[1] + amp_t_[b] * xi[1]);
        cz_[b] = wrap(cz_[b] + mob_t_[b] * f[2] + amp_t_[b] * xi[2]);
        if (!std::isfinite(cx_[b] + cy_[b] + cz_[b] + angle)) bad = std::max(bad, std::int64_t(b));
        for (std::uint32_t k = b; k != npos; k = next_[k])
            start_[k] = {wrap(cx_[b] + ox_[k]), wrap(cy_[b] + oy_[k]), wrap(cz_[b] + oz_[k]), b, pos_[k].species};
        // The centre's move, for the displacement bound only (summed in another order).
        const double dcx = mob_t_[b] * f[0] + amp_t_[b] * xi[0], dcy = mob_t_[b] * f[1] + amp_t_[b] * xi[1],
                     dcz = mob_t_[b] * f[2] + amp_t_[b] * xi[2];
        const double move = std::sqrt(dcx * dcx + dcy * dcy + dcz * dcz) + angle * std::sqrt(reach_b2);
        largest_move2 = std::max(largest_move2, move * move);
    }
    // start_ now holds the new positions: swap, so that pos_ is the end of the move and
    // start_ its start.
    std::swap(pos_, start_);
    add_to_displacement_bounds(std::sqrt(largest_move2));
    if (bad >= 0)
        throw std::runtime_error("the position of body " + std::to_string(bad) + " became non-finite at step " +
                                 std::to_string(step_) + " (time step " + std::to_string(m.time_step.time_step_s) +
                                 " s): a force too large for the step");
}

}  // namespace brownfloc::sim
