// Every way a small valid CSV or summary can be cut short or have one bit flipped: the
// readers must give a result (for a cut CSV: exactly the complete rows before the cut) or a
// RunFileError, never another exception, a crash or a hang.
#include <exception>
#include <string>
#include <vector>

#include "run_files/csv_table.hpp"
#include "run_files/json_value.hpp"
#include "run_files/run_summary_view.hpp"
#include "test_support.hpp"

using namespace brownfloc;
using run_files::CsvTable;
using run_files::RunFileError;

namespace {

const std::string timeseries =
    "time_s,time_half_lives,clusters,mean_size\n"
    "0,0,200,1\n"
    "0.00040754114286464696,0.029999999999999923,168,1.1904761904761905\n"
    "0.00081508228572929392,0.059999999999999845,147,1.3605442176870748\r\n"
    "0.0012226234285939409,0.089999999999999769,131,1.5267175572519085\n";

const std::string summary =
    "{\n"
    "  \"debye_length_nm\": 3.0382445275109635,\n"
    "  \"barrier_kT\": -1.5e-3,\n"
    "  \"cluster_gap_nm\": null,\n"
    "  \"measured_stability_ratio_ci95\": [0.63453046421358852, 1.1156671553682078],\n"
    "  \"particles\": 200,\n"
    "  \"seed\": 9007199254740993,\n"
    "  \"fractal_dimension_note\": \"only 2 clusters qualify \\u2014 need \\\"30\\\"\\n\",\n"
    "  \"names\": [\"caf\xC3\xA9\", \"\\ud83d\\ude00\"],\n"
    "  \"percolating\": true,\n"
    "  \"status\": \"complete\"\n"
    "}\n";

// Row count of the timeseries cut to its first `length` bytes: complete lines after the header.
std::size_t complete_rows(std::size_t length) {
    std::size_t lines = 0;
    for (std::size_t i = 0; i < length; ++i) lines += timeseries[i] == '\n';
    return lines == 0 ? 0 : lines - 1;
}

}  // namespace

TEST_CASE("every cut of a small CSV gives the complete rows before the cut or a RunFileError", "[run_files][damaged]") {
    const CsvTable whole = run_files::parse_csv_table(test::bytes_of(timeseries), "ts.csv");
    REQUIRE(whole.row_count == 4);
    const std::size_t header_end = timeseries.find('\n') + 1;
    for (std::size_t length = 0; length < timeseries.size(); ++length) {
        INFO("cut to " << length << " bytes");
        const auto bytes = test::bytes_of(std::string_view(timeseries).substr(0, length));
        if (length < header_end) {
            CHECK_THROWS_AS(run_files::parse_csv_table(bytes, "ts.csv"), RunFileError);
            continue;
        }
        const CsvTable table = run_files::parse_csv_table(bytes, "ts.csv");
        const std::size_t rows = complete_rows(length);
        REQUIRE(table.row_count == rows);
        CHECK(table.columns == whole.columns);
        CHECK(std::equal(table.values.begin(), table.values.end(), whole.values.begin()));
        CHECK(table.values.size() == rows * 4);
        CHECK(table.torn_last_line == (timeseries[length - 1] != '\n'));
    }
}

TEST_CASE("a CSV cut anywhere inside its last row gives exactly the earlier rows and a torn line",
          "[run_files][damaged]") {
    const CsvTable whole = run_files::parse_csv_table(test::bytes_of(timeseries), "ts.csv");
    const std::size_t last_row = timeseries.rfind('\n', timeseries.size() - 2) + 1;
    const std::vector<double> earlier(whole.values.begin(), whole.values.end() - 4);
    for (std::size_t length = last_row + 1; length < timeseries.size(); ++length) {
        INFO("cut to " << length << " bytes");
        const CsvTable table =
            run_files::parse_csv_table(test::bytes_of(std::string_view(timeseries).substr(0, length)), "ts.csv");
        CHECK(table.row_count == 3);
        CHECK(table.values == earlier);
        CHECK(table.torn_last_line);
    }
}

TEST_CASE("every single-bit flip of a small CSV is read or refused with a RunFileError", "[run_files][damaged]") {
    std::size_t read = 0, refused = 0;
    for (std::size_t bit = 0; bit < 8 * timeseries.size(); ++bit) {
        std::string damaged = timeseries;
        damaged[bit / 8] = static_cast<char>(damaged[bit / 8] ^ (1 << (bit % 8)));
        try {
            const CsvTable table = run_files::parse_csv_table(test::bytes_of(damaged), "ts.csv");
            REQUIRE(table.values.size() == table.row_count * table.columns.size());
            ++read;
        } catch (const RunFileError&) {
            ++refused;
        }  // anything else escapes and fails the test
    }
    CHECK(read > 0);
    CHECK(refused > 0);
}

TEST_CASE("every cut and single-bit flip of a small summary is read or refused with a RunFileError",
          "[run_files][damaged]") {
    const auto whole = run_files::run_summary_from_json(run_files::parse_json(test::bytes_of(summary), "summary.json"),
                                                        "summary.json");
    REQUIRE(whole.seed == 9007199254740993u);
    REQUIRE(whole.fractal_dimension_note == "only 2 clusters qualify \xE2\x80\x94 need \"30\"\n");
    const std::size_t closing_brace = summary.rfind('}');
    std::vector<std::string> inputs;
    for (std::size_t length = 0; length < summary.size(); ++length) inputs.push_back(summary.substr(0, length));
    for (std::size_t bit = 0; bit < 8 * summary.size(); ++bit) {
        std::string damaged = summary;
        damaged[bit / 8] = static_cast<char>(damaged[bit / 8] ^ (1 << (bit % 8)));
        inputs.push_back(std::move(damaged));
    }
    std::size_t read = 0, refused = 0;
    for (std::size_t k = 0; k < inputs.size(); ++k) {
        INFO("input " << k << " (cuts first, then flips)");
        try {
            const auto value = run_files::parse_json(test::bytes_of(inputs[k]), "summary.json");
            (void)run_files::run_summary_from_json(value, "summary.json");
            // A cut before the closing brace can never be a whole document.
            CHECK_FALSE((k < summary.size() && k <= closing_brace));
            ++read;
        } catch (const RunFileError&) {
            ++refused;
        }
    }
    CHECK(read > 0);
    CHECK(refused > 0);
}
