#include "uncertainty/least_squares.hpp"

#include <cmath>
#include <string>

#include "uncertainty/uncertainty_error.hpp"

namespace brownfloc::uncertainty {

namespace {

double squared_norm(const std::vector<double>& v, std::size_t from) {
    double sum = 0.0;
    for (std::size_t i = from; i < v.size(); ++i) sum += v[i] * v[i];
    return sum;
}

void require_shape(const std::vector<std::vector<double>>& columns, const std::vector<double>& rhs) {
    const std::size_t n = rhs.size();
    if (n <= columns.size()) {
        std::string message = "least squares needs more rows than columns (";
        message += std::to_string(n);
        message += " rows, ";
        message += std::to_string(columns.size());
        message += " columns)";
        throw UncertaintyError(message);
    }
    for (std::size_t j = 0; j < columns.size(); ++j) {
        if (columns[j].size() != n) {
            std::string message = "least squares: column ";
            message += std::to_string(j);
            message += " has ";
            message += std::to_string(columns[j].size());
            message += " rows, the right-hand side ";
            message += std::to_string(n);
            throw UncertaintyError(message);
        }
        for (double value : columns[j])
            if (!std::isfinite(value)) {
                std::string message = "least squares: column ";
                message += std::to_string(j);
                message += " holds a value that is not finite";
                throw UncertaintyError(message);
            }
    }
    for (double value : rhs)
        if (!std::isfinite(value)) throw UncertaintyError("least squares: the right-hand side holds a value that is not finite");
}

}  // namespace

LeastSquaresFit least_squares(const std::vector<std::vector<double>>& columns, const std::vector<double>& rhs) {
    require_shape(columns, rhs);
    const std::size_t k = columns.size();
    std::vector<std::vector<double>> a = columns;  // overwritten by R (upper part)
    std::vector<double> b = rhs;                   // overwritten by Q^T b
    std::vector<double> diagonal(k);               // R(j, j)

    for (std::size_t j = 0; j < k; ++j) {
        std::vector<double>& x = a[j];
        const double original_norm = std::sqrt(squared_norm(columns[j], 0));
        const double norm = std::sqrt(squared_norm(x, j));
        if (!(norm > 1e-10 * original_norm) || original_norm == 0.0) {
            std::string message = "least squares: column ";
            message += std::to_string(j);
            message += " is zero or (nearly) a linear combination of the columns before it";
            throw RankDeficientError(message, j);
        }
        // Reflector H = I - 2 v v^T / (v^T v), v = x - alpha e_j, alpha = -sign(x_j) |x|
        // (the sign that avoids cancellation in x_j - alpha).
        const double alpha = x[j] > 0.0 ? -norm : norm;
        std::vector<double> v(x.begin() + static_cast<std::ptrdiff_t>(j), x.end());
        v[0] -= alpha;
        const double v_norm2 = squared_norm(v, 0);
        auto reflect = [&](std::vector<double>& column) {
            double dot = 0.0;
            for (std::size_t i = 0; i < v.size(); ++i) dot += v[i] * column[j + i];
            const double scale = 2.0 * dot / v_norm2;
            for (std::size_t i = 0; i < v.size(); ++i) column[j + i] -= scale * v[i];
        };
        for (std::size_t c = j + 1; c < k; ++c) reflect(a[c]);
        reflect(b);
        diagonal[j] = alpha;
    }

    // Back substitution R c = (Q^T b)[0, k).
    std::vector<double> coefficients(k);
    for (std::size_t j = k; j-- > 0;) {
        double sum = b[j];
        for (std::size_t c = j + 1; c < k; ++c) sum -= a[c][j] * coefficients[c];
        coefficients[j] = sum / diagonal[j];
    }
    return LeastSquaresFit{std::move(coefficients), squared_norm(b, k)};
}

}  // namespace brownfloc::uncertainty
