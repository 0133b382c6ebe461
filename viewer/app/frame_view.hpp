#pragma once
// One picture of one frame: the spheres as the view settings colour and filter them, the four
// plots beside them, and the text over the scene. Used by the window and by --render alike, so
// that a headless render shows exactly what the window shows.
#include <SFML/Graphics/Font.hpp>
#include <SFML/Graphics/RenderTarget.hpp>
#include <SFML/Graphics/Texture.hpp>

#include <array>
#include <cstdint>
#include <optional>
#include <string>
#include <vector>

#include "data/count_series.hpp"
#include "data/frame_loader.hpp"
#include "plots/plot_drawing.hpp"
#include "plots/plot_layout.hpp"
#include "plots/plot_spec.hpp"
#include "scene/camera.hpp"
#include "scene/sphere_image.hpp"
#include "scene/sphere_renderer.hpp"
#include "trajectory/trajectory_data.hpp"
#include "view_options.hpp"

namespace brownfloc::viewer {

struct ViewSettings {
    ColourMode colour = ColourMode::cluster;
    bool wrap = true;                          // positions mapped into the box, else clusters whole
    std::optional<std::uint32_t> selected_cluster;
    bool only_largest = false;
    bool plots = true;
    CameraPose camera;
    int render_threads = 0;                    // 0: as many as the machine has (at most 8)
};

// The particles to draw, coloured and filtered by the settings.
[[nodiscard]] std::vector<Sphere> build_spheres(const trajectory::TrajectoryHeader& header,
                                                const trajectory::TrajectoryFrame& frame,
                                                const FrameAnalysis& analysis, const ViewSettings& settings);

// The four plots for this frame (the clusters plot needs the run's count series).
[[nodiscard]] std::array<PlotSpec, 4> build_plot_specs(const trajectory::TrajectoryHeader& header,
                                                       const FrameAnalysis& analysis, const CountSeries& counts,
                                                       double frame_time_s);

// Lines of text over the scene: what is shown and the state of the file.
struct SceneText {
    std::vector<std::string> top_left;     // run, frame, time, clusters
    std::vector<std::string> bottom_left;  // the selected cluster, notes
    std::vector<std::string> warnings;     // in a warning colour, top right
    int bottom_reserved_px = 0;            // kept free at the bottom of the scene (the window's timeline)
};

class FrameView {
public:
    explicit FrameView(const sf::Font& font);

    // Draws the whole image for `shown` into target (whose size is the image size). The
    // camera's viewport is the layout's scene rectangle.
    void draw(sf::RenderTarget& target, const trajectory::TrajectoryHeader& header, const LoadedFrame& shown,
              const CountSeries& counts, const ViewSettings& settings, const SceneText& text);

    // The particle drawn at image pixel (x, y) in the last draw, if any.
    [[nodiscard]] std::optional<std::uint32_t> particle_at(int x_px, int y_px) const;
    // The layout of the last draw.
    [[nodiscard]] const ViewerLayout& layout() const { return layout_; }
    [[nodiscard]] int plot_redraws() const { return plots_.redraw_count(); }

private:
    void draw_scene_text(sf::RenderTarget& target, const SceneText& text) const;
    void draw_size_legend(sf::RenderTarget& target, std::int64_t largest_size) const;

    const sf::Font& font_;
    SphereImage image_;
    sf::Texture texture_;
    PlotPanel plots_;
    ViewerLayout layout_;
};

// The text lines for a frame: "frame 3 of 21", "t = 1.2e-3 s = 2.50 t1/2", counts.
[[nodiscard]] SceneText describe_frame(const trajectory::TrajectoryHeader& header, const LoadedFrame& shown,
                                       std::size_t frame_count, const ViewSettings& settings);

}  // namespace brownfloc::viewer
