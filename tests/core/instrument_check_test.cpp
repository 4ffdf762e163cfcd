// The checks an instrument passes before it is saved: identity, movement, class index, interval
// and each range, with the reason naming the value.
#include "core/model/instrument_check.h"

#include <catch2/catch.hpp>

#include <algorithm>

using namespace mw;

namespace {

// A 0-15 V DC panel voltmeter on a 1 mA, 100 Ω movement (invented, typical values).
Instrument voltmeter() {
    Instrument meter;
    meter.asset_tag = "T-1";
    meter.description = "Panel voltmeter, 0-15 V DC";
    meter.kind = InstrumentKind::DcVoltmeter;
    meter.movement = {1e-3, 100.0};
    meter.accuracy_class = 1.5;
    meter.scale_divisions = 30;
    meter.ranges = {{0, "15 V", Unit::Volt, 0.0, 15.0, 14900.0, {}, SignalType::Dc, {}}};
    return meter;
}

bool mentions(const std::vector<InstrumentProblem>& problems, const std::string& field,
              const std::string& words) {
    return std::any_of(problems.begin(), problems.end(), [&](const InstrumentProblem& p) {
        return p.field == field && p.message.find(words) != std::string::npos;
    });
}

} // namespace

TEST_CASE("a consistent instrument has no problems") {
    CHECK(checkInstrument(voltmeter()).empty());
    Instrument ammeter = voltmeter();
    ammeter.kind = InstrumentKind::DcAmmeter;
    ammeter.ranges = {{0, "1 A", Unit::Ampere, 0.0, 1.0, 0.1001, {}, SignalType::Dc, {}}};
    CHECK(checkInstrument(ammeter).empty());
    // The bare movement as a 100 mV range (I_fs·R_m = 1 mA × 100 Ω) needs no multiplier.
    Instrument bare = voltmeter();
    bare.ranges = {{0, "100 mV", Unit::Volt, 0.0, 0.1, {}, {}, SignalType::Dc, {}}};
    CHECK(checkInstrument(bare).empty());
}

TEST_CASE("a class index outside the IEC 60051-2 series is refused, naming the series") {
    Instrument meter = voltmeter();
    meter.accuracy_class = 1.2;
    const auto problems = checkInstrument(meter);
    CHECK(mentions(problems, "accuracy_class", "class 1.2 is not in the series"));
    CHECK(mentions(problems, "accuracy_class", "0.05"));
    for (const double index : {0.05, 0.1, 0.2, 0.3, 0.5, 1.0, 1.5, 2.0, 2.5, 3.0, 5.0}) {
        meter.accuracy_class = index; // IEC 60051-2 class indices (from memory)
        CHECK(checkInstrument(meter).empty());
    }
}

TEST_CASE("impossible ranges are refused with the movement's limits named") {
    // Below the movement's own full-scale drop: 1 mA × 100 Ω = 100 mV (V = I·R).
    Instrument meter = voltmeter();
    meter.ranges[0].full_scale = 0.05;
    meter.ranges[0].label = "50 mV";
    CHECK(mentions(checkInstrument(meter), "full_scale", "full-scale drop"));
    // A current range below I_fs cannot be made with a shunt.
    Instrument ammeter = voltmeter();
    ammeter.kind = InstrumentKind::DcAmmeter;
    ammeter.ranges = {{0, "500 µA", Unit::Ampere, 0.0, 500e-6, {}, {}, SignalType::Dc, {}}};
    const auto problems = checkInstrument(ammeter);
    CHECK(mentions(problems, "full_scale", "below the movement's own full-scale current"));
    CHECK(problems.front().rangeIndex == 0);
}

TEST_CASE("kind, unit and signal agree; identity, movement and interval are required") {
    Instrument meter = voltmeter();
    meter.ranges[0].signal = SignalType::Bridge;
    CHECK(mentions(checkInstrument(meter), "signal", "measures"));
    meter = voltmeter();
    meter.ranges[0].unit = Unit::Ampere;
    CHECK(mentions(checkInstrument(meter), "unit", "volts"));
    meter = voltmeter();
    meter.ranges[0].signal.reset();
    CHECK(mentions(checkInstrument(meter), "signal", "say whether"));
    meter = voltmeter();
    meter.asset_tag.clear();
    meter.interval_days = 0;
    meter.ranges.push_back(meter.ranges[0]);
    auto problems = checkInstrument(meter);
    CHECK(mentions(problems, "asset_tag", "asset tag"));
    CHECK(mentions(problems, "interval_days", "1 to 3650"));
    CHECK(mentions(problems, "label", "two ranges"));
    meter = voltmeter();
    meter.movement.amps_fs = 0.0;
    CHECK(mentions(checkInstrument(meter), "movement_amps_fs", "I_fs"));
    meter = voltmeter();
    meter.ranges.clear();
    CHECK(mentions(checkInstrument(meter), "ranges", "at least one range"));
    meter = voltmeter();
    meter.ranges[0].full_scale = 0.0;
    CHECK(mentions(checkInstrument(meter), "full_scale", "must be above the lower end"));
}
