#pragma once
// SIGINT and SIGTERM during a run: the handler only records the signal; the run checks
// between steps (and between set-up phases, and during placement), writes a checkpoint and exits 130 / 143. A
// second signal while that checkpoint is being written ends the process at once: the
// checkpoint is replaced atomically, so the previous one stays valid.
namespace brownfloc::sim {

class SignalGuard {
public:
    SignalGuard();   // installs the handlers
    ~SignalGuard();  // restores the previous ones
    SignalGuard(const SignalGuard&) = delete;
    SignalGuard& operator=(const SignalGuard&) = delete;

    // The signal received (SIGINT or SIGTERM), or 0.
    [[nodiscard]] static int received();
    // Marks the final checkpoint's write: a signal now ends the process at once.
    static void set_writing_checkpoint(bool writing);
};

}  // namespace brownfloc::sim
