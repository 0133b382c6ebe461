// libFuzzer target: arbitrary bytes as a run directory's CSV or JSON file. The first byte
// selects the reader (even: parse_csv_table; odd: parse_json, then run_summary_from_json on
// the value) and is part of the input, so the seeds in tests/fuzz/corpus/run_files/ start with
// 0x00 or 0x01. The readers must refuse with RunFileError or succeed; any other exception
// escapes and aborts, and a table that breaks the format's promises (finite values, row-major
// size, time_s never decreasing) is a finding too.
// Build: cmake --preset fuzz && cmake --build --preset fuzz; run: build-fuzz/bin/run_files_fuzz
// -max_total_time=60 -malloc_limit_mb=256 tests/fuzz/corpus/run_files/
#include <cmath>
#include <cstddef>
#include <cstdint>
#include <cstdlib>
#include <span>

#include "run_files/csv_table.hpp"
#include "run_files/json_value.hpp"
#include "run_files/run_file_error.hpp"
#include "run_files/run_summary_view.hpp"

namespace {

using namespace brownfloc::run_files;

void check_table(const CsvTable& table) {
    if (table.columns.empty() || table.columns.size() > max_csv_columns) std::abort();
    if (table.values.size() != table.row_count * table.columns.size()) std::abort();
    for (const double x : table.values)
        if (!std::isfinite(x)) std::abort();
    const int time = table.column_index("time_s");
    if (time < 0) return;
    for (std::size_t r = 1; r < table.row_count; ++r)
        if (table.at(r, static_cast<std::size_t>(time)) < table.at(r - 1, static_cast<std::size_t>(time))) std::abort();
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    if (size == 0) return 0;
    const std::span<const std::byte> bytes = std::as_bytes(std::span{data + 1, size - 1});
    try {
        if (data[0] % 2 == 0) {
            check_table(parse_csv_table(bytes, "fuzz.csv"));
        } else {
            const JsonValue value = parse_json(bytes, "fuzz.json");
            (void)run_summary_from_json(value, "fuzz.json");
        }
    } catch (const RunFileError&) {
    }
    return 0;
}
