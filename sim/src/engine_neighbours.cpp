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

double Engine::largest_squared_displacement_since_build() const {
    const std::int64_t n = static_cast<std::int64_t>(radius_.size());
    double largest = 0;
#pragma omp parallel for schedule(static, omp_block) reduction(max : largest) if (n >= model_->parallel_min_items)
    for (std::int64_t ii = 0; ii < n; ++ii) {
        const std::size_t i = static_cast<std::size_t>(ii);
        const double dx = fold(pos_[i].x - bx_[i]), dy = fold(pos_[i].y - by_[i]), dz = fold(pos_[i].z - bz_[i]);
        largest = std::max(largest, dx * dx + dy * dy + dz * dz);
    }
    return largest;
}

void Engine::build_neighbour_list() {
    ++list_builds_;
    displacement_bound_m_ = 0;
    capture_list_bound_m_ = std::numeric_limits<double>::infinity();  // remade from this list at the next capture check
    const std::size_t n = radius_.size();
    const double reach = 2 * max_radius_m_ + list_radius_extra_m_;
    // Cells at least one list range wide, and no more than about 2 per particle (a dilute box
    // would otherwise hold mostly empty cells: memory and time growing as 1/phi).
    const double max_cells_per_edge = std::max(3.0, std::floor(std::cbrt(2.0 * double(n))));
    const int m = static_cast<int>(std::min(std::floor(box_ / reach), max_cells_per_edge));
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
    // One scan per particle: each block of omp_block particles collects its neighbours (larger
    // ids first for each particle) in its own buffer; the buffers are then laid end to end.
    const std::size_t blocks = (n + omp_block - 1) / omp_block;
    std::vector<std::vector<std::uint32_t>> block_lists(blocks);
    std::vector<std::uint32_t> upper_count(n);
    const auto nblocks = static_cast<std::int64_t>(blocks);
#pragma omp parallel for schedule(static, 1) if (static_cast<std::int64_t>(n) >= model_->parallel_min_items)
    for (std::int64_t bb = 0; bb < nblocks; ++bb) {
        const auto block = static_cast<std::size_t>(bb);
        std::vector<std::uint32_t>& out = block_lists[block];
        std::vector<std::uint32_t> lower;
        for (std::size_t i = block * omp_block; i < std::min(n, (block + 1) * omp_block); ++i) {
            lower.clear();
            const std::size_t before = out.size();
            scan(i, [&](std::uint32_t j) {
                if (j > i) out.push_back(j); else lower.push_back(j);
            });
            upper_count[i] = static_cast<std::uint32_t>(out.size() - before);
            out.insert(out.end(), lower.begin(), lower.end());
            nbr_start_[i + 1] = upper_count[i] + lower.size();
        }
    }
    std::partial_sum(nbr_start_.begin(), nbr_start_.end(), nbr_start_.begin());
    // prefetch_ahead entries past the end, all valid ids (0), so that the pair loops can
    // prefetch nbr_[k + prefetch_ahead] without a bounds check.
    nbr_.assign(nbr_start_[n] + prefetch_ahead, 0);
    for (std::size_t i = 0; i < n; ++i) nbr_upper_end_[i] = nbr_start_[i] + upper_count[i];
#pragma omp parallel for schedule(static, 1) if (static_cast<std::int64_t>(n) >= model_->parallel_min_items)
    for (std::int64_t bb = 0; bb < nblocks; ++bb) {
        const auto block = static_cast<std::size_t>(bb);
        std::copy(block_lists[block].begin(), block_lists[block].end(), nbr_.begin() + static_cast<std::ptrdiff_t>(nbr_start_[block * omp_block]));
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
            smallest = std::min(smallest, gap_m(static_cast<std::uint32_t>(i), j) / std::min(radius_[i], radius_[j]));
        }
    return smallest;
}

}  // namespace brownfloc::sim
