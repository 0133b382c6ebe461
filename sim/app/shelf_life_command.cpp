#include <iostream>

#include "commands.hpp"
#include "sim/shelf_life_report.hpp"

namespace brownfloc::app {

int run_shelf_life(const CommonOptions& options) {
    const sim::Scenario scenario = sim::load_scenario(options.scenario_path, options.set_overrides);
    const sim::ShelfLifeReport report = sim::compute_shelf_life(scenario);
    if (options.json) std::cout << sim::shelf_life_json(report, scenario).dump() << "\n";
    else sim::write_shelf_life_text(std::cout, report, scenario);
    return exit_ok;
}

}  // namespace brownfloc::app
