// The shelf-life report as JSON and as readable text (the keys are documented in README.md,
// "Shelf-life estimates").
#include <cmath>
#include <cstdio>

#include "report_format.hpp"
#include "shelf_life_format.hpp"
#include "sha256.hpp"
#include "sim/dlvo_report.hpp"
#include "shelf_criteria/criterion_time.hpp"
#include "sim/shelf_life_report.hpp"

namespace brownfloc::sim {

using namespace detail;

namespace {

// A time for JSON: capped at the limit (beyond_range says so); an interval end that is open
// (no order statistic far enough out) is null.
Json capped_time(double t_s) { return Json(std::min(t_s, shelf_life_time_limit_s)); }

Json percentile_json(const uncertainty::PercentileEstimate& e, bool is_time) {
    Json j = Json::object();
    j.set("value", is_time ? capped_time(e.value) : Json(e.value));
    j.set("lower_95", std::isfinite(e.lower) ? (is_time ? capped_time(e.lower) : Json(e.lower)) : Json());
    j.set("upper_95", std::isfinite(e.upper) ? (is_time ? capped_time(e.upper) : Json(e.upper)) : Json());
    j.set("interval_coverage", e.interval.coverage);
    return j;
}

Json percentiles_json(const Percentiles& p, bool is_time) {
    Json j = Json::object();
    j.set("p5", is_time ? capped_time(p.p5.value) : Json(p.p5.value));
    j.set("p50", is_time ? capped_time(p.p50.value) : Json(p.p50.value));
    j.set("p95", is_time ? capped_time(p.p95.value) : Json(p.p95.value));
    Json detail = Json::object();
    detail.set("p5", percentile_json(p.p5, is_time));
    detail.set("p50", percentile_json(p.p50, is_time));
    detail.set("p95", percentile_json(p.p95, is_time));
    j.set("intervals", detail);
    if (is_time) {
        Json beyond = Json::object();
        beyond.set("p5", !(p.p5.value <= shelf_life_time_limit_s));
        beyond.set("p50", !(p.p50.value <= shelf_life_time_limit_s));
        beyond.set("p95", !(p.p95.value <= shelf_life_time_limit_s));
        j.set("beyond_range", beyond);
    }
    return j;
}

Json margin_json(const SaltMargin& p5, const SaltMargin& p50) {
    Json m = Json::object();
    m.set_number_or_null("p5", p5.added_mM, p5.reason);
    m.set_number_or_null("p50", p50.added_mM, p50.reason);
    if (!p5.added_mM || !p50.added_mM) m.set("reason", !p5.added_mM ? p5.reason : p50.reason);
    return m;
}

Json sensitivity_json(const ConditionEstimate& e) {
    Json j = Json::object();
    if (e.sensitivity) {
        j.set("r_squared", e.sensitivity->r_squared);
        j.set("reliable", e.sensitivity->reliable);
        Json ranked = Json::array();
        for (const std::size_t k : e.sensitivity->by_influence) {
            const uncertainty::InputSensitivity& in = e.sensitivity->inputs[k];
            Json item = Json::object();
            item.set("input", in.name);
            item.set("srrc", *in.srrc);
            item.set("spearman_rho", *in.spearman_rho);
            ranked.push(item);
        }
        j.set("ranking", ranked);
    }
    if (!e.sensitivity_note.empty()) j.set("note", e.sensitivity_note);
    return j;
}

Json resolved_inputs_json(const Scenario& s) {
    Json inputs = Json::array();
    for (const UncertainInput& u : s.uncertain_inputs) {
        Json item = Json::object();
        item.set("key", u.key);
        item.set("distribution", u.distribution.text());
        item.set("median", u.distribution.quantile(0.5));
        item.set("input_index", static_cast<std::int64_t>(u.input_index));
        inputs.push(item);
    }
    return inputs;
}

std::string time_text(double t_s) {
    if (!(t_s <= shelf_life_time_limit_s)) return "> " + g4(shelf_life_time_limit_s / seconds_per_day);
    return g4(t_s / seconds_per_day);
}

// How the time follows from tau for each criterion (Smoluchowski 1917, constant kernel).
std::string criterion_formula(const shelf::CriterionSpec& c) {
    switch (c.criterion) {
        case shelf::Criterion::count_drop: return "count drop g: t/tau = g / (1 - g)";
        case shelf::Criterion::mean_size: return "mean size m = N0/N: t/tau = m - 1";
        case shelf::Criterion::aggregated_fraction: return "aggregated fraction g: t/tau = 1/sqrt(1 - g) - 1";
        case shelf::Criterion::z_average_growth: return "z-average growth: t/tau solved from the z-average series";
    }
    return "";
}

std::string interval_text(const uncertainty::PercentileEstimate& e) {
    const auto end = [](double t_s) {
        if (std::isinf(t_s) && t_s < 0) return std::string("open");
        return t_s <= shelf_life_time_limit_s ? g4(t_s / seconds_per_day) : std::string("beyond range");
    };
    if (!(e.lower <= shelf_life_time_limit_s)) return "beyond range (above 1e12 s)";
    return "from " + end(e.lower) + " to " + end(e.upper) + " days";
}

// The short form for the table (the JSON keeps the whole reason).
std::string margin_text(const SaltMargin& m) {
    if (m.added_mM) return g4(*m.added_mM) + " mM";
    for (const char* start : {"already missed", "never reached"})
        if (m.reason.rfind(start, 0) == 0) return start;
    return m.reason;
}

}  // namespace

Json shelf_life_json(const ShelfLifeReport& r, const Scenario& s) {
    Json j = Json::object();
    j.set("criterion", std::string(shelf::criterion_name(r.criterion.criterion)));
    j.set("criterion_value", r.criterion.value);
    if (r.criterion.criterion == shelf::Criterion::z_average_growth) {
        j.set("optics", std::string(shelf::optics_name(r.criterion.scattering.optics)));
        j.set("fractal_dimension", r.criterion.fractal_dimension);
    }
    j.set("target_days", s.storage.target_days);
    j.set("surface_hold", s.storage.surface_hold);
    j.set("hydrodynamic_correction", s.storage.hydrodynamic_correction);
    j.set("double_layer", std::string(double_layer_name(s.double_layer)));
    j.set("retarded_vdw", s.retarded_vdw);
    j.set("primary_radius_nm", r.primary_radius_m * 1e9);
    j.set("number_density_per_m3", r.number_density_per_m3);
    j.set("time_over_tau", shelf::criterion_t_over_tau(r.criterion, r.primary_radius_m));
    j.set("samples", static_cast<std::int64_t>(r.samples));
    j.set("band_samples", static_cast<std::int64_t>(r.band_samples));
    j.set("inputs_vary", r.inputs_vary);
    j.set("uncertainty_note",
          r.inputs_vary ? "p5, p50 and p95 over the Monte Carlo samples; the band reflects input uncertainty only, not "
                          "model error"
                        : "no input varies: p5 = p50 = p95 = the point estimate");
    j.set("concentration_note", r.concentration_note);
    j.set("uncertain_inputs", resolved_inputs_json(s));
    Json conditions = Json::array();
    for (const ConditionEstimate& e : r.conditions) {
        const StorageCondition& c = e.condition;
        Json item = Json::object();
        item.set("temperature_C", c.temperature_K - 273.15);
        item.set("surface_potential_mV", Json(Json::Array(c.surface_potential_mV.begin(), c.surface_potential_mV.end())));
        item.set("debye_length_nm", c.debye_length_nm);
        item.set_number_or_null("stability_ratio", c.log10_stability_ratio < 300 ? std::optional<double>(std::pow(10.0, c.log10_stability_ratio)) : std::nullopt,
                                "above 1e300; see log10_stability_ratio");
        item.set("log10_stability_ratio", c.log10_stability_ratio);
        item.set("log10_stability_ratio_percentiles", percentiles_json(e.log10_w, false));
        item.set("half_life_fast_s", c.half_life_fast_s);
        item.set_number_or_null("half_life_s", c.log10_tau_s < 300 ? std::optional<double>(std::pow(10.0, c.log10_tau_s)) : std::nullopt,
                                "above 1e300 s; see log10_half_life_s");
        item.set("log10_half_life_s", c.log10_tau_s);
        item.set("log10_half_life_s_percentiles", percentiles_json(e.log10_half_life_s, false));
        item.set("time_to_criterion_s", percentiles_json(e.time_s, true));
        item.set("beyond_range", !(e.time_s.p50.value <= shelf_life_time_limit_s));
        item.set("p5_time_over_target", e.p5_time_over_target);
        item.set("acceleration_vs_reference", c.acceleration_vs_reference);
        item.set("acceleration_from_medium", c.acceleration_from_medium);
        item.set("acceleration_from_stability", c.acceleration_from_stability);
        item.set("rule_of_thumb_factor", c.rule_of_thumb_factor);
        Json ccc = Json::object();
        ccc.set_number_or_null("p5", e.ccc_p5_mM, "no barrier CCC");
        ccc.set_number_or_null("p50", e.ccc_p50_mM, "no barrier CCC");
        item.set("ccc_mM", ccc);
        Json margin = Json::object();
        const auto ratio = [&](const std::optional<double>& ccc_mM) -> std::optional<double> {
            if (ccc_mM && r.present_salt_mM && *r.present_salt_mM > 0) return *ccc_mM / *r.present_salt_mM;
            return std::nullopt;
        };
        margin.set_number_or_null("p5", ratio(e.ccc_p5_mM), "needs a CCC and a present salt concentration above 0");
        margin.set_number_or_null("p50", ratio(e.ccc_p50_mM), "needs a CCC and a present salt concentration above 0");
        item.set("salt_margin", margin);
        item.set("added_salt_to_target_mM", margin_json(e.added_salt_p5, e.added_salt_p50));
        item.set("added_second_salt_to_target_mM", margin_json(e.added_second_salt_p5, e.added_second_salt_p50));
        item.set("sensitivity", sensitivity_json(e));
        conditions.push(item);
    }
    j.set("conditions", conditions);
    j.set("rule_of_thumb_note", rule_of_thumb_caution());
    j.set("varied_salt", r.varied_salt.empty() ? Json() : Json(r.varied_salt));
    if (r.varied_salt.empty()) j.set("varied_salt_note", "no salt formula in [electrolyte] (salt or titrant)");
    j.set("second_salt", s.storage.second_salt);
    j.set("second_salt_note",
          "DLVO omits specific adsorption of multivalent ions: the real tolerance is usually lower; calibrate with "
          "that salt");
    j.set_number_or_null("present_salt_mM", r.present_salt_mM,
                         r.varied_salt.empty() ? "no salt formula in [electrolyte]"
                                               : "the varied salt is a titrant added on top: none present");
    j.set_number_or_null("ccc_mM", r.ccc_mM, r.ccc_note.empty() ? "no CCC" : r.ccc_note);
    std::optional<double> margin;
    if (r.ccc_mM && r.present_salt_mM && *r.present_salt_mM > 0) margin = *r.ccc_mM / *r.present_salt_mM;
    j.set_number_or_null("salt_margin", margin, "needs the CCC and a present salt concentration above 0");
    Json choices = Json::array();
    for (const ModelChoice& m : r.model_choices) {
        Json item = Json::object();
        item.set("double_layer", m.double_layer);
        item.set("retarded_vdw", m.retarded_vdw);
        item.set("hydrodynamic_correction", m.hydrodynamic_correction);
        item.set("log10_stability_ratio", m.log10_w);
        item.set("time_to_criterion_s", m.time_s);
        item.set("beyond_range", m.beyond_range);
        item.set("scenario_choice", m.is_scenario_choice);
        choices.push(item);
    }
    j.set("model_choices", choices);
    j.set("model_choices_note", "time to the criterion at the first temperature, every input at its median");
    if (r.calibration) {
        j.set("calibration", calibration_json(*r.calibration));
        // The fitted values at the top level too: calibrated_surface_potential_mV, calibrated_hamaker_J.
        for (const FittedParameter& p : r.calibration->parameters) {
            Json fitted = Json::object();
            fitted.set("estimate", p.estimate);
            fitted.set_number_or_null("standard_error", std::isfinite(p.standard_error) ? std::optional<double>(p.standard_error) : std::nullopt,
                                      "the data do not determine this parameter");
            fitted.set("ci95_low", p.ci95_low);
            fitted.set("ci95_high", p.ci95_high);
            if (p.bound_message) fitted.set("bound_message", *p.bound_message);
            j.set("calibrated_" + p.name, fitted);
        }
        j.set("calibration_note", "the Monte Carlo draws the fitted parameters jointly from the fit (normal, with its "
                                  "covariance)");
    }
    j.set_number_or_null("settling_distance_m", r.settling_distance_m, r.settling_note);
    j.set_number_or_null("gravitational_length_m", r.gravitational_length_m,
                         "needs particle_density_kg_per_m3 different from the medium's");
    j.set("not_modelled", Json(shelf_life_not_modelled()));
    j.set("cautions", Json(shelf_life_cautions()));
    j.set("warnings", Json(r.warnings));
    const std::string resolved = resolved_scenario_toml(s);
    j.set("input_sha256", sha256_hex(resolved));
    j.set("resolved_scenario", resolved);
    j.set("seed", s.run.seed);
    add_common_json(j, s);
    return j;
}

void write_shelf_life_text(std::ostream& out, const ShelfLifeReport& r, const Scenario& s) {
    out << "Shelf-life estimate for " << s.source << "\n";
    out << "  criterion: " << shelf::criterion_name(r.criterion.criterion) << " = " << g4(r.criterion.value)
        << "; target " << g4(s.storage.target_days) << " days; surface " << s.storage.surface_hold
        << " held fixed across temperatures; W " << (s.storage.hydrodynamic_correction ? "with" : "without")
        << " hydrodynamic drainage\n";
    if (r.inputs_vary) {
        out << "  Monte Carlo: " << r.samples << " samples (seed " << s.run.seed << "), margins over the first "
            << r.band_samples << "; the band reflects input uncertainty only, not model error\n";
        for (const UncertainInput& u : s.uncertain_inputs)
            out << "    " << u.key << " = " << u.distribution.text() << "\n";
        if (r.calibration) out << "    fitted parameters drawn jointly from the calibration\n";
        out << "  " << r.concentration_note << "\n";
    } else {
        out << "  no input varies: p5 = p50 = p95 = the point estimate\n";
    }
    const double ratio = shelf::criterion_t_over_tau(r.criterion, r.primary_radius_m);
    out << "\n  Every input at its median: n0 = " << g4(r.number_density_per_m3) << " per m^3, fast half-life t1/2 = "
        << "3 eta / (4 kT n0), tau = W t1/2, time = tau x " << g4(ratio) << " (" << criterion_formula(r.criterion)
        << ")\n";
    out << "  T (degC)   t1/2 fast (s)   log10 W          W    tau (s)   time (days)   acceleration (T/eta x W)   "
           "2^(dT/10)\n";
    for (const ConditionEstimate& e : r.conditions) {
        const StorageCondition& c = e.condition;
        const double tau = std::pow(10.0, c.log10_tau_s);
        char line[320];
        std::snprintf(line, sizeof line, "  %7.1f   %13.4g   %7.3f  %9.4g  %9.4g   %11s   %8.3g (%.3g x %.3g)   %9.3g\n",
                      c.temperature_K - 273.15, c.half_life_fast_s, c.log10_stability_ratio,
                      std::pow(10.0, c.log10_stability_ratio), tau, time_text(tau * ratio).c_str(),
                      c.acceleration_vs_reference, c.acceleration_from_medium, c.acceleration_from_stability,
                      c.rule_of_thumb_factor);
        out << line;
    }
    out << "  " << rule_of_thumb_caution() << "\n\n";
    out << "  Over the samples (p5 / p50 / p95; time = tau x " << g4(ratio) << " sample by sample):\n";
    out << "  T (degC)   log10 W                   tau (s)                          time (days)                    "
           "p5 time / target\n";
    for (const ConditionEstimate& e : r.conditions) {
        char line[400];
        std::snprintf(line, sizeof line, "  %7.1f   %6.2f %6.2f %6.2f   %9.4g %9.4g %9.4g   %10s %10s %10s   %11.4g\n",
                      e.condition.temperature_K - 273.15, e.log10_w.p5.value, e.log10_w.p50.value, e.log10_w.p95.value,
                      std::pow(10.0, e.log10_half_life_s.p5.value), std::pow(10.0, e.log10_half_life_s.p50.value),
                      std::pow(10.0, e.log10_half_life_s.p95.value), time_text(e.time_s.p5.value).c_str(),
                      time_text(e.time_s.p50.value).c_str(), time_text(e.time_s.p95.value).c_str(),
                      e.p5_time_over_target);
        out << line;
    }
    if (r.inputs_vary) {
        out << "  95 % order-statistic intervals: ";
        const ConditionEstimate& first = r.conditions.front();
        out << "p5 time " << interval_text(first.time_s.p5) << ", p95 time " << interval_text(first.time_s.p95)
            << " at " << g4(first.condition.temperature_K - 273.15) << " degC (all in --json)\n";
        for (const ConditionEstimate& e : r.conditions) {
            if (!e.sensitivity || e.sensitivity->by_influence.empty()) {
                if (!e.sensitivity_note.empty())
                    out << "  " << g4(e.condition.temperature_K - 273.15) << " degC: " << e.sensitivity_note << "\n";
                continue;
            }
            out << "  " << g4(e.condition.temperature_K - 273.15) << " degC ranking (SRRC of the time):";
            for (const std::size_t k : e.sensitivity->by_influence)
                out << " " << e.sensitivity->inputs[k].name << " " << g4(*e.sensitivity->inputs[k].srrc) << ";";
            out << " R^2 " << g4(e.sensitivity->r_squared)
                << (e.sensitivity->reliable ? "" : " (below 0.7: the ranking is unreliable)") << "\n";
        }
    }
    out << "\nSalt margins (added on top of the present ions, at which the p5 / p50 time falls to the target; "
           "\"already missed\": the time is below the target without added salt; \"never reached\": not even at "
           "5 M)\n";
    for (const ConditionEstimate& e : r.conditions) {
        out << "  " << g4(e.condition.temperature_K - 273.15) << " degC: "
            << (r.varied_salt.empty() ? std::string("salt") : r.varied_salt) << " " << margin_text(e.added_salt_p5)
            << " / " << margin_text(e.added_salt_p50) << "; " << s.storage.second_salt << " "
            << margin_text(e.added_second_salt_p5) << " / " << margin_text(e.added_second_salt_p50);
        if (e.ccc_p5_mM && e.ccc_p50_mM)
            out << "; CCC " << g4(*e.ccc_p5_mM) << " / " << g4(*e.ccc_p50_mM) << " mM";
        out << "\n";
    }
    if (r.ccc_mM) out << "  CCC of " << r.varied_salt << " at the medians: " << g4(*r.ccc_mM) << " mM\n";
    else out << "  CCC: " << r.ccc_note << "\n";
    out << "  " << s.storage.second_salt << ": DLVO omits specific adsorption of multivalent ions; the real tolerance "
        << "is usually lower; calibrate with that salt.\n";
    if (r.calibration) {
        out << "\n";
        write_calibration_text(out, *r.calibration);
    }
    out << "\nModel choices (time to the criterion at " << g4(r.conditions.front().condition.temperature_K - 273.15)
        << " degC, inputs at their medians, days)\n";
    for (const ModelChoice& m : r.model_choices) {
        char line[200];
        std::snprintf(line, sizeof line, "  %-22s %-13s %-16s log10 W %8.3f   %12s%s\n", m.double_layer.c_str(),
                      m.retarded_vdw ? "retarded" : "non-retarded", m.hydrodynamic_correction ? "with Honig" : "without Honig",
                      m.log10_w, time_text(m.beyond_range ? INFINITY : m.time_s).c_str(),
                      m.is_scenario_choice ? "   <- this scenario" : "");
        out << line;
    }
    out << "\nNot modelled: ";
    const auto missing = shelf_life_not_modelled();
    for (std::size_t k = 0; k < missing.size(); ++k) out << (k ? "; " : "") << missing[k];
    out << ".\n";
    if (r.settling_distance_m) out << "Stokes settling over the target time: " << g4(*r.settling_distance_m * 1e3)
                                   << " mm (" << r.settling_note << ")"
                                   << (r.gravitational_length_m
                                           ? "; Brownian motion spreads single particles over a gravitational length "
                                             "kT / (drho V g) = " + g4(*r.gravitational_length_m * 1e3) + " mm (Perrin 1909)"
                                           : std::string())
                                   << "\n";
    else out << "Settling: " << r.settling_note << "\n";
    out << "\nProvenance: brownfloc " << BROWNFLOC_VERSION << "; input SHA-256 "
        << sha256_hex(resolved_scenario_toml(s)) << " (of the resolved scenario, distributions included); seed "
        << s.run.seed << "; " << r.samples << " samples; " << double_layer_name(s.double_layer) << ", "
        << (s.retarded_vdw ? "retarded" : "non-retarded") << " van der Waals, min_gap " << g4(s.min_gap_nm) << " nm\n";
    out << "\nCautions\n";
    for (const std::string& c : shelf_life_cautions()) out << "  - " << c << "\n";
    if (!r.warnings.empty()) {
        out << "\nWarnings\n";
        for (const std::string& w : r.warnings) out << "  - " << w << "\n";
    }
}

}  // namespace brownfloc::sim
