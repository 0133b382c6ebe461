#pragma once
// `brownfloc-view RUN --render OUT.png [...]`: draws one frame (or, with --sequence DIR
// --every K, every K-th frame) off screen exactly as the window would, writes PNG files and
// exits. Needs an X display like every SFML drawing (tests use xvfb-run).
#include <iosfwd>

#include "view_options.hpp"

namespace brownfloc::viewer {

// Returns the exit code; messages go to `messages`, the written paths to `out`.
// Throws ViewerInputError / ViewerEnvironmentError / ViewerUsageError.
int render_headless(const ViewOptions& options, std::ostream& out, std::ostream& messages);

}  // namespace brownfloc::viewer
