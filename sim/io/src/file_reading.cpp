#include "io/file_reading.hpp"

#include <cerrno>
#include <fcntl.h>
#include <limits>
#include <string>
#include <sys/stat.h>
#include <unistd.h>

#include "file_kind.hpp"
#include "io/io_error.hpp"

namespace brownfloc::io {

ReadableFile open_for_reading(const std::filesystem::path& path) {
    int fd;
    do {
        fd = ::open(path.c_str(), O_RDONLY | O_NONBLOCK | O_CLOEXEC);
    } while (fd < 0 && errno == EINTR);
    if (fd < 0) throw IoError("open", path, errno);
    UniqueFd owned{fd};
    const std::uint64_t size_bytes = regular_file_size(owned.get(), path);
    // O_NONBLOCK has no effect on a regular file; it only mattered for the open above.
    return ReadableFile{std::move(owned), size_bytes};
}

std::uint64_t regular_file_size(int fd, const std::filesystem::path& path) {
    struct stat status {};
    if (::fstat(fd, &status) != 0) throw IoError("read", path, errno);
    if (!S_ISREG(status.st_mode)) throw IoError("read", path, 0, detail::not_regular_reason(status.st_mode));
    return static_cast<std::uint64_t>(status.st_size);
}

void pread_exact(int fd, std::uint64_t offset, std::span<std::byte> into, const std::filesystem::path& path) {
    constexpr auto max_offset = static_cast<std::uint64_t>(std::numeric_limits<off_t>::max());
    if (offset > max_offset || into.size() > max_offset - offset) throw IoError("read", path, EOVERFLOW);
    std::size_t done = 0;
    while (done < into.size()) {
        const ssize_t got = ::pread(fd, into.data() + done, into.size() - done, static_cast<off_t>(offset + done));
        if (got < 0) {
            if (errno == EINTR) continue;
            throw IoError("read", path, errno);
        }
        if (got == 0) {
            std::string reason = "the file ends at byte ";
            reason += std::to_string(offset + done);
            reason += ", inside the ";
            reason += std::to_string(into.size());
            reason += " bytes wanted from byte ";
            reason += std::to_string(offset);
            throw IoError("read", path, 0, reason);
        }
        done += static_cast<std::size_t>(got);
    }
}

}  // namespace brownfloc::io
