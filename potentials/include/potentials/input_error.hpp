#pragma once
// The one project exception for "your input is wrong". Thrown at boundaries (factories,
// scenario parsing, file I/O) with a message that names the place, the value and what is
// allowed; main() prints it as one `error:` line and exits 2. Bugs are asserts instead.
#include <stdexcept>
#include <string>

namespace brownfloc {

class InputError : public std::runtime_error {
public:
    explicit InputError(const std::string& message) : std::runtime_error(message) {}
};

}  // namespace brownfloc
