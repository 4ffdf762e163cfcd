// The demo meters' invented behaviour. Errors are modelled in % of the fiducial value, the unit
// the accuracy class is stated in: zero offset, span error drifting with the years, a bow of
// non-linearity, friction (up-scale readings lag low, down-scale high), the low-end loss of a
// rectifier, and reading scatter. The technician sets the pointer on each scale mark and reads
// the applied value from the standard (common practice for analog meters), so `indicated` is
// the mark and `applied` carries the error.
#include "storage/demo/demo_history.h"

#include "core/accuracy/accuracy_class.h"
#include "core/plan/test_plan.h"
#include "core/units/quantity.h"
#include "storage/demo/demo_catalogue.h"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <string>

namespace mw::demo {
namespace {

ScaleRange scaleOf(const Instrument& instrument, const RangeSpec& range) {
    return ScaleRange{range.lower_limit, range.full_scale, instrument.scale_type,
                      range.fiducial_value};
}

double limitOf(const Instrument& instrument, const RangeSpec& range) {
    return permissibleError(instrument.accuracy_class, fiducialValue(scaleOf(instrument, range)));
}

// The standard's display: five significant digits.
double roundSignificant(double value, int digits) {
    if (value == 0.0) {
        return 0.0;
    }
    const double magnitude = std::floor(std::log10(std::fabs(value)));
    const double step = std::pow(10.0, magnitude - digits + 1);
    return std::round(value / step) * step;
}

// The test points of a range: core's default plan snapped to the scale marks.
TestPlan planOf(const Instrument& instrument, const RangeSpec& range) {
    const InstrumentKind kind = isAcRange(range) ? InstrumentKind::BridgeAcVoltmeter
                                : instrument.kind == InstrumentKind::MultiRange
                                    ? InstrumentKind::DcVoltmeter
                                    : instrument.kind;
    const ScaleRange scale = scaleOf(instrument, range);
    return snapPlan(defaultPlan(kind, scale), scale, instrument.scale_divisions);
}

int indexOf(const std::vector<double>& values, double value) {
    const auto it = std::min_element(values.begin(), values.end(), [value](double a, double b) {
        return std::fabs(a - value) < std::fabs(b - value);
    });
    return static_cast<int>(it - values.begin());
}

std::string percentText(double value) {
    char text[32];
    std::snprintf(text, sizeof text, "%+.2f %%", value);
    return text;
}

std::string valueText(double value, Unit unit) {
    return formatEngineering(value, 3, unit);
}

} // namespace

double worstErrorFraction(const Instrument& instrument, const std::vector<Reading>& readings,
                          Phase phase) {
    double worst = 0.0;
    for (const Reading& reading : readings) {
        if (reading.phase != phase) {
            continue;
        }
        for (const RangeSpec& range : instrument.ranges) {
            if (range.id == reading.range_id) {
                const double error =
                    std::fabs(reading.indicated.value_or(reading.applied) - reading.applied);
                worst = std::max(worst, error / limitOf(instrument, range));
            }
        }
    }
    return worst;
}

MeterSimulation::MeterSimulation(const Instrument& instrument, std::uint64_t seed, bool fastDrift,
                                 std::optional<ScriptedDrift> script)
    : instrument_(instrument)
    , random_(seed)
    , class_(instrument.accuracy_class) {
    zero_pct_ = random_.normal(0.0, 0.08 * class_);
    span_pct_ = random_.normal(0.0, 0.12 * class_);
    span_rate_pct_ = fastDrift
                         ? (random_.chance(0.5) ? 1.0 : -1.0) * random_.uniform(0.5, 0.8) * class_
                         : random_.normal(0.0, 0.2 * class_);
    nonlinear_pct_ = random_.normal(0.0, 0.12 * class_);
    friction_pct_ = 0.02 * class_ + std::fabs(random_.normal(0.0, 0.06 * class_));
    rectifier_pct_ = -random_.uniform(0.1, 0.35) * class_;
    for (std::size_t i = 0; i < instrument.ranges.size(); ++i) {
        RangeState state;
        if (instrument.ranges.size() > 1) {
            state.span_pct = random_.normal(0.0, 0.1 * class_);
            state.span_rate_pct = random_.normal(0.0, 0.12 * class_);
        }
        ranges_.push_back(state);
    }
    if (script) {
        zero_pct_ *= 0.3;
        nonlinear_pct_ *= 0.3;
        span_pct_ = script->startPct;
        span_rate_pct_ = script->ratePctPerYear;
        walk_ = 0.005;
        wear_ = 0.0;
        adjustAbove_ = 1.0;
    }
}

void MeterSimulation::age(int days) {
    const double years = days / 365.25;
    span_pct_ += span_rate_pct_ * years + random_.normal(0.0, walk_ * class_ * std::sqrt(years));
    zero_pct_ += random_.normal(0.0, walk_ * class_ * std::sqrt(years));
    friction_pct_ += wear_ * class_ * years;
    for (RangeState& range : ranges_) {
        range.span_pct += range.span_rate_pct * years;
    }
}

double MeterSimulation::errorPercent(std::size_t rangeIndex, double nominal, Direction direction) {
    const RangeSpec& range = instrument_.ranges[rangeIndex];
    const double top = std::max(std::fabs(range.lower_limit), std::fabs(range.full_scale));
    const double x = nominal / top; // signed: a centre-zero meter errs both ways
    const double ax = std::fabs(x);
    double error = zero_pct_ + (span_pct_ + ranges_[rangeIndex].span_pct) * x +
                   nonlinear_pct_ * 4.0 * ax * (1.0 - ax);
    if (isAcRange(range)) {
        error += rectifier_pct_ * std::pow(1.0 - ax, 3.0);
    }
    if (damaged_ && ax > 0.3 && ax < 0.7) {
        error += 4.0 * class_; // the pointer hangs in the middle of the scale
    }
    error += (direction == Direction::Up ? -0.5 : 0.5) * friction_pct_;
    return error + random_.normal(0.0, 0.03 * class_);
}

Reading MeterSimulation::readAt(std::size_t rangeIndex, int pointIndex, double nominal,
                                Direction direction, Phase phase) {
    const RangeSpec& range = instrument_.ranges[rangeIndex];
    const double fiducial = fiducialValue(scaleOf(instrument_, range));
    const double error = errorPercent(rangeIndex, nominal, direction) / 100.0 * fiducial;
    Reading reading;
    reading.range_id = range.id;
    reading.point_index = pointIndex;
    reading.direction = direction;
    reading.phase = phase;
    reading.repeat = 1;
    reading.unit = range.unit;
    reading.indicated = nominal;
    reading.applied = roundSignificant(nominal - error, 5);
    return reading;
}

std::vector<Reading> MeterSimulation::run(Phase phase) {
    std::vector<Reading> readings;
    for (std::size_t r = 0; r < instrument_.ranges.size(); ++r) {
        const TestPlan plan = planOf(instrument_, instrument_.ranges[r]);
        const std::vector<double> nominals = nominalValues(plan);
        for (const PlannedPoint& point : plan.points) {
            readings.push_back(
                readAt(r, indexOf(nominals, point.nominal), point.nominal, point.direction, phase));
        }
    }
    return readings;
}

ResistorCheck MeterSimulation::checkResistor(std::size_t rangeIndex) {
    const RangeSpec& range = instrument_.ranges[rangeIndex];
    // A multiplier that has grown makes a voltmeter read low; a shunt that has grown makes an
    // ammeter read high: the resistor's deviation mirrors the range's own span error.
    const double sign = range.unit == Unit::Ampere ? 1.0 : -1.0;
    const double deviation_pct =
        sign * ranges_[rangeIndex].span_pct + random_.normal(0.0, 0.05 * class_);
    ResistorCheck check;
    check.range_id = range.id;
    check.component = resistorName(instrument_, rangeIndex);
    check.computed_ohms = range.nominal_ohms.value_or(0.0);
    check.measured_ohms = roundSignificant(check.computed_ohms * (1.0 + deviation_pct / 100.0), 6);
    check.tolerance_percent = class_ <= 1.0 ? 0.5 : 1.0;
    return check;
}

void MeterSimulation::adjust(Timestamp at, const std::vector<Reading>& asFound,
                             SessionContent& content) {
    // The worst reading relative to its own range's limit (ranges differ in size).
    const Reading* worst = &asFound.front();
    double worstFraction = -1.0;
    for (const Reading& reading : asFound) {
        const double fraction = worstErrorFraction(instrument_, {reading}, reading.phase);
        if (fraction > worstFraction) {
            worstFraction = fraction;
            worst = &reading;
        }
    }
    std::size_t worstRange = 0;
    while (instrument_.ranges[worstRange].id != worst->range_id) {
        ++worstRange;
    }
    const RangeSpec& range = instrument_.ranges[worstRange];
    const double fiducial = fiducialValue(scaleOf(instrument_, range));
    const double error_pct = (*worst->indicated - worst->applied) / fiducial * 100.0;
    const bool outOfTolerance = std::fabs(error_pct) > class_;
    std::string text = std::string(outOfTolerance ? "Out of tolerance as found"
                                                  : "Within tolerance as found but close to the "
                                                    "limit, adjusted to last the interval") +
                       ": largest error " + percentText(error_pct) + " of the fiducial value at " +
                       valueText(*worst->indicated, range.unit) +
                       (worst->direction == Direction::Up ? " up-scale" : " down-scale") +
                       " on the " + range.label + " range (limit +/-" +
                       percentText(class_).substr(1) + "). ";
    if (std::fabs(ranges_[worstRange].span_pct) > 0.5 * class_) {
        content.resistor_checks.push_back(checkResistor(worstRange));
        text += content.resistor_checks.back().component +
                " out of its value; replaced with a selected resistor. ";
        ranges_[worstRange].span_pct = random_.normal(0.0, 0.05 * class_);
    }
    if (friction_pct_ > 0.3 * class_) {
        text += "Pivot and jewels cleaned. ";
        friction_pct_ = 0.03 * class_;
    }
    text += "Span reset with the magnetic shunt, mechanical zero reset.";
    zero_pct_ = random_.normal(0.0, 0.04 * class_);
    span_pct_ = random_.normal(0.0, 0.06 * class_);
    for (RangeState& state : ranges_) {
        state.span_pct *= 0.3;
    }
    content.adjustments.push_back(AdjustmentNote{0, at, text});
}

SessionContent MeterSimulation::calibrate(Timestamp start, bool firstVisit) {
    SessionContent content;
    if (firstVisit) {
        for (std::size_t r = 0; r < instrument_.ranges.size(); ++r) {
            if (instrument_.ranges[r].nominal_ohms) {
                content.resistor_checks.push_back(checkResistor(r));
            }
        }
    }
    const std::vector<Reading> asFound = run(Phase::AsFound);
    content.readings = asFound;
    const double worst = worstErrorFraction(instrument_, asFound, Phase::AsFound);
    // Close to the limit is adjusted too, so that the meter lasts its interval (common practice).
    if (worst > adjustAbove_) {
        adjust(start + std::chrono::minutes(40), asFound, content);
        const std::vector<Reading> asLeft = run(Phase::AsLeft);
        content.readings.insert(content.readings.end(), asLeft.begin(), asLeft.end());
    }
    content.minutes = 25 + 2 * static_cast<int>(content.readings.size());
    return content;
}

SessionContent MeterSimulation::calibrateDamaged(Timestamp start) {
    damaged_ = true;
    SessionContent content;
    content.readings = run(Phase::AsFound);
    content.adjustments.push_back(AdjustmentNote{
        0, start + std::chrono::minutes(30),
        "Pointer hangs between 40 % and 60 % of the scale and reads far high there; the lower "
        "pivot jewel is cracked. Not adjustable on the bench: withdrawn from service and "
        "labelled, repair quotation sent to the owner."});
    content.minutes = 25 + 2 * static_cast<int>(content.readings.size());
    return content;
}

SessionContent MeterSimulation::partialAsFound(int count) {
    SessionContent content;
    content.readings = run(Phase::AsFound);
    if (static_cast<int>(content.readings.size()) > count) {
        content.readings.resize(static_cast<std::size_t>(count));
    }
    content.minutes = 2 * count;
    return content;
}

} // namespace mw::demo
