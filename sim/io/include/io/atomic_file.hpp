#pragma once
// Replacing a whole file so that a crash leaves either the old or the new content, never a
// mixture: write a temporary file beside it, fsync, rename over the target, fsync the directory.
//
//   write_file_atomically("run/summary.json", json_text);
//
// The temporary file is ".<name>.tmp-<pid>" in the target's directory (same file system, so
// the rename is atomic). A crash can leave one behind; remove_stale_temporaries() clears them
// when a run (re)starts. One writer per target path at a time: two threads replacing the same
// path at once share the temporary name.
#include <cstddef>
#include <filesystem>
#include <span>
#include <string_view>

namespace brownfloc::io {

// Writes bytes to path atomically (see above). Refuses a target that exists and is a symbolic
// link or not a regular file. Throws IoError; the temporary file is removed on failure.
void write_file_atomically(const std::filesystem::path& path, std::span<const std::byte> bytes);
void write_file_atomically(const std::filesystem::path& path, std::string_view text);

// The temporary name write_file_atomically uses for path in this process.
[[nodiscard]] std::filesystem::path temporary_path_for(const std::filesystem::path& path);

// Removes the regular files in directory named ".<name>.tmp-<digits>" (leftovers of
// write_file_atomically); returns how many. Call it when no atomic write into that directory
// is in flight, e.g. right after taking the run directory's lock. Throws IoError.
std::size_t remove_stale_temporaries(const std::filesystem::path& directory);

}  // namespace brownfloc::io
