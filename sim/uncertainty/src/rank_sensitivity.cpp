#include "uncertainty/rank_sensitivity.hpp"

#include <algorithm>
#include <cmath>
#include <numeric>

#include "uncertainty/least_squares.hpp"
#include "uncertainty/ranks.hpp"
#include "uncertainty/uncertainty_error.hpp"

namespace brownfloc::uncertainty {

namespace {

// Ranks shifted to mean 0 and scaled to sd 1 (divisor n - 1); empty if they do not vary.
std::optional<std::vector<double>> standardised_ranks(const std::vector<double>& values) {
    std::vector<double> ranks = average_ranks(values);
    const double n = static_cast<double>(ranks.size());
    const double mean = (n + 1.0) / 2.0;  // average ranks always sum to n (n + 1) / 2
    double sum_squares = 0.0;
    for (double& r : ranks) {
        r -= mean;
        sum_squares += r * r;
    }
    if (!(sum_squares > 0.0)) return std::nullopt;
    const double inverse_sd = 1.0 / std::sqrt(sum_squares / (n - 1.0));
    for (double& r : ranks) r *= inverse_sd;
    return ranks;
}

double dot(const std::vector<double>& a, const std::vector<double>& b) {
    double sum = 0.0;
    for (std::size_t i = 0; i < a.size(); ++i) sum += a[i] * b[i];
    return sum;
}

void require_numbers(const std::vector<double>& values, const std::string& what) {
    for (std::size_t i = 0; i < values.size(); ++i) {
        if (std::isnan(values[i])) {
            std::string message = "sensitivity: ";
            message += what;
            message += " of sample ";
            message += std::to_string(i);
            message += " is nan: every sample needs a number";
            throw UncertaintyError(message);
        }
    }
}

}  // namespace

RankSensitivity rank_sensitivity(const std::vector<SampledInput>& inputs, const std::vector<double>& outputs) {
    const std::size_t n = outputs.size();
    require_numbers(outputs, "the output");
    for (const SampledInput& input : inputs) {
        if (input.values.size() != n) {
            std::string message = "sensitivity: input ";
            message += input.name;
            message += " has ";
            message += std::to_string(input.values.size());
            message += " samples, the output ";
            message += std::to_string(n);
            throw UncertaintyError(message);
        }
        std::string what = "input ";
        what += input.name;
        require_numbers(input.values, what);
    }

    RankSensitivity result{{}, {}, 0.0, false, false};
    std::vector<std::vector<double>> columns;  // standardised ranks of the varied inputs
    std::vector<std::size_t> column_input;     // which input each column is
    for (std::size_t j = 0; j < inputs.size(); ++j) {
        result.inputs.push_back(InputSensitivity{inputs[j].name, false, std::nullopt, std::nullopt});
        if (n < 2) continue;
        if (auto ranks = standardised_ranks(inputs[j].values)) {
            result.inputs[j].varied = true;
            columns.push_back(std::move(*ranks));
            column_input.push_back(j);
        }
    }
    if (n < columns.size() + 2) {
        std::string message = "sensitivity: the rank regression of ";
        message += std::to_string(columns.size());
        message += " varied inputs needs at least ";
        message += std::to_string(columns.size() + 2);
        message += " samples, got ";
        message += std::to_string(n);
        throw UncertaintyError(message);
    }
    const std::optional<std::vector<double>> y = standardised_ranks(outputs);
    if (!y) return result;  // every output equal: nothing to explain
    result.output_varied = true;

    LeastSquaresFit fit;
    try {
        fit = least_squares(columns, *y);
    } catch (const RankDeficientError& error) {
        std::string message = "sensitivity: the ranks of input ";
        message += inputs[column_input[error.column()]].name;
        message += " are (nearly) a linear combination of those of the inputs before it; "
                   "their effects cannot be told apart";
        throw UncertaintyError(message);
    }
    const double n_minus_1 = static_cast<double>(n) - 1.0;
    for (std::size_t c = 0; c < columns.size(); ++c) {
        InputSensitivity& input = result.inputs[column_input[c]];
        input.srrc = fit.coefficients[c];
        input.spearman_rho = std::clamp(dot(columns[c], *y) / n_minus_1, -1.0, 1.0);
        result.by_influence.push_back(column_input[c]);
    }
    // |y|^2 = n - 1 after standardising.
    result.r_squared = std::clamp(1.0 - fit.residual_sum_of_squares / n_minus_1, 0.0, 1.0);
    result.reliable = result.r_squared >= reliable_rank_r_squared;
    std::stable_sort(result.by_influence.begin(), result.by_influence.end(), [&](std::size_t a, std::size_t b) {
        return std::fabs(*result.inputs[a].srrc) > std::fabs(*result.inputs[b].srrc);
    });
    return result;
}

}  // namespace brownfloc::uncertainty
