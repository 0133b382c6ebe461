// Fractal dimension from binned (ln n, ln R_g) with a bootstrap error; method and sources in
// analysis/fractal_fit.hpp.
#include "analysis/fractal_fit.hpp"

#include <algorithm>
#include <bit>
#include <cmath>
#include <cstdio>
#include <map>
#include <optional>
#include <stdexcept>
#include <string>
#include <vector>

#include "message_text.hpp"
#include "splitmix64.hpp"

namespace brownfloc::analysis {
namespace {

struct Point {
    int bin;          // floor(log2 n)
    double log_size;  // ln n
    double log_rg;    // ln R_g (R_g in m)
};

struct LineFit {
    double slope = 0.0, intercept = 0.0;
    std::size_t bins = 0;
};

// Rules 2-4: bin means on the fixed ln 2 grid, then unweighted least squares over them.
// Returns nothing and says why in `why` when fewer than 2 bins are populated or the slope is
// not positive.
std::optional<LineFit> fit_binned_line(const std::vector<Point>& points, const std::vector<std::size_t>& use,
                                       std::string& why) {
    struct Bin { double sum_x = 0.0, sum_y = 0.0; std::size_t count = 0; };
    std::map<int, Bin> bins;  // ordered by bin, so the sums below run in a fixed order
    for (std::size_t i : use) {
        Bin& bin = bins[points[i].bin];
        bin.sum_x += points[i].log_size;
        bin.sum_y += points[i].log_rg;
        ++bin.count;
    }
    if (bins.size() < 2) {
        why = detail::message("only ", bins.size(), " size bin (width ln 2) populated: need at least 2");
        return std::nullopt;
    }
    double mean_x = 0.0, mean_y = 0.0;
    for (const auto& [k, bin] : bins) {
        mean_x += bin.sum_x / static_cast<double>(bin.count);
        mean_y += bin.sum_y / static_cast<double>(bin.count);
    }
    const double bin_count = static_cast<double>(bins.size());
    mean_x /= bin_count;
    mean_y /= bin_count;
    double sxx = 0.0, sxy = 0.0;
    for (const auto& [k, bin] : bins) {
        const double dx = bin.sum_x / static_cast<double>(bin.count) - mean_x;
        sxx += dx * dx;
        sxy += dx * (bin.sum_y / static_cast<double>(bin.count) - mean_y);
    }
    LineFit fit{sxy / sxx, 0.0, bins.size()};
    fit.intercept = mean_y - fit.slope * mean_x;
    if (!(fit.slope > 0.0)) {
        why = detail::message("fitted slope d ln R_g / d ln n = ", fit.slope, " is not positive");
        return std::nullopt;
    }
    return fit;
}

}  // namespace

FractalFit fit_fractal_dimension(std::span<const ClusterShape> clusters, double primary_radius_m,
                                 std::uint64_t seed) {
    if (!(primary_radius_m > 0.0) || !std::isfinite(primary_radius_m))
        throw std::invalid_argument(
            detail::message("fit_fractal_dimension: primary_radius_m = ", primary_radius_m, ": must be finite and > 0"));
    // Rule 1: non-spanning clusters of at least fractal_min_cluster_size particles.
    std::vector<Point> points;
    std::int64_t smallest = 0, largest = 0, spanning = 0, too_small = 0;
    for (std::size_t i = 0; i < clusters.size(); ++i) {
        const ClusterShape& c = clusters[i];
        if (c.spans_box) { ++spanning; continue; }
        if (c.size < fractal_min_cluster_size) { ++too_small; continue; }
        if (!(c.radius_of_gyration_m > 0.0) || !std::isfinite(c.radius_of_gyration_m))
            throw std::invalid_argument(detail::message("fit_fractal_dimension: cluster ", i, " (size ", c.size,
                                                        ") has radius_of_gyration_m = ", c.radius_of_gyration_m,
                                                        ": must be finite and > 0"));
        const int bin = static_cast<int>(std::bit_width(static_cast<std::uint64_t>(c.size))) - 1;
        points.push_back({bin, std::log(static_cast<double>(c.size)), std::log(c.radius_of_gyration_m)});
        smallest = points.size() == 1 ? c.size : std::min(smallest, c.size);
        largest = std::max(largest, c.size);
    }

    FractalFit result;
    result.clusters_used = static_cast<std::int64_t>(points.size());
    const std::string left_out =
        detail::message(" (", spanning, " spanning and ", too_small, " smaller than ", fractal_min_cluster_size, " left out)");
    if (points.size() < fractal_min_clusters) {
        result.note = detail::message("only ", points.size(), " clusters qualify", left_out, ": need at least ",
                                      fractal_min_clusters);
        return result;
    }
    const double span = static_cast<double>(largest) / static_cast<double>(smallest);
    if (span < fractal_min_size_span) {
        char text[160];
        std::snprintf(text, sizeof text, "qualifying sizes run %lld-%lld, a factor %.2f: need a factor of at least %g",
                      static_cast<long long>(smallest), static_cast<long long>(largest), span, fractal_min_size_span);
        result.note = text;
        return result;
    }

    std::vector<std::size_t> all(points.size());
    for (std::size_t i = 0; i < all.size(); ++i) all[i] = i;
    std::string why;
    const std::optional<LineFit> fit = fit_binned_line(points, all, why);
    if (!fit) {
        result.note = why;
        return result;
    }
    const double dimension = 1.0 / fit->slope;
    result.dimension = dimension;
    result.prefactor = std::exp(dimension * (std::log(primary_radius_m) - fit->intercept));

    // Rule 6: bootstrap over clusters. Resamples whose fit fails (one bin, slope <= 0) are
    // skipped and counted in the note.
    detail::SplitMix64 generator{detail::derive_seed(seed, 0x46726163ULL)};
    std::vector<std::size_t> resample(points.size());
    double mean = 0.0, sum_squared_deviation = 0.0;
    int fitted = 0;
    for (int b = 0; b < fractal_bootstrap_resamples; ++b) {
        for (std::size_t& i : resample) i = generator.index_below(points.size());
        std::string ignored;
        const std::optional<LineFit> refit = fit_binned_line(points, resample, ignored);
        if (!refit) continue;
        const double x = 1.0 / refit->slope;
        ++fitted;
        const double delta = x - mean;  // Welford (1962) running variance
        mean += delta / fitted;
        sum_squared_deviation += delta * (x - mean);
    }
    if (fitted >= 2) result.dimension_error = std::sqrt(sum_squared_deviation / (fitted - 1));

    char text[320];
    std::snprintf(text, sizeof text,
                  "R_g from sphere centres; %zu clusters, sizes %lld-%lld, %zu bins of width ln 2; unweighted least "
                  "squares of ln R_g on ln n over bin means; error = sd over %d of %d bootstrap resamples",
                  points.size(), static_cast<long long>(smallest), static_cast<long long>(largest), fit->bins, fitted,
                  fractal_bootstrap_resamples);
    result.note = text;
    return result;
}

}  // namespace brownfloc::analysis
