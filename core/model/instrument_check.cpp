// Checking an instrument as it is typed.
#include "core/model/instrument_check.h"

#include "core/accuracy/accuracy_class.h"
#include "core/circuits/range_design.h"
#include "core/units/quantity.h"

#include <cmath>
#include <cstdio>
#include <set>
#include <stdexcept>

namespace mw {
namespace {

std::string number(double value, Unit unit) {
    return formatEngineering(value, 4, unit);
}

bool isVoltmeterKind(InstrumentKind kind) {
    return kind == InstrumentKind::DcVoltmeter || kind == InstrumentKind::HalfWaveAcVoltmeter ||
           kind == InstrumentKind::BridgeAcVoltmeter;
}

// The signal a kind of one signal settles (nullopt: a multi-range meter may mix them).
std::optional<SignalType> signalOfKind(InstrumentKind kind) {
    switch (kind) {
    case InstrumentKind::DcVoltmeter:
    case InstrumentKind::DcAmmeter:
        return SignalType::Dc;
    case InstrumentKind::HalfWaveAcVoltmeter:
        return SignalType::HalfWave;
    case InstrumentKind::BridgeAcVoltmeter:
        return SignalType::Bridge;
    default:
        return std::nullopt;
    }
}

void checkRange(const Instrument& instrument, int index, std::vector<InstrumentProblem>& out) {
    const RangeSpec& range = instrument.ranges[std::size_t(index)];
    auto problem = [&](const char* field, std::string message) {
        out.push_back({field, index, std::move(message)});
    };
    if (range.label.empty()) {
        problem("label", "a range needs a label (as engraved on the switch, e.g. \"10 V\")");
    }
    if (!std::isfinite(range.full_scale) || !std::isfinite(range.lower_limit) ||
        range.full_scale <= range.lower_limit) {
        problem("full_scale", "the full scale " + number(range.full_scale, range.unit) +
                                  " must be above the lower end " +
                                  number(range.lower_limit, range.unit));
        return;
    }
    if (isVoltmeterKind(instrument.kind) && range.unit != Unit::Volt) {
        problem("unit", "a voltmeter's ranges are in volts");
    }
    if (instrument.kind == InstrumentKind::DcAmmeter && range.unit != Unit::Ampere) {
        problem("unit", "an ammeter's ranges are in amperes");
    }
    if (!range.signal) {
        problem("signal", "say whether the range is DC, half-wave or bridge rectifier AC");
    } else if (const auto settled = signalOfKind(instrument.kind);
               settled && *range.signal != *settled) {
        problem("signal", std::string("a ") + std::string(displayName(instrument.kind)) +
                              " measures " + std::string(displayName(*settled)));
    } else if (range.unit == Unit::Ampere && *range.signal != SignalType::Dc) {
        problem("signal", "a current range is DC (there are no rectifier ammeters here)");
    }
    if (range.nominal_ohms && !(*range.nominal_ohms > 0.0 && std::isfinite(*range.nominal_ohms))) {
        problem("nominal_ohms", "the resistor must be a positive number of ohms");
    }
    if (range.fiducial_value && !(*range.fiducial_value > 0.0)) {
        problem("fiducial_value", "the fiducial value must be positive");
    }
    const double top = std::max(std::fabs(range.lower_limit), std::fabs(range.full_scale));
    if (range.unit == Unit::Ampere && top < instrument.movement.amps_fs * (1.0 - 1e-12)) {
        problem("full_scale", "a current range of " + number(top, Unit::Ampere) +
                                  " is below the movement's own full-scale current " +
                                  number(instrument.movement.amps_fs, Unit::Ampere) +
                                  ": no shunt can make it");
        return;
    }
    const double drop = instrument.movement.fullScaleDrop_V();
    if (range.unit == Unit::Volt && range.signal == SignalType::Dc && !range.nominal_ohms &&
        std::fabs(top - drop) <= 1e-9 * top) {
        return; // the bare movement used as a millivoltmeter
    }
    try {
        designedResistor(instrument, range);
    } catch (const std::exception& error) {
        problem("full_scale", error.what());
    }
}

} // namespace

std::vector<InstrumentProblem> checkInstrument(const Instrument& instrument) {
    std::vector<InstrumentProblem> out;
    auto problem = [&](const char* field, std::string message) {
        out.push_back({field, -1, std::move(message)});
    };
    if (instrument.asset_tag.empty()) {
        problem("asset_tag", "an instrument needs an asset tag");
    }
    if (instrument.description.empty()) {
        problem("description", "say what the instrument is (e.g. \"Panel voltmeter, 0-15 V DC\")");
    }
    bool movementKnown = true;
    try {
        checkMovement(instrument.movement);
    } catch (const std::invalid_argument& error) {
        movementKnown = false;
        problem(instrument.movement.amps_fs > 0.0 ? "movement_ohms" : "movement_amps_fs",
                error.what());
    }
    if (!isStandardClassIndex(instrument.accuracy_class)) {
        std::string series;
        for (const double index : classIndexSeries()) {
            char text[16];
            std::snprintf(text, sizeof text, "%s%g", series.empty() ? "" : ", ", index);
            series += text;
        }
        char typed[32];
        std::snprintf(typed, sizeof typed, "%g", instrument.accuracy_class);
        problem("accuracy_class", std::string("class ") + typed +
                                      " is not in the series of IEC 60051-2 (" + series + ")");
    }
    if (instrument.scale_divisions < 0) {
        problem("scale_divisions", "the number of scale divisions cannot be negative");
    }
    if (instrument.interval_days < 1 || instrument.interval_days > 3650) {
        problem("interval_days", "the calibration interval must be 1 to 3650 days");
    }
    if (instrument.ranges.empty()) {
        problem("ranges", "an instrument needs at least one range");
    }
    std::set<std::string> labels;
    for (int i = 0; i < int(instrument.ranges.size()); ++i) {
        if (!labels.insert(instrument.ranges[std::size_t(i)].label).second) {
            out.push_back(
                {"label", i,
                 "two ranges are labelled \"" + instrument.ranges[std::size_t(i)].label + "\""});
        }
        if (movementKnown) {
            checkRange(instrument, i, out);
        }
    }
    return out;
}

} // namespace mw
