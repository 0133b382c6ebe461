// Kirkwood (1954) hydrodynamic radius of a rigid cluster of spheres: exact double sum, and for
// large clusters a seeded estimate from sampled pairs. Formula, sample-count rule and sources
// are in analysis/cluster_geometry.hpp.
#include <cmath>
#include <stdexcept>
#include <string>

#include "analysis/cluster_geometry.hpp"
#include "geometry_checks.hpp"
#include "splitmix64.hpp"

namespace brownfloc::analysis {
namespace {

// 1/r (1/m) between two centres; coincident centres would make the Kirkwood sum infinite.
double inverse_distance_per_m(std::span<const Vec3> centres_m, std::size_t i, std::size_t j) {
    const double r2 = detail::squared_distance_m2(centres_m[i], centres_m[j]);
    if (!(r2 > 0.0))
        throw std::invalid_argument(detail::message("Kirkwood sum: centres ", i, " and ", j,
                                                    " coincide at ", centres_m[i],
                                                    " m: the Kirkwood sum needs distinct centres"));
    return 1.0 / std::sqrt(r2);
}

// sum_i 1/a_i (1/m), in index order.
double self_sum_per_m(std::span<const double> radii_m) {
    double sum = 0.0;
    for (double a : radii_m) sum += 1.0 / a;
    return sum;
}

// sum_{i != j} 1/r_ij (1/m) over ordered pairs = twice the sum over i < j. Fixed order, so the
// bits do not depend on anything but the input.
double exact_pair_sum_per_m(std::span<const Vec3> centres_m) {
    double sum = 0.0;
    for (std::size_t i = 0; i < centres_m.size(); ++i) {
        double row = 0.0;
        for (std::size_t j = i + 1; j < centres_m.size(); ++j) row += inverse_distance_per_m(centres_m, i, j);
        sum += row;
    }
    return 2.0 * sum;
}

double radius_from_sums_m(double self_sum_per_m, double pair_sum_per_m, std::size_t count) {
    const double n = static_cast<double>(count);
    return n * n / (self_sum_per_m + pair_sum_per_m);
}

constexpr std::size_t first_sample_pairs = 65536;
constexpr std::size_t sample_block_pairs = 4096;
constexpr double standard_errors_in_target = 3.0;

}  // namespace

double kirkwood_hydrodynamic_radius_exact_m(std::span<const Vec3> centres_m, std::span<const double> radii_m) {
    detail::check_spheres("kirkwood_hydrodynamic_radius_exact_m", centres_m, radii_m);
    return radius_from_sums_m(self_sum_per_m(radii_m), exact_pair_sum_per_m(centres_m), centres_m.size());
}

double kirkwood_hydrodynamic_radius_m(std::span<const Vec3> centres_m, std::span<const double> radii_m,
                                      std::uint64_t seed) {
    detail::check_spheres("kirkwood_hydrodynamic_radius_m", centres_m, radii_m);
    const std::size_t count = centres_m.size();
    if (count <= kirkwood_exact_limit)
        return radius_from_sums_m(self_sum_per_m(radii_m), exact_pair_sum_per_m(centres_m), count);

    // Mean mu of 1/r over ordered pairs of distinct spheres, from pairs drawn uniformly with
    // replacement: i uniform in [0, N), j uniform over the other N-1. Welford's running mean
    // and variance (Welford 1962, Technometrics 4, 419) avoid the cancellation of sum x^2.
    const std::size_t distinct_pairs = count * (count - 1) / 2;
    const double target = kirkwood_sampled_relative_error / standard_errors_in_target;
    detail::SplitMix64 generator{detail::derive_seed(seed, 0x4B69726BULL)};
    std::size_t drawn = 0;
    double mean_per_m = 0.0, sum_squared_deviation = 0.0;
    std::size_t next_check = first_sample_pairs;
    while (true) {
        while (drawn < next_check) {
            const std::size_t i = generator.index_below(count);
            std::size_t j = generator.index_below(count - 1);
            if (j >= i) ++j;
            const double x = inverse_distance_per_m(centres_m, i, j);
            ++drawn;
            const double delta = x - mean_per_m;
            mean_per_m += delta / static_cast<double>(drawn);
            sum_squared_deviation += delta * (x - mean_per_m);
        }
        // Relative standard error of mu: CV / sqrt(M), CV^2 = variance / mu^2.
        const double variance = sum_squared_deviation / static_cast<double>(drawn - 1);
        const double needed = variance / (mean_per_m * mean_per_m * target * target);
        if (needed >= static_cast<double>(distinct_pairs))
            return radius_from_sums_m(self_sum_per_m(radii_m), exact_pair_sum_per_m(centres_m), count);
        if (static_cast<double>(drawn) >= needed) break;
        next_check = drawn + sample_block_pairs;
    }
    const double n = static_cast<double>(count);
    return radius_from_sums_m(self_sum_per_m(radii_m), n * (n - 1.0) * mean_per_m, count);
}

}  // namespace brownfloc::analysis
