#pragma once
// What a trajectory file holds, as plain data (fixed-width integers, double, std::vector), so
// that the viewer links it without Eigen, OpenMP or physics. The byte layout is in
// trajectory/trajectory_format.hpp; the rules each value must meet are listed there too and
// checked by both TrajectoryWriter (std::invalid_argument) and TrajectoryReader.
#include <cstdint>
#include <string>
#include <vector>

namespace brownfloc::trajectory {

// One species pair's interaction, for plots beside the scene.
struct PairRecord {
    std::uint32_t species_i = 0, species_j = 0;  // indices into TrajectoryHeader::species_names
    double stability_ratio = 1.0;                // Fuchs W; +inf where the barrier stops aggregation
    double capture_gap_nm = 0.0;                 // surface gap at which two particles bond
    bool has_barrier = false;
    double barrier_kT = 0.0, barrier_gap_nm = 0.0;  // 0 when has_barrier is false
    std::vector<double> gap_nm, energy_kT;          // the pair energy curve (the app writes 512 samples)

    bool operator==(const PairRecord&) const = default;
};

// Written once at the start of the file; particle count N = radius_nm.size().
struct TrajectoryHeader {
    // Units of the stored numbers; format version 1 accepts exactly these.
    std::string length_unit = "nm", time_unit = "s", energy_unit = "kT";
    double box_length_nm = 0.0;     // edge of the periodic cubic box
    double temperature_K = 0.0;
    double fast_half_life_s = 0.0;  // Smoluchowski half-life without a barrier: the natural time unit
    double debye_length_nm = 0.0;
    std::vector<std::string> species_names;
    std::vector<double> radius_nm;        // per particle
    std::vector<std::uint32_t> species;   // per particle, index into species_names
    std::string scenario_toml;            // the resolved scenario text
    std::vector<PairRecord> pairs;

    bool operator==(const TrajectoryHeader&) const = default;
};

// One snapshot of the run.
struct TrajectoryFrame {
    std::int64_t step = 0;
    double time_s = 0.0;
    std::vector<double> positions_nm;  // 3N: x, y, z per particle, each cluster stored whole
    std::vector<std::uint32_t> cluster;  // N: canonical cluster id = smallest member id
    std::vector<std::uint32_t> spanning_clusters;  // ids of clusters that span the periodic box
    std::uint32_t cluster_count = 0, largest_cluster = 0;  // largest_cluster in particles

    bool operator==(const TrajectoryFrame&) const = default;
};

}  // namespace brownfloc::trajectory
