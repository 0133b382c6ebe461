#include "sim/shelf_life_report.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <exception>
#include <functional>
#include <stdexcept>

#include "potentials/ccc.hpp"
#include "potentials/electrolyte.hpp"
#include "potentials/grahame.hpp"
#include "potentials/input_error.hpp"
#include "potentials/water.hpp"
#include "report_format.hpp"
#include "sha256.hpp"
#include "shelf_criteria/criterion_time.hpp"
#include "shelf_criteria/early_stage.hpp"
#include "shelf_criteria/scattering_setup.hpp"
#include "sim/ccc_report.hpp"
#include "sim/dlvo_report.hpp"
#include "sim/scenario_physics.hpp"
#include "sim/shelf_life_samples.hpp"
#include "shelf_life_ensemble.hpp"
#include "shelf_life_format.hpp"

namespace brownfloc::sim {

using namespace detail;

namespace {

constexpr double standard_gravity_m_per_s2 = 9.80665;

shelf::CriterionSpec criterion_of(const Scenario& s) {
    shelf::CriterionSpec spec;
    const StorageSettings& st = s.storage;
    try {
        spec.criterion = shelf::criterion_from_name(st.criterion);
        spec.value = st.criterion_value.value_or(shelf::default_criterion_value(spec.criterion));
        spec.scattering.optics = shelf::optics_from_name(st.optics);
        spec.scattering.scattering_angle_deg = st.scattering_angle_deg;
        spec.scattering.wavelength_nm = st.wavelength_nm;
        spec.scattering.medium_refractive_index = st.medium_refractive_index;
        spec.fractal_dimension = st.fractal_dimension;
        shelf::validate_criterion(spec);
    } catch (const std::invalid_argument& error) {
        std::string message = s.source;
        message += ": [storage] ";
        message += error.what();
        throw InputError(message);
    }
    return spec;
}

// Number-fraction mean of the species' median radii: the primary particle of the criteria.
double primary_radius_m(const Scenario& s) {
    double a = 0;
    for (const SpeciesSpec& sp : s.species) a += sp.number_fraction * sp.radius_nm * 1e-9;
    return a;
}

}  // namespace

std::vector<std::string> shelf_life_cautions() {
    return {
        stability_caution(),
        "The p5-p95 band reflects the uncertainty of the inputs only, not model error: the model-choice table shows "
        "how far the choice of model alone moves the time.",
        "Zeta potentials understate the surface potential the double layer sets; a zeta-based estimate errs towards "
        "instability.",
        "DLVO omits specific adsorption of multivalent ions: the real tolerance to the second salt is usually lower "
        "than its margin here; calibrate with that salt.",
        "Real-time and accelerated stability testing, the applicable regulations and standards, and qualified "
        "judgement decide a shelf life; this estimate does not.",
    };
}

std::vector<std::string> shelf_life_not_modelled() {
    return {"sedimentation and creaming (the Stokes settling distance is given)", "Ostwald ripening",
            "shear during mixing, filling and transport", "pH drift and charge regulation", "freeze-thaw cycles"};
}

namespace {

Percentiles percentiles_of(std::vector<double> values) {
    std::sort(values.begin(), values.end());
    return {uncertainty::estimate_percentile(values, 0.05), uncertainty::estimate_percentile(values, 0.50),
            uncertainty::estimate_percentile(values, 0.95)};
}

std::optional<double> finite_or_empty(double v) { return std::isfinite(v) ? std::optional<double>(v) : std::nullopt; }

std::string concentration_note(const Scenario& s) {
    bool radius_varies = false;
    for (const UncertainInput& u : s.uncertain_inputs)
        radius_varies = radius_varies || (u.slot == InputSlot::radius_nm && !u.distribution.is_point());
    std::string held = s.number_density_per_m3 ? "the number density is held fixed while the radius varies"
                       : s.mass_fraction       ? "the mass fraction is held fixed while the radius varies, so the "
                                                 "number density follows 1/a^3"
                                               : "the volume fraction is held fixed while the radius varies, so the "
                                                 "number density follows 1/a^3";
    return radius_varies ? held : held + " (the radius does not vary here)";
}

// The time at the first temperature with every input at its median, under each double-layer
// model, with and without retardation, with and without the Honig factor.
std::vector<ModelChoice> model_choices(const Scenario& s, const ShelfLifeReport& r, double temperature_K) {
    std::vector<ModelChoice> out;
    for (const auto model : {potentials::DoubleLayerModel::linear_superposition,
                             potentials::DoubleLayerModel::constant_potential,
                             potentials::DoubleLayerModel::constant_charge})
        for (const bool retarded : {false, true})
            for (const bool honig : {true, false}) {
                Scenario at = s;
                at.double_layer = model;
                at.retarded_vdw = retarded;
                const StorageCondition c = storage_conditions(at, {temperature_K}, r.hold, honig, s).front();
                ModelChoice m;
                m.double_layer = double_layer_name(model);
                m.retarded_vdw = retarded;
                m.hydrodynamic_correction = honig;
                m.log10_w = c.log10_stability_ratio;
                const double t = time_from_log10_tau(c.log10_tau_s, r);
                m.beyond_range = !(t <= shelf_life_time_limit_s);
                m.time_s = m.beyond_range ? shelf_life_time_limit_s : t;
                m.is_scenario_choice = model == s.double_layer && retarded == s.retarded_vdw &&
                                       honig == s.storage.hydrodynamic_correction;
                out.push_back(m);
            }
    return out;
}

// The plot: the time at the first temperature against the varied salt, p50 and the pointwise
// p5-p95 band over the ensemble, on 25 concentrations spread evenly in log c.
ShelfLifePlotData plot_data(const Scenario& s, const Ensemble& e, const ShelfLifeReport& r) {
    if (!s.titrant && !s.salt)
        throw InputError(s.source + ": --plot: the plot varies the salt, and [electrolyte] has no salt or titrant");
    const double temperature_K = r.conditions.front().condition.temperature_K;
    double low = 0.1, high = 1000;
    if (r.ccc_mM && *r.ccc_mM > 0) {
        low = *r.ccc_mM / 100;
        high = *r.ccc_mM * 3;
    }
    if (r.present_salt_mM && *r.present_salt_mM > 0) {
        low = std::min(low, *r.present_salt_mM / 10);
        high = std::max(high, *r.present_salt_mM * 10);
    }
    high = std::min(high, max_total_salt_mM);
    ShelfLifePlotData d;
    const int points = 25;
    for (int k = 0; k < points; ++k) {
        const double c = low * std::pow(high / low, double(k) / (points - 1));
        const auto change = [&](const Scenario& m) { return at_varied_salt(m, c); };
        d.salt_mM.push_back(c);
        const std::vector<double> times = ensemble_times(e, temperature_K, r, s.storage.hydrodynamic_correction, change);
        d.p5_s.push_back(uncertainty::percentile(times, 0.05));
        d.p50_s.push_back(uncertainty::percentile(times, 0.50));
        d.p95_s.push_back(uncertainty::percentile(times, 0.95));
    }
    d.salt_name = r.varied_salt + (s.titrant ? " added" : "");
    d.criterion_label = std::string(shelf::criterion_name(r.criterion.criterion)) + " " + g4(r.criterion.value);
    d.title = "Time to " + d.criterion_label + " at " + g4(temperature_K - 273.15) + " degC against " + r.varied_salt;
    d.present_salt_mM = r.present_salt_mM;
    d.ccc_mM = r.ccc_mM;
    d.target_s = r.target_s;
    d.caption_lines = {"Band: pointwise p5-p95 over " + std::to_string(e.members.size()) +
                           " Monte Carlo samples; it reflects input uncertainty only, not model error.",
                       stability_caution()};
    return d;
}

}  // namespace

ShelfLifeReport compute_shelf_life(const Scenario& given, const ShelfLifeOptions& options) {
    ShelfLifeReport r;
    r.criterion = criterion_of(given);
    r.target_s = given.storage.target_days * seconds_per_day;
    r.hold = given.storage.surface_hold == "charge" ? SurfaceHold::charge : SurfaceHold::potential;
    std::vector<double> temperatures_K;
    for (double t_C : given.storage.temperatures_C) {
        if (!(t_C >= 0.0 && t_C <= 100.0))
            throw InputError(given.source + ": [storage] temperatures_C = " + g4(t_C) +
                             ": the water correlations hold from 0 to 100 degC");
        temperatures_K.push_back(t_C + 273.15);
    }
    const bool hydrodynamic = given.storage.hydrodynamic_correction;

    // A calibration replaces the fitted parameters by their estimates, and the Monte Carlo
    // then draws them jointly from the fit.
    Scenario s = given;
    std::optional<JointDraw> joint;
    if (given.calibration_given) {
        r.calibration = calibrate(given);
        s = with_fit_values(given, r.calibration->fit_values);
        // A fitted value is drawn from the fit, not from a distribution the scenario gives it.
        const auto fitted = [&](const UncertainInput& u) {
            for (const std::string& name : given.calibration.parameters)
                if ((name == "surface_potential_mV" && u.slot == InputSlot::surface_potential_mV) ||
                    (name == "hamaker_J" && u.slot == InputSlot::hamaker_J))
                    return true;
            return false;
        };
        for (const UncertainInput& u : given.uncertain_inputs)
            if (fitted(u))
                r.warnings.push_back(u.key + " = " + u.distribution.text() +
                                     ": replaced by the calibration, whose fit the Monte Carlo draws from");
        std::erase_if(s.uncertain_inputs, fitted);
        // The fit holds every value it does not fit at its median: an uncertain value that the
        // data also constrain (the Hamaker constant, the radius) is then drawn independently of
        // the fitted one, which ignores their correlation through the data.
        for (const UncertainInput& u : s.uncertain_inputs)
            if (!u.distribution.is_point() &&
                (u.slot == InputSlot::hamaker_J || u.slot == InputSlot::radius_nm))
                r.warnings.push_back(u.key + " = " + u.distribution.text() +
                                     ": the calibration was fitted with it at its median and the Monte Carlo draws it "
                                     "independently of the fitted parameters, which can widen or shift the band; fit it "
                                     "too (hamaker_J) or give it as a single value");
        std::vector<std::string> names;
        for (const std::string& coordinate : r.calibration->fit_coordinates) names.push_back("fitted " + coordinate);
        joint = JointDraw{names, r.calibration->fit_values, r.calibration->covariance,
                          [](const Scenario& base, const std::vector<double>& x) { return with_fit_values(base, x); }};
        for (const std::string& w : r.calibration->warnings) r.warnings.push_back("calibration: " + w);
    }
    r.primary_radius_m = primary_radius_m(s);
    r.number_density_per_m3 = number_density_per_m3(s).value_or(0.0);
    const std::vector<StorageCondition> conditions = storage_conditions(s, temperatures_K, r.hold, hydrodynamic);
    if (auto w = shelf::early_stage_warning(r.criterion)) r.warnings.push_back(*w);
    r.concentration_note = concentration_note(s);

    // The Monte Carlo (or the point estimate alone when nothing varies).
    const ShelfLifeSampler sampler(s, joint ? &*joint : nullptr);
    r.inputs_vary = sampler.varies();
    r.input_names = sampler.input_names();
    const auto time_for = [&r](double log10_tau) { return time_from_log10_tau(log10_tau, r); };
    SampledConditions sampled;
    Ensemble band;
    if (r.inputs_vary) {
        r.samples = static_cast<std::uint64_t>(s.storage.samples);
        r.band_samples = std::min<std::uint64_t>(r.samples, static_cast<std::uint64_t>(s.storage.band_samples));
        sampled = sample_conditions(sampler, r.samples, temperatures_K, r.hold, hydrodynamic, time_for);
        band.quadrature = WQuadrature::fast;
        for (std::uint64_t i = 0; i < r.band_samples; ++i) band.members.push_back(sampler.sample(i));
    } else {
        sampled.inputs.assign(r.input_names.size(), {});
        for (std::size_t j = 0; j < r.input_names.size(); ++j) sampled.inputs[j] = {0.0};
        for (const StorageCondition& c : conditions) {
            sampled.log10_w.push_back({c.log10_stability_ratio});
            sampled.log10_tau_s.push_back({c.log10_tau_s});
            sampled.time_s.push_back({time_for(c.log10_tau_s)});
        }
        band.members = {s};
    }

    const bool has_varied_salt = s.titrant.has_value() || s.salt.has_value();
    if (has_varied_salt) r.varied_salt = varied_salt_name(s);
    if (s.salt && !s.titrant) r.present_salt_mM = s.salt_concentration_mM;
    for (std::size_t k = 0; k < conditions.size(); ++k) {
        ConditionEstimate e;
        e.condition = conditions[k];
        e.time_s = percentiles_of(sampled.time_s[k]);
        e.log10_w = percentiles_of(sampled.log10_w[k]);
        e.log10_half_life_s = percentiles_of(sampled.log10_tau_s[k]);
        e.p5_time_over_target = std::min(e.time_s.p5.value, shelf_life_time_limit_s) / r.target_s;
        const double T = conditions[k].temperature_K;
        const std::vector<double> band_times = ensemble_times(band, T, r, hydrodynamic, [](const Scenario& m) { return m; });
        const double band_p5 = uncertainty::percentile(band_times, 0.05);
        const double band_p50 = uncertainty::percentile(band_times, 0.50);
        if (has_varied_salt) {
            e.added_salt_p5 = margin_for(band, r.varied_salt, T, 0.05, band_p5, r, hydrodynamic);
            e.added_salt_p50 = margin_for(band, r.varied_salt, T, 0.50, band_p50, r, hydrodynamic);
            const std::vector<double> cccs = ensemble_cccs(band, T, r);
            e.ccc_p5_mM = finite_or_empty(uncertainty::percentile(cccs, 0.05));
            e.ccc_p50_mM = finite_or_empty(uncertainty::percentile(cccs, 0.50));
        } else {
            e.added_salt_p5.reason = e.added_salt_p50.reason = "no salt formula in [electrolyte] (salt or titrant) to add";
        }
        e.added_second_salt_p5 = margin_for(band, s.storage.second_salt, T, 0.05, band_p5, r, hydrodynamic);
        e.added_second_salt_p50 = margin_for(band, s.storage.second_salt, T, 0.50, band_p50, r, hydrodynamic);
        if (!r.inputs_vary) {
            e.sensitivity_note = "no input varies: nothing to rank";
        } else {
            std::vector<uncertainty::SampledInput> inputs;
            for (std::size_t j = 0; j < r.input_names.size(); ++j) inputs.push_back({r.input_names[j], sampled.inputs[j]});
            try {
                e.sensitivity = uncertainty::rank_sensitivity(inputs, sampled.time_s[k]);
                if (!e.sensitivity->output_varied) e.sensitivity_note = "the time does not vary over the samples";
                else if (!e.sensitivity->reliable)
                    e.sensitivity_note = "R^2 = " + g4(e.sensitivity->r_squared) +
                                         " < 0.7: the ranking is unreliable (non-monotone or interacting effects)";
            } catch (const std::exception& error) {
                e.sensitivity_note = std::string("no ranking: ") + error.what();
            }
        }
        r.conditions.push_back(std::move(e));
    }

    if (has_varied_salt) {
        const double ccc = ccc_at_temperature(s, temperatures_K.front(), r);
        r.ccc_mM = finite_or_empty(ccc);
        if (!r.ccc_mM) r.ccc_note = "the barrier survives 5 M of " + r.varied_salt;
    } else {
        r.ccc_note = "no salt formula in [electrolyte] (salt or titrant): the CCC needs a salt to vary";
    }
    r.model_choices = model_choices(s, r, temperatures_K.front());

    if (s.particle_density_kg_per_m3) {
        const StorageCondition& ref = conditions.front();
        const double drho = *s.particle_density_kg_per_m3 - potentials::water_density_kg_per_m3(ref.temperature_K);
        const double velocity = 2 * r.primary_radius_m * r.primary_radius_m * drho * standard_gravity_m_per_s2 /
                                (9 * ref.medium.viscosity_Pa_s);
        r.settling_distance_m = velocity * r.target_s;
        // Sedimentation-diffusion equilibrium (Perrin 1909): the number density falls as
        // exp(-z / l_g) with l_g = kT / (|drho| V g); Brownian motion keeps single particles
        // spread over about l_g however long they stand.
        const double volume_m3 = 4.0 / 3.0 * 3.141592653589793 * std::pow(r.primary_radius_m, 3);
        if (drho != 0)
            r.gravitational_length_m = 1.380649e-23 * ref.temperature_K /
                                       (std::abs(drho) * volume_m3 * standard_gravity_m_per_s2);
        r.settling_note = velocity >= 0 ? "settles (Stokes, single particles, at the first temperature)"
                                        : "creams upwards (negative distance; Stokes, single particles)";
    } else {
        r.settling_note = "give [suspension] particle_density_kg_per_m3 for the Stokes settling distance";
    }
    if (options.plot) r.plot = plot_data(s, band, r);
    return r;
}

}  // namespace brownfloc::sim
