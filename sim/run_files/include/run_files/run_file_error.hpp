#pragma once
// "This run file's content is not what our writers produce": a CSV cell that is not a number,
// a JSON string that is not UTF-8, a summary key of the wrong type. The message names the
// file, the line and column of the offending byte (both from 1; columns count bytes), what
// was found (text from the file escaped by io::quoted) and what is allowed:
//
//   runs/a/timeseries.csv:7:23: cell "1.5x" in column "mean_size" is not a number; cells are finite decimal numbers
//
// Failures to open or read the file (missing, a FIFO, too large, a failed read) are
// io::IoError instead.
#include <cstdint>
#include <stdexcept>
#include <string>
#include <string_view>

namespace brownfloc::run_files {

class RunFileError : public std::runtime_error {
public:
    // what() = "<source>:<line>:<column>: <problem>"
    RunFileError(std::string_view source, std::uint64_t line, std::uint64_t column, const std::string& problem);

    [[nodiscard]] std::uint64_t line() const noexcept { return line_; }
    [[nodiscard]] std::uint64_t column() const noexcept { return column_; }
    [[nodiscard]] const std::string& problem() const noexcept { return problem_; }

private:
    std::uint64_t line_;
    std::uint64_t column_;
    std::string problem_;
};

}  // namespace brownfloc::run_files
