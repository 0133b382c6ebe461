#include <catch2/catch.hpp>
#include <cmath>

#include "sim/coagulation_reference.hpp"

using namespace brownfloc::sim;
using Catch::Matchers::WithinAbs;
using Catch::Matchers::WithinRel;

TEST_CASE("the constant-kernel total count halves at the half-life", "[sim][kinetics]") {
    // Smoluchowski (1917): N/N0 = 1/(1 + t/tau). Closed form: rounding error only.
    CHECK(constant_kernel_fraction(0.0, 3.0) == 1.0);
    CHECK_THAT(constant_kernel_fraction(3.0, 3.0), WithinRel(0.5, 1e-15));
    CHECK_THAT(constant_kernel_fraction(27.0, 3.0), WithinRel(0.1, 1e-15));
}

TEST_CASE("constant-kernel size fractions add up to the total count and conserve mass", "[sim][kinetics]") {
    // Sum_k n_k = N and sum_k k n_k = N0 (Smoluchowski 1917). At t = 2 tau the ratio
    // x/(1+x) = 2/3, so the terms past k = 200 are below (2/3)^200 ~ 1e-35: the sums are exact
    // to rounding, allowed 1e-13 for 200 terms.
    for (double t_s : {0.5, 2.0, 6.0}) {
        const double tau_s = 1.0;
        double count = 0.0, mass = 0.0;
        for (int k = 1; k <= 400; ++k) {
            const double nk = constant_kernel_size_fraction(k, t_s, tau_s);
            count += nk;
            mass += k * nk;
        }
        CHECK_THAT(count, WithinRel(constant_kernel_fraction(t_s, tau_s), 1e-13));
        CHECK_THAT(mass, WithinRel(1.0, 1e-13));
    }
    // Monomers: 1/(1 + t/tau)^2; doublets at t = tau: 1/8.
    CHECK_THAT(constant_kernel_size_fraction(1, 1.0, 1.0), WithinRel(0.25, 1e-15));
    CHECK_THAT(constant_kernel_size_fraction(2, 1.0, 1.0), WithinRel(0.125, 1e-15));
    CHECK(constant_kernel_size_fraction(3, 0.0, 1.0) == 0.0);
}

TEST_CASE("the transient-corrected count reduces to the constant kernel when diffusion is infinite",
          "[sim][kinetics]") {
    const double k = 1.2e-17, n0 = 2e16, tau_s = 2.0 / (k * n0);
    for (double t_s : {0.0, 1.0, 10.0, 100.0})
        CHECK_THAT(transient_corrected_fraction(t_s, k, n0, 1e-6, INFINITY),
                   WithinRel(constant_kernel_fraction(t_s, tau_s), 1e-14));
}

TEST_CASE("the transient-corrected count follows the time-dependent Smoluchowski rate", "[sim][kinetics]") {
    // d(1/n)/dt must equal (k/2)(1 + R/sqrt(pi D t)) (Smoluchowski 1917). Central differences
    // with step 1e-4 t: truncation ~1e-9 relative, rounding ~1e-16/1e-4 ~ 1e-11 of 1/n.
    const double k = 1.2e-17, n0 = 2e16, r = 1e-6, d = 9.8e-13;
    for (double t_s : {0.01, 0.3, 5.0, 40.0}) {
        const double step = 1e-4 * t_s;
        auto inverse_n = [&](double t) { return 1.0 / (n0 * transient_corrected_fraction(t, k, n0, r, d)); };
        const double slope = (inverse_n(t_s + step) - inverse_n(t_s - step)) / (2.0 * step);
        const double expected = 0.5 * k * (1.0 + r / std::sqrt(3.14159265358979323846 * d * t_s));
        CHECK_THAT(slope, WithinRel(expected, 1e-6));
    }
    // The transient makes early aggregation faster: at t = 1 s here R/sqrt(pi D t) = 0.57.
    CHECK(transient_corrected_fraction(1.0, k, n0, r, d) < transient_corrected_fraction(1.0, k, n0, r, INFINITY));
    CHECK_THAT(transient_integrated_time_s(4.0, 0.0, d), WithinAbs(4.0, 0.0));
}
