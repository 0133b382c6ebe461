#include "sim/shelf_life_report.hpp"

#include <cmath>
#include <cstdio>
#include <stdexcept>

#include "potentials/electrolyte.hpp"
#include "potentials/input_error.hpp"
#include "report_format.hpp"
#include "sha256.hpp"
#include "shelf_criteria/criterion_time.hpp"
#include "shelf_criteria/early_stage.hpp"
#include "shelf_criteria/scattering_setup.hpp"
#include "sim/ccc_report.hpp"
#include "sim/dlvo_report.hpp"
#include "sim/scenario_physics.hpp"

namespace brownfloc::sim {

namespace {

constexpr double seconds_per_day = 86400.0;
constexpr double max_total_salt_mM = 5000.0;  // as the scenario schema allows
constexpr double standard_gravity_m_per_s2 = 9.80665;

std::string g4(double v) {
    char buffer[32];
    std::snprintf(buffer, sizeof buffer, "%.4g", v);
    return buffer;
}

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

// The scenario with `added_mM` of `formula` on top of its ions (as an ion list).
Scenario with_added_salt(const Scenario& s, const std::string& formula, double added_mM) {
    Scenario out = s;
    const potentials::Electrolyte mixed =
        electrolyte_of(s).plus(potentials::Electrolyte::from_salt(formula, added_mM));
    out.salt.reset();
    out.salt_concentration_mM = 0;
    out.titrant.reset();
    out.ions.clear();
    for (const potentials::Ion& ion : mixed.ions()) out.ions.push_back({ion.valence, ion.concentration_mol_per_m3});
    return out;
}

// Time to the criterion [s] from log10 tau; +inf when it overflows.
double time_from_log10_tau(double log10_tau, const ShelfLifeReport& r) {
    if (log10_tau > 300) return INFINITY;
    try {
        return shelf::time_to_criterion_s(r.criterion, std::pow(10.0, log10_tau), r.primary_radius_m);
    } catch (const std::range_error&) {
        return INFINITY;
    }
}

// Time to the criterion [s] for a scenario at one temperature; +inf when it overflows.
double time_at(const Scenario& s, double temperature_K, const ShelfLifeReport& r, const Scenario& reference) {
    const std::vector<StorageCondition> c =
        storage_conditions(s, {temperature_K}, r.hold, reference.storage.hydrodynamic_correction, reference);
    return time_from_log10_tau(c.front().log10_tau_s, r);
}

// The added salt at which the time to the criterion falls to the target (bisection; the
// time falls as salt screens the double layer).
SaltMargin margin_for(const Scenario& s, const std::string& formula, double temperature_K, double time_now_s,
                      const ShelfLifeReport& r) {
    SaltMargin margin;
    if (time_now_s <= r.target_s) {
        margin.reason = "already missed: without added salt the time is below the target";
        return margin;
    }
    const double room = max_total_salt_mM - electrolyte_of(s).ionic_strength_mol_per_m3();
    double hi = std::max(room, 1.0);
    if (time_at(with_added_salt(s, formula, hi), temperature_K, r, s) > r.target_s) {
        margin.reason = "never reached: even " + g4(hi) + " mM of " + formula + " added leaves the time above the target";
        return margin;
    }
    double lo = 0;
    for (int k = 0; k < 200 && (lo == 0 ? hi > 1e-9 : hi > lo * (1 + 1e-7)); ++k) {
        const double mid = lo == 0 ? hi / 1000 : std::sqrt(lo * hi);
        (time_at(with_added_salt(s, formula, mid), temperature_K, r, s) > r.target_s ? lo : hi) = mid;
    }
    margin.added_mM = hi;
    return margin;
}

// Water density [kg/m^3] at 0-40 degC, Tanaka et al. 2001, Metrologia 38, 301 [memory for
// the coefficients; 997.05 at 25 degC].
double water_density_kg_per_m3(double temperature_K) {
    const double t = temperature_K - 273.15;
    const double a1 = -3.983035, a2 = 301.797, a3 = 522528.9, a4 = 69.34881, a5 = 999.974950;
    return a5 * (1 - (t + a1) * (t + a1) * (t + a2) / (a3 * (t + a4)));
}

}  // namespace

std::vector<std::string> shelf_life_cautions() {
    return {
        stability_caution(),
        "The p5-p95 band reflects the uncertainty of the inputs only, not model error; this version treats every "
        "input as exact, so the band is a single value.",
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

ShelfLifeReport compute_shelf_life(const Scenario& s) {
    ShelfLifeReport r;
    r.criterion = criterion_of(s);
    r.primary_radius_m = primary_radius_m(s);
    r.target_s = s.storage.target_days * seconds_per_day;
    r.hold = s.storage.surface_hold == "charge" ? SurfaceHold::charge : SurfaceHold::potential;
    std::vector<double> temperatures_K;
    for (double t_C : s.storage.temperatures_C) {
        if (!(t_C >= 0.0 && t_C <= 100.0))
            throw InputError(s.source + ": [storage] temperatures_C = " + g4(t_C) +
                             ": the water correlations hold from 0 to 100 degC");
        temperatures_K.push_back(t_C + 273.15);
    }
    const std::vector<StorageCondition> conditions =
        storage_conditions(s, temperatures_K, r.hold, s.storage.hydrodynamic_correction);
    if (auto w = shelf::early_stage_warning(r.criterion)) r.warnings.push_back(*w);

    const bool has_varied_salt = s.titrant.has_value() || s.salt.has_value();
    if (has_varied_salt) r.varied_salt = varied_salt_name(s);
    if (s.salt) r.present_salt_mM = s.salt_concentration_mM;
    for (const StorageCondition& c : conditions) {
        ConditionEstimate e;
        e.condition = c;
        const double t = time_from_log10_tau(c.log10_tau_s, r);  // tau of this condition, computed above
        e.beyond_range = !(t <= shelf_life_time_limit_s);
        e.time_to_criterion_s = e.beyond_range ? shelf_life_time_limit_s : t;
        e.time_over_target = e.time_to_criterion_s / r.target_s;
        if (has_varied_salt) e.added_salt = margin_for(s, r.varied_salt, c.temperature_K, t, r);
        else e.added_salt.reason = "no salt formula in [electrolyte] (salt or titrant) to add";
        e.added_second_salt = margin_for(s, s.storage.second_salt, c.temperature_K, t, r);
        r.conditions.push_back(std::move(e));
    }

    if (has_varied_salt) {
        try {
            const CccReport ccc = compute_ccc_report(s);
            const PairCcc& limiting = ccc.pairs.at(ccc.limiting_pair);
            r.ccc_mM = limiting.ccc_mM;
            if (!r.ccc_mM) r.ccc_note = limiting.ccc_note;
        } catch (const InputError& error) {
            r.ccc_note = error.what();
        }
    } else {
        r.ccc_note = "no salt formula in [electrolyte] (salt or titrant): the CCC needs a salt to vary";
    }

    if (s.storage.particle_density_kg_per_m3) {
        const StorageCondition& ref = conditions.front();
        const double drho = *s.storage.particle_density_kg_per_m3 - water_density_kg_per_m3(ref.temperature_K);
        const double velocity = 2 * r.primary_radius_m * r.primary_radius_m * drho * standard_gravity_m_per_s2 /
                                (9 * ref.medium.viscosity_Pa_s);
        r.settling_distance_m = velocity * r.target_s;
        r.settling_note = velocity >= 0 ? "settles (Stokes, single particles, at the first temperature)"
                                        : "creams upwards (negative distance; Stokes, single particles)";
    } else {
        r.settling_note = "give [storage] particle_density_kg_per_m3 for the Stokes settling distance";
    }
    return r;
}

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
    j.set("primary_radius_nm", r.primary_radius_m * 1e9);
    j.set("uncertainty_note", "every input is taken as exact in this version: p5 = p50 = p95");
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
        item.set("half_life_fast_s", c.half_life_fast_s);
        item.set_number_or_null("half_life_s", c.log10_tau_s < 300 ? std::optional<double>(std::pow(10.0, c.log10_tau_s)) : std::nullopt,
                                "above 1e300 s; see log10_half_life_s");
        item.set("log10_half_life_s", c.log10_tau_s);
        Json times = Json::object();
        times.set("p5", e.time_to_criterion_s);
        times.set("p50", e.time_to_criterion_s);
        times.set("p95", e.time_to_criterion_s);
        item.set("time_to_criterion_s", times);
        item.set("beyond_range", e.beyond_range);
        item.set("p5_time_over_target", e.time_over_target);
        item.set("acceleration_vs_reference", c.acceleration_vs_reference);
        item.set("acceleration_from_medium", c.acceleration_from_medium);
        item.set("acceleration_from_stability", c.acceleration_from_stability);
        item.set("rule_of_thumb_factor", c.rule_of_thumb_factor);
        for (const auto& [key, margin] : {std::pair<const char*, const SaltMargin*>{"added_salt_to_target_mM", &e.added_salt},
                                          {"added_second_salt_to_target_mM", &e.added_second_salt}}) {
            Json m = Json::object();
            m.set_number_or_null("p5", margin->added_mM, margin->reason);
            m.set_number_or_null("p50", margin->added_mM, margin->reason);
            if (!margin->added_mM) m.set("reason", margin->reason);
            item.set(key, m);
        }
        conditions.push(item);
    }
    j.set("conditions", conditions);
    j.set("rule_of_thumb_note", rule_of_thumb_caution());
    j.set("varied_salt", r.varied_salt.empty() ? Json() : Json(r.varied_salt));
    if (r.varied_salt.empty()) j.set("varied_salt_note", "no salt formula in [electrolyte] (salt or titrant)");
    j.set("second_salt", s.storage.second_salt);
    j.set_number_or_null("present_salt_mM", r.present_salt_mM, "the electrolyte is an ion list: no single salt");
    j.set_number_or_null("ccc_mM", r.ccc_mM, r.ccc_note.empty() ? "no CCC" : r.ccc_note);
    std::optional<double> margin;
    if (r.ccc_mM && r.present_salt_mM && *r.present_salt_mM > 0) margin = *r.ccc_mM / *r.present_salt_mM;
    j.set_number_or_null("salt_margin", margin, "needs the CCC and a present salt concentration above 0");
    j.set_number_or_null("settling_distance_m", r.settling_distance_m, r.settling_note);
    j.set("not_modelled", Json(shelf_life_not_modelled()));
    j.set("cautions", Json(shelf_life_cautions()));
    j.set("warnings", Json(r.warnings));
    j.set("input_sha256", sha256_hex(resolved_scenario_toml(s)));
    j.set("seed", s.run.seed);
    j.set("samples", std::int64_t{1});
    add_common_json(j, s);
    return j;
}

void write_shelf_life_text(std::ostream& out, const ShelfLifeReport& r, const Scenario& s) {
    out << "Shelf-life estimate for " << s.source << "\n";
    out << "  criterion: " << shelf::criterion_name(r.criterion.criterion) << " = " << g4(r.criterion.value)
        << "; target " << g4(s.storage.target_days) << " days; surface " << s.storage.surface_hold
        << " held fixed across temperatures; W " << (s.storage.hydrodynamic_correction ? "with" : "without")
        << " hydrodynamic drainage\n";
    out << "  every input is taken as exact in this version (no uncertainty band yet)\n\n";
    out << "  T (degC)   log10 W   t1/2 fast (s)   W t1/2 (s)   time to criterion (days)   time / target   "
           "acceleration (T/eta x W)   2^(dT/10)\n";
    for (const ConditionEstimate& e : r.conditions) {
        const StorageCondition& c = e.condition;
        char line[320];
        std::snprintf(line, sizeof line, "  %7.1f  %8.3f   %13.4g   %10.4g   %24s   %13.4g   %8.3g (%.3g x %.3g)   %9.3g\n",
                      c.temperature_K - 273.15, c.log10_stability_ratio, c.half_life_fast_s, std::pow(10.0, c.log10_tau_s),
                      (e.beyond_range ? std::string("> ") + g4(shelf_life_time_limit_s / seconds_per_day)
                                      : g4(e.time_to_criterion_s / seconds_per_day)).c_str(),
                      e.time_over_target, c.acceleration_vs_reference, c.acceleration_from_medium,
                      c.acceleration_from_stability, c.rule_of_thumb_factor);
        out << line;
    }
    out << "  " << rule_of_thumb_caution() << "\n\n";
    out << "Salt margins (added on top of the present ions, at which the time falls to the target)\n";
    for (const ConditionEstimate& e : r.conditions) {
        out << "  " << g4(e.condition.temperature_K - 273.15) << " degC: ";
        out << (r.varied_salt.empty() ? std::string("salt") : r.varied_salt) << " "
            << (e.added_salt.added_mM ? g4(*e.added_salt.added_mM) + " mM" : e.added_salt.reason) << "; "
            << s.storage.second_salt << " "
            << (e.added_second_salt.added_mM ? g4(*e.added_second_salt.added_mM) + " mM" : e.added_second_salt.reason)
            << "\n";
    }
    if (r.ccc_mM) out << "  CCC of " << r.varied_salt << ": " << g4(*r.ccc_mM) << " mM\n";
    else out << "  CCC: " << r.ccc_note << "\n";
    out << "\nNot modelled: ";
    const auto missing = shelf_life_not_modelled();
    for (std::size_t k = 0; k < missing.size(); ++k) out << (k ? "; " : "") << missing[k];
    out << ".\n";
    if (r.settling_distance_m) out << "Stokes settling over the target time: " << g4(*r.settling_distance_m * 1e3)
                                   << " mm (" << r.settling_note << ")\n";
    else out << "Settling: " << r.settling_note << "\n";
    std::vector<std::string> warnings = r.warnings;
    out << "\nCautions\n";
    for (const std::string& c : shelf_life_cautions()) out << "  - " << c << "\n";
    if (!warnings.empty()) {
        out << "\nWarnings\n";
        for (const std::string& w : warnings) out << "  - " << w << "\n";
    }
}

}  // namespace brownfloc::sim
