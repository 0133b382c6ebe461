#include "scene/palettes.hpp"

#include <catch2/catch.hpp>

#include <array>
#include <limits>
#include <stdexcept>

#include "colour_science.hpp"

using namespace brownfloc::viewer;
using namespace brownfloc::viewer::test;

namespace {

constexpr Rgb background{22, 24, 30};  // viewer/README.md

template <std::size_t N>
double min_pairwise_delta_e(const std::array<Rgb, N>& palette, Vision vision) {
    double smallest = std::numeric_limits<double>::infinity();
    for (std::size_t a = 0; a < N; ++a)
        for (std::size_t b = a + 1; b < N; ++b) smallest = std::min(smallest, delta_e76(palette[a], palette[b], vision));
    return smallest;
}

// The documented hash, re-derived from palettes.hpp's comment (Wellons 2018, "lowbias32").
std::uint32_t documented_mix(std::uint32_t x) {
    x = x ^ (x >> 16);
    x = std::uint32_t(std::uint64_t(x) * 0x7feb352dULL);
    x = x ^ (x >> 15);
    x = std::uint32_t(std::uint64_t(x) * 0x846ca68bULL);
    return x ^ (x >> 16);
}

}  // namespace

TEST_CASE("cluster colours stay pairwise distinct under normal and simulated colour-deficient vision",
          "[viewer][scene][palette]") {
    // Thresholds chosen for this palette (CIEDE76, CIE 15:2004; deficiency simulation Machado,
    // Oliveira & Fernandes 2009, severity 1.0): 30 under normal vision (a JND is about 2.3,
    // Sharma 2003, Digital Color Imaging Handbook, from memory) and 15 under each deficiency.
    // The palette reaches 35.6 / 17.0 / 17.8 / 18.0 (normal / protan / deutan / tritan).
    CHECK(min_pairwise_delta_e(cluster_palette, Vision::normal) >= 30.0);
    CHECK(min_pairwise_delta_e(cluster_palette, Vision::protanopia) >= 15.0);
    CHECK(min_pairwise_delta_e(cluster_palette, Vision::deuteranopia) >= 15.0);
    CHECK(min_pairwise_delta_e(cluster_palette, Vision::tritanopia) >= 15.0);
}

TEST_CASE("cluster colours stand apart from the monomer grey and the background in every vision mode",
          "[viewer][scene][palette]") {
    for (Vision vision : all_visions) {
        CAPTURE(vision_name(vision));
        for (Rgb c : cluster_palette) {
            CAPTURE(int(c.r), int(c.g), int(c.b));
            // Thresholds as above: 15 from grey (the palette reaches 17.7), 30 from the
            // background (reached: 36).
            CHECK(delta_e76(c, monomer_grey, vision) >= 15.0);
            CHECK(delta_e76(c, background, vision) >= 30.0);
        }
    }
}

TEST_CASE("cluster colours are not dark since shading scales them down to 35 percent", "[viewer][scene][palette]") {
    // CIELAB L* >= 50 (our choice): at the 0.35 ambient floor these colours keep L* of 16..32,
    // still clear of the background's L* of 8.3.
    for (Rgb c : cluster_palette) {
        CAPTURE(int(c.r), int(c.g), int(c.b));
        CHECK(cielab(c)[0] >= 50.0);
    }
}

TEST_CASE("a cluster takes the palette slot of its hashed id and monomers are grey", "[viewer][scene][palette]") {
    for (std::uint32_t id : {0u, 1u, 2u, 17u, 4095u, 123456789u, 0xFFFFFFFEu}) {
        CAPTURE(id);
        CHECK(mix_cluster_id(id) == documented_mix(id));
        CHECK(cluster_colour(id, 2) == cluster_palette[documented_mix(id) % 12]);
        CHECK(cluster_colour(id, 5000) == cluster_palette[documented_mix(id) % 12]);
        CHECK(cluster_colour(id, 1) == monomer_grey);
    }
    CHECK_THROWS_WITH(cluster_colour(3, 0), Catch::Contains("cluster 3") && Catch::Contains("size 0"));
    CHECK_THROWS_AS(cluster_colour(3, -4), std::invalid_argument);
}

TEST_CASE("consecutive cluster ids spread over all palette slots", "[viewer][scene][palette]") {
    std::array<int, 12> uses{};
    for (std::uint32_t id = 0; id < 1200; ++id) ++uses[mix_cluster_id(id) % 12];
    // 100 expected per slot; binomial standard deviation sqrt(1200 (1/12)(11/12)) = 9.6, so
    // 70..130 is about three standard deviations (common practice).
    for (int n : uses) {
        CHECK(n >= 70);
        CHECK(n <= 130);
    }
    // Neighbouring ids rarely share a colour: about 1 in 12 pairs would by chance.
    int same = 0;
    for (std::uint32_t id = 0; id < 1200; ++id) same += mix_cluster_id(id) % 12 == mix_cluster_id(id + 1) % 12;
    CHECK(same < 200);
}

TEST_CASE("species colours are distinct under normal vision and follow species order", "[viewer][scene][palette]") {
    // Threshold 40 (our choice; reached 51.9), CIEDE76 as above.
    CHECK(min_pairwise_delta_e(species_palette, Vision::normal) >= 40.0);
    for (Vision vision : all_visions) {
        CAPTURE(vision_name(vision));
        for (Rgb c : species_palette) CHECK(delta_e76(c, background, vision) >= 30.0);
    }
    for (std::uint32_t k = 0; k < 8; ++k) CHECK(species_colour(k) == species_palette[k]);
    CHECK(species_colour(8) == species_palette[0]);
    CHECK(species_colour(13) == species_palette[5]);
}

TEST_CASE("dimming moves a colour 65 percent of the way to the background", "[viewer][scene][palette]") {
    // viewer/README.md: every other sphere is drawn at 35 % of its colour, towards the background.
    // (255, 0, 100) on (22, 24, 30): 22 + 0.35 * 233 = 103.55, 24 - 0.35 * 24 = 15.6,
    // 30 + 0.35 * 70 = 54.5 -> rounded 104, 16 and 54 or 55 (0.35 is not exact in binary).
    const Rgb d = dimmed({255, 0, 100}, background);
    CHECK(d.r == 104);
    CHECK(d.g == 16);
    CHECK((d.b == 54 || d.b == 55));
    CHECK(dimmed(background, background) == background);
    CHECK(dimmed({0, 0, 0}, {255, 255, 255}) == Rgb{166, 166, 166});  // 255 - 0.35 * 255 = 165.75
}
