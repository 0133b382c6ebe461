#pragma once
// Tabulated U(h) and -dU/dh of one pair for the simulator's inner loop (a GapTable of the
// force and the energy; see gap_table.hpp for the layout and the accuracy).
// |F_tab - F| <= 1e-6 max(|F|, kappa kT) from start to end gap (tested). Beyond end_gap both
// are 0; below start_gap they hold their start_gap values. Thread-safe look-ups.
#include "potentials/gap_table.hpp"
#include "potentials/pair_interaction.hpp"

namespace brownfloc::potentials {

class TabulatedInteraction {
public:
    TabulatedInteraction(const PairInteraction& pair, double start_gap_m, double end_gap_m)
        : table_([&pair](double h) {
                     const EnergySlope es = pair.total(h);
                     return std::array<double, 2>{-es.slope_J_per_m, es.energy_J};
                 },
                 start_gap_m, end_gap_m) {}

    // -dU/dh [N] at gap h_m.
    [[nodiscard]] double force_N(double h_m) const { return table_.value<0>(h_m); }
    // U [J] at gap h_m.
    [[nodiscard]] double energy_J(double h_m) const { return table_.value<1>(h_m); }

    [[nodiscard]] double start_gap_m() const { return table_.start_gap_m(); }
    [[nodiscard]] double end_gap_m() const { return table_.end_gap_m(); }
    [[nodiscard]] std::size_t intervals() const { return table_.intervals(); }

private:
    GapTable<2> table_;
};

}  // namespace brownfloc::potentials
