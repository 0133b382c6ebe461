// The engine's neighbour search: a cell grid rebuilt into a full Verlet list (each pair
// listed for both particles) when any particle has moved more than half the skin since the
// last build. Cost O(N) per build whatever the cluster sizes, since particles, not bodies,
// are binned. The list order (cells in fixed order, ids ascending within a cell) does not
// depend on the thread count.
#include <algorithm>
#include <cmath>
#include <numeric>

#include "sim/engine.hpp"

namespace brownfloc::sim {

namespace {
constexpr int omp_block = 256;
}

bool Engine::neighbour_list_stale() const {
    const double limit = 0.5 * model_->skin_m;
    const double limit2 = limit * limit;
    const std::int64_t n = static_cast<std::int64_t>(radius_.size());
    int stale = 0;
#pragma omp parallel for schedule(static, omp_block) reduction(| : stale)
    for (std::int64_t ii = 0; ii < n; ++ii) {
        const std::size_t i = static_cast<std::size_t>(ii);
        double dx = x_[i] - bx_[i], dy = y_[i] - by_[i], dz = z_[i] - bz_[i];
        dx -= box_ * std::nearbyint(dx * inv_box_);
        dy -= box_ * std::nearbyint(dy * inv_box_);
        dz -= box_ * std::nearbyint(dz * inv_box_);
        if (dx * dx + dy * dy + dz * dz > limit2) stale |= 1;
    }
    return stale != 0;
}

void Engine::build_neighbour_list() {
    ++list_builds_;
    const std::size_t n = radius_.size();
    const double reach = 2 * max_radius_m_ + list_radius_extra_m_;
    const int m = static_cast<int>(std::floor(box_ / reach));
    const double extra = list_radius_extra_m_;
    nbr_start_.assign(n + 1, 0);

    auto within = [&](std::size_t i, std::size_t j) {
        double dx = x_[j] - x_[i], dy = y_[j] - y_[i], dz = z_[j] - z_[i];
        dx -= box_ * std::nearbyint(dx * inv_box_);
        dy -= box_ * std::nearbyint(dy * inv_box_);
        dz -= box_ * std::nearbyint(dz * inv_box_);
        const double r = radius_[i] + radius_[j] + extra;
        return dx * dx + dy * dy + dz * dz < r * r;
    };

    if (m < 3) {
        // Small box: every pair, in id order.
        for (std::size_t i = 0; i < n; ++i) {
            std::uint64_t c = 0;
            for (std::size_t j = 0; j < n; ++j)
                if (j != i && within(i, j)) ++c;
            nbr_start_[i + 1] = nbr_start_[i] + c;
        }
        nbr_.resize(nbr_start_[n]);
        for (std::size_t i = 0; i < n; ++i) {
            std::uint64_t k = nbr_start_[i];
            for (std::size_t j = 0; j < n; ++j)
                if (j != i && within(i, j)) nbr_[k++] = static_cast<std::uint32_t>(j);
        }
    } else {
        const double cells_per_m = m / box_;
        auto cell_coord = [&](double v) { return std::min(m - 1, std::max(0, static_cast<int>(v * cells_per_m))); };
        const std::size_t cells = static_cast<std::size_t>(m) * m * m;
        std::vector<std::uint32_t> cell_of(n);
        std::vector<std::uint32_t> cell_start(cells + 1, 0);
        for (std::size_t i = 0; i < n; ++i) {
            const std::size_t c = (static_cast<std::size_t>(cell_coord(z_[i])) * m + cell_coord(y_[i])) * m + cell_coord(x_[i]);
            cell_of[i] = static_cast<std::uint32_t>(c);
            ++cell_start[c + 1];
        }
        std::partial_sum(cell_start.begin(), cell_start.end(), cell_start.begin());
        std::vector<std::uint32_t> in_cell(n);
        {
            std::vector<std::uint32_t> fill(cell_start.begin(), cell_start.end() - 1);
            for (std::size_t i = 0; i < n; ++i) in_cell[fill[cell_of[i]]++] = static_cast<std::uint32_t>(i);
        }
        auto scan = [&](std::size_t i, auto&& visit) {
            const std::uint32_t c = cell_of[i];
            const int cx = static_cast<int>(c % m), cy = static_cast<int>((c / m) % m), cz = static_cast<int>(c / (static_cast<std::size_t>(m) * m));
            for (int dz = -1; dz <= 1; ++dz)
                for (int dy = -1; dy <= 1; ++dy)
                    for (int dx = -1; dx <= 1; ++dx) {
                        const int ax = (cx + dx + m) % m, ay = (cy + dy + m) % m, az = (cz + dz + m) % m;
                        const std::size_t cc = (static_cast<std::size_t>(az) * m + ay) * m + ax;
                        for (std::uint32_t k = cell_start[cc]; k < cell_start[cc + 1]; ++k) {
                            const std::uint32_t j = in_cell[k];
                            if (j != i && within(i, j)) visit(j);
                        }
                    }
        };
        const std::int64_t ni = static_cast<std::int64_t>(n);
#pragma omp parallel for schedule(static, omp_block)
        for (std::int64_t ii = 0; ii < ni; ++ii) {
            std::uint64_t c = 0;
            scan(static_cast<std::size_t>(ii), [&](std::uint32_t) { ++c; });
            nbr_start_[static_cast<std::size_t>(ii) + 1] = c;
        }
        std::partial_sum(nbr_start_.begin(), nbr_start_.end(), nbr_start_.begin());
        nbr_.resize(nbr_start_[n]);
#pragma omp parallel for schedule(static, omp_block)
        for (std::int64_t ii = 0; ii < ni; ++ii) {
            std::uint64_t k = nbr_start_[static_cast<std::size_t>(ii)];
            scan(static_cast<std::size_t>(ii), [&](std::uint32_t j) { nbr_[k++] = j; });
        }
    }
    bx_ = x_;
    by_ = y_;
    bz_ = z_;
}

double Engine::smallest_relative_gap() const {
    double smallest = std::numeric_limits<double>::infinity();
    const std::size_t n = radius_.size();
    for (std::size_t i = 0; i < n; ++i)
        for (std::uint64_t k = nbr_start_[i]; k < nbr_start_[i + 1]; ++k) {
            const std::uint32_t j = nbr_[k];
            const Vec3 d = minimum_image({x_[i], y_[i], z_[i]}, {x_[j], y_[j], z_[j]});
            const double gap = std::sqrt(d[0] * d[0] + d[1] * d[1] + d[2] * d[2]) - radius_[i] - radius_[j];
            smallest = std::min(smallest, gap / std::min(radius_[i], radius_[j]));
        }
    return smallest;
}

}  // namespace brownfloc::sim
