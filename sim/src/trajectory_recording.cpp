#include "sim/trajectory_recording.hpp"

#include <algorithm>
#include <cmath>

#include "potentials/extrema.hpp"
#include "potentials/pair_interaction.hpp"
#include "sim/scenario_physics.hpp"

namespace brownfloc::sim {

namespace {

// The first step boundary at or after time t (steps of dt). The small relative allowance
// keeps t = k dt, computed with rounding, on step k rather than k + 1.
std::int64_t first_step_at_or_after(double t_s, double dt_s) {
    return static_cast<std::int64_t>(std::ceil(t_s / dt_s * (1 - 1e-12)));
}

}  // namespace

std::vector<std::int64_t> snapshot_steps(const Scenario& s, const RunPlan& plan) {
    const double dt = plan.model->time_step.time_step_s;
    const std::int64_t total = plan.total_steps;
    std::vector<std::int64_t> steps;
    if (s.output.snapshot_interval_s) {
        const double interval = *s.output.snapshot_interval_s;
        for (std::int64_t k = 0;; ++k) {
            const double t = double(k) * interval;
            const std::int64_t step = first_step_at_or_after(t, dt);
            if (step >= total) break;
            steps.push_back(step);
        }
    } else {
        const std::int64_t count = s.output.snapshots.value_or(default_snapshots);  // >= 2 (schema)
        for (std::int64_t k = 0; k + 1 < count; ++k)
            steps.push_back(first_step_at_or_after(plan.end_time_s * double(k) / double(count - 1), dt));
    }
    steps.push_back(total);
    for (std::int64_t& step : steps) step = std::min(step, total);
    std::sort(steps.begin(), steps.end());
    steps.erase(std::unique(steps.begin(), steps.end()), steps.end());
    return steps;
}

trajectory::TrajectoryHeader trajectory_header(const Scenario& s, const RunPlan& plan, const std::string& resolved) {
    const EngineModel& m = *plan.model;
    trajectory::TrajectoryHeader h;
    h.box_length_nm = plan.particles.box_length_m * 1e9;
    h.temperature_K = m.temperature_K;
    h.fast_half_life_s = plan.half_life_fast_s;
    h.species_names = m.species_names;
    h.radius_nm.reserve(plan.particles.radii_m.size());
    for (const double r : plan.particles.radii_m) h.radius_nm.push_back(r * 1e9);
    h.species = plan.particles.species;
    h.scenario_toml = resolved;

    const potentials::Medium medium = medium_of(s);
    const potentials::Electrolyte electrolyte = electrolyte_of(s);
    const double min_gap = min_gap_m(s);
    for (std::size_t i = 0; i < s.species.size(); ++i)
        for (std::size_t j = i; j < s.species.size(); ++j) {
            const potentials::PairInteraction pair(pair_model(s, i, j), medium, electrolyte);
            if (i == 0 && j == 0) h.debye_length_nm = 1e9 / pair.kappa_per_m();
            const PairKind& kind = m.pair_kind(i, j);
            const double max_gap = std::max(potentials::default_max_gap_m(pair), kind.cutoff_gap_m);
            const potentials::Extrema ex = potentials::find_extrema(pair, min_gap, max_gap);
            trajectory::PairRecord rec;
            rec.species_i = static_cast<std::uint32_t>(i);
            rec.species_j = static_cast<std::uint32_t>(j);
            rec.stability_ratio = std::exp(kind.log_stability_ratio);  // as in `dlvo`; may be +inf
            rec.capture_gap_nm = kind.capture_gap_m * 1e9;
            rec.has_barrier = ex.has_barrier();
            rec.barrier_kT = ex.barrier_J() / m.kT_J;
            rec.barrier_gap_nm = ex.has_barrier() ? ex.maximum_gap_m * 1e9 : 0.0;
            const double ratio = std::pow(max_gap / min_gap, 1.0 / (curve_samples - 1));
            for (int k = 0; k < curve_samples; ++k) {
                const double gap = k + 1 == curve_samples ? max_gap : min_gap * std::pow(ratio, k);
                rec.gap_nm.push_back(gap * 1e9);
                rec.energy_kT.push_back(pair.total(gap).energy_J / m.kT_J);
            }
            h.pairs.push_back(std::move(rec));
        }
    return h;
}

trajectory::TrajectoryFrame trajectory_frame(const Engine& engine) {
    trajectory::TrajectoryFrame f;
    const std::size_t n = engine.particle_count();
    f.step = engine.steps_taken();
    f.time_s = engine.time_s();
    f.positions_nm.assign(3 * n, 0.0);
    f.cluster.assign(n, 0);
    std::uint32_t largest = 0;
    for (const std::uint32_t b : engine.bodies()) {
        const std::vector<std::uint32_t> members = engine.members(b);
        const std::vector<Vec3> where = engine.unwrapped_members_m(b);
        for (std::size_t k = 0; k < members.size(); ++k) {
            const std::size_t i = members[k];
            for (int c = 0; c < 3; ++c) f.positions_nm[3 * i + std::size_t(c)] = where[k][std::size_t(c)] * 1e9;
            f.cluster[i] = b;
        }
        largest = std::max(largest, engine.body_size(b));
        if (engine.spans_box(b)) f.spanning_clusters.push_back(b);
    }
    f.cluster_count = static_cast<std::uint32_t>(engine.bodies().size());
    f.largest_cluster = largest;
    return f;
}

}  // namespace brownfloc::sim
