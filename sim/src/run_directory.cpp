#include "run_directory.hpp"

#include <fcntl.h>
#include <sys/file.h>
#include <sys/statvfs.h>
#include <unistd.h>

#include <cerrno>
#include <cstdlib>
#include <cstring>
#include <span>
#include <system_error>

#include "io/atomic_file.hpp"
#include "io/file_writing.hpp"
#include "sim/environment_error.hpp"

namespace brownfloc::sim {

namespace fs = std::filesystem;

namespace {

// Files whose presence means the directory holds a run, and every file a run writes.
constexpr const char* run_markers[] = {"summary.json", "timeseries.csv", "scenario.toml", trajectory_file_name,
                                       checkpoint_file_name};
constexpr const char* run_outputs[] = {"summary.json",          "timeseries.csv",     "scenario.toml", "clusters.csv",
                                       "size_distribution.csv", trajectory_file_name, checkpoint_file_name};

std::string message(const fs::path& path, const std::string& what) {
    std::string m = path.string();
    m += ": ";
    m += what;
    return m;
}

// The PID the holder wrote into the lock file, or "unknown".
std::string holder_pid(int fd) {
    char buf[32] = {};
    const ssize_t got = ::pread(fd, buf, sizeof buf - 1, 0);
    std::string pid;
    for (ssize_t k = 0; k < got && buf[k] >= '0' && buf[k] <= '9'; ++k) pid += buf[k];
    return pid.empty() ? std::string("unknown") : pid;
}

}  // namespace

RunDirectory::RunDirectory(const fs::path& dir, Mode mode) : dir_(dir) {
    std::error_code ec;
    if (mode == Mode::resume) {
        if (!fs::is_directory(dir_, ec)) throw EnvironmentError(message(dir_, "no such run directory"));
    } else {
        fs::create_directories(dir_, ec);
        if (ec || !fs::is_directory(dir_))
            throw EnvironmentError(message(dir_, "cannot create the run directory: " +
                                                     (ec ? ec.message() : std::string("a file of that name exists"))));
    }
    const fs::path lock = dir_ / ".lock";
    lock_ = io::UniqueFd(::open(lock.c_str(), O_RDWR | O_CREAT | O_NOFOLLOW | O_CLOEXEC, 0644));
    if (!lock_) throw EnvironmentError(message(lock, std::string("cannot open the lock file: ") + std::strerror(errno)));
    if (::flock(lock_.get(), LOCK_EX | LOCK_NB) != 0) {
        if (errno == EWOULDBLOCK)
            throw EnvironmentError(message(dir_, "another brownfloc process (PID " + holder_pid(lock_.get()) +
                                                     ") is writing into this run directory"));
        throw EnvironmentError(message(lock, std::string("cannot lock: ") + std::strerror(errno)));
    }
    const std::string pid = std::to_string(::getpid()) + "\n";
    io::truncate_to(lock_.get(), 0, lock);
    io::write_all(lock_.get(), std::as_bytes(std::span(pid.data(), pid.size())), lock);
    io::remove_stale_temporaries(dir_);

    if (mode == Mode::resume) return;
    for (const char* name : run_markers)
        if (fs::exists(fs::symlink_status(dir_ / name)) && mode == Mode::new_run)
            throw EnvironmentError(message(dir_, std::string("holds another run (") + name +
                                                     "); choose another directory with -o, pass --overwrite, or "
                                                     "continue it with --resume"));
    if (mode == Mode::overwrite)
        for (const char* name : run_outputs) fs::remove(dir_ / name, ec);
}

// Test-only: BROWNFLOC_TEST_FREE_BYTES=N stands for the free space (no test may fill a disk
// or mount a small one to see the warning).
std::optional<std::uint64_t> RunDirectory::available_bytes() const {
    if (const char* test = std::getenv("BROWNFLOC_TEST_FREE_BYTES"); test && *test)
        return std::strtoull(test, nullptr, 10);
    struct statvfs fs_info {};
    if (::statvfs(dir_.c_str(), &fs_info) != 0) return std::nullopt;
    return static_cast<std::uint64_t>(fs_info.f_bavail) * static_cast<std::uint64_t>(fs_info.f_frsize);
}

void RunDirectory::write_file(const std::string& name, const std::string& content) const {
    io::write_file_atomically(dir_ / name, content);
}

}  // namespace brownfloc::sim
