#include <catch2/catch.hpp>

#include <cerrno>
#include <csignal>
#include <string>
#include <sys/resource.h>
#include <sys/stat.h>
#include <sys/wait.h>
#include <unistd.h>

#include "io/file_writing.hpp"
#include "io/io_error.hpp"
#include "test_support.hpp"

using namespace brownfloc;
using Catch::Matchers::Contains;

TEST_CASE("a new file is created with mode 0644 and holds what was written", "[io][writing]") {
    const test::TempDir dir;
    const mode_t old_mask = ::umask(022);
    io::UniqueFd fd = io::create_new_file(dir / "new");
    ::umask(old_mask);
    io::write_all(fd.get(), test::as_bytes("hello, world"), dir / "new");
    io::sync_file(fd.get(), dir / "new");
    io::close_file(fd, dir / "new");
    CHECK_FALSE(fd);
    CHECK(test::read_text(dir / "new") == "hello, world");
    CHECK((std::filesystem::status(dir / "new").permissions() & std::filesystem::perms::all) ==
          (std::filesystem::perms::owner_read | std::filesystem::perms::owner_write | std::filesystem::perms::group_read |
           std::filesystem::perms::others_read));
}

TEST_CASE("creating a file refuses an existing path and a symbolic link, even a dangling one", "[io][writing]") {
    const test::TempDir dir;
    test::write_text(dir / "exists", "keep me");
    CHECK_THROWS_WITH(io::create_new_file(dir / "exists"), Contains("cannot create") && Contains("File exists"));
    CHECK(test::read_text(dir / "exists") == "keep me");
    std::filesystem::create_symlink(dir / "nowhere", dir / "dangling");
    CHECK_THROWS_AS(io::create_new_file(dir / "dangling"), io::IoError);
    CHECK_FALSE(std::filesystem::exists(dir / "nowhere"));
}

TEST_CASE("truncating a file cuts it and moves the write position to the new end", "[io][writing]") {
    const test::TempDir dir;
    io::UniqueFd fd = io::create_new_file(dir / "file");
    io::write_all(fd.get(), test::as_bytes("0123456789"), dir / "file");
    io::truncate_to(fd.get(), 4, dir / "file");
    io::write_all(fd.get(), test::as_bytes("ab"), dir / "file");
    fd.reset();
    // Without the position move the file would be "0123" + six zero bytes + "ab".
    CHECK(test::read_text(dir / "file") == "0123ab");
}

TEST_CASE("appending to an existing file writes after its bytes and refuses links, FIFOs and directories",
          "[io][writing][hostile]") {
    const test::TempDir dir;
    test::write_text(dir / "log", "first;");
    {
        io::UniqueFd fd = io::open_existing_for_append(dir / "log");
        io::write_all(fd.get(), test::as_bytes("second;"), dir / "log");
    }
    CHECK(test::read_text(dir / "log") == "first;second;");

    std::filesystem::create_symlink(dir / "log", dir / "link");
    CHECK_THROWS_WITH(io::open_existing_for_append(dir / "link"), Contains("symbolic link"));
    REQUIRE(::mkfifo((dir / "pipe").c_str(), 0600) == 0);
    ::alarm(10);  // a blocking open would kill the test run here instead of hanging it
    CHECK_THROWS_WITH(io::open_existing_for_append(dir / "pipe"), Contains("not a regular file (a FIFO)"));
    ::alarm(0);
    CHECK_THROWS_AS(io::open_existing_for_append(dir.path()), io::IoError);
    CHECK_THROWS_WITH(io::open_existing_for_append(dir / "absent"), Contains("No such file or directory"));
}

TEST_CASE("syncing a directory works, and a missing one is an error naming it", "[io][writing]") {
    const test::TempDir dir;
    CHECK_NOTHROW(io::sync_directory(dir.path()));
    CHECK_THROWS_WITH(io::sync_directory(dir / "absent"), Contains("absent"));
}

namespace {

// Runs body in a child process with a 1000-byte file-size limit; returns the wait status.
template <class Body>
int run_with_file_size_limit(Body body) {
    const pid_t child = ::fork();
    REQUIRE(child >= 0);
    if (child == 0) {
        const rlimit limit{1000, RLIM_INFINITY};
        ::setrlimit(RLIMIT_FSIZE, &limit);
        ::_exit(body());
    }
    int status = 0;
    ::waitpid(child, &status, 0);
    return status;
}

}  // namespace

TEST_CASE("past a file-size limit, a write fails with EFBIG once SIGXFSZ is ignored", "[io][writing][hostile]") {
    const test::TempDir dir;
    const std::string big(4096, 'x');
    // The default action of SIGXFSZ kills the process without a word: what the app must avoid.
    const int killed = run_with_file_size_limit([&] {
        std::signal(SIGXFSZ, SIG_DFL);
        io::UniqueFd fd = io::create_new_file(dir / "killed");
        io::write_all(fd.get(), test::as_bytes(big), dir / "killed");
        return 3;
    });
    CHECK(WIFSIGNALED(killed));
    CHECK(WTERMSIG(killed) == SIGXFSZ);

    const int reported = run_with_file_size_limit([&] {
        io::ignore_file_size_signal();
        io::UniqueFd fd = io::create_new_file(dir / "reported");
        try {
            io::write_all(fd.get(), test::as_bytes(big), dir / "reported");
        } catch (const io::IoError& error) {
            const std::string text = error.what();
            return error.error_number() == EFBIG && text.find("File too large") != std::string::npos ? 0 : 1;
        }
        return 2;
    });
    REQUIRE(WIFEXITED(reported));
    CHECK(WEXITSTATUS(reported) == 0);
    CHECK(std::filesystem::file_size(dir / "reported") == 1000);
}
