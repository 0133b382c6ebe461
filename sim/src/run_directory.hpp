#pragma once
// The run directory on disk: created if missing, refused if it holds another run (unless
// overwrite), guarded by a .lock file while a run writes into it.
#include <filesystem>
#include <fstream>
#include <string>

namespace brownfloc::sim {

class RunDirectory {
public:
    RunDirectory(const std::filesystem::path& dir, bool overwrite);
    ~RunDirectory();
    RunDirectory(const RunDirectory&) = delete;
    RunDirectory& operator=(const RunDirectory&) = delete;

    [[nodiscard]] const std::filesystem::path& path() const { return dir_; }
    // Opens a file in the directory for writing; EnvironmentError naming it on failure.
    [[nodiscard]] std::ofstream open(const std::string& name) const;
    // Writes a whole file (via a temporary and rename, so a reader never sees half of it).
    void write_file(const std::string& name, const std::string& content) const;
    // Throws EnvironmentError if the stream failed (disk full, ...).
    void check(std::ofstream& out, const std::string& name) const;

private:
    std::filesystem::path dir_;
    bool locked_ = false;
};

}  // namespace brownfloc::sim
