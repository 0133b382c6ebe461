#pragma once
// Globally adaptive Gauss-Kronrod quadrature (10-point Gauss / 21-point Kronrod pair, the
// QUADPACK qk21 rule: Piessens, de Doncker-Kapenga, Ueberhuber & Kahaner 1983). Private
// to potentials/. Thread-safe: no state outside the call.
#include <algorithm>
#include <cmath>
#include <queue>
#include <vector>

namespace brownfloc::potentials::detail {

struct QuadratureResult {
    double value = 0.0;
    double error = 0.0;  // estimated absolute error
    int intervals = 0;
    bool converged = false;
};

struct KronrodEstimate {
    double a, b, value, error;
    bool operator<(const KronrodEstimate& o) const { return error < o.error; }
};

extern const double kronrod21_nodes[11];
extern const double kronrod21_weights[11];
extern const double gauss10_weights[5];

template <class F>
KronrodEstimate kronrod21(const F& f, double a, double b) {
    const double centre = 0.5 * (a + b), half = 0.5 * (b - a);
    const double fc = f(centre);
    double kronrod = fc * kronrod21_weights[10], gauss = 0.0;
    for (int i = 0; i < 10; ++i) {
        const double dx = half * kronrod21_nodes[i];
        const double pair = f(centre - dx) + f(centre + dx);
        kronrod += kronrod21_weights[i] * pair;
        if (i % 2 == 1) gauss += gauss10_weights[i / 2] * pair;
    }
    return {a, b, kronrod * half, std::abs((kronrod - gauss) * half)};
}

// Integrates f over each [breaks[i], breaks[i+1]] jointly, bisecting the interval with the
// largest error estimate until the total error <= max(abs_tol, rel_tol |value|).
template <class F>
QuadratureResult integrate(const F& f, const std::vector<double>& breaks, double rel_tol,
                           double abs_tol = 0.0, int max_intervals = 4000) {
    std::priority_queue<KronrodEstimate> queue;
    double value = 0.0, error = 0.0;
    for (std::size_t i = 0; i + 1 < breaks.size(); ++i) {
        if (!(breaks[i + 1] > breaks[i])) continue;
        const KronrodEstimate e = kronrod21(f, breaks[i], breaks[i + 1]);
        value += e.value;
        error += e.error;
        queue.push(e);
    }
    int intervals = static_cast<int>(queue.size());
    while (!queue.empty() && error > std::max(abs_tol, rel_tol * std::abs(value)) &&
           intervals < max_intervals) {
        const KronrodEstimate worst = queue.top();
        queue.pop();
        const double mid = 0.5 * (worst.a + worst.b);
        if (!(mid > worst.a && mid < worst.b)) break;  // cannot split further in double
        const KronrodEstimate left = kronrod21(f, worst.a, mid), right = kronrod21(f, mid, worst.b);
        value += left.value + right.value - worst.value;
        error += left.error + right.error - worst.error;
        queue.push(left);
        queue.push(right);
        ++intervals;
    }
    // Re-sum to shed the rounding of the running updates.
    double sum = 0.0, err = 0.0;
    while (!queue.empty()) {
        sum += queue.top().value;
        err += queue.top().error;
        queue.pop();
    }
    return {sum, err, intervals, err <= std::max(abs_tol, rel_tol * std::abs(sum))};
}

}  // namespace brownfloc::potentials::detail
