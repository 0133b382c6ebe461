#pragma once
// A text file a run appends to (timeseries.csv, size_distribution.csv): created new, never
// through a symbolic link; appended in whole rows; its length and row count are what a
// checkpoint records, and a resumed run cuts it back to them before appending again.
#include <cstdint>
#include <filesystem>
#include <string>
#include <string_view>

#include "io/unique_fd.hpp"

namespace brownfloc::sim {

class AppendingFile {
public:
    // A new file (refused if the path exists). Throws io::IoError.
    [[nodiscard]] static AppendingFile create(const std::filesystem::path& path);
    // An existing file cut back to valid_bytes holding valid_rows lines, for appending.
    // Throws io::IoError, or EnvironmentError when the file is shorter than valid_bytes.
    [[nodiscard]] static AppendingFile reopen(const std::filesystem::path& path, std::uint64_t valid_bytes,
                                              std::uint64_t valid_rows);

    // Appends text (whole lines): buffered until flush().
    void append(std::string_view text);
    // Writes the buffer out; sync() also fsyncs. Throw io::IoError.
    void flush();
    void sync();

    [[nodiscard]] std::uint64_t bytes() const { return bytes_; }  // including the buffer
    [[nodiscard]] std::uint64_t rows() const { return rows_; }    // newlines written
    [[nodiscard]] const std::filesystem::path& path() const { return path_; }

private:
    AppendingFile(io::UniqueFd fd, std::filesystem::path path, std::uint64_t bytes, std::uint64_t rows);
    io::UniqueFd fd_;
    std::filesystem::path path_;
    std::string buffer_;
    std::uint64_t bytes_ = 0, rows_ = 0;
};

}  // namespace brownfloc::sim
