#pragma once
// "These uncertain inputs or statistics are not usable": a distribution with a negative sd, a
// probability outside [0, 1], a sample column holding NaN. The message names the value and what
// is allowed; the caller (the scenario parser, the estimator) prefixes the file, line and key:
//
//   { mean = 10, sd = -4 }: sd = -4: must be >= 0
#include <cstddef>
#include <stdexcept>
#include <string>

namespace brownfloc::uncertainty {

class UncertaintyError : public std::runtime_error {
public:
    explicit UncertaintyError(const std::string& what);
};

// least_squares: a column is (nearly) a linear combination of the columns before it.
class RankDeficientError : public UncertaintyError {
public:
    RankDeficientError(const std::string& what, std::size_t column);
    // Index (from 0) of the first column that adds nothing new.
    [[nodiscard]] std::size_t column() const noexcept { return column_; }

private:
    std::size_t column_;
};

}  // namespace brownfloc::uncertainty
