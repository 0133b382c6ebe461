#pragma once
// SFML needs an X display even to render off screen (shared/TOOLCHAIN.md). The viewer checks
// DISPLAY before it touches SFML, so that a headless machine gets a clear message and exit 3
// instead of an SFML abort.
namespace brownfloc::viewer {

inline constexpr const char* no_display_message = "needs an X display; run under xvfb-run -a";

// True when the DISPLAY environment variable names a display.
[[nodiscard]] bool x_display_named();

}  // namespace brownfloc::viewer
