#pragma once
// Input checks shared by the cluster-geometry functions: each message names the function,
// the index and the offending value.
#include <cmath>
#include <cstddef>
#include <span>
#include <stdexcept>
#include <string>

#include "analysis/cluster_geometry.hpp"
#include "message_text.hpp"

namespace brownfloc::analysis::detail {

// At least one centre, all coordinates finite.
inline void check_centres(const char* function, std::span<const Vec3> centres_m) {
    if (centres_m.empty())
        throw std::invalid_argument(message(function, ": no centres; need at least one sphere"));
    for (std::size_t i = 0; i < centres_m.size(); ++i)
        for (double x : centres_m[i])
            if (!std::isfinite(x))
                throw std::invalid_argument(
                    message(function, ": centre ", i, " = ", centres_m[i], " m: must be finite"));
}

// Centres as above, one finite radius > 0 per centre.
inline void check_spheres(const char* function, std::span<const Vec3> centres_m,
                          std::span<const double> radii_m) {
    check_centres(function, centres_m);
    if (radii_m.size() != centres_m.size())
        throw std::invalid_argument(message(function, ": ", radii_m.size(), " radii for ", centres_m.size(),
                                            " centres: need one radius per centre"));
    for (std::size_t i = 0; i < radii_m.size(); ++i)
        if (!(radii_m[i] > 0.0) || !std::isfinite(radii_m[i]))
            throw std::invalid_argument(
                message(function, ": radius ", i, " = ", radii_m[i], " m: must be finite and > 0"));
}

inline double squared_distance_m2(const Vec3& a, const Vec3& b) {
    const double dx = a[0] - b[0], dy = a[1] - b[1], dz = a[2] - b[2];
    return dx * dx + dy * dy + dz * dz;
}

}  // namespace brownfloc::analysis::detail
