// Unwrapping a cluster across the periodic box: breadth-first over the bonds from member 0,
// each bond vector taken as its minimum image. Contract in analysis/cluster_geometry.hpp.
#include <cmath>
#include <queue>
#include <stdexcept>
#include <string>

#include "analysis/cluster_geometry.hpp"
#include "geometry_checks.hpp"
#include "message_text.hpp"

namespace brownfloc::analysis {

std::vector<Vec3> unwrap_cluster(std::span<const Vec3> wrapped_centres_m,
                                 std::span<const std::pair<std::size_t, std::size_t>> bonds,
                                 double box_length_m) {
    if (!(box_length_m > 0.0) || !std::isfinite(box_length_m))
        throw std::invalid_argument(
            detail::message("unwrap_cluster: box_length_m = ", box_length_m, ": must be finite and > 0"));
    const std::size_t count = wrapped_centres_m.size();
    if (count == 0) return {};
    detail::check_centres("unwrap_cluster", wrapped_centres_m);

    // Adjacency in compressed form (offsets + neighbour list), neighbours in bond order, so
    // the walk and hence the result depend only on the input.
    std::vector<std::size_t> offset(count + 1, 0);
    for (std::size_t b = 0; b < bonds.size(); ++b) {
        const auto [u, v] = bonds[b];
        if (u >= count || v >= count)
            throw std::invalid_argument(detail::message("unwrap_cluster: bond ", b, " = (", u, ", ", v,
                                                        "): indices must be < ", count, " (the number of members)"));
        ++offset[u + 1];
        ++offset[v + 1];
    }
    for (std::size_t i = 0; i < count; ++i) offset[i + 1] += offset[i];
    std::vector<std::size_t> neighbour(offset[count]), fill(offset.begin(), offset.end() - 1);
    for (const auto& [u, v] : bonds) {
        neighbour[fill[u]++] = v;
        neighbour[fill[v]++] = u;
    }

    std::vector<Vec3> unwrapped_m(count);
    std::vector<bool> reached(count, false);
    std::queue<std::size_t> frontier;
    unwrapped_m[0] = wrapped_centres_m[0];
    reached[0] = true;
    frontier.push(0);
    while (!frontier.empty()) {
        const std::size_t u = frontier.front();
        frontier.pop();
        for (std::size_t k = offset[u]; k < offset[u + 1]; ++k) {
            const std::size_t v = neighbour[k];
            if (reached[v]) continue;
            for (std::size_t d = 0; d < 3; ++d) {
                double step_m = wrapped_centres_m[v][d] - wrapped_centres_m[u][d];
                step_m -= box_length_m * std::round(step_m / box_length_m);  // minimum image
                unwrapped_m[v][d] = unwrapped_m[u][d] + step_m;
            }
            reached[v] = true;
            frontier.push(v);
        }
    }
    for (std::size_t i = 0; i < count; ++i)
        if (!reached[i])
            throw std::invalid_argument(detail::message("unwrap_cluster: member ", i, " of ", count,
                                                        " is not connected to member 0 by the ", bonds.size(),
                                                        " bonds given"));
    return unwrapped_m;
}

}  // namespace brownfloc::analysis
