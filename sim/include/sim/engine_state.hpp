#pragma once
// Everything an Engine needs to continue a run bit for bit: the state after a step, as
// plain arrays (what a checkpoint stores). The neighbour list is not stored: it is rebuilt
// from the positions of its last build, which gives the same list in the same order; the
// capture list and the displacement bounds only decide how much work a step does, never its
// result, and start afresh.
#include <cstdint>
#include <vector>

#include "sim/engine.hpp"

namespace brownfloc::sim {

struct EngineState {
    std::uint64_t seed = 0;
    std::int64_t step = 0;
    std::int64_t bonded_at_start = 0, list_builds = 0, first_spanning_step = -1;
    double box_length_m = 0;
    double max_member_diffusion_m2_per_s = 0;
    double min_relative_gap_last_step = 0, min_relative_gap_ever = 0;

    // Per particle.
    std::vector<double> x_m, y_m, z_m;                 // wrapped positions
    std::vector<std::uint32_t> body, species, next_member;
    std::vector<double> radius_m;
    std::vector<double> list_x_m, list_y_m, list_z_m;  // positions at the last list build
    std::vector<double> offset_x_m, offset_y_m, offset_z_m;

    // Per body id (entries of ids that are not bodies are kept as they are).
    std::vector<double> centre_x_m, centre_y_m, centre_z_m;
    std::vector<std::uint32_t> body_size;
    std::vector<double> diffusion_t_m2_per_s, diffusion_r_per_s, hydrodynamic_radius_m;
    std::vector<double> amplitude_t_m, amplitude_r, mobility_t_m_per_N, mobility_r_per_N_m;
    std::vector<std::uint8_t> spans_box;
    std::vector<std::uint32_t> bodies;  // ascending

    std::vector<CaptureEvent> captures;

    friend bool operator==(const EngineState&, const EngineState&) = default;
};

}  // namespace brownfloc::sim
