#pragma once
// Helpers shared by the potentials tests.
#include <cmath>

#include "potentials/energy_slope.hpp"

namespace brownfloc::test {

// Central finite difference of an energy function at h with step rel_step * h.
// Truncation error ~ (rel_step h)^2 U''' / 6; rounding ~ eps U / (rel_step h).
template <class F>
double central_slope(const F& energy, double h, double rel_step = 1e-5) {
    const double dh = rel_step * h;
    return (energy(h + dh) - energy(h - dh)) / (2.0 * dh);
}

}  // namespace brownfloc::test
