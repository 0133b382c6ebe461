#include "scene/sphere_image.hpp"

#include <catch2/catch.hpp>

#include <cmath>
#include <stdexcept>

using namespace brownfloc::viewer;

TEST_CASE("a resized sphere image is opaque black with no owners and infinite depth", "[viewer][scene][image]") {
    SphereImage image;
    image.resize(7, 3);
    CHECK(image.rgba.size() == 4 * 7 * 3);
    CHECK(image.owner.size() == 21);
    CHECK(image.depth_nm.size() == 21);
    CHECK(image.pixel(6, 2) == Rgb{0, 0, 0});
    CHECK(image.rgba[4 * 20 + 3] == 255);
    CHECK(image.owner_at(0, 0) == no_particle);
    CHECK(std::isinf(image.depth_at(3, 1)));
    image.rgba[4 * (2 * 7 + 5)] = 9;  // pixel (5, 2), row-major
    CHECK(image.pixel(5, 2) == Rgb{9, 0, 0});
    image.resize(0, 0);
    CHECK(image.rgba.empty());
}

TEST_CASE("sphere image access outside its size throws", "[viewer][scene][image][validation]") {
    SphereImage image;
    image.resize(4, 4);
    CHECK_THROWS_WITH(image.pixel(4, 0), Catch::Contains("(4, 0)") && Catch::Contains("4 x 4"));
    CHECK_THROWS_AS(image.owner_at(0, -1), std::out_of_range);
    CHECK_THROWS_AS(image.depth_at(-1, 2), std::out_of_range);
    CHECK_THROWS_WITH(image.resize(-1, 5), Catch::Contains("-1 x 5"));
    CHECK_THROWS_AS(image.resize(100000, 100000), std::invalid_argument);
    CHECK(image.width_px == 4);  // a failed resize leaves the image as it was
}
