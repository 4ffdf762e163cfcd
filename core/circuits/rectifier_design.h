// Range design for rectifier voltmeters: the multiplier that puts full scale exactly at the
// range, the indication predicted at any test point, and the AC sensitivity.
#pragma once

#include "core/circuits/rectifier_meter.h"
#include "core/circuits/waveform.h"

#include <span>
#include <vector>

namespace mw {

// Rectified average per rms of `shape` as the rectifier sees it: the sine gives 2√2/π (bridge)
// and √2/π (half-wave); a DC voltmeter (Rectifier::None) reads the mean, 1 per volt.
double averagePerRms(Rectifier rectifier, WaveShape shape = WaveShape::Sine);

// Ideal-diode multiplier: R_s = k·V/I_load − R_load − (diodes in the path)·R_f, where k is the
// rectified average per rms (the textbook uses 0.45 / 0.9 for the sine). The circuit's own
// multiplier value is ignored. Throws std::domain_error when the range is too low.
double idealMultiplierOhms(const RectifierCircuit& circuit, double range_volts_rms,
                           double average_per_rms, IdealDiodes ideal = {});

// AC sensitivity in ohms per volt: k / I_load, i.e. k times the DC ohms-per-volt of the
// (shunted) movement -- 0.9 × and 0.45 × for a sine (ideal diodes).
double acSensitivityOhmPerVolt(const RectifierCircuit& circuit, double average_per_rms);

struct MultiplierSolution {
    double multiplier_ohms = 0.0;
    double ideal_multiplier_ohms = 0.0;  // ideal diodes, exact average-per-rms factor
    double multiplier_rms_amps_fs = 0.0; // true rms current in the multiplier at full scale
    double movement_amps_at_range = 0.0; // check: equals I_fs within the tolerance
    int evaluations = 0;                 // period averages taken by the solve
};

// The multiplier for which a `shape` input of `range_volts_rms` (true rms) gives exactly full
// scale. Ideal diodes: closed form. Shockley diodes: a bracketed secant (Illinois) solve on the
// period-average movement current, to 1e-9 of the multiplier. Throws std::domain_error when
// the range is below what the diodes and the movement need with no multiplier at all.
MultiplierSolution solveMultiplier(const RectifierMeter& meter, double range_volts_rms,
                                   WaveShape shape = WaveShape::Sine);

struct Indication {
    double input_rms_volts = 0.0;
    double movement_amps = 0.0; // period average
    double indicated = 0.0;     // in the range's unit; scale marked in rms of a sine
    double error_percent_of_range = 0.0;
};

// Largest input, as a share of the range, that predictIndication() accepts. Beyond it the
// movement is overloaded: the pointer lies against its stop, so no indication exists to predict
// and the input is far more likely a wrong range or a typing slip. 150 % is our own choice, well
// above the 120 % overrange at which the resistor dissipation is checked (core/circuits/eseries.h).
inline constexpr double kMaxInputFractionOfRange = 1.5;

// What the meter shows for `input` on a scale that is linear in movement current and marked so
// that full-scale current reads `range`. For Rectifier::None the input's mean is the DC value.
// Throws std::invalid_argument when the input (rms; the mean for a DC voltmeter) or the
// movement current it drives exceeds kMaxInputFractionOfRange of the range or of I_fs.
Indication predictIndication(const RectifierMeter& meter, double range, const Waveform& input);

// A test plan of true-rms values of one shape (e.g. 0 %, 10 % … 100 % of range).
std::vector<Indication> predictTestPlan(const RectifierMeter& meter, double range,
                                        std::span<const double> points_rms, WaveShape shape);

} // namespace mw
