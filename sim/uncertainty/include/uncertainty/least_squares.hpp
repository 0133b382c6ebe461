#pragma once
// A small dense least-squares solver for the rank regression (a handful of columns, up to a
// few tens; rows = Monte Carlo samples). Householder QR (Golub & Van Loan (2013), "Matrix
// Computations", 4th ed., algorithm 5.3.2): it works on A itself, so its error grows with
// cond(A), not cond(A)^2 as with the normal equations. O(n k^2) time, one copy of A.
// No pivoting: columns are taken in the order given, so a column that is (nearly) a linear
// combination of the earlier ones is reported by index. Pure, thread-safe.
#include <vector>

namespace brownfloc::uncertainty {

struct LeastSquaresFit {
    std::vector<double> coefficients;  // minimise |A c - b|, one per column
    double residual_sum_of_squares;    // |A c - b|^2
};

// columns: k columns of A, each n rows long, n > k >= 0 (k = 0 gives RSS = |b|^2).
// A column whose part orthogonal to the columns before it is below 1e-10 of its own norm
// (or which is zero) throws RankDeficientError with its index. Non-finite entries, ragged
// columns or n <= k throw UncertaintyError.
[[nodiscard]] LeastSquaresFit least_squares(const std::vector<std::vector<double>>& columns,
                                            const std::vector<double>& rhs);

}  // namespace brownfloc::uncertainty
