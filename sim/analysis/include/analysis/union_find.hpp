#pragma once
// Disjoint sets over the ids 0..n-1, used to group bonded particles into clusters.
//
// The project's rule: a cluster's id is its smallest particle id. UnionFind keeps that
// rule as an invariant, so the root of every set IS the cluster id and no relabelling pass
// is needed: unite() always hangs the larger root under the smaller one.
//
//   UnionFind sets(5);
//   sets.unite(3, 1);          // returns 1
//   sets.unite(4, 3);          // returns 1
//   sets.find(4) == 1; sets.size_of(4) == 3; sets.set_count() == 3  ({0}, {1,3,4}, {2})
//
// Linking by smallest id rather than by size gives up the inverse-Ackermann bound; with path
// halving alone find() is O(log n) amortised (Tarjan & van Leeuwen 1984, J. ACM 31, 245),
// which is ample for cluster bookkeeping once per step. Deterministic: the result depends only
// on the sequence of calls. Not thread-safe: find() shortens paths, so it writes.
#include <cstddef>
#include <vector>

namespace brownfloc::analysis {

class UnionFind {
public:
    // n singleton sets {0}, ..., {n-1}.
    explicit UnionFind(std::size_t n);

    // Root (= smallest member id) of the set holding i; halves the path on the way. i < n.
    [[nodiscard]] std::size_t find(std::size_t i);

    // Merges the sets of a and b; returns the root of the merged set, which is the smaller of
    // the two roots. Uniting two members of one set changes nothing and returns its root.
    std::size_t unite(std::size_t a, std::size_t b);

    // Number of members in the set holding i.
    [[nodiscard]] std::size_t size_of(std::size_t i);

    // Number of disjoint sets.
    [[nodiscard]] std::size_t set_count() const { return set_count_; }

    // n, the number of ids.
    [[nodiscard]] std::size_t element_count() const { return parent_.size(); }

    // Root of every id, in id order (a cluster label per particle).
    [[nodiscard]] std::vector<std::size_t> roots();

    // Size of every set, ordered by its root (ascending smallest member id).
    [[nodiscard]] std::vector<std::size_t> set_sizes();

private:
    std::vector<std::size_t> parent_;
    std::vector<std::size_t> size_;  // valid at roots only
    std::size_t set_count_;
};

}  // namespace brownfloc::analysis
