// Capture and bonding (the rule itself is in capture_rule.hpp). The uniform number for the
// bridge test is keyed by (seed, step, smaller id, capture stream, larger id).
#include <algorithm>
#include <cmath>
#include <limits>

#include "sim/capture_rule.hpp"
#include "sim/engine.hpp"
#include "sim/philox_noise.hpp"

namespace brownfloc::sim {

namespace {
constexpr int omp_block = 256;
constexpr std::uint32_t npos = 0xFFFFFFFFu;
constexpr int overlap_passes = 16;

// The share of a shift taken by the first of two bodies: its part of the summed mobility
// (half each when both are immobile, e.g. two box-spanning networks).
double share(double d_first, double d_second) {
    return d_first + d_second > 0 ? d_first / (d_first + d_second) : 0.5;
}
}  // namespace

double Engine::effective_diffusion(std::uint32_t i, const Vec3& unit) const {
    const std::uint32_t b = pos_[i].body;
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

double Engine::capture_reach_m() const {
    // No pair farther than this can be captured in this step: the largest capture distance
    // plus the bridge range of the fastest member (a monomer of the smallest radius, or a
    // cluster member far from its centre: D_t + D_r |o|^2, the rotation included).
    const double d_rel_max = 2 * max_member_diffusion_;
    return 2 * max_radius_m_ + model_->max_capture_gap_m() +
           12.0 * std::sqrt(d_rel_max * model_->time_step.time_step_s) * 1.01;
}

void Engine::build_capture_pairs(double reach_m) {
    // Pairs of the neighbour list closer than the capture reach plus 1.5 skins: while no
    // particle has moved more than (range - reach) / 2 since, every listed pair that can be
    // within reach is among them. Same-body pairs stay in: they reveal spanning bodies.
    capture_list_range_m_ = reach_m + 1.5 * model_->skin_m;
    capture_list_bound_m_ = 0;
    const double range2 = capture_list_range_m_ * capture_list_range_m_;
    capture_pairs_.clear();
    const std::uint32_t n = static_cast<std::uint32_t>(radius_.size());
    for (std::uint32_t i = 0; i < n; ++i)
        for (std::uint64_t k = nbr_start_[i]; k < nbr_upper_end_[i]; ++k) {
            const std::uint32_t j = nbr_[k];
            const double dx = fold(pos_[j].x - pos_[i].x), dy = fold(pos_[j].y - pos_[i].y), dz = fold(pos_[j].z - pos_[i].z);
            if (dx * dx + dy * dy + dz * dz <= range2) capture_pairs_.push_back({i, j});
        }
}

void Engine::detect_captures(std::vector<Candidate>& out) {
    out.clear();
    const double dt = model_->time_step.time_step_s;
    const std::uint64_t seed = seed_, step = static_cast<std::uint64_t>(step_);
    double smallest = std::numeric_limits<double>::infinity();
    std::vector<std::uint32_t> spanning_found;
    const double reach = capture_reach_m();
    const double reach2 = reach * reach;
    // The pairs any particle's motion since the capture list was made could have brought within reach.
    if (reach + 2 * capture_list_bound_m_ > capture_list_range_m_) build_capture_pairs(reach);
    const std::int64_t pairs = static_cast<std::int64_t>(capture_pairs_.size());
#pragma omp parallel reduction(min : smallest) if (pairs >= model_->parallel_min_items)
    {
        std::vector<Candidate> local;
        std::vector<std::uint32_t> spanning;
#pragma omp for schedule(static, omp_block) nowait
        for (std::int64_t kk = 0; kk < pairs; ++kk) {
            const std::size_t k = static_cast<std::size_t>(kk);
            if (k + prefetch_ahead < capture_pairs_.size()) __builtin_prefetch(&pos_[capture_pairs_[k + prefetch_ahead][1]]);
            const std::uint32_t i = capture_pairs_[k][0];
            const std::uint32_t j = capture_pairs_[k][1];
            const Vec3 d = minimum_image({pos_[i].x, pos_[i].y, pos_[i].z}, {pos_[j].x, pos_[j].y, pos_[j].z});
            const double r2 = d[0] * d[0] + d[1] * d[1] + d[2] * d[2];
            if (r2 > reach2) continue;  // too far for a capture or a bridge crossing
            const std::uint32_t bi = pos_[i].body;
            const double hc = capture_gap(i, j);
            const double r = std::sqrt(r2);
            const double h1 = r - radius_[i] - radius_[j];
            if (pos_[j].body == bi) {
                // Members of one body: a contact through the periodic boundary means the
                // body meets its own image.
                if (h1 <= hc) {
                    const double ex = ox_[j] - ox_[i] - d[0], ey = oy_[j] - oy_[i] - d[1], ez = oz_[j] - oz_[i] - d[2];
                    if (ex * ex + ey * ey + ez * ez > 0.25 * box_ * box_) spanning.push_back(bi);
                }
                continue;
            }
            if (h1 <= hc) {
                local.push_back({i, j, false});
                continue;
            }
            smallest = std::min(smallest, h1 / std::min(radius_[i], radius_[j]));
            const Vec3 unit{d[0] / r, d[1] / r, d[2] / r};
            const double d_rel = effective_diffusion(i, unit) + effective_diffusion(j, unit);
            const double x1 = h1 - hc;
            if (!bridge_crossing_possible(x1, d_rel, dt)) continue;
            const Vec3 d0 = minimum_image({start_[i].x, start_[i].y, start_[i].z}, {start_[j].x, start_[j].y, start_[j].z});
            const double x0 = std::sqrt(d0[0] * d0[0] + d0[1] * d0[1] + d0[2] * d0[2]) - radius_[i] - radius_[j] - hc;
            const double p = bridge_crossing_probability(x0, x1, d_rel, dt);
            if (p < 1e-18) continue;
            const auto bits = philox_block(seed, step, i, NoiseStream::capture, j);
            if (uniform_open01(bits[0]) < p) local.push_back({i, j, true});
        }
#pragma omp critical(brownfloc_capture_merge)
        {
            out.insert(out.end(), local.begin(), local.end());
            spanning_found.insert(spanning_found.end(), spanning.begin(), spanning.end());
        }
    }
    std::sort(out.begin(), out.end(), &Engine::by_pair);
    std::sort(spanning_found.begin(), spanning_found.end());
    for (std::uint32_t b : spanning_found) {
        if (spans_[b]) continue;
        spans_[b] = 1;
        update_mobility(b);  // now immobile
        if (first_spanning_step_ < 0) first_spanning_step_ = step_;
    }
    min_relative_gap_ = smallest;
    min_relative_gap_ever_ = std::min(min_relative_gap_ever_, smallest);
}

void Engine::shift_body(std::uint32_t b, const Vec3& s) {
    add_to_displacement_bounds(std::sqrt(s[0] * s[0] + s[1] * s[1] + s[2] * s[2]));
    sync_monomer_centre(b);
    cx_[b] += s[0];
    cy_[b] += s[1];
    cz_[b] += s[2];
    for (std::uint32_t k = b; k != npos; k = next_[k]) set_position_from_body(k);
    cx_[b] = wrap(cx_[b]);
    cy_[b] = wrap(cy_[b]);
    cz_[b] = wrap(cz_[b]);
}

void Engine::apply_captures(std::vector<Candidate>& candidates) {
    std::vector<std::uint32_t> moved;
    for (int pass = 0; pass < overlap_passes && !candidates.empty(); ++pass) {
        moved.clear();
        for (const Candidate& c : candidates) {
            const std::uint32_t i = c.i, j = c.j;
            const std::uint32_t bi = pos_[i].body, bj = pos_[j].body;
            if (bi == bj) continue;
            const double R = radius_[i] + radius_[j] + capture_gap(i, j);
            const Vec3 d_now = minimum_image({pos_[i].x, pos_[i].y, pos_[i].z}, {pos_[j].x, pos_[j].y, pos_[j].z});
            const double r_now = std::sqrt(d_now[0] * d_now[0] + d_now[1] * d_now[1] + d_now[2] * d_now[2]);
            bool placed = false;
            Vec3 away{0, 0, 0};  // direction in which j's body leaves i's body if other pairs overlap
            if (r_now < R && pass == 0) {
                // Back both bodies along their displacements of this step to the moment the
                // pair reached the capture distance: |d_prev + s (u_j - u_i)| = R.
                const Vec3 ui = minimum_image({start_[i].x, start_[i].y, start_[i].z}, {pos_[i].x, pos_[i].y, pos_[i].z});
                const Vec3 uj = minimum_image({start_[j].x, start_[j].y, start_[j].z}, {pos_[j].x, pos_[j].y, pos_[j].z});
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
                    const double norm = std::sqrt(qa);
                    away = {-del[0] / norm, -del[1] / norm, -del[2] / norm};
                    placed = true;
                }
            }
            if (!placed && r_now > 0) {
                // Along the line of centres to the capture distance, shared by mobility.
                const double excess = r_now - R;
                const double wi = share(diff_t_[bi], diff_t_[bj]), wj = 1.0 - wi;
                const Vec3 u{d_now[0] / r_now, d_now[1] / r_now, d_now[2] / r_now};
                shift_body(bi, {excess * wi * u[0], excess * wi * u[1], excess * wi * u[2]});
                shift_body(bj, {-excess * wj * u[0], -excess * wj * u[1], -excess * wj * u[2]});
                away = u;
            }
            separate_other_contacts(bi, bj, away);
            captures_.push_back({step_, i, j, bi, bj, size_[bi], size_[bj], c.by_bridge});
            merge_bodies(i, j);
            moved.push_back(pos_[i].body);
        }
        // Shifts can bring other pairs inside their capture gap: bond those too, at contact.
        candidates.clear();
        std::sort(moved.begin(), moved.end());
        moved.erase(std::unique(moved.begin(), moved.end()), moved.end());
        for (std::uint32_t b0 : moved) {
            const std::uint32_t b = pos_[b0].body;
            for (std::uint32_t m = b; m != npos; m = next_[m])
                for (std::uint64_t k = nbr_start_[m]; k < nbr_start_[m + 1]; ++k) {
                    const std::uint32_t o = nbr_[k];
                    if (pos_[o].body == b) continue;
                    if (gap_m(m, o) < capture_gap(m, o) * (1 - 1e-9)) candidates.push_back({std::min(m, o), std::max(m, o), false});
                }
        }
        std::sort(candidates.begin(), candidates.end(), &Engine::by_pair);
        candidates.erase(std::unique(candidates.begin(), candidates.end(),
                                     [](const Candidate& a, const Candidate& b) { return a.i == b.i && a.j == b.j; }),
                         candidates.end());
    }
    drop_absorbed_bodies();
}

void Engine::separate_other_contacts(std::uint32_t bi, std::uint32_t bj, const Vec3& away) {
    // Two bodies about to merge may touch through more than the capture pair (clusters meet
    // at several points): move body bj along `away` (and bi against it, shared by mobility)
    // until no pair between them is inside its capture distance, the deepest pair first.
    constexpr int max_rounds = 32;
    const std::uint32_t small = size_[bi] <= size_[bj] ? bi : bj;
    const double wi = share(diff_t_[bi], diff_t_[bj]), wj = 1.0 - wi;
    for (int round = 0; round < max_rounds; ++round) {
        double worst = 0, t_needed = 0;
        for (std::uint32_t m = small; m != npos; m = next_[m])
            for (std::uint64_t k = nbr_start_[m]; k < nbr_start_[m + 1]; ++k) {
                const std::uint32_t o = nbr_[k];
                const std::uint32_t bo = pos_[o].body;
                if (bo == pos_[m].body || (bo != bi && bo != bj)) continue;
                const std::uint32_t p = pos_[m].body == bi ? m : o, q = p == m ? o : m;  // p in bi, q in bj
                const Vec3 d = minimum_image({pos_[p].x, pos_[p].y, pos_[p].z}, {pos_[q].x, pos_[q].y, pos_[q].z});
                const double R = radius_[p] + radius_[q] + capture_gap(p, q);
                const double d2 = d[0] * d[0] + d[1] * d[1] + d[2] * d[2];
                const double depth = R * (1 - 1e-9) - std::sqrt(d2);
                if (depth <= worst) continue;
                // Smallest t > 0 with |d + t away| = R (away is a unit vector).
                const double b = d[0] * away[0] + d[1] * away[1] + d[2] * away[2];
                const double t = -b + std::sqrt(std::max(0.0, b * b - (d2 - R * R)));
                worst = depth;
                t_needed = t;
            }
        if (worst <= 0) return;
        shift_body(bi, {-wi * t_needed * away[0], -wi * t_needed * away[1], -wi * t_needed * away[2]});
        shift_body(bj, {wj * t_needed * away[0], wj * t_needed * away[1], wj * t_needed * away[2]});
    }
}

bool Engine::by_pair(const Candidate& a, const Candidate& b) { return a.i != b.i ? a.i < b.i : a.j < b.j; }

void Engine::drop_absorbed_bodies() {
    bodies_.erase(std::remove_if(bodies_.begin(), bodies_.end(), [&](std::uint32_t b) { return pos_[b].body != b; }),
                  bodies_.end());
}

void Engine::merge_bodies(std::uint32_t i, std::uint32_t j) {
    std::uint32_t keep = pos_[i].body, gone = pos_[j].body;
    std::uint32_t p = i, q = j;  // p in keep, q in gone
    if (gone < keep) {
        std::swap(keep, gone);
        std::swap(p, q);
    }
    sync_monomer_centre(keep);
    // Offsets of the absorbed members in the kept body's frame, through the contact pair.
    const Vec3 d = minimum_image({pos_[p].x, pos_[p].y, pos_[p].z}, {pos_[q].x, pos_[q].y, pos_[q].z});
    const double qx = ox_[q], qy = oy_[q], qz = oz_[q];
    for (std::uint32_t k = gone; k != npos; k = next_[k]) {
        ox_[k] = ox_[p] + d[0] + (ox_[k] - qx);
        oy_[k] = oy_[p] + d[1] + (oy_[k] - qy);
        oz_[k] = oz_[p] + d[2] + (oz_[k] - qz);
        pos_[k].body = keep;
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
    cx_[keep] = wrap(cx_[keep]);
    cy_[keep] = wrap(cy_[keep]);
    cz_[keep] = wrap(cz_[keep]);
    update_mobility(keep);
}

void Engine::bond_initial_contacts() {
    std::vector<Candidate> found;
    const std::uint32_t n = static_cast<std::uint32_t>(radius_.size());
    for (std::uint32_t i = 0; i < n; ++i)
        for (std::uint64_t k = nbr_start_[i]; k < nbr_start_[i + 1]; ++k) {
            const std::uint32_t j = nbr_[k];
            if (j <= i) continue;
            if (gap_m(i, j) <= capture_gap(i, j)) found.push_back({i, j, false});
        }
    for (const Candidate& c : found) {
        if (pos_[c.i].body == pos_[c.j].body) continue;
        merge_bodies(c.i, c.j);
        ++bonded_at_start_;
    }
    drop_absorbed_bodies();
    start_ = pos_;
}

}  // namespace brownfloc::sim
