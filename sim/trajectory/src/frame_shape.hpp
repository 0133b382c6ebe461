#pragma once
// The sizes the header fixes for every frame: N particles, positions as float32 or float64.
#include <cstddef>
#include <cstdint>

namespace brownfloc::trajectory::detail {

struct FrameShape {
    std::size_t particle_count = 0;  // N, 1 <= N < 2^32 (a header rule)
    bool positions_float64 = false;

    [[nodiscard]] std::uint64_t position_bytes() const { return positions_float64 ? 8 : 4; }
    // Payload with no spanning cluster: step, time, 3N positions, N cluster ids, the spanning
    // count, cluster_count, largest_cluster. With N < 2^32 this is below 2^37: no overflow.
    [[nodiscard]] std::uint64_t min_payload_bytes() const {
        const std::uint64_t n = particle_count;
        return 8 + 8 + 3 * n * position_bytes() + 4 * n + 8 + 4 + 4;
    }
    // With every particle's cluster spanning (at most N spanning clusters).
    [[nodiscard]] std::uint64_t max_payload_bytes() const { return min_payload_bytes() + 4 * std::uint64_t{particle_count}; }
};

}  // namespace brownfloc::trajectory::detail
