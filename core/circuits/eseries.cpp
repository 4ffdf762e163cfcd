// IEC 60063 series tables and the resistor choices made from them.
#include "core/circuits/eseries.h"

#include "core/units/quantity.h"

#include <algorithm>
#include <array>
#include <cmath>
#include <limits>
#include <stdexcept>

namespace mw {
namespace {

// IEC 60063:2015 Table 1 (two-digit series). E12 and E6 are every 2nd and 4th E24 value.
constexpr std::array<int, 6> kE6{10, 15, 22, 33, 47, 68};
constexpr std::array<int, 12> kE12{10, 12, 15, 18, 22, 27, 33, 39, 47, 56, 68, 82};
constexpr std::array<int, 24> kE24{10, 11, 12, 13, 15, 16, 18, 20, 22, 24, 27, 30,
                                   33, 36, 39, 43, 47, 51, 56, 62, 68, 75, 82, 91};

// IEC 60063:2015 Table 2 (three-digit series). E96 is every 2nd E192 value, E48 every 4th.
constexpr std::array<int, 192> kE192{
    100, 101, 102, 104, 105, 106, 107, 109, 110, 111, 113, 114, 115, 117, 118, 120, 121, 123,
    124, 126, 127, 129, 130, 132, 133, 135, 137, 138, 140, 142, 143, 145, 147, 149, 150, 152,
    154, 156, 158, 160, 162, 164, 165, 167, 169, 172, 174, 176, 178, 180, 182, 184, 187, 189,
    191, 193, 196, 198, 200, 203, 205, 208, 210, 213, 215, 218, 221, 223, 226, 229, 232, 234,
    237, 240, 243, 246, 249, 252, 255, 258, 261, 264, 267, 271, 274, 277, 280, 284, 287, 291,
    294, 298, 301, 305, 309, 312, 316, 320, 324, 328, 332, 336, 340, 344, 348, 352, 357, 361,
    365, 370, 374, 379, 383, 388, 392, 397, 402, 407, 412, 417, 422, 427, 432, 437, 442, 448,
    453, 459, 464, 470, 475, 481, 487, 493, 499, 505, 511, 517, 523, 530, 536, 542, 549, 556,
    562, 569, 576, 583, 590, 597, 604, 612, 619, 626, 634, 642, 649, 657, 665, 673, 681, 690,
    698, 706, 715, 723, 732, 741, 750, 759, 768, 777, 787, 796, 806, 816, 825, 835, 845, 856,
    866, 876, 887, 898, 909, 920, 931, 942, 953, 965, 976, 988};

template <std::size_t Step>
constexpr std::array<int, 192 / Step> everyNth() {
    std::array<int, 192 / Step> out{};
    for (std::size_t i = 0; i < out.size(); ++i) {
        out[i] = kE192[i * Step];
    }
    return out;
}

constexpr std::array<int, 96> kE96 = everyNth<2>();
constexpr std::array<int, 48> kE48 = everyNth<4>();

// mantissa x 10^power, dividing for negative powers so that e.g. 499e-4 is the nearest double.
double scaled(int mantissa, int power) {
    return power >= 0 ? mantissa * std::pow(10.0, power) : mantissa / std::pow(10.0, -power);
}

void checkWanted(double ohms) {
    if (!std::isfinite(ohms) || ohms <= 0.0) {
        throw std::domain_error("resistor selection: the wanted value must be above 0 Ω, got " +
                                formatEngineering(ohms, 4, Unit::Ohm));
    }
}

// The standard values around `ohms`: the largest not above it and the next one up. Three
// decades are searched so that log10 rounding at a decade boundary cannot miss a value.
std::array<double, 2> bracket(double ohms, ESeries series) {
    const std::span<const int> decade = eseriesDecade(series);
    const int digits = decade.front() == 10 ? 2 : 3;
    const int power = static_cast<int>(std::floor(std::log10(ohms))) - (digits - 1);
    // A wanted value a hair under a standard one (4699.9999999 from arithmetic) still takes it.
    const double tolerant = ohms * (1.0 + 1e-12);
    double below = 0.0;
    double above = std::numeric_limits<double>::infinity();
    for (int p = power - 1; p <= power + 1; ++p) {
        for (const int mantissa : decade) {
            const double value = scaled(mantissa, p);
            if (value <= tolerant) {
                below = std::max(below, value);
            } else {
                above = std::min(above, value);
            }
        }
    }
    return {below, above};
}

} // namespace

std::optional<ESeries> eseriesFromText(std::string_view text) {
    for (ESeries s :
         {ESeries::E6, ESeries::E12, ESeries::E24, ESeries::E48, ESeries::E96, ESeries::E192}) {
        const std::string_view name = toText(s);
        if (text.size() == name.size() && (text[0] == 'E' || text[0] == 'e') &&
            text.substr(1) == name.substr(1)) {
            return s;
        }
    }
    return std::nullopt;
}

std::string_view toText(ESeries series) {
    switch (series) {
    case ESeries::E6:
        return "E6";
    case ESeries::E12:
        return "E12";
    case ESeries::E24:
        return "E24";
    case ESeries::E48:
        return "E48";
    case ESeries::E96:
        return "E96";
    case ESeries::E192:
        return "E192";
    }
    return "?";
}

std::span<const int> eseriesDecade(ESeries series) {
    switch (series) {
    case ESeries::E6:
        return kE6;
    case ESeries::E12:
        return kE12;
    case ESeries::E24:
        return kE24;
    case ESeries::E48:
        return kE48;
    case ESeries::E96:
        return kE96;
    case ESeries::E192:
        return kE192;
    }
    return kE24;
}

double eseriesTolerance(ESeries series) {
    switch (series) {
    case ESeries::E6:
        return 0.20;
    case ESeries::E12:
        return 0.10;
    case ESeries::E24:
        return 0.05;
    case ESeries::E48:
        return 0.02;
    case ESeries::E96:
        return 0.01;
    case ESeries::E192:
        return 0.005;
    }
    return 0.0;
}

double nearestNotAbove(double ohms, ESeries series) {
    checkWanted(ohms);
    return bracket(ohms, series)[0];
}

double nearestStandard(double ohms, ESeries series) {
    checkWanted(ohms);
    const auto [below, above] = bracket(ohms, series);
    const double downBy = ohms - below;
    const double upBy = above - ohms;
    if (downBy < upBy) {
        return below;
    }
    if (upBy < downBy) {
        return above;
    }
    return std::log(ohms / below) < std::log(above / ohms) ? below : above;
}

ResistorChoice chooseResistor(double ohms, ESeries series, double smallestTrimmer_ohm) {
    ResistorChoice choice;
    choice.ohms_wanted = ohms;
    choice.ohms_standard = nearestNotAbove(ohms, series);
    choice.ohms_trim = std::max(0.0, ohms - choice.ohms_standard);
    choice.ohms_trim_range = ohms - choice.ohms_standard * (1.0 - eseriesTolerance(series));
    // Trimmers come in a 1-2-5 sequence (common practice: 10 Ω, 20 Ω, 50 Ω, 100 Ω ...).
    const double decade = std::pow(10.0, std::floor(std::log10(choice.ohms_trim_range)));
    for (double step : {1.0, 2.0, 5.0, 10.0}) {
        if (step * decade >= choice.ohms_trim_range * (1.0 - 1e-12)) {
            choice.ohms_trimmer = step * decade;
            break;
        }
    }
    if (choice.ohms_trimmer < smallestTrimmer_ohm) {
        choice.trimPractical = false;
        choice.trimNote =
            "no trim suggested: covering " +
            formatEngineering(choice.ohms_trim_range, 3, Unit::Ohm) +
            " (the trim with the part's " +
            formatEngineering(100.0 * eseriesTolerance(series), 2, Unit::Percent) +
            " tolerance) would take a trimmer below the smallest practical one (about " +
            formatEngineering(smallestTrimmer_ohm, 2, Unit::Ohm) +
            "); select the part by measurement, or trim elsewhere in the circuit";
    }
    return choice;
}

Dissipation dissipation(double ohms, double amps_fs, double watts_rating, double derating,
                        double volts_rating) {
    if (!std::isfinite(ohms) || ohms < 0.0 || !std::isfinite(amps_fs)) {
        throw std::domain_error("dissipation: resistance must be >= 0 Ω and current finite");
    }
    if (!(watts_rating > 0.0) || !(derating > 0.0 && derating <= 1.0) || !(volts_rating > 0.0)) {
        throw std::domain_error("dissipation: ratings must be > 0 W and > 0 V and the derating "
                                "in (0, 1]");
    }
    Dissipation d;
    d.watts_fs = amps_fs * amps_fs * ohms;
    const double amps_over = kOverrangeFactor * amps_fs;
    d.watts_overrange = amps_over * amps_over * ohms;
    d.volts_fs = std::fabs(amps_fs) * ohms;
    d.volts_overrange = std::fabs(amps_over) * ohms;
    d.watts_rating = watts_rating;
    d.volts_rating = volts_rating;
    d.aboveDeratedRating = d.watts_overrange > watts_rating * derating;
    d.overRating = d.watts_overrange > watts_rating;
    d.overVoltageRating = d.volts_overrange > volts_rating;
    return d;
}

std::optional<std::string> ratingCaution(const Dissipation& heat, std::string_view part) {
    const std::string name(part);
    const auto w = [](double watts) {
        return formatEngineering(watts, 3, Unit::Watt);
    };
    const auto v = [](double volts) {
        return formatEngineering(volts, 3, Unit::Volt);
    };
    std::string text;
    if (heat.overRating) {
        text = "OVER the power rating: " + name + " dissipates " + w(heat.watts_fs) +
               " at full scale and " + w(heat.watts_overrange) + " at 120 % of range, against a " +
               w(heat.watts_rating) + " rating; choose a part rated at least " +
               w(heat.watts_overrange / kTypicalDerating) + ".";
    } else if (heat.aboveDeratedRating) {
        text = "Above the derated power: " + name + " dissipates " + w(heat.watts_overrange) +
               " at 120 % of range, more than half of its " + w(heat.watts_rating) +
               " rating (common practice: run at half the rating).";
    }
    if (heat.overVoltageRating) {
        text += std::string(text.empty() ? "" : " ") + "OVER the voltage rating: " + name +
                " has " + v(heat.volts_overrange) + " across it at 120 % of range (" +
                v(heat.volts_fs) + " at full scale), against a working voltage of " +
                v(heat.volts_rating) +
                "; build it from resistors in series, each within its "
                "rating.";
    }
    return text.empty() ? std::nullopt : std::optional<std::string>(text);
}

} // namespace mw
