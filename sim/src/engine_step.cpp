// One engine step: forces, the Ermak-McCammon update of every body, then captures.
#include <cmath>
#include <stdexcept>
#include <string>

#include "sim/engine.hpp"
#include "sim/philox_noise.hpp"

namespace brownfloc::sim {

namespace {
constexpr int omp_block = 256;
constexpr std::uint32_t npos = 0xFFFFFFFFu;

inline double wrap(double c, double box, double inv_box) {
    c -= box * std::floor(c * inv_box);
    if (c >= box) c -= box;  // rounding of a tiny negative value
    return c;
}
}  // namespace

void Engine::step() {
    if (neighbour_list_stale()) build_neighbour_list();
    if (model_->any_interaction) compute_forces();
    move_bodies();
    detect_captures(candidates_);
    if (!candidates_.empty()) apply_captures(candidates_);
    ++step_;
}

void Engine::compute_forces() {
    const std::int64_t n = static_cast<std::int64_t>(radius_.size());
#pragma omp parallel for schedule(static, omp_block)
    for (std::int64_t ii = 0; ii < n; ++ii) {
        const std::size_t i = static_cast<std::size_t>(ii);
        const std::uint32_t bi = body_[i];
        const double xi = x_[i], yi = y_[i], zi = z_[i], ai = radius_[i];
        double fx = 0, fy = 0, fz = 0;
        for (std::uint64_t k = nbr_start_[i]; k < nbr_start_[i + 1]; ++k) {
            const std::uint32_t j = nbr_[k];
            if (body_[j] == bi) continue;
            double dx = x_[j] - xi, dy = y_[j] - yi, dz = z_[j] - zi;
            dx -= box_ * std::nearbyint(dx * inv_box_);
            dy -= box_ * std::nearbyint(dy * inv_box_);
            dz -= box_ * std::nearbyint(dz * inv_box_);
            const double r = std::sqrt(dx * dx + dy * dy + dz * dz);
            const double f = force_between(static_cast<std::uint32_t>(i), j, r - ai - radius_[j]);
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
    const std::uint64_t seed = m.seed, step = static_cast<std::uint64_t>(step_);
    const std::int64_t nb = static_cast<std::int64_t>(bodies_.size());
    std::int64_t bad = -1;
#pragma omp parallel for schedule(static, omp_block) reduction(max : bad)
    for (std::int64_t kk = 0; kk < nb; ++kk) {
        const std::uint32_t b = bodies_[static_cast<std::size_t>(kk)];
        const auto xi = standard_normals(seed, step, b, NoiseStream::translation);
        if (size_[b] == 1) {
            px_[b] = x_[b];
            py_[b] = y_[b];
            pz_[b] = z_[b];
            double dx = amp_t_[b] * xi[0], dy = amp_t_[b] * xi[1], dz = amp_t_[b] * xi[2];
            if (forces) {
                dx += mob_t_[b] * fx_[b];
                dy += mob_t_[b] * fy_[b];
                dz += mob_t_[b] * fz_[b];
            }
            const double nx = wrap(cx_[b] + dx, box_, inv_box_), ny = wrap(cy_[b] + dy, box_, inv_box_),
                         nz = wrap(cz_[b] + dz, box_, inv_box_);
            if (!std::isfinite(nx + ny + nz)) bad = std::max(bad, std::int64_t(b));
            cx_[b] = x_[b] = nx;
            cy_[b] = y_[b] = ny;
            cz_[b] = z_[b] = nz;
            continue;
        }
        // Rigid cluster: force and torque summed over members in id order.
        double f[3] = {0, 0, 0}, t[3] = {0, 0, 0};
        for (std::uint32_t k = b; k != npos; k = next_[k]) {
            px_[k] = x_[k];
            py_[k] = y_[k];
            pz_[k] = z_[k];
            if (!forces) continue;
            f[0] += fx_[k];
            f[1] += fy_[k];
            f[2] += fz_[k];
            t[0] += oy_[k] * fz_[k] - oz_[k] * fy_[k];
            t[1] += oz_[k] * fx_[k] - ox_[k] * fz_[k];
            t[2] += ox_[k] * fy_[k] - oy_[k] * fx_[k];
        }
        const auto xr = standard_normals(seed, step, b, NoiseStream::rotation);
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
        cx_[b] = wrap(cx_[b] + mob_t_[b] * f[0] + amp_t_[b] * xi[0], box_, inv_box_);
        cy_[b] = wrap(cy_[b] + mob_t_[b] * f[1] + amp_t_[b] * xi[1], box_, inv_box_);
        cz_[b] = wrap(cz_[b] + mob_t_[b] * f[2] + amp_t_[b] * xi[2], box_, inv_box_);
        if (!std::isfinite(cx_[b] + cy_[b] + cz_[b] + angle)) bad = std::max(bad, std::int64_t(b));
        for (std::uint32_t k = b; k != npos; k = next_[k]) set_position_from_body(k);
    }
    if (bad >= 0)
        throw std::runtime_error("the position of body " + std::to_string(bad) + " became non-finite at step " +
                                 std::to_string(step_) + " (time step " + std::to_string(m.time_step.time_step_s) +
                                 " s): a force too large for the step");
}

}  // namespace brownfloc::sim
