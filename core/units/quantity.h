// Quantities as a technician types them ("4k7", "50 µA", "10 Vrms", "12.5 %") and the one
// number format the app uses (engineering notation, round-trip safe).
#pragma once

#include <cstddef>
#include <optional>
#include <stdexcept>
#include <string>
#include <string_view>

namespace mw {

enum class Unit {
    Dimensionless,
    Volt,
    Ampere,
    Ohm,
    Watt,
    Hertz,
    Second,
    Kelvin,
    DegreeCelsius,
    Percent,
    OhmPerVolt,
    PerKelvin, // temperature coefficient: "0.00393/K", "15 ppm/K", "0.4 %/K"
};

// value is in the coherent unit named by `unit` (volts, amperes, ohms ...); a Percent quantity
// holds the number of percent as typed (12.5 for "12.5 %").
struct Quantity {
    double value = 0.0;
    Unit unit = Unit::Dimensionless;
    int prefixPower = 0; // the SI prefix as typed: -6 for "50uA" and "4u7", 0 without one
};

struct ParseOptions {
    bool decimalComma = false; // "4,7k" instead of "4.7k"
    // A number typed with neither prefix nor unit is taken as this power of ten of the unit:
    // -6 on a 50 µA range, where the scale shows "50" for 50 µA. The prefix is folded into the
    // one decimal conversion, so "-50" is the double nearest -50e-6, like "-50 µA".
    int bareNumberPowerOfTen = 0;
};

// A precise parse error: what was wrong, and the 0-based character position where it was found.
// Positions count Unicode characters, not bytes ("µ" is one character). The message itself
// quotes the input and names the 1-based character for people.
class QuantityError : public std::runtime_error {
public:
    QuantityError(const std::string& message, std::size_t position);
    std::size_t position() const noexcept { return position_; }

private:
    std::size_t position_;
};

// Parses a number with optional SI prefix and unit; throws QuantityError.
// Accepted: "4.7k", "4k7" / "4R7" / "R47" (IEC 60062 letter as decimal point), "50u", "50µA",
// "1 mA", "10 Vrms", "2.2 MΩ", "2.2Mohm", "1e3", "-0.25", "12.5 %", "23C", "23 °C", "296.15K",
// "50Hz", "20k/V", "20 kΩ/V", "15 ppm/K". A bare "K" is kelvin; kilo is a lower-case "k".
Quantity parseQuantity(std::string_view text, const ParseOptions& options = {});

// Parses a value that must be of `expected` unit (a bare number is taken in that unit).
// A different unit is an error, never a silent conversion (K and °C are the one pair converted).
double parseValue(std::string_view text, Unit expected, const ParseOptions& options = {});

// Engineering notation with `significantDigits` digits and an SI prefix: "4.70 kΩ", "-250 mV".
// Prefixes run from p to G; outside that (and for °C, K, %, /K, which take no prefix) the
// mantissa is written with an exponent ("1.00e-15 A"). Every finite result parses back to the
// value rounded to the printed digits. Non-finite values print as "NaN", "inf", "-inf".
// significantDigits is clamped to 1..17.
std::string formatEngineering(double value, int significantDigits, Unit unit = Unit::Dimensionless);

// The value rounded (exactly, half away from zero, on its shortest decimal) to a multiple of
// 10^lastDigitExponent and written with the SI prefix 10^prefixPower (a multiple of 3 from -12
// to 9; without one, the prefix of the rounded value, or of the last digit for a zero):
// (0.1603, -3) -> "160 mV", (0, -3, -6) -> "0 µV" ... For numbers that must be shown to the
// same last digit as their uncertainty (JCGM 100:2008 7.2.6), and columns in one prefix.
std::string formatAtExponent(double value, int lastDigitExponent, Unit unit,
                             std::optional<int> prefixPower = std::nullopt);

// Dimensionless numbers in messages (probabilities, factors, degrees of freedom): six significant
// digits without an SI prefix, so 1e-9 does not print as 0.000000 and 0.5 not as "500 m".
std::string formatPlain(double value);

std::string_view unitSymbol(Unit unit);

// What kind of value a unit measures, for messages: "a voltage", "a resistance" ...
std::string_view unitDescription(Unit unit);

} // namespace mw
