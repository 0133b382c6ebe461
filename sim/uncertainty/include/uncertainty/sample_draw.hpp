#pragma once
// Counter-based draws for the Monte Carlo estimator: the value of input j in sample i is a
// pure function of (seed, i, j), so the samples are the same at any thread count, in any
// order, and sample i can be recomputed alone (to report or re-run it).
//
//   for (std::uint64_t i = 0; i < n; ++i)          // any order, any thread
//       radius_nm[i] = draw(radius, seed, i, 0);   // input 0
//
// Layout. Philox4x32-10 (Salmon, Moraes, Dror & Shaw (2011), "Parallel random numbers: as
// easy as 1, 2, 3", Proc. SC'11; the Random123 implementation):
//   counter = { sample bits 0-31, sample bits 32-63, input, 0 }
//   key     = { seed bits 0-31, seed bits 32-63 }
// Output words 0 and 1 form a 64-bit word (word 0 high); its top 53 bits k give
// u = k 2^-53, with k = 0 taken as 1/2 (u = 2^-54), so u lies in the OPEN interval (0, 1):
// from 2^-54 to 1 - 2^-53, all exact doubles. Words 2 and 3 are unused.
// This is a different counter layout from the engine's noise (sim/philox_noise.hpp), and the
// estimator's seed is its own, so the two never share a stream by construction of the seeds.
//
// Thread safety: pure functions of their arguments, no state; bitwise reproducible on a given
// platform (the quantiles call the C library's log, exp and erfc).
#include <array>
#include <cstdint>

#include "uncertainty/distribution.hpp"

namespace brownfloc::uncertainty {

// The raw Philox4x32-10 block (10 rounds) of counter and key.
[[nodiscard]] std::array<std::uint32_t, 4> philox4x32_10(const std::array<std::uint32_t, 4>& counter,
                                                         const std::array<std::uint32_t, 2>& key);

// u in (0, 1) from two 32-bit words (high, low): the layout above.
[[nodiscard]] constexpr double uniform_from_bits(std::uint32_t high, std::uint32_t low) {
    const std::uint64_t k = ((static_cast<std::uint64_t>(high) << 32) | low) >> 11;
    return k == 0 ? 0x1p-54 : static_cast<double>(k) * 0x1p-53;
}

// The probability u in (0, 1) that input `input` of sample `sample` is drawn at.
[[nodiscard]] double uniform_draw(std::uint64_t seed, std::uint64_t sample, std::uint32_t input);

// distribution.quantile(uniform_draw(seed, sample, input)). A zero-width distribution
// returns its value (and skips the Philox block).
[[nodiscard]] double draw(const Distribution& distribution, std::uint64_t seed, std::uint64_t sample,
                          std::uint32_t input);

}  // namespace brownfloc::uncertainty
