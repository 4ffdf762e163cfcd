// The quantity parser against a table of good and bad inputs, and the formatter's round trip.
#include "core/units/quantity.h"

#include "support/approx.h"

#include <catch2/catch.hpp>

#include <cmath>
#include <limits>
#include <string>

using namespace mw;
using mwtest::relative;

namespace {

struct Good {
    const char* text;
    double value;
    Unit unit;
};

struct Bad {
    const char* text;
    std::size_t position; // 0-based character where the error is reported
    const char* words;    // part of the message that says why
};

} // namespace

TEST_CASE("values a technician types parse to the right number and unit") {
    // SI prefixes and symbols: SI Brochure, 9th edition (2019), Tables 7 and 4.
    // Letter-as-decimal-point resistor code: IEC 60062 (4K7 = 4.7 kΩ, R47 = 0.47 Ω, 4R7 = 4.7 Ω).
    // "Vrms", "20 kΩ/V", "23C", "100R": common practice on meter dials and in lab notebooks.
    const Good table[] = {
        {"4.7k", 4700.0, Unit::Dimensionless},
        {"4k7", 4700.0, Unit::Dimensionless},
        {"4K7", 4700.0, Unit::Dimensionless},
        {"4R7", 4.7, Unit::Ohm},
        {"R47", 0.47, Unit::Ohm},
        {"2M2", 2.2e6, Unit::Dimensionless},
        {"1G5", 1.5e9, Unit::Dimensionless},
        {"4k7Ω", 4700.0, Unit::Ohm},
        {"50u", 50e-6, Unit::Dimensionless},
        {"50µA", 50e-6, Unit::Ampere},
        {"50μA", 50e-6, Unit::Ampere}, // Greek mu instead of the micro sign
        {"50uA", 50e-6, Unit::Ampere},
        {"1 mA", 1e-3, Unit::Ampere},
        {"10 Vrms", 10.0, Unit::Volt},
        {"10Vdc", 10.0, Unit::Volt},
        {"2.2 MΩ", 2.2e6, Unit::Ohm},
        {"2.2 MΩ", 2.2e6, Unit::Ohm}, // U+2126 ohm sign
        {"2.2Mohm", 2.2e6, Unit::Ohm},
        {"100R", 100.0, Unit::Ohm},
        {"1e3", 1000.0, Unit::Dimensionless},
        {"1e0000001", 10.0, Unit::Dimensionless}, // the exponent's value counts, not its digits
        {"5e-000000003 V", 5e-3, Unit::Volt},
        {"2.5E-3 A", 2.5e-3, Unit::Ampere},
        {"-0.25", -0.25, Unit::Dimensionless},
        {"+5", 5.0, Unit::Dimensionless},
        {".5", 0.5, Unit::Dimensionless},
        {"12.5 %", 12.5, Unit::Percent},
        {"  3 V  ", 3.0, Unit::Volt},
        {"23C", 23.0, Unit::DegreeCelsius},
        {"23 °C", 23.0, Unit::DegreeCelsius},
        {"296.15K", 296.15, Unit::Kelvin},
        {"50Hz", 50.0, Unit::Hertz},
        {"1 kHz", 1000.0, Unit::Hertz},
        {"20k/V", 20000.0, Unit::OhmPerVolt},
        {"20 kΩ/V", 20000.0, Unit::OhmPerVolt},
        {"0.25 W", 0.25, Unit::Watt},
        {"20 ms", 0.02, Unit::Second},
        {"15 ppm/K", 15e-6, Unit::PerKelvin},
        {"0.00393/K", 0.00393, Unit::PerKelvin},
        {"5 pA", 5e-12, Unit::Ampere},
        {"3 nA", 3e-9, Unit::Ampere},
    };
    for (const Good& row : table) {
        INFO("input: " << row.text);
        const Quantity q = parseQuantity(row.text);
        CHECK(q.value == relative(row.value, 1e-15));
        CHECK(q.unit == row.unit);
    }
}

TEST_CASE("prefixes are folded into one decimal conversion, so values are the nearest doubles") {
    // The double nearest 0.0047 is what a C++ literal gives (ISO C++ [lex.fcon]).
    CHECK(parseQuantity("4.7m").value == 0.0047);
    CHECK(parseQuantity("4m7").value == 0.0047);
    CHECK(parseQuantity("0.1 µA").value == 1e-7);
    CHECK(parseQuantity("33 nA").value == 33e-9);
}

TEST_CASE("decimal comma is an option, and the wrong separator is named") {
    const ParseOptions comma{true};
    CHECK(parseQuantity("4,7k", comma).value == 4700.0);
    CHECK(parseQuantity("-0,25 V", comma).value == -0.25);
    CHECK(parseQuantity("4k7", comma).value == 4700.0);
    CHECK_THROWS_WITH(parseQuantity("4.7k", comma), Catch::Contains("comma"));
    CHECK_THROWS_WITH(parseQuantity("4,7k"), Catch::Contains("decimal comma is off"));
}

TEST_CASE("bad input is an error that says what, at which character, and why") {
    const Bad table[] = {
        {"1..2", 2, "only one decimal separator"},
        {"1.2.3", 3, "only one decimal separator"},
        {"5 mV A", 5, "nothing may follow the unit"},
        {"k", 0, "a number must come before it"},
        {"mA", 0, "a number must come before it"},
        {"1e999", 0, "out of the range"},
        {"-1e999 V", 0, "out of the range"},
        {"1e308G", 0, "out of the range"},
        {"nan", 0, "not-a-number"},
        {"-inf", 1, "not-a-number"},
        {"", 0, "empty value"},
        {"   ", 0, "empty value"},
        {"-", 1, "expected a number after the sign"},
        {"1e", 1, "exponent needs digits"},
        {"1e-00000000400", 0, "out of the range"},
        {"5 Vx", 2, "unknown unit"},
        {"5 kX", 3, "unknown unit"},
        {"5 x", 2, "unknown unit"},
        {"5 k°C", 2, "no SI prefix"},
        {"5 m%", 2, "no SI prefix"},
        {"4k7k", 3, "already carries its prefix"},
        {"4k7.5", 3, "no other decimal point"},
        {"4R7 V", 4, "resistance"},
        {"1 000", 2, "unknown unit"},
        {"abc", 0, "expected a number"},
    };
    for (const Bad& row : table) {
        INFO("input: \"" << row.text << "\"");
        try {
            (void)parseQuantity(row.text);
            FAIL("no error for \"" << row.text << "\"");
        } catch (const QuantityError& error) {
            CHECK(error.position() == row.position);
            CHECK_THAT(error.what(), Catch::Contains(row.words));
            if (row.text[0] != '\0' &&
                std::string(row.text).find_first_not_of(' ') != std::string::npos) {
                // The message names the character people count from 1, and quotes the input.
                CHECK_THAT(error.what(),
                           Catch::Contains("character " + std::to_string(row.position + 1)));
                CHECK_THAT(error.what(), Catch::Contains(std::string("\"") + row.text + "\""));
            }
        }
    }
}

TEST_CASE("positions count characters, not UTF-8 bytes") {
    try {
        (void)parseQuantity("5 µV A");
        FAIL("no error");
    } catch (const QuantityError& error) {
        CHECK(error.position() == 5);
    }
    CHECK_THROWS_AS(parseQuantity("5 \xff"), QuantityError);
}

TEST_CASE("parseValue takes a bare number in the expected unit and refuses another unit") {
    CHECK(parseValue("10", Unit::Volt) == 10.0);
    CHECK(parseValue("4k7", Unit::Ohm) == 4700.0);
    CHECK(parseValue("10 Vrms", Unit::Volt) == 10.0);
    CHECK(parseValue("4R7", Unit::Ohm) == relative(4.7, 1e-15));
    try {
        (void)parseValue("5 A", Unit::Volt);
        FAIL("an ampere was accepted as a volt");
    } catch (const QuantityError& error) {
        CHECK(error.position() == 2);
        CHECK_THAT(error.what(), Catch::Contains("a voltage (V) is expected here, not a current"));
    }
    CHECK_THROWS_AS(parseValue("4R7", Unit::Volt), QuantityError);
    CHECK_THROWS_AS(parseValue("12.5 %", Unit::Ohm), QuantityError);
    CHECK_THROWS_WITH(parseValue("4.7K", Unit::Ohm), Catch::Contains("temperature"));
}

TEST_CASE("a bare number takes the prefix of its context, a typed unit is converted") {
    // On a 50 µA range the scale shows "50" for 50 µA: a bare -50 is -50 µA, and it is the
    // same double as "-50 µA" (one decimal conversion), not -50 × 1e-6 in binary arithmetic.
    ParseOptions micro;
    micro.bareNumberPowerOfTen = -6;
    CHECK(parseValue("-50", Unit::Ampere, micro) == parseValue("-50 µA", Unit::Ampere));
    CHECK(parseValue("49.925", Unit::Ampere, micro) == 49.925e-6);
    CHECK(parseValue("0.05 mA", Unit::Ampere, micro) == 50e-6); // a unit typed: converted
    CHECK(parseValue("2 A", Unit::Ampere, micro) == 2.0);
    CHECK(parseValue("7m", Unit::Ampere, micro) == 7e-3); // a prefix typed: its own
    ParseOptions kilo;
    kilo.bareNumberPowerOfTen = 3;
    CHECK(parseValue("1.5", Unit::Volt, kilo) == 1500.0);
    // The prefix as typed is reported, for the unit of a range.
    CHECK(parseQuantity("50uA").prefixPower == -6);
    CHECK(parseQuantity("-50").prefixPower == 0);
    CHECK(parseQuantity("10 kV").prefixPower == 3);
    CHECK(parseQuantity("4k7").prefixPower == 3);
    CHECK(parseQuantity("10V").prefixPower == 0);
}

TEST_CASE("kelvin and degrees Celsius are the one converted pair") {
    // 0 °C = 273.15 K exactly: SI Brochure, 9th edition, 2.3.1 (unit of temperature).
    CHECK(parseValue("296.15K", Unit::DegreeCelsius) == relative(23.0, 1e-12));
    CHECK(parseValue("23 °C", Unit::Kelvin) == relative(296.15, 1e-15));
    CHECK(parseValue("23", Unit::DegreeCelsius) == 23.0);
}

TEST_CASE("engineering notation picks the SI prefix and the significant digits") {
    // Engineering notation (exponents in multiples of three with SI prefixes): common practice.
    CHECK(formatEngineering(4700.0, 3, Unit::Ohm) == "4.70 kΩ");
    CHECK(formatEngineering(-0.25, 3, Unit::Volt) == "-250 mV");
    CHECK(formatEngineering(50e-6, 2, Unit::Ampere) == "50 µA");
    CHECK(formatEngineering(1.01010101, 4, Unit::Ohm) == "1.010 Ω");
    CHECK(formatEngineering(99900.0, 3, Unit::Ohm) == "99.9 kΩ");
    CHECK(formatEngineering(999.96, 3, Unit::Volt) == "1.00 kV"); // rounding carries a prefix
    CHECK(formatEngineering(2.2e6, 2, Unit::Ohm) == "2.2 MΩ");
    CHECK(formatEngineering(1.5e9, 2) == "1.5 G");
    CHECK(formatEngineering(4.7e-12, 2) == "4.7 p");
    CHECK(formatEngineering(123456.0, 1) == "100 k");
    CHECK(formatEngineering(0.0, 3, Unit::Volt) == "0.00 V");
    CHECK(formatEngineering(-0.0, 3) == "0.00");
    CHECK(formatEngineering(12.5, 3, Unit::Percent) == "12.5 %");
    CHECK(formatEngineering(23.0, 3, Unit::DegreeCelsius) == "23.0 °C");
    CHECK(formatEngineering(0.00393, 3, Unit::PerKelvin) == "0.00393 /K");
    CHECK(formatEngineering(15e-6, 2, Unit::PerKelvin) == "1.5e-5 /K");
    CHECK(formatEngineering(20000.0, 2, Unit::OhmPerVolt) == "20 kΩ/V");
    CHECK(formatEngineering(1e-15, 3, Unit::Ampere) == "1.00e-15 A");
    CHECK(formatEngineering(3.3e13, 2, Unit::Ohm) == "33e12 Ω");
    CHECK(formatEngineering(std::nan(""), 3, Unit::Volt) == "NaN V");
    CHECK(formatEngineering(std::numeric_limits<double>::infinity(), 3) == "inf");
    CHECK(formatEngineering(-std::numeric_limits<double>::infinity(), 3, Unit::Ohm) == "-inf Ω");
    CHECK(formatEngineering(4700.0, 0, Unit::Ohm) == "5 kΩ"); // digits clamp to at least 1
}

TEST_CASE("a value written to a decimal place, in a chosen prefix") {
    // JCGM 100:2008 7.2.6: a result is given to the same last digit as its uncertainty.
    CHECK(formatAtExponent(0.1603, -3, Unit::Volt) == "160 mV");
    CHECK(formatAtExponent(1.2345, -3, Unit::Volt) == "1.235 V"); // half away from zero
    CHECK(formatAtExponent(-0.0125, -3, Unit::Volt) == "-13 mV");
    CHECK(formatAtExponent(0.0, -3, Unit::Volt) == "0 mV");
    CHECK(formatAtExponent(0.0, -9, Unit::Ampere, -6) == "0.000 µA"); // a column in µA
    CHECK(formatAtExponent(50e-6, -9, Unit::Ampere, -6) == "50.000 µA");
    CHECK(formatAtExponent(10.0, -3, Unit::Volt, 0) == "10.000 V");
    CHECK(formatAtExponent(2.5, -2, Unit::Percent) == "2.50 %");
}

TEST_CASE("formatted values parse back to the value rounded to the printed digits") {
    const Unit units[] = {Unit::Dimensionless, Unit::Volt,       Unit::Ohm,       Unit::Percent,
                          Unit::DegreeCelsius, Unit::OhmPerVolt, Unit::PerKelvin, Unit::Kelvin};
    const double values[] = {1.0,      -1.0,    0.0047,   4700.0,    1.23456789e-13, 9.99999e8,
                             -2.5e-16, 3.3e13,  123456.7, 0.000999,  999.5,          1e-300,
                             1.7e300,  6.02e23, -273.15,  0.0039309, 1.0 / 3.0,      2.0 / 3.0};
    for (const Unit unit : units) {
        for (const double value : values) {
            for (int digits = 1; digits <= 17; ++digits) {
                const std::string text = formatEngineering(value, digits, unit);
                INFO(value << " with " << digits << " digits -> " << text);
                const Quantity back = parseQuantity(text);
                CHECK(back.unit == unit);
                const double tolerance = 0.5 * std::pow(10.0, 1 - digits) * std::fabs(value);
                CHECK(std::fabs(back.value - value) <= tolerance * (1.0 + 1e-9) + 1e-300);
                // Formatting the parsed value again gives the same text: a fixed point.
                CHECK(formatEngineering(back.value, digits, unit) == text);
            }
        }
    }
    CHECK(parseQuantity(formatEngineering(0.1, 17)).value == 0.1); // 17 digits round-trip exactly
}
