// The spellings of units and SI prefixes the quantity parser accepts and the formatter writes.
#pragma once

#include "core/units/quantity.h"

#include <optional>
#include <string_view>

namespace mw::units {

struct UnitSpelling {
    std::u32string_view text;
    Unit unit;
    int powerOfTen;   // "ppm/K" is 1e-6 /K
    bool takesPrefix; // °C, K, % and /K take no SI prefix
};

// The unit spelled exactly `text`, if any ("Vrms" is a volt, "ohm" and "Ω" are ohms).
std::optional<UnitSpelling> findUnit(std::u32string_view text);

// The power of ten of an SI prefix letter (p n u µ m k K M G), if `letter` is one.
std::optional<int> prefixPower(char32_t letter);

// The prefix written for a power of ten that is a multiple of 3 between -12 and 9.
std::string_view prefixSymbol(int powerOfTen);

} // namespace mw::units
