#include "run_directory.hpp"

#include <fcntl.h>
#include <unistd.h>

#include <cerrno>
#include <cstring>
#include <system_error>

#include "sim/environment_error.hpp"

namespace brownfloc::sim {

namespace fs = std::filesystem;

namespace {
// Files whose presence means the directory holds a run.
constexpr const char* run_files[] = {"summary.json", "timeseries.csv", "scenario.toml"};
}

RunDirectory::RunDirectory(const fs::path& dir, bool overwrite) : dir_(dir) {
    std::error_code ec;
    fs::create_directories(dir_, ec);
    if (ec || !fs::is_directory(dir_))
        throw EnvironmentError(dir_.string() + ": cannot create the run directory: " +
                               (ec ? ec.message() : std::string("a file of that name exists")));
    const fs::path lock = dir_ / ".lock";
    const int fd = ::open(lock.c_str(), O_WRONLY | O_CREAT | O_EXCL, 0644);
    if (fd < 0) {
        if (errno == EEXIST)
            throw EnvironmentError(lock.string() + ": another run is writing into this directory (lock held); if no "
                                                   "run is active, delete the .lock file");
        throw EnvironmentError(dir_.string() + ": cannot write into the run directory: " + std::strerror(errno));
    }
    ::close(fd);
    locked_ = true;
    for (const char* name : run_files) {
        if (fs::exists(dir_ / name) && !overwrite) {
            fs::remove(lock, ec);  // the destructor does not run when the constructor throws
            throw EnvironmentError(dir_.string() + ": holds another run (" + name +
                                   "); choose another directory with -o or pass --overwrite");
        }
    }
    if (overwrite)
        for (const char* name : {"summary.json", "timeseries.csv", "scenario.toml", "clusters.csv", "size_distribution.csv"})
            fs::remove(dir_ / name, ec);
}

RunDirectory::~RunDirectory() {
    if (locked_) {
        std::error_code ec;
        fs::remove(dir_ / ".lock", ec);
    }
}

std::ofstream RunDirectory::open(const std::string& name) const {
    std::ofstream out(dir_ / name, std::ios::binary | std::ios::trunc);
    if (!out) throw EnvironmentError((dir_ / name).string() + ": cannot open for writing: " + std::strerror(errno));
    return out;
}

void RunDirectory::check(std::ofstream& out, const std::string& name) const {
    out.flush();
    if (!out) throw EnvironmentError((dir_ / name).string() + ": write failed (disk full or removed?)");
}

void RunDirectory::write_file(const std::string& name, const std::string& content) const {
    const std::string temporary = "." + name + ".partial";
    {
        std::ofstream out = open(temporary);
        out << content;
        check(out, temporary);
    }
    std::error_code ec;
    fs::rename(dir_ / temporary, dir_ / name, ec);
    if (ec) throw EnvironmentError((dir_ / name).string() + ": cannot write: " + ec.message());
}

}  // namespace brownfloc::sim
