#pragma once
// Owns one POSIX file descriptor and closes it when destroyed. Move-only.
//
// The destructor ignores close() errors: a file whose writes matter is synced (sync_file) and
// closed with close_file(), which reports them, before its UniqueFd goes away.
namespace brownfloc::io {

class UniqueFd {
public:
    UniqueFd() noexcept = default;
    explicit UniqueFd(int fd) noexcept : fd_{fd} {}
    UniqueFd(UniqueFd&& other) noexcept : fd_{other.release()} {}
    UniqueFd& operator=(UniqueFd&& other) noexcept;
    UniqueFd(const UniqueFd&) = delete;
    UniqueFd& operator=(const UniqueFd&) = delete;
    ~UniqueFd() { reset(); }

    // The descriptor, or -1 when empty.
    [[nodiscard]] int get() const noexcept { return fd_; }
    [[nodiscard]] explicit operator bool() const noexcept { return fd_ >= 0; }
    // Gives up ownership without closing; returns the descriptor.
    int release() noexcept;
    // Closes the owned descriptor (errors ignored) and takes fd.
    void reset(int fd = -1) noexcept;

private:
    int fd_ = -1;
};

}  // namespace brownfloc::io
