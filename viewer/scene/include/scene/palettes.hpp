#pragma once
// The viewer's colours (viewer/README.md, "Colours"): by cluster, by size and by species, and
// the selection dimming. All functions are pure and thread-safe.
//
// Design of the palettes (ours, found by a seeded search over 8-bit sRGB and hand-rounded):
// - cluster_palette: 12 colours with CIELAB lightness 52..87 (spheres are shaded down to 35 %,
//   so none is dark). Minimum pairwise CIEDE76 distance (CIELAB, D65) 35.6 under normal vision,
//   17.0 / 17.8 / 18.0 under simulated protanopia / deuteranopia / tritanopia (Machado,
//   Oliveira & Fernandes 2009, IEEE TVCG 15(6) 1291, severity 1.0, applied in linear RGB);
//   at least 17.7 from monomer_grey and 36 from the background (22, 24, 30) in every mode.
// - species_palette: 8 colours, minimum pairwise CIEDE76 51.9 under normal vision (>= 20 under
//   each simulated deficiency).
// - size map: a constant-chroma spiral in Oklab (Ottosson 2020), lightness 0.44 -> 0.90
//   (indigo, rose, orange, light yellow-green), chroma 0.15, hue 280 -> 475 deg; equal steps
//   in Oklab distance before 8-bit rounding.
#include <array>
#include <cstdint>

#include "scene/rgb.hpp"

namespace brownfloc::viewer {

inline constexpr std::array<Rgb, 12> cluster_palette{{
    {172, 110, 66},   // amber brown
    {156, 100, 255},  // violet
    {250, 16, 16},    // signal red
    {24, 250, 60},    // bright green
    {228, 114, 198},  // orchid
    {255, 30, 120},   // raspberry
    {158, 232, 170},  // mint
    {88, 192, 68},    // leaf green
    {142, 152, 250},  // periwinkle
    {255, 180, 206},  // blush
    {230, 216, 128},  // straw
    {28, 208, 250},   // sky
}};

inline constexpr Rgb monomer_grey{150, 150, 150};

// The cluster id hash: the 32-bit "lowbias32" integer finaliser of Wellons (2018),
// "Prospecting for Hash Functions", nullprogram.com/blog/2018/07/31:
//     x ^= x >> 16;  x *= 0x7feb352d;  x ^= x >> 15;  x *= 0x846ca68b;  x ^= x >> 16;
// (multiplications modulo 2^32). Neighbouring ids land on unrelated palette slots.
[[nodiscard]] std::uint32_t mix_cluster_id(std::uint32_t id);

// cluster_palette[mix_cluster_id(id) % 12] for a cluster of >= 2 particles, monomer_grey for
// size 1. Throws std::invalid_argument for cluster_size < 1.
[[nodiscard]] Rgb cluster_colour(std::uint32_t cluster_id, std::int64_t cluster_size);

// The size map at log10(size) / log10(largest_size): the dark end for size 1, the light end for
// the largest. Sizes above largest_size take the light end; largest_size <= 1 maps everything
// to the dark end. Throws std::invalid_argument for size < 1.
[[nodiscard]] Rgb size_colour(std::int64_t size, std::int64_t largest_size);

// The size map at fraction 0 (dark, size 1) .. 1 (light, largest), clamped to [0, 1]; for the
// legend. Throws std::invalid_argument for NaN.
[[nodiscard]] Rgb size_map_at(double fraction);

inline constexpr std::array<Rgb, 8> species_palette{{
    {20, 128, 210},   // cobalt
    {255, 160, 110},  // apricot
    {32, 170, 8},     // green
    {236, 40, 92},    // crimson
    {146, 88, 255},   // violet
    {220, 210, 40},   // mustard
    {84, 244, 196},   // aquamarine
    {255, 176, 250},  // lilac
}};

// species_palette[species_index % 8] (species beyond the eighth repeat the palette).
[[nodiscard]] Rgb species_colour(std::uint32_t species_index);

// Selection dimming: background + 0.35 (colour - background) per channel, rounded to nearest.
[[nodiscard]] Rgb dimmed(Rgb colour, Rgb background);

}  // namespace brownfloc::viewer
