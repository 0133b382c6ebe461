#pragma once
// Whether a run is still being written, seen from outside the writing process.
//
// `brownfloc run` takes an exclusive flock(2) on <run directory>/.lock for the whole life of
// the process and writes its PID into the file (sim/src/run_directory.cpp); the file stays
// behind when the run ends, so its presence says nothing. Readers never take the lock (that
// would stop a run from resuming into the directory while the viewer is open): they look for
// the lock in /proc/locks instead.
//
//   if (writer_holds_lock(where.lock_file)) show("running, PID " + std::to_string(*lock_file_pid(where.lock_file)));
//
// Linux only (/proc/locks); elsewhere, or when /proc/locks cannot be read, nobody is seen to
// hold the lock. Thread-safe: each call opens and reads the files afresh.
#include <cstdint>
#include <filesystem>
#include <optional>

namespace brownfloc::viewer {

// True when some process holds a flock on lock_file's inode now, without taking the lock:
// /proc/locks is searched for a FLOCK entry (not a waiter) on the file's inode whose device is
// the file's device or whose PID is the PID written in the file. (Either is enough because on
// some file systems, btrfs subvolumes for one, stat() reports another device number than the
// kernel's lock table.) False for an empty path, a missing or unreadable file, or something
// that is not a regular file.
[[nodiscard]] bool writer_holds_lock(const std::filesystem::path& lock_file);

// The PID the writer wrote into lock_file (leading decimal digits), or nothing when the file is
// missing, unreadable, or holds no number. The PID of a finished run stays in the file.
[[nodiscard]] std::optional<std::int64_t> lock_file_pid(const std::filesystem::path& lock_file);

}  // namespace brownfloc::viewer
