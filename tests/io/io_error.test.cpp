#include <catch2/catch.hpp>

#include <cerrno>

#include "io/io_error.hpp"

using brownfloc::io::IoError;

TEST_CASE("an I/O error names the action, the path and the system's reason", "[io][errors]") {
    const IoError error("write", "/data/run/trajectory.bftraj", ENOSPC);
    CHECK(std::string{error.what()} == "cannot write /data/run/trajectory.bftraj: No space left on device");
    CHECK(error.path() == "/data/run/trajectory.bftraj");
    CHECK(error.error_number() == ENOSPC);
}

TEST_CASE("an I/O refusal of our own carries its reason and error number 0", "[io][errors]") {
    const IoError error("read", "/tmp/pipe", 0, "not a regular file (a FIFO)");
    CHECK(std::string{error.what()} == "cannot read /tmp/pipe: not a regular file (a FIFO)");
    CHECK(error.error_number() == 0);
}
