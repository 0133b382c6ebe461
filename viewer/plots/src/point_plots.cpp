// Plots 2 and 3: per-cluster points at the current frame, log-log. Range rules in
// plot_layout.hpp.
#include "plots/plot_builders.hpp"

#include "builder_support.hpp"

#include <algorithm>
#include <cmath>

namespace brownfloc::viewer {

std::vector<std::size_t> strided_subset(std::size_t count, std::size_t max_count) {
    // Below 2^32, i * (count % max_count) cannot overflow 64 bits (see the header).
    max_count = std::min<std::size_t>(max_count, 0xFFFF'FFFFu);
    const std::size_t kept = std::min(count, max_count);
    std::vector<std::size_t> indices(kept);
    if (kept == 0) return indices;
    if (kept == count) {
        for (std::size_t i = 0; i < kept; ++i) indices[i] = i;
        return indices;
    }
    // floor(i * count / max_count) = i * q + floor(i * r / max_count) with count = q * max_count + r.
    const std::size_t quotient = count / max_count, remainder = count % max_count;
    for (std::size_t i = 0; i < kept; ++i) indices[i] = i * quotient + i * remainder / max_count;
    return indices;
}

PlotSpec size_distribution_plot(const std::vector<std::pair<std::int64_t, std::int64_t>>& size_count) {
    PlotSpec spec;
    spec.title = "Size distribution";
    spec.x_label = "size k";
    spec.y_label = "n_k";
    Series points{"", {}, {}, Series::Style::points, plot_colours::cluster_points};
    double largest_size = 1.0, largest_count = 1.0;
    for (const auto& [size, count] : size_count) {
        if (size < 1 || count < 1) continue;
        const auto k = static_cast<double>(size);
        const auto n_k = static_cast<double>(count);
        points.x.push_back(k);
        points.y.push_back(n_k);
        largest_size = std::max(largest_size, k);
        largest_count = std::max(largest_count, n_k);
    }
    spec.x = AxisRange{0.8, builder_support::scaled_positive(largest_size, 1.25), true};
    spec.y = AxisRange{0.8, builder_support::scaled_positive(largest_count, 1.25), true};
    if (!points.x.empty()) spec.series.push_back(std::move(points));
    return spec;
}

std::string fractal_dimension_note(double dimension, double dimension_error) {
    std::string note = "d_f = ";
    if (!std::isfinite(dimension)) {
        note += "n/a";
        return note;
    }
    note += builder_support::fixed_text(dimension, 2);
    if (std::isfinite(dimension_error)) {
        note += " +- ";
        note += builder_support::fixed_text(dimension_error, 2);
    }
    return note;
}

namespace {

bool usable_fit(const FractalLine& fit) {
    return std::isfinite(fit.dimension) && fit.dimension > 0.0 && std::isfinite(fit.prefactor) && fit.prefactor > 0.0 &&
           fit.smallest_size >= 1 && fit.smallest_size <= fit.largest_size;
}

}  // namespace

PlotSpec gyration_plot(const std::vector<std::int64_t>& sizes, const std::vector<double>& rg_over_radius,
                       std::optional<FractalLine> fit, std::string fit_note) {
    builder_support::require_equal_lengths("gyration plot", sizes.size(), "cluster sizes", rg_over_radius.size(),
                                           "R_g / a values");
    PlotSpec spec;
    spec.title = "R_g / a against size";
    spec.x_label = "size k";
    spec.y_label = "R_g / a";
    spec.legend_corner = LegendCorner::top_left;  // the points rise to the top right

    std::vector<std::size_t> usable;
    double largest_size = 1.0, smallest_rg = 0.0, largest_rg = 0.0;
    for (std::size_t i = 0; i < sizes.size(); ++i) {
        const double rg = rg_over_radius[i];
        if (sizes[i] < 1 || !std::isfinite(rg) || !(rg > 0.0)) continue;
        largest_size = std::max(largest_size, static_cast<double>(sizes[i]));
        smallest_rg = usable.empty() ? rg : std::min(smallest_rg, rg);
        largest_rg = usable.empty() ? rg : std::max(largest_rg, rg);
        usable.push_back(i);
    }
    spec.x = AxisRange{0.8, builder_support::scaled_positive(largest_size, 1.25), true};
    spec.y = usable.empty() ? AxisRange{1.0, 10.0, true}
                            : AxisRange{builder_support::scaled_positive(smallest_rg, 0.8),
                                        builder_support::scaled_positive(largest_rg, 1.25), true};

    if (!usable.empty()) {
        Series points{"", {}, {}, Series::Style::points, plot_colours::cluster_points};
        for (const std::size_t pick : strided_subset(usable.size(), max_gyration_points)) {
            points.x.push_back(static_cast<double>(sizes[usable[pick]]));
            points.y.push_back(rg_over_radius[usable[pick]]);
        }
        spec.series.push_back(std::move(points));
    }
    if (fit && usable_fit(*fit)) {
        Series line{"fit", {}, {}, Series::Style::line, plot_colours::fit_line};
        // A power law is a straight line on log-log axes: its two ends define it.
        for (const std::int64_t k : {fit->smallest_size, fit->largest_size}) {
            line.x.push_back(static_cast<double>(k));
            line.y.push_back(std::pow(static_cast<double>(k) / fit->prefactor, 1.0 / fit->dimension));
        }
        spec.series.push_back(std::move(line));
    }
    if (!fit_note.empty())
        spec.notes.push_back(std::move(fit_note));
    else if (fit)
        spec.notes.push_back(fractal_dimension_note(fit->dimension, fit->dimension_error));
    return spec;
}

}  // namespace brownfloc::viewer
