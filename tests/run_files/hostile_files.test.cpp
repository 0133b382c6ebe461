// The file rules shared by read_csv_table, read_json_file and read_run_summary: a FIFO, a
// device or a directory is refused at once (io::IoError, never blocking), and so is a file
// over the size limit, before anything is allocated for it.
#include <catch2/catch.hpp>

#include <fcntl.h>
#include <sys/stat.h>
#include <unistd.h>

#include <chrono>

#include "io/io_error.hpp"
#include "run_files/csv_table.hpp"
#include "run_files/json_value.hpp"
#include "run_files/run_summary_view.hpp"
#include "test_support.hpp"

using namespace brownfloc;
using Catch::Matchers::Contains;

namespace {

// A sparse file of size_bytes (ftruncate writes nothing).
void make_sparse_file(const std::filesystem::path& path, std::uint64_t size_bytes) {
    const int fd = ::open(path.c_str(), O_WRONLY | O_CREAT | O_TRUNC | O_CLOEXEC, 0600);
    REQUIRE(fd >= 0);
    const int truncated = ::ftruncate(fd, static_cast<off_t>(size_bytes));
    ::close(fd);
    REQUIRE(truncated == 0);
}

}  // namespace

TEST_CASE("a FIFO named timeseries.csv or summary.json is refused at once", "[run_files][hostile]") {
    const test::TempDir dir;
    REQUIRE(::mkfifo((dir / "timeseries.csv").c_str(), 0600) == 0);
    REQUIRE(::mkfifo((dir / "summary.json").c_str(), 0600) == 0);
    ::alarm(10);  // a blocking open or read would kill the test run here
    const auto start = std::chrono::steady_clock::now();
    CHECK_THROWS_AS(run_files::read_csv_table(dir / "timeseries.csv"), io::IoError);
    CHECK_THROWS_WITH(run_files::read_csv_table(dir / "timeseries.csv"),
                      Contains("timeseries.csv") && Contains("(a FIFO)"));
    CHECK_THROWS_AS(run_files::read_json_file(dir / "summary.json"), io::IoError);
    CHECK_THROWS_AS(run_files::read_run_summary(dir / "summary.json"), io::IoError);
    CHECK(std::chrono::steady_clock::now() - start < std::chrono::seconds(2));
    ::alarm(0);
}

TEST_CASE("a device a directory and a missing file are refused with an IoError", "[run_files][hostile]") {
    const test::TempDir dir;
    ::alarm(10);
    CHECK_THROWS_WITH(run_files::read_csv_table("/dev/zero"),
                      Contains("/dev/zero") && Contains("(a character device)"));
    CHECK_THROWS_AS(run_files::read_json_file("/dev/zero"), io::IoError);
    CHECK_THROWS_AS(run_files::read_csv_table(dir.path()), io::IoError);
    CHECK_THROWS_AS(run_files::read_run_summary(dir / "missing.json"), io::IoError);
    ::alarm(0);
}

TEST_CASE("a file over the size limit is refused naming its size and the limit", "[run_files][hostile]") {
    const test::TempDir dir;
    make_sparse_file(dir / "timeseries.csv", run_files::max_csv_file_bytes + 1);
    CHECK_THROWS_WITH(run_files::read_csv_table(dir / "timeseries.csv"),
                      Contains("timeseries.csv") && Contains("the file holds 268435457 bytes") &&
                          Contains("run files are read up to 268435456 bytes"));
    make_sparse_file(dir / "summary.json", run_files::max_json_file_bytes + 1);
    CHECK_THROWS_WITH(run_files::read_run_summary(dir / "summary.json"),
                      Contains("summary.json") && Contains("the file holds 16777217 bytes") &&
                          Contains("run files are read up to 16777216 bytes"));
    CHECK_THROWS_AS(run_files::read_json_file(dir / "summary.json"), io::IoError);
}

TEST_CASE("files on disk are read whole and their errors name the path", "[run_files][hostile]") {
    const test::TempDir dir;
    test::write_text(dir / "timeseries.csv", "time_s,clusters\n0,10\n0.5,9\n1,8");
    const run_files::CsvTable table = run_files::read_csv_table(dir / "timeseries.csv");
    CHECK(table.row_count == 2);
    CHECK(table.torn_last_line);
    test::write_text(dir / "empty.csv", "");
    test::check_refused([&] { (void)run_files::read_csv_table(dir / "empty.csv"); },
                        (dir / "empty.csv").string() + ":1:1:", "no complete header line");
    test::write_text(dir / "summary.json", "{\"status\": \"complete\",\n \"particles\": 0}\n");
    test::check_refused([&] { (void)run_files::read_run_summary(dir / "summary.json"); },
                        (dir / "summary.json").string() + ":2:15:", "\"particles\" is the number 0");
    // A sparse file just under the limit is read (all zero bytes, so a content error follows).
    make_sparse_file(dir / "zeros.json", 1 << 20);
    test::check_refused([&] { (void)run_files::read_json_file(dir / "zeros.json"); },
                        (dir / "zeros.json").string() + ":1:1:", "unexpected \"\\x00\"");
}
