#include "content_rules.hpp"

#include <cmath>
#include <cstdint>
#include <limits>

#include "io_pieces.hpp"
#include "trajectory/trajectory_format.hpp"

namespace brownfloc::trajectory::detail {
namespace {

constexpr std::uint64_t max_string_bytes = std::numeric_limits<std::uint32_t>::max();

std::optional<std::string> unit_problem(std::string_view field, const std::string& value, std::string_view required) {
    if (value == required) return std::nullopt;
    return message(field, " is ", quoted(value), ": format version 1 stores it in \"", required, "\"");
}

std::optional<std::string> positive_finite_problem(std::string_view field, double value) {
    if (std::isfinite(value) && value > 0.0) return std::nullopt;
    return message(field, " = ", value, ": must be finite and > 0");
}

std::optional<std::string> pair_problem(const PairRecord& pair, std::size_t k, std::size_t species_count) {
    const std::string name = message("pairs[", k, "]");
    if (pair.species_i >= species_count || pair.species_j >= species_count)
        return message(name, " joins species ", pair.species_i, " and ", pair.species_j, ": there are ", species_count,
                       " species");
    // W < 1 is physical (van der Waals attraction speeds collisions up); +inf means no barrier
    // crossing at all. Only NaN, zero and negative values are meaningless.
    if (!(pair.stability_ratio > 0.0)) return message(name, ".stability_ratio = ", pair.stability_ratio, ": must be > 0");
    if (!std::isfinite(pair.capture_gap_nm) || pair.capture_gap_nm < 0.0)
        return message(name, ".capture_gap_nm = ", pair.capture_gap_nm, ": must be finite and >= 0");
    if (!std::isfinite(pair.barrier_kT)) return message(name, ".barrier_kT = ", pair.barrier_kT, ": must be finite");
    if (!std::isfinite(pair.barrier_gap_nm))
        return message(name, ".barrier_gap_nm = ", pair.barrier_gap_nm, ": must be finite");
    if (pair.gap_nm.size() != pair.energy_kT.size())
        return message(name, " has ", pair.gap_nm.size(), " gap_nm values but ", pair.energy_kT.size(),
                       " energy_kT values: the curve needs as many of each");
    for (std::size_t i = 0; i < pair.gap_nm.size(); ++i) {
        if (!std::isfinite(pair.gap_nm[i])) return message(name, ".gap_nm[", i, "] = ", pair.gap_nm[i], ": must be finite");
        if (i > 0 && !(pair.gap_nm[i] > pair.gap_nm[i - 1]))
            return message(name, ".gap_nm[", i, "] = ", pair.gap_nm[i], ": must be greater than gap_nm[", i - 1, "] = ",
                           pair.gap_nm[i - 1]);
        if (!std::isfinite(pair.energy_kT[i]))
            return message(name, ".energy_kT[", i, "] = ", pair.energy_kT[i], ": must be finite");
    }
    return std::nullopt;
}

}  // namespace

std::optional<std::string> header_problem(const TrajectoryHeader& header) {
    if (auto problem = unit_problem("length_unit", header.length_unit, format::length_unit)) return problem;
    if (auto problem = unit_problem("time_unit", header.time_unit, format::time_unit)) return problem;
    if (auto problem = unit_problem("energy_unit", header.energy_unit, format::energy_unit)) return problem;
    if (auto problem = positive_finite_problem("box_length_nm", header.box_length_nm)) return problem;
    if (auto problem = positive_finite_problem("temperature_K", header.temperature_K)) return problem;
    if (auto problem = positive_finite_problem("fast_half_life_s", header.fast_half_life_s)) return problem;
    if (auto problem = positive_finite_problem("debye_length_nm", header.debye_length_nm)) return problem;

    const std::size_t species_count = header.species_names.size();
    if (species_count == 0) return std::string{"species_names is empty: a trajectory needs at least one species"};
    for (std::size_t s = 0; s < species_count; ++s) {
        if (header.species_names[s].empty()) return message("species_names[", s, "] is empty");
        if (header.species_names[s].size() > max_string_bytes)
            return message("species_names[", s, "] is longer than 2^32 - 1 bytes");
    }
    if (header.scenario_toml.size() > max_string_bytes)
        return message("scenario_toml has ", header.scenario_toml.size(), " bytes, more than 2^32 - 1");

    const std::size_t n = header.radius_nm.size();
    if (n == 0) return std::string{"radius_nm is empty: a trajectory needs at least one particle"};
    // Cluster ids are u32 and must be < N, so N itself must fit below 2^32.
    if (n > std::numeric_limits<std::uint32_t>::max()) return message(n, " particles: at most 2^32 - 1 fit the format");
    if (header.species.size() != n)
        return message("species has ", header.species.size(), " entries, radius_nm ", n, ": one of each per particle");
    for (std::size_t i = 0; i < n; ++i) {
        if (auto problem = positive_finite_problem(message("radius_nm[", i, "]"), header.radius_nm[i])) return problem;
        if (header.species[i] >= species_count)
            return message("species[", i, "] = ", header.species[i], ": there are ", species_count, " species");
    }
    for (std::size_t k = 0; k < header.pairs.size(); ++k)
        if (auto problem = pair_problem(header.pairs[k], k, species_count)) return problem;
    return std::nullopt;
}

std::optional<std::string> frame_problem(const TrajectoryFrame& frame, const FrameShape& shape) {
    const std::size_t n = shape.particle_count;
    if (frame.positions_nm.size() != 3 * n)
        return message("positions_nm has ", frame.positions_nm.size(), " values: 3 N = ", 3 * n, " are needed");
    if (frame.cluster.size() != n) return message("cluster has ", frame.cluster.size(), " entries: N = ", n, " are needed");
    if (frame.spanning_clusters.size() > n)
        return message(frame.spanning_clusters.size(), " spanning clusters: there cannot be more than N = ", n);
    if (!std::isfinite(frame.time_s)) return message("time_s = ", frame.time_s, ": must be finite");

    // float32 storage: a double beyond FLT_MAX would become inf (converting it is even undefined
    // behaviour in C++), so it is refused rather than stored.
    const double largest_storable = shape.positions_float64 ? std::numeric_limits<double>::max()
                                                            : static_cast<double>(std::numeric_limits<float>::max());
    for (std::size_t i = 0; i < frame.positions_nm.size(); ++i) {
        const double x = frame.positions_nm[i];
        if (!std::isfinite(x) || std::fabs(x) > largest_storable)
            return message("positions_nm[", i, "] (particle ", i / 3, ", ", "xyz"[i % 3], ") = ", x,
                           shape.positions_float64 ? ": must be finite" : ": must be finite and fit in float32");
    }
    for (std::size_t i = 0; i < n; ++i)
        if (frame.cluster[i] >= n) return message("cluster[", i, "] = ", frame.cluster[i], ": must be < N = ", n);
    for (std::size_t k = 0; k < frame.spanning_clusters.size(); ++k)
        if (frame.spanning_clusters[k] >= n)
            return message("spanning_clusters[", k, "] = ", frame.spanning_clusters[k], ": must be < N = ", n);
    if (frame.cluster_count > n) return message("cluster_count = ", frame.cluster_count, ": must be <= N = ", n);
    if (frame.largest_cluster > n) return message("largest_cluster = ", frame.largest_cluster, ": must be <= N = ", n);
    return std::nullopt;
}

}  // namespace brownfloc::trajectory::detail
