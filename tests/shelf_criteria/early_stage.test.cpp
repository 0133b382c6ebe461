// Early-stage warnings (shelf_criteria/early_stage.hpp): the constant kernel holds only
// while clusters are few and small.
#include <catch2/catch.hpp>
#include <cmath>
#include <limits>

#include "error_message.hpp"
#include "shelf_criteria/early_stage.hpp"

using namespace brownfloc::shelf;
using test::spec_of;
using Catch::Matchers::Contains;

namespace {


}  // namespace

TEST_CASE("criteria up to their early-stage limit get no warning and past it get one", "[shelf][warnings]") {
    // Issue 6: count drop > 0.5, mean size > 2, z-average growth > 100 %; aggregated
    // fraction > 0.75 is the value at t = τ (Smoluchowski 1917: 1 - 1/(1+1)²), our choice.
    struct Case {
        Criterion criterion;
        double limit;
        const char* phrase;
    };
    for (const Case& c : {Case{Criterion::count_drop, 0.5, "count drop > 0.5"},
                          Case{Criterion::mean_size, 2.0, "mean size > 2"},
                          Case{Criterion::aggregated_fraction, 0.75, "aggregated fraction > 0.75"},
                          Case{Criterion::z_average_growth, 1.0, "z-average growth > 100 %"}}) {
        CHECK(early_stage_limit(c.criterion) == c.limit);
        CHECK_FALSE(early_stage_warning(spec_of(c.criterion, c.limit)).has_value());
        CHECK_FALSE(early_stage_warning(spec_of(c.criterion, std::nextafter(c.limit, 0.0))).has_value());
        const auto warning = early_stage_warning(spec_of(c.criterion, std::nextafter(c.limit, 10.0)));
        REQUIRE(warning.has_value());
        CHECK_THAT(*warning, Contains("past the early stage where the constant kernel holds") &&
                                 Contains(std::string(criterion_name(c.criterion))) && Contains(c.phrase));
    }
}

TEST_CASE("the default criterion gets no warning", "[shelf][warnings]") {
    CHECK_FALSE(early_stage_warning(CriterionSpec{}).has_value());
}

TEST_CASE("a warning is not given for a bad value which is refused instead", "[shelf][warnings][errors]") {
    CHECK_THROWS_AS(early_stage_warning(spec_of(Criterion::count_drop, 1.5)), std::invalid_argument);
    CHECK_THROWS_AS(early_stage_warning(spec_of(Criterion::mean_size, std::numeric_limits<double>::quiet_NaN())),
                    std::invalid_argument);
}
