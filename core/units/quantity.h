// Quantities as a technician types them ("4k7", "50 µA", "10 Vrms", "12.5 %") and the one
// number format the app uses (engineering notation, round-trip safe).
#pragma once

#include <cstddef>
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
};

// value is in the coherent unit named by `unit` (volts, amperes, ohms ...); a Percent quantity
// holds the number of percent as typed (12.5 for "12.5 %").
struct Quantity {
    double value = 0.0;
    Unit unit = Unit::Dimensionless;
};

struct ParseOptions {
    bool decimalComma = false; // "4,7k" instead of "4.7k"
};

// A precise parse error: what was wrong, and the 0-based character position where it was found.
class QuantityError : public std::runtime_error {
public:
    QuantityError(const std::string& message, std::size_t position);
    std::size_t position() const noexcept { return position_; }

private:
    std::size_t position_;
};

// Parses a number with optional SI prefix and unit; throws QuantityError.
Quantity parseQuantity(std::string_view text, const ParseOptions& options = {});

// Parses a value that must be of `expected` unit (a bare number is taken in that unit).
// A different unit is an error, never a silent conversion (K and °C are the one pair converted).
double parseValue(std::string_view text, Unit expected, const ParseOptions& options = {});

// Engineering notation with `significantDigits` digits and an SI prefix: "4.70 kΩ", "-250 mV".
std::string formatEngineering(double value, int significantDigits, Unit unit = Unit::Dimensionless);

std::string_view unitSymbol(Unit unit);

} // namespace mw
