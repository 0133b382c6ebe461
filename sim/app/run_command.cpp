#include <omp.h>

#include <cstdlib>
#include <iostream>

#include "commands.hpp"
#include "sim/dlvo_report.hpp"
#include "sim/environment_error.hpp"
#include "sim/run_driver.hpp"

namespace brownfloc::app {

int default_thread_count() {
    // OMP_NUM_THREADS if set (the OpenMP runtime reads it), else every core.
    if (const char* env = std::getenv("OMP_NUM_THREADS"); env && *env) return omp_get_max_threads();
    return omp_get_num_procs();
}

int run_run(const RunCommandOptions& options) {
    const sim::Scenario scenario = sim::load_scenario(options.common.scenario_path, options.common.set_overrides);
    sim::RunOptions run;
    run.output_dir = options.output_dir;
    run.overwrite = options.overwrite;
    run.seed = options.seed;
    run.threads = options.threads > 0 ? options.threads : default_thread_count();
    run.quiet = options.quiet;
    run.messages = &std::cerr;
    try {
        const sim::RunResult result = sim::execute_run(scenario, run);
        if (options.common.json) std::cout << result.summary_json << "\n";
        else if (!options.quiet) std::cerr << sim::stability_caution() << "\n";
    } catch (const sim::EnvironmentError& e) {
        std::cerr << "error: " << e.what() << "\n";
        return exit_io;
    }
    return exit_ok;
}

}  // namespace brownfloc::app
