#include "uncertainty/ranks.hpp"

#include <algorithm>
#include <cmath>
#include <numeric>
#include <string>

#include "uncertainty/uncertainty_error.hpp"

namespace brownfloc::uncertainty {

std::vector<double> average_ranks(const std::vector<double>& values) {
    const std::size_t n = values.size();
    for (std::size_t i = 0; i < n; ++i) {
        if (std::isnan(values[i])) {
            std::string message = "ranks: value ";
            message += std::to_string(i);
            message += " is nan: every sample needs a number";
            throw UncertaintyError(message);
        }
    }
    std::vector<std::size_t> order(n);
    std::iota(order.begin(), order.end(), std::size_t{0});
    std::stable_sort(order.begin(), order.end(), [&](std::size_t a, std::size_t b) { return values[a] < values[b]; });
    std::vector<double> ranks(n);
    for (std::size_t first = 0; first < n;) {
        std::size_t last = first;  // inclusive end of the run of equal values
        while (last + 1 < n && values[order[last + 1]] == values[order[first]]) ++last;
        // Positions first..last (from 0) hold ranks first+1..last+1: their average.
        const double rank = 0.5 * static_cast<double>(first + last) + 1.0;
        for (std::size_t k = first; k <= last; ++k) ranks[order[k]] = rank;
        first = last + 1;
    }
    return ranks;
}

double pearson_correlation(const std::vector<double>& x, const std::vector<double>& y) {
    if (x.size() != y.size() || x.size() < 2) {
        std::string message = "correlation needs two vectors of the same length >= 2 (got ";
        message += std::to_string(x.size());
        message += " and ";
        message += std::to_string(y.size());
        message += ")";
        throw UncertaintyError(message);
    }
    for (std::size_t i = 0; i < x.size(); ++i) {
        if (!std::isfinite(x[i]) || !std::isfinite(y[i])) {
            std::string message = "correlation: pair ";
            message += std::to_string(i);
            message += " is not finite: use spearman_rho (ranks) for infinite values";
            throw UncertaintyError(message);
        }
    }
    const double n = static_cast<double>(x.size());
    const double mean_x = std::accumulate(x.begin(), x.end(), 0.0) / n;
    const double mean_y = std::accumulate(y.begin(), y.end(), 0.0) / n;
    double sxx = 0.0, syy = 0.0, sxy = 0.0;
    for (std::size_t i = 0; i < x.size(); ++i) {
        const double dx = x[i] - mean_x, dy = y[i] - mean_y;
        sxx += dx * dx;
        syy += dy * dy;
        sxy += dx * dy;
    }
    if (!(sxx > 0.0) || !(syy > 0.0)) return 0.0;
    return std::clamp(sxy / std::sqrt(sxx * syy), -1.0, 1.0);
}

double spearman_rho(const std::vector<double>& x, const std::vector<double>& y) {
    return pearson_correlation(average_ranks(x), average_ranks(y));
}

}  // namespace brownfloc::uncertainty
