#pragma once
// The sums behind the z-average diameter (shelf_criteria/z_average.hpp), with the per-size
// intensities and diameters kept between calls: a root search evaluates the same setup at
// many times, and the per-size factors (a pow or two each) cost more than the sums.
#include <vector>

#include "shelf_criteria/scattering_setup.hpp"

namespace brownfloc::shelf::detail {

class ZAverageSeries {
public:
    // Inputs already validated; qa = q a (0 for rayleigh optics).
    ZAverageSeries(Optics optics, double qa, double fractal_dimension);

    // D_z(x)/D_z(0) - 1 at x = t/τ in [0, max_z_average_t_over_tau], as
    // Σ_{k>=2} w_k (1 - D_1/D_k) / Σ_k w_k D_1/D_k with w_k = I_k p^(k-1), p = x/(1+x):
    // no "ratio - 1" cancellation, so small growths keep their relative precision.
    [[nodiscard]] double growth(double t_over_tau);

    // Number of sizes the last growth() call summed (for tests and measurements).
    [[nodiscard]] int last_term_count() const { return last_term_count_; }

private:
    void extend_to(int k);

    Optics optics_;
    double qa_;
    double fractal_dimension_;
    std::vector<double> intensity_;          // I_k / I_1, index k - 1
    std::vector<double> primary_over_size_;  // D_1 / D_k = a / R_h,k, index k - 1
    int last_term_count_ = 0;
};

}  // namespace brownfloc::shelf::detail
