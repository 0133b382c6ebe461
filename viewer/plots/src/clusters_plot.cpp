// Plot 1: clusters / N0 against t / t_half. Range rule in plot_layout.hpp.
#include "plots/plot_builders.hpp"

#include "builder_support.hpp"

#include <algorithm>
#include <cmath>

namespace brownfloc::viewer {

PlotSpec clusters_plot(const std::vector<double>& measured_t_half_lives, const std::vector<double>& measured_clusters_over_n0,
                       const std::vector<double>& reference_t_half_lives, const std::vector<double>& smoluchowski_over_n0,
                       const std::vector<double>& smoluchowski_transient_over_n0, double current_t_half_lives) {
    using namespace builder_support;
    const char* plot = "clusters plot";
    require_equal_lengths(plot, measured_t_half_lives.size(), "measured times", measured_clusters_over_n0.size(),
                          "measured cluster fractions");
    require_equal_lengths(plot, reference_t_half_lives.size(), "reference times", smoluchowski_over_n0.size(),
                          "Smoluchowski values");
    if (!smoluchowski_transient_over_n0.empty())
        require_equal_lengths(plot, reference_t_half_lives.size(), "reference times",
                              smoluchowski_transient_over_n0.size(), "transient-corrected values");

    PlotSpec spec;
    spec.title = "Clusters / N0";
    spec.x_label = "t / t_half";
    spec.y_label = "clusters / N0";

    // Rule: x in [0, x_end], x_end the largest finite time of any series, 1 if none or <= 0.
    // A reference time only counts when that row has a curve value (it always has here).
    const double largest_time = std::max(largest_finite(measured_t_half_lives, 0.0),
                                         largest_finite(reference_t_half_lives, 0.0));
    spec.x = AxisRange{0.0, largest_time > 0.0 ? largest_time : 1.0, false};
    spec.y = AxisRange{0.0, 1.0, false};

    if (!smoluchowski_over_n0.empty())
        spec.series.push_back(Series{"Smoluchowski", reference_t_half_lives, smoluchowski_over_n0, Series::Style::line,
                                     plot_colours::smoluchowski});
    if (!smoluchowski_transient_over_n0.empty())
        spec.series.push_back(Series{"with transient", reference_t_half_lives, smoluchowski_transient_over_n0,
                                     Series::Style::dashed_line, plot_colours::transient_corrected});
    if (!measured_clusters_over_n0.empty())
        spec.series.push_back(Series{"measured", measured_t_half_lives, measured_clusters_over_n0, Series::Style::line,
                                     plot_colours::measured});
    if (std::isfinite(current_t_half_lives)) spec.current_x = current_t_half_lives;
    return spec;
}

}  // namespace brownfloc::viewer
