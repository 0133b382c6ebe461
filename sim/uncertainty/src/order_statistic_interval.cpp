#include "uncertainty/percentile.hpp"

#include <algorithm>
#include <cmath>
#include <string>
#include <vector>

#include "number_text.hpp"
#include "uncertainty/uncertainty_error.hpp"

namespace brownfloc::uncertainty {

namespace {

// Binomial(n, p) probabilities of k = first .. first + terms.size() - 1, for 0 < p < 1:
// every term above 1e-30 of the mode's (beyond it the neglected tail is far below any useful
// 1 - confidence), by the ratio recurrence P(k+1)/P(k) = (n-k)/(k+1) * p/(1-p) from the mode
// (set to 1), then divided by their sum. No lgamma, no underflow at any n.
struct BinomialWindow {
    std::size_t first;
    std::vector<double> terms;
};

BinomialWindow binomial_window(std::size_t n, double p) {
    constexpr double negligible = 1e-30;
    const double nd = static_cast<double>(n);
    const auto mode = static_cast<std::size_t>(std::min(nd, std::floor((nd + 1.0) * p)));
    const double odds = p / (1.0 - p);

    std::vector<double> below;  // P(mode - 1), P(mode - 2), ...
    double term = 1.0;
    for (std::size_t k = mode; k > 0 && term > negligible; --k) {
        // P(k-1) = P(k) * k / (n - k + 1) / odds
        term *= static_cast<double>(k) / (static_cast<double>(n - k + 1) * odds);
        below.push_back(term);
    }
    std::vector<double> above;  // P(mode + 1), P(mode + 2), ...
    term = 1.0;
    for (std::size_t k = mode; k < n && term > negligible; ++k) {
        term *= static_cast<double>(n - k) / static_cast<double>(k + 1) * odds;
        above.push_back(term);
    }

    BinomialWindow window{mode - below.size(), {}};
    window.terms.assign(below.rbegin(), below.rend());
    window.terms.push_back(1.0);
    window.terms.insert(window.terms.end(), above.begin(), above.end());
    // Normalised by their sum (rounding error about 1e-16 per term).
    double total = 0.0;
    for (double t : window.terms) total += t;
    for (double& t : window.terms) t /= total;
    return window;
}

}  // namespace

OrderStatisticInterval order_statistic_interval(std::size_t n, double p, double confidence) {
    if (n == 0) throw UncertaintyError("percentile interval of no values: at least one sample is needed");
    if (!(p >= 0.0 && p <= 1.0)) {
        std::string message = "percentile interval: p = ";
        message += detail::number_text(p);
        message += ": must be in [0, 1] (a fraction, not per cent)";
        throw UncertaintyError(message);
    }
    if (!(confidence > 0.0 && confidence < 1.0)) {
        std::string message = "percentile interval: confidence = ";
        message += detail::number_text(confidence);
        message += ": must be in (0, 1), e.g. 0.95";
        throw UncertaintyError(message);
    }
    const double tail = 0.5 * (1.0 - confidence);
    // B is certain to be 0 (p = 0) or n (p = 1): x(0) = -inf <= xi_0 <= x(1), x(n) <= xi_1.
    if (p == 0.0) return OrderStatisticInterval{0, 1, 1.0};
    if (p == 1.0) return OrderStatisticInterval{n, n + 1, 1.0};

    const BinomialWindow window = binomial_window(n, p);
    const std::size_t count = window.terms.size();
    // r - 1 = the largest k with P(B <= k) <= tail; k = first - 1 has P ~ 0 (outside window).
    std::size_t lower_rank = window.first;  // r for k = first - 1
    double below_r = 0.0;                   // P(B <= r - 1)
    {
        double cumulative = 0.0;
        for (std::size_t i = 0; i < count; ++i) {
            cumulative += window.terms[i];
            if (cumulative > tail) break;
            lower_rank = window.first + i + 1;
            below_r = cumulative;
        }
    }
    // s = the smallest with P(B >= s) <= tail; s = first + count has P ~ 0 (outside window).
    std::size_t upper_rank = window.first + count;
    double above_s = 0.0;  // P(B >= s)
    {
        double cumulative = 0.0;
        for (std::size_t i = count; i-- > 0;) {
            cumulative += window.terms[i];
            if (cumulative > tail) break;
            upper_rank = window.first + i;
            above_s = cumulative;
        }
    }
    upper_rank = std::max<std::size_t>(upper_rank, 1);
    return OrderStatisticInterval{lower_rank, upper_rank, 1.0 - below_r - above_s};
}

}  // namespace brownfloc::uncertainty
