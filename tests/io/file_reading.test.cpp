#include <catch2/catch.hpp>

#include <array>
#include <cerrno>
#include <sys/stat.h>
#include <unistd.h>

#include "io/file_reading.hpp"
#include "io/io_error.hpp"
#include "test_support.hpp"

using namespace brownfloc;
using Catch::Matchers::Contains;

namespace {

std::string text_of(std::span<const std::byte> bytes) { return {reinterpret_cast<const char*>(bytes.data()), bytes.size()}; }

}  // namespace

TEST_CASE("a regular file opens with its size, and pread_exact reads any range of it", "[io][reading]") {
    const test::TempDir dir;
    test::write_text(dir / "data", "0123456789abcdef");
    const io::ReadableFile file = io::open_for_reading(dir / "data");
    CHECK(file.size_bytes == 16);
    std::array<std::byte, 6> bytes{};
    io::pread_exact(file.fd.get(), 10, bytes, dir / "data");
    CHECK(text_of(bytes) == "abcdef");
    io::pread_exact(file.fd.get(), 0, std::span{bytes}.first(3), dir / "data");
    CHECK(text_of(std::span{bytes}.first(3)) == "012");
    CHECK(io::regular_file_size(file.fd.get(), dir / "data") == 16);
}

TEST_CASE("reading past the end of a file throws, naming the path and where the file ends", "[io][reading]") {
    const test::TempDir dir;
    test::write_text(dir / "short", "0123456789");
    const io::ReadableFile file = io::open_for_reading(dir / "short");
    std::array<std::byte, 8> bytes{};
    CHECK_THROWS_WITH(io::pread_exact(file.fd.get(), 6, bytes, dir / "short"),
                      Contains((dir / "short").string()) && Contains("the file ends at byte 10") &&
                          Contains("8 bytes wanted from byte 6"));
}

TEST_CASE("a symbolic link to a regular file is read through", "[io][reading]") {
    const test::TempDir dir;
    test::write_text(dir / "target", "abc");
    std::filesystem::create_symlink(dir / "target", dir / "link");
    CHECK(io::open_for_reading(dir / "link").size_bytes == 3);
}

TEST_CASE("a FIFO is refused at once, without waiting for a writer", "[io][reading][hostile]") {
    const test::TempDir dir;
    REQUIRE(::mkfifo((dir / "pipe").c_str(), 0600) == 0);
    ::alarm(10);  // a blocking open would kill the test run here instead of hanging it
    CHECK_THROWS_AS(io::open_for_reading(dir / "pipe"), io::IoError);
    CHECK_THROWS_WITH(io::open_for_reading(dir / "pipe"), Contains("not a regular file (a FIFO)"));
    ::alarm(0);
}

TEST_CASE("/dev/zero and a directory are refused as not regular files", "[io][reading][hostile]") {
    CHECK_THROWS_WITH(io::open_for_reading("/dev/zero"),
                      Contains("cannot read /dev/zero") && Contains("not a regular file (a character device)"));
    const test::TempDir dir;
    CHECK_THROWS_WITH(io::open_for_reading(dir.path()), Contains("not a regular file (a directory)"));
}

TEST_CASE("a missing file is refused with the system's reason", "[io][reading]") {
    const test::TempDir dir;
    try {
        (void)io::open_for_reading(dir / "absent");
        FAIL("no error");
    } catch (const io::IoError& error) {
        CHECK(error.error_number() == ENOENT);
        CHECK_THAT(error.what(), Contains("absent") && Contains("No such file or directory"));
    }
}
