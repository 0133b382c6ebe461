#include "data/viewer_input_error.hpp"

namespace brownfloc::viewer {

// Out of line so that the class has one home for its vtable.
ViewerInputError::ViewerInputError(const std::string& what) : std::runtime_error{what} {}

}  // namespace brownfloc::viewer
