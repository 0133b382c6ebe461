#include "uncertainty/sample_draw.hpp"

#include <Random123/philox.h>

namespace brownfloc::uncertainty {

std::array<std::uint32_t, 4> philox4x32_10(const std::array<std::uint32_t, 4>& counter,
                                           const std::array<std::uint32_t, 2>& key) {
    using Philox = r123::Philox4x32_R<10>;
    const Philox::ctr_type c = {{counter[0], counter[1], counter[2], counter[3]}};
    const Philox::key_type k = {{key[0], key[1]}};
    const Philox::ctr_type r = Philox{}(c, k);
    return {r[0], r[1], r[2], r[3]};
}

double uniform_draw(std::uint64_t seed, std::uint64_t sample, std::uint32_t input) {
    const std::array<std::uint32_t, 4> block =
        philox4x32_10({static_cast<std::uint32_t>(sample), static_cast<std::uint32_t>(sample >> 32), input, 0},
                      {static_cast<std::uint32_t>(seed), static_cast<std::uint32_t>(seed >> 32)});
    return uniform_from_bits(block[0], block[1]);
}

double draw(const Distribution& distribution, std::uint64_t seed, std::uint64_t sample, std::uint32_t input) {
    if (distribution.is_point()) return distribution.first_parameter();
    return distribution.quantile(uniform_draw(seed, sample, input));
}

}  // namespace brownfloc::uncertainty
