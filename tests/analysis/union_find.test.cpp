#include <catch2/catch.hpp>

#include <vector>

#include "analysis/union_find.hpp"
#include "test_support.hpp"

using brownfloc::analysis::UnionFind;

TEST_CASE("new union-find sets are singletons rooted at themselves", "[analysis][union_find]") {
    UnionFind sets(6);
    CHECK(sets.set_count() == 6);
    CHECK(sets.element_count() == 6);
    for (std::size_t i = 0; i < 6; ++i) {
        CHECK(sets.find(i) == i);
        CHECK(sets.size_of(i) == 1);
    }
}

TEST_CASE("the root of every set is its smallest member, whatever the order of unions", "[analysis][union_find]") {
    // The project's rule: a cluster's id is its smallest particle id.
    UnionFind sets(10);
    CHECK(sets.unite(7, 9) == 7);
    CHECK(sets.unite(9, 4) == 4);
    CHECK(sets.unite(8, 2) == 2);
    CHECK(sets.unite(8, 9) == 2);  // {2, 8} joins {4, 7, 9}
    CHECK(sets.unite(4, 7) == 2);  // already together: unchanged
    for (std::size_t i : {2, 4, 7, 8, 9}) {
        CHECK(sets.find(i) == 2);
        CHECK(sets.size_of(i) == 5);
    }
    CHECK(sets.set_count() == 6);  // {0} {1} {2,4,7,8,9} {3} {5} {6}
    CHECK(sets.roots() == std::vector<std::size_t>{0, 1, 2, 3, 2, 5, 6, 2, 2, 2});
    CHECK(sets.set_sizes() == std::vector<std::size_t>{1, 1, 5, 1, 1, 1});
}

TEST_CASE("random unions agree with a brute-force labelling", "[analysis][union_find]") {
    // Reference: relabel every member of the absorbed set by hand, keeping the minimum label;
    // O(n) per union but obviously right. Seed 11; 300 ids, 250 random unions.
    const std::size_t n = 300;
    UnionFind sets(n);
    std::vector<std::size_t> label(n);
    for (std::size_t i = 0; i < n; ++i) label[i] = i;
    brownfloc::test::TestRandom random{11};
    for (int u = 0; u < 250; ++u) {
        const std::size_t a = random.next() % n, b = random.next() % n;
        const std::size_t keep = std::min(label[a], label[b]), drop = std::max(label[a], label[b]);
        for (std::size_t& l : label)
            if (l == drop) l = keep;
        CHECK(sets.unite(a, b) == keep);
    }
    std::size_t distinct = 0;
    for (std::size_t i = 0; i < n; ++i) {
        CHECK(sets.find(i) == label[i]);
        if (label[i] == i) ++distinct;
    }
    CHECK(sets.set_count() == distinct);
}
