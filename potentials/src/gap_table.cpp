#include "potentials/gap_table.hpp"

#include "potentials/constants.hpp"

namespace brownfloc::potentials::detail {

void cubic_through(const double nodes[4], const double values[4], double out[4]) {
    // Newton divided differences, then p(t) = d0 + (t-t0)(d1 + (t-t1)(d2 + (t-t2) d3))
    // expanded into monomials from the inside out.
    double d[4] = {values[0], values[1], values[2], values[3]};
    for (int level = 1; level < 4; ++level)
        for (int k = 3; k >= level; --k) d[k] = (d[k] - d[k - 1]) / (nodes[k] - nodes[k - level]);
    double c[4] = {d[3], 0, 0, 0};
    int degree = 0;
    for (int k = 2; k >= 0; --k) {
        for (int j = degree + 1; j >= 1; --j) c[j] = c[j - 1] - nodes[k] * c[j];  // c *= (t - t_k)
        c[0] = -nodes[k] * c[0] + d[k];
        ++degree;
    }
    for (int j = 0; j < 4; ++j) out[j] = c[j];
}

const double* chebyshev_nodes_01() {
    static const double nodes[4] = {
        0.5 * (1.0 - std::cos(1 * constants::pi / 8.0)), 0.5 * (1.0 - std::cos(3 * constants::pi / 8.0)),
        0.5 * (1.0 - std::cos(5 * constants::pi / 8.0)), 0.5 * (1.0 - std::cos(7 * constants::pi / 8.0))};
    return nodes;
}

}  // namespace brownfloc::potentials::detail
