#include "timeline_bar.hpp"

#include <SFML/Graphics/RectangleShape.hpp>
#include <SFML/Graphics/Text.hpp>

#include <algorithm>
#include <cmath>
#include <cstdio>

namespace brownfloc::viewer {

namespace {

constexpr int track_left_px = 110, track_right_margin_px = 16;

}  // namespace

PixelRect TimelineBar::area(const PixelRect& scene) {
    return {scene.x_px, scene.y_px + scene.height_px - height_px, scene.width_px, height_px};
}

std::optional<std::size_t> TimelineBar::frame_at(const PixelRect& scene, std::size_t frame_count, int x_px, int y_px,
                                                 bool dragging) {
    const PixelRect bar = area(scene);
    const int left = bar.x_px + track_left_px, right = bar.x_px + bar.width_px - track_right_margin_px;
    if (frame_count == 0 || right <= left) return std::nullopt;
    if (!dragging && (y_px < bar.y_px || y_px >= bar.y_px + bar.height_px || x_px < left - 6 || x_px > right + 6))
        return std::nullopt;
    const double fraction = std::clamp(double(x_px - left) / double(right - left), 0.0, 1.0);
    return static_cast<std::size_t>(std::lround(fraction * double(frame_count - 1)));
}

void TimelineBar::draw(sf::RenderTarget& target, const PixelRect& scene, const TimelineState& state,
                       const sf::Font& font) {
    const PixelRect bar = area(scene);
    sf::RectangleShape back({float(bar.width_px), float(bar.height_px)});
    back.setPosition(float(bar.x_px), float(bar.y_px));
    back.setFillColor(sf::Color(12, 14, 20, 215));
    target.draw(back);

    sf::Text label("", font, 12);
    label.setFillColor(sf::Color(225, 228, 235));
    char speed[48];
    std::snprintf(speed, sizeof speed, "%s %.3g fr/s", state.playing ? "playing" : "paused", state.frames_per_s);
    label.setString(speed);
    label.setPosition(float(bar.x_px) + 8.0f, float(bar.y_px) + 7.0f);
    target.draw(label);

    const float left = float(bar.x_px + track_left_px), right = float(bar.x_px + bar.width_px - track_right_margin_px);
    if (right <= left) return;
    const float mid = float(bar.y_px) + float(bar.height_px) / 2;
    sf::RectangleShape track({right - left, 3.0f});
    track.setPosition(left, mid - 1.5f);
    track.setFillColor(sf::Color(90, 96, 110));
    target.draw(track);
    const std::size_t n = state.frame_count;
    if (n == 0) return;
    const std::size_t stride = std::max<std::size_t>(1, n / 200);
    sf::RectangleShape tick({1.0f, 6.0f});
    tick.setFillColor(sf::Color(120, 126, 140));
    for (std::size_t k = 0; k < n; k += stride) {
        const float x = n == 1 ? left : left + (right - left) * float(k) / float(n - 1);
        tick.setPosition(std::floor(x), mid + 3.0f);
        target.draw(tick);
    }
    const float x = n == 1 ? left : left + (right - left) * float(state.frame) / float(n - 1);
    sf::RectangleShape handle({8.0f, 16.0f});
    handle.setOrigin(4.0f, 8.0f);
    handle.setPosition(x, mid);
    handle.setFillColor(sf::Color(245, 190, 90));
    target.draw(handle);
}

}  // namespace brownfloc::viewer
