#pragma once
// Shared by the viewer data tests: small invented headers and frames, a trajectory written
// with TrajectoryWriter into a temporary run directory, file edits, and waiting for the
// frame loader with a deadline (no test may hang).
#include <chrono>
#include <cstddef>
#include <cstdint>
#include <filesystem>
#include <fstream>
#include <iterator>
#include <optional>
#include <string>
#include <thread>
#include <vector>

#include "../../support/temp_dir.hpp"
#include "trajectory/trajectory_data.hpp"
#include "trajectory/trajectory_writer.hpp"

namespace brownfloc::test {

// N particles of one species, radius radius_nm, in a 1000 nm box; one pair record with a
// short curve; the resolved scenario text holds `seed = 7` in [run].
inline trajectory::TrajectoryHeader viewer_header(std::size_t particles, double radius_nm = 50.0) {
    trajectory::TrajectoryHeader header;
    header.box_length_nm = 1000.0;
    header.temperature_K = 298.15;
    header.fast_half_life_s = 0.01;
    header.debye_length_nm = 3.04;
    header.species_names = {"latex"};
    header.radius_nm.assign(particles, radius_nm);
    header.species.assign(particles, 0u);
    header.scenario_toml = "# resolved\n[particle]\nradius_nm = 50\n\n[run]\nparticles = 8\nseed = 7\n";
    trajectory::PairRecord pair;
    pair.capture_gap_nm = 0.5;
    pair.gap_nm = {0.2, 1.0, 5.0, 25.0};
    pair.energy_kT = {-40.0, -8.0, -1.6, -0.3};
    header.pairs.push_back(pair);
    return header;
}

// Frame k: every particle a monomer on a simple cubic lattice of spacing 120 nm, shifted by
// k nm along x so that frames differ; time 0.005 k s.
inline trajectory::TrajectoryFrame monomer_frame(std::size_t particles, std::uint64_t k) {
    trajectory::TrajectoryFrame frame;
    frame.step = static_cast<std::int64_t>(100 * k);
    frame.time_s = 0.005 * static_cast<double>(k);
    for (std::size_t i = 0; i < particles; ++i) {
        frame.positions_nm.push_back(60.0 + 120.0 * static_cast<double>(i % 8) + static_cast<double>(k));
        frame.positions_nm.push_back(60.0 + 120.0 * static_cast<double>((i / 8) % 8));
        frame.positions_nm.push_back(60.0 + 120.0 * static_cast<double>(i / 64));
        frame.cluster.push_back(static_cast<std::uint32_t>(i));
    }
    frame.cluster_count = static_cast<std::uint32_t>(particles);
    frame.largest_cluster = 1;
    return frame;
}

// A trajectory of `frames` monomer frames (positions in float64) written to path.
inline trajectory::TrajectoryWriter write_trajectory(const std::filesystem::path& path, std::size_t particles,
                                                     std::uint64_t frames) {
    trajectory::TrajectoryWriter writer = trajectory::TrajectoryWriter::create(path, viewer_header(particles), true);
    for (std::uint64_t k = 0; k < frames; ++k) writer.append(monomer_frame(particles, k));
    return writer;
}

inline std::string read_text(const std::filesystem::path& path) {
    std::ifstream in{path, std::ios::binary};
    return {std::istreambuf_iterator<char>{in}, std::istreambuf_iterator<char>{}};
}

inline void write_text(const std::filesystem::path& path, const std::string& text) {
    std::ofstream out{path, std::ios::binary | std::ios::trunc};
    out << text;
}

// Flips every bit of the byte at offset, in place (same inode).
inline void flip_byte(const std::filesystem::path& path, std::uint64_t offset) {
    std::fstream file{path, std::ios::binary | std::ios::in | std::ios::out};
    file.seekg(static_cast<std::streamoff>(offset));
    char byte = 0;
    file.get(byte);
    file.seekp(static_cast<std::streamoff>(offset));
    file.put(static_cast<char>(~byte));
}

// Calls try_once() every millisecond until it returns a value or `seconds` pass.
template <class Try>
auto eventually(Try try_once, double seconds = 20.0) -> decltype(try_once()) {
    const auto deadline = std::chrono::steady_clock::now() + std::chrono::duration<double>(seconds);
    for (;;) {
        if (auto value = try_once()) return value;
        if (std::chrono::steady_clock::now() > deadline) return {};
        std::this_thread::sleep_for(std::chrono::milliseconds(1));
    }
}

}  // namespace brownfloc::test
