#pragma once
// Reads a run file whole, with the file rules shared by the CSV and JSON readers: opened
// without blocking (a FIFO, device or directory is refused at once), a size limit checked
// before anything is allocated, positioned reads only.
#include <cstddef>
#include <cstdint>
#include <filesystem>
#include <vector>

namespace brownfloc::run_files::detail {

// The bytes of path as they were when it was opened (a writer appending meanwhile is not
// followed: the viewer reads again). Throws io::IoError if it cannot be opened or read, is
// not a regular file, or holds more than limit_bytes.
[[nodiscard]] std::vector<std::byte> read_whole_file(const std::filesystem::path& path, std::uint64_t limit_bytes);

}  // namespace brownfloc::run_files::detail
