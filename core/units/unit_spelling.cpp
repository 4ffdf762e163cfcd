// Tables of unit spellings and SI prefixes shared by the parser and the formatter.
#include "core/units/unit_spelling.h"

#include <array>

namespace mw::units {
namespace {

// One table so the parser and the documentation agree; spellings are case-sensitive.
constexpr std::array kSpellings{
    UnitSpelling{U"V", Unit::Volt, 0, true},
    UnitSpelling{U"Vrms", Unit::Volt, 0, true},
    UnitSpelling{U"Vdc", Unit::Volt, 0, true},
    UnitSpelling{U"Vac", Unit::Volt, 0, true},
    UnitSpelling{U"A", Unit::Ampere, 0, true},
    UnitSpelling{U"Arms", Unit::Ampere, 0, true},
    UnitSpelling{U"Adc", Unit::Ampere, 0, true},
    UnitSpelling{U"Aac", Unit::Ampere, 0, true},
    UnitSpelling{U"\u03A9", Unit::Ohm, 0, true}, // Greek capital omega
    UnitSpelling{U"\u2126", Unit::Ohm, 0, true}, // ohm sign
    UnitSpelling{U"ohm", Unit::Ohm, 0, true},
    UnitSpelling{U"ohms", Unit::Ohm, 0, true},
    UnitSpelling{U"Ohm", Unit::Ohm, 0, true},
    UnitSpelling{U"Ohms", Unit::Ohm, 0, true},
    UnitSpelling{U"R", Unit::Ohm, 0, true}, // "100R", as printed on resistors
    UnitSpelling{U"\u03A9/V", Unit::OhmPerVolt, 0, true},
    UnitSpelling{U"\u2126/V", Unit::OhmPerVolt, 0, true},
    UnitSpelling{U"ohm/V", Unit::OhmPerVolt, 0, true},
    UnitSpelling{U"ohms/V", Unit::OhmPerVolt, 0, true},
    UnitSpelling{U"/V", Unit::OhmPerVolt, 0, true}, // "20k/V", as printed on meter dials
    UnitSpelling{U"W", Unit::Watt, 0, true},
    UnitSpelling{U"Hz", Unit::Hertz, 0, true},
    UnitSpelling{U"s", Unit::Second, 0, true},
    UnitSpelling{U"K", Unit::Kelvin, 0, false},
    UnitSpelling{U"\u00B0C", Unit::DegreeCelsius, 0, false},
    UnitSpelling{U"\u2103", Unit::DegreeCelsius, 0, false},
    UnitSpelling{U"C", Unit::DegreeCelsius, 0, false}, // "23C": no coulombs in this trade
    UnitSpelling{U"degC", Unit::DegreeCelsius, 0, false},
    UnitSpelling{U"%", Unit::Percent, 0, false},
    UnitSpelling{U"/K", Unit::PerKelvin, 0, false},
    UnitSpelling{U"ppm/K", Unit::PerKelvin, -6, false},
    UnitSpelling{U"%/K", Unit::PerKelvin, -2, false},
};

} // namespace

std::optional<UnitSpelling> findUnit(std::u32string_view text) {
    for (const UnitSpelling& spelling : kSpellings) {
        if (spelling.text == text) {
            return spelling;
        }
    }
    return std::nullopt;
}

std::optional<int> prefixPower(char32_t letter) {
    switch (letter) {
    case U'p':
        return -12;
    case U'n':
        return -9;
    case U'u':
    case U'\u00B5': // micro sign
    case U'\u03BC': // Greek small mu
        return -6;
    case U'm':
        return -3;
    case U'k':
    case U'K':
        return 3;
    case U'M':
        return 6;
    case U'G':
        return 9;
    default:
        return std::nullopt;
    }
}

std::string_view prefixSymbol(int powerOfTen) {
    switch (powerOfTen) {
    case -12:
        return "p";
    case -9:
        return "n";
    case -6:
        return "\u00B5";
    case -3:
        return "m";
    case 3:
        return "k";
    case 6:
        return "M";
    case 9:
        return "G";
    default:
        return "";
    }
}

} // namespace mw::units
