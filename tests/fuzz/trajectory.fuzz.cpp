// libFuzzer target: arbitrary bytes as a trajectory file, read twice: as they are, and with
// every CRC the layout lets us find re-sealed, as a deliberate forger would (random mutations
// almost never get past a CRC, so without this the decoders behind them would go unexplored).
// The reader must either refuse the bytes with TrajectoryFormatError or index them, and every
// indexed frame must then decode and obey the format's rules. Any other exception, any
// sanitizer report, or a frame that breaks a rule is a finding; run with -malloc_limit_mb=16
// to make any large single allocation one too.
// Build: cmake --preset fuzz && cmake --build --preset fuzz; run: build-fuzz/bin/trajectory_fuzz
// -max_total_time=60 -malloc_limit_mb=16 CORPUS_DIR, seeded with tests/trajectory/data/.
#include <cmath>
#include <cstddef>
#include <cstdint>
#include <cstdlib>
#include <span>
#include <vector>

#include "trajectory/crc32c.hpp"
#include "trajectory/trajectory_error.hpp"
#include "trajectory/trajectory_reader.hpp"

namespace {

using namespace brownfloc::trajectory;

std::uint64_t load_u64(const std::vector<std::byte>& bytes, std::size_t at) {
    std::uint64_t value = 0;
    for (std::size_t i = 0; i < 8; ++i) value |= std::to_integer<std::uint64_t>(bytes[at + i]) << (8 * i);
    return value;
}

void store_u32(std::vector<std::byte>& bytes, std::size_t at, std::uint32_t value) {
    for (std::size_t i = 0; i < 4; ++i) bytes[at + i] = static_cast<std::byte>((value >> (8 * i)) & 0xFFu);
}

// Recomputes the CRCs of the file header and of each frame reached by following the stored
// lengths (layout in trajectory/trajectory_format.hpp).
void reseal(std::vector<std::byte>& bytes) {
    const std::span<const std::byte> all{bytes};
    if (bytes.size() < 32) return;
    const std::uint64_t header_payload = load_u64(bytes, 16);
    if (header_payload > bytes.size() - 32) return;
    store_u32(bytes, 24, crc32c(all.subspan(32, header_payload)));
    store_u32(bytes, 28, crc32c(all.first(28)));
    std::size_t at = 32 + header_payload;
    while (bytes.size() - at >= 32) {
        const std::uint64_t payload = load_u64(bytes, at + 16);
        if (payload > bytes.size() - at - 32) return;
        store_u32(bytes, at + 24, crc32c(all.subspan(at + 32, payload)));
        store_u32(bytes, at + 28, crc32c(all.subspan(at, 28)));
        at += 32 + payload;
    }
}

void read_everything(std::span<const std::byte> bytes) {
    try {
        const TrajectoryReader reader = TrajectoryReader::from_bytes(bytes, "fuzz.bftraj");
        const std::size_t n = reader.particle_count();
        if (n == 0 || reader.header().radius_nm.size() != n) std::abort();
        double previous_time_s = -INFINITY;
        std::uint64_t previous_number = 0;
        for (std::size_t k = 0; k < reader.frame_count(); ++k) {
            const TrajectoryFrame frame = reader.read_frame(k);
            if (frame.positions_nm.size() != 3 * n || frame.cluster.size() != n) std::abort();
            for (const double x : frame.positions_nm)
                if (!std::isfinite(x)) std::abort();
            for (const std::uint32_t id : frame.cluster)
                if (id >= n) std::abort();
            if (!(frame.time_s >= previous_time_s)) std::abort();
            if (k > 0 && reader.frame_info(k).frame_number <= previous_number) std::abort();
            previous_time_s = frame.time_s;
            previous_number = reader.frame_info(k).frame_number;
        }
        (void)reader.warnings();
    } catch (const TrajectoryFormatError&) {
    }
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const std::span<const std::byte> bytes = std::as_bytes(std::span{data, size});
    read_everything(bytes);
    std::vector<std::byte> resealed(bytes.begin(), bytes.end());
    reseal(resealed);
    read_everything(resealed);
    return 0;
}
