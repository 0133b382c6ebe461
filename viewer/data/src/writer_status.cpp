#include "data/writer_status.hpp"

#include <fcntl.h>
#include <sys/stat.h>
#include <sys/sysmacros.h>
#include <unistd.h>

#include <charconv>
#include <fstream>
#include <sstream>
#include <string>
#include <string_view>

#include "io/unique_fd.hpp"

namespace brownfloc::viewer {
namespace {

struct LockFileFacts {
    dev_t device = 0;
    ino_t inode = 0;
    std::optional<std::int64_t> pid;
};

// Opens without blocking (O_NONBLOCK: a FIFO planted as .lock must not hang the viewer) and
// without following a link (the writer opens it with O_NOFOLLOW too).
std::optional<LockFileFacts> look_at_lock_file(const std::filesystem::path& lock_file) {
    if (lock_file.empty()) return std::nullopt;
    const io::UniqueFd fd{::open(lock_file.c_str(), O_RDONLY | O_NONBLOCK | O_NOFOLLOW | O_CLOEXEC)};
    if (!fd) return std::nullopt;
    struct stat facts {};
    if (::fstat(fd.get(), &facts) != 0 || !S_ISREG(facts.st_mode)) return std::nullopt;
    LockFileFacts result;
    result.device = facts.st_dev;
    result.inode = facts.st_ino;
    char text[32] = {};
    const ssize_t got = ::pread(fd.get(), text, sizeof text - 1, 0);
    if (got > 0) {
        std::int64_t pid = 0;
        const auto [end, error] = std::from_chars(text, text + got, pid);
        if (error == std::errc{} && end != text && pid > 0) result.pid = pid;
    }
    return result;
}

template <class Integer>
bool parse_number(std::string_view text, Integer& value, int base) {
    const auto [end, error] = std::from_chars(text.data(), text.data() + text.size(), value, base);
    return error == std::errc{} && end == text.data() + text.size();
}

// One line of /proc/locks, e.g. "1: FLOCK  ADVISORY  WRITE 28120 fe:00:10955238 0 EOF"
// (fs/locks.c, lock_get_status: device major and minor in hex, inode in decimal). A waiter's
// line has "->" after the number and does not hold the lock.
bool line_shows_holder(const std::string& line, const LockFileFacts& lock) {
    std::istringstream words{line};
    std::string number, kind, advisory, mode, pid_text, where;
    if (!(words >> number >> kind)) return false;
    if (kind != "FLOCK") return false;  // "->" (a waiter), POSIX, OFDLCK, LEASE, ...
    if (!(words >> advisory >> mode >> pid_text >> where)) return false;
    const std::size_t first = where.find(':'), second = where.find(':', first + 1);
    if (first == std::string::npos || second == std::string::npos) return false;
    unsigned major_number = 0, minor_number = 0;
    unsigned long long inode = 0;
    if (!parse_number(std::string_view{where}.substr(0, first), major_number, 16) ||
        !parse_number(std::string_view{where}.substr(first + 1, second - first - 1), minor_number, 16) ||
        !parse_number(std::string_view{where}.substr(second + 1), inode, 10))
        return false;
    if (inode != static_cast<unsigned long long>(lock.inode)) return false;
    if (major_number == major(lock.device) && minor_number == minor(lock.device)) return true;
    std::int64_t pid = 0;
    return lock.pid && parse_number(std::string_view{pid_text}, pid, 10) && pid == *lock.pid;
}

}  // namespace

bool writer_holds_lock(const std::filesystem::path& lock_file) {
    const std::optional<LockFileFacts> lock = look_at_lock_file(lock_file);
    if (!lock) return false;
    std::ifstream table{"/proc/locks"};
    std::string line;
    while (std::getline(table, line))
        if (line_shows_holder(line, *lock)) return true;
    return false;
}

std::optional<std::int64_t> lock_file_pid(const std::filesystem::path& lock_file) {
    const std::optional<LockFileFacts> lock = look_at_lock_file(lock_file);
    return lock ? lock->pid : std::nullopt;
}

}  // namespace brownfloc::viewer
