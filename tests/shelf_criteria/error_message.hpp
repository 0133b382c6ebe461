#pragma once
// Test helpers: the what() of the exception a call throws (a failed check when it throws
// nothing), and a criterion with a value.
#include <catch2/catch.hpp>
#include <stdexcept>
#include <string>

#include "shelf_criteria/criterion.hpp"

namespace brownfloc::shelf::test {

template <typename Exception = std::invalid_argument, typename Call>
std::string message_of(Call&& call) {
    try {
        call();
    } catch (const Exception& error) {
        return error.what();
    }
    FAIL("the call threw nothing");
    return {};
}

inline CriterionSpec spec_of(Criterion criterion, double value) {
    CriterionSpec spec;
    spec.criterion = criterion;
    spec.value = value;
    return spec;
}

}  // namespace brownfloc::shelf::test
