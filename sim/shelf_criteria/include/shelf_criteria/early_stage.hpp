#pragma once
// The constant kernel describes only the early stage of slow aggregation, while clusters
// are few and small (later the kernel depends on size and the clusters restructure). A
// criterion set past that stage still gets a time, with a warning for the report.
// Limits, all at about t = τ: count drop 0.5, mean size 2, aggregated fraction 0.75 (the
// value 1 - 1/4 at t = τ; our choice, issue 6 names the other three), z-average growth 1
// (100 %). A value equal to its limit gets no warning.
//
// Pure functions; thread-safe.
#include <optional>
#include <string>

#include "shelf_criteria/criterion.hpp"

namespace brownfloc::shelf {

// The largest value of the criterion that counts as early stage (see above).
[[nodiscard]] double early_stage_limit(Criterion criterion);

// A one-line warning, e.g. "criterion count-drop = 0.6 is past the early stage where the
// constant kernel holds (count drop > 0.5)", or nothing. Validates the spec first.
[[nodiscard]] std::optional<std::string> early_stage_warning(const CriterionSpec& spec);

}  // namespace brownfloc::shelf
