// One engine step: forces, the Ermak-McCammon update of every body, then captures.
#include <cmath>
#include <stdexcept>
#include <string>

#include "sim/brownian_update.hpp"
#include "sim/engine.hpp"
#include "sim/philox_noise.hpp"

namespace brownfloc::sim {

namespace {
constexpr int omp_block = 256;
constexpr std::uint32_t npos = 0xFFFFFFFFu;

}  // namespace

void Engine::step() {
    // move_bodies checks the list against the motion of the step; captures shift bodies
    // afterwards, so after a step with captures the check is done again in full.
    if (moved_far_ || (captured_last_step_ && neighbour_list_stale())) build_neighbour_list();
    if (model_->any_interaction) compute_forces();
    move_bodies();
    detect_captures(candidates_);
    captured_last_step_ = !candidates_.empty();
    if (captured_last_step_) apply_captures(candidates_);
    ++step_;
}

void Engine::compute_forces() {
    const std::int64_t n = static_cast<std::int64_t>(radius_.size());
    const EngineModel& m = *model_;
    // One tabulated species pair and equal radii: the common case, without per-pair dispatch.
    const bool single = m.species_count == 1 && !m.radius_free && m.pair_tables[0] && min_radius_m_ == max_radius_m_;
    const potentials::TabulatedInteraction* table = single ? &*m.pair_tables[0] : nullptr;
    const double contact = 2 * max_radius_m_;
    const double reach = single ? contact + m.pair_kinds[0].cutoff_gap_m : 0.0;
    const double reach2 = reach * reach;
#pragma omp parallel for schedule(static, omp_block) if (n >= model_->parallel_min_items)
    for (std::int64_t ii = 0; ii < n; ++ii) {
        const std::size_t i = static_cast<std::size_t>(ii);
        const std::uint32_t bi = pos_[i].body;
        const double xi = pos_[i].x, yi = pos_[i].y, zi = pos_[i].z, ai = radius_[i];
        double fx = 0, fy = 0, fz = 0;
        for (std::uint64_t k = nbr_start_[i]; k < nbr_start_[i + 1]; ++k) {
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
        fx_[i] = fx;
        fy_[i] = fy;
        fz_[i] = fz;
    }
}

void Engine::move_bodies() {
    const EngineModel& m = *model_;
    const bool forces = m.any_interaction;
    const std::uint64_t seed = seed_, step = static_cast<std::uint64_t>(step_);
    const std::int64_t nb = static_cast<std::int64_t>(bodies_.size());
    std::int64_t bad = -1;
    int far = 0;
    const double limit = 0.5 * m.skin_m, limit2 = limit * limit;
    auto moved_far = [&](std::uint32_t k) {
        const double dx = fold(pos_[k].x - bx_[k]), dy = fold(pos_[k].y - by_[k]), dz = fold(pos_[k].z - bz_[k]);
        return dx * dx + dy * dy + dz * dz > limit2;
    };
#pragma omp parallel for schedule(static, omp_block) reduction(max : bad) reduction(| : far) if (nb >= model_->parallel_min_items)
    for (std::int64_t kk = 0; kk < nb; ++kk) {
        const std::uint32_t b = bodies_[static_cast<std::size_t>(kk)];
        const auto xi = standard_normals3(seed, step, b, NoiseStream::translation);
        if (size_[b] == 1) {
            px_[b] = pos_[b].x;
            py_[b] = pos_[b].y;
            pz_[b] = pos_[b].z;
            const Vec3 force = forces ? Vec3{fx_[b], fy_[b], fz_[b]} : Vec3{0, 0, 0};
            const Vec3 dr = monomer_displacement(mob_t_[b], amp_t_[b], force, xi);
            const double nx = wrap(cx_[b] + dr[0]), ny = wrap(cy_[b] + dr[1]),
                         nz = wrap(cz_[b] + dr[2]);
            if (!std::isfinite(nx + ny + nz)) bad = std::max(bad, std::int64_t(b));
            cx_[b] = pos_[b].x = nx;
            cy_[b] = pos_[b].y = ny;
            cz_[b] = pos_[b].z = nz;
            if (moved_far(b)) far = 1;
            continue;
        }
        // Rigid cluster: force and torque summed over members in id order.
        double f[3] = {0, 0, 0}, t[3] = {0, 0, 0};
        for (std::uint32_t k = b; k != npos; k = next_[k]) {
            px_[k] = pos_[k].x;
            py_[k] = pos_[k].y;
            pz_[k] = pos_[k].z;
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
        for (std::uint32_t k = b; k != npos; k = next_[k]) {
            set_position_from_body(k);
            if (moved_far(k)) far = 1;
        }
    }
    moved_far_ = far != 0;
    if (bad >= 0)
        throw std::runtime_error("the position of body " + std::to_string(bad) + " became non-finite at step " +
                                 std::to_string(step_) + " (time step " + std::to_string(m.time_step.time_step_s) +
                                 " s): a force too large for the step");
}

}  // namespace brownfloc::sim
