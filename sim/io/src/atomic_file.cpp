#include "io/atomic_file.hpp"

#include <cerrno>
#include <cstdio>
#include <string>
#include <sys/stat.h>
#include <unistd.h>

#include "file_kind.hpp"
#include "io/file_writing.hpp"
#include "io/io_error.hpp"

namespace brownfloc::io {
namespace {

constexpr std::string_view temporary_marker = ".tmp-";

std::filesystem::path directory_of(const std::filesystem::path& path) {
    const std::filesystem::path parent = path.parent_path();
    return parent.empty() ? std::filesystem::path{"."} : parent;
}

// ".<name>.tmp-<digits>" with a non-empty name.
bool is_temporary_name(std::string_view name) {
    if (name.size() < 2 || name.front() != '.') return false;
    const std::size_t marker = name.rfind(temporary_marker);
    if (marker == std::string_view::npos || marker < 2) return false;
    const std::string_view digits = name.substr(marker + temporary_marker.size());
    if (digits.empty()) return false;
    for (const char c : digits)
        if (c < '0' || c > '9') return false;
    return true;
}

void refuse_unsuitable_target(const std::filesystem::path& path) {
    struct stat status {};
    if (::lstat(path.c_str(), &status) != 0) {
        if (errno == ENOENT) return;
        throw IoError("replace", path, errno);
    }
    if (S_ISLNK(status.st_mode))
        throw IoError("replace", path, 0, "it is a symbolic link (refused: files are written in place, never through a link)");
    if (!S_ISREG(status.st_mode)) throw IoError("replace", path, 0, detail::not_regular_reason(status.st_mode));
}

// Opens the temporary file. One left by an earlier process that had our pid (common in
// containers, where a program often runs as the same small pid every time) is removed and the
// create retried once; a temporary name is never a link we could be tricked into following,
// because the create is O_EXCL | O_NOFOLLOW.
UniqueFd create_temporary(const std::filesystem::path& temporary) {
    try {
        return create_new_file(temporary);
    } catch (const IoError& error) {
        if (error.error_number() != EEXIST) throw;
    }
    if (::unlink(temporary.c_str()) != 0 && errno != ENOENT) throw IoError("remove stale", temporary, errno);
    return create_new_file(temporary);
}

}  // namespace

std::filesystem::path temporary_path_for(const std::filesystem::path& path) {
    std::string name = ".";
    name += path.filename().string();
    name += temporary_marker;
    name += std::to_string(static_cast<long long>(::getpid()));
    return directory_of(path) / name;
}

void write_file_atomically(const std::filesystem::path& path, std::span<const std::byte> bytes) {
    if (path.filename().empty()) throw IoError("replace", path, EISDIR, "the path names no file");
    refuse_unsuitable_target(path);
    const std::filesystem::path temporary = temporary_path_for(path);
    UniqueFd fd = create_temporary(temporary);
    try {
        write_all(fd.get(), bytes, temporary);
        sync_file(fd.get(), temporary);
        close_file(fd, temporary);
        // Checked again just before the rename to narrow the window for a swap; rename itself
        // replaces a link rather than following it, so the worst a racing swap can do is lose
        // the link, never write through it.
        refuse_unsuitable_target(path);
        if (::rename(temporary.c_str(), path.c_str()) != 0) throw IoError("replace", path, errno);
    } catch (...) {
        fd.reset();
        ::unlink(temporary.c_str());
        throw;
    }
    sync_directory(directory_of(path));
}

void write_file_atomically(const std::filesystem::path& path, std::string_view text) {
    write_file_atomically(path, std::as_bytes(std::span<const char>{text.data(), text.size()}));
}

std::size_t remove_stale_temporaries(const std::filesystem::path& directory) {
    std::error_code error;
    std::filesystem::directory_iterator entries{directory, error};
    if (error) throw IoError("list", directory, error.value());
    std::size_t removed = 0;
    // The error_code form of increment: the range-for form would throw filesystem_error.
    for (; entries != std::filesystem::directory_iterator{}; entries.increment(error)) {
        if (error) throw IoError("list", directory, error.value());
        const std::filesystem::directory_entry& entry = *entries;
        if (!is_temporary_name(entry.path().filename().string())) continue;
        // Regular files only, judged without following links: a link named like a temporary
        // is not ours.
        struct stat status {};
        if (::lstat(entry.path().c_str(), &status) != 0 || !S_ISREG(status.st_mode)) continue;
        if (::unlink(entry.path().c_str()) != 0) {
            if (errno == ENOENT) continue;
            throw IoError("remove", entry.path(), errno);
        }
        ++removed;
    }
    if (error) throw IoError("list", directory, error.value());
    return removed;
}

}  // namespace brownfloc::io
