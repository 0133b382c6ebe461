#pragma once
// Helpers shared by the engine tests: a plan built from scenario TOML text, bodies placed by
// hand far apart in a big box, and a tracker of unwrapped particle positions.
#include <cstdint>
#include <string>
#include <vector>

#include "sim/engine.hpp"
#include "sim/engine_setup.hpp"
#include "sim/scenario.hpp"

namespace brownfloc::engine_test {

using sim::Vec3;

// plan_run on a scenario given as TOML text (named "<test>" in messages), with optional
// --set style overrides; the seed is [run] seed.
inline sim::RunPlan plan_from_toml(const std::string& toml, const std::vector<std::string>& overrides = {}) {
    const sim::Scenario scenario = sim::parse_scenario(toml, "<test>", overrides);
    return sim::plan_run(scenario, scenario.run.seed);
}

// Scenario text for non-interacting sticky spheres of radius 100 nm (U == 0: captured at
// min_gap = 0.2 nm) in water at 298.15 K with viscosity 0.89 mPa s given explicitly (so that
// references need not use the project's water tables); `suspension` is the body of the
// [suspension] section, e.g. "volume_fraction = 0.05".
inline std::string sticky_spheres(const std::string& suspension, int particles, int seed) {
    return "[particle]\nradius_nm = 100\nhamaker_J = 0\nsurface_potential_mV = 0\n"
           "[suspension]\n" + suspension + "\n"
           "[medium]\ntemperature_K = 298.15\nviscosity_mPa_s = 0.89\n"
           "[electrolyte]\nsalt = \"NaCl\"\nconcentration_mM = 10\n"
           "[run]\nparticles = " + std::to_string(particles) + "\nseed = " + std::to_string(seed) + "\n";
}

// Unwrapped positions: the running sum of each particle's minimum-image displacement
// between successive calls to update(). Correct while no particle moves more than half the
// box between calls (the engine moves a particle by far less than that in one step).
class UnwrappedTracker {
public:
    explicit UnwrappedTracker(const sim::Engine& engine) {
        const std::size_t n = engine.particle_count();
        last_.resize(n);
        unwrapped_.resize(n);
        for (std::uint32_t i = 0; i < n; ++i) last_[i] = unwrapped_[i] = engine.position_m(i);
    }

    // Call after every step.
    void update(const sim::Engine& engine) {
        for (std::uint32_t i = 0; i < last_.size(); ++i) {
            const Vec3 now = engine.position_m(i);
            const Vec3 d = engine.minimum_image(last_[i], now);
            for (int c = 0; c < 3; ++c) unwrapped_[i][static_cast<std::size_t>(c)] += d[static_cast<std::size_t>(c)];
            last_[i] = now;
        }
    }

    [[nodiscard]] const Vec3& position_m(std::uint32_t i) const { return unwrapped_[i]; }

private:
    std::vector<Vec3> last_;
    std::vector<Vec3> unwrapped_;
};

[[nodiscard]] inline double squared_distance_m2(const Vec3& a, const Vec3& b) {
    const double dx = b[0] - a[0], dy = b[1] - a[1], dz = b[2] - a[2];
    return dx * dx + dy * dy + dz * dz;
}

// A simple cubic lattice of `count` sites with spacing spacing_m, starting at spacing/2,
// and the box that holds it (lattice constant times sites per edge). Used to put bodies
// far enough apart that they never meet during a test.
struct Lattice {
    double box_length_m = 0;
    std::vector<Vec3> sites_m;
};

[[nodiscard]] inline Lattice cubic_lattice(std::size_t count, double spacing_m) {
    std::size_t per_edge = 1;
    while (per_edge * per_edge * per_edge < count) ++per_edge;
    Lattice lattice;
    lattice.box_length_m = double(per_edge) * spacing_m;
    for (std::size_t k = 0; k < count; ++k) {
        const std::size_t ix = k % per_edge, iy = (k / per_edge) % per_edge, iz = k / (per_edge * per_edge);
        lattice.sites_m.push_back(
            {(double(ix) + 0.5) * spacing_m, (double(iy) + 0.5) * spacing_m, (double(iz) + 0.5) * spacing_m});
    }
    return lattice;
}

}  // namespace brownfloc::engine_test
