// The readable form of `brownfloc dlvo`.
#include <cmath>
#include <ostream>

#include "potentials/electrolyte.hpp"
#include "report_format.hpp"
#include "sim/dlvo_report.hpp"

namespace brownfloc::sim {
namespace {

std::string electrolyte_line(const Scenario& s, const DlvoReport& r) {
    std::string out;
    if (s.salt) out = *s.salt + " " + format_general(s.salt_concentration_mM) + " mM";
    else {
        for (const IonSpec& ion : s.ions)
            out += (out.empty() ? "" : ", ") + std::string("z = ") + std::to_string(ion.valence) + " at " +
                   format_general(ion.concentration_mM) + " mM";
    }
    return out + "; ionic strength " + format_significant(r.ionic_strength_mM, 4) + " mM, Debye length " +
           format_significant(r.debye_length_nm, 4) + " nm";
}

std::string ratio_line(double log10_value) {
    if (!std::isfinite(log10_value)) return "not computed (the Fuchs integral failed; please report)";
    if (log10_value > 300) return "10^" + format_fixed(log10_value, 2);
    return format_significant(std::pow(10.0, log10_value), 3) + "  (log10 " + format_fixed(log10_value, 3) + ")";
}

void write_pair(std::ostream& out, const PairStability& p, const Scenario& s, bool several) {
    if (several)
        out << "\nPair " << p.species_i + 1 << "-" << p.species_j + 1 << " (" << s.species[p.species_i].name
            << " / " << s.species[p.species_j].name << ")\n";
    else
        out << "\n";
    auto row = [&](const std::string& label, const std::string& value) { write_row(out, "  " + label, value, 36); };
    row("kappa a", format_significant(p.kappa_a, 4));
    if (p.barrier_gap_nm)
        row("energy barrier", format_fixed(p.barrier_kT, 2) + " kT at " + format_significant(*p.barrier_gap_nm, 4) +
                                  " nm" + (p.barrier_at_min_gap ? " (at min_gap)" : ""));
    else
        row("energy barrier", "none" + (p.local_maximum_kT ? " (highest maximum " + format_fixed(*p.local_maximum_kT, 2) +
                                                                  " kT)" : std::string()));
    row("U at min_gap (primary minimum)", format_fixed(p.primary_minimum_kT, 2) + " kT");
    if (p.secondary_minimum_gap_nm)
        row("secondary minimum", format_fixed(p.secondary_minimum_kT, 3) + " kT at " +
                                     format_significant(*p.secondary_minimum_gap_nm, 4) + " nm");
    else
        row("secondary minimum", "none");
    row("stability ratio W (Fuchs)", ratio_line(p.log10_stability_ratio));
    row("W with hydrodynamics (Honig)", ratio_line(p.log10_stability_ratio_hydrodynamic));
    row("W as measured (vs vdW-only)", ratio_line(p.log10_stability_ratio_experimental));
    row("fast rate constant", format_significant(p.fast_rate_m3_per_s, 4) + " m^3/s");
    if (p.half_life_fast_s) {
        const double lg = std::log10(*p.half_life_fast_s);
        auto duration = [&](double log10_t) {
            if (!std::isfinite(log10_t)) return std::string("not computed");
            return log10_t > 300 ? "10^" + format_fixed(log10_t, 1) + " s" : format_duration(std::pow(10.0, log10_t));
        };
        row("half-life, fast (W = 1)", format_duration(*p.half_life_fast_s));
        row("half-life, no hydrodynamics", duration(lg + p.log10_stability_ratio));
        row("half-life, with hydrodynamics *", duration(lg + p.log10_stability_ratio_hydrodynamic));
    }
}

}  // namespace

void write_dlvo_text(std::ostream& out, const DlvoReport& r, const Scenario& s) {
    out << "brownfloc dlvo: " << s.source << "\n\n";
    out << "Medium       T = " << format_fixed(r.medium.temperature_K - 273.15, 2) << " degC, viscosity "
        << format_significant(r.medium.viscosity_Pa_s * 1e3, 5) << " mPa s, relative permittivity "
        << format_significant(r.medium.relative_permittivity, 5) << "\n";
    out << "Electrolyte  " << electrolyte_line(s, r) << "\n";
    for (const SpeciesSpec& sp : s.species)
        out << "Particles    " << sp.name << ": radius " << format_general(sp.radius_nm) << " nm, Hamaker "
            << format_general(sp.hamaker_J) << " J, surface potential " << format_general(sp.surface_potential_mV)
            << " mV" << (s.species.size() > 1 ? ", number fraction " + format_general(sp.number_fraction) : "")
            << "\n";
    if (r.number_density_per_m3)
        out << "Suspension   " << format_significant(*r.number_density_per_m3, 4) << " particles per m^3\n";
    out << "Model        van der Waals: " << (s.retarded_vdw ? "Gregory (1981) retarded" : "full Hamaker (1937), non-retarded")
        << "; double layer: " << double_layer_name(s.double_layer) << "; min_gap " << format_general(s.min_gap_nm)
        << " nm\n";
    if (!s.defaults_applied.empty()) {
        out << "Defaults     ";
        for (std::size_t k = 0; k < s.defaults_applied.size(); ++k)
            out << (k ? ", " : "") << s.defaults_applied[k];
        out << "\n";
    }
    for (const PairStability& p : r.pairs) write_pair(out, p, s, r.pairs.size() > 1);
    if (r.number_density_per_m3)
        out << "\n* The hydrodynamic half-life is the one to compare with a real dispersion: close to contact\n"
               "  the liquid has to drain from the gap (Honig et al. 1971), which slows every collision. The\n"
               "  Brownian-dynamics simulator has no hydrodynamic interactions, so its half-life follows the\n"
               "  'no hydrodynamics' value. The hydrodynamic W depends on min_gap (the correction diverges at\n"
               "  contact).\n";
    out << "\nThe surface potential is usually a measured zeta potential, which understates the true surface\n"
           "potential; DLVO leaves out steric, hydration, bridging and ion-specific forces.\n";
    write_warnings_and_caution(out, r.warnings);
}

}  // namespace brownfloc::sim
