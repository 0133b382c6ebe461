#pragma once
// The timeline along the bottom of the scene: a track with one tick per frame (thinned when
// there are many), the current frame's handle, and the play state and speed beside it.
#include <SFML/Graphics/Font.hpp>
#include <SFML/Graphics/RenderTarget.hpp>

#include <cstddef>
#include <optional>
#include <string>

#include "plots/plot_layout.hpp"

namespace brownfloc::viewer {

struct TimelineState {
    std::size_t frame = 0, frame_count = 0;
    bool playing = false;
    double frames_per_s = 5.0;
    std::string time_text;  // "t = 1.2e-3 s (2.50 fast half-lives)"
};

class TimelineBar {
public:
    static constexpr int height_px = 30;

    // The bar sits at the bottom of the scene rectangle.
    [[nodiscard]] static PixelRect area(const PixelRect& scene);
    // The frame under image column x, if (x, y) is on the track.
    [[nodiscard]] static std::optional<std::size_t> frame_at(const PixelRect& scene, std::size_t frame_count, int x_px,
                                                             int y_px, bool dragging);
    static void draw(sf::RenderTarget& target, const PixelRect& scene, const TimelineState& state, const sf::Font& font);
};

}  // namespace brownfloc::viewer
