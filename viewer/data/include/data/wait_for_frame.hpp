#pragma once
// For `brownfloc-view --render --frame K --wait S`: render a frame of a run that is still
// writing as soon as it exists, or give up after S seconds.
#include <chrono>
#include <cstddef>

#include "data/live_trajectory.hpp"

namespace brownfloc::viewer {

inline constexpr std::chrono::milliseconds wait_poll_interval{50};
// Longer timeouts wait this long (about three years).
inline constexpr double max_wait_s = 1e8;

// Polls trajectory (every wait_poll_interval, on the calling thread) until frame k (an index,
// from 0) is intact, or timeout_s (seconds, finite and >= 0; else ViewerInputError) has
// passed; returns whether it arrived. Checks once before any waiting, so a frame already
// there, or timeout_s = 0, returns at once.
[[nodiscard]] bool wait_for_frame(LiveTrajectory& trajectory, std::size_t k, double timeout_s);

}  // namespace brownfloc::viewer
