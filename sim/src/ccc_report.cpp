#include "sim/ccc_report.hpp"

#include "potentials/ccc.hpp"
#include "report_format.hpp"
#include "sim/dlvo_report.hpp"
#include "sim/scenario_physics.hpp"

namespace brownfloc::sim {

using namespace brownfloc::potentials;

const char* ccc_definition() {
    return "barrier criterion: the concentration of the varied salt at which the highest maximum of U(h) "
           "falls to 0 kT, so that U = 0 and dU/dh = 0 at the same gap (Verwey & Overbeek 1948); the "
           "surface potentials are held fixed as salt is added";
}

namespace {

PairCcc pair_ccc(const Scenario& scenario, const Medium& medium, std::size_t i, std::size_t j) {
    const PairModel model = pair_model(scenario, i, j);
    const PairAtConcentration make_pair = [&](double c) {
        return PairInteraction(model, medium, electrolyte_with_varied_salt(scenario, c));
    };
    PairCcc out;
    out.species_i = i;
    out.species_j = j;
    const CccResult barrier = barrier_ccc(make_pair, min_gap_m(scenario));
    out.ccc_mM = barrier.concentration_mol_per_m3;
    out.ccc_note = barrier.note;
    out.unstable_at_any_salt = barrier.status == CccStatus::no_barrier_anywhere;
    if (barrier.concentration_mol_per_m3) out.ccc_gap_nm = barrier.gap_m * 1e9;
    out.ccc_at_min_gap = barrier.maximum_at_min_gap;
    const KineticCccResult kinetic = kinetic_ccc(make_pair, min_gap_m(scenario));
    out.ccc_kinetic_mM = kinetic.concentration_mol_per_m3;
    out.w100_mM = kinetic.w100_concentration_mol_per_m3;
    out.dlog10w_dlog10c = kinetic.dlog10w_dlog10c;
    out.kinetic_note = kinetic.note;
    return out;
}

// Order: unstable at any salt, then by CCC, then pairs whose barrier survives 5 M.
bool loses_barrier_first(const PairCcc& a, const PairCcc& b) {
    if (a.unstable_at_any_salt != b.unstable_at_any_salt) return a.unstable_at_any_salt;
    if (a.unstable_at_any_salt) return false;
    return a.ccc_mM && (!b.ccc_mM || *a.ccc_mM < *b.ccc_mM);
}

}  // namespace

CccReport compute_ccc_report(const Scenario& scenario) {
    CccReport report;
    report.varied_salt = varied_salt_name(scenario);
    const Medium medium = medium_of(scenario);
    for (std::size_t i = 0; i < scenario.species.size(); ++i)
        for (std::size_t j = i; j < scenario.species.size(); ++j) {
            report.pairs.push_back(pair_ccc(scenario, medium, i, j));
            if (loses_barrier_first(report.pairs.back(), report.pairs[report.limiting_pair]))
                report.limiting_pair = report.pairs.size() - 1;
        }

    const PairCcc& limiting = report.pairs[report.limiting_pair];
    const PairModel model = pair_model(scenario, limiting.species_i, limiting.species_j);
    double valences[3], cccs[3];
    int found = 0;
    for (int z = 1; z <= 3; ++z) {
        const PairAtConcentration make_pair = [&](double c) {
            return PairInteraction(model, medium, electrolyte_with_symmetric_salt(scenario, z, c));
        };
        const CccResult r = barrier_ccc(make_pair, min_gap_m(scenario));
        report.ccc_by_valence_mM[z - 1] = r.concentration_mol_per_m3;
        report.by_valence_note[z - 1] = r.note;
        if (r.concentration_mol_per_m3) {
            valences[found] = z;
            cccs[found++] = *r.concentration_mol_per_m3;
        }
    }
    if (found >= 2) report.schulze_hardy_exponent = log_log_slope(valences, cccs, found);

    for (const PairCcc& p : report.pairs) {
        if (p.ccc_mM && *p.ccc_mM > 200)
            report.warnings.push_back("a CCC above 200 mM: Poisson-Boltzmann and DLVO are qualitative at such "
                                      "ionic strengths");
        if (p.ccc_at_min_gap) report.warnings.push_back(p.ccc_note);
    }
    if (auto medians = medians_used_warning(scenario)) report.warnings.push_back(std::move(*medians));
    return report;
}

Json ccc_json(const CccReport& report, const Scenario& scenario) {
    const PairCcc& lim = report.pairs[report.limiting_pair];
    Json json = Json::object();
    json.set("varied_salt", report.varied_salt);
    json.set_number_or_null("ccc_mM", lim.ccc_mM, lim.ccc_note);
    if (lim.ccc_mM && !lim.ccc_note.empty()) json.set("ccc_note", lim.ccc_note);
    json.set("ccc_definition", ccc_definition());
    json.set_number_or_null("ccc_gap_nm", lim.ccc_gap_nm, "no CCC in range");
    // Exactly the keys "1", "2", "3"; why a value is null goes in one sibling note.
    Json by_valence = Json::object();
    std::string by_valence_note;
    for (int z = 1; z <= 3; ++z) {
        const auto& value = report.ccc_by_valence_mM[z - 1];
        by_valence.set(std::to_string(z), value ? Json(*value) : Json(nullptr));
        if (!value)
            by_valence_note += (by_valence_note.empty() ? "" : "; ") + std::string("z = ") + std::to_string(z) +
                               ": " + report.by_valence_note[z - 1];
    }
    json.set("ccc_by_valence_mM", std::move(by_valence));
    if (!by_valence_note.empty()) json.set("ccc_by_valence_mM_note", by_valence_note);
    json.set_number_or_null("schulze_hardy_exponent", report.schulze_hardy_exponent,
                            "fewer than two valences have a CCC in range");
    json.set_number_or_null("ccc_kinetic_mM", lim.ccc_kinetic_mM, lim.kinetic_note);
    json.set_number_or_null("ccc_w100_mM", lim.w100_mM, lim.kinetic_note);
    json.set_number_or_null("dlog10W_dlog10c", lim.dlog10w_dlog10c, lim.kinetic_note);
    json.set("ccc_kinetic_definition",
             "tangent of log10 W_experimental against log10 c at W = 100, extended to W = 1");
    if (scenario.species.size() > 1) {
        json.set("limiting_pair", Json(Json::Array{Json(static_cast<int>(lim.species_i + 1)),
                                                   Json(static_cast<int>(lim.species_j + 1))}));
        Json pairs = Json::array();
        for (const PairCcc& p : report.pairs) {
            Json entry = Json::object();
            entry.set("species", Json(Json::Array{Json(static_cast<int>(p.species_i + 1)),
                                                  Json(static_cast<int>(p.species_j + 1))}));
            entry.set_number_or_null("ccc_mM", p.ccc_mM, p.ccc_note);
            entry.set_number_or_null("ccc_kinetic_mM", p.ccc_kinetic_mM, p.kinetic_note);
            pairs.push(std::move(entry));
        }
        json.set("pairs", std::move(pairs));
    }
    json.set("warnings", Json(report.warnings));
    add_common_json(json, scenario);
    return json;
}

void write_ccc_text(std::ostream& out, const CccReport& report, const Scenario& scenario) {
    const PairCcc& lim = report.pairs[report.limiting_pair];
    auto mM = [](const std::optional<double>& v, const std::string& note) {
        return v ? format_significant(*v, 4) + " mM" : "none (" + note + ")";
    };
    out << "brownfloc ccc: " << scenario.source << "\n\n";
    auto row = [&](const std::string& label, const std::string& value) { write_row(out, label, value, 32); };
    row("Varied salt", report.varied_salt + (scenario.titrant ? " (titrant, added on top of [electrolyte])" : ""));
    if (scenario.species.size() > 1)
        row("Limiting pair", std::to_string(lim.species_i + 1) + "-" + std::to_string(lim.species_j + 1) +
                                 " (the first to lose its barrier, or one that never has one)");
    row("CCC, barrier criterion", mM(lim.ccc_mM, lim.ccc_note));
    row("CCC, kinetic (W = 100 tangent)", mM(lim.ccc_kinetic_mM, lim.kinetic_note));
    if (lim.dlog10w_dlog10c) row("  dlog10 W / dlog10 c at W = 100", format_significant(*lim.dlog10w_dlog10c, 4));
    out << "\nSymmetric z:z salts in place of " << report.varied_salt << " (Schulze-Hardy series)\n";
    for (int z = 1; z <= 3; ++z)
        out << "  z = " << z << "   " << mM(report.ccc_by_valence_mM[z - 1], report.by_valence_note[z - 1]) << "\n";
    if (report.schulze_hardy_exponent)
        out << "  exponent of CCC ~ z^n: n = " << format_significant(*report.schulze_hardy_exponent, 4)
            << " (classical limit -6 for high potentials, -2 for low)\n";
    if (scenario.species.size() > 1) {
        out << "\nAll pairs\n";
        for (const PairCcc& p : report.pairs)
            out << "  " << p.species_i + 1 << "-" << p.species_j + 1 << "  barrier " << mM(p.ccc_mM, p.ccc_note)
                << ", kinetic " << mM(p.ccc_kinetic_mM, p.kinetic_note) << "\n";
    }
    out << "\nDefinition: " << ccc_definition() << ".\n"
        << "Measured CCCs also reflect specific ion adsorption and the fall of the surface potential with salt;\n"
           "DLVO over-predicts W at high barriers.\n";
    write_warnings_and_caution(out, report.warnings);
}

}  // namespace brownfloc::sim
