#include "analysis/union_find.hpp"

#include <cassert>
#include <numeric>
#include <utility>

namespace brownfloc::analysis {

UnionFind::UnionFind(std::size_t n) : parent_(n), size_(n, 1), set_count_{n} {
    std::iota(parent_.begin(), parent_.end(), std::size_t{0});
}

std::size_t UnionFind::find(std::size_t i) {
    assert(i < parent_.size());
    // Path halving (Tarjan & van Leeuwen 1984): every other node on the path skips to its
    // grandparent. Parents only ever point to smaller ids, so the root stays the minimum.
    while (parent_[i] != i) {
        parent_[i] = parent_[parent_[i]];
        i = parent_[i];
    }
    return i;
}

std::size_t UnionFind::unite(std::size_t a, std::size_t b) {
    std::size_t root_a = find(a), root_b = find(b);
    if (root_a == root_b) return root_a;
    if (root_b < root_a) std::swap(root_a, root_b);
    // root_a < root_b: the smaller id stays root, which keeps "cluster id = smallest id".
    parent_[root_b] = root_a;
    size_[root_a] += size_[root_b];
    --set_count_;
    return root_a;
}

std::size_t UnionFind::size_of(std::size_t i) { return size_[find(i)]; }

std::vector<std::size_t> UnionFind::roots() {
    std::vector<std::size_t> root_of(parent_.size());
    for (std::size_t i = 0; i < parent_.size(); ++i) root_of[i] = find(i);
    return root_of;
}

std::vector<std::size_t> UnionFind::set_sizes() {
    std::vector<std::size_t> sizes;
    sizes.reserve(set_count_);
    for (std::size_t i = 0; i < parent_.size(); ++i)
        if (find(i) == i) sizes.push_back(size_[i]);
    return sizes;
}

}  // namespace brownfloc::analysis
