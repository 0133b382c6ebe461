// `brownfloc export RUN_DIR [--frame N|last] [--format csv] [-o FILE]`.
#include <csignal>
#include <cerrno>
#include <cstdio>
#include <cstring>
#include <filesystem>
#include <iostream>
#include <string>

#include "commands.hpp"
#include "io/atomic_file.hpp"
#include "sim/frame_export.hpp"
#include "trajectory/trajectory_reader.hpp"

namespace brownfloc::app {

namespace {

// The index of the intact frame numbered `wanted`, or frame_count() if there is none.
std::size_t index_of_frame(const trajectory::TrajectoryReader& reader, std::uint64_t wanted) {
    for (std::size_t k = 0; k < reader.frame_count(); ++k)
        if (reader.frame_info(k).frame_number == wanted) return k;
    return reader.frame_count();
}

}  // namespace

int run_export(const ExportOptions& options) {
    const std::filesystem::path path = std::filesystem::path(options.run_dir) / "trajectory.bftraj";
    trajectory::TrajectoryReader reader(path);
    for (const std::string& warning : reader.warnings()) std::cerr << "warning: " << warning << "\n";
    if (reader.frame_count() == 0) {
        std::cerr << "error: " << path.string() << ": no intact frame to export\n";
        return exit_bad_input;
    }
    const std::uint64_t last_number = reader.frame_info(reader.frame_count() - 1).frame_number;
    std::size_t k = reader.frame_count() - 1;
    if (options.frame != "last") {
        std::uint64_t wanted = 0;
        const bool digits = !options.frame.empty() && options.frame.size() <= 18 &&
                            options.frame.find_first_not_of("0123456789") == std::string::npos;
        if (digits) wanted = std::stoull(options.frame);
        k = digits ? index_of_frame(reader, wanted) : reader.frame_count();
        if (k == reader.frame_count()) {
            std::cerr << "error: --frame " << (digits ? options.frame : std::string("value")) << ": "
                      << (digits ? "no intact frame of that number" : "must be a frame number or last")
                      << " (" << reader.frame_count() << " intact frames, the last numbered " << last_number << ")\n";
            return exit_bad_input;
        }
    }
    const std::string csv = sim::frame_csv(reader.header(), reader.read_frame(k), reader.positions_float64());
    if (!options.output_path.empty()) {
        io::write_file_atomically(options.output_path, csv);
        return exit_ok;
    }
    // Standard output: a reader that stops early (| head) ends the export quietly.
    std::signal(SIGPIPE, SIG_IGN);
    const std::size_t written = std::fwrite(csv.data(), 1, csv.size(), stdout);
    if (written != csv.size() || std::fflush(stdout) != 0) {
        if (errno == EPIPE) return exit_ok;
        std::cerr << "error: cannot write to standard output: " << std::strerror(errno) << "\n";
        return exit_io;
    }
    return exit_ok;
}

}  // namespace brownfloc::app
