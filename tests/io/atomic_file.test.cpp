#include <catch2/catch.hpp>

#include <cerrno>
#include <unistd.h>

#include "io/atomic_file.hpp"
#include "io/io_error.hpp"
#include "io/write_faults.hpp"
#include "test_support.hpp"

using namespace brownfloc;
using Catch::Matchers::Contains;

namespace {

std::size_t entries_in(const std::filesystem::path& dir) {
    std::size_t count = 0;
    for ([[maybe_unused]] const auto& entry : std::filesystem::directory_iterator{dir}) ++count;
    return count;
}

}  // namespace

TEST_CASE("an atomic write creates, then replaces a file and leaves no temporary file", "[io][atomic]") {
    const test::TempDir dir;
    io::write_file_atomically(dir / "summary.json", "{\"a\": 1}\n");
    CHECK(test::read_text(dir / "summary.json") == "{\"a\": 1}\n");
    io::write_file_atomically(dir / "summary.json", "{\"a\": 2}\n");
    CHECK(test::read_text(dir / "summary.json") == "{\"a\": 2}\n");
    CHECK(entries_in(dir.path()) == 1);
    CHECK(io::temporary_path_for(dir / "summary.json").filename().string() ==
          ".summary.json.tmp-" + std::to_string(::getpid()));
}

TEST_CASE("an atomic write refuses a symbolic link or a directory as its target", "[io][atomic][hostile]") {
    const test::TempDir dir;
    test::write_text(dir / "elsewhere", "untouched");
    std::filesystem::create_symlink(dir / "elsewhere", dir / "link");
    CHECK_THROWS_WITH(io::write_file_atomically(dir / "link", "new"), Contains("symbolic link"));
    CHECK(test::read_text(dir / "elsewhere") == "untouched");
    CHECK(std::filesystem::is_symlink(dir / "link"));
    std::filesystem::create_directory(dir / "sub");
    CHECK_THROWS_WITH(io::write_file_atomically(dir / "sub", "new"), Contains("not a regular file (a directory)"));
    CHECK(entries_in(dir.path()) == 3);  // no temporary file left
}

TEST_CASE("a full disk during an atomic write keeps the old content and leaves no temporary file", "[io][atomic][faults]") {
    const test::TempDir dir;
    const test::WriteFaultGuard guard;
    io::write_file_atomically(dir / "state", "old");
    io::testing::fail_nth_write(1, ENOSPC, 1);
    CHECK_THROWS_WITH(io::write_file_atomically(dir / "state", "new content"), Contains("No space left on device"));
    CHECK(test::read_text(dir / "state") == "old");
    CHECK(entries_in(dir.path()) == 1);
}

TEST_CASE("a temporary file left by an earlier process with our pid does not block an atomic write", "[io][atomic]") {
    // In a container a program often gets the same small pid on every start.
    const test::TempDir dir;
    test::write_text(io::temporary_path_for(dir / "state"), "left by a crash");
    io::write_file_atomically(dir / "state", "fresh");
    CHECK(test::read_text(dir / "state") == "fresh");
    CHECK(entries_in(dir.path()) == 1);
}

TEST_CASE("removing stale temporaries removes only regular files named like them", "[io][atomic]") {
    const test::TempDir dir;
    for (const char* name : {".summary.json.tmp-123", ".state.tmp-7", ".x.tmp-99999999"}) test::write_text(dir / name, "stale");
    for (const char* name : {"summary.json", "a.tmp-1", ".b.tmp-", ".c.tmp-12x", ".tmp-5", "..tmp-5x", ".d.tmp-12.bak"})
        test::write_text(dir / name, "keep");
    std::filesystem::create_symlink(dir / "summary.json", dir / ".link.tmp-5");
    std::filesystem::create_directory(dir / ".dir.tmp-6");
    CHECK(io::remove_stale_temporaries(dir.path()) == 3);
    CHECK(entries_in(dir.path()) == 9);
    CHECK(std::filesystem::exists(dir / "summary.json"));
    CHECK(std::filesystem::is_symlink(dir / ".link.tmp-5"));
    CHECK(io::remove_stale_temporaries(dir.path()) == 0);
    CHECK_THROWS_AS(io::remove_stale_temporaries(dir / "absent"), io::IoError);
}
