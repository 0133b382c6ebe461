// Criterion names, defaults and validation (shelf_criteria/criterion.hpp,
// shelf_criteria/scattering_setup.hpp): every refusal names the criterion or key, the
// value and what is allowed.
#include <catch2/catch.hpp>
#include <cmath>
#include <limits>
#include <string>

#include "error_message.hpp"
#include "shelf_criteria/criterion.hpp"

using namespace brownfloc::shelf;
using test::spec_of;
using Catch::Matchers::Contains;
using test::message_of;

namespace {


}  // namespace

TEST_CASE("criterion names read back to the same criterion", "[shelf][names]") {
    for (const Criterion criterion : {Criterion::count_drop, Criterion::mean_size,
                                      Criterion::aggregated_fraction, Criterion::z_average_growth})
        CHECK(criterion_from_name(criterion_name(criterion)) == criterion);
    CHECK(criterion_name(Criterion::count_drop) == "count-drop");
    CHECK(criterion_name(Criterion::mean_size) == "mean-size");
    CHECK(criterion_name(Criterion::aggregated_fraction) == "aggregated-fraction");
    CHECK(criterion_name(Criterion::z_average_growth) == "z-average-growth");
    CHECK(optics_from_name("rayleigh") == Optics::rayleigh);
    CHECK(optics_from_name("rgd") == Optics::rgd);
    CHECK(optics_name(Optics::rgd) == "rgd");
}

TEST_CASE("an unknown criterion or optics name is refused with the allowed names", "[shelf][names][errors]") {
    const std::string message = message_of([] { (void)criterion_from_name("Count-Drop"); });
    CHECK_THAT(message, Contains("\"Count-Drop\"") && Contains("count-drop") && Contains("mean-size") &&
                            Contains("aggregated-fraction") && Contains("z-average-growth"));
    CHECK_THAT(message_of([] { (void)criterion_from_name(""); }), Contains("unknown criterion \"\""));
    CHECK_THAT(message_of([] { (void)optics_from_name("mie"); }),
               Contains("unknown optics \"mie\"") && Contains("rayleigh, rgd"));
}

TEST_CASE("the default spec is a 10 percent count drop with rayleigh optics and d_f 2.1", "[shelf][defaults]") {
    // Issue 6: criterion "count-drop", criterion_value 0.1; d_f 2.1 for reaction-limited
    // aggregation (PHYSICS.md "Clusters", common practice).
    const CriterionSpec spec;
    CHECK(spec.criterion == Criterion::count_drop);
    CHECK(spec.value == 0.1);
    CHECK(spec.scattering.optics == Optics::rayleigh);
    CHECK(spec.fractal_dimension == 2.1);
    CHECK(default_criterion_value(Criterion::count_drop) == 0.1);
    for (const Criterion criterion : {Criterion::count_drop, Criterion::mean_size,
                                      Criterion::aggregated_fraction, Criterion::z_average_growth})
        CHECK_NOTHROW(validate_criterion(spec_of(criterion, default_criterion_value(criterion))));
}

TEST_CASE("criterion values outside their range are refused naming criterion value and range", "[shelf][validation][errors]") {
    const double nan = std::numeric_limits<double>::quiet_NaN();
    const double inf = std::numeric_limits<double>::infinity();
    for (const double bad : {0.0, 1.0, -0.1, 1.5, nan, inf}) {
        CHECK_THAT(message_of([&] { validate_criterion(spec_of(Criterion::count_drop, bad)); }),
                   Contains("criterion count-drop") && Contains("criterion_value") && Contains("in (0, 1)"));
        CHECK_THAT(message_of([&] { validate_criterion(spec_of(Criterion::aggregated_fraction, bad)); }),
                   Contains("criterion aggregated-fraction") && Contains("in (0, 1)"));
    }
    for (const double bad : {1.0, 0.5, -2.0, nan, inf})
        CHECK_THAT(message_of([&] { validate_criterion(spec_of(Criterion::mean_size, bad)); }),
                   Contains("criterion mean-size") && Contains("> 1"));
    for (const double bad : {0.0, -0.1, nan, inf})
        CHECK_THAT(message_of([&] { validate_criterion(spec_of(Criterion::z_average_growth, bad)); }),
                   Contains("criterion z-average-growth") && Contains("> 0"));
    // The value is printed so that it reads back exactly.
    CHECK_THAT(message_of([] { validate_criterion(spec_of(Criterion::count_drop, 1.25)); }),
               Contains("criterion_value = 1.25"));
    CHECK_THAT(message_of([&] { validate_criterion(spec_of(Criterion::mean_size, nan)); }),
               Contains("criterion_value = nan"));
}

TEST_CASE("z-average optics and fractal dimension out of range are refused by key", "[shelf][validation][errors]") {
    CriterionSpec spec = spec_of(Criterion::z_average_growth, 0.1);
    spec.fractal_dimension = 3.5;
    CHECK_THAT(message_of([&] { validate_criterion(spec); }),
               Contains("fractal_dimension = 3.5") && Contains("[1, 3]"));
    spec.fractal_dimension = 2.1;
    spec.scattering.optics = Optics::rgd;
    spec.scattering.scattering_angle_deg = 0.0;
    CHECK_THAT(message_of([&] { validate_criterion(spec); }),
               Contains("scattering_angle_deg = 0") && Contains("(0, 180]"));
    spec.scattering.scattering_angle_deg = 181.0;
    CHECK_THAT(message_of([&] { validate_criterion(spec); }), Contains("scattering_angle_deg = 181"));
    spec.scattering.scattering_angle_deg = 90.0;
    spec.scattering.wavelength_nm = -633.0;
    CHECK_THAT(message_of([&] { validate_criterion(spec); }), Contains("wavelength_nm = -633"));
    spec.scattering.wavelength_nm = 633.0;
    spec.scattering.medium_refractive_index = 0.9;
    CHECK_THAT(message_of([&] { validate_criterion(spec); }),
               Contains("medium_refractive_index = 0.9") && Contains(">= 1"));
    // rayleigh optics do not read the instrument keys.
    spec.scattering.optics = Optics::rayleigh;
    CHECK_NOTHROW(validate_criterion(spec));
}
