// DC voltmeter design: multiplier resistors, multi-range series chains, input resistance and
// the loading error on a source with Thevenin resistance.
#pragma once

#include "core/circuits/movement.h"

#include <span>
#include <vector>

namespace mw {

// Multiplier for one range: R_s = V / I_fs - R_m. Throws std::domain_error when the range is not
// above the movement's own full-scale drop I_fs·R_m.
double multiplier_ohm(const Movement& movement, double volts_range);

// Individual multipliers, one per range, each switched alone in series with the movement.
std::vector<double> multipliers_ohm(const Movement& movement, std::span<const double> volts_ranges);

// Series-chain (string) multiplier: ranges in ascending order; section 0 sits next to the
// movement and gives the lowest range; section i is added for range i, so
// section i = (V_i - V_{i-1}) / I_fs. Throws std::domain_error for ranges not strictly ascending.
std::vector<double> seriesChain_ohm(const Movement& movement, std::span<const double> volts_ranges);

// Voltmeter input resistance on a range: R_v = V / I_fs = S·V.
double voltmeterResistance_ohm(const Movement& movement, double volts_range);

struct LoadedReading {
    double volts_reading = 0.0;  // what the meter shows
    double error_fraction = 0.0; // (reading - true) / true, negative: the meter reads low
};

// Reading of a voltmeter of resistance R_v across a source whose open-circuit (true) voltage is
// volts_true behind a Thevenin resistance R_th: reading = true × R_v / (R_v + R_th).
LoadedReading loadedReading(double volts_true, double ohms_meter, double ohms_thevenin);

} // namespace mw
