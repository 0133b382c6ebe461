#pragma once
// Tabulated U(h) and -dU/dh for the simulator's inner loop.
//
// The table covers [start_gap, end_gap] with 128 intervals per octave of h / start_gap, so
// the spacing is between 1/128 and 1/64 of the gap: fine where van der Waals varies as
// 1/h^2 near contact, and fine enough for exp(-kappa h) wherever that force still matters.
// The interval index comes straight from the bits of the double h / start_gap (exponent and
// top 7 mantissa bits), so a look-up costs no logarithm. Each interval holds the cubic that
// interpolates the analytic force (and energy) at the 4 Chebyshev nodes of the interval,
// an error 8x below cubic Hermite: |F_tab - F| <= 1e-6 max(|F|, kappa kT) (tested).
// Beyond end_gap both are 0; below start_gap they are held at their start_gap values.
// Immutable after construction; look-ups are thread-safe and reproducible.
#include <cstdint>
#include <vector>

#include "potentials/pair_interaction.hpp"

namespace brownfloc::potentials {

class TabulatedInteraction {
public:
    TabulatedInteraction(const PairInteraction& pair, double start_gap_m, double end_gap_m);

    // -dU/dh [N] at gap h_m.
    [[nodiscard]] double force_N(double h_m) const {
        const Lookup l = locate(h_m);
        if (l.index < 0) return l.index == below_ ? force_start_N_ : 0.0;
        const double* c = &coefficients_[8 * static_cast<std::size_t>(l.index)];
        return c[0] + l.t * (c[1] + l.t * (c[2] + l.t * c[3]));
    }
    // U [J] at gap h_m.
    [[nodiscard]] double energy_J(double h_m) const {
        const Lookup l = locate(h_m);
        if (l.index < 0) return l.index == below_ ? energy_start_J_ : 0.0;
        const double* c = &coefficients_[8 * static_cast<std::size_t>(l.index) + 4];
        return c[0] + l.t * (c[1] + l.t * (c[2] + l.t * c[3]));
    }

    [[nodiscard]] double start_gap_m() const { return start_gap_m_; }
    [[nodiscard]] double end_gap_m() const { return end_gap_m_; }
    [[nodiscard]] std::size_t intervals() const { return coefficients_.size() / 8; }

    static constexpr int intervals_per_octave = 128;

private:
    struct Lookup {
        std::int64_t index;
        double t;  // position inside the interval, [0, 1)
    };
    static constexpr std::int64_t below_ = -1, beyond_ = -2;

    [[nodiscard]] Lookup locate(double h_m) const {
        const double x = h_m * inverse_start_gap_;
        if (!(x >= 1.0)) return {below_, 0.0};
        if (x >= end_x_) return {beyond_, 0.0};
        std::uint64_t bits;
        static_assert(sizeof(bits) == sizeof(x));
        __builtin_memcpy(&bits, &x, sizeof bits);
        const auto octave = static_cast<std::int64_t>(bits >> 52) - 1023;
        const auto sub = static_cast<std::int64_t>((bits >> 45) & 127u);
        const double t = static_cast<double>(bits & ((std::uint64_t{1} << 45) - 1)) * 0x1p-45;
        return {octave * intervals_per_octave + sub, t};
    }

    double start_gap_m_, end_gap_m_, inverse_start_gap_, end_x_;
    double force_start_N_ = 0.0, energy_start_J_ = 0.0;
    std::vector<double> coefficients_;  // per interval: 4 force, 4 energy polynomial coefficients
};

}  // namespace brownfloc::potentials
