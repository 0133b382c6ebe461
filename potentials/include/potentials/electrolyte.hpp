#pragma once
// Dissolved ions: ionic strength and Debye screening length.
//
//   Electrolyte e = Electrolyte::from_salt("CaCl2", 1.0 /*mM*/);
//   double debye_m = e.debye_length_m(water_at(298.15));
//
// Concentrations are molar concentrations of each ion (mol/m^3 inside, mM at the edges;
// 1 mM = 1 mol/m^3). Values are validated once in the factories (finite, >= 0, integer
// non-zero valences, electroneutral to 1e-9 relative) and throw brownfloc::InputError.
#include <string>
#include <vector>

#include "potentials/medium.hpp"

namespace brownfloc::potentials {

struct Ion {
    int valence = 0;                        // signed charge number z
    double concentration_mol_per_m3 = 0.0;  // numerically equal to mM
};

// Stoichiometry of a salt formula such as "CaCl2" or "Al2(SO4)3".
struct SaltFormula {
    std::string formula;
    std::string cation, anion;
    int cation_valence = 0, anion_valence = 0;  // +z and -z
    int cation_count = 0, anion_count = 0;      // ions per formula unit
};

// Parses a salt formula made of one known cation and one known anion; throws InputError
// naming the formula and listing the ions known when it cannot (or when the formula is
// not electroneutral).
[[nodiscard]] SaltFormula parse_salt_formula(const std::string& formula);
// The ions known to parse_salt_formula, for help texts: "Na+ K+ ... Cl- SO4(2-) ...".
[[nodiscard]] std::string known_salt_ions();

class Electrolyte {
public:
    Electrolyte() = default;
    // Any ion mixture; must be electroneutral to 1e-9 relative.
    [[nodiscard]] static Electrolyte from_ions(std::vector<Ion> ions);
    // A fully dissociated salt at concentration_mM (mol of formula units per m^3).
    [[nodiscard]] static Electrolyte from_salt(const std::string& formula, double concentration_mM);
    // A symmetric z:z salt at concentration_mM.
    [[nodiscard]] static Electrolyte symmetric(int valence, double concentration_mM);

    // This electrolyte with another salt added on top (same ion valences are merged).
    [[nodiscard]] Electrolyte plus(const Electrolyte& other) const;

    [[nodiscard]] const std::vector<Ion>& ions() const { return ions_; }
    // I = 1/2 sum c_i z_i^2 [mol/m^3].
    [[nodiscard]] double ionic_strength_mol_per_m3() const;
    // kappa^2 = 2 N_A e^2 I / (eps kT) [1/m]; zero if I = 0.
    [[nodiscard]] double inverse_debye_length_per_m(const Medium& medium) const;
    // 1/kappa [m]; +inf if I = 0.
    [[nodiscard]] double debye_length_m(const Medium& medium) const;
    // True when all ions form one symmetric z:z pair (then valence() is z).
    [[nodiscard]] bool is_symmetric() const;
    [[nodiscard]] int symmetric_valence() const;

private:
    std::vector<Ion> ions_;
};

}  // namespace brownfloc::potentials
