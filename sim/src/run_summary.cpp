#include "run_summary.hpp"

#include <cmath>

#include "potentials/electrolyte.hpp"
#include "sim/dlvo_report.hpp"
#include "sim/scenario_physics.hpp"
#include "sim/time_step_rule.hpp"

namespace brownfloc::sim {

namespace {

std::optional<double> finite(double v) { return std::isfinite(v) ? std::optional<double>(v) : std::nullopt; }

Json interval(const std::optional<std::array<double, 2>>& ci) {
    if (!ci) return Json();
    return Json(Json::Array{Json((*ci)[0]), Json((*ci)[1])});
}

// W = k_fast / k and its interval (the bounds swap).
std::optional<std::array<double, 2>> ratio_interval(double k_fast, const std::optional<std::array<double, 2>>& ci) {
    if (!ci || (*ci)[1] <= 0) return std::nullopt;
    const double hi = (*ci)[0] > 0 ? k_fast / (*ci)[0] : INFINITY;
    if (!std::isfinite(hi)) return std::nullopt;
    return std::array<double, 2>{k_fast / (*ci)[1], hi};
}

}  // namespace

Json run_summary_json(const Scenario& scenario, const RunPlan& plan, const Engine& engine, const RunRecorder& recorder,
                      const std::vector<ClusterRow>& rows, const std::string& scenario_sha256, const RunTiming& timing) {
    const EngineModel& m = *plan.model;
    const PairKind& first = m.pair_kinds.front();
    const auto electrolyte = electrolyte_of(scenario);
    const double steps = double(engine.steps_taken());
    const double particle_steps = steps * double(engine.particle_count());
    const std::string no_fit = "no rate: too few aggregation events in the early-time window";

    Json j = Json::object();
    j.set("debye_length_nm", electrolyte.debye_length_m(medium_of(scenario)) * 1e9);
    j.set("barrier_kT", first.barrier_kT);
    j.set("secondary_minimum_kT", first.secondary_minimum_kT);
    j.set("capture_gap_nm", first.capture_gap_m * 1e9);
    j.set("capture_gap_rule", first.capture_gap_rule);
    j.set("cutoff_gap_nm", first.cutoff_gap_m * 1e9);
    j.set_number_or_null("cluster_gap_nm", first.cluster_gap_m ? std::optional<double>(*first.cluster_gap_m * 1e9) : std::nullopt,
                         "no secondary minimum of at least 1 kT: no geometric clusters");
    j.set_number_or_null("stability_ratio", finite(std::exp(first.log_stability_ratio)), "above 1e300; see log10_stability_ratio");
    j.set("log10_stability_ratio", first.log_stability_ratio / std::log(10.0));
    j.set_number_or_null("stability_ratio_at_capture", finite(std::exp(first.log_stability_ratio_at_capture)),
                         "above 1e300");
    j.set("half_life_fast_s", plan.half_life_fast_s);
    j.set("particles", static_cast<std::int64_t>(engine.particle_count()));
    j.set("box_length_nm", engine.box_length_m() * 1e9);
    j.set("number_density_per_m3", plan.number_density_per_m3);
    j.set("seed", m.seed);
    j.set("aggregation", m.reversible ? "reversible" : "irreversible");
    j.set("cluster_mobility", m.cluster_mobility == ClusterMobility::free_draining ? "free-draining" : "hydrodynamic-radius");
    j.set("steps", engine.steps_taken());
    j.set("particle_steps", particle_steps);
    j.set("simulated_time_s", engine.time_s());
    j.set("simulated_half_lives", engine.time_s() / plan.half_life_fast_s);
    j.set("time_step_s", m.time_step.time_step_s);
    j.set("time_step_min_s", m.time_step.time_step_s);
    j.set("time_step_max_s", m.time_step.time_step_s);
    j.set("time_step_rule", m.time_step.rule);
    j.set("time_step_rule_s", m.time_step.rule_time_step_s);
    j.set("time_step_limited_by", m.time_step.limited_by);
    j.set("time_step_length_scale_nm", m.time_step.length_scale_m * 1e9);
    j.set("predicted_steps", plan.total_steps);
    j.set("predicted_steps_per_half_life", plan.steps_per_half_life);
    j.set("max_steps", plan.max_steps);

    const RateFit fit = recorder.total_rate();
    const double k_fast = plan.mean_fast_rate_m3_per_s;
    j.set_number_or_null("measured_rate_constant_m3_per_s", fit.rate_m3_per_s, fit.note.empty() ? no_fit : fit.note);
    j.set("measured_rate_constant_ci95_m3_per_s", interval(fit.ci95_m3_per_s));
    j.set("rate_fit_window_s", fit.window_s);
    j.set("rate_fit_events", fit.events);
    j.set("rate_fit_contact_distance_nm", recorder.contact_distance_m() * 1e9);
    j.set_number_or_null("measured_stability_ratio",
                         fit.rate_m3_per_s && *fit.rate_m3_per_s > 0 ? std::optional<double>(k_fast / *fit.rate_m3_per_s)
                                                                     : std::nullopt,
                         fit.note.empty() ? no_fit : fit.note);
    j.set("measured_stability_ratio_ci95", interval(ratio_interval(k_fast, fit.ci95_m3_per_s)));

    const analysis::FractalFit fractal = recorder.fractal(rows);
    j.set_number_or_null("fractal_dimension", fractal.dimension, fractal.note);
    j.set_number_or_null("fractal_dimension_error", fractal.dimension_error, fractal.note);
    j.set_number_or_null("fractal_prefactor", fractal.prefactor, fractal.note);
    if (fractal.dimension && std::isfinite(*fractal.dimension)) j.set("fractal_dimension_note", fractal.note);  // else written above
    j.set("fractal_clusters_used", fractal.clusters_used);

    j.set("bonded_at_start", engine.bonded_at_start());
    const bool percolating = engine.first_spanning_step() >= 0;
    j.set("percolating", percolating);
    j.set_number_or_null("gel_time_s",
                         percolating ? std::optional<double>(double(engine.first_spanning_step() + 1) * m.time_step.time_step_s)
                                     : std::nullopt,
                         "no cluster met its own periodic image");
    const analysis::SizeStatistics last = recorder.last_statistics();
    j.set("final_clusters", last.clusters);
    j.set("final_mean_size", last.mean_size);
    j.set("final_weight_mean_size", last.weight_mean_size);
    j.set("final_largest", last.largest);
    if (m.reversible) {
        j.set("final_bonded_clusters", last.clusters);
        j.set_number_or_null("final_geometric_clusters",
                             recorder.last_geometric_clusters() ? std::optional<double>(double(*recorder.last_geometric_clusters()))
                                                                : std::nullopt,
                             "no output was written");
    }
    j.set("smallest_gap_relative", engine.min_relative_gap_ever());

    Json pairs = Json::array();
    for (const PairRate& p : recorder.pair_rates()) {
        const PairKind& kind = m.pair_kind(p.species_i, p.species_j);
        Json e = Json::object();
        e.set("species", Json(Json::Array{Json(static_cast<int>(p.species_i + 1)), Json(static_cast<int>(p.species_j + 1))}));
        e.set("names", Json(std::vector<std::string>{m.species_names[p.species_i], m.species_names[p.species_j]}));
        e.set("barrier_kT", kind.barrier_kT);
        e.set("capture_gap_nm", kind.capture_gap_m * 1e9);
        e.set("cutoff_gap_nm", kind.cutoff_gap_m * 1e9);
        e.set_number_or_null("stability_ratio", finite(std::exp(kind.log_stability_ratio)), "above 1e300");
        e.set_number_or_null("stability_ratio_at_capture", finite(std::exp(kind.log_stability_ratio_at_capture)), "above 1e300");
        e.set("fast_rate_m3_per_s", p.fast_rate_m3_per_s);
        e.set("monomer_events", p.monomer_events);
        e.set_number_or_null("measured_rate_constant_m3_per_s", p.rate.rate_m3_per_s, p.rate.note);
        e.set("measured_rate_constant_ci95_m3_per_s", interval(p.rate.ci95_m3_per_s));
        e.set_number_or_null("measured_stability_ratio",
                             p.rate.rate_m3_per_s && *p.rate.rate_m3_per_s > 0
                                 ? std::optional<double>(p.fast_rate_m3_per_s / *p.rate.rate_m3_per_s)
                                 : std::nullopt,
                             p.rate.note);
        e.set("measured_stability_ratio_ci95", interval(ratio_interval(p.fast_rate_m3_per_s, p.rate.ci95_m3_per_s)));
        pairs.push(std::move(e));
    }
    j.set("pairs", std::move(pairs));
    j.set("pair_rate_method", "monomer-monomer captures of the species pair over the monomer pair exposure "
                              "(with the transient term) while N/N0 >= 0.7; no 1/2 for unlike species");
    j.set("rate_fit_method", "least squares of 1/n - 1/n0 on (1/2)[t + 2R sqrt(t/(pi D_rel))] while N/N0 >= 0.7; "
                             "R = a1 + a2 + capture gap, D_rel = D1 + D2; 95 % interval from the event count");
    j.set("notes", Json(std::vector<std::string>{
                       "no hydrodynamic interactions between bodies: compare measured_stability_ratio with "
                       "stability_ratio_at_capture, not with a measured (hydrodynamic) stability ratio",
                       "radius of gyration from the sphere centres (each sphere's own 3/5 a^2 not included)"}));
    j.set("trajectory_file", timing.trajectory_file);
    j.set("trajectory_bytes", static_cast<std::int64_t>(timing.trajectory_bytes));
    j.set("trajectory_frames", static_cast<std::int64_t>(timing.trajectory_frames));
    j.set("status", timing.status);
    j.set("resumes", timing.resumes);
    j.set("brownfloc_version", BROWNFLOC_VERSION);
    j.set("scenario_sha256", scenario_sha256);
    j.set("wall_time_s", timing.wall_time_s);
    j.set("particle_steps_per_s", timing.session_wall_time_s > 0
                                      ? double(timing.session_particle_steps) / timing.session_wall_time_s
                                      : 0.0);
    j.set("threads", timing.threads);
    j.set("caution", stability_caution());
    return j;
}

}  // namespace brownfloc::sim
