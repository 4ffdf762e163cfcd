// Rectifier voltmeter models: ideal diodes in closed form, Shockley diodes solved instant by
// instant with a bracketed Newton iteration, then averaged over the period.
#include "core/circuits/rectifier_meter.h"

#include "core/units/quantity.h"

#include <cmath>
#include <stdexcept>
#include <string>
#include <vector>

namespace mw {
namespace {

void requirePositive(double value, const char* what) {
    if (!std::isfinite(value) || !(value > 0.0)) {
        throw std::invalid_argument(std::string("rectifier meter: ") + what +
                                    " must be a finite value above 0");
    }
}

// Mean of max(v, 0)² over the period, for the multiplier's rms current with ideal diodes.
double positiveMeanSquare(const Waveform& waveform) {
    switch (waveform.shape()) {
    case WaveShape::Sine:
    case WaveShape::Square:
    case WaveShape::Triangle:
        return 0.5 * waveform.rms() * waveform.rms(); // symmetric: half the energy is positive
    case WaveShape::Sampled: {
        double sum = 0.0;
        for (double v : waveform.samplesVolts()) {
            sum += v > 0.0 ? v * v : 0.0;
        }
        return sum / static_cast<double>(waveform.samplesVolts().size());
    }
    case WaveShape::SineWithOffset:
        break;
    }
    constexpr int kSamples = 1 << 14; // kink only in the derivative: error of order 1e-9
    double sum = 0.0;
    for (int k = 0; k < kSamples; ++k) {
        const double v = waveform.valueAt(static_cast<double>(k) / kSamples);
        sum += v > 0.0 ? v * v : 0.0;
    }
    return sum / kSamples;
}

double diodeModelCelsius(double celsius) {
    if (!std::isfinite(celsius) || celsius < kDiodeModelMinCelsius ||
        celsius > kDiodeModelMaxCelsius) {
        throw std::invalid_argument(
            "rectifier meter: an operating temperature of " +
            formatEngineering(celsius, 4, Unit::DegreeCelsius) + " lies outside " +
            formatEngineering(kDiodeModelMinCelsius, 3, Unit::DegreeCelsius) + " … " +
            formatEngineering(kDiodeModelMaxCelsius, 3, Unit::DegreeCelsius) +
            ", the range in which the diode model's temperature scaling is meant to hold");
    }
    return celsius;
}

} // namespace

std::string_view rectifierName(Rectifier rectifier) {
    switch (rectifier) {
    case Rectifier::None:
        return "none";
    case Rectifier::HalfWave:
        return "half";
    case Rectifier::Bridge:
        return "bridge";
    }
    return "?";
}

void validate(const RectifierCircuit& circuit) {
    requirePositive(circuit.movement_amps_fs, "the movement's full-scale current");
    requirePositive(circuit.movement_ohms, "the movement's coil resistance");
    if (!std::isfinite(circuit.multiplier_ohms) || circuit.multiplier_ohms < 0.0) {
        throw std::invalid_argument(
            "rectifier meter: the multiplier resistance must be a finite value of 0 Ω or more");
    }
    if (!(circuit.shunt_ohms > 0.0)) {
        throw std::invalid_argument(
            "rectifier meter: the resistor across the movement must be above 0 Ω (∞ for none)");
    }
}

double loadOhms(const RectifierCircuit& circuit) {
    if (std::isinf(circuit.shunt_ohms)) {
        return circuit.movement_ohms;
    }
    return circuit.movement_ohms * circuit.shunt_ohms /
           (circuit.movement_ohms + circuit.shunt_ohms);
}

double fullScaleLoadAmps(const RectifierCircuit& circuit) {
    return circuit.movement_amps_fs * circuit.movement_ohms / loadOhms(circuit);
}

struct RectifierMeter::Branch {
    double volts = 0.0;  // |source voltage| that drives `parameter_amps`
    double dvolts = 0.0; // its derivative with respect to the parameter
    InstantSolution solution;
    InstantSolution dsolution; // derivatives of the solution with respect to the parameter
};

RectifierMeter::RectifierMeter(const RectifierCircuit& circuit, IdealDiodes ideal)
    : circuit_(circuit)
    , ideal_(ideal) {
    validate(circuit_);
    if (!std::isfinite(ideal.forward_ohms) || ideal.forward_ohms < 0.0) {
        throw std::invalid_argument(
            "rectifier meter: the ideal diodes' forward resistance must be 0 Ω or more");
    }
}

RectifierMeter::RectifierMeter(const RectifierCircuit& circuit, const DiodeParameters& diode,
                               double celsius)
    : circuit_(circuit)
    , diode_(Diode(diode, diodeModelCelsius(celsius))) {
    validate(circuit_);
}

RectifierMeter RectifierMeter::withMultiplier(double ohms) const {
    RectifierMeter copy = *this;
    copy.circuit_.multiplier_ohms = ohms;
    validate(copy.circuit_);
    return copy;
}

double RectifierMeter::idealSeriesOhms() const {
    const double diodes = circuit_.rectifier == Rectifier::Bridge     ? 2.0
                          : circuit_.rectifier == Rectifier::HalfWave ? 1.0
                                                                      : 0.0;
    return circuit_.multiplier_ohms + diodes * ideal_.forward_ohms + loadOhms(circuit_);
}

InstantSolution RectifierMeter::idealAt(double volts) const {
    double conducting = volts;
    if (circuit_.rectifier == Rectifier::HalfWave) {
        conducting = volts > 0.0 ? volts : 0.0;
    } else if (circuit_.rectifier == Rectifier::Bridge) {
        conducting = std::abs(volts);
    }
    const double load_amps = conducting / idealSeriesOhms();
    InstantSolution solution;
    solution.movement_amps = load_amps * loadOhms(circuit_) / circuit_.movement_ohms;
    solution.source_amps =
        circuit_.rectifier == Rectifier::Bridge ? volts / idealSeriesOhms() : load_amps;
    return solution;
}

double RectifierMeter::idealAverageMovementAmps(const Waveform& waveform) const {
    double volts = waveform.mean();
    if (circuit_.rectifier == Rectifier::HalfWave) {
        volts = waveform.halfWaveAverage();
    } else if (circuit_.rectifier == Rectifier::Bridge) {
        volts = waveform.rectifiedAverage();
    }
    return volts / idealSeriesOhms() * loadOhms(circuit_) / circuit_.movement_ohms;
}

RectifierMeter::Branch RectifierMeter::evaluate(double volts_sign, double p) const {
    const Diode& d = *diode_;
    const double load = loadOhms(circuit_);
    const double rs = circuit_.multiplier_ohms;
    Branch b;
    if (circuit_.rectifier == Rectifier::Bridge) {
        // p: current of each forward diode. With identical diodes the bridge balances so that
        // both forward diodes share voltage a and both reverse diodes share voltage
        // −(a + V_m); the reverse pair's current i_r then follows in closed form.
        const double a = d.voltageAt(p);
        const double da = d.resistanceAt(p);
        const double c = a + p * load;
        const double ir = d.currentAt(-c, load);
        const double dir = -d.conductanceAt(ir, load) * (da + load);
        const double vm = (p + ir) * load;
        b.volts = 2.0 * a + vm + rs * (p - ir);
        b.dvolts = 2.0 * da + (1.0 + dir) * load + rs * (1.0 - dir);
        b.solution.movement_amps = vm / circuit_.movement_ohms;
        b.solution.source_amps = volts_sign * (p - ir);
        b.dsolution.movement_amps = (1.0 + dir) * load / circuit_.movement_ohms;
        b.dsolution.source_amps = volts_sign * (1.0 - dir);
    } else if (volts_sign > 0.0) {
        // p: series-diode current; the reverse-path diode sees −V_A.
        const double va = d.voltageAt(p) + p * load;
        const double dva = d.resistanceAt(p) + load;
        const double i2 = d.currentAt(-va);
        const double di2 = -d.conductanceAt(i2) * dva;
        b.volts = va + rs * (p - i2);
        b.dvolts = dva + rs * (1.0 - di2);
        b.solution.movement_amps = p * load / circuit_.movement_ohms;
        b.solution.source_amps = p - i2;
        b.dsolution.movement_amps = load / circuit_.movement_ohms;
        b.dsolution.source_amps = 1.0 - di2;
    } else {
        // p: reverse-path diode current; the series diode and the movement see V_A = −a₂.
        const double a2 = d.voltageAt(p);
        const double da2 = d.resistanceAt(p);
        const double i1 = d.currentAt(-a2, load);
        const double di1 = -d.conductanceAt(i1, load) * da2;
        b.volts = a2 + rs * (p - i1);
        b.dvolts = da2 + rs * (1.0 - di1);
        b.solution.movement_amps = i1 * load / circuit_.movement_ohms;
        b.solution.source_amps = i1 - p;
        b.dsolution.movement_amps = di1 * load / circuit_.movement_ohms;
        b.dsolution.source_amps = di1 - 1.0;
    }
    return b;
}

RectifierMeter::Sample RectifierMeter::solveSample(double volts, double start_amps) const {
    Sample sample;
    sample.volts = volts;
    if (volts == 0.0) {
        return sample;
    }
    const double sign = volts > 0.0 ? 1.0 : -1.0;
    const double target = std::abs(volts);
    double lo = 0.0; // |v|(0) = 0 < target
    double hi = std::numeric_limits<double>::infinity();
    double p = start_amps > 0.0 ? start_amps : target / idealSeriesOhms();
    for (int iteration = 0; iteration < 400; ++iteration) {
        const Branch b = evaluate(sign, p);
        const double f = b.volts - target;
        (f > 0.0 ? hi : lo) = p;
        double next = p - f / b.dvolts;
        // Newton converges quadratically here (the bracket only guards the first steps): once a
        // step is below 1e-7 of the parameter, the next one would be below 1e-13, so the last
        // step is taken to first order on the solution instead of with another evaluation.
        const bool small_step = std::abs(next - p) <= 1e-7 * p && next > lo && next < hi;
        if (f == 0.0 || small_step || (std::isfinite(hi) && hi - lo <= 1e-15 * hi)) {
            const double step = small_step ? next - p : 0.0;
            sample.parameter_amps = p + step;
            sample.solution.movement_amps =
                b.solution.movement_amps + step * b.dsolution.movement_amps;
            sample.solution.source_amps = b.solution.source_amps + step * b.dsolution.source_amps;
            return sample;
        }
        if (!std::isfinite(next) || !(next > lo && next < hi)) {
            next = std::isinf(hi) ? 2.0 * p + 1e-12 : 0.5 * (lo + hi); // fall back to the bracket
        }
        p = next;
    }
    throw std::runtime_error("rectifier meter: the circuit equation did not converge at " +
                             formatEngineering(volts, 6, Unit::Volt));
}

InstantSolution RectifierMeter::solveAt(double volts) const {
    if (!std::isfinite(volts)) {
        throw std::invalid_argument("rectifier meter: the source voltage must be finite");
    }
    if (!diode_ || circuit_.rectifier == Rectifier::None) {
        return idealAt(volts);
    }
    return solveSample(volts, 0.0).solution;
}

// Sampling grid of the periodic trapezoidal rule. A sine or triangle repeats its first quarter
// period mirrored in time and in sign, so only phases 0 … 1/4 are solved (weights 1, 2 … 2, 1,
// each point standing for +v and −v); other shapes use the whole period with weight 1.
struct RectifierMeter::Grid {
    const Waveform& waveform;
    bool quarter = false;
    bool bridge = false;
};

void RectifierMeter::solvePoint(const Grid& grid, double phase, const GridPoint* left,
                                const GridPoint* right, GridPoint& point) const {
    const double volts = grid.waveform.valueAt(phase);
    // Neighbours on the same branch give the start: interpolated in voltage between two.
    auto start = [](const Sample* a, const Sample* b, double target_volts) {
        const bool use_a = a != nullptr && a->volts * target_volts > 0.0;
        const bool use_b = b != nullptr && b->volts * target_volts > 0.0;
        if (use_a && use_b && a->volts != b->volts) {
            const double t = (target_volts - a->volts) / (b->volts - a->volts);
            const double p = a->parameter_amps + t * (b->parameter_amps - a->parameter_amps);
            if (p > 0.0) {
                return p;
            }
        }
        return use_a ? a->parameter_amps : use_b ? b->parameter_amps : 0.0;
    };
    point.up =
        solveSample(volts, start(left ? &left->up : nullptr, right ? &right->up : nullptr, volts));
    if (grid.quarter && !grid.bridge) {
        point.down = solveSample(
            -volts, start(left ? &left->down : nullptr, right ? &right->down : nullptr, -volts));
    } else if (grid.quarter) {
        point.down = point.up; // the bridge answers −v as it answers +v
        point.down.volts = -volts;
        point.down.solution.source_amps = -point.up.solution.source_amps;
    }
}

void RectifierMeter::addPoint(const Grid& grid, const GridPoint& point, double weight,
                              Sums& sums) const {
    for (const Sample* sample : {&point.up, grid.quarter ? &point.down : nullptr}) {
        if (sample != nullptr) {
            sums.movement_amps += weight * sample->solution.movement_amps;
            sums.source_square_amps2 +=
                weight * sample->solution.source_amps * sample->solution.source_amps;
        }
    }
}

std::vector<RectifierMeter::GridPoint> RectifierMeter::firstLevel(const Grid& grid, int n,
                                                                  Sums& sums) const {
    // Quarter grid: phases 0, 1/n … 1/4 with weights 1, 2 … 2, 1; full grid: n points, weight 1.
    const int points = grid.quarter ? n / 4 + 1 : n;
    std::vector<GridPoint> level(static_cast<std::size_t>(points));
    for (int k = 0; k < points; ++k) {
        const auto i = static_cast<std::size_t>(k);
        solvePoint(grid, static_cast<double>(k) / n, k > 0 ? &level[i - 1] : nullptr, nullptr,
                   level[i]);
        const bool end = k == 0 || k == points - 1;
        addPoint(grid, level[i], grid.quarter && !end ? 2.0 : 1.0, sums);
    }
    return level;
}

std::vector<RectifierMeter::GridPoint>
RectifierMeter::refineLevel(const Grid& grid, const std::vector<GridPoint>& level, int n,
                            Sums& sums) const {
    // Keeps the old points and adds the midpoints, each started from both its neighbours.
    const std::size_t new_points = grid.quarter ? 2 * level.size() - 1 : 2 * level.size();
    std::vector<GridPoint> finer(new_points);
    for (std::size_t k = 0; k < level.size(); ++k) {
        finer[2 * k] = level[k];
    }
    for (std::size_t k = 1; k < new_points; k += 2) {
        const GridPoint* right = k + 1 < new_points ? &finer[k + 1] : &finer[0]; // wraps
        solvePoint(grid, static_cast<double>(k) / (2.0 * n), &finer[k - 1], right, finer[k]);
        addPoint(grid, finer[k], grid.quarter ? 2.0 : 1.0, sums);
    }
    return finer;
}

PeriodAverage RectifierMeter::trapezoid(const Waveform& waveform, int samples,
                                        double relative_tolerance, int max_samples) const {
    const Grid grid{waveform,
                    waveform.shape() == WaveShape::Sine || waveform.shape() == WaveShape::Triangle,
                    circuit_.rectifier == Rectifier::Bridge};
    if (grid.quarter && samples % (waveform.shape() == WaveShape::Triangle ? 8 : 4) != 0) {
        throw std::invalid_argument("rectifier meter: the samples per period must be a multiple "
                                    "of 4 for a sine and of 8 for a triangle");
    }
    // A triangle's integrand has corners at the peaks, so its trapezoid sums are extrapolated
    // (Richardson's step, as in Romberg's method, cancels the h² term); with a fixed count
    // that takes the sums at samples/2 and at samples.
    const bool richardson = waveform.shape() == WaveShape::Triangle;
    const bool fixed_richardson = richardson && !(relative_tolerance > 0.0);
    int n = fixed_richardson ? samples / 2 : samples;
    Sums sums;
    std::vector<GridPoint> level = firstLevel(grid, n, sums);
    const double floor_amps = 1e-3 * std::abs(idealAverageMovementAmps(waveform)) + 1e-300;
    Sums coarse{sums.movement_amps / n, sums.source_square_amps2 / n};
    Sums answer = coarse;
    for (bool more = fixed_richardson || relative_tolerance > 0.0; more;) {
        if (2 * n > max_samples) {
            throw std::runtime_error("rectifier meter: the period average did not settle within "
                                     "the tolerance at " +
                                     std::to_string(n) + " samples per period");
        }
        level = refineLevel(grid, level, n, sums);
        n *= 2;
        const Sums fine{sums.movement_amps / n, sums.source_square_amps2 / n};
        const double previous = answer.movement_amps;
        answer = fine;
        if (richardson) {
            answer.movement_amps += (fine.movement_amps - coarse.movement_amps) / 3.0;
            answer.source_square_amps2 +=
                (fine.source_square_amps2 - coarse.source_square_amps2) / 3.0;
        }
        // Plain sums: compare the two trapezoid sums; extrapolated: two extrapolations (the
        // first has nothing to compare with).
        const bool comparable = !richardson || n >= 4 * samples;
        const double change = answer.movement_amps - (richardson ? previous : coarse.movement_amps);
        more = !fixed_richardson &&
               !(comparable &&
                 std::abs(change) <=
                     relative_tolerance * std::max(std::abs(answer.movement_amps), floor_amps));
        coarse = fine;
    }
    PeriodAverage result;
    result.movement_amps = answer.movement_amps;
    result.multiplier_rms_amps = std::sqrt(answer.source_square_amps2);
    result.samples = n;
    return result;
}

PeriodAverage RectifierMeter::averageWithSamples(const Waveform& waveform, int samples) const {
    if (!diode_ || circuit_.rectifier == Rectifier::None) {
        return average(waveform);
    }
    if (waveform.shape() == WaveShape::Sampled || waveform.shape() == WaveShape::Square) {
        return exactLevels(waveform);
    }
    if (samples < 4) {
        throw std::invalid_argument("rectifier meter: at least 4 samples per period are needed");
    }
    return trapezoid(waveform, samples, 0.0, samples);
}

PeriodAverage RectifierMeter::average(const Waveform& waveform,
                                      const AveragingOptions& options) const {
    if (!diode_ || circuit_.rectifier == Rectifier::None) {
        PeriodAverage result;
        result.movement_amps = idealAverageMovementAmps(waveform);
        const double mean_square = circuit_.rectifier == Rectifier::HalfWave
                                       ? positiveMeanSquare(waveform)
                                       : waveform.rms() * waveform.rms();
        result.multiplier_rms_amps = std::sqrt(mean_square) / idealSeriesOhms();
        return result;
    }
    if (waveform.shape() == WaveShape::Sampled || waveform.shape() == WaveShape::Square) {
        return exactLevels(waveform);
    }
    if (!(options.relative_tolerance > 0.0) || options.first_samples < 4 ||
        options.first_samples % 4 != 0) {
        throw std::invalid_argument("rectifier meter: averaging needs a tolerance above 0 and a "
                                    "first sample count that is a multiple of 4");
    }
    return trapezoid(waveform, options.first_samples, options.relative_tolerance,
                     options.max_samples);
}

PeriodAverage RectifierMeter::exactLevels(const Waveform& waveform) const {
    // A square wave is two levels and a record is its samples: the mean over them is exact.
    std::vector<double> volts = waveform.samplesVolts();
    if (waveform.shape() == WaveShape::Square) {
        volts = {waveform.peakVolts(), -waveform.peakVolts()};
    }
    PeriodAverage result;
    for (double v : volts) {
        const InstantSolution s = solveSample(v, 0.0).solution;
        result.movement_amps += s.movement_amps;
        result.multiplier_rms_amps += s.source_amps * s.source_amps;
    }
    const auto n = static_cast<double>(volts.size());
    result.movement_amps /= n;
    result.multiplier_rms_amps = std::sqrt(result.multiplier_rms_amps / n);
    result.samples = static_cast<int>(volts.size());
    return result;
}

} // namespace mw
