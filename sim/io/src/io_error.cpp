#include "io/io_error.hpp"

#include <system_error>

namespace brownfloc::io {
namespace {

// Built by appending: `"literal" + std::string` trips a false -Wrestrict in g++ 12 at -O3
// (GCC bug 105651), which fails builds with BROWNFLOC_WARNINGS_AS_ERRORS.
std::string describe(std::string_view action, const std::filesystem::path& path, std::string_view reason) {
    std::string text = "cannot ";
    text += action;
    text += ' ';
    text += path.string();
    text += ": ";
    text += reason;
    return text;
}

}  // namespace

// std::generic_category().message() rather than strerror(): it is thread-safe.
IoError::IoError(std::string_view action, const std::filesystem::path& path, int error_number)
    : IoError(action, path, error_number, std::generic_category().message(error_number)) {}

IoError::IoError(std::string_view action, const std::filesystem::path& path, int error_number,
                 std::string_view reason)
    : std::runtime_error(describe(action, path, reason)), path_{path.string()}, error_number_{error_number} {}

}  // namespace brownfloc::io
