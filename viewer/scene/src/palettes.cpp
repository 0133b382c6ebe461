#include "scene/palettes.hpp"

#include <cmath>
#include <stdexcept>
#include <string>

namespace brownfloc::viewer {

std::uint32_t mix_cluster_id(std::uint32_t id) {
    std::uint32_t x = id;
    x ^= x >> 16;
    x *= 0x7feb352dU;
    x ^= x >> 15;
    x *= 0x846ca68bU;
    x ^= x >> 16;
    return x;
}

Rgb cluster_colour(std::uint32_t cluster_id, std::int64_t cluster_size) {
    if (cluster_size < 1) {
        std::string message = "cluster_colour: cluster ";
        message += std::to_string(cluster_id);
        message += " has size ";
        message += std::to_string(cluster_size);
        message += ": must be >= 1";
        throw std::invalid_argument(message);
    }
    if (cluster_size == 1) return monomer_grey;
    return cluster_palette[mix_cluster_id(cluster_id) % cluster_palette.size()];
}

Rgb species_colour(std::uint32_t species_index) { return species_palette[species_index % species_palette.size()]; }

Rgb dimmed(Rgb colour, Rgb background) {
    const auto channel = [](std::uint8_t c, std::uint8_t b) {
        return static_cast<std::uint8_t>(std::lround(double(b) + 0.35 * (double(c) - double(b))));
    };
    return {channel(colour.r, background.r), channel(colour.g, background.g), channel(colour.b, background.b)};
}

}  // namespace brownfloc::viewer
