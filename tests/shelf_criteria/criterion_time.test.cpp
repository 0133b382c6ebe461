// Times to the closed-form criteria and their values at a given time
// (shelf_criteria/criterion_time.hpp), against the constant-kernel solution of
// Smoluchowski (1917), Z. Phys. Chem. 92, 129: N/N0 = 1/(1+x), n_k/N0 = x^(k-1)/(1+x)^(k+1),
// x = t/τ.
#include <catch2/catch.hpp>
#include <cmath>
#include <limits>
#include <string>

#include "error_message.hpp"
#include "shelf_criteria/criterion_time.hpp"

using namespace brownfloc::shelf;
using test::spec_of;
using Catch::Matchers::Contains;
using Catch::Matchers::WithinAbs;
using Catch::Matchers::WithinRel;
using test::message_of;

namespace {

constexpr double primary_radius_m = 100e-9;


// Smoluchowski (1917): n_k/N0 at x = t/τ, written out here rather than taken from the library.
double size_fraction(int k, double x) {
    return std::pow(x, k - 1) / std::pow(1.0 + x, k + 1);
}

}  // namespace

TEST_CASE("time to a count drop is tau g over 1 minus g", "[shelf][closed-form]") {
    // Smoluchowski 1917: N/N0 = 1/(1 + t/τ) = 1 - g. Tolerance: closed form, rounding only.
    for (const double tau_s : {1.0, 3.7e5, 2.2e9})
        for (const double g : {1e-6, 0.01, 0.1, 0.5, 0.9, 0.999})
            CHECK_THAT(time_to_criterion_s(spec_of(Criterion::count_drop, g), tau_s, primary_radius_m),
                       WithinRel(tau_s * g / (1.0 - g), 1e-12));
}

TEST_CASE("time to a mean size v is tau times v minus 1", "[shelf][closed-form]") {
    // Smoluchowski 1917: N0/N = 1 + t/τ = v. Tolerance: closed form, rounding only.
    for (const double tau_s : {1.0, 3.7e5, 2.2e9})
        for (const double v : {1.000001, 1.1, 1.5, 2.0, 10.0, 1e6})
            CHECK_THAT(time_to_criterion_s(spec_of(Criterion::mean_size, v), tau_s, primary_radius_m),
                       WithinRel(tau_s * (v - 1.0), 1e-12));
}

TEST_CASE("time to an aggregated fraction g is tau times one over root of 1 minus g minus 1", "[shelf][closed-form]") {
    // Smoluchowski 1917: 1 - n1/N0 = 1 - 1/(1+x)² = g. Tolerance: closed form; g >= 0.01 so
    // that the direct form 1/√(1-g) - 1 itself loses under 1e-13 to cancellation.
    for (const double tau_s : {1.0, 3.7e5, 2.2e9})
        for (const double g : {0.01, 0.1, 0.5, 0.75, 0.9, 0.999})
            CHECK_THAT(time_to_criterion_s(spec_of(Criterion::aggregated_fraction, g), tau_s, primary_radius_m),
                       WithinRel(tau_s * (1.0 / std::sqrt(1.0 - g) - 1.0), 1e-12));
    // Small g: x = g/2 + 3g²/8 + ... (the series of (1-g)^(-1/2) - 1); relative error of the
    // two terms kept is 5g²/8 < 1e-18 at g = 1e-9.
    const double g = 1e-9;
    CHECK_THAT(criterion_t_over_tau(spec_of(Criterion::aggregated_fraction, g), primary_radius_m),
               WithinRel(g / 2.0 + 3.0 * g * g / 8.0, 1e-15));
}

TEST_CASE("each closed-form criterion reads back its own value at its time", "[shelf][round-trip]") {
    // criterion_at(time_to_criterion / τ) = value. Smoluchowski 1917; tolerance: rounding of
    // a formula and its inverse (a few ulps of 1/(1-g) near g = 0.999).
    for (const Criterion criterion : {Criterion::count_drop, Criterion::aggregated_fraction})
        for (const double g : {1e-9, 0.01, 0.1, 0.5, 0.9, 0.999}) {
            const CriterionSpec spec = spec_of(criterion, g);
            const double tau_s = 4.2e6;
            const double t_s = time_to_criterion_s(spec, tau_s, primary_radius_m);
            CHECK_THAT(criterion_at(spec, t_s / tau_s, primary_radius_m), WithinRel(g, 1e-12));
        }
    for (const double v : {1.000001, 1.1, 2.0, 1e6}) {
        const CriterionSpec spec = spec_of(Criterion::mean_size, v);
        const double tau_s = 4.2e6;
        const double t_s = time_to_criterion_s(spec, tau_s, primary_radius_m);
        CHECK_THAT(criterion_at(spec, t_s / tau_s, primary_radius_m), WithinRel(v, 1e-12));
    }
}

TEST_CASE("the aggregated fraction equals the mass in clusters of two or more from a direct sum of n_k", "[shelf][closed-form]") {
    // Smoluchowski 1917: 1 - n1/N0 = Σ_{k>=2} k n_k/N0 (mass is conserved, Σ k n_k = N0).
    // The sum runs until the terms fall below 1e-18 of it; tolerance: summation rounding.
    const CriterionSpec spec = spec_of(Criterion::aggregated_fraction, 0.5);
    for (const double x : {1e-3, 0.1, 0.5, 1.0, 3.0}) {
        double in_clusters = 0.0;
        for (int k = 2; k < 100000; ++k) {
            const double term = k * size_fraction(k, x);
            in_clusters += term;
            if (term < 1e-18 * in_clusters) break;
        }
        CHECK_THAT(criterion_at(spec, x, primary_radius_m), WithinRel(in_clusters, 1e-12));
        CHECK_THAT(criterion_at(spec, x, primary_radius_m), WithinRel(1.0 - size_fraction(1, x), 1e-12));
    }
}

TEST_CASE("the mean size equals N0 over N summed from n_k", "[shelf][closed-form]") {
    // Smoluchowski 1917: N/N0 = Σ_k n_k/N0 = 1/(1+x), so the mean size N0/N = 1 + x.
    // Tolerance: summation rounding.
    const CriterionSpec spec = spec_of(Criterion::mean_size, 2.0);
    for (const double x : {1e-3, 0.1, 0.5, 1.0, 3.0}) {
        double clusters = 0.0;
        for (int k = 1; k < 100000; ++k) {
            const double term = size_fraction(k, x);
            clusters += term;
            if (term < 1e-18 * clusters) break;
        }
        CHECK_THAT(criterion_at(spec, x, primary_radius_m), WithinRel(1.0 / clusters, 1e-12));
        CHECK_THAT(criterion_at(spec_of(Criterion::count_drop, 0.1), x, primary_radius_m),
                   WithinRel(1.0 - clusters, 1e-12));
    }
}

TEST_CASE("criterion values at time zero are those of a fresh dispersion", "[shelf][closed-form]") {
    CHECK(criterion_at(spec_of(Criterion::count_drop, 0.1), 0.0, primary_radius_m) == 0.0);
    CHECK(criterion_at(spec_of(Criterion::mean_size, 2.0), 0.0, primary_radius_m) == 1.0);
    CHECK(criterion_at(spec_of(Criterion::aggregated_fraction, 0.1), 0.0, primary_radius_m) == 0.0);
    CHECK(criterion_at(spec_of(Criterion::z_average_growth, 0.1), 0.0, primary_radius_m) == 0.0);
}

TEST_CASE("criterion values stay finite at the largest times", "[shelf][closed-form]") {
    const double huge = std::numeric_limits<double>::max();
    CHECK(criterion_at(spec_of(Criterion::count_drop, 0.1), huge, primary_radius_m) == 1.0);
    CHECK(criterion_at(spec_of(Criterion::aggregated_fraction, 0.1), huge, primary_radius_m) == 1.0);
    CHECK(criterion_at(spec_of(Criterion::mean_size, 2.0), huge, primary_radius_m) == huge);
}

TEST_CASE("bad tau radius or time are refused naming the value", "[shelf][errors]") {
    const double nan = std::numeric_limits<double>::quiet_NaN();
    const double inf = std::numeric_limits<double>::infinity();
    const CriterionSpec spec;
    for (const double bad_tau : {0.0, -1.0, nan, inf})
        CHECK_THAT(message_of([&] { (void)time_to_criterion_s(spec, bad_tau, primary_radius_m); }),
                   Contains("tau_s = ") && Contains("finite and > 0"));
    for (const double bad_radius : {0.0, -1e-7, nan, inf})
        CHECK_THAT(message_of([&] { (void)time_to_criterion_s(spec, 1.0, bad_radius); }),
                   Contains("primary_radius_m = ") && Contains("finite and > 0"));
    for (const double bad_x : {-1e-9, nan, inf})
        CHECK_THAT(message_of([&] { (void)criterion_at(spec, bad_x, primary_radius_m); }),
                   Contains("criterion count-drop: t/tau = ") && Contains(">= 0"));
    // A bad value is refused by time_to_criterion_s and criterion_at alike.
    CHECK_THAT(message_of([] { (void)time_to_criterion_s(spec_of(Criterion::mean_size, 0.5), 1.0, primary_radius_m); }),
               Contains("criterion mean-size: criterion_value = 0.5"));
}

TEST_CASE("a time that overflows a double is a range error not inf", "[shelf][errors]") {
    const double g = std::nextafter(1.0, 0.0);  // t/τ = g/(1-g) ≈ 9e15
    const std::string message = message_of<std::range_error>(
        [&] { (void)time_to_criterion_s(spec_of(Criterion::count_drop, g), 1e300, primary_radius_m); });
    CHECK_THAT(message, Contains("overflows a double") && Contains("count-drop") && Contains("tau_s = 1e+300"));
}
