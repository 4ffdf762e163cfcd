// Exact decimal arithmetic on a coefficient of decimal digits and a power of ten.
#include "core/units/decimal.h"

#include <algorithm>
#include <charconv>
#include <cmath>
#include <cstdlib>
#include <limits>
#include <stdexcept>
#include <system_error>

namespace mw {
namespace {

using Digits = std::vector<std::uint8_t>; // least significant first

// a − b for magnitudes with a ≥ b, both aligned to the same exponent.
Digits subtractDigits(const Digits& a, const Digits& b) {
    Digits out(a.size(), 0);
    int borrow = 0;
    for (std::size_t i = 0; i < a.size(); ++i) {
        int d = a[i] - borrow - (i < b.size() ? b[i] : 0);
        borrow = d < 0 ? 1 : 0;
        out[i] = static_cast<std::uint8_t>(d + 10 * borrow);
    }
    return out;
}

Digits addDigits(const Digits& a, const Digits& b) {
    Digits out;
    out.reserve(std::max(a.size(), b.size()) + 1);
    int carry = 0;
    for (std::size_t i = 0; i < std::max(a.size(), b.size()); ++i) {
        const int d = (i < a.size() ? a[i] : 0) + (i < b.size() ? b[i] : 0) + carry;
        out.push_back(static_cast<std::uint8_t>(d % 10));
        carry = d / 10;
    }
    if (carry != 0) {
        out.push_back(static_cast<std::uint8_t>(carry));
    }
    return out;
}

// Compares aligned magnitudes (same exponent).
int compareDigits(const Digits& a, const Digits& b) {
    std::size_t top = std::max(a.size(), b.size());
    while (top-- > 0) {
        const int da = top < a.size() ? a[top] : 0;
        const int db = top < b.size() ? b[top] : 0;
        if (da != db) {
            return da < db ? -1 : 1;
        }
    }
    return 0;
}

Digits shifted(const Digits& digits, int zeros) {
    Digits out(static_cast<std::size_t>(zeros), 0);
    out.insert(out.end(), digits.begin(), digits.end());
    return out;
}

[[noreturn]] void refuse(std::string_view text, const char* why) {
    throw std::invalid_argument("decimal \"" + std::string(text) + "\": " + why);
}

} // namespace

void ExactDecimal::normalize() {
    while (!digits_.empty() && digits_.back() == 0) {
        digits_.pop_back();
    }
    std::size_t trailing = 0;
    while (trailing < digits_.size() && digits_[trailing] == 0) {
        ++trailing;
    }
    digits_.erase(digits_.begin(), digits_.begin() + static_cast<std::ptrdiff_t>(trailing));
    exponent_ += static_cast<int>(trailing);
    if (digits_.empty()) {
        negative_ = false;
        exponent_ = 0;
    }
}

ExactDecimal ExactDecimal::fromDouble(double value) {
    if (!std::isfinite(value)) {
        throw std::invalid_argument("decimal: a value that is not a finite number has no "
                                    "decimal form");
    }
    char buffer[64];
    const auto result = std::to_chars(buffer, buffer + sizeof buffer, value);
    return parse(std::string_view(buffer, static_cast<std::size_t>(result.ptr - buffer)));
}

ExactDecimal ExactDecimal::fromInteger(std::int64_t value) {
    return parse(std::to_string(value));
}

ExactDecimal ExactDecimal::parse(std::string_view text) {
    ExactDecimal out;
    std::size_t i = 0;
    if (i < text.size() && (text[i] == '-' || text[i] == '+')) {
        out.negative_ = text[i] == '-';
        ++i;
    }
    std::string mantissa; // most significant first
    int pointShift = 0;
    bool point = false;
    for (; i < text.size() && text[i] != 'e' && text[i] != 'E'; ++i) {
        if (text[i] == '.' && !point) {
            point = true;
        } else if (text[i] >= '0' && text[i] <= '9') {
            mantissa += text[i];
            pointShift -= point ? 1 : 0;
        } else {
            refuse(text, "expected digits, one decimal point and an exponent");
        }
    }
    if (mantissa.empty()) {
        refuse(text, "no digits");
    }
    long exponent = 0;
    if (i < text.size()) {
        const char* first = text.data() + i + 1;
        const char* last = text.data() + text.size();
        if (first != last && *first == '+') {
            ++first;
        }
        const auto [end, error] = std::from_chars(first, last, exponent);
        if (error != std::errc() || end != last || std::labs(exponent) > 100000) {
            refuse(text, "the exponent must be a whole number of reasonable size");
        }
    }
    for (auto it = mantissa.rbegin(); it != mantissa.rend(); ++it) {
        out.digits_.push_back(static_cast<std::uint8_t>(*it - '0'));
    }
    out.exponent_ = static_cast<int>(exponent) + pointShift;
    out.normalize();
    return out;
}

ExactDecimal ExactDecimal::abs() const {
    ExactDecimal out = *this;
    out.negative_ = false;
    return out;
}

ExactDecimal ExactDecimal::operator-() const {
    ExactDecimal out = *this;
    out.negative_ = !isZero() && !negative_;
    return out;
}

ExactDecimal ExactDecimal::timesPowerOfTen(int power) const {
    ExactDecimal out = *this;
    if (!out.isZero()) {
        out.exponent_ += power;
    }
    return out;
}

int ExactDecimal::leadingExponent() const {
    if (isZero()) {
        throw std::domain_error("decimal: zero has no leading digit");
    }
    return exponent_ + static_cast<int>(digits_.size()) - 1;
}

int ExactDecimal::lastDigitExponent() const {
    return isZero() ? 0 : exponent_;
}

ExactDecimal ExactDecimal::roundedToExponent(int power) const {
    if (isZero() || exponent_ >= power) {
        return *this;
    }
    const auto dropped = static_cast<std::size_t>(power - exponent_);
    ExactDecimal out;
    out.negative_ = negative_;
    out.exponent_ = power;
    const bool roundUp = dropped <= digits_.size() && digits_[dropped - 1] >= 5;
    if (dropped < digits_.size()) {
        out.digits_.assign(digits_.begin() + static_cast<std::ptrdiff_t>(dropped), digits_.end());
    }
    if (roundUp) {
        out.digits_ = addDigits(out.digits_, Digits{1});
    }
    out.normalize();
    return out;
}

ExactDecimal ExactDecimal::roundedUpToSignificant(int digits) const {
    if (digits < 1) {
        throw std::invalid_argument("decimal: at least one significant digit is needed");
    }
    if (isZero() || static_cast<int>(digits_.size()) <= digits) {
        return *this;
    }
    ExactDecimal out = roundedDownToSignificant(digits);
    ExactDecimal step;
    step.digits_ = {1};
    step.exponent_ = leadingExponent() - digits + 1;
    step.negative_ = negative_;
    return out + step; // something was cut off, so one step away from zero
}

ExactDecimal ExactDecimal::roundedDownToSignificant(int digits) const {
    if (digits < 1) {
        throw std::invalid_argument("decimal: at least one significant digit is needed");
    }
    if (isZero() || static_cast<int>(digits_.size()) <= digits) {
        return *this;
    }
    ExactDecimal out = *this;
    const std::size_t cut = digits_.size() - static_cast<std::size_t>(digits);
    out.digits_.erase(out.digits_.begin(), out.digits_.begin() + static_cast<std::ptrdiff_t>(cut));
    out.exponent_ += static_cast<int>(cut);
    out.normalize();
    return out;
}

int ExactDecimal::compareMagnitude(const ExactDecimal& a, const ExactDecimal& b) {
    if (a.isZero() || b.isZero()) {
        return a.isZero() == b.isZero() ? 0 : (a.isZero() ? -1 : 1);
    }
    if (a.leadingExponent() != b.leadingExponent()) {
        return a.leadingExponent() < b.leadingExponent() ? -1 : 1;
    }
    const int low = std::min(a.exponent_, b.exponent_);
    return compareDigits(shifted(a.digits_, a.exponent_ - low),
                         shifted(b.digits_, b.exponent_ - low));
}

ExactDecimal ExactDecimal::addSigned(const ExactDecimal& a, const ExactDecimal& b, bool negateB) {
    const bool bNegative = negateB ? !b.negative_ && !b.isZero() : b.negative_;
    if (b.isZero()) {
        return a;
    }
    if (a.isZero()) {
        ExactDecimal out = b;
        out.negative_ = bNegative;
        return out;
    }
    const int low = std::min(a.exponent_, b.exponent_);
    const Digits da = shifted(a.digits_, a.exponent_ - low);
    const Digits db = shifted(b.digits_, b.exponent_ - low);
    ExactDecimal out;
    out.exponent_ = low;
    if (a.negative_ == bNegative) {
        out.digits_ = addDigits(da, db);
        out.negative_ = a.negative_;
    } else if (compareDigits(da, db) >= 0) {
        out.digits_ = subtractDigits(da, db);
        out.negative_ = a.negative_;
    } else {
        out.digits_ = subtractDigits(db, da);
        out.negative_ = bNegative;
    }
    out.normalize();
    return out;
}

ExactDecimal operator+(const ExactDecimal& a, const ExactDecimal& b) {
    return ExactDecimal::addSigned(a, b, false);
}

ExactDecimal operator-(const ExactDecimal& a, const ExactDecimal& b) {
    return ExactDecimal::addSigned(a, b, true);
}

ExactDecimal operator*(const ExactDecimal& a, const ExactDecimal& b) {
    ExactDecimal out;
    if (a.isZero() || b.isZero()) {
        return out;
    }
    std::vector<int> product(a.digits_.size() + b.digits_.size(), 0);
    for (std::size_t i = 0; i < a.digits_.size(); ++i) {
        for (std::size_t j = 0; j < b.digits_.size(); ++j) {
            product[i + j] += a.digits_[i] * b.digits_[j];
        }
    }
    int carry = 0;
    for (int& d : product) {
        d += carry;
        carry = d / 10;
        d %= 10;
    }
    for (const int d : product) {
        out.digits_.push_back(static_cast<std::uint8_t>(d));
    }
    out.exponent_ = a.exponent_ + b.exponent_;
    out.negative_ = a.negative_ != b.negative_;
    out.normalize();
    return out;
}

std::strong_ordering operator<=>(const ExactDecimal& a, const ExactDecimal& b) {
    if (a.negative_ != b.negative_) {
        return a.negative_ ? std::strong_ordering::less : std::strong_ordering::greater;
    }
    const int magnitude = ExactDecimal::compareMagnitude(a, b);
    const int sign = a.negative_ ? -magnitude : magnitude;
    return sign < 0 ? std::strong_ordering::less
                    : (sign > 0 ? std::strong_ordering::greater : std::strong_ordering::equal);
}

double ExactDecimal::toDouble() const {
    const std::string text = toScientific();
    double value = 0.0;
    const auto result = std::from_chars(text.data(), text.data() + text.size(), value);
    if (result.ec == std::errc::result_out_of_range) {
        // Beyond the range of a double: the sign and an overflow or underflow, as strtod gives.
        const bool huge = leadingExponent() > 0;
        const double magnitude = huge ? std::numeric_limits<double>::infinity() : 0.0;
        return negative_ ? -magnitude : magnitude;
    }
    return value;
}

std::string ExactDecimal::toScientific() const {
    if (isZero()) {
        return "0";
    }
    std::string out = negative_ ? "-" : "";
    out += static_cast<char>('0' + digits_.back());
    if (digits_.size() > 1) {
        out += '.';
        for (std::size_t i = digits_.size() - 1; i-- > 0;) {
            out += static_cast<char>('0' + digits_[i]);
        }
    }
    return out + "e" + std::to_string(leadingExponent());
}

std::string ExactDecimal::toPlain() const {
    if (isZero()) {
        return "0";
    }
    std::string digits;
    for (auto it = digits_.rbegin(); it != digits_.rend(); ++it) {
        digits += static_cast<char>('0' + *it);
    }
    std::string body;
    if (exponent_ >= 0) {
        body = digits + std::string(static_cast<std::size_t>(exponent_), '0');
    } else {
        const auto fraction = static_cast<std::size_t>(-exponent_);
        if (digits.size() <= fraction) {
            body = "0." + std::string(fraction - digits.size(), '0') + digits;
        } else {
            body = digits.substr(0, digits.size() - fraction) + "." +
                   digits.substr(digits.size() - fraction);
        }
    }
    return (negative_ ? "-" : "") + body;
}

ExactDecimal ExactDecimal::dividedBy(std::int64_t divisor) const {
    if (divisor <= 0) {
        throw std::invalid_argument("decimal: the divisor must be above zero");
    }
    if (isZero() || divisor == 1) {
        return *this;
    }
    if (divisor > 100'000'000'000'000LL) {
        return fromDouble(toDouble() / static_cast<double>(divisor)); // no exact need that large
    }
    // Long division of the coefficient, extended by zeros until the quotient has 30
    // significant digits; the rest is cut off (far below what a double can hold).
    constexpr std::size_t kDigits = 30;
    ExactDecimal out;
    out.negative_ = negative_;
    std::vector<std::uint8_t> quotient; // most significant first
    std::int64_t remainder = 0;
    std::size_t index = digits_.size();
    int extraZeros = 0;
    std::size_t significant = 0;
    while (significant < kDigits && (index > 0 || remainder != 0)) {
        int digit = 0;
        if (index > 0) {
            digit = digits_[--index];
        } else {
            ++extraZeros;
        }
        remainder = remainder * 10 + digit;
        const auto q = static_cast<std::uint8_t>(remainder / divisor);
        remainder %= divisor;
        quotient.push_back(q);
        significant += significant > 0 || q != 0 ? 1 : 0;
    }
    // Digits still unread of the coefficient shift the result up.
    const int unread = static_cast<int>(index);
    out.digits_.assign(quotient.rbegin(), quotient.rend());
    out.exponent_ = exponent_ - extraZeros + unread;
    out.normalize();
    return out;
}

int ExactMean::compare(const ExactDecimal& bound) const {
    const ExactDecimal scaled = ExactDecimal::fromInteger(count) * bound;
    const auto order = sum <=> scaled;
    return order < 0 ? -1 : (order > 0 ? 1 : 0);
}

int ExactMean::compareMagnitude(const ExactMean& other) const {
    const ExactDecimal left = sum.abs() * ExactDecimal::fromInteger(other.count);
    const ExactDecimal right = other.sum.abs() * ExactDecimal::fromInteger(count);
    const auto order = left <=> right;
    return order < 0 ? -1 : (order > 0 ? 1 : 0);
}

double ExactMean::toDouble() const {
    return sum.dividedBy(count).toDouble();
}

} // namespace mw
