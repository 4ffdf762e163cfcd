// Error across the scale of a rectifier voltmeter range with its multiplier designed.
#include "core/circuits/scale_error_curve.h"

#include "core/circuits/rectifier_design.h"

#include <array>
#include <cmath>
#include <stdexcept>

namespace mw {
namespace {

constexpr std::array<double, 25> kFractions{0.0,  0.01, 0.02, 0.03, 0.05, 0.075, 0.1,  0.15, 0.2,
                                            0.25, 0.3,  0.35, 0.4,  0.45, 0.5,   0.55, 0.6,  0.65,
                                            0.7,  0.75, 0.8,  0.85, 0.9,  0.95,  1.0};

// Error in % of the range of a sine of `fraction` × range on `meter`.
double errorPercent(const RectifierMeter& meter, double range, double fraction) {
    const double applied = fraction * range;
    const Indication shown =
        predictIndication(meter, range, Waveform::withRms(WaveShape::Sine, applied));
    return (shown.indicated - applied) / range * 100.0;
}

} // namespace

std::span<const double> defaultScaleFractions() {
    return kFractions;
}

ScaleErrorCurve rectifierScaleErrorCurve(const RectifierMeter& meter, double range_volts_rms,
                                         std::span<const double> fractions) {
    if (meter.circuit().rectifier == Rectifier::None) {
        throw std::invalid_argument("a DC voltmeter has no rectifier, so no diode curve");
    }
    for (const double fraction : fractions) {
        if (!(fraction >= 0.0 && fraction <= 1.0)) {
            throw std::invalid_argument("a point of the scale curve lies outside 0 … 100 % of "
                                        "the range");
        }
    }
    ScaleErrorCurve curve;
    curve.range_volts_rms = range_volts_rms;
    curve.multiplier_ohms = solveMultiplier(meter, range_volts_rms).multiplier_ohms;
    const RectifierMeter designed = meter.withMultiplier(curve.multiplier_ohms);
    const RectifierMeter ideal(meter.circuit(), IdealDiodes{});
    curve.ideal_multiplier_ohms = solveMultiplier(ideal, range_volts_rms).multiplier_ohms;
    const RectifierMeter idealDesigned = ideal.withMultiplier(curve.ideal_multiplier_ohms);
    curve.fractions.assign(fractions.begin(), fractions.end());
    for (const double fraction : fractions) {
        curve.error_percent.push_back(errorPercent(designed, range_volts_rms, fraction));
        curve.ideal_error_percent.push_back(errorPercent(idealDesigned, range_volts_rms, fraction));
    }
    return curve;
}

ScaleErrorCurve rectifierScaleErrorCurve(const RectifierMeter& meter, double range_volts_rms) {
    return rectifierScaleErrorCurve(meter, range_volts_rms, defaultScaleFractions());
}

} // namespace mw
