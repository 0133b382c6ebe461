#pragma once
// The trajectory file (trajectory.bftraj), format version 1, byte by byte. The same table is in
// DEVELOPERS.md ("Trajectory file format"); change both together, and bump `version` for any
// change a version-1 reader would misread.
//
// All integers and floating-point numbers are little-endian (IEEE 754 binary32/binary64),
// packed byte by byte with no padding. CRC = CRC-32C (Castagnoli, reflected polynomial
// 0x82F63B78; "123456789" -> 0xE3069283; trajectory/crc32c.hpp). A string is a
// u32 byte count then the bytes (no terminator); an array is a u64 item count then the items.
//
// File = file header (32 bytes) + header payload (H bytes) + frames, back to back.
//
// File header, at byte 0:
//   offset width type   field
//        0     8 bytes  magic "BFLOCTRJ"
//        8     4 u32    format version = 1
//       12     4 u32    flags: bit 0 set = positions stored as f64, clear = f32; other bits 0
//       16     8 u64    H = header payload length in bytes (at most 2^30)
//       24     4 u32    CRC of the H header payload bytes
//       28     4 u32    CRC of bytes 0..27 of this header
//
// Header payload, at byte 32 (TrajectoryHeader, in this order):
//   string length_unit  = "nm"      string time_unit = "s"      string energy_unit = "kT"
//   f64 box_length_nm   f64 temperature_K   f64 fast_half_life_s   f64 debye_length_nm
//   array of string species_names        (S >= 1 names, none empty)
//   array of f64    radius_nm            (N >= 1 particles, N < 2^32; finite, > 0)
//   array of u32    species              (N entries, each < S)
//   string scenario_toml                 (the resolved scenario text)
//   array of pair records, each:
//     u32 species_i, u32 species_j (< S)   f64 stability_ratio (Fuchs W, > 0, +inf allowed)
//     f64 capture_gap_nm (finite, >= 0)    u8 has_barrier (0 or 1)
//     f64 barrier_kT, f64 barrier_gap_nm (finite; 0 when there is no barrier)
//     array of f64 gap_nm (finite, strictly increasing)   array of f64 energy_kT (as many, finite)
//   All H bytes are used: nothing may follow the last pair record.
//   No timestamp, host name or path anywhere: the file is a pure function of the run.
//
// Frame k (k = 0, 1, 2, ...), at the end of the previous one (the first at byte 32 + H):
//   offset width type   field
//        0     4 u32    sync marker 0x46524D31 (bytes "1MRF")
//        4     4 u32    reserved = 0
//        8     8 u64    frame number k (0, 1, 2, ...: must rise from frame to frame)
//       16     8 u64    P = frame payload length in bytes
//       24     4 u32    CRC of the P payload bytes
//       28     4 u32    CRC of bytes 0..27 of this frame header
//   then the payload (TrajectoryFrame), w = 8 if flags bit 0 else 4, A = 16 + 3Nw, B = A + 4N:
//        0     8 i64    step
//        8     8 f64    time_s (finite; never less than the previous frame's)
//       16  3N*w f32/f64 positions_nm: x, y, z of particle 0, then 1, ... (each cluster whole)
//        A    4N u32    cluster: id of each particle's cluster = its smallest member id (< N)
//        B     8 u64    C = number of spanning clusters (C <= N)
//      B+8    4C u32    spanning_clusters (each < N)
//   B+8+4C     4 u32    cluster_count (<= N)
//  B+12+4C     4 u32    largest_cluster, in particles (<= N)
//   so P = 32 + 3Nw + 4N + 4C exactly.
//
// Reading rules (TrajectoryReader): a bad file header or header payload makes the file
// unusable (TrajectoryFormatError). Frames are skipped, each with a warning naming its byte
// offset, when: the sync marker is missing or the frame header's CRC fails (the reader then
// scans forward for the next sync marker whose header CRC checks); the header is intact but
// P is impossible for N (scan on from the end of the header); the payload CRC fails (the
// header's length is trustworthy, so reading goes on right after the payload: indexing stays
// linear in the file size whatever the file holds); the payload breaks a rule above; the
// frame number does not rise, or the time goes back. A file that ends inside a frame (a run
// still writing, or killed) is a warning, not an error. Writing is append-only; a failed write
// is cut back to the last complete frame, and a resumed run first truncates the file to the
// end of the last frame its checkpoint knows (TrajectoryWriter::reopen_for_append).
#include <cstddef>
#include <cstdint>
#include <string_view>

namespace brownfloc::trajectory::format {

inline constexpr std::string_view file_extension = ".bftraj";
inline constexpr std::string_view magic = "BFLOCTRJ";
inline constexpr std::uint32_t version = 1;
inline constexpr std::uint32_t flag_positions_float64 = 1u;
inline constexpr std::uint32_t known_flags = flag_positions_float64;
inline constexpr std::size_t file_header_bytes = 32;
inline constexpr std::size_t frame_header_bytes = 32;
inline constexpr std::uint32_t frame_sync_marker = 0x46524D31u;
// A cap on what a file can make us allocate before its header CRC is checked; 2^30 bytes hold
// the radii and species of 8e7 particles.
inline constexpr std::uint64_t max_header_payload_bytes = std::uint64_t{1} << 30;
inline constexpr std::string_view length_unit = "nm";
inline constexpr std::string_view time_unit = "s";
inline constexpr std::string_view energy_unit = "kT";

}  // namespace brownfloc::trajectory::format
