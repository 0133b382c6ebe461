#include "z_average_series.hpp"

#include <algorithm>
#include <cmath>
#include <stdexcept>

#include "shelf_criteria/cluster_optics.hpp"
#include "shelf_criteria/z_average.hpp"

namespace brownfloc::shelf::detail {
namespace {

// Issue 6's rule: stop once the sizes left over hold less than this share of the clusters.
constexpr double remaining_number_fraction = 1e-12;
// And once what they could add to either sum is below this share of it.
constexpr double remaining_sum_bound = 1e-15;
// Far above the ~6e5 sizes needed at the largest x allowed: reaching it is a bug.
constexpr int max_terms = 50'000'000;

// Compensated (Neumaier) summation: up to ~1e6 positive terms of very different size.
class CompensatedSum {
public:
    void add(double term) {
        const double total = sum_ + term;
        if (std::abs(sum_) >= std::abs(term))
            compensation_ += (sum_ - total) + term;
        else
            compensation_ += (term - total) + sum_;
        sum_ = total;
    }
    [[nodiscard]] double value() const { return sum_ + compensation_; }

private:
    double sum_ = 0.0;
    double compensation_ = 0.0;
};

// Σ_{j>k} j² p^(j-1) = p^k [c²/(1-p) + 2cp/(1-p)² + p(1+p)/(1-p)³], c = k + 1: the sum of
// the Rayleigh weights k², which bound I_j / I_1 for every optics (S_j <= 1).
// p_to_k = p^k; one_minus_p = 1/(1+x), exact rather than 1 - p.
double rayleigh_tail(int k, double p, double p_to_k, double one_minus_p) {
    const double c = static_cast<double>(k) + 1.0;
    return p_to_k * (c * c / one_minus_p + 2.0 * c * p / (one_minus_p * one_minus_p) +
                     p * (1.0 + p) / (one_minus_p * one_minus_p * one_minus_p));
}

}  // namespace

ZAverageSeries::ZAverageSeries(Optics optics, double qa, double fractal_dimension)
    : optics_{optics}, qa_{qa}, fractal_dimension_{fractal_dimension} {}

void ZAverageSeries::extend_to(int k) {
    intensity_.reserve(static_cast<std::size_t>(k));
    primary_over_size_.reserve(static_cast<std::size_t>(k));
    for (int size = static_cast<int>(intensity_.size()) + 1; size <= std::min(k, 3); ++size) {
        intensity_.push_back(cluster_intensity_over_primary(size, optics_, qa_, fractal_dimension_));
        primary_over_size_.push_back(1.0 / cluster_hydrodynamic_radius_over_a(size, fractal_dimension_));
    }
    // k >= 4: the same formulas as cluster_optics.cpp, R_g = R_h = a k^(1/d_f) and the
    // Fisher & Burford (1967) S_k, with the power taken once per size (the tests compare
    // the two paths).
    const double inverse_dimension = 1.0 / fractal_dimension_;
    const double fisher_burford = 2.0 * qa_ * qa_ / (3.0 * fractal_dimension_);
    for (int size = static_cast<int>(intensity_.size()) + 1; size <= k; ++size) {
        const double mass = static_cast<double>(size);
        const double radius_over_a = std::pow(mass, inverse_dimension);
        double intensity = mass * mass;
        if (optics_ == Optics::rgd)
            intensity *= std::pow(1.0 + fisher_burford * radius_over_a * radius_over_a, -0.5 * fractal_dimension_);
        intensity_.push_back(intensity);
        primary_over_size_.push_back(1.0 / radius_over_a);
    }
}

double ZAverageSeries::growth(double t_over_tau) {
    const double x = t_over_tau;
    const double p = x / (1.0 + x);
    const double one_minus_p = 1.0 / (1.0 + x);
    CompensatedSum growth_sum;  // Σ w_k (1 - D_1/D_k)
    CompensatedSum inverse_sum; // Σ w_k D_1/D_k
    // The rule stops near 42 (1 + x) sizes for rayleigh optics, a little later for rgd.
    const int expected_terms = static_cast<int>(std::min(45.0 * (1.0 + x) + 64.0, 1e8));
    double p_to_k_minus_1 = 1.0;
    for (int k = 1; k <= max_terms; ++k) {
        if (k > static_cast<int>(intensity_.size()))
            extend_to(std::max(k + k / 4, expected_terms));
        const double weight = intensity_[k - 1] * p_to_k_minus_1;
        const double primary_over_size = primary_over_size_[k - 1];
        if (k > 1) growth_sum.add(weight * (1.0 - primary_over_size));
        inverse_sum.add(weight * primary_over_size);
        const double p_to_k = p_to_k_minus_1 * p;  // the number fraction in sizes > k
        if (p_to_k < remaining_number_fraction) {
            // Past k, D_1/D_j <= D_1/D_k (R_h rises with size) and 1 - D_1/D_j < 1.
            const double tail = rayleigh_tail(k, p, p_to_k, one_minus_p);
            if (tail <= remaining_sum_bound * growth_sum.value() &&
                tail * primary_over_size <= remaining_sum_bound * inverse_sum.value()) {
                last_term_count_ = k;
                return growth_sum.value() / inverse_sum.value();
            }
        }
        p_to_k_minus_1 = p_to_k;
    }
    throw std::logic_error("ZAverageSeries::growth: the series did not meet its truncation rule");
}

}  // namespace brownfloc::shelf::detail
