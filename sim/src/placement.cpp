#include "sim/placement.hpp"

#include <algorithm>
#include <cmath>
#include <numeric>
#include <sstream>

#include "potentials/constants.hpp"
#include "potentials/input_error.hpp"
#include "sim/philox_noise.hpp"

namespace brownfloc::sim {

namespace {
constexpr std::uint64_t max_attempts_per_particle = 200000;
}

InitialParticles place_particles(const std::vector<double>& radii, const std::vector<std::uint32_t>& species,
                                 double box, const EngineModel& model, std::uint64_t seed, const std::string& source,
                                 StopRequested stop_requested) {
    const std::size_t n = radii.size();
    const double half_capture = 0.5 * model.max_capture_gap_m();
    double occupied = 0;
    for (double a : radii) occupied += 4.0 / 3.0 * potentials::constants::pi * std::pow(a + half_capture, 3);
    const double phi_eff = occupied / (box * box * box);
    if (phi_eff > max_placement_volume_fraction) {
        std::ostringstream o;
        o.precision(3);
        o << source << ": [suspension]: the particles cannot be placed at random: with the capture gap they fill a volume "
          << "fraction of " << phi_eff << ", above " << max_placement_volume_fraction
          << " (random sequential addition jams near 0.38); lower volume_fraction or number_density_per_m3";
        throw InputError(o.str());
    }
    const double a_max = *std::max_element(radii.begin(), radii.end());
    const double reach = 2 * a_max + model.max_capture_gap_m();
    // Cells at least one reach wide, and no more cells than about 2 per particle (a dilute
    // box would otherwise hold mostly empty cells: memory and time grow as 1/phi).
    const double max_cells_per_edge = std::max(3.0, std::floor(std::cbrt(2.0 * double(n))));
    const int m = std::max(1, static_cast<int>(std::min(std::floor(box / reach), max_cells_per_edge)));
    const double per_m = m / box;
    auto coord = [&](double v) { return std::min(m - 1, std::max(0, static_cast<int>(v * per_m))); };
    auto cell_index = [&](int x, int y, int z) { return (static_cast<std::size_t>(z) * m + y) * m + x; };
    std::vector<std::vector<std::uint32_t>> cells(static_cast<std::size_t>(m) * m * m);
    std::vector<Vec3> pos(n);
    auto min_image = [&](double d) { return d - box * std::nearbyint(d / box); };
    auto fits = [&](std::size_t slot, const Vec3& p) {
        const int cx = coord(p[0]), cy = coord(p[1]), cz = coord(p[2]);
        const int span = m >= 3 ? 1 : 0;
        for (int dz = -span; dz <= span; ++dz)
            for (int dy = -span; dy <= span; ++dy)
                for (int dx = -span; dx <= span; ++dx) {
                    const auto& cell = m >= 3 ? cells[cell_index((cx + dx + m) % m, (cy + dy + m) % m, (cz + dz + m) % m)]
                                              : cells[0];
                    for (std::uint32_t o : cell) {
                        const double ddx = min_image(pos[o][0] - p[0]), ddy = min_image(pos[o][1] - p[1]),
                                     ddz = min_image(pos[o][2] - p[2]);
                        const double r = radii[slot] + radii[o] + model.pair_kind(species[slot], species[o]).capture_gap_m;
                        if (ddx * ddx + ddy * ddy + ddz * ddz < r * r * (1 + 1e-12)) return false;
                    }
                }
        return true;
    };
    if (m < 3) cells.assign(1, {});  // small box: one cell holding every particle
    auto cell_of = [&](const Vec3& p) { return m >= 3 ? cell_index(coord(p[0]), coord(p[1]), coord(p[2])) : std::size_t{0}; };
    for (std::size_t slot = 0; slot < n; ++slot) {
        if (stop_requested != nullptr && slot % 4096 == 0 && stop_requested()) throw SetupStopped{};
        bool placed = false;
        for (std::uint64_t attempt = 0; attempt < max_attempts_per_particle && !placed; ++attempt) {
            const auto bits = philox_block(seed, attempt, static_cast<std::uint32_t>(slot), NoiseStream::placement);
            const Vec3 p{uniform_open01(bits[0]) * box, uniform_open01(bits[1]) * box, uniform_open01(bits[2]) * box};
            if (fits(slot, p)) {
                pos[slot] = p;
                cells[cell_of(p)].push_back(static_cast<std::uint32_t>(slot));
                placed = true;
            }
        }
        if (!placed) {
            std::ostringstream o;
            o.precision(3);
            o << source << ": [suspension]: particle " << slot + 1 << " of " << n << " found no room after "
              << max_attempts_per_particle << " random tries (volume fraction with the capture gap " << phi_eff
              << "); lower volume_fraction or number_density_per_m3";
            throw InputError(o.str());
        }
    }
    // Ids along a Morton (Z-order) curve of a 1024^3 grid (then slot order), so that
    // neighbours in space are close in id, hence in memory, in all three directions.
    std::vector<std::uint32_t> order(n);
    std::iota(order.begin(), order.end(), 0u);
    std::vector<std::uint64_t> key(n);
    auto spread = [](std::uint64_t v) {  // 10 bits -> every third bit
        std::uint64_t r = 0;
        for (int b = 0; b < 10; ++b) r |= ((v >> b) & 1u) << (3 * b);
        return r;
    };
    auto grid = [&](double v) { return static_cast<std::uint64_t>(std::min(1023.0, std::max(0.0, v / box * 1024.0))); };
    for (std::size_t k = 0; k < n; ++k)
        key[k] = spread(grid(pos[k][0])) | (spread(grid(pos[k][1])) << 1) | (spread(grid(pos[k][2])) << 2);
    std::stable_sort(order.begin(), order.end(), [&](std::uint32_t a, std::uint32_t b) { return key[a] < key[b]; });
    InitialParticles out;
    out.box_length_m = box;
    for (std::uint32_t slot : order) {
        out.positions_m.push_back(pos[slot]);
        out.radii_m.push_back(radii[slot]);
        out.species.push_back(species[slot]);
    }
    return out;
}

}  // namespace brownfloc::sim
