// Radius of gyration of a cluster, from the centres alone or from the solid spheres.
// Two passes (mean first, then squared deviations) so that a cluster far from the origin
// loses no precision to cancellation.
#include <algorithm>
#include <cmath>

#include "analysis/cluster_geometry.hpp"
#include "geometry_checks.hpp"

namespace brownfloc::analysis {

double radius_of_gyration_m(std::span<const Vec3> centres_m) {
    detail::check_centres("radius_of_gyration_m", centres_m);
    const double count = static_cast<double>(centres_m.size());
    Vec3 mean_m{0.0, 0.0, 0.0};
    for (const Vec3& c : centres_m)
        for (std::size_t k = 0; k < 3; ++k) mean_m[k] += c[k];
    for (double& x : mean_m) x /= count;

    double sum_m2 = 0.0;
    for (const Vec3& c : centres_m) sum_m2 += detail::squared_distance_m2(c, mean_m);
    return std::sqrt(sum_m2 / count);
}

double radius_of_gyration_with_spheres_m(std::span<const Vec3> centres_m, std::span<const double> radii_m) {
    detail::check_spheres("radius_of_gyration_with_spheres_m", centres_m, radii_m);
    // Uniform density: mass of sphere i proportional to a_i^3. Work with a_i / a_max so that
    // the cube neither underflows nor overflows.
    double max_radius_m = 0.0;
    for (double a : radii_m) max_radius_m = std::max(max_radius_m, a);

    double total_mass = 0.0;
    Vec3 centre_of_mass_m{0.0, 0.0, 0.0};
    for (std::size_t i = 0; i < centres_m.size(); ++i) {
        const double ratio = radii_m[i] / max_radius_m, mass = ratio * ratio * ratio;
        total_mass += mass;
        for (std::size_t k = 0; k < 3; ++k) centre_of_mass_m[k] += mass * centres_m[i][k];
    }
    for (double& x : centre_of_mass_m) x /= total_mass;

    // Parallel-axis theorem: a solid sphere's moment about its own centre is (3/5) a^2 per
    // unit mass (any mechanics text, e.g. Goldstein, Classical Mechanics).
    double sum_m2 = 0.0;
    for (std::size_t i = 0; i < centres_m.size(); ++i) {
        const double ratio = radii_m[i] / max_radius_m, mass = ratio * ratio * ratio;
        sum_m2 += mass * (detail::squared_distance_m2(centres_m[i], centre_of_mass_m) +
                          0.6 * radii_m[i] * radii_m[i]);
    }
    return std::sqrt(sum_m2 / total_mass);
}

}  // namespace brownfloc::analysis
