#include "sim/engine.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <stdexcept>
#include <string>

#include "analysis/cluster_geometry.hpp"
#include "potentials/constants.hpp"
#include "sim/philox_noise.hpp"

namespace brownfloc::sim {

namespace {
constexpr std::uint32_t npos = std::numeric_limits<std::uint32_t>::max();
constexpr double pi = potentials::constants::pi;
}  // namespace

Engine::Engine(std::shared_ptr<const EngineModel> model, InitialParticles particles, std::optional<std::uint64_t> seed)
    : model_(std::move(model)), seed_(seed.value_or(model_->seed)) {
    const std::size_t n = particles.radii_m.size();
    if (n == 0 || particles.positions_m.size() != n || particles.species.size() != n)
        throw std::invalid_argument("Engine: positions, radii and species must have the same, non-zero length");
    if (n >= (std::size_t{1} << 28)) throw std::invalid_argument("Engine: at most 2^28 particles");
    box_ = particles.box_length_m;
    inv_box_ = 1.0 / box_;
    half_box_ = 0.5 * box_;
    auto resize = [n](auto&... v) { (v.resize(n), ...); };
    resize(pos_, start_, bx_, by_, bz_, ox_, oy_, oz_, fx_, fy_, fz_, radius_, next_,
           cx_, cy_, cz_, size_, diff_t_, diff_r_, hydro_radius_, spans_, amp_t_, amp_r_, mob_t_, mob_r_);
    bodies_.resize(n);
    for (std::uint32_t i = 0; i < n; ++i) {
        const Vec3& p = particles.positions_m[i];
        pos_[i].x = cx_[i] = p[0];
        pos_[i].y = cy_[i] = p[1];
        pos_[i].z = cz_[i] = p[2];
        ox_[i] = oy_[i] = oz_[i] = 0.0;
        radius_[i] = particles.radii_m[i];
        pos_[i].species = particles.species[i];
        pos_[i].body = i;
        next_[i] = npos;
        size_[i] = 1;
        spans_[i] = 0;
        bodies_[i] = i;
    }
    max_radius_m_ = *std::max_element(radius_.begin(), radius_.end());
    min_radius_m_ = *std::min_element(radius_.begin(), radius_.end());
    for (std::uint32_t i = 0; i < n; ++i) update_mobility(i);
    list_radius_extra_m_ = model_->max_cutoff_gap_m() + model_->skin_m;
    build_neighbour_list();
    bond_initial_contacts();
    min_relative_gap_ever_ = std::numeric_limits<double>::infinity();
}

std::vector<std::uint32_t> Engine::members(std::uint32_t b) const {
    std::vector<std::uint32_t> out;
    out.reserve(size_[b]);
    for (std::uint32_t k = b; k != npos; k = next_[k]) out.push_back(k);
    return out;
}

std::vector<Vec3> Engine::unwrapped_members_m(std::uint32_t b) const {
    std::vector<Vec3> out;
    out.reserve(size_[b]);
    if (size_[b] == 1) return {position_m(b)};  // a monomer's centre is its position (cx_ is not kept)
    for (std::uint32_t k = b; k != npos; k = next_[k]) out.push_back({cx_[b] + ox_[k], cy_[b] + oy_[k], cz_[b] + oz_[k]});
    return out;
}

void Engine::update_mobility(std::uint32_t b) {
    const EngineModel& m = *model_;
    const double eta = m.viscosity_Pa_s, kT = m.kT_J, dt = m.time_step.time_step_s;
    double zeta_t = 0, zeta_r = 0, r_h = radius_[b];
    if (size_[b] == 1) {
        zeta_t = 6 * pi * eta * r_h;
        zeta_r = 8 * pi * eta * r_h * r_h * r_h;
    } else if (m.cluster_mobility == ClusterMobility::free_draining) {
        // Free-draining beads: frictions add; the rotational friction is the orientation
        // average (2/3)|o|^2 of each bead's translational friction about the centre plus
        // its own rotational friction.
        for (std::uint32_t k = b; k != npos; k = next_[k]) {
            const double a = radius_[k];
            const double o2 = ox_[k] * ox_[k] + oy_[k] * oy_[k] + oz_[k] * oz_[k];
            zeta_t += 6 * pi * eta * a;
            zeta_r += 6 * pi * eta * a * (2.0 / 3.0) * o2 + 8 * pi * eta * a * a * a;
        }
        r_h = zeta_t / (6 * pi * eta);
    } else {
        // Kirkwood hydrodynamic radius: a sphere of radius R_h for translation and rotation.
        std::vector<analysis::Vec3> centres = unwrapped_members_m(b);
        std::vector<double> radii;
        radii.reserve(size_[b]);
        for (std::uint32_t k = b; k != npos; k = next_[k]) radii.push_back(radius_[k]);
        const std::uint64_t sample_seed = seed_ * 0x9E3779B97F4A7C15ull + (std::uint64_t(b) << 32) + size_[b];
        r_h = analysis::kirkwood_hydrodynamic_radius_m(centres, radii, sample_seed);
        zeta_t = 6 * pi * eta * r_h;
        zeta_r = 8 * pi * eta * r_h * r_h * r_h;
    }
    double max_offset2 = 0;
    for (std::uint32_t k = b; k != npos; k = next_[k])
        max_offset2 = std::max(max_offset2, ox_[k] * ox_[k] + oy_[k] * oy_[k] + oz_[k] * oz_[k]);
    max_member_diffusion_ = std::max(max_member_diffusion_, kT / zeta_t + kT / zeta_r * max_offset2);
    hydro_radius_[b] = r_h;
    diff_t_[b] = kT / zeta_t;
    diff_r_[b] = kT / zeta_r;
    if (spans_[b]) {
        // Bonded to its own periodic image: an unbounded network, which cannot diffuse.
        diff_t_[b] = diff_r_[b] = 0.0;
    }
    mob_t_[b] = dt / zeta_t;  // displacement per newton
    mob_r_[b] = dt / zeta_r;  // rotation angle per newton metre
    amp_t_[b] = std::sqrt(2 * diff_t_[b] * dt);
    amp_r_[b] = std::sqrt(2 * diff_r_[b] * dt);
}

void Engine::set_position_from_body(std::uint32_t i) {
    const std::uint32_t b = pos_[i].body;
    pos_[i].x = wrap(cx_[b] + ox_[i]);
    pos_[i].y = wrap(cy_[b] + oy_[i]);
    pos_[i].z = wrap(cz_[b] + oz_[i]);
}

}  // namespace brownfloc::sim
