// Option values with their own syntax: --size, --camera, --frame, --select, --color.
#include <catch2/catch.hpp>

#include "view_options.hpp"

using namespace brownfloc::viewer;

TEST_CASE("option values parse and bad ones name the option and what is allowed", "[viewer][options]") {
    CHECK(parse_image_size("1280x800").width_px == 1280);
    CHECK(parse_image_size("1280x800").height_px == 800);
    CHECK_THROWS_WITH(parse_image_size("1280*800"), Catch::StartsWith("--size \"1280*800\": expected WIDTHxHEIGHT"));
    CHECK_THROWS_AS(parse_image_size("10x10"), ViewerUsageError);
    CHECK_THROWS_AS(parse_image_size("x800"), ViewerUsageError);
    const CameraPose pose = parse_camera("-30,20,2.5");
    CHECK(pose.azimuth_deg == Approx(330));
    CHECK(pose.elevation_deg == 20);
    CHECK(pose.distance_box_lengths == 2.5);
    CHECK_THROWS_AS(parse_camera("30,20"), ViewerUsageError);
    CHECK_THROWS_AS(parse_camera("30,20,nan"), ViewerUsageError);
    CHECK_THROWS_AS(parse_camera("30,20,0"), ViewerUsageError);
    CHECK(parse_frame_choice("last").last);
    CHECK(parse_frame_choice("7").index == 7);
    CHECK_THROWS_AS(parse_frame_choice("-1"), ViewerUsageError);
    CHECK(parse_cluster_choice("largest").largest);
    CHECK(*parse_cluster_choice("12").cluster_id == 12);
    CHECK_THROWS_AS(parse_cluster_choice("big"), ViewerUsageError);
    CHECK(parse_colour_mode("size") == ColourMode::size);
    CHECK_THROWS_WITH(parse_colour_mode("red"), Catch::Contains("expected cluster, size or species"));
}
