#pragma once
// A numeric CSV file of a run directory (timeseries.csv, size_distribution.csv), read whole
// while the run may still be appending to it.
//
//   const CsvTable table = read_csv_table("runs/a/timeseries.csv");
//   const int t = table.column_index("time_s");
//   for (std::size_t r = 0; r < table.row_count; ++r) plot(table.at(r, t), ...);
//
// The format is what our writers produce: a header line of 1 to 256 unique names of
// [A-Za-z0-9_], then rows of exactly as many cells, each a finite decimal number read
// completely by std::from_chars (no spaces, no empty cells, no nan or inf); lines end in
// '\n', optionally preceded by '\r', and hold at most 64 KiB; a time_s column, if present,
// never decreases. A last line without its '\n' is a row being written (or a run killed
// mid-line): it is left out and torn_last_line is set, whatever it holds. Anything else is
// a RunFileError naming the line and column. clusters.csv (true/false and empty cells) is
// not in this format.
#include <cstddef>
#include <cstdint>
#include <filesystem>
#include <span>
#include <string>
#include <string_view>
#include <vector>

namespace brownfloc::run_files {

inline constexpr std::size_t max_csv_columns = 256;
inline constexpr std::size_t max_csv_line_bytes = 64 * 1024;  // without the '\n'
inline constexpr std::uint64_t max_csv_file_bytes = 256ull * 1024 * 1024;

struct CsvTable {
    std::vector<std::string> columns;  // header names, in file order
    std::vector<double> values;        // row-major: row_count * columns.size() finite numbers
    std::size_t row_count = 0;
    bool torn_last_line = false;  // the bytes after the last '\n' were left out

    // Position of the column named name, or -1 if there is none.
    [[nodiscard]] int column_index(std::string_view name) const;
    // The value in row (from 0) and column col (from 0); asserts both are in range.
    [[nodiscard]] double at(std::size_t row, std::size_t col) const;
};

// Parses the bytes of a CSV file; source_name is for messages only. Throws RunFileError.
[[nodiscard]] CsvTable parse_csv_table(std::span<const std::byte> bytes, std::string_view source_name);

// Reads and parses path: io::IoError if it cannot be opened or read, is not a regular file or
// is larger than max_csv_file_bytes; RunFileError for its content. Memory: the file, plus
// 8 bytes per cell (at most 4 times the file size).
[[nodiscard]] CsvTable read_csv_table(const std::filesystem::path& path);

}  // namespace brownfloc::run_files
