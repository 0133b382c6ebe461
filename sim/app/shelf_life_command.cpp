#include <iostream>

#include "commands.hpp"
#include "io/atomic_file.hpp"
#include "sim/shelf_life_report.hpp"

namespace brownfloc::app {

int run_shelf_life(const ShelfLifeCommandOptions& options) {
    const sim::Scenario scenario = sim::load_scenario(options.common.scenario_path, options.common.set_overrides);
    sim::ShelfLifeOptions estimate;
    estimate.plot = !options.plot_path.empty();
    const sim::ShelfLifeReport report = sim::compute_shelf_life(scenario, estimate);
    // The plot first: a plot that cannot be written is an I/O error (exit 3) with nothing
    // printed that a caller could mistake for a complete answer.
    if (report.plot) io::write_file_atomically(options.plot_path, sim::shelf_life_svg(*report.plot));
    if (options.common.json) std::cout << sim::shelf_life_json(report, scenario).dump() << "\n";
    else sim::write_shelf_life_text(std::cout, report, scenario);
    return exit_ok;
}

}  // namespace brownfloc::app
