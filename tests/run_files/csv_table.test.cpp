// parse_csv_table: one test per rule of the format (run_files/csv_table.hpp). Every refusal
// must name the file, the line and the column.
#include <cmath>
#include <string>

#include "run_files/csv_table.hpp"
#include "test_support.hpp"

using namespace brownfloc;
using run_files::CsvTable;
using run_files::parse_csv_table;
using test::bytes_of;
using test::check_refused;
using test::message;

namespace {

CsvTable parse(std::string_view text) { return parse_csv_table(bytes_of(text), "ts.csv"); }

void check_csv_refused(std::string_view text, std::string_view place, std::string_view fragment) {
    check_refused([&] { (void)parse(text); }, place, fragment);
}

}  // namespace

TEST_CASE("a timeseries-style CSV gives its columns and its rows in file order", "[run_files][csv]") {
    const CsvTable table = parse(
        "time_s,time_half_lives,clusters,mean_size\n"
        "0,0,200,1\n"
        "0.00040754114286464696,0.029999999999999923,168,1.1904761904761905\n"
        "1e300,-0,4.9406564584124654e-324,-2.5E-3\n");
    REQUIRE(table.columns == std::vector<std::string>{"time_s", "time_half_lives", "clusters", "mean_size"});
    REQUIRE(table.row_count == 3);
    REQUIRE(table.values.size() == 12);
    CHECK_FALSE(table.torn_last_line);
    CHECK(table.column_index("clusters") == 2);
    CHECK(table.column_index("Clusters") == -1);
    CHECK(table.column_index("") == -1);
    // %.17g text reads back to the same double: compare bits, no tolerance.
    CHECK(table.at(1, 0) == 0.00040754114286464696);
    CHECK(table.at(1, 3) == 1.1904761904761905);
    CHECK(table.at(0, 2) == 200.0);
    CHECK(table.at(2, 0) == 1e300);
    CHECK(std::signbit(table.at(2, 1)));
    CHECK(table.at(2, 2) == 4.9406564584124654e-324);
    CHECK(table.at(2, 3) == -2.5e-3);
}

TEST_CASE("a header without rows is a table of no rows", "[run_files][csv]") {
    const CsvTable table = parse("time_s,size,count\n");
    CHECK(table.columns.size() == 3);
    CHECK(table.row_count == 0);
    CHECK(table.values.empty());
    CHECK_FALSE(table.torn_last_line);
}

TEST_CASE("a carriage return before each line feed is accepted", "[run_files][csv]") {
    const CsvTable table = parse("time_s,clusters\r\n0,10\r\n1.5,8\r\n");
    CHECK(table.columns == std::vector<std::string>{"time_s", "clusters"});
    REQUIRE(table.row_count == 2);
    CHECK(table.at(1, 0) == 1.5);
    CHECK(table.at(1, 1) == 8.0);
    // Anywhere else it is a byte that belongs to no name or number.
    check_csv_refused("time_s,clusters\r\n0\r,10\r\n",
                      "ts.csv:2:1:", "cell \"0\\x0D\" in column \"time_s\" is not a number");
}

TEST_CASE("an empty file or one with only an unterminated header has no complete header line", "[run_files][csv]") {
    check_csv_refused("", "ts.csv:1:1:", "no complete header line: the file is empty");
    check_csv_refused("time_s,clusters", "ts.csv:1:16:", "no complete header line: the file ends after 15 bytes");
}

TEST_CASE("column names are non-empty and made of letters digits and underscores", "[run_files][csv]") {
    check_csv_refused(",x\n", "ts.csv:1:1:", "column 1 has an empty name");
    check_csv_refused("time_s,,x\n", "ts.csv:1:8:", "column 2 has an empty name");
    check_csv_refused("time_s,x,\n", "ts.csv:1:10:", "column 3 has an empty name");
    check_csv_refused("\n", "ts.csv:1:1:", "column 1 has an empty name");
    check_csv_refused("time_s,mean size\n",
                      "ts.csv:1:12:", "column name \"mean size\" has \" \"; names are 1 or more of");
    check_csv_refused("time_s,\"x\"\n", "ts.csv:1:8:", "column name \"\\\"x\\\"\" has \"\\\"\"");
    check_csv_refused("time_s,mean-size\n", "ts.csv:1:12:", "has \"-\"");
}

TEST_CASE("bytes that are not printable ASCII in the header are named escaped", "[run_files][csv]") {
    check_csv_refused("time_s,cl\xFFx\n",
                      "ts.csv:1:10:", "column name \"cl\\xFFx\" has \"\\xFF\", a byte that is not printable ASCII");
    check_csv_refused(std::string_view("a\0b\n", 4), "ts.csv:1:2:", "column name \"a\\x00b\" has \"\\x00\"");
    check_csv_refused("\xEF\xBB\xBFtime_s\n", "ts.csv:1:1:", "\"\\xEF\", a byte that is not printable ASCII");
    check_csv_refused("a\tb\n", "ts.csv:1:2:", "has \"\\x09\", a byte that is not printable ASCII");
}

TEST_CASE("column names are unique", "[run_files][csv]") {
    check_csv_refused("time_s,clusters,time_s\n", "ts.csv:1:17:", "column name \"time_s\" repeats column 1");
    CHECK(parse("Time_s,time_s\n").columns.size() == 2);  // names are case-sensitive
}

TEST_CASE("a header holds 1 to 256 columns", "[run_files][csv]") {
    std::string header = "c0";
    for (int k = 1; k < 256; ++k) header += message(",c", k);
    std::string row = "0";
    for (int k = 1; k < 256; ++k) row += message(",", k);
    const CsvTable table = parse(message(header, "\n", row, "\n"));
    REQUIRE(table.columns.size() == 256);
    CHECK(table.at(0, 255) == 255.0);
    check_csv_refused(message(header, ",c256\n"), message("ts.csv:1:", header.size() + 2, ":"),
                      "more than 256 columns");
}

TEST_CASE("every row has exactly as many cells as the header has columns", "[run_files][csv]") {
    check_csv_refused("time_s,clusters,largest\n0,1,1\n1,2\n",
                      "ts.csv:3:4:", "the row has 2 cells; the header names 3 columns");
    check_csv_refused("time_s,clusters\n0,1\n1,2,3\n",
                      "ts.csv:3:4:", "the row has more than 2 cells; the header names 2 columns");
    check_csv_refused("time_s,clusters\n0,1,\n", "ts.csv:2:4:", "the row has more than 2 cells");
    check_csv_refused("time_s,clusters\n0,1\n\n", "ts.csv:3:1:", "empty cell in column \"time_s\"");
}

TEST_CASE("every cell is a finite decimal number read completely", "[run_files][csv]") {
    struct Case {
        std::string_view cell, fragment;
    };
    const Case cases[] = {
        {"", "empty cell in column \"x\"; cells are finite decimal numbers"},
        {" 1", "cell \" 1\" in column \"x\" is not a number"},
        {"1 ", "cell \"1 \" in column \"x\" is not a number"},
        {"+1", "cell \"+1\" in column \"x\" is not a number"},
        {"1e", "cell \"1e\" in column \"x\" is not a number"},
        {"0x10", "cell \"0x10\" in column \"x\" is not a number"},
        {"1.5.2", "cell \"1.5.2\" in column \"x\" is not a number"},
        {"true", "cell \"true\" in column \"x\" is not a number"},
        {"nan", "cell \"nan\" in column \"x\" is not finite"},
        {"-nan", "cell \"-nan\" in column \"x\" is not finite"},
        {"inf", "cell \"inf\" in column \"x\" is not finite"},
        {"-Infinity", "cell \"-Infinity\" in column \"x\" is not finite"},
        {"1e400", "cell \"1e400\" in column \"x\" is out of the range of a double"},
        {"-1e400", "cell \"-1e400\" in column \"x\" is out of the range of a double"},
        {"\xC3\xA9", "cell \"\\xC3\\xA9\" in column \"x\" is not a number"},
    };
    for (const Case& c : cases) {
        const std::string text = message("time_s,x,y\n0,1,2\n1,", c.cell, ",3\n");
        check_csv_refused(text, "ts.csv:3:3:", c.fragment);
    }
    const CsvTable table = parse("x\n.5\n5.\n-0.0\n1E5\n");
    CHECK(table.values == std::vector<double>{0.5, 5.0, -0.0, 1e5});
}

TEST_CASE("lines hold at most 64 KiB without their line end", "[run_files][csv]") {
    const std::string longest = message("0.", std::string(65534, '0'));  // 65536 bytes, the number 0
    REQUIRE(longest.size() == run_files::max_csv_line_bytes);
    CHECK(parse(message("x\n", longest, "\n")).row_count == 1);
    CHECK(parse(message("x\n", longest, "\r\n")).row_count == 1);
    check_csv_refused(message("x\n", longest, "0\n"),
                      "ts.csv:2:65537:", "the line holds 65537 bytes; lines hold at most 65536");
    check_csv_refused(std::string(65537, 'a') + "\n", "ts.csv:1:65537:", "the line holds 65537 bytes");
}

TEST_CASE("an unterminated last line is left out whatever it holds", "[run_files][csv]") {
    const std::string complete = "time_s,clusters\n0,10\n1,9\n";
    for (const std::string_view torn : {"2", "2,8", "2,8\r", "garbage\xFF\x00", ",,,,,,", "0,0,0", "\r", "1e999"}) {
        INFO("torn line: " << torn);
        const CsvTable table = parse(complete + std::string(torn));
        CHECK(table.row_count == 2);
        CHECK(table.values == std::vector<double>{0, 10, 1, 9});
        CHECK(table.torn_last_line);
    }
    const CsvTable header_only = parse("time_s,clusters\n0");
    CHECK(header_only.row_count == 0);
    CHECK(header_only.torn_last_line);
    // An over-long torn line is still only torn: it may be a row the writer is in the middle of.
    CHECK(parse(complete + std::string(100000, '9')).torn_last_line);
}

TEST_CASE("time_s never decreases but may repeat", "[run_files][csv]") {
    const CsvTable table = parse("time_s,size,count\n0,1,200\n0.5,1,150\n0.5,2,25\n");
    CHECK(table.row_count == 3);
    check_csv_refused("size,time_s\n1,0\n1,0.5\n2,0.25\n",
                      "ts.csv:4:3:", "time_s = 0.25 is earlier than 0.5 on the line before; time_s must not decrease");
    check_csv_refused("time_s\n-0\n-1e-300\n", "ts.csv:3:1:", "time_s = -1e-300 is earlier than -0");
    // Other columns may fall and rise as they like.
    CHECK(parse("clusters\n3\n1\n2\n").row_count == 3);
}

TEST_CASE("the files of a real run are read", "[run_files][csv]") {
    const CsvTable timeseries = run_files::read_csv_table(BROWNFLOC_RUN_FILES_TEST_DATA "/timeseries.csv");
    CHECK(timeseries.columns.size() == 11);
    CHECK(timeseries.row_count == 101);
    CHECK_FALSE(timeseries.torn_last_line);
    const int clusters = timeseries.column_index("clusters");
    REQUIRE(clusters == 2);
    CHECK(timeseries.at(0, static_cast<std::size_t>(clusters)) == 200.0);
    const CsvTable sizes = run_files::read_csv_table(BROWNFLOC_RUN_FILES_TEST_DATA "/size_distribution.csv");
    CHECK(sizes.columns == std::vector<std::string>{"time_s", "size", "count"});
    CHECK(sizes.row_count == 934);
}
