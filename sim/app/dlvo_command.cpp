#include <fstream>
#include <iostream>

#include "commands.hpp"
#include "sim/dlvo_report.hpp"

namespace brownfloc::app {

int run_dlvo(const DlvoOptions& options) {
    const sim::Scenario scenario = sim::load_scenario(options.common.scenario_path, options.common.set_overrides);
    const sim::DlvoReport report = sim::compute_dlvo_report(scenario);
    if (!options.curve_path.empty()) {
        std::ofstream curve(options.curve_path);
        if (curve) sim::write_curve_csv(curve, scenario);
        curve.close();
        if (!curve) {
            std::cerr << "error: " << options.curve_path << ": cannot write the curve file (check the folder "
                      << "exists, is writable and the disk is not full)\n";
            return exit_io;
        }
    }
    if (options.common.json) std::cout << sim::dlvo_json(report, scenario).dump() << "\n";
    else sim::write_dlvo_text(std::cout, report, scenario);
    if (!options.curve_path.empty() && !options.common.json)
        std::cout << "\nInteraction curve written to " << options.curve_path << "\n";
    return exit_ok;
}

}  // namespace brownfloc::app
