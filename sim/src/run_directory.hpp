#pragma once
// The run directory on disk: created if missing, refused if it holds another run (unless
// overwrite), and locked for the life of the process that writes into it. The lock is a
// kernel advisory lock (flock) on RUN_DIR/.lock, which the kernel drops when the process
// ends, however it ends: a killed run never blocks its resumption. A second writer is refused
// (EnvironmentError, exit 3) with the holder's PID, which the holder writes into the file.
// Readers (export, the viewer) never take it.
#include <cstdint>
#include <filesystem>
#include <optional>
#include <string>

#include "io/unique_fd.hpp"

namespace brownfloc::sim {

class RunDirectory {
public:
    enum class Mode {
        new_run,    // create; refuse a directory that holds a run
        overwrite,  // create; remove the files of a run it holds
        resume,     // must hold a run (a checkpoint)
    };
    RunDirectory(const std::filesystem::path& dir, Mode mode);

    [[nodiscard]] const std::filesystem::path& path() const { return dir_; }
    [[nodiscard]] std::filesystem::path file(const std::string& name) const { return dir_ / name; }
    // Replaces a whole file atomically (temporary file, fsync, rename, directory fsync).
    // Throws io::IoError.
    void write_file(const std::string& name, const std::string& content) const;
    // Bytes available to us on the directory's file system (statvfs); empty if unknown.
    [[nodiscard]] std::optional<std::uint64_t> available_bytes() const;

private:
    std::filesystem::path dir_;
    io::UniqueFd lock_;
};

// The files of a run (present or not).
inline constexpr const char* trajectory_file_name = "trajectory.bftraj";
inline constexpr const char* checkpoint_file_name = "checkpoint.bfckpt";

}  // namespace brownfloc::sim
