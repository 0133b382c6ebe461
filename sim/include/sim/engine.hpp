#pragma once
// The Brownian-dynamics engine: overdamped Langevin dynamics of rigid bodies (single
// particles and bonded clusters) in a periodic cube, without hydrodynamic interactions
// between bodies (Ermak & McCammon 1978, J. Chem. Phys. 69, 1352):
//   dR = (D_t/kT) F dt + sqrt(2 D_t dt) xi,   dTheta = (D_r/kT) T dt + sqrt(2 D_r dt) xi_r,
// F and T the summed DLVO forces and torques on a body's members from members of other
// bodies. A pair whose gap reaches its capture gap bonds for good: crossings inside a step
// are caught with the Brownian-bridge probability, the two bodies are backed along the
// step's relative displacement to the capture gap and merge in the same step.
//
// Reproducibility: noise is a pure function of (seed, step, body id, stream); forces are
// summed per particle over a full neighbour list in a fixed order, body sums over members
// in id order, captures are applied serially in (min id, max id) order. The state after any
// step is therefore bitwise the same for any number of OpenMP threads (same binary).
//
// Not thread-safe itself: one thread calls step(); it parallelises inside.
#include <array>
#include <cstdint>
#include <memory>
#include <span>
#include <vector>

#include "sim/engine_model.hpp"

namespace brownfloc::sim {

using Vec3 = std::array<double, 3>;

struct InitialParticles {
    double box_length_m = 0;
    std::vector<Vec3> positions_m;        // in [0, L)^3
    std::vector<double> radii_m;
    std::vector<std::uint32_t> species;   // 0-based
};

// One bond formed: the contact pair and the bodies it joined (sizes before the merge).
struct CaptureEvent {
    std::int64_t step = 0;
    std::uint32_t particle_i = 0, particle_j = 0;  // i < j
    std::uint32_t body_i = 0, body_j = 0;
    std::uint32_t size_i = 0, size_j = 0;
    bool by_bridge = false;  // caught by the Brownian-bridge probability, not by the end position
};

class Engine {
public:
    // Pairs already within their capture gap are bonded at once (counted in bonded_at_start).
    Engine(std::shared_ptr<const EngineModel> model, InitialParticles particles);

    void step();

    [[nodiscard]] const EngineModel& model() const { return *model_; }
    [[nodiscard]] std::int64_t steps_taken() const { return step_; }
    [[nodiscard]] double time_s() const { return double(step_) * model_->time_step.time_step_s; }
    [[nodiscard]] std::size_t particle_count() const { return radius_.size(); }
    [[nodiscard]] double box_length_m() const { return box_; }
    [[nodiscard]] std::int64_t bonded_at_start() const { return bonded_at_start_; }
    [[nodiscard]] std::int64_t list_builds() const { return list_builds_; }

    // Wrapped position of particle i [m].
    [[nodiscard]] Vec3 position_m(std::uint32_t i) const { return {x_[i], y_[i], z_[i]}; }
    [[nodiscard]] double radius_m(std::uint32_t i) const { return radius_[i]; }
    [[nodiscard]] std::uint32_t species(std::uint32_t i) const { return species_[i]; }
    // Body (bonded cluster) of particle i: its smallest member id.
    [[nodiscard]] std::uint32_t body_of(std::uint32_t i) const { return body_[i]; }
    // Body ids in ascending order.
    [[nodiscard]] const std::vector<std::uint32_t>& bodies() const { return bodies_; }
    [[nodiscard]] std::uint32_t body_size(std::uint32_t b) const { return size_[b]; }
    // Members of body b in ascending id order.
    [[nodiscard]] std::vector<std::uint32_t> members(std::uint32_t b) const;
    // Member positions made continuous (body centre + offsets) [m], in members() order.
    [[nodiscard]] std::vector<Vec3> unwrapped_members_m(std::uint32_t b) const;
    [[nodiscard]] bool spans_box(std::uint32_t b) const { return spans_[b] != 0; }
    [[nodiscard]] double hydrodynamic_radius_m(std::uint32_t b) const { return hydro_radius_[b]; }
    [[nodiscard]] double translational_diffusion_m2_per_s(std::uint32_t b) const { return diff_t_[b]; }
    [[nodiscard]] double rotational_diffusion_per_s(std::uint32_t b) const { return diff_r_[b]; }
    // Offset of member i from its body centre [m] (rotates with the body).
    [[nodiscard]] Vec3 offset_m(std::uint32_t i) const { return {ox_[i], oy_[i], oz_[i]}; }

    // Every bond formed so far, in the order formed.
    [[nodiscard]] const std::vector<CaptureEvent>& captures() const { return captures_; }
    // Smallest gap between particles of different bodies found by the last capture check,
    // relative to the smaller radius (negative = overlap); +inf when none was in range.
    [[nodiscard]] double min_relative_gap_last_step() const { return min_relative_gap_; }
    // Smallest such value over the whole run.
    [[nodiscard]] double min_relative_gap_ever() const { return min_relative_gap_ever_; }
    // Smallest gap of any two particles in range (same body included) over the smaller
    // radius, scanned now (for tests; O(N)).
    [[nodiscard]] double smallest_relative_gap() const;

    // Step in which a body was first found touching its own periodic image; -1 if never.
    [[nodiscard]] std::int64_t first_spanning_step() const { return first_spanning_step_; }

    // Calls visit(i, j) for each listed pair i < j (every pair closer than a_i + a_j +
    // cutoff + half the skin is listed), in a fixed order.
    template <class Visit>
    void for_each_listed_pair(Visit&& visit) const {
        for (std::uint32_t i = 0; i < radius_.size(); ++i)
            for (std::uint64_t k = nbr_start_[i]; k < nbr_start_[i + 1]; ++k)
                if (nbr_[k] > i) visit(i, nbr_[k]);
    }

    // Minimum-image vector from a to b [m].
    [[nodiscard]] Vec3 minimum_image(const Vec3& a, const Vec3& b) const;

private:
    struct Candidate {
        std::uint32_t i, j;  // i < j
        bool by_bridge;
    };
    void build_neighbour_list();
    bool neighbour_list_stale() const;
    void compute_forces();
    void move_bodies();
    void detect_captures(std::vector<Candidate>& out);
    void apply_captures(std::vector<Candidate>& candidates);
    void merge_bodies(std::uint32_t i, std::uint32_t j);
    void update_mobility(std::uint32_t b);
    void shift_body(std::uint32_t b, const Vec3& shift_m);
    [[nodiscard]] double effective_diffusion(std::uint32_t i, const Vec3& unit) const;
    [[nodiscard]] double force_between(std::uint32_t i, std::uint32_t j, double gap_m) const;
    [[nodiscard]] double capture_gap(std::uint32_t i, std::uint32_t j) const;
    void bond_initial_contacts();
    void set_position_from_body(std::uint32_t i);

    std::shared_ptr<const EngineModel> model_;
    double box_ = 0, inv_box_ = 0;
    std::int64_t step_ = 0;
    std::int64_t bonded_at_start_ = 0;
    std::int64_t list_builds_ = 0;
    std::int64_t first_spanning_step_ = -1;

    // Per particle.
    std::vector<double> x_, y_, z_;        // wrapped positions
    std::vector<double> px_, py_, pz_;     // positions at the start of the step
    std::vector<double> bx_, by_, bz_;     // positions when the list was built
    std::vector<double> ox_, oy_, oz_;     // offset from the body centre
    std::vector<double> fx_, fy_, fz_;     // force from other bodies [N]
    std::vector<double> radius_;
    std::vector<std::uint32_t> species_;
    std::vector<std::uint32_t> body_;      // body id (smallest member)
    std::vector<std::uint32_t> next_;      // next member of the same body in id order; npos at the end
    // Per body, indexed by body id (valid where body_[b] == b).
    std::vector<double> cx_, cy_, cz_;     // centre (a^3-weighted mean of member centres), wrapped
    std::vector<std::uint32_t> size_;
    std::vector<double> diff_t_, diff_r_, hydro_radius_;
    std::vector<double> amp_t_, amp_r_;  // sqrt(2 D dt)
    std::vector<double> mob_t_, mob_r_;  // dt / friction
    std::vector<std::uint8_t> spans_;
    std::vector<std::uint32_t> bodies_;

    // Neighbour list (full, CSR): neighbours of i are nbr_[nbr_start_[i] .. nbr_start_[i+1]).
    std::vector<std::uint64_t> nbr_start_;
    std::vector<std::uint32_t> nbr_;
    double list_radius_extra_m_ = 0;  // list range beyond a_i + a_j
    double max_radius_m_ = 0, min_radius_m_ = 0;
    bool bodies_moved_by_capture_ = false;

    std::vector<CaptureEvent> captures_;
    double min_relative_gap_ = 0, min_relative_gap_ever_ = 0;
    std::vector<Candidate> candidates_;
};

}  // namespace brownfloc::sim
