#include "data/frame_analysis.hpp"

#include <algorithm>
#include <cmath>
#include <stdexcept>
#include <string>

#include "analysis/cluster_geometry.hpp"
#include "analysis/size_statistics.hpp"
#include "data/viewer_input_error.hpp"
#include "io/message_text.hpp"

namespace brownfloc::viewer {
namespace {

constexpr double metres_per_nm = 1e-9;
constexpr double nm_per_metre = 1e9;

void check_fits(const trajectory::TrajectoryHeader& header, const trajectory::TrajectoryFrame& frame) {
    const std::size_t n = header.radius_nm.size();
    if (n == 0) throw ViewerInputError("frame analysis: the header has no particles (radius_nm is empty)");
    for (std::size_t i = 0; i < n; ++i)
        if (!std::isfinite(header.radius_nm[i]) || header.radius_nm[i] <= 0.0)
            throw ViewerInputError(io::message("frame analysis: header radius_nm[", i, "] = ", header.radius_nm[i],
                                               ": must be finite and > 0"));
    if (frame.positions_nm.size() != 3 * n)
        throw ViewerInputError(io::message("frame analysis: frame at step ", frame.step, " has ", frame.positions_nm.size(),
                                           " position values; the header's N = ", n, " particles need ", 3 * n));
    if (frame.cluster.size() != n)
        throw ViewerInputError(io::message("frame analysis: frame at step ", frame.step, " has ", frame.cluster.size(),
                                           " cluster ids; the header's N = ", n, " particles need ", n));
    for (std::size_t i = 0; i < n; ++i)
        if (frame.cluster[i] >= n)
            throw ViewerInputError(io::message("frame analysis: frame at step ", frame.step, ": cluster[", i,
                                               "] = ", frame.cluster[i], ": must be < N = ", n));
    for (std::size_t k = 0; k < 3 * n; ++k)
        if (!std::isfinite(frame.positions_nm[k]))
            throw ViewerInputError(io::message("frame analysis: frame at step ", frame.step, ": particle ", k / 3,
                                               " has a position that is not finite (", frame.positions_nm[k], ")"));
}

// The run's primary radius: the plain mean of every particle's radius (RunRecorder::fractal
// sums then divides; the same order here). A sum that overflows (radii near 1e308, only from a
// forged header) falls back to a running mean.
double mean_radius_nm(const std::vector<double>& radii_nm) {
    double sum = 0.0;
    for (const double a : radii_nm) sum += a;
    const double mean = sum / static_cast<double>(radii_nm.size());
    if (std::isfinite(mean)) return mean;
    double running = 0.0;
    for (std::size_t i = 0; i < radii_nm.size(); ++i) running += (radii_nm[i] - running) / static_cast<double>(i + 1);
    return running;
}

}  // namespace

const ClusterSummary* FrameAnalysis::find(std::uint32_t cluster_id) const {
    const auto at = std::lower_bound(clusters.begin(), clusters.end(), cluster_id,
                                     [](const ClusterSummary& c, std::uint32_t id) { return c.id < id; });
    return at != clusters.end() && at->id == cluster_id ? &*at : nullptr;
}

FrameAnalysis analyse_frame(const trajectory::TrajectoryHeader& header, const trajectory::TrajectoryFrame& frame,
                            std::uint64_t seed) {
    check_fits(header, frame);
    const std::size_t n = header.radius_nm.size();

    // Members of each cluster id, ascending particle id within each (a counting sort: O(N)).
    std::vector<std::size_t> first(n + 1, 0);
    for (const std::uint32_t id : frame.cluster) ++first[id + 1];
    for (std::size_t id = 0; id < n; ++id) first[id + 1] += first[id];
    std::vector<std::uint32_t> members(n);
    {
        std::vector<std::size_t> next(first.begin(), first.end() - 1);
        for (std::size_t i = 0; i < n; ++i) members[next[frame.cluster[i]]++] = static_cast<std::uint32_t>(i);
    }
    std::vector<bool> spans(n, false);
    for (const std::uint32_t id : frame.spanning_clusters)
        if (id < n) spans[id] = true;

    FrameAnalysis result;
    result.mean_radius_nm = mean_radius_nm(header.radius_nm);
    std::vector<analysis::ClusterShape> shapes;
    std::vector<std::int64_t> sizes;
    std::vector<analysis::Vec3> centres_m;
    std::optional<std::uint32_t> overflowing_cluster;
    for (std::size_t id = 0; id < n; ++id) {
        const std::size_t begin = first[id], end = first[id + 1];
        if (begin == end) continue;
        ClusterSummary summary;
        summary.id = static_cast<std::uint32_t>(id);
        summary.size = static_cast<std::int64_t>(end - begin);
        summary.spans_box = spans[id];
        // As RunRecorder::cluster_rows: R_g in metres of the (whole) member centres, kept in
        // nm, and handed to the fit as nm * 1e-9; spanning clusters get none (0 in the fit).
        if (!summary.spans_box) {
            centres_m.clear();
            for (std::size_t k = begin; k < end; ++k) {
                const std::size_t i = members[k];
                centres_m.push_back({frame.positions_nm[3 * i] * metres_per_nm, frame.positions_nm[3 * i + 1] * metres_per_nm,
                                     frame.positions_nm[3 * i + 2] * metres_per_nm});
            }
            const double rg_nm = analysis::radius_of_gyration_m(centres_m) * nm_per_metre;
            if (std::isfinite(rg_nm)) {
                summary.radius_of_gyration_nm = rg_nm;
            } else if (!overflowing_cluster) {
                overflowing_cluster = summary.id;
            }
        }
        if (summary.size > result.largest_size) {  // strictly larger: ties keep the smaller id
            result.largest_size = summary.size;
            result.largest_cluster_id = summary.id;
        }
        shapes.push_back({summary.size, summary.radius_of_gyration_nm.value_or(0.0) * metres_per_nm, summary.spans_box});
        sizes.push_back(summary.size);
        result.clusters.push_back(summary);
    }
    result.size_count = analysis::size_histogram(sizes);

    if (overflowing_cluster) {
        result.fractal.note = io::message("no fit: the radius of gyration of cluster ", *overflowing_cluster,
                                          " is not finite (positions too far apart to square)");
        return result;
    }
    try {
        result.fractal = analysis::fit_fractal_dimension(shapes, result.mean_radius_nm * metres_per_nm, seed);
    } catch (const std::invalid_argument& refused) {
        // Coincident centres in a qualifying cluster (R_g = 0): only a forged or hand-made frame.
        result.fractal = analysis::FractalFit{};
        result.fractal.note = io::message("no fit: ", refused.what());
    }
    // No NaN or infinity leaves here (a slope near 0 from forged positions would give one).
    analysis::FractalFit& fit = result.fractal;
    const auto finite_or_empty = [](const std::optional<double>& v) { return !v || std::isfinite(*v); };
    if (!finite_or_empty(fit.dimension) || !finite_or_empty(fit.dimension_error) || !finite_or_empty(fit.prefactor)) {
        std::string note = "no fit: the fit gave a value that is not finite (";
        note += fit.note;
        note += ")";
        fit = analysis::FractalFit{};
        fit.note = note;
    }
    return result;
}

}  // namespace brownfloc::viewer
