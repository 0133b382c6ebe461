// brownfloc: command-line entry point. The only file that includes CLI11.
#include <CLI/CLI.hpp>
#include <cerrno>
#include <cstdlib>
#include <exception>
#include <iostream>

#include "commands.hpp"
#include "io/file_writing.hpp"
#include "io/io_error.hpp"
#include "io/write_faults.hpp"
#include "potentials/input_error.hpp"
#include "sim/checkpoint.hpp"
#include "sim/environment_error.hpp"
#include "trajectory/trajectory_error.hpp"

namespace {

using namespace brownfloc::app;

void add_common(CLI::App& command, CommonOptions& options, bool scenario_required = true) {
    CLI::Option* scenario =
        command.add_option("scenario", options.scenario_path, "Scenario file (TOML); see the README for its keys");
    if (scenario_required) scenario->required();
    command.add_option("--set", options.set_overrides,
                       "Override one scenario value: section.key=value, the value in TOML syntax "
                       "(e.g. --set electrolyte.concentration_mM=25, --set species.2.radius_nm=40); "
                       "repeatable. Units are those of the key's name.")
        ->type_name("SECTION.KEY=VALUE")
        ->allow_extra_args(false);
    command.add_flag("--json", options.json,
                     "Write only JSON to standard output (messages go to standard error)");
}

}  // namespace

int main(int argc, char** argv) {
    CLI::App app{"brownfloc: colloidal stability from DLVO theory, and Brownian-dynamics "
                 "aggregation runs. Energies in kT, lengths in nm, concentrations in mM, times in s."};
    app.set_version_flag("--version", std::string("brownfloc ") + BROWNFLOC_VERSION);
    app.require_subcommand(1);

    DlvoOptions dlvo;
    CLI::App* dlvo_command = app.add_subcommand(
        "dlvo", "Interaction curve, energy barrier and minima (kT, nm), Fuchs stability ratios W "
                "(plain, with hydrodynamics, and as measured), fast rate constant (m^3/s) and half-lives (s)");
    add_common(*dlvo_command, dlvo.common);
    dlvo_command->add_option("--curve", dlvo.curve_path,
                             "Also write the interaction curve as CSV: gap_nm, total_kT, vdw_kT, "
                             "double_layer_kT, force_pN (2000 log-spaced gaps)")
        ->type_name("FILE.csv");

    CommonOptions ccc;
    CLI::App* ccc_command = app.add_subcommand(
        "ccc", "Critical coagulation concentration (mM) of the varied salt (titrant, else salt): barrier "
               "and kinetic criteria, and for 1:1, 2:2, 3:3 salts with the Schulze-Hardy exponent");
    add_common(*ccc_command, ccc);

    RunCommandOptions run;
    CLI::App* run_command = app.add_subcommand(
        "run", "Brownian-dynamics aggregation run: cluster growth, size distributions, measured rate constant "
               "and stability ratio, fractal dimension; writes a run directory (see the README)");
    add_common(*run_command, run.common, false);  // not with --resume
    run_command->add_option("-o,--output", run.output_dir, "Run directory (default runs/<scenario name>-seed<S>)")
        ->type_name("RUN_DIR");
    run_command->add_option("--threads", run.threads, "OpenMP threads (default: OMP_NUM_THREADS, else all cores); "
                                                      "results are bitwise the same for any count")
        ->check(CLI::Range(1, 4096));
    run_command->add_option("--seed", run.seed, "Random seed, replacing [run] seed");
    run_command->add_flag("--quiet", run.quiet, "No progress lines on standard error");
    run_command->add_flag("--overwrite", run.overwrite, "Replace the results in a run directory that holds another run");
    CLI::Option* resume = run_command->add_option("--resume", run.resume_dir,
                                                  "Continue the run in RUN_DIR from its checkpoint (with --threads, "
                                                  "--quiet and --force only); the same bits as an uninterrupted run")
                              ->type_name("RUN_DIR");
    run_command->add_flag("--force", run.force, "With --resume: accept a checkpoint written by another build "
                                                "(the bits then differ from an uninterrupted run)");
    for (const char* other : {"scenario", "--set", "--json", "-o", "--seed", "--overwrite"})
        resume->excludes(run_command->get_option(other));

    // A write past `ulimit -f` then fails with EFBIG (reported, exit 3) instead of killing us.
    brownfloc::io::ignore_file_size_signal();
    // Test-only: BROWNFLOC_TEST_FAIL_WRITE=N makes the N-th write of this process fail with
    // ENOSPC (disk full), through the io library's fault seam.
    if (const char* n = std::getenv("BROWNFLOC_TEST_FAIL_WRITE"); n && *n)
        brownfloc::io::testing::fail_nth_write(std::strtoull(n, nullptr, 10), ENOSPC);
    ExportOptions export_options;
    CLI::App* export_command = app.add_subcommand(
        "export", "One frame of a run's trajectory as CSV: id, species, radius_nm, x_nm, y_nm, z_nm, cluster, "
                  "spans_box (each cluster stored whole)");
    export_command->add_option("run_dir", export_options.run_dir, "Run directory (holds trajectory.bftraj)")
        ->required();
    export_command->add_option("--frame", export_options.frame, "Frame number (from 0) or last (default: the last "
                                                                "intact frame)")
        ->type_name("N|last");
    export_command->add_option("--format", export_options.format, "Output format")->check(CLI::IsMember({"csv"}));
    export_command->add_option("-o,--output", export_options.output_path,
                               "Write to this file (replaced atomically) instead of standard output")
        ->type_name("FILE");

    ShelfLifeCommandOptions shelf_life;
    CLI::App* shelf_life_command = app.add_subcommand(
        "shelf-life", "Time to an aggregation criterion at storage temperatures ([storage]; defaults 25, 30, 40, "
                      "5 degC), its acceleration with temperature, and the added salt the dispersion tolerates "
                      "before that time falls to the target; a model estimate, not a stability test");
    add_common(*shelf_life_command, shelf_life.common);
    shelf_life_command->add_option("--plot", shelf_life.plot_path,
                                   "Also write an SVG of the time to the criterion against the varied salt at the "
                                   "first temperature (log-log), with the p5-p95 Monte Carlo band, the present salt, "
                                   "the CCC and the target marked");

    try {
        app.parse(argc, argv);
    } catch (const CLI::ParseError& e) {
        if (e.get_exit_code() == 0) return app.exit(e);  // --help, --version
        std::cerr << "error: " << e.what() << " (see brownfloc --help)\n";
        return exit_bad_input;
    }

    try {
        if (dlvo_command->parsed()) return run_dlvo(dlvo);
        if (ccc_command->parsed()) return run_ccc(ccc);
        if (run_command->parsed()) return run_run(run);
        if (export_command->parsed()) return run_export(export_options);
        if (shelf_life_command->parsed()) return run_shelf_life(shelf_life);
    } catch (const brownfloc::InputError& e) {
        std::cerr << "error: " << e.what() << "\n";
        return exit_bad_input;
    } catch (const brownfloc::sim::CheckpointFormatError& e) {
        std::cerr << "error: " << e.what() << "\n";  // a damaged or foreign checkpoint
        return exit_bad_input;
    } catch (const brownfloc::trajectory::TrajectoryFormatError& e) {
        std::cerr << "error: " << e.what() << "\n";  // a damaged or hostile file
        return exit_bad_input;
    } catch (const brownfloc::io::IoError& e) {
        std::cerr << "error: " << e.what() << "\n";
        return exit_io;
    } catch (const brownfloc::sim::EnvironmentError& e) {
        std::cerr << "error: " << e.what() << "\n";
        return exit_io;
    } catch (const std::exception& e) {
        std::cerr << "error: internal error: " << e.what() << " (please report this with the scenario)\n";
        return exit_internal;
    }
    return exit_internal;
}
