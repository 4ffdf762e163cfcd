// IEC 60051 class index series, fiducial values by scale type and permissible errors.
#include "core/accuracy/accuracy_class.h"

#include "support/approx.h"

#include <catch2/catch.hpp>

#include <stdexcept>
#include <vector>

using namespace mw;

TEST_CASE("class index series of IEC 60051-2") {
    // IEC 60051-2 class indices for ammeters and voltmeters (from memory).
    const std::vector<double> expected{0.05, 0.1, 0.2, 0.3, 0.5, 1, 1.5, 2, 2.5, 3, 5};
    const auto series = classIndexSeries();
    CHECK(std::vector<double>(series.begin(), series.end()) == expected);
    CHECK(isStandardClassIndex(1.5));
    CHECK(isStandardClassIndex(0.05));
    CHECK_FALSE(isStandardClassIndex(0.25)); // ANSI C39.1 class (from memory), not IEC
    CHECK_FALSE(isStandardClassIndex(4.0));
}

TEST_CASE("fiducial value follows the scale type") {
    // IEC 60051-1 5.2.3 rule (from memory).
    CHECK(fiducialValue({0.0, 250.0, ScaleType::ZeroAtEnd, {}}) == 250.0);
    CHECK(fiducialValue({-10.0, 0.0, ScaleType::ZeroAtEnd, {}}) == 10.0);
    CHECK(fiducialValue({-50e-6, 50e-6, ScaleType::ZeroInside, {}}) ==
          mwtest::relative(100e-6, 1e-12));
    CHECK(fiducialValue({-20.0, 80.0, ScaleType::ZeroInside, {}}) == 100.0);
    CHECK(fiducialValue({180.0, 260.0, ScaleType::NoZero, {}}) == 260.0);
    CHECK(fiducialValue({180.0, 260.0, ScaleType::NoZero, 80.0}) == 80.0); // set explicitly
    CHECK(fiducialValue({0.0, 1000.0, ScaleType::NonLinear, 90.0}) == 90.0);
}

TEST_CASE("permissible error is the class index in percent of the fiducial value") {
    // IEC 60051-1 rule (from memory), computed: class 1.5, 0-250 V -> ±3.75 V; centre zero ±50 µA
    // -> ±1.5 µA.
    CHECK(permissibleError(1.5, fiducialValue({0.0, 250.0, ScaleType::ZeroAtEnd, {}})) ==
          mwtest::relative(3.75, 1e-12));
    CHECK(permissibleError(1.5, fiducialValue({-50e-6, 50e-6, ScaleType::ZeroInside, {}})) ==
          mwtest::relative(1.5e-6, 1e-12));
    // Computed: the same 3.75 V is 7.5 % of a 50 V reading.
    CHECK(permissibleError(1.5, 250.0) / 50.0 * 100.0 == mwtest::relative(7.5, 1e-12));
}

TEST_CASE("the limit is exact in decimals at every prefix") {
    // IEC 60051-1: class index % of the fiducial value. 1.5 % of 10 V is 0.15 V exactly, and
    // the double returned is the one nearest 0.15 (1.5 / 100 * 10 in binary is not).
    CHECK(permissibleError(1.5, 10.0) == 0.15);
    CHECK(exactPermissibleError(1.5, {0.0, 10.0, ScaleType::ZeroAtEnd, {}}) ==
          ExactDecimal::parse("0.15"));
    CHECK(exactPermissibleError(0.3, {-50e-6, 50e-6, ScaleType::ZeroInside, {}}) ==
          ExactDecimal::parse("3e-7"));
    CHECK(exactPermissibleError(2.5, {0.0, 30e3, ScaleType::ZeroAtEnd, {}}) ==
          ExactDecimal::parse("750"));
    CHECK(exactFiducialValue({-0.1, 0.2, ScaleType::ZeroInside, {}}) == ExactDecimal::parse("0.3"));
}

TEST_CASE("bad scales are refused with the reason") {
    CHECK_THROWS_WITH(fiducialValue({0.0, 1000.0, ScaleType::NonLinear, {}}),
                      Catch::Contains("scale length"));
    CHECK_THROWS_WITH(fiducialValue({0.0, 10.0, ScaleType::ZeroInside, {}}),
                      Catch::Contains("zero-inside"));
    CHECK_THROWS_AS(fiducialValue({10.0, 0.0, ScaleType::ZeroAtEnd, {}}), std::invalid_argument);
    CHECK_THROWS_WITH(permissibleError(0.0, 10.0), Catch::Contains("class index"));
}
