#include "sim/run_driver.hpp"

#include <omp.h>

#include <algorithm>
#include <chrono>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <memory>
#include <optional>
#include <sstream>
#include <thread>

#include "appending_file.hpp"
#include "io/file_reading.hpp"
#include "potentials/input_error.hpp"
#include "run_directory.hpp"
#include "run_signals.hpp"
#include "run_summary.hpp"
#include "sha256.hpp"
#include "sim/checkpoint.hpp"
#include "sim/engine.hpp"
#include "sim/engine_setup.hpp"
#include "sim/engine_state.hpp"
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


namespace {

std::string clusters_csv(const std::vector<ClusterRow>& rows, const std::vector<std::string>& species_names) {
    std::string csv = "cluster_id,size,radius_of_gyration_nm,hydrodynamic_radius_nm,spans_box";
    for (const std::string& name : species_names) {
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
    return csv;
}

// A test-only pause after a checkpoint's output files are synced and before the checkpoint
// is written and renamed into place, so that a test can kill the run in mid-checkpoint:
// BROWNFLOC_TEST_CHECKPOINT_PAUSE_FILE names a file created (empty) when the pause begins;
// the pause lasts BROWNFLOC_TEST_CHECKPOINT_PAUSE_S seconds (default 30).
void test_checkpoint_pause() {
    const char* marker = std::getenv("BROWNFLOC_TEST_CHECKPOINT_PAUSE_FILE");
    if (!marker || !*marker) return;
    const char* seconds = std::getenv("BROWNFLOC_TEST_CHECKPOINT_PAUSE_S");
    { std::ofstream touch(marker); }
    std::this_thread::sleep_for(std::chrono::duration<double>(seconds ? std::atof(seconds) : 30.0));
}

// [output] checkpoint_interval_wall_s, or the default; tests override it with
// BROWNFLOC_TEST_CHECKPOINT_INTERVAL_S so that runs checkpointing at different rates share one
// scenario (the interval is part of the resolved scenario, which the outputs carry).
double checkpoint_interval_s(const Scenario& s) {
    if (const char* test = std::getenv("BROWNFLOC_TEST_CHECKPOINT_INTERVAL_S"); test && *test) return std::atof(test);
    return s.output.checkpoint_interval_wall_s.value_or(default_checkpoint_interval_wall_s);
}

// One process's share of a run: a new run, or a resumed one, from its first step here to the
// end or to an interruption.
class RunSession {
public:
    RunSession(Scenario scenario, std::string resolved, RunPlan plan, RunDirectory dir, std::ostream* messages, int threads)
        : scenario_(std::move(scenario)), resolved_(std::move(resolved)), plan_(std::move(plan)), dir_(std::move(dir)),
          msg_(messages), threads_(threads), outputs_(output_steps(scenario_, plan_)),
          snapshots_(snapshot_steps(scenario_, plan_)),
          checkpoint_interval_s_(checkpoint_interval_s(scenario_)) {}

    // A new run: engine from the plan, new output files.
    void start_new() {
        engine_ = std::make_unique<Engine>(plan_.model, plan_.particles);
        recorder_ = std::make_unique<RunRecorder>(plan_, *engine_);
        timeseries_.emplace(AppendingFile::create(dir_.file("timeseries.csv")));
        sizes_.emplace(AppendingFile::create(dir_.file("size_distribution.csv")));
        std::ostringstream ts, sz;
        RunRecorder::write_timeseries_header(ts, plan_.model->reversible);
        RunRecorder::write_size_distribution_header(sz);
        timeseries_->append(ts.str());
        sizes_->append(sz.str());
        const bool float64 = scenario_.output.trajectory_precision.value_or("float32") == "float64";
        trajectory_.emplace(trajectory::TrajectoryWriter::create(dir_.file(trajectory_file_name),
                                                                 trajectory_header(scenario_, plan_, resolved_), float64));
    }

    // A resumed run: engine and recorder from the checkpoint, output files cut back to it.
    void start_from(const Checkpoint& c) {
        try {
            engine_ = std::make_unique<Engine>(plan_.model, c.engine);
            recorder_ = std::make_unique<RunRecorder>(plan_, *engine_);
            recorder_->restore(c.recorder);
        } catch (const std::invalid_argument& e) {
            std::string m = dir_.file(checkpoint_file_name).string();
            m += ": the state does not fit the run's scenario: ";
            m += e.what();
            throw CheckpointFormatError(m);
        }
        if (c.next_output > outputs_.size() || c.next_snapshot > snapshots_.size())
            throw CheckpointFormatError(dir_.file(checkpoint_file_name).string() + ": output positions beyond the schedule");
        next_output_ = static_cast<std::size_t>(c.next_output);
        next_snapshot_ = static_cast<std::size_t>(c.next_snapshot);
        timeseries_.emplace(AppendingFile::reopen(dir_.file("timeseries.csv"), c.files.timeseries_bytes, c.files.timeseries_rows));
        sizes_.emplace(AppendingFile::reopen(dir_.file("size_distribution.csv"), c.files.size_distribution_bytes,
                                             c.files.size_distribution_rows));
        trajectory_.emplace(trajectory::TrajectoryWriter::reopen_for_append(dir_.file(trajectory_file_name),
                                                                            c.files.trajectory_bytes, c.files.trajectory_frames));
        earlier_wall_s_ = c.wall_time_s;
        resumes_ = c.resumes + 1;
    }

    // Steps to the end or to a signal; returns the signal (0 when the run is complete).
    int run() {
        auto last_report = Clock::now(), last_checkpoint = Clock::now();
        bool first = true;
        while (true) {
            if (next_output_ < outputs_.size() && outputs_[next_output_] == engine_->steps_taken()) {
                std::ostringstream ts, sz;
                recorder_->write_output(*engine_, ts, sz);
                timeseries_->append(ts.str());
                sizes_->append(sz.str());
                ++next_output_;
            }
            if (next_snapshot_ < snapshots_.size() && snapshots_[next_snapshot_] == engine_->steps_taken()) {
                trajectory_->append(trajectory_frame(*engine_));
                ++next_snapshot_;
            }
            if (first) write_results("running");  // the state where this process starts, for anyone looking in
            if (engine_->steps_taken() >= plan_.total_steps) return 0;
            // A checkpoint at the start (step 0, or where a resumed run begins) and then every
            // checkpoint_interval_wall_s; never between an output and its step.
            const auto now = Clock::now();
            if ((first && engine_->steps_taken() == 0) ||
                std::chrono::duration<double>(now - last_checkpoint).count() >= checkpoint_interval_s_) {
                write_checkpoint_now(false);
                last_checkpoint = Clock::now();
            }
            first = false;
            if (const int signal = SignalGuard::received(); signal != 0) return signal;
            engine_->step();
            recorder_->after_step(*engine_);
            ++session_steps_;
            if (msg_ && (engine_->steps_taken() & 63) == 0 && now - last_report > std::chrono::seconds(2)) {
                last_report = now;
                report_progress();
            }
        }
    }

    // Flushes and fsyncs the output files, then replaces the checkpoint atomically.
    void write_checkpoint_now(bool complete) {
        timeseries_->sync();
        sizes_->sync();
        trajectory_->sync();
        Checkpoint c;
        c.build_id = build_id();
        c.scenario_toml = resolved_;
        c.seed = scenario_.run.seed;
        c.engine = engine_->state();
        c.recorder = recorder_->state();
        c.next_output = next_output_;
        c.next_snapshot = next_snapshot_;
        c.files = {trajectory_->bytes(), trajectory_->frames(), timeseries_->bytes(), timeseries_->rows(),
                   sizes_->bytes(),      sizes_->rows()};
        c.wall_time_s = wall_time_s();
        c.resumes = resumes_;
        c.complete = complete;
        test_checkpoint_pause();
        write_checkpoint(dir_.file(checkpoint_file_name), c);
    }

    // clusters.csv and summary.json; status complete, running or interrupted.
    std::string write_results(const std::string& status) {
        const std::vector<ClusterRow> rows = recorder_->cluster_rows(*engine_);
        if (status == "complete") dir_.write_file("clusters.csv", clusters_csv(rows, plan_.model->species_names));
        RunTiming timing;
        timing.wall_time_s = wall_time_s();
        timing.session_wall_time_s = session_wall_s();
        timing.session_particle_steps = session_steps_ * static_cast<std::int64_t>(engine_->particle_count());
        timing.threads = threads_;
        timing.status = status;
        timing.resumes = resumes_;
        timing.trajectory_file = trajectory_file_name;
        timing.trajectory_bytes = trajectory_->bytes();
        timing.trajectory_frames = trajectory_->frames();
        const Json summary = run_summary_json(scenario_, plan_, *engine_, *recorder_, rows, sha256_hex(resolved_), timing);
        std::string text = summary.dump();
        dir_.write_file("summary.json", text + "\n");
        return text;
    }

    void report_done() const {
        if (!msg_) return;
        *msg_ << "  done: " << engine_->steps_taken() << " steps in " << short_number(wall_time_s()) << " s; "
              << engine_->bodies().size() << " clusters; results in " << dir_.path().string() << "\n";
        const RateFit fit = recorder_->total_rate();
        const double w_capture = std::exp(plan_.model->pair_kinds.front().log_stability_ratio_at_capture);
        if (fit.rate_m3_per_s && fit.ci95_m3_per_s && *fit.rate_m3_per_s > 0) {
            const double k_fast = plan_.mean_fast_rate_m3_per_s;
            *msg_ << "  measured stability ratio " << short_number(k_fast / *fit.rate_m3_per_s) << " (95 % interval "
                  << short_number(k_fast / (*fit.ci95_m3_per_s)[1]) << "-" << short_number(k_fast / (*fit.ci95_m3_per_s)[0])
                  << ", " << fit.events << " events); Fuchs, from the capture gap, without hydrodynamics: "
                  << short_number(w_capture) << "\n";
        } else {
            *msg_ << "  no measured rate: " << fit.note << "\n";
        }
        const analysis::SizeStatistics last = recorder_->last_statistics();
        *msg_ << "  mean cluster size " << short_number(last.mean_size) << " (weight-average "
              << short_number(last.weight_mean_size) << ", largest " << last.largest << ")\n";
    }

private:
    [[nodiscard]] double session_wall_s() const { return std::chrono::duration<double>(Clock::now() - start_).count(); }
    [[nodiscard]] double wall_time_s() const { return earlier_wall_s_ + session_wall_s(); }

    void report_progress() const {
        const double wall = session_wall_s();
        const double done = double(engine_->steps_taken()) / double(plan_.total_steps);
        const double rate = double(session_steps_) * double(engine_->particle_count()) / wall;
        const double left_steps = double(plan_.total_steps - engine_->steps_taken());
        *msg_ << "  " << short_number(100 * done, 3) << " %  t = " << short_number(engine_->time_s()) << " s ("
              << short_number(engine_->time_s() / plan_.half_life_fast_s) << " fast half-lives)  clusters "
              << engine_->bodies().size() << "  " << short_number(rate) << " particle-steps/s  ETA "
              << short_number(left_steps * double(engine_->particle_count()) / std::max(rate, 1e-300)) << " s\n";
    }

    Scenario scenario_;
    std::string resolved_;
    RunPlan plan_;
    RunDirectory dir_;
    std::ostream* msg_;
    int threads_;
    std::vector<std::int64_t> outputs_, snapshots_;
    double checkpoint_interval_s_;
    std::unique_ptr<Engine> engine_;
    std::unique_ptr<RunRecorder> recorder_;
    std::optional<AppendingFile> timeseries_, sizes_;
    std::optional<trajectory::TrajectoryWriter> trajectory_;
    std::size_t next_output_ = 0, next_snapshot_ = 0;
    std::int64_t session_steps_ = 0, resumes_ = 0;
    double earlier_wall_s_ = 0;
    Clock::time_point start_ = Clock::now();
};

// Runs the session to its end or a signal and writes what each case needs.
RunResult finish_session(RunSession& session, const std::string& output_dir) {
    RunResult result;
    result.output_dir = output_dir;
    const int signal = session.run();
    if (signal != 0) {
        SignalGuard::set_writing_checkpoint(true);
        session.write_checkpoint_now(false);
        result.summary_json = session.write_results("interrupted");
        result.interrupted_by = signal;
        result.checkpoint_written = true;
        return result;
    }
    result.summary_json = session.write_results("complete");
    SignalGuard::set_writing_checkpoint(true);
    session.write_checkpoint_now(true);
    SignalGuard::set_writing_checkpoint(false);
    session.report_done();
    return result;
}

// What a run will write, roughly [bytes]: the trajectory (header, and per frame 64 bytes plus
// 16 or 28 per particle), two checkpoints at once (old and new, ~300 bytes per particle) and
// the CSVs (~300 bytes per output row and size class).
std::uint64_t estimated_output_bytes(const Scenario& s, const RunPlan& plan, std::size_t outputs, std::size_t snapshots) {
    const double n = double(plan.particle_count);
    const double per_particle = s.output.trajectory_precision.value_or("float32") == "float64" ? 28.0 : 16.0;
    const double trajectory = 20e3 * double(plan.model->pair_kinds.size()) + 12.0 * n + double(snapshots) * (64.0 + per_particle * n);
    const double checkpoints = 2.0 * 300.0 * n;
    const double csv = double(outputs) * 300.0 * 20.0;
    return static_cast<std::uint64_t>(trajectory + checkpoints + csv);
}

void warn_if_short_of_space(const RunDirectory& dir, std::uint64_t needed, std::ostream* out) {
    const std::optional<std::uint64_t> free = dir.available_bytes();
    if (!out || !free || needed <= *free) return;
    *out << "warning: the run will write about " << short_number(double(needed) / 1e6) << " MB, more than the "
         << short_number(double(*free) / 1e6) << " MB free for " << dir.path().string()
         << "; if the disk fills the run stops (exit 3) with its last checkpoint, and --resume continues it once "
            "there is room\n";
}

// The first line where two resolved scenario texts differ, as "[section] key".
std::string first_difference(const std::string& a, const std::string& b) {
    std::istringstream sa(a), sb(b);
    std::string la, lb, section;
    while (true) {
        const bool ga = static_cast<bool>(std::getline(sa, la)), gb = static_cast<bool>(std::getline(sb, lb));
        if (!ga && !gb) return "";
        if (ga && !la.empty() && la[0] == '[') section = la;
        if (ga != gb || la != lb) {
            const std::string& line = ga ? la : lb;
            const std::size_t eq = line.find('=');
            std::string key = eq == std::string::npos ? line : line.substr(0, eq);
            while (!key.empty() && key.back() == ' ') key.pop_back();
            std::string where = section.empty() ? std::string() : section + " ";
            where += key;
            return where;
        }
    }
}

// The plan, or nothing when SIGINT or SIGTERM arrived during the (long) placement.
std::optional<RunPlan> plan_or_stop(const Scenario& scenario, std::uint64_t seed) {
    try {
        return plan_run(scenario, seed, [] { return SignalGuard::received() != 0; });
    } catch (const SetupStopped&) {
        return std::nullopt;
    }
}

}  // namespace

RunResult execute_run(const Scenario& input, const RunOptions& options) {
    const SignalGuard signals;
    Scenario scenario = input;
    if (options.seed) scenario.run.seed = *options.seed;
    const std::uint64_t seed = scenario.run.seed;
    RunResult early;
    early.output_dir = options.output_dir.empty() ? default_run_directory(scenario.source, seed) : options.output_dir;
    std::optional<RunPlan> planned = plan_or_stop(scenario, seed);
    if (const int signal = SignalGuard::received(); !planned || signal != 0) {
        early.interrupted_by = signal;  // nothing written yet: nothing to keep
        return early;
    }
    RunPlan plan = std::move(*planned);
    std::ostream* msg = options.quiet ? nullptr : options.messages;
    if (msg) print_plan(*msg, plan, early.output_dir);

    RunDirectory dir(early.output_dir, options.overwrite ? RunDirectory::Mode::overwrite : RunDirectory::Mode::new_run);
    warn_if_short_of_space(dir, estimated_output_bytes(scenario, plan, output_steps(scenario, plan).size(),
                                                       snapshot_steps(scenario, plan).size()),
                           options.messages);
    std::string resolved = resolved_scenario_toml(scenario);
    dir.write_file("scenario.toml", resolved);
    omp_set_num_threads(std::max(1, options.threads));
    RunSession session(std::move(scenario), std::move(resolved), std::move(plan), std::move(dir), msg,
                       std::max(1, options.threads));
    session.start_new();
    return finish_session(session, early.output_dir);
}

RunResult resume_run(const ResumeOptions& options) {
    const SignalGuard signals;
    RunDirectory dir(options.run_dir, RunDirectory::Mode::resume);
    const Checkpoint checkpoint = read_checkpoint(dir.file(checkpoint_file_name));
    std::ostream* msg = options.quiet ? nullptr : options.messages;
    RunResult result;
    result.output_dir = options.run_dir;
    if (checkpoint.build_id != build_id()) {
        if (!options.force)
            throw InputError(dir.file(checkpoint_file_name).string() +
                             ": written by another build of brownfloc; its continuation would not give the same bits "
                             "as an uninterrupted run. Resume with --force to accept that");
        if (options.messages)
            *options.messages << "warning: the checkpoint was written by another build: the results will not be bitwise "
                                 "those of an uninterrupted run\n";
    }
    if (checkpoint.complete) {
        result.already_complete = true;
        return result;
    }
    // The scenario is the checkpoint's; the directory's copy must not have changed.
    io::ReadableFile file = io::open_for_reading(dir.file("scenario.toml"));
    std::string on_disk(static_cast<std::size_t>(std::min<std::uint64_t>(file.size_bytes, std::uint64_t{1} << 26)), '\0');
    io::pread_exact(file.fd.get(), 0, std::as_writable_bytes(std::span(on_disk.data(), on_disk.size())), dir.file("scenario.toml"));
    if (on_disk != checkpoint.scenario_toml)
        throw InputError(dir.file("scenario.toml").string() + ": differs from the scenario the checkpoint holds, first at " +
                         first_difference(on_disk, checkpoint.scenario_toml) +
                         "; a run continues only with the scenario it started with (start a new run to change it)");
    Scenario scenario = parse_scenario(checkpoint.scenario_toml, dir.file("scenario.toml").string());
    scenario.run.seed = checkpoint.seed;
    std::optional<RunPlan> planned = plan_or_stop(scenario, checkpoint.seed);
    if (const int signal = SignalGuard::received(); !planned || signal != 0) {
        result.interrupted_by = signal;  // the checkpoint on disk stays the one to resume from
        return result;
    }
    RunPlan plan = std::move(*planned);
    if (msg) {
        *msg << "brownfloc run --resume: " << options.run_dir << " from step " << checkpoint.engine.step << " of "
             << plan.total_steps << " (resume " << checkpoint.resumes + 1 << ")\n";
    }
    omp_set_num_threads(std::max(1, options.threads));
    RunSession session(std::move(scenario), checkpoint.scenario_toml, std::move(plan), std::move(dir), msg,
                       std::max(1, options.threads));
    session.start_from(checkpoint);
    return finish_session(session, options.run_dir);
}

}  // namespace brownfloc::sim
