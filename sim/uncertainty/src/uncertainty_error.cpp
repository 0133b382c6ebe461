#include "uncertainty/uncertainty_error.hpp"

namespace brownfloc::uncertainty {

UncertaintyError::UncertaintyError(const std::string& what) : std::runtime_error(what) {}

RankDeficientError::RankDeficientError(const std::string& what, std::size_t column)
    : UncertaintyError(what), column_{column} {}

}  // namespace brownfloc::uncertainty
