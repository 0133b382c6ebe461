#pragma once
// Build the four plots' specs from plain inputs, applying the range rules written in
// plot_layout.hpp. Plain C++ (no SFML); the viewer computes no physics, so every curve comes
// in as sampled arrays from the run files or the trajectory header.
//
// Input rules, the same for all four: arrays that belong together must have equal lengths
// (otherwise PlotError names the plot and both lengths); non-finite values are kept in line
// series (the line breaks there) and dropped from point series; on log axes points that are
// not positive are dropped. An empty input gives an empty plot with the default ranges.
//
//   auto spec = clusters_plot(t_run, clusters_over_n0, t_ref, smoluchowski, transient, 1.7);
//   draw_plot(window, spec, layout.plot_outer[0], layout.plot_data[0], font);
#include "plots/plot_spec.hpp"

#include <cstddef>
#include <cstdint>
#include <optional>
#include <string>
#include <utility>
#include <vector>

namespace brownfloc::viewer {

// Plot 1: "Clusters / N0" against t / t_half (linear). Measured clusters / N0 at the measured
// times (half-lives) as a line; the plain Smoluchowski curve (solid) and the
// transient-corrected one (dashed; may be empty) at the reference times; the current time
// (half-lives) as a marker when finite.
[[nodiscard]] PlotSpec clusters_plot(const std::vector<double>& measured_t_half_lives,
                                     const std::vector<double>& measured_clusters_over_n0,
                                     const std::vector<double>& reference_t_half_lives,
                                     const std::vector<double>& smoluchowski_over_n0,
                                     const std::vector<double>& smoluchowski_transient_over_n0,
                                     double current_t_half_lives);

// Plot 2: number of clusters n_k of each size k at the current frame, log-log points.
// Pairs are (size k, count n_k); pairs with k < 1 or n_k < 1 are dropped.
[[nodiscard]] PlotSpec size_distribution_plot(const std::vector<std::pair<std::int64_t, std::int64_t>>& size_count);

// At most this many R_g points are drawn (plot 3); more are thinned by strided_subset.
inline constexpr std::size_t max_gyration_points = 2000;

// Indices of an evenly strided, deterministic subset of 0..count-1: all of them when
// count <= max_count, otherwise floor(i * count / max_count) for i = 0..max_count-1
// (increasing, distinct, starting at 0). max_count above 2^32 - 1 is treated as 2^32 - 1.
[[nodiscard]] std::vector<std::size_t> strided_subset(std::size_t count, std::size_t max_count);

// A fitted fractal law N = prefactor * (R_g / a)^dimension over sizes
// [smallest_size, largest_size]; dimension_error is its standard error.
struct FractalLine {
    double dimension, dimension_error, prefactor;
    std::int64_t smallest_size, largest_size;
};

// "d_f = 1.78 +- 0.05" (two decimals); "d_f = n/a" when the dimension is not finite, and the
// "+- ..." part left out when the error is not finite.
[[nodiscard]] std::string fractal_dimension_note(double dimension, double dimension_error);

// Plot 3: R_g / a of each cluster against its size at the current frame, log-log points (at
// most max_gyration_points, chosen by strided_subset among the usable points, in input
// order). With a usable fit (dimension and prefactor finite and > 0, 1 <= smallest <= largest)
// the line R_g/a = (k / prefactor)^(1 / dimension) for k in [smallest, largest]. The note is
// fit_note, or fractal_dimension_note of the fit when fit_note is empty and a fit is given.
[[nodiscard]] PlotSpec gyration_plot(const std::vector<std::int64_t>& sizes, const std::vector<double>& rg_over_radius,
                                     std::optional<FractalLine> fit, std::string fit_note);

// One species pair's interaction curve: U/kT at gaps h (nm), its barrier (gap in nm and height
// in kT, absent when the curve has no barrier) and the capture gap (nm).
struct PairCurve {
    std::string label;
    std::vector<double> gap_nm, energy_kT;
    std::optional<double> barrier_gap_nm, barrier_kT;
    double capture_gap_nm;
};

// "barrier 12.3 kT": the label of a barrier marker (one decimal).
[[nodiscard]] std::string barrier_label(double barrier_kT);

// Plot 4: U/kT against h (nm), one line per pair (colours plot_colours::pair_curves in order);
// a marker at each finite barrier gap (barrier_label) and at each distinct finite capture gap
// ("capture").
[[nodiscard]] PlotSpec interaction_plot(const std::vector<PairCurve>& curves);

}  // namespace brownfloc::viewer
