#include <catch2/catch.hpp>
#include <cmath>
#include <cstdint>
#include <string>

#include "potentials/extrema.hpp"
#include "potentials/fast_stability_ratio.hpp"
#include "potentials/input_error.hpp"
#include "potentials/stability_ratio.hpp"

using namespace brownfloc::potentials;
using Catch::Matchers::Contains;
using Catch::Matchers::WithinAbs;

namespace {

const Medium water = water_at(298.15);

// splitmix64 (Steele, Lea & Flood 2014), mapped to [0, 1) from its top 53 bits: the same
// numbers on every standard library, unlike std::uniform_real_distribution.
class SplitMix64 {
public:
    explicit SplitMix64(std::uint64_t seed) : state_(seed) {}
    double uniform() {
        std::uint64_t z = (state_ += 0x9e3779b97f4a7c15ULL);
        z = (z ^ (z >> 30)) * 0xbf58476d1ce4e5b9ULL;
        z = (z ^ (z >> 27)) * 0x94d049bb133111ebULL;
        return static_cast<double>((z ^ (z >> 31)) >> 11) * 0x1.0p-53;
    }
    double log_uniform(double lo, double hi) { return lo * std::exp(uniform() * std::log(hi / lo)); }

private:
    std::uint64_t state_;
};

// Pair number i of the checked range: radius, Hamaker constant, potential and salt drawn,
// double-layer model, van der Waals form and salt type cycled so that each of their 12
// combinations appears 8 or 9 times in 100 pairs.
struct DrawnPair {
    PairModel model;
    std::string salt;
    double concentration_mM;
};

DrawnPair draw_pair(SplitMix64& random, int i) {
    constexpr DoubleLayerModel models[] = {DoubleLayerModel::linear_superposition,
                                           DoubleLayerModel::constant_potential, DoubleLayerModel::constant_charge};
    DrawnPair out;
    const double radius_m = random.log_uniform(20e-9, 500e-9);
    const double hamaker_J = random.log_uniform(3e-21, 3e-20);
    const double psi_V = -(10e-3 + 70e-3 * random.uniform());
    out.model = PairModel{radius_m, radius_m, hamaker_J, psi_V, psi_V};
    out.model.double_layer = models[i % 3];
    out.model.vdw = (i / 3) % 2 == 0 ? VdwForm::hamaker_full : VdwForm::gregory_retarded;
    const bool two_to_one = (i / 6) % 2 == 1;
    out.salt = two_to_one ? "CaCl2" : "NaCl";
    out.concentration_mM = two_to_one ? random.log_uniform(0.1, 30.0) : random.log_uniform(0.1, 300.0);
    return out;
}

}  // namespace

TEST_CASE("the fast stability ratio matches the careful quadrature on 100 drawn pairs",
          "[potentials][fast_stability_ratio][validation]") {
    // Acceptance test of the issue: "a faster W with relative error <= 1e-3 against the careful
    // quadrature is allowed if checked on 100 samples", i.e. |ln W_fast - ln W| <= 1e-3.
    // The careful routine (relative error ~1e-9) is the independent computation. Seed 20240611,
    // fixed. Measured worst error over these 200 values: ~2e-9.
    SplitMix64 random(20240611);
    const double min_gap_m = 0.2e-9;
    int checked = 0;
    for (int i = 0; i < 100; ++i) {
        const DrawnPair drawn = draw_pair(random, i);
        const PairInteraction pair(drawn.model, water, Electrolyte::from_salt(drawn.salt, drawn.concentration_mM));
        for (bool hydrodynamic : {false, true}) {
            INFO("pair " << i << ": radius " << drawn.model.radius1_m << " m, A " << drawn.model.hamaker_J
                         << " J, psi " << drawn.model.surface_potential1_V << " V, " << drawn.concentration_mM
                         << " mM " << drawn.salt << ", double layer " << static_cast<int>(drawn.model.double_layer)
                         << ", vdw " << static_cast<int>(drawn.model.vdw) << ", hydrodynamic " << hydrodynamic);
            const double careful = log_stability_ratio(pair, min_gap_m, hydrodynamic);
            CHECK_THAT(log_stability_ratio_fast(pair, min_gap_m, hydrodynamic), WithinAbs(careful, 1e-3));
            ++checked;
        }
    }
    CHECK(checked == 200);
}

TEST_CASE("the fast stability ratio is 1 without interaction or hydrodynamics", "[potentials][fast_stability_ratio][validation]") {
    // Fuchs (1934), Z. Physik 89, 736, with R_c = a1 + a2 + min_gap: W = R_c int_{R_c}^inf r^-2 dr = 1
    // for U = 0 and beta = 1. Tolerance: the rounding and quadrature error of the fixed
    // Gauss-Legendre panels on a smooth integrand (measured ~1e-15).
    const PairInteraction none({120e-9, 40e-9, 0.0, 0.0, 0.0}, water, Electrolyte::from_salt("NaCl", 10));
    REQUIRE(none.is_zero());
    CHECK_THAT(log_stability_ratio_fast(none, 0.2e-9, false), WithinAbs(0.0, 1e-10));
    // With Honig's beta and no forces: the careful quadrature, to the promised 1e-3 in ln W.
    CHECK_THAT(log_stability_ratio_fast(none, 0.2e-9, true), WithinAbs(log_stability_ratio(none, 0.2e-9, true), 1e-3));
}

TEST_CASE("a barrier of hundreds of kT gives a finite fast ln W equal to the careful one", "[potentials][fast_stability_ratio]") {
    // 500 nm spheres at -60 mV in 1 mM NaCl: a barrier of several hundred kT, far past the
    // e^709 at which W itself overflows a double. Both routines sum in logarithms.
    const PairInteraction pair({500e-9, 500e-9, 1e-20, -0.06, -0.06}, water, Electrolyte::from_salt("NaCl", 1));
    const double barrier_kT = find_extrema(pair, 0.2e-9, default_max_gap_m(pair)).barrier_J() / pair.kT_J();
    REQUIRE(barrier_kT > 700);
    for (bool hydrodynamic : {false, true}) {
        const double fast = log_stability_ratio_fast(pair, 0.2e-9, hydrodynamic);
        CHECK(std::isfinite(fast));
        CHECK(fast > 700);
        CHECK_THAT(fast, WithinAbs(log_stability_ratio(pair, 0.2e-9, hydrodynamic), 1e-3));
    }
}

TEST_CASE("a barrier at min_gap under constant charge is resolved by the fast ln W", "[potentials][fast_stability_ratio]") {
    // Constant charge (Wiese & Healy 1970) rises towards contact, so the integrand peaks at
    // min_gap itself; the end panel must follow its curvature, not only its slope.
    PairModel model{232e-9, 232e-9, 2.16e-20, -0.0459, -0.0459};
    model.double_layer = DoubleLayerModel::constant_charge;
    const PairInteraction pair(model, water, Electrolyte::from_salt("NaCl", 2.29));
    REQUIRE(find_extrema(pair, 0.2e-9, default_max_gap_m(pair)).maximum_at_min_gap);
    for (bool hydrodynamic : {false, true})
        CHECK_THAT(log_stability_ratio_fast(pair, 0.2e-9, hydrodynamic),
                   WithinAbs(log_stability_ratio(pair, 0.2e-9, hydrodynamic), 1e-3));
}

TEST_CASE("the fast stability ratio refuses a min_gap that is not positive", "[potentials][fast_stability_ratio]") {
    const PairInteraction pair({100e-9, 100e-9, 1e-20, -0.03, -0.03}, water, Electrolyte::from_salt("NaCl", 10));
    for (double bad : {0.0, -1e-9, std::nan("")}) {
        CHECK_THROWS_AS(log_stability_ratio_fast(pair, bad, false), brownfloc::InputError);
        CHECK_THROWS_WITH(log_stability_ratio_fast(pair, bad, true), Contains("min_gap_m") && Contains("must be finite and > 0"));
    }
    CHECK_THROWS_WITH(log_stability_ratio_fast(pair, -1e-9, false), Contains("min_gap_m = -1e-09"));
}
