#include "sim/run_driver.hpp"

#include <omp.h>

#include <algorithm>
#include <chrono>
#include <cmath>
#include <cstdio>
#include <filesystem>
#include <sstream>

#include "appending_file.hpp"
#include "run_directory.hpp"
#include "run_summary.hpp"
#include "sha256.hpp"
#include "sim/engine.hpp"
#include "sim/engine_setup.hpp"
#include "sim/rate_fit.hpp"
#include "sim/run_recorder.hpp"
#include "sim/trajectory_recording.hpp"
#include "trajectory/trajectory_writer.hpp"

namespace brownfloc::sim {

namespace {

using Clock = std::chrono::steady_clock;

constexpr int default_outputs = 100;
constexpr int log_outputs_per_decade = 20;
constexpr double log_first_output_fraction = 1e-4;

// Steps (after the step with that number is done) at which an output is written.
std::vector<std::int64_t> output_steps(const Scenario& s, const RunPlan& plan) {
    const double dt = plan.model->time_step.time_step_s;
    const std::int64_t total = plan.total_steps;
    std::vector<std::int64_t> steps{0};
    const bool log = s.output.output_spacing && *s.output.output_spacing == "log";
    if (log) {
        const double first = s.output.output_interval_s.value_or(plan.end_time_s * log_first_output_fraction);
        for (int k = 0;; ++k) {
            const double t = first * std::pow(10.0, double(k) / log_outputs_per_decade);
            if (t >= plan.end_time_s) break;
            steps.push_back(std::max<std::int64_t>(1, std::llround(t / dt)));
        }
    } else {
        const double interval = s.output.output_interval_s.value_or(plan.end_time_s / default_outputs);
        for (int k = 1;; ++k) {
            const double t = k * interval;
            if (t >= plan.end_time_s * (1 - 1e-12)) break;
            steps.push_back(std::max<std::int64_t>(1, std::llround(t / dt)));
        }
    }
    steps.push_back(total);
    std::sort(steps.begin(), steps.end());
    steps.erase(std::unique(steps.begin(), steps.end()), steps.end());
    while (!steps.empty() && steps.back() > total) steps.pop_back();
    return steps;
}

std::string short_number(double v, int digits = 3) {
    char buf[40];
    std::snprintf(buf, sizeof buf, "%.*g", digits, v);
    return buf;
}

void print_plan(std::ostream& out, const RunPlan& plan, const std::string& dir) {
    const TimeStep& ts = plan.model->time_step;
    out << "brownfloc run: " << plan.particle_count << " particles, box " << short_number(plan.particles.box_length_m * 1e9, 4)
        << " nm; time step " << short_number(ts.time_step_s) << " s (" << ts.limited_by << ")\n"
        << "  predicted_steps " << plan.total_steps << " (" << short_number(plan.steps_per_half_life) << " per fast half-life of "
        << short_number(plan.half_life_fast_s) << " s; end time " << short_number(plan.end_time_s) << " s), "
        << short_number(double(plan.total_steps) * double(plan.particle_count)) << " particle-steps\n"
        << "  writing to " << dir << "\n";
    if (ts.user_given && ts.time_step_s > ts.rule_time_step_s)
        out << "  note: time_step_s is " << short_number(ts.time_step_s / ts.rule_time_step_s)
            << " times the step the rule gives; results may depend on it\n";
}

}  // namespace

std::string default_run_directory(const std::string& scenario_path, std::uint64_t seed) {
    const std::string stem = std::filesystem::path(scenario_path).stem().string();
    std::string dir = "runs/";
    dir += stem.empty() ? std::string("scenario") : stem;
    dir += "-seed";
    dir += std::to_string(seed);
    return dir;
}

RunResult execute_run(const Scenario& input, const RunOptions& options) {
    Scenario scenario = input;
    if (options.seed) scenario.run.seed = *options.seed;
    const std::uint64_t seed = scenario.run.seed;
    const RunPlan plan = plan_run(scenario, seed);
    RunResult result;
    result.output_dir = options.output_dir.empty() ? default_run_directory(scenario.source, seed) : options.output_dir;
    std::ostream* msg = options.quiet ? nullptr : options.messages;
    if (msg) print_plan(*msg, plan, result.output_dir);

    RunDirectory dir(result.output_dir, options.overwrite ? RunDirectory::Mode::overwrite : RunDirectory::Mode::new_run);
    const std::string resolved = resolved_scenario_toml(scenario);
    dir.write_file("scenario.toml", resolved);

    omp_set_num_threads(std::max(1, options.threads));
    const auto start = Clock::now();
    Engine engine(plan.model, plan.particles);
    RunRecorder recorder(plan, engine);
    AppendingFile timeseries = AppendingFile::create(dir.file("timeseries.csv"));
    AppendingFile sizes = AppendingFile::create(dir.file("size_distribution.csv"));
    {
        std::ostringstream ts, sz;
        RunRecorder::write_timeseries_header(ts, plan.model->reversible);
        RunRecorder::write_size_distribution_header(sz);
        timeseries.append(ts.str());
        sizes.append(sz.str());
    }
    const bool float64 = scenario.output.trajectory_precision.value_or("float32") == "float64";
    trajectory::TrajectoryWriter trajectory_out =
        trajectory::TrajectoryWriter::create(dir.file(trajectory_file_name), trajectory_header(scenario, plan, resolved), float64);

    const std::vector<std::int64_t> outputs = output_steps(scenario, plan);
    const std::vector<std::int64_t> snapshots = snapshot_steps(scenario, plan);
    std::size_t next_output = 0, next_snapshot = 0;
    auto last_report = Clock::now();
    while (true) {
        if (next_output < outputs.size() && outputs[next_output] == engine.steps_taken()) {
            std::ostringstream ts, sz;
            recorder.write_output(engine, ts, sz);
            timeseries.append(ts.str());
            sizes.append(sz.str());
            ++next_output;
        }
        if (next_snapshot < snapshots.size() && snapshots[next_snapshot] == engine.steps_taken()) {
            trajectory_out.append(trajectory_frame(engine));
            ++next_snapshot;
        }
        if (engine.steps_taken() >= plan.total_steps) break;
        engine.step();
        recorder.after_step(engine);
        if (msg && (engine.steps_taken() & 63) == 0) {
            const auto now = Clock::now();
            if (now - last_report > std::chrono::seconds(2)) {
                last_report = now;
                const double wall = std::chrono::duration<double>(now - start).count();
                const double done = double(engine.steps_taken()) / double(plan.total_steps);
                const double rate = double(engine.steps_taken()) * double(engine.particle_count()) / wall;
                *msg << "  " << short_number(100 * done, 3) << " %  t = " << short_number(engine.time_s()) << " s ("
                     << short_number(engine.time_s() / plan.half_life_fast_s) << " fast half-lives)  clusters "
                     << engine.bodies().size() << "  " << short_number(rate) << " particle-steps/s  ETA "
                     << short_number(wall * (1 - done) / std::max(done, 1e-12)) << " s\n";
            }
        }
    }
    timeseries.sync();
    sizes.sync();
    trajectory_out.sync();

    const std::vector<ClusterRow> rows = recorder.cluster_rows(engine);
    {
        std::string csv = "cluster_id,size,radius_of_gyration_nm,hydrodynamic_radius_nm,spans_box";
        for (const std::string& name : plan.model->species_names) {
            csv += ",count_";
            csv += name;
        }
        csv += "\n";
        char buf[64];
        for (const ClusterRow& r : rows) {
            csv += std::to_string(r.cluster_id);
            csv += ',';
            csv += std::to_string(r.size);
            csv += ',';
            if (r.radius_of_gyration_nm) { std::snprintf(buf, sizeof buf, "%.17g", *r.radius_of_gyration_nm); csv += buf; }
            csv += ",";
            if (r.hydrodynamic_radius_nm) { std::snprintf(buf, sizeof buf, "%.17g", *r.hydrodynamic_radius_nm); csv += buf; }
            csv += r.spans_box ? ",true" : ",false";
            for (std::int64_t c : r.per_species) {
                csv += ',';
                csv += std::to_string(c);
            }
            csv += "\n";
        }
        dir.write_file("clusters.csv", csv);
    }
    RunTiming timing;
    timing.wall_time_s = std::chrono::duration<double>(Clock::now() - start).count();
    timing.session_wall_time_s = timing.wall_time_s;
    timing.session_particle_steps = engine.steps_taken() * static_cast<std::int64_t>(engine.particle_count());
    timing.threads = std::max(1, options.threads);
    timing.trajectory_file = trajectory_file_name;
    timing.trajectory_bytes = trajectory_out.bytes();
    timing.trajectory_frames = trajectory_out.frames();
    const Json summary = run_summary_json(scenario, plan, engine, recorder, rows, sha256_hex(resolved), timing);
    result.summary_json = summary.dump();
    dir.write_file("summary.json", result.summary_json + "\n");
    if (msg) {
        *msg << "  done: " << engine.steps_taken() << " steps in " << short_number(timing.wall_time_s) << " s; "
             << engine.bodies().size() << " clusters; results in " << result.output_dir << "\n";
        const RateFit fit = recorder.total_rate();
        const double w_capture = std::exp(plan.model->pair_kinds.front().log_stability_ratio_at_capture);
        if (fit.rate_m3_per_s && fit.ci95_m3_per_s && *fit.rate_m3_per_s > 0) {
            const double k_fast = plan.mean_fast_rate_m3_per_s;
            *msg << "  measured stability ratio " << short_number(k_fast / *fit.rate_m3_per_s) << " (95 % interval "
                 << short_number(k_fast / (*fit.ci95_m3_per_s)[1]) << "-" << short_number(k_fast / (*fit.ci95_m3_per_s)[0])
                 << ", " << fit.events << " events); Fuchs, from the capture gap, without hydrodynamics: "
                 << short_number(w_capture) << "\n";
        } else {
            *msg << "  no measured rate: " << fit.note << "\n";
        }
        const analysis::SizeStatistics last = recorder.last_statistics();
        *msg << "  mean cluster size " << short_number(last.mean_size) << " (weight-average " << short_number(last.weight_mean_size)
             << ", largest " << last.largest << ")\n";
    }
    return result;
}

}  // namespace brownfloc::sim
