#pragma once
// N functions of the surface gap h, tabulated together for fast look-ups in inner loops.
//
// The table covers [start_gap, end_gap] with 128 intervals per octave of x = h / start_gap,
// so the spacing is between 1/128 and 1/64 of the gap: fine where a force varies as 1/h^2
// near contact, and fine for exp(-kappa h) wherever that term still matters. The interval
// index comes straight from the bits of the double x (exponent and top 7 mantissa bits), so
// a look-up costs no logarithm. Each interval holds, per function, the cubic through the
// function at the interval's 4 Chebyshev nodes (interpolation error 8x below cubic Hermite).
// The N cubics of one interval sit together in memory (N = 2: one 64-byte line).
// Beyond end_gap every function is 0; below start_gap each holds its start_gap value.
// Immutable after construction; look-ups are thread-safe and reproducible.
#include <array>
#include <cassert>
#include <cmath>
#include <cstdint>
#include <cstring>
#include <vector>

namespace brownfloc::potentials {

namespace detail {
// Monomial coefficients (in t on [0, 1]) of the cubic through (nodes[k], values[k]).
void cubic_through(const double nodes[4], const double values[4], double out[4]);
// The 4 Chebyshev nodes of [0, 1].
const double* chebyshev_nodes_01();
}  // namespace detail

template <int N>
class GapTable {
public:
    static constexpr int intervals_per_octave = 128;

    // sample(h) returns std::array<double, N>: the N functions at gap h [m].
    template <class Sample>
    GapTable(const Sample& sample, double start_gap_m, double end_gap_m)
        : start_gap_m_(start_gap_m), end_gap_m_(end_gap_m), inverse_start_gap_(1.0 / start_gap_m),
          end_x_(end_gap_m / start_gap_m) {
        assert(start_gap_m > 0 && end_gap_m > start_gap_m);
        at_start_ = sample(start_gap_m);
        const int octaves = static_cast<int>(std::ceil(std::log2(end_x_)));
        const std::size_t count = static_cast<std::size_t>(octaves) * intervals_per_octave;
        coefficients_.resize(4 * N * count);
        const double* nodes = detail::chebyshev_nodes_01();
        for (std::size_t i = 0; i < count; ++i) {
            const int octave = static_cast<int>(i / intervals_per_octave);
            const int sub = static_cast<int>(i % intervals_per_octave);
            const double width_x = std::ldexp(1.0, octave) / intervals_per_octave;
            const double x0 = std::ldexp(1.0, octave) + sub * width_x;
            double values[N][4];
            for (int k = 0; k < 4; ++k) {
                const std::array<double, N> v = sample(start_gap_m * (x0 + nodes[k] * width_x));
                for (int n = 0; n < N; ++n) values[n][k] = v[n];
            }
            for (int n = 0; n < N; ++n) detail::cubic_through(nodes, values[n], &coefficients_[(N * i + n) * 4]);
        }
    }

    // Function n at gap h_m.
    template <int n>
    [[nodiscard]] double value(double h_m) const {
        static_assert(n >= 0 && n < N);
        const Lookup l = locate(h_m);
        if (l.index < 0) return l.index == below_ ? at_start_[n] : 0.0;
        const double* c = &coefficients_[(N * static_cast<std::size_t>(l.index) + n) * 4];
        return c[0] + l.t * (c[1] + l.t * (c[2] + l.t * c[3]));
    }

    // All N functions at gap h_m.
    [[nodiscard]] std::array<double, N> values(double h_m) const {
        std::array<double, N> out{};
        const Lookup l = locate(h_m);
        if (l.index < 0) return l.index == below_ ? at_start_ : out;
        const double* c = &coefficients_[N * static_cast<std::size_t>(l.index) * 4];
        for (int n = 0; n < N; ++n, c += 4) out[n] = c[0] + l.t * (c[1] + l.t * (c[2] + l.t * c[3]));
        return out;
    }

    [[nodiscard]] double start_gap_m() const { return start_gap_m_; }
    [[nodiscard]] double end_gap_m() const { return end_gap_m_; }
    [[nodiscard]] std::size_t intervals() const { return coefficients_.size() / (4 * N); }

private:
    struct Lookup {
        std::int64_t index;
        double t;  // position inside the interval, [0, 1)
    };
    static constexpr std::int64_t below_ = -1, beyond_ = -2;

    [[nodiscard]] Lookup locate(double h_m) const {
        const double x = h_m * inverse_start_gap_;
        if (!(x >= 1.0)) return {below_, 0.0};  // also NaN
        if (x >= end_x_) return {beyond_, 0.0};
        std::uint64_t bits;
        std::memcpy(&bits, &x, sizeof bits);
        const auto octave = static_cast<std::int64_t>(bits >> 52) - 1023;
        const auto sub = static_cast<std::int64_t>((bits >> 45) & 127u);
        const double t = static_cast<double>(bits & ((std::uint64_t{1} << 45) - 1)) * 0x1p-45;
        return {octave * intervals_per_octave + sub, t};
    }

    double start_gap_m_, end_gap_m_, inverse_start_gap_, end_x_;
    std::array<double, N> at_start_{};
    std::vector<double> coefficients_;  // interval-major: N cubics of 4 coefficients each
};

}  // namespace brownfloc::potentials
