#pragma once
// Counter-based noise: every random number of a run is a pure function of
// (seed, step, body, stream, extra). There is no generator state anywhere, so a run gives
// the same bits at any thread count and in any order of evaluation.
//
//   const auto xi = standard_normals(seed, step, i, NoiseStream::translation);
//   x[i] += mobility * force[i][0] * dt + std::sqrt(2 * D * dt) * xi[0];   // and y, z
//
// Block layout. Philox4x32-10 (Salmon, Moraes, Dror & Shaw (2011), "Parallel random
// numbers: as easy as 1, 2, 3", Proc. SC'11; the Random123 1.14 implementation):
//   key     = { seed bits 0-31, seed bits 32-63 }
//   counter = { step bits 0-31, step bits 32-63, body, (stream << 28) | extra }
// extra < 2^28 (asserted) numbers further blocks of the same (step, body, stream).
// Changing any one of seed, step, body, stream or extra gives an unrelated block.
//
// Fast normals (standard_normals, standard_normal_from_bits): an inverse normal CDF by
// table. Word w stands for u = (w + 1/2) 2^-32. Its top 12 bits pick one of 4096
// equiprobable intervals of u, its low 20 bits the position t = (f + 1/2) 2^-20 inside.
// Within an interval z is the cubic Hermite interpolant of the exact quantiles and their
// slopes 1/phi(z) at both ends, so each interval keeps exactly its probability 2^-12 and z
// is continuous and increasing in w. The two outermost intervals at each end
// (|z| > 3.297, probability 2^-11 per side), where the quantile curves too hard for a cubic,
// call inverse_normal_cdf on the exact u instead: 1 word in 1024. The table (4096 rows of 4
// doubles, 128 KiB) is built once from inverse_normal_cdf.
//
// Accuracy (tests/sim/philox_noise.test.cpp, 65 points in every interval):
// |Phi(z(w)) - u(w)| <= 2.3e-7 everywhere, reached at |z| ~ 3.2-3.3 in the last tabulated
// interval (0.1 % of its probability 2^-12); below 1e-9 for |z| < 2.6, 1e-11 for |z| < 2.
// On top of that the outputs take 2^32 equiprobable values (the CDF steps by 2^-32) and
// |z| <= 6.34.
//
// Cost (tests/bench/noise.bench.cpp; one core of the 2-core build machine, AMD EPYC at
// ~3.3 GHz, g++ 12 -O3, baseline x86-64, the other core busy): block + 4 fast normals
// 16-20 ns, block + 4 Box-Muller normals 67-75 ns, the bare block 5.9 ns. Philox and the
// transform are latency-bound: hence Estrin's scheme and ~22 instructions per normal (a
// two-lane SIMD version measured slower).
//
// Thread safety: every function is pure and thread-safe. The quantile table is a
// function-local static (thread-safe initialisation, built on first use). Nothing depends
// on thread count or order, and no -ffast-math is involved, so outputs are bitwise
// reproducible on a given platform. Across platforms the last bit may differ: the quantile
// table and the exact path call the C library's log and exp, and where the base instruction
// set has FMA (AArch64) g++ contracts a * b + c by default.
#include <array>
#include <bit>
#include <cassert>
#include <cmath>
#include <cstdint>

#include <Random123/philox.h>

namespace brownfloc::sim {

// Independent noise streams of one (seed, step, body): the top 4 bits of counter word 3.
enum class NoiseStream : std::uint32_t {
    translation = 0,
    rotation = 1,
    capture = 2,
    placement = 3,
    radius = 4,
    species = 5,
    bootstrap = 6,
};

// extra must stay below this (the low 28 bits of counter word 3).
inline constexpr std::uint32_t noise_extra_limit = std::uint32_t{1} << 28;

// The Philox4x32-10 block of (seed, step, body, stream, extra); layout above.
[[nodiscard]] inline std::array<std::uint32_t, 4> philox_block(std::uint64_t seed, std::uint64_t step,
                                                               std::uint32_t body, NoiseStream stream,
                                                               std::uint32_t extra = 0) {
    assert(extra < noise_extra_limit);
    using Philox = r123::Philox4x32;
    const Philox::ctr_type counter = {{static_cast<std::uint32_t>(step), static_cast<std::uint32_t>(step >> 32),
                                       body, (static_cast<std::uint32_t>(stream) << 28) | extra}};
    const Philox::key_type key = {{static_cast<std::uint32_t>(seed), static_cast<std::uint32_t>(seed >> 32)}};
    const Philox::ctr_type r = Philox{}(counter, key);
    return {r[0], r[1], r[2], r[3]};
}

// (bits + 1/2) 2^-32: one of 2^32 equiprobable values in (0, 1), never 0 or 1.
[[nodiscard]] constexpr double uniform_open01(std::uint32_t bits) {
    return (static_cast<double>(bits) + 0.5) * 0x1p-32;
}

// (j + 1/2) 2^-52 with j the top 20 bits of hi followed by all 32 of lo: one of 2^52
// equiprobable values in (0, 1), never 0 or 1 (j + 1/2 is exact in a double for j < 2^52).
[[nodiscard]] constexpr double uniform_open01(std::uint32_t hi, std::uint32_t lo) {
    const std::uint64_t j = (static_cast<std::uint64_t>(hi >> 12) << 32) | lo;
    return (static_cast<double>(j) + 0.5) * 0x1p-52;
}

// Quantile of the standard normal distribution at probability p in (0, 1): Wichura (1988),
// "Algorithm AS 241: the percentage points of the normal distribution", Appl. Statist. 37,
// 477-484 (PPND16, relative accuracy about 1e-16). -inf at 0, +inf at 1, NaN outside [0, 1].
[[nodiscard]] double inverse_normal_cdf(double p);

namespace detail {

inline constexpr int normal_interval_bits = 12;
inline constexpr std::uint32_t normal_intervals = std::uint32_t{1} << normal_interval_bits;
inline constexpr int normal_fraction_bits = 32 - normal_interval_bits;
// Intervals 0, 1 and 4094, 4095 take the exact path.
inline constexpr std::uint32_t normal_exact_intervals_per_side = 2;

// Row k of the table: the Hermite cubic of interval k as c0 + c1 f + c2 f^2 + c3 f^3 in the
// raw fraction bits f (t = (f + 1/2) 2^-20 folded into the coefficients). 32-byte aligned:
// one look-up touches one cache line.
struct alignas(32) NormalQuantileRow {
    std::array<double, 4> c;
};
using NormalQuantileTable = std::array<NormalQuantileRow, normal_intervals>;
[[nodiscard]] NormalQuantileTable build_normal_quantile_table();

[[nodiscard]] inline const NormalQuantileTable& normal_quantile_table() {
    static const NormalQuantileTable table = build_normal_quantile_table();
    return table;
}

// z of a word in an outermost interval, by inverse_normal_cdf on the exact tail probability.
[[nodiscard]] double normal_from_bits_exact(std::uint32_t bits);

// standard_normal_from_bits with the table already at hand.
[[nodiscard]] inline double normal_from_bits(std::uint32_t bits, const NormalQuantileRow* table) {
    const std::uint32_t interval = bits >> normal_fraction_bits;
    if (interval - normal_exact_intervals_per_side >= normal_intervals - 2 * normal_exact_intervals_per_side)
        [[unlikely]] {
        return normal_from_bits_exact(bits);
    }
    // Estrin's scheme: a shorter dependency chain than Horner's.
    const double* c = table[interval].c.data();
    const double f = static_cast<double>(static_cast<std::int32_t>(bits & ((1u << normal_fraction_bits) - 1)));
    return (c[0] + c[1] * f) + (f * f) * (c[2] + c[3] * f);
}

}  // namespace detail

// The fast inverse-CDF normal of one 32-bit word (see the header comment): a pure function
// of bits, increasing in bits.
[[nodiscard]] inline double standard_normal_from_bits(std::uint32_t bits) {
    return detail::normal_from_bits(bits, detail::normal_quantile_table().data());
}

// Four independent N(0, 1) from the one block of (seed, step, body, stream, extra), by the
// fast transform (output i from word i). Pure and thread-safe.
[[nodiscard]] inline std::array<double, 4> standard_normals(std::uint64_t seed, std::uint64_t step,
                                                            std::uint32_t body, NoiseStream stream,
                                                            std::uint32_t extra = 0) {
    const std::array<std::uint32_t, 4> w = philox_block(seed, step, body, stream, extra);
    const detail::NormalQuantileRow* table = detail::normal_quantile_table().data();
    return {detail::normal_from_bits(w[0], table), detail::normal_from_bits(w[1], table),
            detail::normal_from_bits(w[2], table), detail::normal_from_bits(w[3], table)};
}

// Three of the four normals above (words 0-2), for a translation step: skips the fourth
// transform. Pure and thread-safe.
[[nodiscard]] inline std::array<double, 4> standard_normals3(std::uint64_t seed, std::uint64_t step,
                                                             std::uint32_t body, NoiseStream stream) {
    const std::array<std::uint32_t, 4> w = philox_block(seed, step, body, stream);
    const detail::NormalQuantileRow* table = detail::normal_quantile_table().data();
    return {detail::normal_from_bits(w[0], table), detail::normal_from_bits(w[1], table),
            detail::normal_from_bits(w[2], table), 0.0};
}

// Four independent N(0, 1) from the same block by double-precision Box-Muller on 32-bit
// uniforms (Box & Muller (1958), Ann. Math. Statist. 29, 610): words 0, 1 give outputs
// 0, 1 and words 2, 3 give outputs 2, 3. The reference transform of the speed baseline.
[[nodiscard]] inline std::array<double, 4> box_muller_normals(std::uint64_t seed, std::uint64_t step,
                                                              std::uint32_t body, NoiseStream stream,
                                                              std::uint32_t extra = 0) {
    constexpr double two_pi = 6.283185307179586476925;
    const std::array<std::uint32_t, 4> w = philox_block(seed, step, body, stream, extra);
    const double r0 = std::sqrt(-2.0 * std::log(uniform_open01(w[0])));
    const double r1 = std::sqrt(-2.0 * std::log(uniform_open01(w[2])));
    const double a0 = two_pi * uniform_open01(w[1]);
    const double a1 = two_pi * uniform_open01(w[3]);
    return {r0 * std::cos(a0), r0 * std::sin(a0), r1 * std::cos(a1), r1 * std::sin(a1)};
}

}  // namespace brownfloc::sim
