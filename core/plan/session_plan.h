// A calibration session's plan: the test points of each range, the readings the plan asks for
// in the order they are taken, and those it still needs before the session can be submitted.
#pragma once

#include "core/model/calibration.h"
#include "core/model/instrument.h"

#include <compare>
#include <cstddef>
#include <string>
#include <vector>

namespace mw {

// A reading's identity within a session.
struct ReadingKey {
    std::int64_t range_id = 0;
    int point_index = 0;
    Direction direction = Direction::Up;
    Phase phase = Phase::AsFound;
    int repeat = 1;

    auto operator<=>(const ReadingKey&) const = default;
};

ReadingKey keyOf(const Reading& reading);

// The kind of meter one range is, as the engine's plans and advice know it.
InstrumentKind rangeKind(SignalType signal, Unit unit);

// The default points of a range: the engine's default plan (core/plan/test_plan.h) snapped to
// the scale marks when the divisions are known, numbered from 0 in ascending order.
std::vector<TestPoint> defaultPoints(const Instrument& instrument, const RangeSpec& range,
                                     int repeats = 1);

// The session's own plan; for a record made before plans were kept, the plan its readings
// show (one point per point index, at the mean applied value, with the most repeats taken).
std::vector<TestPoint> effectivePlan(const CalibrationSession& session);

// Every reading the plan asks for, in the order the bench takes them: range by range (the
// instrument's order), phase by phase, up-scale in ascending order then down-scale back, each
// repeat in turn.
std::vector<ReadingKey> plannedReadings(const Instrument& instrument,
                                        const CalibrationSession& session);

// Those of plannedReadings() the session does not hold with an indication.
std::vector<ReadingKey> missingReadings(const Instrument& instrument,
                                        const CalibrationSession& session);

// "10 V: point 4 (8.000 V) down-scale as-left; …" for at most `limit` of `missing`, with "and N
// more" after them.
std::string describeMissing(const Instrument& instrument, const CalibrationSession& session,
                            const std::vector<ReadingKey>& missing, std::size_t limit = 4);

} // namespace mw
