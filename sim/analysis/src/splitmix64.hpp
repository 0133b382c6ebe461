#pragma once
// A small seeded generator of our own for the sampled Kirkwood sum and the bootstrap.
// std:: distributions are not used: their output differs between standard-library
// versions, and every result here must be a pure function of (inputs, seed).
//
// SplitMix64: Steele, Lea & Flood (2014), "Fast splittable pseudorandom number
// generators", OOPSLA '14; constants as in Vigna's public-domain reference code
// splitmix64.c [memory]. Period 2^64, passes BigCrush; plenty for sampling pairs.
#include <cstddef>
#include <cstdint>

namespace brownfloc::analysis::detail {

class SplitMix64 {
public:
    explicit SplitMix64(std::uint64_t seed) : state_{seed} {}

    std::uint64_t next() {
        std::uint64_t z = (state_ += 0x9E3779B97F4A7C15ULL);
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9ULL;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBULL;
        return z ^ (z >> 31);
    }

    // Uniform index in [0, n), n >= 1. Plain modulo: the bias is below n / 2^64, far under
    // anything a sample of pairs or clusters could detect.
    std::size_t index_below(std::size_t n) { return static_cast<std::size_t>(next() % n); }

private:
    std::uint64_t state_;
};

// A second, independent stream derived from one seed (e.g. one per purpose), so that
// two uses of the same user seed do not share draws.
inline std::uint64_t derive_seed(std::uint64_t seed, std::uint64_t purpose) {
    SplitMix64 mix{seed ^ (purpose * 0xD1B54A32D192ED03ULL)};
    return mix.next();
}

}  // namespace brownfloc::analysis::detail
