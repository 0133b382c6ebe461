#include "io/file_writing.hpp"

#include <cerrno>
#include <csignal>
#include <fcntl.h>
#include <limits>
#include <sys/stat.h>
#include <unistd.h>

#include "file_kind.hpp"
#include "io/io_error.hpp"
#include "low_level_write.hpp"

namespace brownfloc::io {
namespace {

constexpr const char* symbolic_link_refusal = "it is a symbolic link (refused: files are written in place, never through a link)";

int open_retrying(const std::filesystem::path& path, int flags, mode_t mode) {
    int fd;
    do {
        fd = ::open(path.c_str(), flags, mode);
    } while (fd < 0 && errno == EINTR);
    return fd;
}

// Better words than the errno for two refusals: O_NOFOLLOW reports a link as ELOOP ("Too many
// levels of symbolic links"), and a FIFO opened O_WRONLY | O_NONBLOCK with no reader as ENXIO.
[[noreturn]] void throw_open_error(std::string_view action, const std::filesystem::path& path, int error_number) {
    struct stat status {};
    if ((error_number == ELOOP || error_number == ENXIO) && ::lstat(path.c_str(), &status) == 0) {
        if (S_ISLNK(status.st_mode)) throw IoError(action, path, error_number, symbolic_link_refusal);
        if (!S_ISREG(status.st_mode)) throw IoError(action, path, error_number, detail::not_regular_reason(status.st_mode));
    }
    throw IoError(action, path, error_number);
}

}  // namespace

UniqueFd create_new_file(const std::filesystem::path& path) {
    const int fd = open_retrying(path, O_WRONLY | O_CREAT | O_EXCL | O_NOFOLLOW | O_CLOEXEC, 0644);
    if (fd < 0) throw_open_error("create", path, errno);
    return UniqueFd{fd};
}

UniqueFd open_existing_for_append(const std::filesystem::path& path) {
    // O_NONBLOCK only so that a FIFO cannot block the open; cleared once we know it is a file.
    const int fd = open_retrying(path, O_WRONLY | O_APPEND | O_NOFOLLOW | O_CLOEXEC | O_NONBLOCK, 0);
    if (fd < 0) throw_open_error("open for appending", path, errno);
    UniqueFd owned{fd};
    struct stat status {};
    if (::fstat(owned.get(), &status) != 0) throw IoError("open for appending", path, errno);
    if (!S_ISREG(status.st_mode)) throw IoError("open for appending", path, 0, detail::not_regular_reason(status.st_mode));
    const int flags = ::fcntl(owned.get(), F_GETFL);
    if (flags < 0 || ::fcntl(owned.get(), F_SETFL, flags & ~O_NONBLOCK) != 0) throw IoError("open for appending", path, errno);
    return owned;
}

void write_all(int fd, std::span<const std::byte> bytes, const std::filesystem::path& path) {
    std::size_t done = 0;
    while (done < bytes.size()) {
        const ssize_t wrote = detail::low_level_write(fd, bytes.data() + done, bytes.size() - done);
        if (wrote < 0) {
            if (errno == EINTR) continue;
            throw IoError("write", path, errno);
        }
        // write(2) returns 0 for a non-empty buffer only on odd devices; treat it as the error
        // it is rather than loop forever.
        if (wrote == 0) throw IoError("write", path, EIO, "the system accepted no bytes");
        done += static_cast<std::size_t>(wrote);
    }
}

void truncate_to(int fd, std::uint64_t length_bytes, const std::filesystem::path& path) {
    if (length_bytes > static_cast<std::uint64_t>(std::numeric_limits<off_t>::max()))
        throw IoError("truncate", path, EFBIG);
    const auto length = static_cast<off_t>(length_bytes);
    int result;
    do {
        result = ::ftruncate(fd, length);
    } while (result != 0 && errno == EINTR);
    if (result != 0) throw IoError("truncate", path, errno);
    // Without O_APPEND the position would stay past the new end, and the next write would
    // leave a hole of zeros.
    if (::lseek(fd, length, SEEK_SET) < 0) throw IoError("truncate", path, errno);
}

void sync_file(int fd, const std::filesystem::path& path) {
    int result;
    do {
        result = ::fsync(fd);
    } while (result != 0 && errno == EINTR);
    if (result != 0) throw IoError("sync", path, errno);
}

void sync_directory(const std::filesystem::path& directory) {
    const std::filesystem::path where = directory.empty() ? std::filesystem::path{"."} : directory;
    const int fd = open_retrying(where, O_RDONLY | O_DIRECTORY | O_CLOEXEC, 0);
    if (fd < 0) throw IoError("sync directory", where, errno);
    UniqueFd owned{fd};
    int result;
    do {
        result = ::fsync(owned.get());
    } while (result != 0 && errno == EINTR);
    // EINVAL: a file system that cannot sync directories (some network and FUSE ones); there
    // is nothing more to do there, and refusing would make the program unusable on them.
    if (result != 0 && errno != EINVAL) throw IoError("sync directory", where, errno);
}

void close_file(UniqueFd& fd, const std::filesystem::path& path) {
    const int raw = fd.release();
    if (raw < 0) return;
    // No retry on EINTR: the descriptor is closed either way on Linux.
    if (::close(raw) != 0 && errno != EINTR) throw IoError("close", path, errno);
}

void ignore_file_size_signal() {
    struct sigaction action {};
    action.sa_handler = SIG_IGN;
    sigemptyset(&action.sa_mask);
    ::sigaction(SIGXFSZ, &action, nullptr);
}

}  // namespace brownfloc::io
