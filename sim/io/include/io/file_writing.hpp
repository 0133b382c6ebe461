#pragma once
// Writing files that must not be damaged: create only what does not exist, never write through
// a symbolic link, retry partial writes and EINTR, report every failure as an IoError naming
// the path and the system's reason ("No space left on device").
//
//   UniqueFd fd = create_new_file("run/trajectory.bftraj");
//   write_all(fd.get(), bytes, "run/trajectory.bftraj");
//   sync_file(fd.get(), "run/trajectory.bftraj");
//   sync_directory("run");          // makes the new name itself durable
//
// Every write goes through one low-level call that tests can make fail (io/write_faults.hpp).
// The path arguments of the descriptor functions are for messages only.
#include <cstddef>
#include <cstdint>
#include <filesystem>
#include <span>

#include "io/unique_fd.hpp"

namespace brownfloc::io {

// Creates path for writing (mode 0644 before umask); refuses an existing path, a symbolic link
// included (O_CREAT | O_EXCL | O_NOFOLLOW). Throws IoError.
[[nodiscard]] UniqueFd create_new_file(const std::filesystem::path& path);

// Opens an existing regular file for appending, to resume a run: refuses a symbolic link, a
// FIFO, a device or a directory without blocking. Writes go to the end (O_APPEND), so no
// earlier byte can be overwritten. Throws IoError.
[[nodiscard]] UniqueFd open_existing_for_append(const std::filesystem::path& path);

// Writes all of bytes at the descriptor's position. Throws IoError; some of the bytes may have
// been written when it does (the caller truncates if it needs the file whole).
void write_all(int fd, std::span<const std::byte> bytes, const std::filesystem::path& path);

// Shortens (or extends with zeros) the file to length_bytes and moves the descriptor's
// position there, so that the next write continues at the new end. Throws IoError.
void truncate_to(int fd, std::uint64_t length_bytes, const std::filesystem::path& path);

// fsync: the file's data and size are on the disk when it returns. Throws IoError.
void sync_file(int fd, const std::filesystem::path& path);

// fsync of a directory, so that files created, renamed or removed in it stay so after a
// crash. Throws IoError.
void sync_directory(const std::filesystem::path& directory);

// Closes fd and reports a failure of close() itself (network file systems report delayed
// write errors there). fd is empty afterwards either way. Throws IoError.
void close_file(UniqueFd& fd, const std::filesystem::path& path);

// A write past `ulimit -f` raises SIGXFSZ, whose default action kills the process with no
// message. Ignoring the signal makes that write fail with EFBIG instead, which write_all
// reports as "File too large". Process-wide; the app calls it once at start.
void ignore_file_size_signal();

}  // namespace brownfloc::io
