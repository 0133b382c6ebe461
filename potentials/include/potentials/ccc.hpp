#pragma once
// Critical coagulation concentration (CCC) of a varied salt.
//
// Barrier criterion (Verwey & Overbeek 1948): the salt concentration at which the highest
// local maximum of U(h) falls to zero, so U = 0 and dU/dh = 0 at the same gap. Kinetic
// criterion: the concentration where the tangent of log10 W - log10 c, taken where W = 100,
// reaches W = 1 (the way CCCs are read off stability plots).
#include <functional>
#include <optional>
#include <string>

#include "potentials/pair_interaction.hpp"

namespace brownfloc::potentials {

// Builds the pair interaction at a given concentration [mol/m^3] of the varied salt.
using PairAtConcentration = std::function<PairInteraction(double concentration_mol_per_m3)>;

enum class CccStatus {
    found,                // a crossing inside [1 uM, 5 M]
    no_barrier_anywhere,  // no barrier even at 1 uM: unstable at any salt
    barrier_everywhere,   // the barrier survives 5 M
};

struct CccResult {
    CccStatus status = CccStatus::found;
    std::optional<double> concentration_mol_per_m3;  // empty when no crossing in the range
    std::string note;                                 // why it is empty, or a caveat
    double gap_m = 0.0;                               // where the maximum sits at the CCC
    bool maximum_at_min_gap = false;
};

// Search range of every CCC: 1 uM to 5 M.
inline constexpr double ccc_lowest_mol_per_m3 = 1e-3;
inline constexpr double ccc_highest_mol_per_m3 = 5e3;

// Barrier CCC by bisection in ln c, to 1e-7 relative. Thread-safe if make_pair is.
[[nodiscard]] CccResult barrier_ccc(const PairAtConcentration& make_pair, double min_gap_m);

struct KineticCccResult {
    std::optional<double> concentration_mol_per_m3;
    std::optional<double> w100_concentration_mol_per_m3;  // where W_experimental = 100
    std::optional<double> dlog10w_dlog10c;                 // slope there
    std::string note;
};

// Kinetic CCC from W_experimental (Honig-corrected, relative to van der Waals alone).
[[nodiscard]] KineticCccResult kinetic_ccc(const PairAtConcentration& make_pair, double min_gap_m);

// Least-squares slope of ln y on ln x (the Schulze-Hardy exponent for y = CCC, x = z).
[[nodiscard]] double log_log_slope(const double* x, const double* y, int n);

}  // namespace brownfloc::potentials
