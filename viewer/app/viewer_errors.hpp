#pragma once
// The viewer's exit codes follow the project's (shared/INTERFACES.md): 2 bad input (options,
// a missing, damaged or still-empty trajectory), 3 environment (no X display, no font, an
// output that cannot be written).
#include <stdexcept>

#include "data/viewer_input_error.hpp"  // ViewerInputError: the run or trajectory cannot be shown (exit 2)

namespace brownfloc::viewer {

inline constexpr int exit_ok = 0;
inline constexpr int exit_internal = 1;
inline constexpr int exit_bad_input = 2;
inline constexpr int exit_environment = 3;

// The machine cannot do what was asked: no display, no font, an unwritable output (exit 3).
class ViewerEnvironmentError : public std::runtime_error {
public:
    using std::runtime_error::runtime_error;
};

}  // namespace brownfloc::viewer
