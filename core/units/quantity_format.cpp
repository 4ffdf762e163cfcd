// Engineering-notation formatting and unit names: the one number format the app uses.
#include "core/units/quantity.h"

#include "core/units/decimal.h"
#include "core/units/unit_spelling.h"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <string>

namespace mw {
namespace {

bool takesPrefix(Unit unit) {
    return unit != Unit::Kelvin && unit != Unit::DegreeCelsius && unit != Unit::Percent &&
           unit != Unit::PerKelvin;
}

struct Decimal {
    bool negative = false;
    std::string digits; // exactly the significant digits, rounded once by printf
    int exponent = 0;   // value = 0.d1d2d3... x 10^(exponent + 1), i.e. d1.d2d3 x 10^exponent
};

Decimal roundToDigits(double value, int digits) {
    char buffer[64];
    std::snprintf(buffer, sizeof buffer, "%.*e", digits - 1, std::fabs(value));
    const std::string text(buffer);
    const std::size_t e = text.find('e');
    Decimal decimal;
    decimal.negative = std::signbit(value) && value != 0.0;
    for (std::size_t i = 0; i < e; ++i) {
        if (text[i] != '.') {
            decimal.digits += text[i];
        }
    }
    decimal.exponent = std::atoi(text.c_str() + e + 1);
    return decimal;
}

// Places the decimal point so that `integerDigits` digits stand before it.
std::string placePoint(std::string digits, int integerDigits) {
    if (integerDigits <= 0) {
        return "0." + std::string(static_cast<std::size_t>(-integerDigits), '0') + digits;
    }
    const auto whole = static_cast<std::size_t>(integerDigits);
    if (digits.size() <= whole) {
        return digits + std::string(whole - digits.size(), '0');
    }
    return digits.substr(0, whole) + "." + digits.substr(whole);
}

std::string joinUnit(std::string number, std::string_view prefix, Unit unit) {
    const std::string_view symbol = unitSymbol(unit);
    if (prefix.empty() && symbol.empty()) {
        return number;
    }
    return number + " " + std::string(prefix) + std::string(symbol);
}

} // namespace

std::string formatEngineering(double value, int significantDigits, Unit unit) {
    const int digits = std::clamp(significantDigits, 1, 17);
    if (std::isnan(value)) {
        return joinUnit("NaN", "", unit);
    }
    if (std::isinf(value)) {
        return joinUnit(value > 0 ? "inf" : "-inf", "", unit);
    }
    const Decimal decimal = roundToDigits(value, digits);
    const std::string sign = decimal.negative ? "-" : "";
    if (value == 0.0) {
        return joinUnit(placePoint(decimal.digits, 1), "", unit);
    }
    const bool prefixed = takesPrefix(unit);
    const int low = prefixed ? -12 : -3;
    const int high = prefixed ? 11 : 5;
    if (decimal.exponent < low || decimal.exponent > high) {
        // Beyond the prefixes: mantissa and exponent, which the parser reads back as written.
        const int engineering =
            prefixed ? 3 * static_cast<int>(std::floor(decimal.exponent / 3.0)) : decimal.exponent;
        const std::string mantissa = placePoint(decimal.digits, decimal.exponent - engineering + 1);
        return joinUnit(sign + mantissa + "e" + std::to_string(engineering), "", unit);
    }
    if (!prefixed) {
        return joinUnit(sign + placePoint(decimal.digits, decimal.exponent + 1), "", unit);
    }
    const int engineering = 3 * static_cast<int>(std::floor(decimal.exponent / 3.0));
    const std::string mantissa = placePoint(decimal.digits, decimal.exponent - engineering + 1);
    return joinUnit(sign + mantissa, units::prefixSymbol(engineering), unit);
}

std::string formatAtExponent(double value, int lastDigitExponent, Unit unit,
                             std::optional<int> prefixPower) {
    if (!std::isfinite(value)) {
        return formatEngineering(value, 3, unit);
    }
    const ExactDecimal rounded =
        ExactDecimal::fromDouble(value).roundedToExponent(lastDigitExponent);
    int prefix = 0;
    if (takesPrefix(unit)) {
        const int lead = rounded.isZero() ? lastDigitExponent : rounded.leadingExponent();
        const int wanted = prefixPower.value_or(lead);
        prefix = std::clamp(3 * static_cast<int>(std::floor(wanted / 3.0)), -12, 9);
    }
    std::string text = rounded.timesPowerOfTen(-prefix).toPlain();
    const int decimals = std::max(0, prefix - lastDigitExponent);
    if (decimals > 0) {
        const std::size_t point = text.find('.');
        const std::size_t have = point == std::string::npos ? 0 : text.size() - point - 1;
        if (point == std::string::npos) {
            text += '.';
        }
        text += std::string(static_cast<std::size_t>(decimals) - have, '0');
    }
    return joinUnit(text, units::prefixSymbol(prefix), unit);
}

std::string_view unitSymbol(Unit unit) {
    switch (unit) {
    case Unit::Dimensionless:
        return "";
    case Unit::Volt:
        return "V";
    case Unit::Ampere:
        return "A";
    case Unit::Ohm:
        return "\u03A9";
    case Unit::Watt:
        return "W";
    case Unit::Hertz:
        return "Hz";
    case Unit::Second:
        return "s";
    case Unit::Kelvin:
        return "K";
    case Unit::DegreeCelsius:
        return "\u00B0C";
    case Unit::Percent:
        return "%";
    case Unit::OhmPerVolt:
        return "\u03A9/V";
    case Unit::PerKelvin:
        return "/K";
    }
    return "";
}

std::string_view unitDescription(Unit unit) {
    switch (unit) {
    case Unit::Dimensionless:
        return "a plain number";
    case Unit::Volt:
        return "a voltage (V)";
    case Unit::Ampere:
        return "a current (A)";
    case Unit::Ohm:
        return "a resistance (\u03A9)";
    case Unit::Watt:
        return "a power (W)";
    case Unit::Hertz:
        return "a frequency (Hz)";
    case Unit::Second:
        return "a time (s)";
    case Unit::Kelvin:
        return "a temperature (K)";
    case Unit::DegreeCelsius:
        return "a temperature (\u00B0C)";
    case Unit::Percent:
        return "a percentage (%)";
    case Unit::OhmPerVolt:
        return "a sensitivity (\u03A9/V)";
    case Unit::PerKelvin:
        return "a temperature coefficient (/K)";
    }
    return "a value";
}

std::string formatPlain(double value) {
    char text[32];
    std::snprintf(text, sizeof text, "%.6g", value);
    return text;
}

} // namespace mw
