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
    const int threads = options.threads > 0 ? options.threads : default_thread_count();
    sim::RunResult result;
    if (!options.resume_dir.empty()) {
        sim::ResumeOptions resume;
        resume.run_dir = options.resume_dir;
        resume.threads = threads;
        resume.quiet = options.quiet;
        resume.force = options.force;
        resume.messages = &std::cerr;
        result = sim::resume_run(resume);
        if (result.already_complete) {
            std::cerr << "brownfloc run: " << options.resume_dir << " is already complete\n";
            return exit_ok;
        }
    } else {
        if (options.common.scenario_path.empty()) {
            std::cerr << "error: run needs a scenario file, or --resume RUN_DIR (see brownfloc run --help)\n";
            return exit_bad_input;
        }
        if (options.force) {
            std::cerr << "error: --force goes with --resume only\n";
            return exit_bad_input;
        }
        const sim::Scenario scenario = sim::load_scenario(options.common.scenario_path, options.common.set_overrides);
        sim::RunOptions run;
        run.output_dir = options.output_dir;
        run.overwrite = options.overwrite;
        run.seed = options.seed;
        run.threads = threads;
        run.quiet = options.quiet;
        run.messages = &std::cerr;
        result = sim::execute_run(scenario, run);
    }
    if (result.interrupted_by != 0) {
        if (result.checkpoint_written)
            std::cerr << "brownfloc run: interrupted; checkpoint written. Continue with: brownfloc run --resume "
                      << result.output_dir << "\n";
        else
            std::cerr << "brownfloc run: interrupted during set-up; nothing was written\n";
        return sim::exit_code_for_interruption(result.interrupted_by);
    }
    if (options.common.json) std::cout << result.summary_json << "\n";
    else if (!options.quiet) std::cerr << sim::stability_caution() << "\n";
    return exit_ok;
}

}  // namespace brownfloc::app
