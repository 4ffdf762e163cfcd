// Exact decimal arithmetic: the shortest decimal of a double, sums, products, comparisons and
// roundings, checked by hand and against 64-bit integer arithmetic on scaled values.
#include "core/units/decimal.h"

#include <catch2/catch.hpp>

#include <compare>
#include <cstdint>
#include <limits>
#include <random>
#include <stdexcept>
#include <string>

using namespace mw;

namespace {

ExactDecimal d(const char* text) {
    return ExactDecimal::parse(text);
}

} // namespace

TEST_CASE("a double is taken as the shortest decimal that reads back as it") {
    CHECK(ExactDecimal::fromDouble(0.15).toPlain() == "0.15");
    CHECK(ExactDecimal::fromDouble(10.15).toPlain() == "10.15");
    CHECK(ExactDecimal::fromDouble(-5e-5).toPlain() == "-0.00005");
    CHECK(ExactDecimal::fromDouble(49.925e-6).toScientific() == "4.9925e-5");
    CHECK(ExactDecimal::fromDouble(250.0).toPlain() == "250");
    CHECK(ExactDecimal::fromDouble(0.0).isZero());
    CHECK(ExactDecimal::fromDouble(-0.0).toPlain() == "0");
    CHECK_THROWS_AS(ExactDecimal::fromDouble(std::numeric_limits<double>::infinity()),
                    std::invalid_argument);
    // The binary difference is not the decimal one; the exact difference is.
    CHECK((ExactDecimal::fromDouble(10.15) - ExactDecimal::fromDouble(10.0)) == d("0.15"));
    CHECK(ExactDecimal::fromDouble(10.15 - 10.0) != d("0.15"));
}

TEST_CASE("parsing reads digits, a point and an exponent, and refuses the rest") {
    CHECK(d("1.500") == d("1.5"));
    CHECK(d("15e-1") == d("1.5"));
    CHECK(d("+0.000150").toScientific() == "1.5e-4");
    CHECK(d("-12.5E3").toPlain() == "-12500");
    CHECK(d(".5") == d("0.5"));
    CHECK_THROWS_AS(d("1.2.3"), std::invalid_argument);
    CHECK_THROWS_AS(d("e5"), std::invalid_argument);
    CHECK_THROWS_AS(d("12x"), std::invalid_argument);
    CHECK_THROWS_AS(d("1e"), std::invalid_argument);
}

TEST_CASE("sums, differences and products are exact") {
    CHECK(d("0.1") + d("0.2") == d("0.3"));
    CHECK(d("0.3") - d("0.1") - d("0.2") == ExactDecimal());
    CHECK(d("1.5") * d("10") == d("15"));
    CHECK((d("1.5") * d("10")).timesPowerOfTen(-2) == d("0.15")); // class 1.5 of 10 V
    CHECK(d("-0.024") * d("0.83") == d("-0.01992"));
    CHECK(d("5e-5") - d("-5e-5") == d("1e-4"));
    CHECK(-d("2") == d("-2"));
    CHECK(d("-2").abs() == d("2"));
    CHECK(d("99.99") + d("0.01") == d("100"));
}

TEST_CASE("comparisons order by value at any magnitude") {
    CHECK(d("0.15") < d("0.150000000000000001"));
    CHECK(d("-0.15") > d("-0.150000000000000001"));
    CHECK(d("1e-300") > ExactDecimal());
    CHECK(d("-1e300") < d("1e-300"));
    CHECK(d("10") > d("9.99999999999999999999"));
    CHECK(std::is_eq(d("0.15") <=> d("1.5e-1")));
}

TEST_CASE("rounding to a decimal place and to significant digits") {
    CHECK(d("0.0235").roundedToExponent(-3) == d("0.024"));   // half away from zero
    CHECK(d("-0.0235").roundedToExponent(-3) == d("-0.024")); // half away from zero
    CHECK(d("0.0234").roundedToExponent(-3) == d("0.023"));
    CHECK(d("0.0004").roundedToExponent(-3) == ExactDecimal());
    CHECK(d("0.0006").roundedToExponent(-3) == d("0.001"));
    CHECK(d("0.02301").roundedUpToSignificant(2) == d("0.024"));
    CHECK(d("0.023").roundedUpToSignificant(2) == d("0.023"));
    CHECK(d("0.0991").roundedUpToSignificant(2) == d("0.1"));
    CHECK(d("3.98").roundedDownToSignificant(2) == d("3.9"));
    CHECK(d("156").roundedDownToSignificant(2) == d("150"));
    CHECK(d("0.15").leadingExponent() == -1);
    CHECK(d("0.15").lastDigitExponent() == -2);
    CHECK(d("150").lastDigitExponent() == 1);
}

TEST_CASE("a mean is compared with a bound without dividing") {
    // (0.16 + 0.14) / 2 = 0.15 exactly; (0.1 + 0.1 + 0.1) / 3 = 0.1 exactly.
    const ExactMean two{d("0.16") + d("0.14"), 2};
    CHECK(two.compare(d("0.15")) == 0);
    CHECK(two.compare(d("0.1499")) == 1);
    const ExactMean three{d("0.1") + d("0.1") + d("0.1"), 3};
    CHECK(three.compare(d("0.1")) == 0);
    CHECK(three.compareMagnitude(ExactMean{d("-0.2"), 2}) == 0);
    CHECK(three.toDouble() == 0.1); // the double nearest the exact mean, not 0.3 / 3
    CHECK(d("1").dividedBy(3).toDouble() == 1.0 / 3.0);
    CHECK(d("-2.5").dividedBy(4) == d("-0.625"));
    CHECK(d("7e20").dividedBy(7) == d("1e20"));
}

TEST_CASE("random sums and products agree with 64-bit integer arithmetic") {
    // Independent reference: values k × 10^-6 with |k| < 10^6 as int64 micro-units.
    std::mt19937_64 random(20240601);
    std::uniform_int_distribution<std::int64_t> pick(-999999, 999999);
    const auto micro = [](std::int64_t k) {
        return ExactDecimal::fromInteger(k).timesPowerOfTen(-6);
    };
    for (int i = 0; i < 2000; ++i) {
        const std::int64_t a = pick(random);
        const std::int64_t b = pick(random);
        INFO(a << " " << b);
        CHECK(micro(a) + micro(b) == micro(a + b));
        CHECK(micro(a) - micro(b) == micro(a - b));
        CHECK(micro(a) * micro(b) == ExactDecimal::fromInteger(a * b).timesPowerOfTen(-12));
        CHECK(std::is_lt(micro(a) <=> micro(b)) == (a < b));
        // Through a double and back: a six-decimal value survives the shortest round trip.
        CHECK(ExactDecimal::fromDouble(micro(a).toDouble()) == micro(a));
    }
}
