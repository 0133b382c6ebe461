#pragma once
// The text of a plot: title, axis labels, tick labels, marker labels, legend and notes
// (private to the plots library; placement described in plots/plot_drawing.hpp).
#include "plots/plot_layout.hpp"
#include "plots/plot_spec.hpp"
#include "plots/ticks.hpp"

#include <SFML/Graphics/Font.hpp>
#include <SFML/Graphics/RenderTarget.hpp>

#include <vector>

namespace brownfloc::viewer::plot_text {

void draw_title(sf::RenderTarget& target, const PlotSpec& spec, const PixelRect& outer, const PixelRect& data,
                const sf::Font& font);
void draw_tick_labels(sf::RenderTarget& target, const AxisMap& map, const std::vector<Tick>& x_ticks,
                      const std::vector<Tick>& y_ticks, const PixelRect& outer, const sf::Font& font);
void draw_axis_labels(sf::RenderTarget& target, const PlotSpec& spec, const PixelRect& outer, const PixelRect& data,
                      const sf::Font& font);
void draw_marker_labels(sf::RenderTarget& target, const PlotSpec& spec, const AxisMap& map, const sf::Font& font);
void draw_legend(sf::RenderTarget& target, const PlotSpec& spec, const PixelRect& data, const sf::Font& font);

}  // namespace brownfloc::viewer::plot_text
