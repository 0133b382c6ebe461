#pragma once
// Reading a file that someone else may have made hostile: a FIFO, a device or a directory
// where a regular file should be is refused at once (never blocks), and every read is
// positioned (pread), so one descriptor serves any number of readers of fixed offsets.
//
//   ReadableFile file = open_for_reading("run/trajectory.bftraj");
//   std::array<std::byte, 32> header;
//   pread_exact(file.fd.get(), 0, header, "run/trajectory.bftraj");
//
// Symbolic links are followed: reading through a link cannot damage anything.
#include <cstddef>
#include <cstdint>
#include <filesystem>
#include <span>

#include "io/unique_fd.hpp"

namespace brownfloc::io {

struct ReadableFile {
    UniqueFd fd;
    std::uint64_t size_bytes = 0;  // at the time it was opened
};

// Opens path read-only without blocking (O_NONBLOCK keeps a FIFO from waiting for a writer),
// then refuses anything that is not a regular file. Throws IoError.
[[nodiscard]] ReadableFile open_for_reading(const std::filesystem::path& path);

// The current size of the open file in bytes (fstat); throws IoError if it is not a regular
// file. path is for messages only.
[[nodiscard]] std::uint64_t regular_file_size(int fd, const std::filesystem::path& path);

// Reads exactly into.size() bytes starting at byte offset, retrying partial reads and EINTR.
// Throws IoError if the file ends first or a read fails. path is for messages only.
void pread_exact(int fd, std::uint64_t offset, std::span<std::byte> into, const std::filesystem::path& path);

}  // namespace brownfloc::io
