// Resistor selection from the IEC 60063 preferred-number series E6 ... E192: nearest value,
// trimmer needed, dissipation and voltage at full scale and at 120 % overrange against the
// part's power and working-voltage ratings.
#pragma once

#include <optional>
#include <span>
#include <string>
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

// Trimmers are made from about 10 Ω up (common practice, from memory: cermet trimmer
// potentiometers start at 10 Ω); a trim that only a smaller one could cover is not suggested.
inline constexpr double kSmallestPracticalTrimmer_ohm = 10.0;

struct ResistorChoice {
    double ohms_wanted = 0.0;
    double ohms_standard = 0.0;   // nearest not above
    double ohms_trim = 0.0;       // to add in series at nominal values
    double ohms_trim_range = 0.0; // to add when the fixed part is at its lower tolerance limit
    double ohms_trimmer = 0.0;    // smallest 1-2-5 trimmer covering ohms_trim_range
    // False when that trimmer would be below kSmallestPracticalTrimmer_ohm: the trim is then
    // not a suggestion anyone can build, and trimNote says why and what to do instead.
    bool trimPractical = true;
    std::string trimNote;
};

ResistorChoice chooseResistor(double ohms, ESeries series,
                              double smallestTrimmer_ohm = kSmallestPracticalTrimmer_ohm);

struct Dissipation {
    double watts_fs = 0.0;        // I_fs² R
    double watts_overrange = 0.0; // at 120 % of full-scale current (1.44 x)
    double volts_fs = 0.0;        // across the resistor at full scale
    double volts_overrange = 0.0; // across the resistor at 120 %
    double watts_rating = 0.0;
    double volts_rating = 0.0;
    bool aboveDeratedRating = false; // overrange dissipation above rating x derating
    bool overRating = false;         // overrange dissipation above the rating itself
    bool overVoltageRating = false;  // overrange voltage above the working-voltage rating
};

// Common practice: 0.25 W parts (0207 metal film) run at no more than half their rating.
inline constexpr double kTypicalRating_W = 0.25;
inline constexpr double kTypicalDerating = 0.5;
inline constexpr double kOverrangeFactor = 1.2;
// Largest working voltage of such a part: 250 V is typical of a 0.25 W film resistor (common
// practice, from memory; makers state 200 V to 350 V by size and series). A multiplier that
// sees more is built from several resistors in series.
inline constexpr double kTypicalVoltageRating_V = 250.0;

// Dissipation of a resistor carrying `amps_fs` (DC or rms) at full scale, and the voltage
// across it, against its ratings.
Dissipation dissipation(double ohms, double amps_fs, double watts_rating = kTypicalRating_W,
                        double derating = kTypicalDerating,
                        double volts_rating = kTypicalVoltageRating_V);

// The caution for `part` ("the multiplier", "the shunt") when it is over its power or voltage
// rating, or above the derated power; none when it is within them.
std::optional<std::string> ratingCaution(const Dissipation& heat, std::string_view part);

} // namespace mw
