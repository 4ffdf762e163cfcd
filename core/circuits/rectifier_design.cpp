// Multiplier design and indication prediction for rectifier voltmeters.
#include "core/circuits/rectifier_design.h"

#include "core/units/quantity.h"

#include <cmath>
#include <stdexcept>
#include <string>

namespace mw {
namespace {

double requireRange(double range_volts) {
    if (!std::isfinite(range_volts) || !(range_volts > 0.0)) {
        throw std::invalid_argument("rectifier design: the range must be a finite value above 0");
    }
    return range_volts;
}

double diodesInPath(Rectifier rectifier) {
    return rectifier == Rectifier::Bridge ? 2.0 : rectifier == Rectifier::HalfWave ? 1.0 : 0.0;
}

// Safeguarded secant on the conductance x = 1/(R + R_load), in which the period-average current
// is close to proportional: with a constant diode drop the first step, x·I_fs/I(x), is already
// exact. The bracket starts as (0, 1/R_load]: no current at x = 0, no multiplier at the top,
// which is evaluated only if a step reaches it (then a shortfall means the range is too low).
template <typename F>
double solveConductance(F&& excess_amps, double x0, double f0, double load_ohms, double target_amps,
                        int& evaluations) {
    const double x_top = 1.0 / load_ohms;
    double x_under = 0.0; // f < 0 known
    double x_over = x_top;
    bool over_known = false;
    auto keep = [&](double x, double f) {
        if (f < 0.0) {
            x_under = std::max(x_under, x);
        } else {
            x_over = x;
            over_known = true;
        }
    };
    keep(x0, f0);
    double x_previous = x0;
    double f_previous = f0;
    double x = x0 * target_amps / (f0 + target_amps);
    for (int iteration = 0; iteration < 100; ++iteration) {
        if (x >= x_over) {
            x = over_known ? 0.5 * (x_under + x_over) : x_top;
        } else if (x <= x_under || !std::isfinite(x)) {
            x = 0.5 * (x_under + x_over);
        }
        const double f = excess_amps(1.0 / x - load_ohms);
        ++evaluations;
        if (x == x_top && f < 0.0) {
            throw std::domain_error(
                "rectifier design: the range is too low for the diodes: with no multiplier the "
                "movement reaches only " +
                formatEngineering(100.0 * (f + target_amps) / target_amps, 3) + " % of full scale");
        }
        keep(x, f);
        if (std::abs(f) <= 1e-12 * target_amps || std::abs(x - x_previous) <= 1e-11 * x) {
            return 1.0 / x - load_ohms;
        }
        const double next = x - f * (x - x_previous) / (f - f_previous);
        x_previous = x;
        f_previous = f;
        x = next;
    }
    throw std::runtime_error("rectifier design: the multiplier solve did not converge");
}

// Real diodes: the sample count is chosen once, adaptively, at the ideal multiplier and then
// held, so that the objective is a smooth function of the multiplier.
MultiplierSolution solveShockleyMultiplier(const RectifierMeter& meter, const Waveform& input,
                                           MultiplierSolution solution) {
    const RectifierCircuit& circuit = meter.circuit();
    const double load_ohms = loadOhms(circuit);
    const double target_amps = circuit.movement_amps_fs;
    const double ideal_ohms = solution.ideal_multiplier_ohms;
    const PeriodAverage first = meter.withMultiplier(ideal_ohms).average(input);
    const int samples = first.samples;
    auto excess = [&](double ohms) {
        return meter.withMultiplier(ohms).averageWithSamples(input, samples).movement_amps -
               target_amps;
    };
    solution.evaluations = 1;
    solution.multiplier_ohms =
        solveConductance(excess, 1.0 / (ideal_ohms + load_ohms), first.movement_amps - target_amps,
                         load_ohms, target_amps, solution.evaluations);
    const PeriodAverage check =
        meter.withMultiplier(solution.multiplier_ohms).averageWithSamples(input, samples);
    ++solution.evaluations;
    solution.multiplier_rms_amps_fs = check.multiplier_rms_amps;
    solution.movement_amps_at_range = check.movement_amps;
    return solution;
}
} // namespace

double averagePerRms(Rectifier rectifier, WaveShape shape) {
    if (rectifier == Rectifier::None) {
        return 1.0;
    }
    const Waveform unit = Waveform::withRms(shape, 1.0);
    return rectifier == Rectifier::Bridge ? unit.rectifiedAverage() : unit.halfWaveAverage();
}

double idealMultiplierOhms(const RectifierCircuit& circuit, double range_volts_rms,
                           double average_per_rms, IdealDiodes ideal) {
    RectifierCircuit checked = circuit;
    checked.multiplier_ohms = 0.0;
    validate(checked);
    requireRange(range_volts_rms);
    const double total_ohms = average_per_rms * range_volts_rms / fullScaleLoadAmps(circuit);
    const double fixed_ohms =
        loadOhms(circuit) + diodesInPath(circuit.rectifier) * ideal.forward_ohms;
    if (total_ohms < fixed_ohms) {
        throw std::domain_error(
            "rectifier design: a range of " + formatEngineering(range_volts_rms, 4, Unit::Volt) +
            " is below what the movement itself needs (" +
            formatEngineering(fixed_ohms * fullScaleLoadAmps(circuit) / average_per_rms, 4,
                              Unit::Volt) +
            "); no multiplier can make it");
    }
    return total_ohms - fixed_ohms;
}

double acSensitivityOhmPerVolt(const RectifierCircuit& circuit, double average_per_rms) {
    RectifierCircuit checked = circuit;
    checked.multiplier_ohms = 0.0;
    validate(checked);
    return average_per_rms / fullScaleLoadAmps(circuit);
}

MultiplierSolution solveMultiplier(const RectifierMeter& meter, double range_volts_rms,
                                   WaveShape shape) {
    const RectifierCircuit& circuit = meter.circuit();
    const double k = averagePerRms(circuit.rectifier, shape);
    MultiplierSolution solution;
    solution.ideal_multiplier_ohms = idealMultiplierOhms(circuit, range_volts_rms, k);
    const Waveform input = circuit.rectifier == Rectifier::None
                               ? Waveform::sineWithOffset(0.0, range_volts_rms)
                               : Waveform::withRms(shape, range_volts_rms);
    if (meter.hasIdealDiodes() || circuit.rectifier == Rectifier::None) {
        solution.multiplier_ohms =
            idealMultiplierOhms(circuit, range_volts_rms, k, {meter.idealForwardOhms()});
        const PeriodAverage check = meter.withMultiplier(solution.multiplier_ohms).average(input);
        solution.multiplier_rms_amps_fs = check.multiplier_rms_amps;
        solution.movement_amps_at_range = check.movement_amps;
        return solution;
    }
    return solveShockleyMultiplier(meter, input, solution);
}

Indication predictIndication(const RectifierMeter& meter, double range, const Waveform& input) {
    requireRange(range);
    Indication indication;
    const bool dc = meter.circuit().rectifier == Rectifier::None;
    indication.input_rms_volts = dc ? input.mean() : input.rms();
    const double input_fraction = std::abs(indication.input_rms_volts) / range;
    if (!(input_fraction <= kMaxInputFractionOfRange)) {
        throw std::invalid_argument(
            "rectifier design: an input of " +
            formatEngineering(indication.input_rms_volts, 4, Unit::Volt) + " is " +
            formatEngineering(100.0 * input_fraction, 4, Unit::Percent) + " of the " +
            formatEngineering(range, 4, Unit::Volt) +
            " range; the movement would be overloaded (predictions stop at " +
            formatEngineering(100.0 * kMaxInputFractionOfRange, 3, Unit::Percent) + ")");
    }
    indication.movement_amps = meter.average(input).movement_amps;
    // A waveform the scale is not marked for (a square on a sine-marked scale) can drive more
    // current than its rms suggests.
    const double amps_fs = meter.circuit().movement_amps_fs;
    if (std::abs(indication.movement_amps) > kMaxInputFractionOfRange * amps_fs) {
        throw std::invalid_argument(
            "rectifier design: an input of " +
            formatEngineering(indication.input_rms_volts, 4, Unit::Volt) + " drives " +
            formatEngineering(indication.movement_amps, 4, Unit::Ampere) +
            " through the movement, " +
            formatEngineering(100.0 * std::abs(indication.movement_amps) / amps_fs, 4,
                              Unit::Percent) +
            " of its full-scale current; the movement would be overloaded");
    }
    indication.indicated = indication.movement_amps / meter.circuit().movement_amps_fs * range;
    indication.error_percent_of_range =
        (indication.indicated - indication.input_rms_volts) / range * 100.0;
    return indication;
}

std::vector<Indication> predictTestPlan(const RectifierMeter& meter, double range,
                                        std::span<const double> points_rms, WaveShape shape) {
    std::vector<Indication> plan;
    plan.reserve(points_rms.size());
    for (double rms : points_rms) {
        const Waveform input = meter.circuit().rectifier == Rectifier::None
                                   ? Waveform::sineWithOffset(0.0, rms)
                                   : Waveform::withRms(shape, std::abs(rms));
        plan.push_back(predictIndication(meter, range, input));
    }
    return plan;
}

} // namespace mw
