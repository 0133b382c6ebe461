#include "sim/engine_setup.hpp"

#include <algorithm>
#include <cmath>
#include <numeric>
#include <sstream>

#include "potentials/constants.hpp"
#include "potentials/input_error.hpp"
#include "potentials/kinetics.hpp"
#include "sim/philox_noise.hpp"
#include "sim/placement.hpp"
#include "sim/scenario_physics.hpp"

namespace brownfloc::sim {

using namespace brownfloc::potentials;

namespace {

// Particle counts per species by largest remainder of N x number_fraction (ties to the
// lower species index), so that they add up to N.
std::vector<std::int64_t> species_counts(const Scenario& s, std::int64_t n) {
    std::vector<std::int64_t> counts(s.species.size());
    std::vector<std::pair<double, std::size_t>> rest;
    std::int64_t used = 0;
    for (std::size_t k = 0; k < s.species.size(); ++k) {
        const double exact = double(n) * s.species[k].number_fraction;
        counts[k] = static_cast<std::int64_t>(std::floor(exact));
        used += counts[k];
        rest.push_back({exact - double(counts[k]), k});
    }
    std::stable_sort(rest.begin(), rest.end(), [](auto& a, auto& b) { return a.first > b.first; });
    for (std::size_t k = 0; used < n; ++k, ++used) ++counts[rest[k % rest.size()].second];
    return counts;
}

// Log-normal radius with median a and sd sigma of ln a, truncated at +-3 sd (redrawn), from
// the radius noise stream of this slot.
double draw_radius_m(double median_m, double sigma, std::uint64_t seed, std::uint32_t slot) {
    if (sigma == 0.0) return median_m;
    for (std::uint64_t attempt = 0;; ++attempt) {
        const auto z = standard_normals(seed, attempt, slot, NoiseStream::radius);
        for (double v : z)
            if (std::abs(v) <= 3.0) return median_m * std::exp(sigma * v);
    }
}

std::string format_g(double v) {
    std::ostringstream o;
    o.precision(4);
    o << v;
    return o.str();
}

}  // namespace

RunPlan plan_run(const Scenario& s, std::uint64_t seed, StopRequested stop_requested) {
    RunPlan plan;
    if (!s.uncertain_inputs.empty())
        throw InputError(s.source + ": " + s.uncertain_inputs.front().key + " = " +
                         s.uncertain_inputs.front().distribution.text() +
                         ": a run simulates one dispersion: give a single value (distributions are for "
                         "`brownfloc shelf-life`; `dlvo` and `ccc` take their medians)");
    const auto density = number_density_per_m3(s);
    if (!density)
        throw InputError(s.source + ": [suspension]: a run needs volume_fraction or number_density_per_m3");
    const std::int64_t n = s.run.particles.value_or(default_particles);
    plan.particle_count = n;
    const double min_gap = min_gap_m(s);
    if (s.run.capture_gap_nm && *s.run.capture_gap_nm < s.min_gap_nm)
        throw InputError(s.source + ": [run] capture_gap_nm = " + format_g(*s.run.capture_gap_nm) +
                         ": must be >= [interaction] min_gap_nm = " + format_g(s.min_gap_nm));

    auto model = std::make_shared<EngineModel>();
    const Medium medium = medium_of(s);
    const Electrolyte electrolyte = electrolyte_of(s);
    model->temperature_K = medium.temperature_K;
    model->viscosity_Pa_s = medium.viscosity_Pa_s;
    model->kT_J = constants::boltzmann_J_per_K * medium.temperature_K;
    model->min_gap_m = min_gap;
    model->species_count = s.species.size();
    model->seed = seed;
    model->reversible = s.run.aggregation == "reversible";
    model->cluster_mobility = s.run.cluster_mobility == "free-draining" ? ClusterMobility::free_draining
                                                                       : ClusterMobility::hydrodynamic_radius;
    bool polydisperse = false;
    for (const SpeciesSpec& sp : s.species) {
        model->species_names.push_back(sp.name);
        model->species_median_radius_m.push_back(sp.radius_nm * 1e-9);
        polydisperse = polydisperse || sp.radius_spread > 0;
    }
    const std::optional<double> capture_override =
        s.run.capture_gap_nm ? std::optional<double>(*s.run.capture_gap_nm * 1e-9) : std::nullopt;
    const std::optional<double> cluster_override =
        s.run.cluster_gap_nm ? std::optional<double>(*s.run.cluster_gap_nm * 1e-9) : std::nullopt;
    for (std::size_t i = 0; i < s.species.size(); ++i)
        for (std::size_t j = i; j < s.species.size(); ++j) {
            const PairInteraction pair(pair_model(s, i, j), medium, electrolyte);
            PairKind kind = analyse_pair_kind(pair, i, j, min_gap, capture_override, cluster_override);
            if (!polydisperse && kind.interacting)
                model->pair_tables.emplace_back(std::in_place, pair, min_gap, kind.cutoff_gap_m);
            else
                model->pair_tables.emplace_back(std::nullopt);
            model->any_interaction = model->any_interaction || kind.interacting;
            model->pair_kinds.push_back(std::move(kind));
        }
    if (polydisperse && model->any_interaction) {
        const PairModel m0 = pair_model(s, 0, 0);
        auto rf = std::make_shared<RadiusFreeInteraction>(m0.vdw, s.double_layer, medium, electrolyte, min_gap,
                                                          model->max_cutoff_gap_m() * 1.001);
        for (const SpeciesSpec& sp : s.species) {
            model->species_hamaker_J.push_back(sp.hamaker_J);
            model->species_double_layer_potential_V.push_back(rf->double_layer_potential_V(sp.surface_potential_mV * 1e-3));
        }
        model->radius_free = std::move(rf);
    }

    // Radii per slot (species in blocks of slots; ids are given after placement).
    const std::vector<std::int64_t> counts = species_counts(s, n);
    std::vector<double> radii;
    std::vector<std::uint32_t> species;
    radii.reserve(static_cast<std::size_t>(n));
    for (std::size_t k = 0; k < counts.size(); ++k)
        for (std::int64_t c = 0; c < counts[k]; ++c) {
            const auto slot = static_cast<std::uint32_t>(radii.size());
            radii.push_back(draw_radius_m(s.species[k].radius_nm * 1e-9, s.species[k].radius_spread, seed, slot));
            species.push_back(static_cast<std::uint32_t>(k));
        }
    std::vector<double> min_radius(s.species.size(), std::numeric_limits<double>::infinity());
    for (std::size_t k = 0; k < radii.size(); ++k) min_radius[species[k]] = std::min(min_radius[species[k]], radii[k]);
    for (std::size_t k = 0; k < min_radius.size(); ++k)
        if (!std::isfinite(min_radius[k])) min_radius[k] = s.species[k].radius_nm * 1e-9;

    // Box from the radii actually drawn.
    double volume_m3 = 0;
    if (const std::optional<double> phi = volume_fraction_of(s)) {
        for (double a : radii) volume_m3 += 4.0 / 3.0 * constants::pi * a * a * a;
        volume_m3 /= *phi;
    } else {
        volume_m3 = double(n) / *s.number_density_per_m3;
    }
    const double box = std::cbrt(volume_m3);
    plan.number_density_per_m3 = double(n) / volume_m3;

    // Time step.
    TimeStepInputs ts{model->pair_kinds, min_radius, model->species_median_radius_m, model->kT_J,
                      model->viscosity_Pa_s, std::nullopt, std::nullopt};
    if (s.run.max_time_step_s) ts.max_time_step_s = *s.run.max_time_step_s;
    if (s.run.time_step_s) ts.time_step_s = *s.run.time_step_s;
    model->time_step = choose_time_step(ts);
    const double dt = model->time_step.time_step_s;
    const double a_min = *std::min_element(min_radius.begin(), min_radius.end());
    const double amp = std::sqrt(2 * model->kT_J / (6 * constants::pi * model->viscosity_Pa_s * a_min) * dt);
    model->skin_m = std::max(0.05 * (2 * a_min + model->max_cutoff_gap_m()), 40.0 * amp);

    // Kinetics: fast half-life from the number-fraction mean of the fast kernels.
    double k_mean = 0;
    for (std::size_t i = 0; i < s.species.size(); ++i)
        for (std::size_t j = 0; j < s.species.size(); ++j)
            k_mean += double(counts[i]) / double(n) * double(counts[j]) / double(n) *
                      fast_rate_m3_per_s(s.species[i].radius_nm * 1e-9, s.species[j].radius_nm * 1e-9,
                                         medium.temperature_K, medium.viscosity_Pa_s);
    plan.mean_fast_rate_m3_per_s = k_mean;
    plan.half_life_fast_s = fast_half_life_s(k_mean, plan.number_density_per_m3);
    plan.steps_per_half_life = plan.half_life_fast_s / dt;
    if (s.run.end_time_s) plan.end_time_s = *s.run.end_time_s;
    else if (s.run.steps) plan.end_time_s = double(*s.run.steps) * dt;
    else plan.end_time_s = s.run.end_half_lives.value_or(default_end_half_lives) * plan.half_life_fast_s;
    const double steps = s.run.steps ? double(*s.run.steps) : std::ceil(plan.end_time_s / dt * (1 - 1e-12));
    plan.max_steps = s.run.max_steps.value_or(default_max_steps);
    if (!(steps <= double(plan.max_steps))) {
        throw InputError(
            s.source + ": [run] max_steps = " + std::to_string(plan.max_steps) + ": the run needs " + format_g(steps) +
            " steps (" + format_g(plan.steps_per_half_life) + " per fast half-life of " + format_g(plan.half_life_fast_s) +
            " s; time step " + format_g(dt) + " s limited by " + model->time_step.limited_by + "; end time " +
            format_g(plan.end_time_s) + " s). Shorten the run (end_time_s, end_half_lives or steps) or raise max_steps; "
            "the step is never coarsened silently. Realistic kappa a with W >> 1 needs a reduced model, which a later "
            "version will add.");
    }
    plan.total_steps = static_cast<std::int64_t>(steps);
    plan.particles = place_particles(radii, species, box, *model, seed, s.source, stop_requested);
    plan.model = std::move(model);
    return plan;
}

}  // namespace brownfloc::sim
