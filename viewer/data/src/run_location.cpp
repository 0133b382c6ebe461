#include "data/run_location.hpp"

#include <string>
#include <system_error>

#include "data/viewer_input_error.hpp"

namespace brownfloc::viewer {
namespace fs = std::filesystem;
namespace {

constexpr const char* expected_input =
    " (give a run directory written by `brownfloc run`, or a trajectory file such as run/trajectory.bftraj)";

bool is_regular_file_at(const fs::path& path) {
    std::error_code ec;
    return fs::is_regular_file(fs::status(path, ec));
}

fs::path if_regular_file(const fs::path& path) { return is_regular_file_at(path) ? path : fs::path{}; }

std::string kind_name(fs::file_type type) {
    switch (type) {
    case fs::file_type::fifo: return "a FIFO";
    case fs::file_type::socket: return "a socket";
    case fs::file_type::block: return "a block device";
    case fs::file_type::character: return "a character device";
    default: return "not a regular file";
    }
}

RunLocation in_directory(const fs::path& directory) {
    RunLocation where;
    where.run_directory = directory;
    where.trajectory = directory / run_trajectory_file_name;
    where.timeseries_csv = if_regular_file(directory / "timeseries.csv");
    where.summary_json = if_regular_file(directory / "summary.json");
    where.lock_file = if_regular_file(directory / ".lock");
    return where;
}

}  // namespace

RunLocation locate_run(const fs::path& run_dir_or_trajectory) {
    const fs::path& path = run_dir_or_trajectory;
    if (path.empty()) {
        std::string text = "no run given";
        text += expected_input;
        throw ViewerInputError(text);
    }
    std::error_code ec;
    const fs::file_status status = fs::status(path, ec);  // follows links
    if (status.type() == fs::file_type::not_found || (ec && status.type() == fs::file_type::none)) {
        std::string text = path.string();
        text += ": no such file or directory";
        if (ec && ec != std::errc::no_such_file_or_directory) {
            text = path.string();
            text += ": cannot be looked at: ";
            text += ec.message();
        }
        text += expected_input;
        throw ViewerInputError(text);
    }
    if (fs::is_directory(status)) {
        const fs::path trajectory = path / run_trajectory_file_name;
        if (!is_regular_file_at(trajectory)) {
            std::string text = path.string();
            text += ": not a run directory: it has no ";
            text += run_trajectory_file_name;
            text += expected_input;
            throw ViewerInputError(text);
        }
        return in_directory(path);
    }
    if (!fs::is_regular_file(status)) {
        std::string text = path.string();
        text += ": ";
        text += kind_name(status.type());
        text += ", neither a directory nor a regular file";
        text += expected_input;
        throw ViewerInputError(text);
    }
    // A run's own trajectory named directly: keep its directory's plots and lock.
    const fs::path parent = path.parent_path().empty() ? fs::path{"."} : path.parent_path();
    if (path.filename() == run_trajectory_file_name &&
        (is_regular_file_at(parent / "summary.json") || is_regular_file_at(parent / "timeseries.csv") ||
         is_regular_file_at(parent / ".lock"))) {
        RunLocation where = in_directory(parent);
        where.trajectory = path;
        return where;
    }
    RunLocation where;
    where.trajectory = path;
    return where;
}

}  // namespace brownfloc::viewer
