#include <catch2/catch.hpp>

#include <cerrno>

#include "io/file_writing.hpp"
#include "io/io_error.hpp"
#include "io/write_faults.hpp"
#include "test_support.hpp"

using namespace brownfloc;
using Catch::Matchers::Contains;

TEST_CASE("the n-th write after arming the fault seam fails with the chosen error, once", "[io][faults]") {
    const test::TempDir dir;
    const test::WriteFaultGuard guard;
    io::UniqueFd fd = io::create_new_file(dir / "file");
    io::testing::fail_nth_write(3, ENOSPC);
    io::write_all(fd.get(), test::as_bytes("one;"), dir / "file");
    io::write_all(fd.get(), test::as_bytes("two;"), dir / "file");
    try {
        io::write_all(fd.get(), test::as_bytes("three;"), dir / "file");
        FAIL("the third write did not fail");
    } catch (const io::IoError& error) {
        CHECK(error.error_number() == ENOSPC);
        CHECK_THAT(error.what(), Contains((dir / "file").string()) && Contains("No space left on device"));
    }
    io::write_all(fd.get(), test::as_bytes("four;"), dir / "file");  // the fault has fired: disarmed
    CHECK(test::read_text(dir / "file") == "one;two;four;");
}

TEST_CASE("a faulted write can leave part of its bytes behind, as a disk that fills up does", "[io][faults]") {
    const test::TempDir dir;
    const test::WriteFaultGuard guard;
    io::UniqueFd fd = io::create_new_file(dir / "file");
    io::testing::fail_nth_write(1, EFBIG, 3);
    CHECK_THROWS_WITH(io::write_all(fd.get(), test::as_bytes("abcdef"), dir / "file"), Contains("File too large"));
    CHECK(test::read_text(dir / "file") == "abc");
}

TEST_CASE("clearing the fault seam disarms a pending fault", "[io][faults]") {
    const test::TempDir dir;
    const test::WriteFaultGuard guard;
    io::UniqueFd fd = io::create_new_file(dir / "file");
    io::testing::fail_nth_write(1, ENOSPC);
    io::testing::clear_write_faults();
    CHECK_NOTHROW(io::write_all(fd.get(), test::as_bytes("fine"), dir / "file"));
    io::testing::fail_nth_write(0, ENOSPC);  // n = 0 also disarms
    CHECK_NOTHROW(io::write_all(fd.get(), test::as_bytes("fine"), dir / "file"));
}
