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
#include <cmath>
#include <cstdint>
#include <limits>
#include <memory>
#include <optional>
#include <span>
#include <vector>

#include "sim/engine_model.hpp"
#include "sim/huge_page_allocator.hpp"

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

    friend bool operator==(const CaptureEvent&, const CaptureEvent&) = default;
};

struct EngineState;  // engine_state.hpp

class Engine {
public:
    // Pairs already within their capture gap are bonded at once (counted in bonded_at_start).
    // seed replaces the model's seed for the noise (tests run many engines on one model).
    Engine(std::shared_ptr<const EngineModel> model, InitialParticles particles,
           std::optional<std::uint64_t> seed = std::nullopt);

    // Continues a run from a saved state (a checkpoint) on the same model: the steps that
    // follow give the same bits as in the run that saved it. Throws std::invalid_argument if
    // the state does not fit the model (particle count, radii, species, box).
    Engine(std::shared_ptr<const EngineModel> model, const EngineState& state);
    // The state after the last step: what state-based construction needs.
    [[nodiscard]] EngineState state() const;

    void step();

    [[nodiscard]] const EngineModel& model() const { return *model_; }
    [[nodiscard]] std::int64_t steps_taken() const { return step_; }
    [[nodiscard]] double time_s() const { return double(step_) * model_->time_step.time_step_s; }
    [[nodiscard]] std::size_t particle_count() const { return radius_.size(); }
    [[nodiscard]] double box_length_m() const { return box_; }
    [[nodiscard]] std::int64_t bonded_at_start() const { return bonded_at_start_; }
    [[nodiscard]] std::int64_t list_builds() const { return list_builds_; }

    // Wrapped position of particle i [m].
    [[nodiscard]] Vec3 position_m(std::uint32_t i) const { return {pos_[i].x, pos_[i].y, pos_[i].z}; }
    [[nodiscard]] double radius_m(std::uint32_t i) const { return radius_[i]; }
    [[nodiscard]] std::uint32_t species(std::uint32_t i) const { return pos_[i].species; }
    // Body (bonded cluster) of particle i: its smallest member id.
    [[nodiscard]] std::uint32_t body_of(std::uint32_t i) const { return pos_[i].body; }
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
    // Smallest gap between particles of different bodies that were not captured in the last
    // step, relative to the smaller radius; +inf when none was in range.
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
            for (std::uint64_t k = nbr_start_[i]; k < nbr_upper_end_[i]; ++k) visit(i, nbr_[k]);
    }

    // Surface gap [m] of particles i and j (minimum image; negative when they overlap).
    [[nodiscard]] double gap_m(std::uint32_t i, std::uint32_t j) const {
        const Vec3 d = minimum_image(position_m(i), position_m(j));
        return std::sqrt(d[0] * d[0] + d[1] * d[1] + d[2] * d[2]) - radius_[i] - radius_[j];
    }

    // Minimum-image vector from a to b [m], both inside the box [0, L)^3.
    [[nodiscard]] Vec3 minimum_image(const Vec3& a, const Vec3& b) const {
        return {fold(b[0] - a[0]), fold(b[1] - a[1]), fold(b[2] - a[2])};
    }

private:
    struct Candidate {
        std::uint32_t i, j;  // i < j
        bool by_bridge;
    };
    // (smaller id, larger id) order: the order captures are applied in.
    static bool by_pair(const Candidate& a, const Candidate& b);
    void build_neighbour_list();
    // The largest squared displacement of any particle since the list was built [m^2] (exact, O(N)).
    [[nodiscard]] double largest_squared_displacement_since_build() const;
    void move_bodies();  // forces, then the move of every body
    void detect_captures(std::vector<Candidate>& out);
    [[nodiscard]] double capture_reach_m() const;
    void build_capture_pairs(double reach_m);
    void add_to_displacement_bounds(double move_m) {
        displacement_bound_m_ += move_m;
        capture_list_bound_m_ += move_m;
    }
    void apply_captures(std::vector<Candidate>& candidates);
    void merge_bodies(std::uint32_t i, std::uint32_t j);
    void separate_other_contacts(std::uint32_t bi, std::uint32_t bj, const Vec3& away);
    void update_mobility(std::uint32_t b);
    void shift_body(std::uint32_t b, const Vec3& shift_m);
    [[nodiscard]] double effective_diffusion(std::uint32_t i, const Vec3& unit) const;
    // A coordinate difference of two points inside the box, folded to (-L/2, L/2]. One
    // correction suffices because |d| < L (no library call: nearbyint and floor are calls on
    // baseline x86-64 without SSE4.1).
    [[nodiscard]] double fold(double d) const {
        if (d > half_box_) return d - box_;
        if (d < -half_box_) return d + box_;
        return d;
    }
    // A coordinate brought back into [0, L).
    [[nodiscard]] double wrap(double c) const {
        if (c >= box_) {
            c -= box_;
            if (c >= box_) c -= box_ * std::floor(c * inv_box_);
        } else if (c < 0) {
            c += box_;
            if (c < 0) c -= box_ * std::floor(c * inv_box_);
        }
        return c < box_ ? c : 0.0;  // c + L can round up to L for a tiny negative c
    }
    // -dU/dh [N] between particles i and j at gap_m (0 beyond the pair's cutoff).
    [[nodiscard]] double force_between(std::uint32_t i, std::uint32_t j, double gap_m) const {
        const EngineModel& m = *model_;
        if (m.radius_free) {
            const std::uint32_t si = pos_[i].species, sj = pos_[j].species;
            if (gap_m >= m.pair_kind(si, sj).cutoff_gap_m) return 0.0;
            return m.radius_free->force_N(gap_m, {radius_[i], radius_[j], std::sqrt(m.species_hamaker_J[si] * m.species_hamaker_J[sj]),
                                                  m.species_double_layer_potential_V[si], m.species_double_layer_potential_V[sj]});
        }
        const std::size_t k = m.pair_index(pos_[i].species, pos_[j].species);
        const auto& table = m.pair_tables[k];
        if (!table || gap_m >= m.pair_kinds[k].cutoff_gap_m) return 0.0;
        return table->force_N(gap_m);
    }
    [[nodiscard]] double capture_gap(std::uint32_t i, std::uint32_t j) const {
        return model_->pair_kind(pos_[i].species, pos_[j].species).capture_gap_m;
    }
    void bond_initial_contacts();
    void drop_absorbed_bodies();  // bodies_ keeps only bodies that were not merged into others
    void set_position_from_body(std::uint32_t i);
    void sync_monomer_centre(std::uint32_t b) {
        if (size_[b] != 1) return;
        cx_[b] = pos_[b].x;
        cy_[b] = pos_[b].y;
        cz_[b] = pos_[b].z;
    }

    std::shared_ptr<const EngineModel> model_;
    std::uint64_t seed_ = 0;
    double box_ = 0, inv_box_ = 0, half_box_ = 0;
    std::int64_t step_ = 0;
    std::int64_t bonded_at_start_ = 0;
    std::int64_t list_builds_ = 0;
    std::int64_t first_spanning_step_ = -1;

    // Per particle.
    // Wrapped position, body id (smallest member) and species together: the pair loops
    // touch one 32-byte record per neighbour.
    struct ParticleRecord {
        double x, y, z;
        std::uint32_t body, species;
    };
    ParticleArray<ParticleRecord> pos_;
    // Positions at the start of the last step (written by the move, which then swaps it with
    // pos_). Only x, y, z are meaningful between steps: body ids change in captures.
    ParticleArray<ParticleRecord> start_;
    ParticleArray<double> bx_, by_, bz_;     // positions when the list was built
    ParticleArray<double> ox_, oy_, oz_;     // offset from the body centre
    ParticleArray<double> fx_, fy_, fz_;     // force from other bodies [N]
    ParticleArray<double> radius_;
    ParticleArray<std::uint32_t> next_;      // next member of the same body in id order; npos at the end
    // Per body, indexed by body id (valid where pos_[b].body == b).
    // Centre (a^3-weighted mean of member centres), wrapped. Kept for bodies of two or more
    // members only: a monomer's centre is its position, and the step does not copy it here
    // (memory traffic); sync_monomer_centre brings it in before a monomer is shifted or merged.
    ParticleArray<double> cx_, cy_, cz_;
    ParticleArray<std::uint32_t> size_;
    ParticleArray<double> diff_t_, diff_r_, hydro_radius_;
    ParticleArray<double> amp_t_, amp_r_;  // sqrt(2 D dt)
    ParticleArray<double> mob_t_, mob_r_;  // dt / friction
    ParticleArray<std::uint8_t> spans_;
    std::vector<std::uint32_t> bodies_;

    // The pair loops prefetch the record of the neighbour this many entries ahead in nbr_:
    // at N = 1e5 and above the records do not fit in a core's cache and the loads of
    // neighbour positions otherwise dominate the force and capture passes.
    static constexpr std::uint64_t prefetch_ahead = 20;
    void prefetch_neighbour(std::uint64_t k) const { __builtin_prefetch(&pos_[nbr_[k + prefetch_ahead]]); }

    // Neighbour list (full, CSR): neighbours of i are nbr_[nbr_start_[i] .. nbr_start_[i+1]).
    ParticleArray<std::uint64_t> nbr_start_;
    ParticleArray<std::uint64_t> nbr_upper_end_;  // neighbours of i with larger ids: nbr_start_[i] .. this
    ParticleArray<std::uint32_t> nbr_;
    double list_radius_extra_m_ = 0;  // list range beyond a_i + a_j
    double max_radius_m_ = 0, min_radius_m_ = 0;
    // Largest D_t + D_r max|o|^2 of any body so far [m^2/s] (never decreases: a safe bound).
    double max_member_diffusion_ = 0;
    // An upper bound on how far any particle has moved since the list was built [m]: the
    // sum over steps of the largest body displacement (centre plus rotation arc of its
    // farthest member) and of every capture shift. Only when it passes half the skin is the
    // exact O(N) check made, so the list is rebuilt in exactly the steps an every-step
    // check would choose, at a fraction of the memory traffic. Infinite: check before the
    // first step.
    double displacement_bound_m_ = std::numeric_limits<double>::infinity();

    // Capture candidates: the neighbour-list pairs (i < j) that were within
    // capture_list_range_m_ when the list was made, and a bound on any particle's move since.
    // The capture check visits only these (about a tenth of the list when the force range is
    // long, as van der Waals makes it).
    std::vector<std::array<std::uint32_t, 2>> capture_pairs_;
    double capture_list_range_m_ = 0;
    double capture_list_bound_m_ = std::numeric_limits<double>::infinity();

    std::vector<CaptureEvent> captures_;
    double min_relative_gap_ = 0, min_relative_gap_ever_ = 0;
    std::vector<Candidate> candidates_;
};

}  // namespace brownfloc::sim
