#pragma once
// "The machine would not let us": a directory that cannot be created or written, a lock
// held by another run. The command line maps it to exit code 3 (the project's INTERFACES).
#include <stdexcept>
#include <string>

namespace brownfloc::sim {

class EnvironmentError : public std::runtime_error {
public:
    explicit EnvironmentError(const std::string& what) : std::runtime_error(what) {}
};

}  // namespace brownfloc::sim
