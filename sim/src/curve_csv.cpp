// `brownfloc dlvo --curve FILE.csv`: the interaction curve of every species pair.
#include <cmath>
#include <ostream>

#include "potentials/extrema.hpp"
#include "potentials/pair_interaction.hpp"
#include "sim/dlvo_report.hpp"
#include "sim/json_writer.hpp"
#include "sim/scenario_physics.hpp"

namespace brownfloc::sim {

void write_curve_csv(std::ostream& out, const Scenario& scenario) {
    using namespace brownfloc::potentials;
    const bool several = scenario.species.size() > 1;
    out << (several ? "species_i,species_j," : "") << "gap_nm,total_kT,vdw_kT,double_layer_kT,force_pN\n";
    const Medium medium = medium_of(scenario);
    const Electrolyte electrolyte = electrolyte_of(scenario);
    constexpr int samples = 2000;
    for (std::size_t i = 0; i < scenario.species.size(); ++i)
        for (std::size_t j = i; j < scenario.species.size(); ++j) {
            const PairInteraction pair(pair_model(scenario, i, j), medium, electrolyte);
            // Gaps are generated in nm so that the first row prints min_gap_nm exactly.
            const double kT = pair.kT_J(), first_nm = scenario.min_gap_nm, last_nm = default_max_gap_m(pair) * 1e9;
            const double step = std::log(last_nm / first_nm) / (samples - 1);
            for (int k = 0; k < samples; ++k) {
                const double h_nm = k == 0 ? first_nm : (k == samples - 1 ? last_nm : first_nm * std::exp(step * k));
                const double h = h_nm * 1e-9;
                const EnergySlope vdw = pair.van_der_waals(h), dl = pair.double_layer(h);
                if (several) out << i + 1 << ',' << j + 1 << ',';
                out << format_number(h_nm) << ',' << format_number((vdw.energy_J + dl.energy_J) / kT) << ','
                    << format_number(vdw.energy_J / kT) << ',' << format_number(dl.energy_J / kT) << ','
                    << format_number(-(vdw.slope_J_per_m + dl.slope_J_per_m) * 1e12) << '\n';
            }
        }
}

}  // namespace brownfloc::sim
