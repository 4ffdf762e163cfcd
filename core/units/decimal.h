// Exact decimal arithmetic for the comparisons a record must get right: a value is taken as the
// shortest decimal that reads back as the same double (what a person typed, what the record
// shows), and sums, differences, products, roundings and comparisons are then exact, so that
// 10.15 − 10 is 0.15 and not 0.150000000000000355.
#pragma once

#include <compare>
#include <cstdint>
#include <string>
#include <string_view>
#include <vector>

namespace mw {

class ExactDecimal {
public:
    ExactDecimal() = default; // zero

    // The shortest decimal that converts back to `value` (std::to_chars round trip): 0.15 is
    // 15e-2 exactly. Throws std::invalid_argument for NaN and infinities.
    static ExactDecimal fromDouble(double value);
    static ExactDecimal fromInteger(std::int64_t value);
    // Reads "-12.5", "4e-6", "0.000150" (digits, optional point, optional exponent). Throws
    // std::invalid_argument naming the text.
    static ExactDecimal parse(std::string_view text);

    bool isZero() const { return digits_.empty(); }
    bool isNegative() const { return negative_; }
    ExactDecimal abs() const;
    ExactDecimal operator-() const;
    // × 10^power, exact.
    ExactDecimal timesPowerOfTen(int power) const;
    // Power of ten of the leading digit: 2 for 150, -3 for 0.0024. Zero has none (throws).
    int leadingExponent() const;
    // Power of ten of the last non-zero digit: -2 for 0.15, 1 for 150.
    int lastDigitExponent() const;

    // Divided by a positive integer, cut to 30 significant digits (exact when the quotient has
    // fewer): for turning an exact mean into the nearest double.
    ExactDecimal dividedBy(std::int64_t divisor) const;

    // Rounded to a multiple of 10^power, half away from zero (0.0235 at -3 is 0.024).
    ExactDecimal roundedToExponent(int power) const;
    // Rounded away from zero to `digits` significant digits (0.02301 to 2 is 0.024).
    ExactDecimal roundedUpToSignificant(int digits) const;
    // Rounded toward zero to `digits` significant digits (3.98 to 2 is 3.9).
    ExactDecimal roundedDownToSignificant(int digits) const;

    friend ExactDecimal operator+(const ExactDecimal& a, const ExactDecimal& b);
    friend ExactDecimal operator-(const ExactDecimal& a, const ExactDecimal& b);
    friend ExactDecimal operator*(const ExactDecimal& a, const ExactDecimal& b);
    friend std::strong_ordering operator<=>(const ExactDecimal& a, const ExactDecimal& b);
    friend bool operator==(const ExactDecimal& a, const ExactDecimal& b) = default;

    // The double nearest to the value (one correctly rounded conversion).
    double toDouble() const;
    // "-1.5e-2" style: digits with a point after the first, and the exponent.
    std::string toScientific() const;
    // Positional notation without exponent: "-0.015", "150".
    std::string toPlain() const;

private:
    void normalize();
    // Adds or subtracts magnitudes after aligning exponents.
    static ExactDecimal addSigned(const ExactDecimal& a, const ExactDecimal& b, bool negateB);
    static int compareMagnitude(const ExactDecimal& a, const ExactDecimal& b);

    bool negative_ = false;
    std::vector<std::uint8_t> digits_; // coefficient, least significant first; empty for zero
    int exponent_ = 0;                 // value = ±coefficient × 10^exponent_
};

// An exact mean of decimal values kept as sum and count, so that comparing it with a bound
// never divides: mean ≤ b exactly when sum ≤ count · b.
struct ExactMean {
    ExactDecimal sum;
    std::int64_t count = 1;

    static ExactMean of(double value) { return {ExactDecimal::fromDouble(value), 1}; }
    // Sign of (mean − bound): -1, 0 or +1.
    int compare(const ExactDecimal& bound) const;
    // Sign of (|mean| − |other mean|).
    int compareMagnitude(const ExactMean& other) const;
    // The double nearest the mean (sum divided to 30 significant digits, then converted).
    double toDouble() const;
};

} // namespace mw
