#pragma once
// Shared pieces of the run_files tests: text as bytes, files on disk, and a check that a
// parse fails with a RunFileError at a given place.
#include <catch2/catch.hpp>

#include <cstddef>
#include <fstream>
#include <span>
#include <string>
#include <string_view>

#include "../support/temp_dir.hpp"
#include "io/message_text.hpp"
#include "run_files/run_file_error.hpp"

namespace brownfloc::test {

// Texts built by appending: `"literal" + std::string` trips g++ 12's false -Wrestrict (GCC
// bug 105651; see io/message_text.hpp).
using io::message;

[[nodiscard]] inline std::span<const std::byte> bytes_of(std::string_view text) {
    return std::as_bytes(std::span<const char>{text.data(), text.size()});
}

inline void write_text(const std::filesystem::path& path, std::string_view text) {
    std::ofstream out(path, std::ios::binary);
    out.write(text.data(), static_cast<std::streamsize>(text.size()));
    REQUIRE(out.good());
}

// Runs parse, which must throw RunFileError whose message starts with place ("file:line:col:")
// and contains fragment; the line and column are checked against the exception's fields too.
template <class Parse>
void check_refused(Parse&& parse, std::string_view place, std::string_view fragment) {
    INFO("expected: " << place << " ... " << fragment);
    try {
        parse();
        FAIL("no RunFileError was thrown");
    } catch (const run_files::RunFileError& error) {
        const std::string what = error.what();
        INFO("message: " << what);
        CHECK(what.rfind(place, 0) == 0);
        CHECK(what.find(fragment) != std::string::npos);
        CHECK(place.find(message(":", error.line(), ":", error.column(), ":")) !=
              std::string_view::npos);
    }
}

}  // namespace brownfloc::test
