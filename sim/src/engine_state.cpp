// Saving and restoring the engine's state (checkpoints).
#include "sim/engine_state.hpp"

#include <algorithm>
#include <limits>
#include <stdexcept>
#include <string>

namespace brownfloc::sim {

namespace {
template <class T, class U>
std::vector<T> copy_of(const U& v) {
    return std::vector<T>(v.begin(), v.end());
}
template <class Array, class V>
void assign(Array& a, const V& v) {
    a.assign(v.begin(), v.end());
}
}  // namespace

EngineState Engine::state() const {
    EngineState s;
    s.seed = seed_;
    s.step = step_;
    s.bonded_at_start = bonded_at_start_;
    s.list_builds = list_builds_;
    s.first_spanning_step = first_spanning_step_;
    s.box_length_m = box_;
    s.max_member_diffusion_m2_per_s = max_member_diffusion_;
    s.min_relative_gap_last_step = min_relative_gap_;
    s.min_relative_gap_ever = min_relative_gap_ever_;
    const std::size_t n = pos_.size();
    s.x_m.resize(n);
    s.y_m.resize(n);
    s.z_m.resize(n);
    s.body.resize(n);
    s.species.resize(n);
    for (std::size_t i = 0; i < n; ++i) {
        s.x_m[i] = pos_[i].x;
        s.y_m[i] = pos_[i].y;
        s.z_m[i] = pos_[i].z;
        s.body[i] = pos_[i].body;
        s.species[i] = pos_[i].species;
    }
    s.next_member = copy_of<std::uint32_t>(next_);
    s.radius_m = copy_of<double>(radius_);
    s.list_x_m = copy_of<double>(bx_);
    s.list_y_m = copy_of<double>(by_);
    s.list_z_m = copy_of<double>(bz_);
    s.offset_x_m = copy_of<double>(ox_);
    s.offset_y_m = copy_of<double>(oy_);
    s.offset_z_m = copy_of<double>(oz_);
    // A monomer's centre is its position (cx_ is stale for monomers): store the position, so
    // that the saved state does not depend on when a monomer was last synced.
    s.centre_x_m = copy_of<double>(cx_);
    s.centre_y_m = copy_of<double>(cy_);
    s.centre_z_m = copy_of<double>(cz_);
    for (std::size_t i = 0; i < n; ++i)
        if (size_[i] == 1) {
            s.centre_x_m[i] = pos_[i].x;
            s.centre_y_m[i] = pos_[i].y;
            s.centre_z_m[i] = pos_[i].z;
        }
    s.body_size = copy_of<std::uint32_t>(size_);
    s.diffusion_t_m2_per_s = copy_of<double>(diff_t_);
    s.diffusion_r_per_s = copy_of<double>(diff_r_);
    s.hydrodynamic_radius_m = copy_of<double>(hydro_radius_);
    s.amplitude_t_m = copy_of<double>(amp_t_);
    s.amplitude_r = copy_of<double>(amp_r_);
    s.mobility_t_m_per_N = copy_of<double>(mob_t_);
    s.mobility_r_per_N_m = copy_of<double>(mob_r_);
    s.spans_box = copy_of<std::uint8_t>(spans_);
    s.bodies = bodies_;
    s.captures = captures_;
    return s;
}

Engine::Engine(std::shared_ptr<const EngineModel> model, const EngineState& s) : model_(std::move(model)), seed_(s.seed) {
    const std::size_t n = s.radius_m.size();
    auto fits = [n](const auto&... v) { return ((v.size() == n) && ...); };
    if (n == 0 || n >= (std::size_t{1} << 28) ||
        !fits(s.x_m, s.y_m, s.z_m, s.body, s.species, s.next_member, s.list_x_m, s.list_y_m, s.list_z_m, s.offset_x_m,
              s.offset_y_m, s.offset_z_m, s.centre_x_m, s.centre_y_m, s.centre_z_m, s.body_size, s.diffusion_t_m2_per_s,
              s.diffusion_r_per_s, s.hydrodynamic_radius_m, s.amplitude_t_m, s.amplitude_r, s.mobility_t_m_per_N,
              s.mobility_r_per_N_m, s.spans_box) ||
        s.bodies.empty() || s.bodies.size() > n || !(s.box_length_m > 0))
        throw std::invalid_argument("engine state: arrays of inconsistent length or no particles");
    for (std::size_t i = 0; i < n; ++i)
        if (s.species[i] >= model_->species_count || s.body[i] >= n || !(s.radius_m[i] > 0))
            throw std::invalid_argument("engine state: particle " + std::to_string(i) + " has a species, body or radius out of range");
    box_ = s.box_length_m;
    inv_box_ = 1.0 / box_;
    half_box_ = 0.5 * box_;
    step_ = s.step;
    bonded_at_start_ = s.bonded_at_start;
    first_spanning_step_ = s.first_spanning_step;
    max_member_diffusion_ = s.max_member_diffusion_m2_per_s;
    min_relative_gap_ = s.min_relative_gap_last_step;
    min_relative_gap_ever_ = s.min_relative_gap_ever;
    pos_.resize(n);
    start_.resize(n);
    for (std::size_t i = 0; i < n; ++i) pos_[i] = {s.x_m[i], s.y_m[i], s.z_m[i], s.body[i], s.species[i]};
    assign(next_, s.next_member);
    assign(radius_, s.radius_m);
    assign(ox_, s.offset_x_m);
    assign(oy_, s.offset_y_m);
    assign(oz_, s.offset_z_m);
    assign(cx_, s.centre_x_m);
    assign(cy_, s.centre_y_m);
    assign(cz_, s.centre_z_m);
    assign(size_, s.body_size);
    assign(diff_t_, s.diffusion_t_m2_per_s);
    assign(diff_r_, s.diffusion_r_per_s);
    assign(hydro_radius_, s.hydrodynamic_radius_m);
    assign(amp_t_, s.amplitude_t_m);
    assign(amp_r_, s.amplitude_r);
    assign(mob_t_, s.mobility_t_m_per_N);
    assign(mob_r_, s.mobility_r_per_N_m);
    assign(spans_, s.spans_box);
    bodies_ = s.bodies;
    captures_ = s.captures;
    fx_.assign(n, 0.0);
    fy_.assign(n, 0.0);
    fz_.assign(n, 0.0);
    bx_.resize(n);
    by_.resize(n);
    bz_.resize(n);
    max_radius_m_ = *std::max_element(radius_.begin(), radius_.end());
    min_radius_m_ = *std::min_element(radius_.begin(), radius_.end());
    list_radius_extra_m_ = model_->max_cutoff_gap_m() + model_->skin_m;
    // The list as it was built: from the positions of its last build, in the same order.
    for (std::size_t i = 0; i < n; ++i) {
        pos_[i].x = s.list_x_m[i];
        pos_[i].y = s.list_y_m[i];
        pos_[i].z = s.list_z_m[i];
    }
    build_neighbour_list();
    for (std::size_t i = 0; i < n; ++i) {
        pos_[i].x = s.x_m[i];
        pos_[i].y = s.y_m[i];
        pos_[i].z = s.z_m[i];
    }
    list_builds_ = s.list_builds;
    // Check the list against the real positions before the first step (same decision as
    // in the run that saved the state: the bound there never exceeded the true move).
    displacement_bound_m_ = std::numeric_limits<double>::infinity();
}

}  // namespace brownfloc::sim
