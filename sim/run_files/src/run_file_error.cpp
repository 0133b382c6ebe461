#include "run_files/run_file_error.hpp"

#include "io/message_text.hpp"

namespace brownfloc::run_files {

RunFileError::RunFileError(std::string_view source, std::uint64_t line, std::uint64_t column,
                           const std::string& problem)
    : std::runtime_error(io::message(source, ':', line, ':', column, ": ", problem)),
      line_{line},
      column_{column},
      problem_{problem} {}

}  // namespace brownfloc::run_files
