#pragma once
// Rate constants measured from a simulated aggregation run, with 95 % intervals from the
// counting statistics of the aggregation events.
//
// fit_early_rate: the early-time Smoluchowski rate k [m^3/s] of the whole population, by least
// squares through the origin of y = 1/n - 1/n0 against f(t) = 1/2 [t + 2 R sqrt(t/(pi D_rel))]
// (n = N/V; the integrated time-dependent rate, PHYSICS.md "Kinetics and stability"), on the
// samples with N/N0 >= min_fraction:
//
//   std::vector<CountSample> counts = {{0.0, 1000}, {0.31, 999}, ...};  // every change
//   RateFit fit = fit_early_rate(counts, {.volume_m3 = 5e-14, .initial_particles = 1000,
//                                         .contact_distance_m = 1e-6,
//                                         .relative_diffusion_m2_per_s = 9.8e-13});
//   if (fit.rate_m3_per_s) use(*fit.rate_m3_per_s, *fit.ci95_m3_per_s);
//
// monomer_pair_rate: the maximum-likelihood rate of one species pair, k_ij = M_ij / E_ij,
// from its event count and an exposure the caller accumulates (pair_exposure_s_per_m3).
//
// The 95 % intervals come from the event count M, never from the regression standard error:
// the points of one trajectory share their history and are strongly correlated. Aggregation
// events are the points of a Poisson process whose intensity is k times a known function of
// the state, so M carries the information on k. We use Garwood's (1936) exact interval for a
// Poisson mean (poisson_interval95), scaled by k/M; 1 +- 1.96/sqrt(M) would undercover at the
// smallest M we accept (5). For the least-squares fit, whose weights favour late points, the
// interval is widened by sqrt(design_effect) (see RateFit). Irreversible aggregation is assumed;
// with break-ups, M counts net mergers and the intervals are too narrow.
//
// Pure functions; thread-safe. Invalid inputs throw brownfloc::InputError naming the value.
#include <array>
#include <cstdint>
#include <optional>
#include <span>
#include <string>

namespace brownfloc::sim {

// The total cluster count N at time_s [s]: sample at the outputs and at every change.
struct CountSample {
    double time_s = 0.0;
    std::int64_t clusters = 0;
};

struct RateFitInput {
    double volume_m3 = 0.0;                    // box volume V > 0
    std::int64_t initial_particles = 0;        // N0 >= 2 (primary particles at t = 0)
    double contact_distance_m = 0.0;           // R = a1 + a2 (or the capture distance) >= 0
    double relative_diffusion_m2_per_s = 0.0;  // D_rel = D1 + D2 > 0; +infinity: no transient
    double min_fraction = 0.7;                 // fit window: N/N0 >= this, in (0, 1)
};

struct RateFit {
    std::optional<double> rate_m3_per_s;                 // nullopt: see note
    std::optional<std::array<double, 2>> ci95_m3_per_s;  // {lower, upper}
    double window_s = 0.0;      // time of the last sample in the window
    std::int64_t events = 0;    // M = N0 - N at the window end
    // Var(least-squares k) / (k^2 / M): the variance of the fit against that of a pure
    // counting estimate. Computed from the Poisson structure of the increments of y (each
    // merger adds V/(N(N-1)), at intensity (k/2)(1 + R/sqrt(pi D t)) N(N-1)/V), not from the
    // scatter of the points. About 1.1 when every change is sampled; 1 when the fit fails.
    double design_effect = 1.0;
    std::string note;
};

struct RateEstimate {
    std::optional<double> rate_m3_per_s;
    std::optional<std::array<double, 2>> ci95_m3_per_s;
    std::int64_t events = 0;
    std::string note;
};

// Early-time rate of the population from samples in time order (time_s >= 0, non-decreasing;
// 1 <= clusters <= N0). The window is the samples before the first one with N/N0 < min_fraction.
// nullopt with a note when the window holds fewer than 5 events or no time after 0.
[[nodiscard]] RateFit fit_early_rate(std::span<const CountSample> samples, const RateFitInput& input);

// Maximum-likelihood rate k_ij = M_ij / E_ij [m^3/s] of one species pair from its event count
// M_ij >= 0 and exposure E_ij [s/m^3] >= 0 (pair_exposure_s_per_m3, summed over the run), with
// the interval Garwood(M)/E. nullopt with a note when M < 5 or E = 0.
[[nodiscard]] RateEstimate monomer_pair_rate(std::int64_t events, double exposure_s_per_m3);

// Exposure [s/m^3] of species i and j over [t0_s, t1_s] while their counts stay m_i and m_j:
// P/V * [T(t1) - T(t0)], T(t) = t + 2 R sqrt(t/(pi D_rel)) (coagulation_reference.hpp), with
// P = m_i m_j distinct pairs (i != j) or m_i (m_i - 1)/2 (same species, count_j ignored; the continuum form
// 1/2 m_i^2 overcounts by the self-pair). The merger intensity of the pair is then
// k_ij P/V (1 + R/sqrt(pi D_rel t)). Times 0 <= t0 <= t1 [s], volume > 0 [m^3],
// R >= 0 [m], D_rel > 0 [m^2/s] (+infinity: no transient).
[[nodiscard]] double pair_exposure_s_per_m3(std::int64_t count_i, std::int64_t count_j, bool same_species,
                                            double volume_m3, double t0_s, double t1_s,
                                            double contact_distance_m, double relative_diffusion_m2_per_s);

// Garwood (1936), Biometrika 28, 437: exact (conservative) central 95 % interval for the mean
// of a Poisson count M >= 0, {Gamma^-1(0.025; M), Gamma^-1(0.975; M + 1)} (lower 0 for M = 0).
// Accurate to ~1e-12 relative.
[[nodiscard]] std::array<double, 2> poisson_interval95(std::int64_t count);

}  // namespace brownfloc::sim
