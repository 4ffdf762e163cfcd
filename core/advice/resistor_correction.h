// Resistor work that follows from a span error: the multiplier or shunt value that nulls it,
// and the deviation of a measured resistor from its computed value.
#pragma once

namespace mw {

// For a voltmeter whose indication is spanFactor × true (multiplier R_s in series with the
// movement R_m): the current is (R_s + R_m)/(R'_s + R_m) times larger with R'_s, so
// R'_s = spanFactor · (R_s + R_m) − R_m nulls the span error.
double correctedMultiplierOhms(double multiplierOhms, double movementOhms, double spanFactor);

// For an ammeter with shunt R_sh across the movement R_m: the movement carries the fraction
// q = R_sh/(R_sh + R_m) of the current; q' = q / spanFactor nulls the span error, so
// R'_sh = R_m · q' / (1 − q').
double correctedShuntOhms(double shuntOhms, double movementOhms, double spanFactor);

// The nearest standard value and the trim to reach a corrected value come from
// chooseResistor() in core/circuits/eseries.h.

struct ResistorDeviation {
    double deviationPercent = 0.0; // (measured − computed) / computed × 100
    bool withinTolerance = false;  // |deviation| ≤ tolerance
};

// Throws std::invalid_argument for a non-positive computed value or negative tolerance.
ResistorDeviation compareResistor(double computedOhms, double measuredOhms,
                                  double tolerancePercent);

} // namespace mw
