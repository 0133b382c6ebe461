#pragma once
// `brownfloc ccc`: critical coagulation concentrations of the varied salt (the titrant if
// given, else the salt), by the barrier and the kinetic criteria, and for symmetric z:z salts
// of valence 1-3 (the Schulze-Hardy series).
#include <optional>
#include <ostream>
#include <string>
#include <vector>

#include "sim/json_writer.hpp"
#include "sim/scenario.hpp"

namespace brownfloc::sim {

struct PairCcc {
    std::size_t species_i = 0, species_j = 0;  // 0-based
    std::optional<double> ccc_mM;
    bool unstable_at_any_salt = false;  // no barrier even at 1 uM
    std::string ccc_note;
    std::optional<double> ccc_gap_nm;
    bool ccc_at_min_gap = false;
    std::optional<double> ccc_kinetic_mM;
    std::optional<double> w100_mM;
    std::optional<double> dlog10w_dlog10c;
    std::string kinetic_note;
};

struct CccReport {
    std::string varied_salt;
    std::vector<PairCcc> pairs;
    // Index into pairs of the pair that loses its barrier first: one with no barrier at any
    // salt, else the lowest barrier CCC.
    std::size_t limiting_pair = 0;
    std::optional<double> ccc_by_valence_mM[3];
    std::string by_valence_note[3];
    std::optional<double> schulze_hardy_exponent;
    std::vector<std::string> warnings;
};

[[nodiscard]] CccReport compute_ccc_report(const Scenario& scenario);
[[nodiscard]] Json ccc_json(const CccReport& report, const Scenario& scenario);
void write_ccc_text(std::ostream& out, const CccReport& report, const Scenario& scenario);

// The definition written beside every barrier CCC.
[[nodiscard]] const char* ccc_definition();

}  // namespace brownfloc::sim
