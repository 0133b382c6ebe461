// Capture and bonding. A pair of particles of different bodies is captured in a step when
// its gap ends at or below the capture gap h_c, or when it crossed h_c inside the step and
// came back out: for a Brownian bridge of the gap from x0 = h0 - h_c to x1 = h1 - h_c the
// crossing probability is exp(-x0 x1 / (D_rel dt)), D_rel the relative diffusion
// coefficient along the line of centres (the reflection principle; e.g. Karatzas & Shreve
// 1991, Brownian Motion and Stochastic Calculus, ch. 2.6 [memory for the section]; its use in
// Brownian dynamics: Strating 1999, Phys. Rev. E 59, 2175 [memory]). The uniform number for
// the test is keyed by (seed, step, smaller id, capture stream, larger id).
#include <algorithm>
#include <cmath>
#include <limits>

#include "sim/engine.hpp"
#include "sim/philox_noise.hpp"

namespace brownfloc::sim {

namespace {
constexpr int omp_block = 256;
constexpr std::uint32_t npos = 0xFFFFFFFFu;
constexpr int overlap_passes = 16;
}  // namespace

double Engine::effective_diffusion(std::uint32_t i, const Vec3& unit) const {
    const std::uint32_t b = body_[i];
    double d = diff_t_[b];
    if (size_[b] > 1) {
        // Rotation moves a member at offset o by dTheta x o: along the unit vector n its
        // variance rate is 2 D_r |o x n|^2.
        const double cx = oy_[i] * unit[2] - oz_[i] * unit[1];
        const double cy = oz_[i] * unit[0] - ox_[i] * unit[2];
        const double cz = ox_[i] * unit[1] - oy_[i] * unit[0];
        d += diff_r_[b] * (cx * cx + cy * cy + cz * cz);
    }
    return d;
}

void Engine::detect_captures(std::vector<Candidate>& out) {
    out.clear();
    const std::int64_t n = static_cast<std::int64_t>(radius_.size());
    const double dt = model_->time_step.time_step_s;
    const std::uint64_t seed = model_->seed, step = static_cast<std::uint64_t>(step_);
    double smallest = std::numeric_limits<double>::infinity();
#pragma omp parallel reduction(min : smallest)
    {
        std::vector<Candidate> local;
        std::vector<std::uint32_t> spanning;
#pragma omp for schedule(static, omp_block) nowait
        for (std::int64_t ii = 0; ii < n; ++ii) {
            const std::uint32_t i = static_cast<std::uint32_t>(ii);
            const std::uint32_t bi = body_[i];
            for (std::uint64_t k = nbr_start_[i]; k < nbr_start_[i + 1]; ++k) {
                const std::uint32_t j = nbr_[k];
                if (j <= i) continue;
                const double hc = capture_gap(i, j);
                const Vec3 d = minimum_image({x_[i], y_[i], z_[i]}, {x_[j], y_[j], z_[j]});
                const double r = std::sqrt(d[0] * d[0] + d[1] * d[1] + d[2] * d[2]);
                const double h1 = r - radius_[i] - radius_[j];
                if (body_[j] == bi) {
                    // Members of one body: a contact through the periodic boundary means the
                    // body meets its own image.
                    if (h1 <= hc) {
                        const double ex = ox_[j] - ox_[i] - d[0], ey = oy_[j] - oy_[i] - d[1], ez = oz_[j] - oz_[i] - d[2];
                        if (ex * ex + ey * ey + ez * ez > 0.25 * box_ * box_) spanning.push_back(bi);
                    }
                    continue;
                }
                smallest = std::min(smallest, h1 / std::min(radius_[i], radius_[j]));
                if (h1 <= hc) {
                    local.push_back({i, j, false});
                    continue;
                }
                const Vec3 unit{d[0] / r, d[1] / r, d[2] / r};
                const double d_rel = effective_diffusion(i, unit) + effective_diffusion(j, unit);
                const double x1 = h1 - hc;
                const double scale2 = d_rel * dt;
                if (x1 * x1 > 144.0 * scale2) continue;  // crossing probability < e^-40
                const Vec3 d0 = minimum_image({px_[i], py_[i], pz_[i]}, {px_[j], py_[j], pz_[j]});
                const double x0 = std::sqrt(d0[0] * d0[0] + d0[1] * d0[1] + d0[2] * d0[2]) - radius_[i] - radius_[j] - hc;
                const double p = x0 <= 0 ? 1.0 : std::exp(-x0 * x1 / scale2);
                if (p < 1e-18) continue;
                const auto bits = philox_block(seed, step, i, NoiseStream::capture, j);
                if (uniform_open01(bits[0]) < p) local.push_back({i, j, true});
            }
        }
#pragma omp critical(brownfloc_capture_merge)
        {
            out.insert(out.end(), local.begin(), local.end());
            for (std::uint32_t b : spanning) spans_[b] = 1;
            if (!spanning.empty() && first_spanning_step_ < 0) first_spanning_step_ = step_;
        }
    }
    std::sort(out.begin(), out.end(), [](const Candidate& a, const Candidate& b) {
        return a.i != b.i ? a.i < b.i : a.j < b.j;
    });
    min_relative_gap_ = smallest;
    min_relative_gap_ever_ = std::min(min_relative_gap_ever_, smallest);
}

void Engine::shift_body(std::uint32_t b, const Vec3& s) {
    cx_[b] += s[0];
    cy_[b] += s[1];
    cz_[b] += s[2];
    for (std::uint32_t k = b; k != npos; k = next_[k]) set_position_from_body(k);
    cx_[b] -= box_ * std::floor(cx_[b] * inv_box_);
    cy_[b] -= box_ * std::floor(cy_[b] * inv_box_);
    cz_[b] -= box_ * std::floor(cz_[b] * inv_box_);
}

void Engine::apply_captures(std::vector<Candidate>& candidates) {
    std::vector<std::uint32_t> moved;
    for (int pass = 0; pass < overlap_passes && !candidates.empty(); ++pass) {
        moved.clear();
        for (const Candidate& c : candidates) {
            const std::uint32_t i = c.i, j = c.j;
            const std::uint32_t bi = body_[i], bj = body_[j];
            if (bi == bj) continue;
            const double R = radius_[i] + radius_[j] + capture_gap(i, j);
            const Vec3 d_now = minimum_image({x_[i], y_[i], z_[i]}, {x_[j], y_[j], z_[j]});
            const double r_now = std::sqrt(d_now[0] * d_now[0] + d_now[1] * d_now[1] + d_now[2] * d_now[2]);
            bool placed = false;
            if (r_now < R && pass == 0) {
                // Back both bodies along their displacements of this step to the moment the
                // pair reached the capture distance: |d_prev + s (u_j - u_i)| = R.
                const Vec3 ui = minimum_image({px_[i], py_[i], pz_[i]}, {x_[i], y_[i], z_[i]});
                const Vec3 uj = minimum_image({px_[j], py_[j], pz_[j]}, {x_[j], y_[j], z_[j]});
                const Vec3 del{uj[0] - ui[0], uj[1] - ui[1], uj[2] - ui[2]};
                const Vec3 dp{d_now[0] - del[0], d_now[1] - del[1], d_now[2] - del[2]};
                const double qa = del[0] * del[0] + del[1] * del[1] + del[2] * del[2];
                const double qb = dp[0] * del[0] + dp[1] * del[1] + dp[2] * del[2];
                const double qc = dp[0] * dp[0] + dp[1] * dp[1] + dp[2] * dp[2] - R * R;
                const double disc = qb * qb - qa * qc;
                if (qa > 0 && qc >= 0 && disc >= 0) {
                    const double s = std::clamp((-qb - std::sqrt(disc)) / qa, 0.0, 1.0);
                    const double back = 1.0 - s;
                    shift_body(bi, {-back * ui[0], -back * ui[1], -back * ui[2]});
                    shift_body(bj, {-back * uj[0], -back * uj[1], -back * uj[2]});
                    placed = true;
                }
            }
            if (!placed && r_now > 0) {
                // Along the line of centres to the capture distance, shared by mobility.
                const double excess = r_now - R;
                const double wi = diff_t_[bi] / (diff_t_[bi] + diff_t_[bj]), wj = 1.0 - wi;
                const Vec3 u{d_now[0] / r_now, d_now[1] / r_now, d_now[2] / r_now};
                shift_body(bi, {excess * wi * u[0], excess * wi * u[1], excess * wi * u[2]});
                shift_body(bj, {-excess * wj * u[0], -excess * wj * u[1], -excess * wj * u[2]});
            }
            captures_.push_back({step_, i, j, bi, bj, size_[bi], size_[bj], c.by_bridge});
            merge_bodies(i, j);
            moved.push_back(body_[i]);
        }
        // Shifts can bring other pairs inside their capture gap: bond those too, at contact.
        candidates.clear();
        std::sort(moved.begin(), moved.end());
        moved.erase(std::unique(moved.begin(), moved.end()), moved.end());
        for (std::uint32_t b0 : moved) {
            const std::uint32_t b = body_[b0];
            for (std::uint32_t m = b; m != npos; m = next_[m])
                for (std::uint64_t k = nbr_start_[m]; k < nbr_start_[m + 1]; ++k) {
                    const std::uint32_t o = nbr_[k];
                    if (body_[o] == b) continue;
                    const Vec3 d = minimum_image({x_[m], y_[m], z_[m]}, {x_[o], y_[o], z_[o]});
                    const double gap = std::sqrt(d[0] * d[0] + d[1] * d[1] + d[2] * d[2]) - radius_[m] - radius_[o];
                    if (gap < capture_gap(m, o) * (1 - 1e-9)) candidates.push_back({std::min(m, o), std::max(m, o), false});
                }
        }
        std::sort(candidates.begin(), candidates.end(), [](const Candidate& a, const Candidate& b) {
            return a.i != b.i ? a.i < b.i : a.j < b.j;
        });
        candidates.erase(std::unique(candidates.begin(), candidates.end(),
                                     [](const Candidate& a, const Candidate& b) { return a.i == b.i && a.j == b.j; }),
                         candidates.end());
    }
    // Bodies absorbed into others leave the list.
    bodies_.erase(std::remove_if(bodies_.begin(), bodies_.end(), [&](std::uint32_t b) { return body_[b] != b; }),
                  bodies_.end());
}

void Engine::merge_bodies(std::uint32_t i, std::uint32_t j) {
    std::uint32_t keep = body_[i], gone = body_[j];
    std::uint32_t p = i, q = j;  // p in keep, q in gone
    if (gone < keep) {
        std::swap(keep, gone);
        std::swap(p, q);
    }
    // Offsets of the absorbed members in the kept body's frame, through the contact pair.
    const Vec3 d = minimum_image({x_[p], y_[p], z_[p]}, {x_[q], y_[q], z_[q]});
    const double qx = ox_[q], qy = oy_[q], qz = oz_[q];
    for (std::uint32_t k = gone; k != npos; k = next_[k]) {
        ox_[k] = ox_[p] + d[0] + (ox_[k] - qx);
        oy_[k] = oy_[p] + d[1] + (oy_[k] - qy);
        oz_[k] = oz_[p] + d[2] + (oz_[k] - qz);
        body_[k] = keep;
    }
    // Merge the two member lists, keeping id order.
    std::uint32_t a = keep, b = gone, head = npos, tail = npos;
    while (a != npos || b != npos) {
        std::uint32_t take;
        if (b == npos || (a != npos && a < b)) { take = a; a = next_[a]; }
        else { take = b; b = next_[b]; }
        if (tail == npos) head = take; else next_[tail] = take;
        tail = take;
    }
    next_[tail] = npos;
    (void)head;  // == keep, the smallest id
    size_[keep] += size_[gone];
    size_[gone] = 0;
    spans_[keep] = static_cast<std::uint8_t>(spans_[keep] | spans_[gone]);
    // New centre: the a^3-weighted mean of the member centres.
    double w = 0, mx = 0, my = 0, mz = 0;
    for (std::uint32_t k = keep; k != npos; k = next_[k]) {
        const double v = radius_[k] * radius_[k] * radius_[k];
        w += v;
        mx += v * ox_[k];
        my += v * oy_[k];
        mz += v * oz_[k];
    }
    mx /= w;
    my /= w;
    mz /= w;
    for (std::uint32_t k = keep; k != npos; k = next_[k]) {
        ox_[k] -= mx;
        oy_[k] -= my;
        oz_[k] -= mz;
    }
    cx_[keep] += mx;
    cy_[keep] += my;
    cz_[keep] += mz;
    for (std::uint32_t k = keep; k != npos; k = next_[k]) set_position_from_body(k);
    cx_[keep] -= box_ * std::floor(cx_[keep] * inv_box_);
    cy_[keep] -= box_ * std::floor(cy_[keep] * inv_box_);
    cz_[keep] -= box_ * std::floor(cz_[keep] * inv_box_);
    update_mobility(keep);
}

void Engine::bond_initial_contacts() {
    std::vector<Candidate> found;
    const std::uint32_t n = static_cast<std::uint32_t>(radius_.size());
    for (std::uint32_t i = 0; i < n; ++i)
        for (std::uint64_t k = nbr_start_[i]; k < nbr_start_[i + 1]; ++k) {
            const std::uint32_t j = nbr_[k];
            if (j <= i) continue;
            const Vec3 d = minimum_image({x_[i], y_[i], z_[i]}, {x_[j], y_[j], z_[j]});
            const double gap = std::sqrt(d[0] * d[0] + d[1] * d[1] + d[2] * d[2]) - radius_[i] - radius_[j];
            if (gap <= capture_gap(i, j)) found.push_back({i, j, false});
        }
    for (const Candidate& c : found) {
        if (body_[c.i] == body_[c.j]) continue;
        merge_bodies(c.i, c.j);
        ++bonded_at_start_;
    }
    bodies_.erase(std::remove_if(bodies_.begin(), bodies_.end(), [&](std::uint32_t b) { return body_[b] != b; }),
                  bodies_.end());
    px_ = x_;
    py_ = y_;
    pz_ = z_;
}

}  // namespace brownfloc::sim
