#include "run_signals.hpp"

#include <unistd.h>

#include <atomic>
#include <csignal>

namespace brownfloc::sim {

namespace {

volatile std::sig_atomic_t received_signal = 0;
volatile std::sig_atomic_t writing_checkpoint = 0;
struct sigaction previous_int {}, previous_term {};

extern "C" void on_signal(int signal_number) {
    if (received_signal != 0 && writing_checkpoint != 0) _exit(128 + signal_number);
    received_signal = signal_number;
}

}  // namespace

SignalGuard::SignalGuard() {
    received_signal = 0;
    writing_checkpoint = 0;
    struct sigaction action {};
    action.sa_handler = on_signal;
    sigemptyset(&action.sa_mask);
    action.sa_flags = 0;  // no SA_RESTART: a blocking call returns EINTR and the io layer retries
    sigaction(SIGINT, &action, &previous_int);
    sigaction(SIGTERM, &action, &previous_term);
}

SignalGuard::~SignalGuard() {
    sigaction(SIGINT, &previous_int, nullptr);
    sigaction(SIGTERM, &previous_term, nullptr);
}

int SignalGuard::received() { return received_signal; }

void SignalGuard::set_writing_checkpoint(bool writing) { writing_checkpoint = writing ? 1 : 0; }

}  // namespace brownfloc::sim
