// Resistor selection from the IEC 60063 preferred-number series E6 ... E192: nearest value,
// trimmer needed, dissipation at full scale and at 120 % overrange.
#pragma once

#include <optional>
#include <span>
#include <string_view>

namespace mw {

enum class ESeries { E6, E12, E24, E48, E96, E192 };

std::optional<ESeries> eseriesFromText(std::string_view text); // "E96", "e96"
std::string_view toText(ESeries series);

// The values of one decade as integers (E24: 10 ... 91; E96: 100 ... 976), IEC 60063:2015
// Tables 1 and 2.
std::span<const int> eseriesDecade(ESeries series);

// Usual tolerance paired with the series (E6 20 %, E12 10 %, E24 5 %, E48 2 %, E96 1 %,
// E192 0.5 %) as a fraction.
double eseriesTolerance(ESeries series);

// The largest standard value not above `ohms` (so a trimmer in series can only add). Throws
// std::domain_error for values that are not positive and finite.
double nearestNotAbove(double ohms, ESeries series);

// The standard value nearest to `ohms` by absolute difference; a tie goes to the value nearer
// on a logarithmic scale (the larger one).
double nearestStandard(double ohms, ESeries series);

struct ResistorChoice {
    double ohms_wanted = 0.0;
    double ohms_standard = 0.0;   // nearest not above
    double ohms_trim = 0.0;       // to add in series at nominal values
    double ohms_trim_range = 0.0; // to add when the fixed part is at its lower tolerance limit
    double ohms_trimmer = 0.0;    // smallest 1-2-5 trimmer covering ohms_trim_range
};

ResistorChoice chooseResistor(double ohms, ESeries series);

struct Dissipation {
    double watts_fs = 0.0;        // I_fs² R
    double watts_overrange = 0.0; // at 120 % of full-scale current (1.44 x)
    double volts_overrange = 0.0; // across the resistor at 120 %
    double watts_rating = 0.0;
    bool exceedsRating = false; // overrange dissipation above rating x derating
};

// Common practice: 0.25 W parts (0207 metal film) run at no more than half their rating.
inline constexpr double kTypicalRating_W = 0.25;
inline constexpr double kTypicalDerating = 0.5;
inline constexpr double kOverrangeFactor = 1.2;

// Dissipation of a resistor carrying `amps_fs` at full scale.
Dissipation dissipation(double ohms, double amps_fs, double watts_rating = kTypicalRating_W,
                        double derating = kTypicalDerating);

} // namespace mw
