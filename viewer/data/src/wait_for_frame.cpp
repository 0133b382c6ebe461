#include "data/wait_for_frame.hpp"

#include <algorithm>
#include <cmath>
#include <thread>

#include "data/viewer_input_error.hpp"
#include "io/message_text.hpp"

namespace brownfloc::viewer {

bool wait_for_frame(LiveTrajectory& trajectory, std::size_t k, double timeout_s) {
    // Also refuses infinity: a wait must end.
    if (!std::isfinite(timeout_s) || timeout_s < 0.0)
        throw ViewerInputError(io::message("wait for frame ", k, ": timeout = ", timeout_s,
                                           " s: must be a finite number of seconds >= 0"));
    using Clock = std::chrono::steady_clock;
    // Clamped so that the deadline fits in the clock's 64-bit nanoseconds.
    const double wait_s = std::min(timeout_s, max_wait_s);
    const auto deadline = Clock::now() + std::chrono::duration_cast<Clock::duration>(std::chrono::duration<double>(wait_s));
    for (;;) {
        (void)trajectory.poll();
        if (trajectory.frame_count() > k) return true;
        const auto now = Clock::now();
        if (now >= deadline) return false;
        std::this_thread::sleep_for(std::min<Clock::duration>(wait_poll_interval, deadline - now));
    }
}

}  // namespace brownfloc::viewer
