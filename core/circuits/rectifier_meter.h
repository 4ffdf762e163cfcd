// Rectifier AC voltmeters (half-wave with reverse-path diode, full-wave bridge) and the plain DC
// voltmeter, with ideal diodes in closed form or Shockley diodes solved over a period.
#pragma once

#include "core/circuits/diode.h"
#include "core/circuits/waveform.h"

#include <limits>
#include <optional>
#include <string_view>
#include <vector>

namespace mw {

enum class Rectifier { None, HalfWave, Bridge };

std::string_view rectifierName(Rectifier rectifier); // "none", "half", "bridge"

// Source → multiplier → rectifier → movement (optionally shunted by a resistor).
// Half-wave: the series diode feeds the movement on positive half-cycles; the reverse-path
// diode, from the return to the multiplier's end, carries the negative half-cycles past it.
// Bridge: four identical diodes, two in series with the movement on either half-cycle.
struct RectifierCircuit {
    Rectifier rectifier = Rectifier::Bridge;
    double movement_amps_fs = 0.0;
    double movement_ohms = 0.0;
    double multiplier_ohms = 0.0;
    double shunt_ohms = std::numeric_limits<double>::infinity(); // across the movement; ∞ = none
};

// Throws std::invalid_argument naming the field that is out of range.
void validate(const RectifierCircuit& circuit);

// Movement in parallel with its shunt resistor, as the rectifier sees it.
double loadOhms(const RectifierCircuit& circuit);
// Current the rectifier must deliver for full-scale movement current (I_fs·R_m/R_load).
double fullScaleLoadAmps(const RectifierCircuit& circuit);

// Textbook ideal diodes: no drop, no reverse current, optionally a linear forward resistance.
struct IdealDiodes {
    double forward_ohms = 0.0;
};

// Quadrature settings for Shockley diodes. The circuit has no storage elements, so the movement
// current follows the input instant by instant; the period average is taken with the periodic
// trapezoidal rule, doubling the samples until two successive averages agree within
// `relative_tolerance` (a square wave is exact with its two levels, a sampled waveform exact at
// its samples). Sine and triangle are sampled over a quarter period and mirrored. For the sine
// the integrand is smooth and periodic, so the rule converges faster than geometrically and
// the error left is far below the last change (1e-6 asked → about 1e-9 found against 2^17
// samples); the triangle's corners are handled by Richardson extrapolation (Romberg). Running out
// of `max_samples` throws; an unconverged figure is never returned.
struct AveragingOptions {
    double relative_tolerance = 1e-6;
    int first_samples = 64;
    int max_samples = 1 << 18;
};

struct InstantSolution {
    double movement_amps = 0.0; // through the movement, positive in the scale direction
    double source_amps = 0.0;   // through the multiplier
};

struct PeriodAverage {
    double movement_amps = 0.0;       // average movement current over one period
    double multiplier_rms_amps = 0.0; // true rms current in the multiplier
    int samples = 0;                  // samples per period used (0: closed form)
};

// Operating temperatures at which the Shockley model with SPICE level-1 temperature scaling is
// taken as meaningful for the rectifier's diodes: −55 °C … +150 °C, the junction range silicon
// small-signal diode data sheets commonly state (common practice; figures from memory). Outside
// it the preset parameters and the XTI/EG scaling are extrapolated beyond what they describe.
inline constexpr double kDiodeModelMinCelsius = -55.0;
inline constexpr double kDiodeModelMaxCelsius = 150.0;

class RectifierMeter {
public:
    RectifierMeter(const RectifierCircuit& circuit, IdealDiodes ideal);
    // Throws std::invalid_argument when `celsius` lies outside kDiodeModelMinCelsius …
    // kDiodeModelMaxCelsius, saying why.
    RectifierMeter(const RectifierCircuit& circuit, const DiodeParameters& diode, double celsius);

    const RectifierCircuit& circuit() const { return circuit_; }
    bool hasIdealDiodes() const { return !diode_.has_value(); }
    double idealForwardOhms() const { return ideal_.forward_ohms; }
    RectifierMeter withMultiplier(double ohms) const;

    // Static transfer at one instantaneous source voltage (Newton with a bracket; throws if a
    // solve does not converge).
    InstantSolution solveAt(double volts) const;

    PeriodAverage average(const Waveform& waveform, const AveragingOptions& options = {}) const;
    // Fixed number of trapezoid samples per period (used where an objective must be smooth).
    PeriodAverage averageWithSamples(const Waveform& waveform, int samples) const;

    // Ideal-diode closed form: the movement current average from the waveform's mean, rectified
    // average or half-wave average over the total series resistance.
    double idealAverageMovementAmps(const Waveform& waveform) const;

private:
    struct Branch;
    struct Sample {
        double volts = 0.0;
        double parameter_amps = 0.0; // current of the forward-conducting diode
        InstantSolution solution;
    };
    struct GridPoint {
        Sample up;   // at the waveform's value
        Sample down; // at its negative, for the mirrored half of a symmetric waveform
    };
    struct Grid;
    struct Sums {
        double movement_amps = 0.0;       // weighted sum of movement currents
        double source_square_amps2 = 0.0; // weighted sum of squared multiplier currents
    };
    Sample solveSample(double volts, double start_amps) const;
    Branch evaluate(double volts_sign, double parameter_amps) const;
    void solvePoint(const Grid& grid, double phase, const GridPoint* left, const GridPoint* right,
                    GridPoint& point) const;
    void addPoint(const Grid& grid, const GridPoint& point, double weight, Sums& sums) const;
    std::vector<GridPoint> firstLevel(const Grid& grid, int n, Sums& sums) const;
    std::vector<GridPoint> refineLevel(const Grid& grid, const std::vector<GridPoint>& level, int n,
                                       Sums& sums) const;
    PeriodAverage trapezoid(const Waveform& waveform, int samples, double relative_tolerance,
                            int max_samples) const;
    PeriodAverage exactLevels(const Waveform& waveform) const;
    double idealSeriesOhms() const;
    InstantSolution idealAt(double volts) const;

    RectifierCircuit circuit_;
    IdealDiodes ideal_;
    std::optional<Diode> diode_;
};

} // namespace mw
