#include "display_check.hpp"

#include <cstdlib>

namespace brownfloc::viewer {

bool x_display_named() {
    const char* display = std::getenv("DISPLAY");
    return display != nullptr && *display != '\0';
}

}  // namespace brownfloc::viewer
