// Multiplier and shunt values that null a span error, and resistor deviations.
#include "core/advice/resistor_correction.h"

#include "support/approx.h"

#include <catch2/catch.hpp>

#include <stdexcept>

using namespace mw;

TEST_CASE("corrected multiplier") {
    // Helfrick & Cooper Example 4-3 design formula R_s = V/I_fs − R_m: 1 mA, 100 Ω movement,
    // 10 V range -> R_s = 9.9 kΩ. A meter reading 2 % low (span 0.98) needs R_total × 0.98.
    CHECK(correctedMultiplierOhms(9900.0, 100.0, 0.98) == mwtest::relative(9700.0, 1e-12));
    CHECK(correctedMultiplierOhms(9900.0, 100.0, 1.0) == mwtest::relative(9900.0, 1e-12));
    CHECK_THROWS_AS(correctedMultiplierOhms(9900.0, 100.0, 0.005), std::invalid_argument);
}

TEST_CASE("corrected shunt") {
    // Helfrick & Cooper Example 4-1: 1 mA, 100 Ω, 100 mA -> R_sh = 1.0101 Ω.
    const double shunt = 100.0 / 99.0;
    CHECK(correctedShuntOhms(shunt, 100.0, 1.0) == mwtest::relative(shunt, 1e-12));
    // Reading 1 % high: the movement must get 1/1.01 of its share. q = 0.01 -> q' = 0.01/1.01,
    // R'_sh = 100 q'/(1 − q') = 100 / 100 = 1.0 Ω exactly.
    CHECK(correctedShuntOhms(shunt, 100.0, 1.01) == mwtest::relative(1.0, 1e-12));
}

TEST_CASE("deviation of a measured resistor from its computed value") {
    const ResistorDeviation inside = compareResistor(9900.0, 9950.0, 1.0);
    CHECK(inside.deviationPercent == mwtest::relative(50.0 / 99.0, 1e-12));
    CHECK(inside.withinTolerance);
    const ResistorDeviation outside = compareResistor(9900.0, 9750.0, 1.0);
    CHECK(outside.deviationPercent == mwtest::relative(-150.0 / 99.0, 1e-12));
    CHECK_FALSE(outside.withinTolerance);
    CHECK(compareResistor(100.0, 101.0, 1.0).withinTolerance); // on the tolerance
    CHECK_THROWS_AS(compareResistor(0.0, 1.0, 1.0), std::invalid_argument);
}

TEST_CASE("refusals show the value in its unit, small values included") {
    // Values of our own choosing; the point is that 4.7 mΩ does not print as 0.004700.
    CHECK_THROWS_WITH(correctedShuntOhms(-4.7e-3, 100.0, 1.0),
                      Catch::Contains("shunt resistance") && Catch::Contains("-4.700 mΩ"));
    CHECK_THROWS_WITH(correctedMultiplierOhms(9900.0, 100.0, 1e-9),
                      Catch::Contains("span factor of 1e-09"));
    CHECK_THROWS_WITH(correctedMultiplierOhms(9900.0, 100.0, -0.5),
                      Catch::Contains("span factor") && Catch::Contains("-0.5"));
}
