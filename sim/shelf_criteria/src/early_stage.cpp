#include "shelf_criteria/early_stage.hpp"

#include <stdexcept>

#include "number_text.hpp"

namespace brownfloc::shelf {

double early_stage_limit(Criterion criterion) {
    // All four are the values at t = τ: N/N0 = 1/2, N0/N = 2, 1 - n1/N0 = 1 - 1/4; the
    // z-average limit (100 %) is issue 6's, reached at t = 1.48 τ for rayleigh optics and d_f = 2.1.
    switch (criterion) {
        case Criterion::count_drop: return 0.5;
        case Criterion::mean_size: return 2.0;
        case Criterion::aggregated_fraction: return 0.75;
        case Criterion::z_average_growth: return 1.0;
    }
    throw std::invalid_argument("early_stage_limit: not a Criterion enumerator");
}

std::optional<std::string> early_stage_warning(const CriterionSpec& spec) {
    validate_criterion(spec);
    const double limit = early_stage_limit(spec.criterion);
    if (spec.value <= limit) return std::nullopt;
    std::string message = "criterion ";
    message += criterion_name(spec.criterion);
    message += " = ";
    message += detail::number_text(spec.value);
    message += " is past the early stage where the constant kernel holds (";
    switch (spec.criterion) {
        case Criterion::count_drop: message += "count drop > 0.5"; break;
        case Criterion::mean_size: message += "mean size > 2"; break;
        case Criterion::aggregated_fraction: message += "aggregated fraction > 0.75"; break;
        case Criterion::z_average_growth: message += "z-average growth > 100 %"; break;
    }
    message += "); the time is a rough guide only";
    return message;
}

}  // namespace brownfloc::shelf
