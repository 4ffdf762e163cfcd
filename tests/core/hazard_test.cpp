// Hazardous-live limits of IEC 61010-1: which test values get the caution text.
#include "core/circuits/hazard.h"

#include <catch2/catch.hpp>

#include <cmath>
#include <limits>
#include <stdexcept>

using namespace mw;

TEST_CASE("DC above 60 V is hazardous live") {
    // IEC 61010-1:2010 6.3.1 a): 30 V rms, 42.4 V peak or 60 V d.c.
    CHECK_FALSE(hazardCaution(60.0, VoltageKind::Dc).has_value());
    CHECK_FALSE(hazardCaution(-59.9, VoltageKind::Dc).has_value());
    REQUIRE(hazardCaution(60.5, VoltageKind::Dc).has_value());
    CHECK(hazardCaution(-100.0, VoltageKind::Dc).has_value());
    CHECK_THAT(*hazardCaution(250.0, VoltageKind::Dc), Catch::Contains("250 V DC"));
}

TEST_CASE("AC above 30 V rms or 42.4 V peak is hazardous live") {
    // IEC 61010-1:2010 6.3.1 a). 42.4 V is 30 V × √2 rounded, so a 30 V rms sine is at the
    // limit, not above it.
    CHECK_FALSE(hazardCaution(30.0, VoltageKind::AcRms).has_value());
    CHECK(hazardCaution(30.5, VoltageKind::AcRms).has_value());
    CHECK_FALSE(hazardCaution(42.4, VoltageKind::Peak).has_value());
    CHECK(hazardCaution(42.5, VoltageKind::Peak).has_value());
    // Crest factor of a square wave is 1, of a triangle √3 (exact forms, computed).
    CHECK_FALSE(hazardCaution(29.0, VoltageKind::AcRms, 1.0).has_value());
    CHECK(hazardCaution(25.0, VoltageKind::AcRms, std::sqrt(3.0)).has_value()); // 43.3 V peak
    CHECK_FALSE(hazardCaution(24.0, VoltageKind::AcRms, std::sqrt(3.0)).has_value());
}

TEST_CASE("the caution text names the value, the limits and the standard") {
    const auto text = hazardCaution(230.0, VoltageKind::AcRms);
    REQUIRE(text.has_value());
    CHECK_THAT(*text, Catch::Contains("230 V rms"));
    CHECK_THAT(*text, Catch::Contains("325 V peak"));
    CHECK_THAT(*text, Catch::Contains("IEC 61010-1"));
    CHECK_THAT(*text, Catch::Contains("30 V rms, 42.4 V peak, 60 V DC"));
}

TEST_CASE("values that are not numbers are refused") {
    CHECK_THROWS_AS(hazardCaution(std::numeric_limits<double>::quiet_NaN(), VoltageKind::Dc),
                    std::invalid_argument);
    CHECK_THROWS_AS(hazardCaution(10.0, VoltageKind::AcRms, 0.5), std::invalid_argument);
}
