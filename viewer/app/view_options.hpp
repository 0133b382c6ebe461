#pragma once
// What `brownfloc-view` was asked to do: the command line, parsed and checked. Parsing of the
// option values that have their own syntax (--size WxH, --camera AZ,EL,DIST, --frame N|last,
// --select ID|largest) lives here so that it can be tested without a display.
#include <cstdint>
#include <filesystem>
#include <optional>
#include <stdexcept>
#include <string>
#include <string_view>

#include "scene/camera.hpp"

namespace brownfloc::viewer {

// A bad option value (exit 2); the message names the option, the value and what is allowed.
class ViewerUsageError : public std::runtime_error {
public:
    using std::runtime_error::runtime_error;
};

enum class ColourMode { cluster, size, species };

struct FrameChoice {
    bool last = true;          // --frame last (default)
    std::size_t index = 0;     // --frame N
};

struct ClusterChoice {
    bool largest = false;                  // --select largest
    std::optional<std::uint32_t> cluster_id;  // --select ID
};

struct ImageSize {
    int width_px = 1280, height_px = 800;
};

struct ViewOptions {
    std::filesystem::path run;                  // run directory or trajectory file
    std::optional<std::filesystem::path> render_png;  // --render OUT.png: headless
    std::optional<std::filesystem::path> sequence_dir;  // --sequence DIR (with --render)
    std::size_t sequence_every = 1;             // --every K
    FrameChoice frame;
    ImageSize size;
    ColourMode colour = ColourMode::cluster;
    bool plots = false;                         // --plots (headless); the window starts with plots on
    CameraPose camera;
    ClusterChoice select;
    bool only_largest = false;
    bool wrap = true;                           // --wrap (default) or --whole
    double wait_s = 0.0;                        // --wait S: wait up to S s for the frame to be written
    std::optional<std::filesystem::path> font;  // --font FILE
};

// Largest image edge accepted before the display is asked for its maximum texture size.
inline constexpr int max_image_edge_px = 16384;

[[nodiscard]] ImageSize parse_image_size(std::string_view text);       // "1280x800"
[[nodiscard]] CameraPose parse_camera(std::string_view text);          // "30,20,2.6": degrees, degrees, box lengths
[[nodiscard]] FrameChoice parse_frame_choice(std::string_view text);   // "12" or "last"
[[nodiscard]] ClusterChoice parse_cluster_choice(std::string_view text);  // "17" or "largest"
[[nodiscard]] ColourMode parse_colour_mode(std::string_view text);     // cluster | size | species
[[nodiscard]] std::string_view colour_mode_name(ColourMode mode);

}  // namespace brownfloc::viewer
