#include "sim/checkpoint.hpp"

#include <algorithm>
#include <cmath>
#include <fstream>
#include <iterator>

#include "io/atomic_file.hpp"
#include "io/byte_packing.hpp"
#include "io/byte_reader.hpp"
#include "io/file_reading.hpp"
#include "io/message_text.hpp"
#include "sha256.hpp"
#include "trajectory/crc32c.hpp"

namespace brownfloc::sim {

namespace {

constexpr char magic[8] = {'B', 'F', 'L', 'O', 'C', 'C', 'K', 'P'};
constexpr std::uint32_t format_version = 1;
constexpr std::uint32_t section_count = 3;
constexpr std::uint32_t tag_identity = 1, tag_state = 2, tag_bookkeeping = 3;
constexpr std::size_t section_header_bytes = 20;
constexpr std::uint64_t max_file_bytes = std::uint64_t{16} << 30;
constexpr std::uint32_t no_member = 0xFFFFFFFFu;

[[noreturn]] void throw_checkpoint_error(const std::string& source, std::uint64_t offset_bytes, const std::string& problem) {
    throw CheckpointFormatError(io::located(source, offset_bytes, problem));
}

// --- writing ---

void put_f64s(io::ByteWriter& w, const std::vector<double>& v) { w.f64_array(v); }
void put_u32s(io::ByteWriter& w, const std::vector<std::uint32_t>& v) { w.u32_array(v); }
void put_i64s(io::ByteWriter& w, const std::vector<std::int64_t>& v) {
    w.u64(v.size());
    for (const std::int64_t x : v) w.i64(x);
}
void put_u8s(io::ByteWriter& w, const std::vector<std::uint8_t>& v) {
    w.u64(v.size());
    for (const std::uint8_t x : v) w.u8(x);
}

void put_engine(io::ByteWriter& w, const EngineState& s) {
    w.u64(s.seed);
    w.i64(s.step);
    w.i64(s.bonded_at_start);
    w.i64(s.list_builds);
    w.i64(s.first_spanning_step);
    w.f64(s.box_length_m);
    w.f64(s.max_member_diffusion_m2_per_s);
    w.f64(s.min_relative_gap_last_step);
    w.f64(s.min_relative_gap_ever);
    for (const auto* v : {&s.x_m, &s.y_m, &s.z_m}) put_f64s(w, *v);
    for (const auto* v : {&s.body, &s.species, &s.next_member}) put_u32s(w, *v);
    put_f64s(w, s.radius_m);
    for (const auto* v : {&s.list_x_m, &s.list_y_m, &s.list_z_m, &s.offset_x_m, &s.offset_y_m, &s.offset_z_m,
                          &s.centre_x_m, &s.centre_y_m, &s.centre_z_m})
        put_f64s(w, *v);
    put_u32s(w, s.body_size);
    for (const auto* v : {&s.diffusion_t_m2_per_s, &s.diffusion_r_per_s, &s.hydrodynamic_radius_m, &s.amplitude_t_m,
                          &s.amplitude_r, &s.mobility_t_m_per_N, &s.mobility_r_per_N_m})
        put_f64s(w, *v);
    put_u8s(w, s.spans_box);
    put_u32s(w, s.bodies);
    w.u64(s.captures.size());
    for (const CaptureEvent& c : s.captures) {
        w.i64(c.step);
        for (const std::uint32_t x : {c.particle_i, c.particle_j, c.body_i, c.body_j, c.size_i, c.size_j}) w.u32(x);
        w.u8(c.by_bridge ? 1 : 0);
    }
}

void put_recorder(io::ByteWriter& w, const RecorderState& s) {
    w.u64(s.counts.size());
    for (const CountSample& c : s.counts) {
        w.f64(c.time_s);
        w.i64(c.clusters);
    }
    w.u8(s.in_window ? 1 : 0);
    w.u64(s.captures_seen);
    put_i64s(w, s.monomers);
    put_i64s(w, s.pair_events);
    put_f64s(w, s.pair_exposure);
    w.f64(s.last_time_s);
    for (const std::int64_t x : {s.last.clusters, s.last.monomers, s.last.doublets, s.last.triplets, s.last.largest}) w.i64(x);
    w.f64(s.last.mean_size);
    w.f64(s.last.weight_mean_size);
    w.u8(s.last_geometric ? 1 : 0);
    w.i64(s.last_geometric.value_or(0));
}

void put_section(std::vector<std::byte>& out, std::uint32_t tag, const std::vector<std::byte>& payload) {
    std::byte header[section_header_bytes];
    io::store_u32(header, tag);
    io::store_u64(header + 4, payload.size());
    io::store_u32(header + 12, trajectory::crc32c(payload));
    io::store_u32(header + 16, trajectory::crc32c(std::span<const std::byte>(header, 16)));
    out.insert(out.end(), header, header + section_header_bytes);
    out.insert(out.end(), payload.begin(), payload.end());
}

// --- reading ---

std::vector<std::int64_t> get_i64s(io::ByteReader& r, std::string_view field) {
    const std::size_t n = r.count(field, 8);
    std::vector<std::int64_t> v(n);
    for (std::int64_t& x : v) x = r.i64(field);
    return v;
}

EngineState get_engine(io::ByteReader& r) {
    EngineState s;
    s.seed = r.u64("seed");
    s.step = r.i64("step");
    s.bonded_at_start = r.i64("bonded_at_start");
    s.list_builds = r.i64("list_builds");
    s.first_spanning_step = r.i64("first_spanning_step");
    s.box_length_m = r.f64("box length");
    s.max_member_diffusion_m2_per_s = r.f64("largest member diffusion");
    s.min_relative_gap_last_step = r.f64("smallest gap of the last step");
    s.min_relative_gap_ever = r.f64("smallest gap");
    s.x_m = r.f64_array("x");
    s.y_m = r.f64_array("y");
    s.z_m = r.f64_array("z");
    s.body = r.u32_array("body");
    s.species = r.u32_array("species");
    s.next_member = r.u32_array("next member");
    s.radius_m = r.f64_array("radius");
    s.list_x_m = r.f64_array("list x");
    s.list_y_m = r.f64_array("list y");
    s.list_z_m = r.f64_array("list z");
    s.offset_x_m = r.f64_array("offset x");
    s.offset_y_m = r.f64_array("offset y");
    s.offset_z_m = r.f64_array("offset z");
    s.centre_x_m = r.f64_array("centre x");
    s.centre_y_m = r.f64_array("centre y");
    s.centre_z_m = r.f64_array("centre z");
    s.body_size = r.u32_array("body size");
    s.diffusion_t_m2_per_s = r.f64_array("translational diffusion");
    s.diffusion_r_per_s = r.f64_array("rotational diffusion");
    s.hydrodynamic_radius_m = r.f64_array("hydrodynamic radius");
    s.amplitude_t_m = r.f64_array("translational amplitude");
    s.amplitude_r = r.f64_array("rotational amplitude");
    s.mobility_t_m_per_N = r.f64_array("translational mobility");
    s.mobility_r_per_N_m = r.f64_array("rotational mobility");
    const std::size_t spans = r.count("spans_box", 1);
    s.spans_box.resize(spans);
    for (std::uint8_t& x : s.spans_box) x = r.boolean("spans_box") ? 1 : 0;
    s.bodies = r.u32_array("bodies");
    const std::size_t captures = r.count("captures", 33);
    s.captures.resize(captures);
    for (CaptureEvent& c : s.captures) {
        c.step = r.i64("capture step");
        c.particle_i = r.u32("capture particle");
        c.particle_j = r.u32("capture particle");
        c.body_i = r.u32("capture body");
        c.body_j = r.u32("capture body");
        c.size_i = r.u32("capture size");
        c.size_j = r.u32("capture size");
        c.by_bridge = r.boolean("capture by bridge");
    }
    return s;
}

RecorderState get_recorder(io::ByteReader& r) {
    RecorderState s;
    const std::size_t counts = r.count("cluster counts", 16);
    s.counts.resize(counts);
    for (CountSample& c : s.counts) {
        c.time_s = r.f64("count time");
        c.clusters = r.i64("count");
    }
    s.in_window = r.boolean("in rate window");
    s.captures_seen = r.u64("captures seen");
    s.monomers = get_i64s(r, "monomers");
    s.pair_events = get_i64s(r, "pair events");
    s.pair_exposure = r.f64_array("pair exposure");
    s.last_time_s = r.f64("last time");
    s.last.clusters = r.i64("clusters");
    s.last.monomers = r.i64("monomers");
    s.last.doublets = r.i64("doublets");
    s.last.triplets = r.i64("triplets");
    s.last.largest = r.i64("largest");
    s.last.mean_size = r.f64("mean size");
    s.last.weight_mean_size = r.f64("weight mean size");
    const bool geometric = r.boolean("geometric clusters known");
    const std::int64_t g = r.i64("geometric clusters");
    if (geometric) s.last_geometric = g;
    return s;
}

// Every rule a state must meet that does not need the model (the Engine checks the rest).
void check_engine(const EngineState& s, const std::string& source, std::uint64_t offset) {
    auto fail = [&](const std::string& problem) { throw_checkpoint_error(source, offset, io::message("state: ", problem)); };
    const std::size_t n = s.radius_m.size();
    if (n == 0) fail("no particles");
    for (const std::size_t size : {s.x_m.size(), s.y_m.size(), s.z_m.size(), s.body.size(), s.species.size(),
                                   s.next_member.size(), s.list_x_m.size(), s.list_y_m.size(), s.list_z_m.size(),
                                   s.offset_x_m.size(), s.offset_y_m.size(), s.offset_z_m.size(), s.centre_x_m.size(),
                                   s.centre_y_m.size(), s.centre_z_m.size(), s.body_size.size(),
                                   s.diffusion_t_m2_per_s.size(), s.diffusion_r_per_s.size(),
                                   s.hydrodynamic_radius_m.size(), s.amplitude_t_m.size(), s.amplitude_r.size(),
                                   s.mobility_t_m_per_N.size(), s.mobility_r_per_N_m.size(), s.spans_box.size()})
        if (size != n) fail(io::message("an array of ", size, " entries for ", n, " particles"));
    if (!(std::isfinite(s.box_length_m) && s.box_length_m > 0)) fail(io::message("box length ", s.box_length_m));
    if (s.step < 0) fail(io::message("step ", s.step));
    std::uint64_t members = 0;
    for (std::size_t i = 0; i < n; ++i) {
        for (const double c : {s.x_m[i], s.y_m[i], s.z_m[i]})
            if (!(c >= 0 && c < s.box_length_m)) fail(io::message("particle ", i, ": coordinate ", c, " outside the box"));
        for (const double v : {s.list_x_m[i], s.list_y_m[i], s.list_z_m[i], s.offset_x_m[i], s.offset_y_m[i], s.offset_z_m[i],
                               s.centre_x_m[i], s.centre_y_m[i], s.centre_z_m[i], s.diffusion_t_m2_per_s[i],
                               s.diffusion_r_per_s[i], s.hydrodynamic_radius_m[i], s.amplitude_t_m[i], s.amplitude_r[i],
                               s.mobility_t_m_per_N[i], s.mobility_r_per_N_m[i]})
            if (!std::isfinite(v)) fail(io::message("particle ", i, ": a non-finite value"));
        if (!(s.radius_m[i] > 0 && std::isfinite(s.radius_m[i]))) fail(io::message("particle ", i, ": radius ", s.radius_m[i]));
        if (s.body[i] > i || s.body[s.body[i]] != s.body[i]) fail(io::message("particle ", i, ": body ", s.body[i]));
        if (s.next_member[i] != no_member && (s.next_member[i] <= i || s.next_member[i] >= n))
            fail(io::message("particle ", i, ": next member ", s.next_member[i]));
    }
    std::uint32_t previous = 0;
    for (std::size_t k = 0; k < s.bodies.size(); ++k) {
        const std::uint32_t b = s.bodies[k];
        if (b >= n || (k > 0 && b <= previous) || s.body[b] != b) fail(io::message("body list entry ", k, ": ", b));
        previous = b;
        // Walk the member list: ids rise, so at most n links.
        std::uint64_t count = 0;
        for (std::uint32_t m = b; m != no_member; m = s.next_member[m]) {
            if (s.body[m] != b) fail(io::message("body ", b, ": member ", m, " belongs to body ", s.body[m]));
            ++count;
        }
        if (count != s.body_size[b]) fail(io::message("body ", b, ": ", count, " members listed, size ", s.body_size[b]));
        members += count;
    }
    if (members != n) fail(io::message("the bodies hold ", members, " particles of ", n));
    for (const CaptureEvent& c : s.captures)
        if (c.particle_i >= n || c.particle_j >= n || c.body_i >= n || c.body_j >= n)
            fail("a capture names a particle beyond the count");
}

struct Section {
    std::span<const std::byte> payload;
    std::uint64_t offset = 0;  // of the payload in the file
};

Section take_section(std::span<const std::byte> bytes, std::uint64_t& at, std::uint32_t tag, const std::string& source) {
    if (bytes.size() - at < section_header_bytes)
        throw_checkpoint_error(source, at, io::message("the file ends inside the header of section ", tag));
    const std::byte* h = bytes.data() + at;
    if (trajectory::crc32c(std::span<const std::byte>(h, 16)) != io::load_u32(h + 16))
        throw_checkpoint_error(source, at, io::message("section ", tag, ": header CRC mismatch (damaged file)"));
    if (io::load_u32(h) != tag)
        throw_checkpoint_error(source, at, io::message("section ", io::load_u32(h), " where section ", tag, " belongs"));
    const std::uint64_t length = io::load_u64(h + 4);
    if (length > bytes.size() - at - section_header_bytes)
        throw_checkpoint_error(source, at, io::message("section ", tag, " claims ", length, " bytes, the file has ",
                                                       bytes.size() - at - section_header_bytes, " left"));
    const Section s{bytes.subspan(at + section_header_bytes, length), at + section_header_bytes};
    if (trajectory::crc32c(s.payload) != io::load_u32(h + 12))
        throw_checkpoint_error(source, s.offset, io::message("section ", tag, ": payload CRC mismatch (damaged file)"));
    at += section_header_bytes + length;
    return s;
}

void expect_end(io::ByteReader& r, const std::string& source) {
    if (r.remaining() != 0) throw_checkpoint_error(source, r.offset(), io::message(r.remaining(), " unexpected bytes"));
}

}  // namespace

std::vector<std::byte> encode_checkpoint_state(const Checkpoint& c) {
    std::vector<std::byte> out;
    io::ByteWriter w(out);
    put_engine(w, c.engine);
    put_recorder(w, c.recorder);
    for (const std::uint64_t x : {c.next_output, c.next_snapshot, c.files.trajectory_bytes, c.files.trajectory_frames,
                                  c.files.timeseries_bytes, c.files.timeseries_rows, c.files.size_distribution_bytes,
                                  c.files.size_distribution_rows})
        w.u64(x);
    return out;
}

std::vector<std::byte> encode_checkpoint(const Checkpoint& c) {
    std::vector<std::byte> out;
    {
        io::ByteWriter w(out);
        for (const char ch : magic) w.u8(static_cast<std::uint8_t>(ch));
        w.u32(format_version);
        w.u32(section_count);
    }
    std::vector<std::byte> identity;
    {
        io::ByteWriter w(identity);
        w.string(c.build_id);
        w.string(c.scenario_toml);
        w.u64(c.seed);
    }
    put_section(out, tag_identity, identity);
    put_section(out, tag_state, encode_checkpoint_state(c));
    std::vector<std::byte> book;
    {
        io::ByteWriter w(book);
        w.f64(c.wall_time_s);
        w.i64(c.resumes);
        w.u8(c.complete ? 1 : 0);
    }
    put_section(out, tag_bookkeeping, book);
    return out;
}

Checkpoint decode_checkpoint(std::span<const std::byte> bytes, const std::string& source) {
    if (bytes.size() < 16) throw_checkpoint_error(source, 0, "too short to be a checkpoint");
    for (int k = 0; k < 8; ++k)
        if (std::to_integer<char>(bytes[std::size_t(k)]) != magic[k])
            throw_checkpoint_error(source, 0, "not a brownfloc checkpoint (no BFLOCCKP magic)");
    if (const std::uint32_t v = io::load_u32(bytes.data() + 8); v != format_version)
        throw_checkpoint_error(source, 8, io::message("format version ", v, "; this build reads version ", format_version));
    if (const std::uint32_t n = io::load_u32(bytes.data() + 12); n != section_count)
        throw_checkpoint_error(source, 12, io::message(n, " sections; version 1 has ", section_count));
    std::uint64_t at = 16;
    Checkpoint c;
    const Section identity = take_section(bytes, at, tag_identity, source);
    {
        io::ByteReader r(identity.payload, identity.offset, source, "identity section", &throw_checkpoint_error);
        c.build_id = r.string("build id");
        c.scenario_toml = r.string("scenario");
        c.seed = r.u64("seed");
        expect_end(r, source);
    }
    const Section state = take_section(bytes, at, tag_state, source);
    {
        io::ByteReader r(state.payload, state.offset, source, "state section", &throw_checkpoint_error);
        c.engine = get_engine(r);
        check_engine(c.engine, source, state.offset);
        c.recorder = get_recorder(r);
        c.next_output = r.u64("next output");
        c.next_snapshot = r.u64("next snapshot");
        c.files.trajectory_bytes = r.u64("trajectory bytes");
        c.files.trajectory_frames = r.u64("trajectory frames");
        c.files.timeseries_bytes = r.u64("timeseries bytes");
        c.files.timeseries_rows = r.u64("timeseries rows");
        c.files.size_distribution_bytes = r.u64("size distribution bytes");
        c.files.size_distribution_rows = r.u64("size distribution rows");
        expect_end(r, source);
    }
    const Section book = take_section(bytes, at, tag_bookkeeping, source);
    {
        io::ByteReader r(book.payload, book.offset, source, "bookkeeping section", &throw_checkpoint_error);
        c.wall_time_s = r.f64("wall time");
        c.resumes = r.i64("resumes");
        c.complete = r.boolean("complete");
        expect_end(r, source);
        if (!(std::isfinite(c.wall_time_s) && c.wall_time_s >= 0) || c.resumes < 0)
            throw_checkpoint_error(source, book.offset, "bookkeeping: wall time or resume count out of range");
    }
    if (at != bytes.size()) throw_checkpoint_error(source, at, io::message(bytes.size() - at, " bytes after the last section"));
    return c;
}

Checkpoint read_checkpoint(const std::filesystem::path& path) {
    io::ReadableFile file = io::open_for_reading(path);
    if (file.size_bytes > max_file_bytes)
        throw_checkpoint_error(path.string(), 0, io::message("a checkpoint of ", file.size_bytes, " bytes is beyond any run"));
    std::vector<std::byte> bytes(static_cast<std::size_t>(file.size_bytes));
    io::pread_exact(file.fd.get(), 0, bytes, path);
    return decode_checkpoint(bytes, path.string());
}

void write_checkpoint(const std::filesystem::path& path, const Checkpoint& checkpoint) {
    io::write_file_atomically(path, encode_checkpoint(checkpoint));
}

const std::string& build_id() {
    static const std::string id = [] {
        std::ifstream exe("/proc/self/exe", std::ios::binary);
        if (!exe) return std::string("unknown");
        const std::string bytes((std::istreambuf_iterator<char>(exe)), std::istreambuf_iterator<char>());
        return bytes.empty() ? std::string("unknown") : sha256_hex(bytes);
    }();
    return id;
}

}  // namespace brownfloc::sim
