// The indication error a rectifier voltmeter range shows across its scale once its multiplier
// is designed: the low-scale loss of real diodes beside the straight line of ideal ones, as the
// series the range designer's chart draws.
#pragma once

#include "core/circuits/rectifier_meter.h"

#include <span>
#include <vector>

namespace mw {

// Shares of the range the curve is taken at: dense at the bottom of the scale, where the
// diodes' knee bends it, then every 5 % up to full scale.
std::span<const double> defaultScaleFractions();

struct ScaleErrorCurve {
    double range_volts_rms = 0.0;
    double multiplier_ohms = 0.0;       // solved for the meter's own diodes
    double ideal_multiplier_ohms = 0.0; // solved for ideal diodes (no drop, no forward resistance)
    std::vector<double> fractions;      // applied sine, as a share of the range
    // Error of indication in % of the range, (indicated − applied) / range × 100, at each
    // fraction: the meter's diodes, and ideal diodes each with their own designed multiplier.
    std::vector<double> error_percent;
    std::vector<double> ideal_error_percent;
};

// Designs the multiplier of `meter` (its own one is ignored) so that a sine of
// `range_volts_rms` reads full scale, likewise for ideal diodes in the same circuit, and
// predicts both meters' indications of a sine at each fraction of the range
// (predictIndication of core/circuits/rectifier_design.h). Throws std::domain_error when the
// range is too low for the movement and diodes, std::invalid_argument for a DC meter (it has
// no rectifier) or a fraction outside 0 … 1.
ScaleErrorCurve rectifierScaleErrorCurve(const RectifierMeter& meter, double range_volts_rms,
                                         std::span<const double> fractions);
ScaleErrorCurve rectifierScaleErrorCurve(const RectifierMeter& meter, double range_volts_rms);

} // namespace mw
