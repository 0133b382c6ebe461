// The engine's Brownian motion against closed-form results: free translational diffusion of
// spheres, and rotational and translational diffusion of rigid doublets.
#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>
#include <cstdint>
#include <string>
#include <vector>

#include "engine_test_support.hpp"
#include "sim/engine.hpp"

using brownfloc::engine_test::cubic_lattice;
using brownfloc::engine_test::plan_from_toml;
using brownfloc::engine_test::squared_distance_m2;
using brownfloc::engine_test::sticky_spheres;
using brownfloc::engine_test::UnwrappedTracker;
using brownfloc::sim::Engine;
using brownfloc::sim::InitialParticles;
using brownfloc::sim::Vec3;
using Catch::Matchers::WithinRel;

namespace {

constexpr double pi = 3.14159265358979323846;
// Exact by the 2019 SI definition.
constexpr double boltzmann_J_per_K = 1.380649e-23;
// The medium of sticky_spheres() (engine_test_support.hpp), given there explicitly so that
// the references below do not depend on the project's water tables.
constexpr double temperature_K = 298.15;
constexpr double viscosity_Pa_s = 0.89e-3;
constexpr double kT_J = boltzmann_J_per_K * temperature_K;

// Stokes-Einstein: D = kT / (6 pi eta a) for a sphere of (hydrodynamic) radius a
// (Einstein 1905, Ann. Phys. 17, 549; Stokes' drag).
double stokes_einstein_m2_per_s(double radius_m) { return kT_J / (6 * pi * viscosity_Pa_s * radius_m); }

// Rotational Stokes-Einstein (Debye): D_r = kT / (8 pi eta R^3).
double rotational_diffusion_per_s(double radius_m) {
    return kT_J / (8 * pi * viscosity_Pa_s * radius_m * radius_m * radius_m);
}

}  // namespace

TEST_CASE("free spheres diffuse with the Stokes-Einstein coefficient: MSD = 6 D t",
          "[engine][validation]") {
    // Einstein (1905), Ann. Phys. 17, 549: <|r(t) - r(0)|^2> = 6 D t in three dimensions,
    // D = kT / (6 pi eta a). Sticky spheres without forces, 2000 of them at a volume fraction of
    // 1e-4, seed 11: the fast half-life is ~6.8 s, the measurement ~2.6 ms, so at most a few
    // particles meet; those that did are left out.
    const auto plan = plan_from_toml(sticky_spheres("volume_fraction = 1e-4", 2000, 11));
    const double a = 100e-9;
    const double d_expected = stokes_einstein_m2_per_s(a);
    // The engine's own coefficient is the formula (rounding only).
    Engine engine(plan.model, plan.particles);
    REQUIRE(engine.bonded_at_start() == 0);
    CHECK_THAT(engine.translational_diffusion_m2_per_s(0), WithinRel(d_expected, 1e-12));

    // Displacements over 25 consecutive windows of 40 steps: Brownian increments over
    // disjoint windows are independent, so there are M = 2000 x 25 = 50000 independent 3D
    // displacements. The relative sd of the mean of |dr|^2 (|dr|^2 / (2 D t) is chi-squared
    // with 3 degrees of freedom, variance 6, mean 3) is sqrt(2 / (3 M)) = 0.37 %: the 3 %
    // tolerance is 8 standard errors.
    constexpr int windows = 25, steps_per_window = 40;
    UnwrappedTracker tracker(engine);
    const std::size_t n = engine.particle_count();
    std::vector<Vec3> start(n);
    std::vector<double> sum_sq(n, 0.0);
    for (std::uint32_t i = 0; i < n; ++i) start[i] = tracker.position_m(i);
    for (int w = 0; w < windows; ++w) {
        for (int s = 0; s < steps_per_window; ++s) {
            engine.step();
            tracker.update(engine);
        }
        for (std::uint32_t i = 0; i < n; ++i) {
            sum_sq[i] += squared_distance_m2(start[i], tracker.position_m(i));
            start[i] = tracker.position_m(i);
        }
    }
    double total = 0;
    std::int64_t samples = 0;
    for (std::uint32_t i = 0; i < n; ++i)
        if (engine.body_size(engine.body_of(i)) == 1) {
            total += sum_sq[i];
            samples += windows;
        }
    REQUIRE(double(samples) >= 0.99 * double(n) * windows);
    const double window_s = steps_per_window * plan.model->time_step.time_step_s;
    const double msd_ratio = total / double(samples) / (6 * d_expected * window_s);
    INFO("MSD / 6 D t = " << msd_ratio << " from " << samples << " displacements; relative sd "
                          << std::sqrt(2.0 / (3.0 * double(samples))));
    CHECK(std::abs(msd_ratio - 1) < 0.03);
}

TEST_CASE("rigid doublets turn with the Kirkwood rotational diffusion: <u(0).u(t)> = exp(-2 D_r t)",
          "[engine][validation][slow]") {
    // Debye rotational diffusion of a unit vector fixed in a body: <u(0).u(t)> = exp(-2 D_r t)
    // (Debye 1929, Polar Molecules, ch. V; Berne & Pecora 1976, Dynamic Light Scattering,
    // ch. 7 [memory for the chapters]). The engine treats a cluster as a sphere of the Kirkwood
    // radius R_h (Kirkwood 1954, J. Polym. Sci. 12, 1), which is 4a/3 for a doublet at contact.
    const double a = 100e-9;
    const auto plan = plan_from_toml(sticky_spheres("volume_fraction = 1e-4", 2, 5));
    const double dt = plan.model->time_step.time_step_s;

    // 1000 doublets on a cubic lattice of spacing 4 um, their axes spread evenly over the
    // sphere (a fixed sequence; the statistics do not depend on the start). Over the run
    // (8 / (2 D_r) ~ 0.05 s) two neighbours move apart or together by ~0.6 um (sd) along each
    // axis, so they never meet: the gap is 3.6 um, 5.9 sd.
    constexpr std::size_t doublets = 1000;
    const auto lattice = cubic_lattice(doublets, 4e-6);
    InitialParticles init;
    init.box_length_m = lattice.box_length_m;
    for (std::size_t k = 0; k < doublets; ++k) {
        // Golden-angle spiral of axes over the sphere.
        const double z = 1.0 - (2.0 * double(k) + 1.0) / double(doublets);
        const double phi = double(k) * pi * (3.0 - std::sqrt(5.0));
        const double s = std::sqrt(1 - z * z);
        const Vec3 axis{s * std::cos(phi), s * std::sin(phi), z};
        const Vec3& c = lattice.sites_m[k];
        // Exactly at contact (gap 0 <= capture gap): the engine bonds them at construction.
        init.positions_m.push_back({c[0] - a * axis[0], c[1] - a * axis[1], c[2] - a * axis[2]});
        init.positions_m.push_back({c[0] + a * axis[0], c[1] + a * axis[1], c[2] + a * axis[2]});
        init.radii_m.insert(init.radii_m.end(), {a, a});
        init.species.insert(init.species.end(), {0u, 0u});
    }
    Engine engine(plan.model, init);
    REQUIRE(engine.bonded_at_start() == std::int64_t(doublets));
    REQUIRE(engine.bodies().size() == doublets);

    const double r_h = 4.0 * a / 3.0;
    const double dr_expected = rotational_diffusion_per_s(r_h);
    // The engine's doublet mobility is the formula at R_h = 4a/3 (rounding of the contact
    // distance and of the Kirkwood sum only).
    CHECK_THAT(engine.hydrodynamic_radius_m(0), WithinRel(r_h, 1e-12));
    CHECK_THAT(engine.rotational_diffusion_per_s(0), WithinRel(dr_expected, 1e-12));
    CHECK_THAT(engine.translational_diffusion_m2_per_s(0), WithinRel(stokes_einstein_m2_per_s(r_h), 1e-12));

    // Sample the axis every `stride` steps for 8 correlation times tau = 1 / (2 D_r). The
    // engine turns a body each step by a Gaussian rotation vector of variance s^2 = 2 D_r dt
    // per component, which multiplies <u(0).u(t)> by 1/3 + (2/3)(1 - s^2) e^(-s^2/2) =
    // e^(-s^2) (1 - s^4/12 + ...): with s^2 ~ 4e-4 here the step adds a relative error of
    // order 1e-5 at the longest lag, far below the statistics.
    const double tau_s = 1.0 / (2.0 * dr_expected);
    const auto stride = static_cast<std::int64_t>(std::max(1.0, std::floor(tau_s / dt / 40.0)));
    const std::int64_t samples = static_cast<std::int64_t>(std::ceil(8.0 * tau_s / (double(stride) * dt))) + 1;
    std::vector<Vec3> axes(static_cast<std::size_t>(samples) * doublets);
    std::vector<Vec3> centres(static_cast<std::size_t>(samples) * doublets);  // unwrapped
    UnwrappedTracker tracker(engine);
    auto centre = [&](std::size_t k) {
        const Vec3 p = tracker.position_m(static_cast<std::uint32_t>(2 * k)),
                   q = tracker.position_m(static_cast<std::uint32_t>(2 * k + 1));
        return Vec3{(p[0] + q[0]) / 2, (p[1] + q[1]) / 2, (p[2] + q[2]) / 2};
    };
    auto record = [&](std::int64_t sample) {
        for (std::size_t k = 0; k < doublets; ++k) {
            centres[static_cast<std::size_t>(sample) * doublets + k] = centre(k);
            const auto b = static_cast<std::uint32_t>(2 * k);
            const Vec3 o0 = engine.offset_m(b), o1 = engine.offset_m(b + 1);
            Vec3 u{o1[0] - o0[0], o1[1] - o0[1], o1[2] - o0[2]};
            const double norm = std::sqrt(u[0] * u[0] + u[1] * u[1] + u[2] * u[2]);
            for (double& c : u) c /= norm;
            axes[static_cast<std::size_t>(sample) * doublets + k] = u;
        }
    };
    record(0);
    for (std::int64_t sample = 1; sample < samples; ++sample) {
        for (std::int64_t s = 0; s < stride; ++s) {
            engine.step();
            tracker.update(engine);
        }
        record(sample);
    }
    REQUIRE(engine.captures().empty());
    REQUIRE(engine.bodies().size() == doublets);

    // C(t) at lags of 0.05, 0.1, 0.25 and 0.5 tau (C from 0.95 to 0.61), averaged over every
    // time origin of a doublet and then over the doublets, which are independent: the standard
    // error is the sd of the per-doublet means over sqrt(1000). Lags past 0.5 tau are left
    // out: the per-sample sd of u(0).u(t) grows against C there (0.56 C at 0.5 tau, 1.3 C at
    // tau), and so would the statistical error.
    const std::vector<double> lags_tau{0.05, 0.1, 0.25, 0.5};
    std::vector<double> lag_s;
    std::vector<std::vector<double>> per_doublet;  // C of each doublet at each lag
    std::vector<double> c_mean;
    for (double lag_tau : lags_tau) {
        const auto lag = static_cast<std::int64_t>(std::llround(lag_tau * tau_s / (double(stride) * dt)));
        REQUIRE(lag >= 1);
        lag_s.push_back(double(lag * stride) * dt);
        std::vector<double> c_k(doublets, 0.0);
        double mean = 0;
        for (std::size_t k = 0; k < doublets; ++k) {
            for (std::int64_t o = 0; o + lag < samples; ++o) {
                const Vec3& u0 = axes[static_cast<std::size_t>(o) * doublets + k];
                const Vec3& u1 = axes[static_cast<std::size_t>(o + lag) * doublets + k];
                c_k[k] += u0[0] * u1[0] + u0[1] * u1[1] + u0[2] * u1[2];
            }
            c_k[k] /= double(samples - lag);
            mean += c_k[k];
        }
        c_mean.push_back(mean / double(doublets));
        per_doublet.push_back(std::move(c_k));
    }
    auto standard_error = [&](auto&& value_of_doublet) {
        double mean = 0, mean_sq = 0;
        for (std::size_t k = 0; k < doublets; ++k) {
            const double v = value_of_doublet(k);
            mean += v;
            mean_sq += v * v;
        }
        mean /= double(doublets);
        return std::sqrt(std::max(0.0, mean_sq / double(doublets) - mean * mean) / double(doublets));
    };
    std::vector<double> weight;  // 1 / variance of -ln C at each lag, for the fit below
    for (std::size_t l = 0; l < lags_tau.size(); ++l) {
        const double expected = std::exp(-2.0 * dr_expected * lag_s[l]);
        const double se = standard_error([&](std::size_t k) { return per_doublet[l][k]; }) / c_mean[l];
        weight.push_back(1.0 / (se * se));
        INFO("lag " << lags_tau[l] << " tau: C = " << c_mean[l] << ", exp(-2 D_r t) = " << expected << ", ratio "
                    << c_mean[l] / expected << ", relative standard error " << se);
        // 3 %, and the statistics must be good enough for 3 % to mean something (>= 5 SE).
        CHECK(std::abs(c_mean[l] / expected - 1) < 0.03);
        CHECK(se < 0.006);
    }
    // Weighted least squares of -ln C = 2 D_r t through the origin, weights 1 / SE^2 of -ln C
    // (short lags fix D_r best: the relative SE of D_r from one lag is SE(C)/C / (2 D_r t)).
    // Its standard error by the delta method: doublet k moves the fit by
    // -sum_l w_l t_l (C_kl - C_l) / C_l / (2 sum_l w_l t_l^2) / N.
    double fit_num = 0, fit_den = 0;
    for (std::size_t l = 0; l < lags_tau.size(); ++l) {
        fit_num += weight[l] * lag_s[l] * -std::log(c_mean[l]);
        fit_den += 2.0 * weight[l] * lag_s[l] * lag_s[l];
    }
    const double dr_fit = fit_num / fit_den;
    const double dr_fit_se = standard_error([&](std::size_t k) {
                                 double v = 0;
                                 for (std::size_t l = 0; l < lags_tau.size(); ++l)
                                     v -= weight[l] * lag_s[l] * per_doublet[l][k] / c_mean[l];
                                 return v / fit_den;
                             }) / dr_expected;
    INFO("D_r fit / Kirkwood D_r = " << dr_fit / dr_expected << ", relative standard error " << dr_fit_se);
    CHECK(std::abs(dr_fit / dr_expected - 1) < 0.03);
    CHECK(dr_fit_se < 0.006);

    // The doublet centres (midpoints of the members) diffuse with D_t = kT / (6 pi eta R_h):
    // 16 disjoint windows of 0.5 tau per doublet give M = 16000 independent displacements,
    // relative sd sqrt(2 / (3 M)) = 0.65 %: 3 % is 4.6 standard errors.
    const std::int64_t window = (samples - 1) / 16;
    double sum_sq = 0;
    std::int64_t displacements = 0;
    for (std::int64_t w = 0; w + window < samples; w += window)
        for (std::size_t k = 0; k < doublets; ++k, ++displacements)
            sum_sq += squared_distance_m2(centres[static_cast<std::size_t>(w) * doublets + k],
                                          centres[static_cast<std::size_t>(w + window) * doublets + k]);
    const double window_s = double(window * stride) * dt;
    const double msd_ratio = sum_sq / double(displacements) / (6 * stokes_einstein_m2_per_s(r_h) * window_s);
    INFO("doublet MSD / 6 D_t t = " << msd_ratio << " from " << displacements << " displacements");
    CHECK(displacements >= 16000);
    CHECK(std::abs(msd_ratio - 1) < 0.03);
}
