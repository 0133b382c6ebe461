// Number- and weight-average cluster sizes and the size histogram.
#include "analysis/size_statistics.hpp"

#include <algorithm>
#include <stdexcept>
#include <string>

#include "message_text.hpp"

namespace brownfloc::analysis {
namespace {

void check_sizes(const char* function, std::span<const std::int64_t> cluster_sizes) {
    for (std::size_t i = 0; i < cluster_sizes.size(); ++i)
        if (cluster_sizes[i] < 1)
            throw std::invalid_argument(
                detail::message(function, ": cluster ", i, " has size ", cluster_sizes[i], ": sizes must be >= 1"));
}

}  // namespace

SizeStatistics size_statistics(std::span<const std::int64_t> cluster_sizes) {
    check_sizes("size_statistics", cluster_sizes);
    SizeStatistics stats;
    std::int64_t particles = 0, sum_squared_sizes = 0;
    for (std::int64_t k : cluster_sizes) {
        ++stats.clusters;
        if (k == 1) ++stats.monomers;
        if (k == 2) ++stats.doublets;
        if (k == 3) ++stats.triplets;
        stats.largest = std::max(stats.largest, k);
        particles += k;
        sum_squared_sizes += k * k;
    }
    if (stats.clusters > 0) {
        stats.mean_size = static_cast<double>(particles) / static_cast<double>(stats.clusters);
        stats.weight_mean_size = static_cast<double>(sum_squared_sizes) / static_cast<double>(particles);
    }
    return stats;
}

std::vector<std::pair<std::int64_t, std::int64_t>> size_histogram(std::span<const std::int64_t> cluster_sizes) {
    check_sizes("size_histogram", cluster_sizes);
    std::vector<std::int64_t> sorted(cluster_sizes.begin(), cluster_sizes.end());
    std::sort(sorted.begin(), sorted.end());
    std::vector<std::pair<std::int64_t, std::int64_t>> histogram;
    for (std::int64_t k : sorted) {
        if (histogram.empty() || histogram.back().first != k)
            histogram.emplace_back(k, 0);
        ++histogram.back().second;
    }
    return histogram;
}

}  // namespace brownfloc::analysis
