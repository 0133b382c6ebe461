#include "view_options.hpp"

#include <charconv>
#include <cmath>
#include <system_error>

#include "io/message_text.hpp"

namespace brownfloc::viewer {

namespace {

[[noreturn]] void refuse(std::string_view option, std::string_view value, std::string_view allowed) {
    throw ViewerUsageError(io::message(option, " ", io::quoted(value), ": ", allowed));
}

template <class Number>
bool parse_whole(std::string_view text, Number& out) {
    if (text.empty()) return false;
    const auto [end, error] = std::from_chars(text.data(), text.data() + text.size(), out);
    return error == std::errc() && end == text.data() + text.size();
}

bool parse_real(std::string_view text, double& out) {
    if (text.empty()) return false;
    const auto [end, error] = std::from_chars(text.data(), text.data() + text.size(), out);
    return error == std::errc() && end == text.data() + text.size() && std::isfinite(out);
}

}  // namespace

ImageSize parse_image_size(std::string_view text) {
    const std::size_t x = text.find('x');
    ImageSize size;
    if (x == std::string_view::npos || !parse_whole(text.substr(0, x), size.width_px) ||
        !parse_whole(text.substr(x + 1), size.height_px) || size.width_px < 64 || size.height_px < 64 ||
        size.width_px > max_image_edge_px || size.height_px > max_image_edge_px)
        refuse("--size", text, io::message("expected WIDTHxHEIGHT in pixels, each from 64 to ", max_image_edge_px,
                                           " (e.g. 1280x800)"));
    return size;
}

CameraPose parse_camera(std::string_view text) {
    double values[3] = {};
    std::string_view rest = text;
    for (int k = 0; k < 3; ++k) {
        const std::size_t comma = k < 2 ? rest.find(',') : rest.size();
        if (comma == std::string_view::npos || !parse_real(rest.substr(0, comma), values[k]))
            refuse("--camera", text, "expected AZ,EL,DIST: azimuth and elevation in degrees, distance in box lengths "
                                     "(e.g. 30,20,2.6)");
        rest = k < 2 ? rest.substr(comma + 1) : std::string_view();
    }
    if (values[1] < -89.0 || values[1] > 89.0)
        refuse("--camera", text, "the elevation must lie from -89 to 89 degrees");
    if (values[2] < 0.05 || values[2] > 50.0)
        refuse("--camera", text, "the distance must lie from 0.05 to 50 box lengths");
    CameraPose pose;
    pose.azimuth_deg = values[0] - 360.0 * std::floor(values[0] / 360.0);
    pose.elevation_deg = values[1];
    pose.distance_box_lengths = values[2];
    return pose;
}

FrameChoice parse_frame_choice(std::string_view text) {
    FrameChoice choice;
    if (text == "last") return choice;
    choice.last = false;
    if (!parse_whole(text, choice.index)) refuse("--frame", text, "expected a frame number (0, 1, ...) or last");
    return choice;
}

ClusterChoice parse_cluster_choice(std::string_view text) {
    ClusterChoice choice;
    if (text == "largest") {
        choice.largest = true;
        return choice;
    }
    std::uint32_t id = 0;
    if (!parse_whole(text, id)) refuse("--select", text, "expected a cluster id (its smallest particle id) or largest");
    choice.cluster_id = id;
    return choice;
}

ColourMode parse_colour_mode(std::string_view text) {
    if (text == "cluster") return ColourMode::cluster;
    if (text == "size") return ColourMode::size;
    if (text == "species") return ColourMode::species;
    refuse("--color", text, "expected cluster, size or species");
}

std::string_view colour_mode_name(ColourMode mode) {
    switch (mode) {
        case ColourMode::cluster: return "cluster";
        case ColourMode::size: return "size";
        case ColourMode::species: return "species";
    }
    return "cluster";
}

}  // namespace brownfloc::viewer
