#pragma once
// The window: replays a run, follows it while it is written, orbit/zoom/pan, selection,
// colourings, timeline, plots, help, PNG export. Bindings in help_overlay.cpp and the README.
#include "view_options.hpp"

namespace brownfloc::viewer {

// Returns the exit code. Throws ViewerInputError / ViewerEnvironmentError.
int run_window(const ViewOptions& options);

}  // namespace brownfloc::viewer
