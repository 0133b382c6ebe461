#include <iostream>

#include "commands.hpp"
#include "sim/ccc_report.hpp"

namespace brownfloc::app {

int run_ccc(const CommonOptions& options) {
    const sim::Scenario scenario = sim::load_scenario(options.scenario_path, options.set_overrides);
    const sim::CccReport report = sim::compute_ccc_report(scenario);
    if (options.json) std::cout << sim::ccc_json(report, scenario).dump() << "\n";
    else sim::write_ccc_text(std::cout, report, scenario);
    return exit_ok;
}

}  // namespace brownfloc::app
