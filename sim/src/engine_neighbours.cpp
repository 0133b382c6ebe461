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
#pragma omp parallel for schedule(static, omp_block) reduction(| : stale) if (n >= model_->parallel_min_items)
    for (std::int64_t ii = 0; ii < n; ++ii) {
        const std::size_t i = static_cast<std::size_t>(ii);
        const double dx = fold(pos_[i].x - bx_[i]), dy = fold(pos_[i].y - by_[i]), dz = fold(pos_[i].z - bz_[i]);
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
    nbr_upper_end_.assign(n, 0);

    auto within = [&](std::size_t i, std::size_t j) {
        const double dx = fold(pos_[j].x - pos_[i].x), dy = fold(pos_[j].y - pos_[i].y), dz = fold(pos_[j].z - pos_[i].z);
        const double r = radius_[i] + radius_[j] + extra;
        return dx * dx + dy * dy + dz * dz < r * r;
    };

    // Cell grid (a single cell holding everything when the box is under 3 list ranges).
    const int cells_per_edge = m >= 3 ? m : 1;
    const double cells_per_m = cells_per_edge / box_;
    auto cell_coord = [&](double v) { return std::min(cells_per_edge - 1, std::max(0, static_cast<int>(v * cells_per_m))); };
    const std::size_t cells = static_cast<std::size_t>(cells_per_edge) * cells_per_edge * cells_per_edge;
    std::vector<std::uint32_t> cell_of(n);
    std::vector<std::uint32_t> cell_start(cells + 1, 0);
    for (std::size_t i = 0; i < n; ++i) {
        const std::size_t c = (static_cast<std::size_t>(cell_coord(pos_[i].z)) * cells_per_edge + cell_coord(pos_[i].y)) *
                                  cells_per_edge + cell_coord(pos_[i].x);
        cell_of[i] = static_cast<std::uint32_t>(c);
        ++cell_start[c + 1];
    }
    std::partial_sum(cell_start.begin(), cell_start.end(), cell_start.begin());
    std::vector<std::uint32_t> in_cell(n);
    {
        std::vector<std::uint32_t> fill(cell_start.begin(), cell_start.end() - 1);
        for (std::size_t i = 0; i < n; ++i) in_cell[fill[cell_of[i]]++] = static_cast<std::uint32_t>(i);
    }
    auto visit_cell = [&](std::size_t i, std::size_t cc, auto&& visit) {
        for (std::uint32_t k = cell_start[cc]; k < cell_start[cc + 1]; ++k) {
            const std::uint32_t j = in_cell[k];
            if (j != i && within(i, j)) visit(j);
        }
    };
    // The 27 cells around i's cell in a fixed order (one cell for a small box).
    auto scan = [&](std::size_t i, auto&& visit) {
        if (cells_per_edge == 1) return visit_cell(i, 0, visit);
        const std::uint32_t c = cell_of[i];
        const int e = cells_per_edge;
        const int cx = static_cast<int>(c % e), cy = static_cast<int>((c / e) % e),
                  cz = static_cast<int>(c / (static_cast<std::size_t>(e) * e));
        for (int dz = -1; dz <= 1; ++dz)
            for (int dy = -1; dy <= 1; ++dy)
                for (int dx = -1; dx <= 1; ++dx) {
                    const int ax = (cx + dx + e) % e, ay = (cy + dy + e) % e, az = (cz + dz + e) % e;
                    visit_cell(i, (static_cast<std::size_t>(az) * e + ay) * e + ax, visit);
                }
    };
    const std::int64_t ni = static_cast<std::int64_t>(n);
    std::vector<std::uint32_t> upper_count(n);
#pragma omp parallel for schedule(static, omp_block) if (ni >= model_->parallel_min_items)
    for (std::int64_t ii = 0; ii < ni; ++ii) {
        const auto i = static_cast<std::size_t>(ii);
        std::uint64_t c = 0;
        std::uint32_t up = 0;
        scan(i, [&](std::uint32_t j) {
            ++c;
            if (j > i) ++up;
        });
        nbr_start_[i + 1] = c;
        upper_count[i] = up;
    }
    std::partial_sum(nbr_start_.begin(), nbr_start_.end(), nbr_start_.begin());
    nbr_.resize(nbr_start_[n]);
    // Each particle's neighbours with larger ids first (the capture check visits only those).
#pragma omp parallel for schedule(static, omp_block) if (ni >= model_->parallel_min_items)
    for (std::int64_t ii = 0; ii < ni; ++ii) {
        const auto i = static_cast<std::size_t>(ii);
        std::uint64_t upper = nbr_start_[i], lower = nbr_start_[i] + upper_count[i];
        nbr_upper_end_[i] = lower;
        scan(i, [&](std::uint32_t j) { nbr_[j > i ? upper++ : lower++] = j; });
    }
    for (std::size_t i = 0; i < n; ++i) {
        bx_[i] = pos_[i].x;
        by_[i] = pos_[i].y;
        bz_[i] = pos_[i].z;
    }
}

double Engine::smallest_relative_gap() const {
    double smallest = std::numeric_limits<double>::infinity();
    const std::size_t n = radius_.size();
    for (std::size_t i = 0; i < n; ++i)
        for (std::uint64_t k = nbr_start_[i]; k < nbr_start_[i + 1]; ++k) {
            const std::uint32_t j = nbr_[k];
            const Vec3 d = minimum_image({pos_[i].x, pos_[i].y, pos_[i].z}, {pos_[j].x, pos_[j].y, pos_[j].z});
            const double gap = std::sqrt(d[0] * d[0] + d[1] * d[1] + d[2] * d[2]) - radius_[i] - radius_[j];
            smallest = std::min(smallest, gap / std::min(radius_[i], radius_[j]));
        }
    return smallest;
}

}  // namespace brownfloc::sim
