#include "payload_codec.hpp"

#include <bit>

#include "io_pieces.hpp"
#include "content_rules.hpp"

namespace brownfloc::trajectory::detail {
namespace {

// The fewest bytes a pair record can take (both curves empty): u32 u32 f64 f64 u8 f64 f64 u64 u64.
constexpr std::size_t min_pair_record_bytes = 4 + 4 + 8 + 8 + 1 + 8 + 8 + 8 + 8;

PairRecord read_pair(ByteReader& in, const std::string& name) {
    PairRecord pair;
    pair.species_i = in.u32(message(name, ".species_i"));
    pair.species_j = in.u32(message(name, ".species_j"));
    pair.stability_ratio = in.f64(message(name, ".stability_ratio"));
    pair.capture_gap_nm = in.f64(message(name, ".capture_gap_nm"));
    pair.has_barrier = in.boolean(message(name, ".has_barrier"));
    pair.barrier_kT = in.f64(message(name, ".barrier_kT"));
    pair.barrier_gap_nm = in.f64(message(name, ".barrier_gap_nm"));
    pair.gap_nm = in.f64_array(message(name, ".gap_nm"));
    pair.energy_kT = in.f64_array(message(name, ".energy_kT"));
    return pair;
}

}  // namespace

void encode_header_payload(const TrajectoryHeader& header, std::vector<std::byte>& out) {
    ByteWriter put{out};
    put.string(header.length_unit);
    put.string(header.time_unit);
    put.string(header.energy_unit);
    put.f64(header.box_length_nm);
    put.f64(header.temperature_K);
    put.f64(header.fast_half_life_s);
    put.f64(header.debye_length_nm);
    put.u64(header.species_names.size());
    for (const std::string& name : header.species_names) put.string(name);
    put.f64_array(header.radius_nm);
    put.u32_array(header.species);
    put.string(header.scenario_toml);
    put.u64(header.pairs.size());
    for (const PairRecord& pair : header.pairs) {
        put.u32(pair.species_i);
        put.u32(pair.species_j);
        put.f64(pair.stability_ratio);
        put.f64(pair.capture_gap_nm);
        put.u8(pair.has_barrier ? 1 : 0);
        put.f64(pair.barrier_kT);
        put.f64(pair.barrier_gap_nm);
        put.f64_array(pair.gap_nm);
        put.f64_array(pair.energy_kT);
    }
}

TrajectoryHeader decode_header_payload(std::span<const std::byte> bytes, std::uint64_t base_offset,
                                       const std::string& source) {
    ByteReader in = trajectory_byte_reader(bytes, base_offset, source, "header payload");
    TrajectoryHeader header;
    header.length_unit = in.string("length_unit");
    header.time_unit = in.string("time_unit");
    header.energy_unit = in.string("energy_unit");
    header.box_length_nm = in.f64("box_length_nm");
    header.temperature_K = in.f64("temperature_K");
    header.fast_half_life_s = in.f64("fast_half_life_s");
    header.debye_length_nm = in.f64("debye_length_nm");
    // Each count is checked against the bytes left (at the smallest size of one item) before
    // anything is reserved, so a claimed 2^60 costs nothing.
    const std::size_t species_count = in.count("species_names", 4);
    header.species_names.reserve(species_count);
    for (std::size_t s = 0; s < species_count; ++s) header.species_names.push_back(in.string(message("species_names[", s, "]")));
    header.radius_nm = in.f64_array("radius_nm");
    header.species = in.u32_array("species");
    header.scenario_toml = in.string("scenario_toml");
    const std::size_t pair_count = in.count("pairs", min_pair_record_bytes);
    header.pairs.reserve(pair_count);
    for (std::size_t k = 0; k < pair_count; ++k) header.pairs.push_back(read_pair(in, message("pairs[", k, "]")));
    if (in.remaining() != 0)
        in.fail(in.offset(), message(in.remaining(), " unexpected bytes after the last pair record, where the header payload "
                                                     "should end"));
    if (auto problem = header_problem(header)) in.fail(base_offset, message("header payload: ", *problem));
    return header;
}

void encode_frame_payload(const TrajectoryFrame& frame, const FrameShape& shape, std::vector<std::byte>& out) {
    ByteWriter put{out};
    put.i64(frame.step);
    put.f64(frame.time_s);
    const std::size_t values = frame.positions_nm.size();
    if (shape.positions_float64) {
        std::byte* at = put.grow(8 * values);
        for (std::size_t i = 0; i < values; ++i) store_u64(at + 8 * i, std::bit_cast<std::uint64_t>(frame.positions_nm[i]));
    } else {
        std::byte* at = put.grow(4 * values);
        for (std::size_t i = 0; i < values; ++i)
            store_u32(at + 4 * i, std::bit_cast<std::uint32_t>(static_cast<float>(frame.positions_nm[i])));
    }
    put.u32_items(frame.cluster);
    put.u32_array(frame.spanning_clusters);
    put.u32(frame.cluster_count);
    put.u32(frame.largest_cluster);
}

void decode_frame_payload(std::span<const std::byte> bytes, const FrameShape& shape, std::uint64_t base_offset,
                          const std::string& source, TrajectoryFrame& into) {
    ByteReader in = trajectory_byte_reader(bytes, base_offset, source, "frame payload");
    const std::size_t n = shape.particle_count;
    into.step = in.i64("step");
    into.time_s = in.f64("time_s");
    into.positions_nm.resize(3 * n);
    if (shape.positions_float64) {
        const std::byte* at = in.take(8 * 3 * n, "positions_nm");
        for (std::size_t i = 0; i < 3 * n; ++i) into.positions_nm[i] = std::bit_cast<double>(load_u64(at + 8 * i));
    } else {
        const std::byte* at = in.take(4 * 3 * n, "positions_nm");
        for (std::size_t i = 0; i < 3 * n; ++i)
            into.positions_nm[i] = static_cast<double>(std::bit_cast<float>(load_u32(at + 4 * i)));
    }
    into.cluster = in.u32_items(n, "cluster");
    const std::uint64_t count_at = in.offset();
    const std::size_t spanning = in.count("spanning_clusters", 4);
    if (spanning > n) in.fail(count_at, message(spanning, " spanning clusters: there cannot be more than N = ", n));
    into.spanning_clusters = in.u32_items(spanning, "spanning_clusters");
    into.cluster_count = in.u32("cluster_count");
    into.largest_cluster = in.u32("largest_cluster");
    if (in.remaining() != 0)
        in.fail(in.offset(), message(in.remaining(), " unexpected bytes after largest_cluster, where the frame payload should end"));
    if (auto problem = frame_problem(into, shape)) in.fail(base_offset, *problem);
}

}  // namespace brownfloc::trajectory::detail
