#include "shelf_criteria/criterion.hpp"

#include <array>
#include <cmath>
#include <stdexcept>
#include <string>
#include <utility>

#include "number_text.hpp"

namespace brownfloc::shelf {
namespace {

constexpr std::array<std::pair<std::string_view, Criterion>, 4> criterion_names{{
    {"count-drop", Criterion::count_drop},
    {"mean-size", Criterion::mean_size},
    {"aggregated-fraction", Criterion::aggregated_fraction},
    {"z-average-growth", Criterion::z_average_growth},
}};

[[noreturn]] void refuse_value(const CriterionSpec& spec, std::string_view allowed) {
    std::string message = "criterion ";
    message += criterion_name(spec.criterion);
    message += ": criterion_value = ";
    message += detail::number_text(spec.value);
    message += ": must be ";
    message += allowed;
    throw std::invalid_argument(message);
}

}  // namespace

Criterion criterion_from_name(std::string_view name) {
    for (const auto& [text, criterion] : criterion_names)
        if (name == text) return criterion;
    std::string message = "unknown criterion \"";
    message += name;
    message += "\": allowed are";
    for (std::size_t i = 0; i < criterion_names.size(); ++i) {
        message += i == 0 ? " " : ", ";
        message += criterion_names[i].first;
    }
    throw std::invalid_argument(message);
}

std::string_view criterion_name(Criterion criterion) {
    for (const auto& [text, known] : criterion_names)
        if (known == criterion) return text;
    throw std::invalid_argument("criterion_name: not a Criterion enumerator");
}

double default_criterion_value(Criterion criterion) {
    switch (criterion) {
        case Criterion::count_drop: return 0.1;
        case Criterion::mean_size: return 1.1;
        case Criterion::aggregated_fraction: return 0.1;
        case Criterion::z_average_growth: return 0.1;
    }
    throw std::invalid_argument("default_criterion_value: not a Criterion enumerator");
}

void validate_criterion(const CriterionSpec& spec) {
    const double g = spec.value;
    // Written so that NaN fails every test.
    switch (spec.criterion) {
        case Criterion::count_drop:
            if (!(g > 0.0 && g < 1.0))
                refuse_value(spec, "in (0, 1): the fraction by which the particle count N falls");
            return;
        case Criterion::mean_size:
            if (!(g > 1.0 && std::isfinite(g)))
                refuse_value(spec, "finite and > 1: the number-average size N0/N to reach");
            return;
        case Criterion::aggregated_fraction:
            if (!(g > 0.0 && g < 1.0))
                refuse_value(spec, "in (0, 1): the fraction of primary particles no longer single");
            return;
        case Criterion::z_average_growth:
            if (!(g > 0.0 && std::isfinite(g)))
                refuse_value(spec, "finite and > 0: the fractional growth of the z-average diameter (0.1 = 10 %)");
            validate_scattering(spec.scattering, spec.fractal_dimension);
            return;
    }
    throw std::invalid_argument("validate_criterion: not a Criterion enumerator");
}

}  // namespace brownfloc::shelf
