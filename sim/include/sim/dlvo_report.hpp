#pragma once
// `brownfloc dlvo`: the interaction of every species pair and the classical stability
// theory around it, as numbers (DlvoReport), JSON (keys of the project's INTERFACES), text
// and the interaction-curve CSV.
#include <optional>
#include <ostream>
#include <string>
#include <vector>

#include "potentials/electrolyte.hpp"
#include "potentials/medium.hpp"
#include "sim/json_writer.hpp"
#include "sim/scenario.hpp"

namespace brownfloc::sim {

struct PairStability {
    std::size_t species_i = 0, species_j = 0;  // 0-based
    double radius1_nm = 0, radius2_nm = 0;
    double hamaker_J = 0;
    double kappa_a = 0;  // kappa times the smaller radius

    double barrier_kT = 0;
    std::optional<double> barrier_gap_nm;
    bool barrier_at_min_gap = false;
    std::optional<double> local_maximum_kT;  // none when U only rises from min_gap
    std::optional<double> local_maximum_gap_nm;
    double primary_minimum_kT = 0;
    double secondary_minimum_kT = 0;
    std::optional<double> secondary_minimum_gap_nm;

    double log10_stability_ratio = 0;
    double log10_stability_ratio_hydrodynamic = 0;
    double log10_stability_ratio_experimental = 0;

    double fast_rate_m3_per_s = 0;
    std::optional<double> half_life_fast_s;  // needs a number density
    std::vector<std::string> warnings;
};

struct DlvoReport {
    std::string source;
    potentials::Medium medium;
    potentials::Electrolyte electrolyte;
    double ionic_strength_mM = 0;
    double debye_length_nm = 0;
    std::optional<double> number_density_per_m3;
    std::vector<PairStability> pairs;
    std::vector<std::string> warnings;  // all warnings, each pair's prefixed by its species
};

[[nodiscard]] DlvoReport compute_dlvo_report(const Scenario& scenario);
[[nodiscard]] Json dlvo_json(const DlvoReport& report, const Scenario& scenario);
void write_dlvo_text(std::ostream& out, const DlvoReport& report, const Scenario& scenario);

// The interaction curve: gap_nm, total_kT, vdw_kT, double_layer_kT, force_pN (-dU/dh, > 0
// when repulsive) on 2000 log-spaced gaps from min_gap to max(30 Debye lengths, 100 nm).
// With several species each row starts with species_i, species_j (1-based).
void write_curve_csv(std::ostream& out, const Scenario& scenario);

// The caution that goes with every result that could support a stability decision.
[[nodiscard]] const char* stability_caution();

// Fields shared by the JSON of every command: version and the caution.
void add_common_json(Json& json, const Scenario& scenario);
// The closing lines of every text report: the warnings (if any), then the caution.
void write_warnings_and_caution(std::ostream& out, const std::vector<std::string>& warnings);

}  // namespace brownfloc::sim
