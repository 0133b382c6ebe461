#include "run_view_data.hpp"

#include "data/frame_analysis.hpp"
#include "data/run_location.hpp"
#include "io/io_error.hpp"
#include "io/message_text.hpp"
#include "run_files/csv_table.hpp"
#include "run_files/run_file_error.hpp"
#include "run_files/run_summary_view.hpp"
#include "trajectory/trajectory_error.hpp"
#include "viewer_errors.hpp"

namespace brownfloc::viewer {

std::shared_ptr<LiveTrajectory> open_run(const std::filesystem::path& run) {
    try {
        return std::make_shared<LiveTrajectory>(locate_run(run));
    } catch (const trajectory::TrajectoryFormatError& error) {
        throw ViewerInputError(error.what());
    } catch (const io::IoError& error) {
        throw ViewerInputError(error.what());
    } catch (const std::runtime_error& error) {  // locate_run's refusals
        throw ViewerInputError(error.what());
    }
}

CountSeries load_count_series(const LiveTrajectory& trajectory) {
    const RunLocation& where = trajectory.location();
    const std::size_t n = trajectory.header().radius_nm.size();
    if (!where.timeseries_csv.empty()) {
        try {
            return count_series_from_timeseries(run_files::read_csv_table(where.timeseries_csv), n);
        } catch (const std::exception&) {
            // A damaged or foreign timeseries.csv: fall back to the frames (noted by the caller).
        }
    }
    FrameCountCollector collector;
    for (std::size_t k = 0; k < trajectory.frame_count(); ++k) {
        try {
            const trajectory::TrajectoryFrame frame = trajectory.read_frame(k);
            collector.add(frame.time_s, frame.cluster_count);
        } catch (const std::exception&) {
            // The file changed under us; the next poll re-indexes it.
        }
    }
    return collector.series(trajectory.header().fast_half_life_s, n);
}

LoadedFrame load_frame_now(const LiveTrajectory& trajectory, std::size_t k, std::uint64_t seed) {
    LoadedFrame loaded;
    loaded.index = k;
    loaded.info = trajectory.frame_info(k);
    auto frame = std::make_shared<const trajectory::TrajectoryFrame>(trajectory.read_frame(k));
    loaded.analysis = std::make_shared<const FrameAnalysis>(analyse_frame(trajectory.header(), *frame, seed));
    loaded.frame = std::move(frame);
    return loaded;
}

std::vector<std::string> trajectory_notes(const LiveTrajectory& trajectory) {
    std::vector<std::string> notes;
    switch (trajectory.tail_state()) {
        case TailState::complete: break;
        case TailState::writing: notes.emplace_back("writing\xE2\x80\xA6"); break;
        case TailState::incomplete_last_frame: notes.emplace_back("incomplete last frame"); break;
    }
    std::size_t damaged = 0;
    for (const std::string& warning : trajectory.warnings())
        if (warning.find("skipped") != std::string::npos) ++damaged;  // the torn-tail warning is the state above
    if (damaged > 0) notes.push_back(io::message(damaged, damaged == 1 ? " damaged frame skipped" : " damaged frames skipped"));
    return notes;
}

std::optional<std::string> run_status_note(const LiveTrajectory& trajectory) {
    const std::filesystem::path& summary = trajectory.location().summary_json;
    if (summary.empty()) return std::nullopt;
    try {
        const run_files::RunSummaryView view = run_files::read_run_summary(summary);
        if (!view.status || *view.status == run_files::RunStatus::complete) return std::nullopt;
        if (*view.status == run_files::RunStatus::interrupted)
            return std::string("run interrupted: continue it with brownfloc run --resume");
        return std::string("run in progress");
    } catch (const std::exception&) {
        return std::nullopt;
    }
}

}  // namespace brownfloc::viewer
