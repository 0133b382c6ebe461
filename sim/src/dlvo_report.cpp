#include "sim/dlvo_report.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <ostream>

#include "potentials/extrema.hpp"
#include "potentials/kinetics.hpp"
#include "potentials/pair_interaction.hpp"
#include "potentials/stability_ratio.hpp"
#include "report_format.hpp"
#include "sim/scenario_physics.hpp"

namespace brownfloc::sim {

using namespace brownfloc::potentials;

namespace {

constexpr double ln10 = 2.302585092994046;

std::string pair_label(const Scenario& scenario, const PairStability& p) {
    if (scenario.species.size() == 1) return "";
    return "pair " + std::to_string(p.species_i + 1) + "-" + std::to_string(p.species_j + 1) + ": ";
}

PairStability analyse_pair(const Scenario& scenario, const Medium& medium, const Electrolyte& electrolyte,
                           std::size_t i, std::size_t j, std::optional<double> number_density) {
    const PairModel model = pair_model(scenario, i, j);
    const PairInteraction pair(model, medium, electrolyte);
    const double kT = pair.kT_J(), gap0 = min_gap_m(scenario);
    const Extrema ext = find_extrema(pair, gap0, default_max_gap_m(pair));
    const StabilityRatios w = stability_ratios(pair, gap0);

    PairStability out;
    out.species_i = i;
    out.species_j = j;
    out.radius1_nm = scenario.species[i].radius_nm;
    out.radius2_nm = scenario.species[j].radius_nm;
    out.hamaker_J = model.hamaker_J;
    out.kappa_a = pair.kappa_per_m() * std::min(model.radius1_m, model.radius2_m);
    out.barrier_kT = ext.barrier_J() / kT;
    if (ext.has_barrier()) out.barrier_gap_nm = ext.maximum_gap_m * 1e9;
    out.barrier_at_min_gap = ext.has_maximum && ext.maximum_at_min_gap;
    if (ext.has_maximum) {
        out.local_maximum_kT = ext.local_maximum_J / kT;
        out.local_maximum_gap_nm = ext.maximum_gap_m * 1e9;
    }
    out.primary_minimum_kT = ext.primary_minimum_J / kT;
    if (ext.has_secondary_minimum) {
        out.secondary_minimum_kT = ext.secondary_minimum_J / kT;
        out.secondary_minimum_gap_nm = ext.secondary_minimum_gap_m * 1e9;
    }
    out.log10_stability_ratio = w.log_w / ln10;
    out.log10_stability_ratio_hydrodynamic = w.log_w_hydrodynamic / ln10;
    out.log10_stability_ratio_experimental = w.log_w_experimental() / ln10;
    out.fast_rate_m3_per_s = fast_rate_m3_per_s(model.radius1_m, model.radius2_m, medium.temperature_K,
                                                medium.viscosity_Pa_s);
    if (number_density) out.half_life_fast_s = fast_half_life_s(out.fast_rate_m3_per_s, *number_density);

    // Warnings: where the model is used outside the range its formulas hold in.
    const bool debye_hueckel = scenario.double_layer != DoubleLayerModel::linear_superposition;
    if (out.kappa_a < 5)
        out.warnings.push_back("kappa a = " + format_fixed(out.kappa_a, 2) +
                               " < 5: the double-layer forms assume thin double layers (Derjaguin "
                               "geometry, planar effective potentials); treat the numbers as rough");
    const double psi_max_mV = std::max(std::abs(scenario.species[i].surface_potential_mV),
                                       std::abs(scenario.species[j].surface_potential_mV));
    if (debye_hueckel && psi_max_mV > 50)
        out.warnings.push_back("|surface potential| = " + format_fixed(psi_max_mV, 1) + " mV > 50 mV with " +
                               double_layer_name(scenario.double_layer) +
                               ", a Debye-Hueckel (low-potential) form: it overestimates the repulsion; "
                               "linear-superposition holds at any potential");
    if (out.barrier_at_min_gap)
        out.warnings.push_back("the maximum of U is at min_gap (U falls from contact outwards): the barrier "
                               "and W depend on min_gap_nm = " + format_general(scenario.min_gap_nm));
    if (scenario.retarded_vdw && ext.has_maximum &&
        ext.maximum_gap_m > 0.1 * std::min(model.radius1_m, model.radius2_m))
        out.warnings.push_back("the barrier gap exceeds 0.1 a: Gregory's retarded form (Derjaguin-based) is "
                               "outside its range there");
    return out;
}

std::optional<double> linear_from_log10(double log10_value) {
    if (!(log10_value <= 300)) return std::nullopt;  // also NaN
    return std::pow(10.0, log10_value);
}

void add_pair_json(Json& json, const PairStability& p) {
    const std::string big = "above 1e300; see the log10_ form";
    json.set("kappa_a", p.kappa_a);
    json.set("hamaker_J", p.hamaker_J);
    json.set("barrier_kT", p.barrier_kT);
    json.set_number_or_null("barrier_gap_nm", p.barrier_gap_nm, "no energy barrier (U has no maximum above 0)");
    json.set("barrier_at_min_gap", p.barrier_at_min_gap);
    json.set_number_or_null("local_maximum_kT", p.local_maximum_kT,
                            "U rises monotonically from min_gap: no local maximum");
    json.set_number_or_null("local_maximum_gap_nm", p.local_maximum_gap_nm, "no local maximum");
    json.set("primary_minimum_kT", p.primary_minimum_kT);
    json.set("secondary_minimum_kT", p.secondary_minimum_kT);
    json.set_number_or_null("secondary_minimum_gap_nm", p.secondary_minimum_gap_nm,
                            "no secondary minimum beyond the maximum");
    // A non-finite log10 W would be a quadrature failure (a bug): never print it as a number.
    const std::string failed = "the Fuchs integral could not be evaluated for these inputs; please report";
    auto add_ratio = [&](const std::string& key, double log10_value) {
        json.set_number_or_null(key, linear_from_log10(log10_value), std::isfinite(log10_value) ? big : failed);
        json.set_number_or_null("log10_" + key, log10_value, failed);
    };
    add_ratio("stability_ratio", p.log10_stability_ratio);
    add_ratio("stability_ratio_hydrodynamic", p.log10_stability_ratio_hydrodynamic);
    add_ratio("stability_ratio_experimental", p.log10_stability_ratio_experimental);
    json.set("fast_rate_m3_per_s", p.fast_rate_m3_per_s);
    const std::string no_density = "no [suspension] concentration given";
    if (p.half_life_fast_s) {
        const double lg = std::log10(*p.half_life_fast_s);
        json.set("half_life_fast_s", *p.half_life_fast_s);
        json.set_number_or_null("half_life_s", linear_from_log10(lg + p.log10_stability_ratio), big);
        json.set_number_or_null("half_life_hydrodynamic_s",
                                linear_from_log10(lg + p.log10_stability_ratio_hydrodynamic), big);
    } else {
        json.set_number_or_null("half_life_fast_s", std::nullopt, no_density);
        json.set_number_or_null("half_life_s", std::nullopt, no_density);
        json.set_number_or_null("half_life_hydrodynamic_s", std::nullopt, no_density);
    }
    json.set("warnings", Json(p.warnings));
}

}  // namespace

const char* stability_caution() {
    return "Model estimate only (DLVO theory with the inputs given). It is not a substitute for real "
           "stability testing, the applicable regulations and standards, or qualified professional judgement.";
}

void add_common_json(Json& json, const Scenario& scenario) {
    json.set("brownfloc_version", BROWNFLOC_VERSION);
    json.set("scenario", scenario.source);
    json.set("defaults_applied", Json(scenario.defaults_applied));
    json.set("caution", stability_caution());
}

void write_warnings_and_caution(std::ostream& out, const std::vector<std::string>& warnings) {
    if (!warnings.empty()) {
        out << "\nWarnings\n";
        for (const std::string& w : warnings) out << "  - " << w << "\n";
    }
    out << "\nCaution: " << stability_caution() << "\n";
}

DlvoReport compute_dlvo_report(const Scenario& scenario) {
    DlvoReport report;
    report.source = scenario.source;
    report.medium = medium_of(scenario);
    report.electrolyte = electrolyte_of(scenario);
    report.ionic_strength_mM = report.electrolyte.ionic_strength_mol_per_m3();
    report.debye_length_nm = report.electrolyte.debye_length_m(report.medium) * 1e9;
    report.number_density_per_m3 = number_density_per_m3(scenario);
    if (report.ionic_strength_mM > 200)
        report.warnings.push_back("ionic strength " + format_general(report.ionic_strength_mM) +
                                  " mM > 200 mM: Poisson-Boltzmann ignores ion size and correlations, and "
                                  "specific ion effects dominate; DLVO is qualitative here");
    for (const SpeciesSpec& s : scenario.species)
        if (s.radius_spread > 0) {
            report.warnings.push_back("radius_spread > 0: pair values are for the median radii");
            break;
        }
    for (std::size_t i = 0; i < scenario.species.size(); ++i)
        for (std::size_t j = i; j < scenario.species.size(); ++j) {
            report.pairs.push_back(analyse_pair(scenario, report.medium, report.electrolyte, i, j,
                                                report.number_density_per_m3));
            for (const std::string& w : report.pairs.back().warnings)
                report.warnings.push_back(pair_label(scenario, report.pairs.back()) + w);
        }
    if (auto medians = medians_used_warning(scenario)) report.warnings.push_back(std::move(*medians));
    return report;
}

Json dlvo_json(const DlvoReport& report, const Scenario& scenario) {
    Json json = Json::object();
    json.set("temperature_K", report.medium.temperature_K);
    json.set("viscosity_mPa_s", report.medium.viscosity_Pa_s * 1e3);
    json.set("relative_permittivity", report.medium.relative_permittivity);
    json.set("ionic_strength_mM", report.ionic_strength_mM);
    json.set("debye_length_nm", report.debye_length_nm);
    json.set("min_gap_nm", scenario.min_gap_nm);
    json.set("double_layer", double_layer_name(scenario.double_layer));
    json.set("van_der_waals", scenario.retarded_vdw ? "gregory-retarded" : "hamaker-full");
    json.set_number_or_null("number_density_per_m3", report.number_density_per_m3,
                            "no [suspension] concentration given");
    if (report.pairs.size() == 1) add_pair_json(json, report.pairs.front());
    Json pairs = Json::array();
    for (const PairStability& p : report.pairs) {
        Json entry = Json::object();
        entry.set("species", Json(Json::Array{Json(static_cast<int>(p.species_i + 1)),
                                              Json(static_cast<int>(p.species_j + 1))}));
        entry.set("radius1_nm", p.radius1_nm);
        entry.set("radius2_nm", p.radius2_nm);
        add_pair_json(entry, p);
        pairs.push(std::move(entry));
    }
    json.set("pairs", std::move(pairs));
    json.set("warnings", Json(report.warnings));
    json.set("notes", Json(std::vector<std::string>{
                          "half_life_hydrodynamic_s is the one to compare with a real dispersion: liquid must drain "
                          "from the gap before particles touch (Honig et al. 1971). The Brownian-dynamics simulator has "
                          "no hydrodynamic interactions, so its half-life follows half_life_s.",
                          "stability_ratio_hydrodynamic depends on min_gap_nm: Honig's correction diverges at contact.",
                          "surface_potential_mV is usually a zeta potential, which understates the surface potential."}));
    add_common_json(json, scenario);
    return json;
}

}  // namespace brownfloc::sim
