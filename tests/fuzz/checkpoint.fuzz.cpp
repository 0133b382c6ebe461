// libFuzzer target: arbitrary bytes as a checkpoint file, decoded as they are and with the
// section CRCs re-sealed (as a forger would; random mutations almost never pass a CRC, so
// without this the decoders behind them would go unexplored). The decoder must either refuse
// the bytes with CheckpointFormatError or return a state that passed every check; any other
// exception or sanitizer report is a finding. Run with -malloc_limit_mb=64.
// Build: cmake --preset fuzz && cmake --build --preset fuzz; run: build-fuzz/bin/checkpoint_fuzz
// -max_total_time=60 -malloc_limit_mb=64 CORPUS_DIR (seed: a checkpoint of a small run).
#include <cstddef>
#include <cstdint>
#include <span>
#include <vector>

#include "io/byte_packing.hpp"
#include "sim/checkpoint.hpp"
#include "trajectory/crc32c.hpp"

namespace {

// Recomputes each section's payload and header CRCs, following the stored lengths (layout in
// sim/include/sim/checkpoint.hpp).
void reseal(std::vector<std::byte>& bytes) {
    std::size_t at = 16;
    while (bytes.size() >= at + 20) {
        const std::uint64_t length = brownfloc::io::load_u64(bytes.data() + at + 4);
        if (length > bytes.size() - at - 20) return;
        const std::span<const std::byte> all{bytes};
        brownfloc::io::store_u32(bytes.data() + at + 12, brownfloc::trajectory::crc32c(all.subspan(at + 20, length)));
        brownfloc::io::store_u32(bytes.data() + at + 16, brownfloc::trajectory::crc32c(all.subspan(at, 16)));
        at += 20 + length;
    }
}

void decode(std::span<const std::byte> bytes) {
    try {
        (void)brownfloc::sim::decode_checkpoint(bytes, "<fuzz>");
    } catch (const brownfloc::sim::CheckpointFormatError&) {
    }
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const std::span<const std::byte> bytes(reinterpret_cast<const std::byte*>(data), size);
    decode(bytes);
    std::vector<std::byte> sealed(bytes.begin(), bytes.end());
    reseal(sealed);
    decode(sealed);
    return 0;
}
