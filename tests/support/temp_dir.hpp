#pragma once
// A fresh temporary directory for one test, removed with everything in it at the end.
#include <stdlib.h>  // mkdtemp (POSIX)

#include <filesystem>
#include <stdexcept>
#include <string>
#include <string_view>
#include <system_error>

namespace brownfloc::test {

class TempDir {
public:
    explicit TempDir(std::string_view prefix = "brownfloc") {
        std::string pattern = (std::filesystem::temp_directory_path() / prefix).string();
        pattern += "-XXXXXX";
        if (::mkdtemp(pattern.data()) == nullptr) throw std::runtime_error("mkdtemp failed");
        path_ = pattern;
    }
    TempDir(const TempDir&) = delete;
    TempDir& operator=(const TempDir&) = delete;
    ~TempDir() {
        std::error_code ignored;
        std::filesystem::remove_all(path_, ignored);
    }
    [[nodiscard]] const std::filesystem::path& path() const { return path_; }
    [[nodiscard]] std::filesystem::path operator/(std::string_view name) const { return path_ / name; }

private:
    std::filesystem::path path_;
};

}  // namespace brownfloc::test
