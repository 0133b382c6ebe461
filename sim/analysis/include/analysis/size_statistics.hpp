#pragma once
// Summary numbers of a cluster size distribution, from a list with one size (number of
// primary particles, >= 1) per cluster, monomers included. Pure functions, thread-safe.
//
//   std::vector<std::int64_t> sizes{1, 1, 2, 5};
//   size_statistics(sizes).mean_size == 9.0 / 4;  size_histogram(sizes) == {{1,2},{2,1},{5,1}}
#include <cstdint>
#include <span>
#include <utility>
#include <vector>

namespace brownfloc::analysis {

struct SizeStatistics {
    std::int64_t clusters = 0;   // number of clusters, monomers included
    std::int64_t monomers = 0;   // clusters of size 1
    std::int64_t doublets = 0;   // size 2
    std::int64_t triplets = 0;   // size 3
    std::int64_t largest = 0;    // largest size, 0 when there are no clusters
    // Number-average size, monomers included: sum_k k n_k / sum_k n_k = particles / clusters.
    double mean_size = 0.0;
    // Weight-average size: sum_k k^2 n_k / sum_k k n_k (what light scattering at low angle
    // weighs toward). Both averages are 0 when there are no clusters.
    double weight_mean_size = 0.0;
};

// Statistics of the sizes (each >= 1; std::invalid_argument naming the index otherwise).
// Sums are exact integers while the total particle count stays below 3e9 (sum k^2 <= (sum k)^2).
[[nodiscard]] SizeStatistics size_statistics(std::span<const std::int64_t> cluster_sizes);

// (size, number of clusters of that size), ascending by size, sizes with no cluster left out.
// Sizes must be >= 1.
[[nodiscard]] std::vector<std::pair<std::int64_t, std::int64_t>> size_histogram(
    std::span<const std::int64_t> cluster_sizes);

}  // namespace brownfloc::analysis
