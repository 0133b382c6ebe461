#include "potentials/electrolyte.hpp"

#include <cmath>
#include <limits>
#include <sstream>

#include "potentials/constants.hpp"
#include "potentials/input_error.hpp"

namespace brownfloc::potentials {

Electrolyte Electrolyte::from_ions(std::vector<Ion> ions) {
    double net = 0.0, total = 0.0;
    for (const Ion& ion : ions) {
        if (ion.valence == 0)
            throw InputError("ion valence 0 is not allowed: every ion carries a non-zero integer charge");
        if (!std::isfinite(ion.concentration_mol_per_m3) || ion.concentration_mol_per_m3 < 0)
            throw InputError("ion concentration must be a finite number >= 0");
        net += ion.valence * ion.concentration_mol_per_m3;
        total += std::abs(ion.valence) * ion.concentration_mol_per_m3;
    }
    if (std::abs(net) > 1e-9 * total) {
        std::ostringstream msg;
        msg.precision(6);
        msg << "ions are not electroneutral: net charge sum z c = " << net
            << " mM (must be 0 within 1e-9 of sum |z| c = " << total << " mM)";
        throw InputError(msg.str());
    }
    Electrolyte e;
    // Merge equal valences: only z and c enter Debye-Hueckel and Poisson-Boltzmann.
    for (const Ion& ion : ions) {
        if (ion.concentration_mol_per_m3 == 0) continue;
        bool merged = false;
        for (Ion& existing : e.ions_)
            if (existing.valence == ion.valence) {
                existing.concentration_mol_per_m3 += ion.concentration_mol_per_m3;
                merged = true;
            }
        if (!merged) e.ions_.push_back(ion);
    }
    return e;
}

Electrolyte Electrolyte::from_salt(const std::string& formula, double concentration_mM) {
    const SaltFormula salt = parse_salt_formula(formula);
    return from_ions({{salt.cation_valence, salt.cation_count * concentration_mM},
                      {salt.anion_valence, salt.anion_count * concentration_mM}});
}

Electrolyte Electrolyte::symmetric(int valence, double concentration_mM) {
    return from_ions({{valence, concentration_mM}, {-valence, concentration_mM}});
}

Electrolyte Electrolyte::plus(const Electrolyte& other) const {
    std::vector<Ion> all = ions_;
    all.insert(all.end(), other.ions_.begin(), other.ions_.end());
    return from_ions(std::move(all));
}

double Electrolyte::ionic_strength_mol_per_m3() const {
    double sum = 0.0;
    for (const Ion& ion : ions_) sum += ion.concentration_mol_per_m3 * ion.valence * ion.valence;
    return 0.5 * sum;
}

double Electrolyte::inverse_debye_length_per_m(const Medium& medium) const {
    // kappa^2 = 2 N_A e^2 I / (eps kT), I in mol/m^3 (e.g. Russel, Saville & Schowalter 1989, ch. 4 [memory]).
    using namespace constants;
    const double e2 = elementary_charge_C * elementary_charge_C;
    return std::sqrt(2.0 * avogadro_per_mol * e2 * ionic_strength_mol_per_m3() /
                     (medium.permittivity_F_per_m() * medium.thermal_energy_J()));
}

double Electrolyte::debye_length_m(const Medium& medium) const {
    const double kappa = inverse_debye_length_per_m(medium);
    return kappa > 0 ? 1.0 / kappa : std::numeric_limits<double>::infinity();
}

bool Electrolyte::is_symmetric() const {
    return ions_.size() == 2 && ions_[0].valence == -ions_[1].valence;
}

int Electrolyte::symmetric_valence() const {
    return is_symmetric() ? std::abs(ions_[0].valence) : 0;
}

}  // namespace brownfloc::potentials
