#pragma once
// The checkpoint file of a run (checkpoint.bfckpt): everything the step loop and its
// observers read, and the lengths of the output files that match it, so that
// `brownfloc run --resume` continues bit for bit.
//
// Layout (little-endian, packed; strings u32 length + bytes, arrays u64 count + items):
//   bytes 0-7   magic "BFLOCCKP"
//   8-11        u32 format version = 1
//   12-15       u32 section count = 3
//   then three sections, each: u32 tag, u64 payload length L, u32 CRC-32C of the payload,
//   u32 CRC-32C of the 16 bytes before, then L bytes of payload:
//     tag 1 "identity": build id (string), resolved scenario text (string), seed (u64)
//     tag 2 "state": engine state, recorder state, next output and next snapshot (u64 each),
//           trajectory bytes and frames, timeseries.csv bytes and rows,
//           size_distribution.csv bytes and rows (u64 each) — a pure function of
//           (scenario, seed, binary) at a given step: the same for an uninterrupted run and
//           one killed and resumed
//     tag 3 "bookkeeping": cumulative wall time (f64), resumes (i64), complete (u8 0/1)
// The reader checks the magic, version, section tags in order, lengths against the bytes
// there before allocating, both CRCs, every count and every value it can (finite positions,
// ids below N, sizes that sum to N, ...); a failure is a CheckpointFormatError naming the
// file, the byte offset and what is wrong (exit 2).
#include <cstdint>
#include <filesystem>
#include <span>
#include <stdexcept>
#include <string>
#include <vector>

#include "sim/engine_state.hpp"
#include "sim/run_recorder.hpp"

namespace brownfloc::sim {

class CheckpointFormatError : public std::runtime_error {
public:
    using std::runtime_error::runtime_error;
};

struct OutputLengths {
    std::uint64_t trajectory_bytes = 0, trajectory_frames = 0;
    std::uint64_t timeseries_bytes = 0, timeseries_rows = 0;
    std::uint64_t size_distribution_bytes = 0, size_distribution_rows = 0;
    friend bool operator==(const OutputLengths&, const OutputLengths&) = default;
};

struct Checkpoint {
    // identity
    std::string build_id;
    std::string scenario_toml;  // resolved
    std::uint64_t seed = 0;
    // state
    EngineState engine;
    RecorderState recorder;
    std::uint64_t next_output = 0, next_snapshot = 0;
    OutputLengths files;
    // bookkeeping
    double wall_time_s = 0;
    std::int64_t resumes = 0;
    bool complete = false;
};

// The whole file, and the state section alone (what bitwise-identity tests compare).
[[nodiscard]] std::vector<std::byte> encode_checkpoint(const Checkpoint& checkpoint);
[[nodiscard]] std::vector<std::byte> encode_checkpoint_state(const Checkpoint& checkpoint);
// Throws CheckpointFormatError; source names the file in messages.
[[nodiscard]] Checkpoint decode_checkpoint(std::span<const std::byte> bytes, const std::string& source);

// Reads path (a regular file, at most 16 GiB; io::IoError otherwise) and decodes it.
[[nodiscard]] Checkpoint read_checkpoint(const std::filesystem::path& path);
// Writes atomically: temporary file, fsync, rename, directory fsync (io::IoError).
void write_checkpoint(const std::filesystem::path& path, const Checkpoint& checkpoint);

// This binary's identity: the SHA-256 of the running executable (/proc/self/exe), so that a
// checkpoint from another build is recognised; "unknown" where it cannot be read.
[[nodiscard]] const std::string& build_id();

}  // namespace brownfloc::sim
