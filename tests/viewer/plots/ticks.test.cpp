#include "plots/ticks.hpp"

#include <catch2/catch.hpp>

#include <algorithm>
#include <cfloat>
#include <cmath>
#include <limits>
#include <random>
#include <vector>

using namespace brownfloc::viewer;

namespace {

std::vector<double> values_of(const std::vector<Tick>& ticks) {
    std::vector<double> values;
    for (const Tick& tick : ticks) values.push_back(tick.value);
    return values;
}

std::vector<std::string> labels_of(const std::vector<Tick>& ticks) {
    std::vector<std::string> labels;
    for (const Tick& tick : ticks) labels.push_back(tick.label);
    return labels;
}

// True when step is 1, 2 or 5 times a power of ten (to rounding).
bool is_one_two_five(double step) {
    const double exponent = std::floor(std::log10(step));
    const double mantissa = step / std::pow(10.0, exponent);
    for (const double nice : {1.0, 2.0, 5.0, 10.0})
        if (std::abs(mantissa - nice) < 1e-6 * nice) return true;  // rounding of k * step
    return false;
}

const std::vector<double>& awkward_values() {
    static const std::vector<double> values{std::numeric_limits<double>::quiet_NaN(),
                                            std::numeric_limits<double>::infinity(),
                                            -std::numeric_limits<double>::infinity(),
                                            0.0, -0.0, 5e-324, -5e-324, 1e-310, DBL_MIN, 1e-300, 1e-12, 0.5,
                                            1.0, 1.0 + 1e-15, -1.0, 3.0, 1e5, 1e300, -1e300, DBL_MAX, -DBL_MAX};
    return values;
}

}  // namespace

TEST_CASE("linear ticks over 0 to 4 fall on whole numbers", "[viewer][plots][ticks]") {
    const auto ticks = linear_ticks(0.0, 4.0);
    CHECK(values_of(ticks) == std::vector<double>{0, 1, 2, 3, 4});
    CHECK(labels_of(ticks) == std::vector<std::string>{"0", "1", "2", "3", "4"});
}

TEST_CASE("linear ticks over 0 to 1 step by 0.2 with clean labels", "[viewer][plots][ticks]") {
    const auto ticks = linear_ticks(0.0, 1.0);
    CHECK(labels_of(ticks) == std::vector<std::string>{"0", "0.2", "0.4", "0.6", "0.8", "1"});
}

TEST_CASE("linear ticks across zero label it 0 and never -0", "[viewer][plots][ticks]") {
    const auto ticks = linear_ticks(-1.0, 1.0);
    CHECK(labels_of(ticks) == std::vector<std::string>{"-1", "-0.5", "0", "0.5", "1"});
    for (const Tick& tick : ticks) CHECK_FALSE((std::signbit(tick.value) && tick.value == 0.0));
}

TEST_CASE("linear ticks with the bounds swapped equal those of the ordered bounds", "[viewer][plots][ticks]") {
    CHECK(values_of(linear_ticks(7.5, -2.0)) == values_of(linear_ticks(-2.0, 7.5)));
}

TEST_CASE("linear ticks of an empty range are one tick at the bound", "[viewer][plots][ticks]") {
    const auto ticks = linear_ticks(3.0, 3.0);
    REQUIRE(ticks.size() == 1);
    CHECK(ticks[0].value == 3.0);
    CHECK(ticks[0].label == "3");
}

TEST_CASE("linear ticks of random ranges are 1-2-5 steps inside the range and within max_ticks",
          "[viewer][plots][ticks]") {
    std::mt19937_64 generator(20240611);  // fixed seed
    std::uniform_real_distribution<double> exponent(-8.0, 8.0), unit(-1.0, 1.0);
    std::uniform_int_distribution<int> max_ticks_pick(2, 12);
    for (int trial = 0; trial < 2000; ++trial) {
        const double scale = std::pow(10.0, exponent(generator));
        const double lo = unit(generator) * scale, hi = lo + std::abs(unit(generator)) * scale + 1e-3 * scale;
        const int max_ticks = max_ticks_pick(generator);
        const auto ticks = linear_ticks(lo, hi, max_ticks);
        INFO("lo " << lo << " hi " << hi << " max_ticks " << max_ticks);
        REQUIRE(ticks.size() <= static_cast<std::size_t>(max_ticks));
        if (max_ticks >= 6) CHECK(ticks.size() >= 2);  // the next smaller 1-2-5 step gave > 6
        for (const Tick& tick : ticks) {
            CHECK(tick.value >= lo);
            CHECK(tick.value <= hi);
        }
        if (ticks.size() >= 2) CHECK(is_one_two_five(ticks[1].value - ticks[0].value));
    }
}

TEST_CASE("log ticks fall on the decades inside the range", "[viewer][plots][ticks]") {
    const auto ticks = log10_ticks(0.8, 1250.0);
    CHECK(values_of(ticks) == std::vector<double>{1, 10, 100, 1000});
    CHECK(labels_of(ticks) == std::vector<std::string>{"1", "10", "100", "1000"});
}

TEST_CASE("log ticks over many decades keep every k-th decade", "[viewer][plots][ticks]") {
    // 21 decades, at most 6 ticks: every 4th decade, at exponents divisible by 4.
    const auto ticks = log10_ticks(1e-10, 1e10, 6);
    CHECK(labels_of(ticks) == std::vector<std::string>{"1e-08", "1e-04", "1", "10000", "1e+08"});
}

TEST_CASE("log ticks inside one decade use the 1-2-5 multiples", "[viewer][plots][ticks]") {
    CHECK(values_of(log10_ticks(2.0, 8.0)) == std::vector<double>{2, 5});
    CHECK(values_of(log10_ticks(15.0, 120.0)) == std::vector<double>{20, 50, 100});
}

TEST_CASE("log ticks of a range without positive values are empty", "[viewer][plots][ticks]") {
    CHECK(log10_ticks(-5.0, -1.0).empty());
    CHECK(log10_ticks(-5.0, 0.0).empty());
    CHECK_FALSE(log10_ticks(0.0, 100.0).empty());  // lo raised to the smallest normal double
}

TEST_CASE("tick functions terminate with a few finite ticks for every pathological input",
          "[viewer][plots][ticks][validation]") {
    for (const double lo : awkward_values()) {
        for (const double hi : awkward_values()) {
            for (const int max_ticks : {-3, 0, 1, 2, 6, 1000}) {
                INFO("lo " << lo << " hi " << hi << " max_ticks " << max_ticks);
                const std::size_t bound = static_cast<std::size_t>(std::clamp(max_ticks, 1, max_ticks_limit)) + 2;
                for (const auto& ticks : {linear_ticks(lo, hi, max_ticks), log10_ticks(lo, hi, max_ticks)}) {
                    REQUIRE(ticks.size() <= bound);
                    if (max_ticks >= 0) REQUIRE(ticks.size() <= static_cast<std::size_t>(max_ticks) + 2);
                    for (const Tick& tick : ticks) {
                        CHECK(std::isfinite(tick.value));
                        CHECK_FALSE(tick.label.empty());
                        CHECK(tick.label != "-0");
                    }
                }
            }
        }
    }
}

TEST_CASE("tick labels are compact", "[viewer][plots][ticks]") {
    CHECK(tick_label(0.0) == "0");
    CHECK(tick_label(-0.0) == "0");
    CHECK(tick_label(0.5) == "0.5");
    CHECK(tick_label(2.5) == "2.5");
    CHECK(tick_label(-3.0) == "-3");
    CHECK(tick_label(1000.0) == "1000");
    CHECK(tick_label(12345.5) == "12345.5");
    CHECK(tick_label(0.01) == "0.01");
    CHECK(tick_label(1e-3) == "1e-03");
    CHECK(tick_label(1e6) == "1e+06");
    CHECK(tick_label(2.5e6) == "2.5e+06");
    CHECK(tick_label(1e5) == "1e+05");
    CHECK(tick_label(-4e-7) == "-4e-07");
    CHECK(tick_label(0.1 * 3.0) == "0.3");  // 0.30000000000000004 in binary
    CHECK(tick_label(std::numeric_limits<double>::quiet_NaN()) == "nan");
    CHECK(tick_label(std::numeric_limits<double>::infinity()) == "inf");
    CHECK(tick_label(-std::numeric_limits<double>::infinity()) == "-inf");
    CHECK(tick_label(-5e-324).rfind("-4.94", 0) == 0);  // the smallest subnormal, not "-0"
}
