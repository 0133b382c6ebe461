#include <catch2/catch.hpp>
#include <cmath>
#include <string>

#include "potentials/electrolyte.hpp"
#include "potentials/input_error.hpp"

using namespace brownfloc::potentials;
using Catch::Matchers::Contains;
using Catch::Matchers::WithinRel;

TEST_CASE("the Debye length of a 1:1 salt at 25 degC follows 0.304/sqrt(I) nm", "[potentials][electrolyte][validation]") {
    // Rule of thumb (Israelachvili 2011, ch. 14 [memory for the section]; PHYSICS notes): 1/kappa = 0.304 / sqrt(I[M]) nm at
    // 25 degC. With CODATA 2018 constants and eps_r = 78.30 the exact prefactor is 0.3038,
    // so the rule is 0.06 % high: the tolerance is 0.1 % against 0.304 and 0.02 % against 0.3038.
    const Medium water = water_at(298.15);
    for (double c_mM : {0.1, 1.0, 10.0, 100.0}) {
        const double debye_nm = Electrolyte::from_salt("NaCl", c_mM).debye_length_m(water) * 1e9;
        const double ionic_strength_M = c_mM * 1e-3;
        CHECK_THAT(debye_nm, WithinRel(0.304 / std::sqrt(ionic_strength_M), 1e-3));
        CHECK_THAT(debye_nm, WithinRel(0.3038 / std::sqrt(ionic_strength_M), 2e-4));
    }
}

TEST_CASE("2:1 and 2:2 salts screen through their ionic strength", "[potentials][electrolyte][validation]") {
    // I = 1/2 sum c z^2: CaCl2 -> 3c, MgSO4 -> 4c (any textbook, e.g. Hunter 2001, ch. 2).
    const Medium water = water_at(298.15);
    const double c_mM = 10.0;
    const Electrolyte cacl2 = Electrolyte::from_salt("CaCl2", c_mM);
    const Electrolyte mgso4 = Electrolyte::from_salt("MgSO4", c_mM);
    CHECK_THAT(cacl2.ionic_strength_mol_per_m3(), WithinRel(3 * c_mM, 1e-14));
    CHECK_THAT(mgso4.ionic_strength_mol_per_m3(), WithinRel(4 * c_mM, 1e-14));
    CHECK_THAT(cacl2.debye_length_m(water) * 1e9, WithinRel(0.3038 / std::sqrt(3 * c_mM * 1e-3), 2e-4));
    CHECK_THAT(mgso4.debye_length_m(water) * 1e9, WithinRel(0.3038 / std::sqrt(4 * c_mM * 1e-3), 2e-4));
}

TEST_CASE("every salt named in the foundation issue parses with its stoichiometry", "[potentials][electrolyte]") {
    struct Case { const char* formula; double ionic_strength_per_c; };
    // I/c = 1/2 (n+ z+^2 + n- z-^2), stoichiometry by hand.
    const Case cases[] = {{"NaCl", 1}, {"KCl", 1},     {"KNO3", 1},   {"NaNO3", 1},  {"CaCl2", 3},
                          {"MgCl2", 3}, {"BaCl2", 3},  {"MgSO4", 4},  {"Na2SO4", 3}, {"K2SO4", 3},
                          {"LaCl3", 6}, {"AlCl3", 6},  {"Al2(SO4)3", 15}};
    for (const Case& c : cases) {
        INFO(c.formula);
        CHECK_THAT(Electrolyte::from_salt(c.formula, 2.0).ionic_strength_mol_per_m3(),
                   WithinRel(2.0 * c.ionic_strength_per_c, 1e-14));
    }
}

TEST_CASE("unknown or unbalanced salt formulas are refused with the formula named", "[potentials][electrolyte]") {
    CHECK_THROWS_WITH(parse_salt_formula("XyCl"), Contains("\"XyCl\"") && Contains("known ions"));
    CHECK_THROWS_WITH(parse_salt_formula("CaCl"), Contains("not electroneutral"));
    CHECK_THROWS_WITH(parse_salt_formula("NaClx"), Contains("unexpected text"));
    CHECK_THROWS_AS(parse_salt_formula(""), brownfloc::InputError);
}

TEST_CASE("ion mixtures must be electroneutral to 1e-9", "[potentials][electrolyte]") {
    CHECK_NOTHROW(Electrolyte::from_ions({{1, 10.0}, {-1, 10.0 * (1 + 5e-10)}}));
    CHECK_THROWS_WITH(Electrolyte::from_ions({{1, 10.0}, {-1, 9.0}}), Contains("not electroneutral"));
    CHECK_THROWS_WITH(Electrolyte::from_ions({{0, 1.0}}), Contains("valence 0"));
}

TEST_CASE("adding a titrant merges ions of equal valence", "[potentials][electrolyte]") {
    const Electrolyte mix = Electrolyte::from_salt("NaCl", 5).plus(Electrolyte::from_salt("CaCl2", 1));
    CHECK(mix.ions().size() == 3);
    CHECK_THAT(mix.ionic_strength_mol_per_m3(), WithinRel(5.0 + 3.0, 1e-14));
    CHECK(Electrolyte::symmetric(2, 1.0).is_symmetric());
    CHECK(Electrolyte::symmetric(2, 1.0).symmetric_valence() == 2);
    CHECK_FALSE(mix.is_symmetric());
}
