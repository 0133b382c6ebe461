#pragma once
// Shared by the trajectory tests: a temporary directory, file helpers, a small but complete
// header and deterministic frames, and helpers that re-seal CRCs after a test edits a file
// image on purpose (so that the edit reaches the decoder instead of failing the CRC).
#include <algorithm>
#include <cmath>
#include <cstddef>
#include <cstdint>
#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <iterator>
#include <limits>
#include <span>
#include <stdexcept>
#include <string>
#include <string_view>

#include "../support/temp_dir.hpp"
#include <vector>

#include "io/write_faults.hpp"
#include "trajectory/crc32c.hpp"
#include "trajectory/trajectory_data.hpp"

namespace brownfloc::test {

using trajectory::PairRecord;
using trajectory::TrajectoryFrame;
using trajectory::TrajectoryHeader;
using Bytes = std::vector<std::byte>;


struct WriteFaultGuard {
    WriteFaultGuard() = default;
    WriteFaultGuard(const WriteFaultGuard&) = delete;
    WriteFaultGuard& operator=(const WriteFaultGuard&) = delete;
    ~WriteFaultGuard() { io::testing::clear_write_faults(); }
};

inline Bytes read_bytes(const std::filesystem::path& path) {
    std::ifstream in{path, std::ios::binary};
    const std::string text{std::istreambuf_iterator<char>{in}, std::istreambuf_iterator<char>{}};
    const auto* begin = reinterpret_cast<const std::byte*>(text.data());
    return Bytes(begin, begin + text.size());
}

inline void write_bytes(const std::filesystem::path& path, std::span<const std::byte> bytes, bool append = false) {
    std::ofstream out{path, std::ios::binary | (append ? std::ios::app : std::ios::trunc)};
    out.write(reinterpret_cast<const char*>(bytes.data()), static_cast<std::streamsize>(bytes.size()));
}

inline std::uint32_t load_u32(const Bytes& bytes, std::size_t at) {
    std::uint32_t value = 0;
    for (std::size_t i = 0; i < 4; ++i) value |= std::to_integer<std::uint32_t>(bytes[at + i]) << (8 * i);
    return value;
}
inline std::uint64_t load_u64(const Bytes& bytes, std::size_t at) {
    std::uint64_t value = 0;
    for (std::size_t i = 0; i < 8; ++i) value |= std::to_integer<std::uint64_t>(bytes[at + i]) << (8 * i);
    return value;
}
inline void store_u32(Bytes& bytes, std::size_t at, std::uint32_t value) {
    for (std::size_t i = 0; i < 4; ++i) bytes[at + i] = static_cast<std::byte>((value >> (8 * i)) & 0xFFu);
}
inline void store_u64(Bytes& bytes, std::size_t at, std::uint64_t value) {
    for (std::size_t i = 0; i < 8; ++i) bytes[at + i] = static_cast<std::byte>((value >> (8 * i)) & 0xFFu);
}

// After editing the header payload of a file image: recompute its CRC (bytes 24..27) and the
// file header's own CRC (bytes 28..31), as a deliberate forger would.
inline void reseal_file_header(Bytes& file) {
    const std::size_t payload = static_cast<std::size_t>(load_u64(file, 16));
    const std::size_t available = std::min(payload, file.size() - 32);
    store_u32(file, 24, trajectory::crc32c(std::span<const std::byte>{file}.subspan(32, available)));
    store_u32(file, 28, trajectory::crc32c(std::span<const std::byte>{file}.first(28)));
}

// The same for the frame whose header starts at byte `at`.
inline void reseal_frame(Bytes& file, std::size_t at) {
    const std::size_t payload = static_cast<std::size_t>(load_u64(file, at + 16));
    store_u32(file, at + 24, trajectory::crc32c(std::span<const std::byte>{file}.subspan(at + 32, payload)));
    store_u32(file, at + 28, trajectory::crc32c(std::span<const std::byte>{file}.subspan(at, 28)));
}

// Byte offset of the u64 count of radius_nm in the file (its layout: three unit strings, four
// f64, the species names, then radius_nm).
inline std::size_t radius_count_offset(const TrajectoryHeader& header) {
    std::size_t at = 32 + (4 + header.length_unit.size()) + (4 + header.time_unit.size()) +
                     (4 + header.energy_unit.size()) + 4 * 8 + 8;
    for (const std::string& name : header.species_names) at += 4 + name.size();
    return at;
}

// An invented but realistic header: two species, `particles` particles alternating between
// them, three pair records with curves of `curve_samples` samples; the like-pair of the
// second species has a barrier too high to cross (W = +inf).
inline TrajectoryHeader small_header(std::size_t particles, std::size_t curve_samples = 8) {
    TrajectoryHeader header;
    header.box_length_nm = 1200.0;
    header.temperature_K = 298.15;
    header.fast_half_life_s = 0.0137;
    header.debye_length_nm = 1.36;
    header.species_names = {"silica", "latex"};
    for (std::size_t i = 0; i < particles; ++i) {
        header.species.push_back(static_cast<std::uint32_t>(i % 2));
        header.radius_nm.push_back(i % 2 == 0 ? 50.0 + 0.25 * static_cast<double>(i) : 80.0);
    }
    header.scenario_toml = "# resolved\n[electrolyte]\nsalt = \"NaCl\"\nconcentration_mM = 50\n";
    const std::uint32_t pairs[3][2] = {{0, 0}, {0, 1}, {1, 1}};
    for (const auto& pair : pairs) {
        PairRecord record;
        record.species_i = pair[0];
        record.species_j = pair[1];
        record.capture_gap_nm = 0.5;
        record.has_barrier = pair[1] == 1;
        record.barrier_kT = record.has_barrier ? 18.25 : 0.0;
        record.barrier_gap_nm = record.has_barrier ? 2.75 : 0.0;
        record.stability_ratio = pair[0] == 1 ? std::numeric_limits<double>::infinity() : (record.has_barrier ? 3.1e6 : 0.62);
        for (std::size_t s = 0; s < curve_samples; ++s) {
            const double gap_nm = 0.5 * std::pow(200.0, static_cast<double>(s) / static_cast<double>(curve_samples));
            record.gap_nm.push_back(gap_nm);
            record.energy_kT.push_back(-12.0 / gap_nm + (record.has_barrier ? 40.0 * std::exp(-gap_nm / 1.36) : 0.0));
        }
        header.pairs.push_back(record);
    }
    return header;
}

// Frame k of a deterministic run: positions with many significant digits (so float32 storage
// rounds them), particles 0 and 1 bonded, a spanning cluster in odd frames.
inline TrajectoryFrame sample_frame(std::size_t particles, std::uint64_t k) {
    TrajectoryFrame frame;
    frame.step = static_cast<std::int64_t>(1000 * k);
    frame.time_s = 0.0025 * static_cast<double>(k);
    for (std::size_t i = 0; i < 3 * particles; ++i)
        frame.positions_nm.push_back(static_cast<double>((i * 37 + k * 11) % 1193) + 0.123456789 * static_cast<double>(i % 7));
    for (std::size_t i = 0; i < particles; ++i) frame.cluster.push_back(i < 2 ? 0u : static_cast<std::uint32_t>(i));
    if (k % 2 == 1) frame.spanning_clusters = {0};
    frame.cluster_count = static_cast<std::uint32_t>(particles > 1 ? particles - 1 : 1);
    frame.largest_cluster = particles > 1 ? 2u : 1u;
    return frame;
}

// Relative error of float32 storage: round to nearest gives |x - float(x)| <= 2^-24 |x| for
// normal numbers (unit roundoff u = 2^-24; Higham 2002, Accuracy and Stability of Numerical
// Algorithms, eq. 2.4).
inline bool within_float32_rounding(double stored, double original) {
    return std::fabs(stored - original) <= 0x1.0p-24 * std::fabs(original);
}

}  // namespace brownfloc::test
