#include "sim/engine_model.hpp"

#include <algorithm>

namespace brownfloc::sim {

double EngineModel::max_cutoff_gap_m() const {
    double m = 0;
    for (const PairKind& k : pair_kinds) m = std::max(m, k.cutoff_gap_m);
    return m;
}

double EngineModel::max_capture_gap_m() const {
    double m = 0;
    for (const PairKind& k : pair_kinds) m = std::max(m, k.capture_gap_m);
    return m;
}

}  // namespace brownfloc::sim
