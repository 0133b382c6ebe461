#pragma once
// Trajectories built by hand for the viewer's pixel tests: a few spheres at chosen places in a
// 1000 nm box, written with the project's TrajectoryWriter into a temporary directory.
#include <cmath>
#include <cstdint>
#include <filesystem>
#include <string>
#include <vector>

#include "trajectory/trajectory_data.hpp"
#include "trajectory/trajectory_writer.hpp"

namespace brownfloc::test {

struct PlacedSphere {
    double x_nm, y_nm, z_nm, radius_nm;
    std::uint32_t species = 0;
    std::uint32_t cluster = 0;  // canonical id: the smallest member id
};

inline constexpr double hand_box_nm = 1000.0;
inline constexpr double hand_half_life_s = 0.01;

// A header for these spheres: two species, one pair curve with a barrier of 12 kT at 3 nm
// (a made-up smooth curve, not physics: the viewer only draws it).
inline trajectory::TrajectoryHeader hand_header(const std::vector<PlacedSphere>& spheres) {
    trajectory::TrajectoryHeader header;
    header.box_length_nm = hand_box_nm;
    header.temperature_K = 298.15;
    header.fast_half_life_s = hand_half_life_s;
    header.debye_length_nm = 3.0;
    header.species_names = {"blue latex", "red latex"};
    for (const PlacedSphere& s : spheres) {
        header.radius_nm.push_back(s.radius_nm);
        header.species.push_back(s.species);
    }
    header.scenario_toml = "[run]\nseed = 5\n";
    for (std::uint32_t i = 0; i < 2; ++i)
        for (std::uint32_t j = i; j < 2; ++j) {
            trajectory::PairRecord pair;
            pair.species_i = i;
            pair.species_j = j;
            pair.stability_ratio = 40.0;
            pair.capture_gap_nm = 0.5;
            pair.has_barrier = true;
            pair.barrier_kT = 12.0;
            pair.barrier_gap_nm = 3.0;
            for (int k = 0; k < 512; ++k) {
                const double h = 0.2 + 29.8 * double(k) / 511.0;
                pair.gap_nm.push_back(h);
                // a bump near 3 nm on a weak attraction: U = 12 exp(-((h-3)/1.2)^2) - 1/h
                pair.energy_kT.push_back(12.0 * std::exp(-std::pow((h - 3.0) / 1.2, 2)) - 1.0 / h);
            }
            header.pairs.push_back(pair);
        }
    return header;
}

inline trajectory::TrajectoryFrame hand_frame(const std::vector<PlacedSphere>& spheres, double time_s, std::int64_t step) {
    trajectory::TrajectoryFrame frame;
    frame.step = step;
    frame.time_s = time_s;
    std::vector<std::uint32_t> sizes(spheres.size(), 0);
    for (const PlacedSphere& s : spheres) {
        frame.positions_nm.insert(frame.positions_nm.end(), {s.x_nm, s.y_nm, s.z_nm});
        frame.cluster.push_back(s.cluster);
        ++sizes.at(s.cluster);
    }
    for (std::uint32_t size : sizes) {
        if (size > 0) ++frame.cluster_count;
        frame.largest_cluster = std::max(frame.largest_cluster, size);
    }
    return frame;
}

// Writes dir/trajectory.bftraj with one frame per entry of `frames` (times 0, t1/2, 2 t1/2, ...).
inline void write_hand_run(const std::filesystem::path& dir, const std::vector<std::vector<PlacedSphere>>& frames) {
    std::filesystem::create_directories(dir);
    trajectory::TrajectoryWriter writer =
        trajectory::TrajectoryWriter::create(dir / "trajectory.bftraj", hand_header(frames.front()), true);
    for (std::size_t k = 0; k < frames.size(); ++k)
        writer.append(hand_frame(frames[k], double(k) * hand_half_life_s, std::int64_t(k) * 100));
}

}  // namespace brownfloc::test
