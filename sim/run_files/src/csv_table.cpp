#include "run_files/csv_table.hpp"

#include <cassert>
#include <charconv>
#include <cmath>
#include <system_error>

#include "io/message_text.hpp"
#include "run_files/run_file_error.hpp"
#include "whole_file.hpp"

namespace brownfloc::run_files {

namespace {

using io::message;

constexpr std::string_view name_rule = "names are 1 or more of A-Z, a-z, 0-9 and _";
constexpr std::string_view cell_rule = "cells are finite decimal numbers";

bool is_name_byte(char c) {
    return (c >= 'A' && c <= 'Z') || (c >= 'a' && c <= 'z') || (c >= '0' && c <= '9') || c == '_';
}

bool is_printable(char c) { return c >= 0x20 && c < 0x7F; }

// One pass over the lines; every error names the current line and a column within it.
class CsvParser {
public:
    CsvParser(std::span<const std::byte> bytes, std::string_view source)
        : text_{reinterpret_cast<const char*>(bytes.data()), bytes.size()}, source_{source} {}

    CsvTable parse() {
        CsvTable table;
        std::string_view header;
        if (!next_line(header)) {
            if (text_.empty()) fail(0, "no complete header line: the file is empty");
            fail(text_.size(),
                 message("no complete header line: the file ends after ", text_.size(), " bytes without a line end"));
        }
        parse_header(header, table.columns);
        const int time_column = table.column_index("time_s");
        std::string_view row;
        while (next_line(row)) {
            parse_row(row, table, time_column);
            ++table.row_count;
        }
        table.torn_last_line = next_ < text_.size();
        return table;
    }

private:
    // The next line terminated by '\n', without its "\n" or "\r\n"; false at the end or when only
    // an unterminated piece is left (that piece is never looked at).
    bool next_line(std::string_view& line) {
        if (next_ >= text_.size()) return false;
        const std::size_t end = text_.find('\n', next_);
        if (end == std::string_view::npos) return false;
        ++line_number_;
        line_start_ = next_;
        line = text_.substr(next_, end - next_);
        next_ = end + 1;
        if (!line.empty() && line.back() == '\r') line.remove_suffix(1);
        if (line.size() > max_csv_line_bytes)
            fail(line_start_ + max_csv_line_bytes,
                 message("the line holds ", line.size(), " bytes; lines hold at most ", max_csv_line_bytes));
        return true;
    }

    void parse_header(std::string_view line, std::vector<std::string>& columns) {
        std::size_t start = 0;
        while (true) {
            const std::size_t comma = std::min(line.find(',', start), line.size());
            const std::string_view name = line.substr(start, comma - start);
            if (columns.size() == max_csv_columns)
                fail(line_start_ + start,
                     message("more than ", max_csv_columns, " columns; the header names 1 to ", max_csv_columns));
            if (name.empty())
                fail(line_start_ + start, message("column ", columns.size() + 1, " has an empty name; ", name_rule));
            for (std::size_t i = 0; i < name.size(); ++i) {
                if (is_name_byte(name[i])) continue;
                fail(line_start_ + start + i,
                     message("column name ", io::quoted(name), " has ", io::quoted(name.substr(i, 1)),
                             is_printable(name[i]) ? "" : ", a byte that is not printable ASCII", "; ", name_rule));
            }
            for (std::size_t k = 0; k < columns.size(); ++k)
                if (columns[k] == name)
                    fail(line_start_ + start,
                         message("column name ", io::quoted(name), " repeats column ", k + 1, "; names are unique"));
            columns.emplace_back(name);
            if (comma == line.size()) return;
            start = comma + 1;
        }
    }

    void parse_row(std::string_view line, CsvTable& table, int time_column) {
        const std::size_t column_count = table.columns.size();
        std::size_t start = 0;
        for (std::size_t c = 0;; ++c) {
            if (c == column_count)
                fail(line_start_ + start - 1, message("the row has more than ", column_count,
                                                      " cells; the header names ", column_count, " columns"));
            const std::size_t comma = std::min(line.find(',', start), line.size());
            const double value = parse_cell(line.substr(start, comma - start), start, table.columns[c]);
            if (static_cast<int>(c) == time_column && table.row_count > 0) {
                const double previous = table.at(table.row_count - 1, c);
                if (value < previous)
                    fail(line_start_ + start, message("time_s = ", value, " is earlier than ", previous,
                                                      " on the line before; time_s must not decrease"));
            }
            table.values.push_back(value);
            if (comma == line.size()) {
                if (c + 1 < column_count)
                    fail(line_start_ + line.size(),
                         message("the row has ", c + 1, " cells; the header names ", column_count, " columns"));
                return;
            }
            start = comma + 1;
        }
    }

    double parse_cell(std::string_view cell, std::size_t start, const std::string& column) {
        const std::size_t at = line_start_ + start;
        if (cell.empty()) fail(at, message("empty cell in column ", io::quoted(column), "; ", cell_rule));
        double value = 0;
        const auto [end, error] = std::from_chars(cell.data(), cell.data() + cell.size(), value);
        if (error == std::errc::result_out_of_range && end == cell.data() + cell.size())
            fail(at, message("cell ", io::quoted(cell), " in column ", io::quoted(column),
                             " is out of the range of a double; ", cell_rule));
        if (error != std::errc() || end != cell.data() + cell.size())
            fail(at, message("cell ", io::quoted(cell), " in column ", io::quoted(column), " is not a number; ",
                             cell_rule));
        if (!std::isfinite(value))
            fail(at,
                 message("cell ", io::quoted(cell), " in column ", io::quoted(column), " is not finite; ", cell_rule));
        return value;
    }

    // offset: a byte of the current line (or the end of the file, for the header).
    [[noreturn]] void fail(std::size_t offset, const std::string& problem) const {
        const std::uint64_t line = line_number_ == 0 ? 1 : line_number_;
        throw RunFileError(source_, line, offset - line_start_ + 1, problem);
    }

    std::string_view text_;
    std::string_view source_;
    std::size_t next_ = 0;        // first byte not yet split into lines
    std::size_t line_start_ = 0;  // offset of the current line
    std::uint64_t line_number_ = 0;
};

}  // namespace

int CsvTable::column_index(std::string_view name) const {
    for (std::size_t k = 0; k < columns.size(); ++k)
        if (columns[k] == name) return static_cast<int>(k);
    return -1;
}

double CsvTable::at(std::size_t row, std::size_t col) const {
    assert(row < row_count && col < columns.size());
    return values[row * columns.size() + col];
}

CsvTable parse_csv_table(std::span<const std::byte> bytes, std::string_view source_name) {
    return CsvParser(bytes, source_name).parse();
}

CsvTable read_csv_table(const std::filesystem::path& path) {
    const std::vector<std::byte> bytes = detail::read_whole_file(path, max_csv_file_bytes);
    return parse_csv_table(bytes, path.string());
}

}  // namespace brownfloc::run_files
