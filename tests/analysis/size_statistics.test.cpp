#include <catch2/catch.hpp>

#include <cstdint>
#include <stdexcept>
#include <utility>
#include <vector>

#include "analysis/size_statistics.hpp"

using namespace brownfloc::analysis;
using Catch::Matchers::WithinRel;

TEST_CASE("size statistics of a hand-made list", "[analysis][sizes]") {
    // 10 clusters, 30 particles: sizes 1 1 1 1 2 2 3 5 6 8. By hand: number average 30/10 = 3;
    // sum k^2 = 4 + 8 + 9 + 25 + 36 + 64 = 146, weight average 146/30. Tolerance: rounding only.
    const std::vector<std::int64_t> sizes{5, 1, 2, 1, 8, 3, 1, 6, 2, 1};
    const SizeStatistics stats = size_statistics(sizes);
    CHECK(stats.clusters == 10);
    CHECK(stats.monomers == 4);
    CHECK(stats.doublets == 2);
    CHECK(stats.triplets == 1);
    CHECK(stats.largest == 8);
    CHECK_THAT(stats.mean_size, WithinRel(3.0, 1e-15));
    CHECK_THAT(stats.weight_mean_size, WithinRel(146.0 / 30.0, 1e-15));

    using Row = std::pair<std::int64_t, std::int64_t>;
    CHECK(size_histogram(sizes) == std::vector<Row>{{1, 4}, {2, 2}, {3, 1}, {5, 1}, {6, 1}, {8, 1}});
}

TEST_CASE("all monomers have both averages equal to one, and no clusters gives zeros", "[analysis][sizes]") {
    const SizeStatistics monomers = size_statistics(std::vector<std::int64_t>(50, 1));
    CHECK(monomers.mean_size == 1.0);
    CHECK(monomers.weight_mean_size == 1.0);
    CHECK(monomers.largest == 1);
    const SizeStatistics none = size_statistics(std::vector<std::int64_t>{});
    CHECK(none.clusters == 0);
    CHECK(none.mean_size == 0.0);
    CHECK(size_histogram(std::vector<std::int64_t>{}).empty());
}

TEST_CASE("size statistics reject sizes below one", "[analysis][sizes][validation]") {
    CHECK_THROWS_WITH(size_statistics(std::vector<std::int64_t>{3, 0, 2}),
                      Catch::Contains("cluster 1 has size 0") && Catch::Contains(">= 1"));
    CHECK_THROWS_AS(size_histogram(std::vector<std::int64_t>{-1}), std::invalid_argument);
}
