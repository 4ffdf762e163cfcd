// The plan of a calibration session and its completeness.
#include "core/plan/session_plan.h"

#include "core/plan/test_plan.h"
#include "core/units/quantity.h"

#include <algorithm>
#include <map>
#include <set>

namespace mw {
namespace {

const RangeSpec* rangeOf(const Instrument& instrument, std::int64_t rangeId) {
    for (const RangeSpec& range : instrument.ranges) {
        if (range.id == rangeId) {
            return &range;
        }
    }
    return nullptr;
}

std::vector<TestPoint> pointsOf(const std::vector<TestPoint>& plan, std::int64_t rangeId) {
    std::vector<TestPoint> points;
    for (const TestPoint& point : plan) {
        if (point.range_id == rangeId) {
            points.push_back(point);
        }
    }
    std::sort(points.begin(), points.end(), [](const TestPoint& a, const TestPoint& b) {
        return a.nominal != b.nominal ? a.nominal < b.nominal : a.point_index < b.point_index;
    });
    return points;
}

} // namespace

ReadingKey keyOf(const Reading& reading) {
    return {reading.range_id, reading.point_index, reading.direction, reading.phase,
            reading.repeat};
}

InstrumentKind rangeKind(SignalType signal, Unit unit) {
    switch (signal) {
    case SignalType::HalfWave:
        return InstrumentKind::HalfWaveAcVoltmeter;
    case SignalType::Bridge:
        return InstrumentKind::BridgeAcVoltmeter;
    case SignalType::Dc:
        break;
    }
    return unit == Unit::Ampere ? InstrumentKind::DcAmmeter : InstrumentKind::DcVoltmeter;
}

std::vector<TestPoint> defaultPoints(const Instrument& instrument, const RangeSpec& range,
                                     int repeats) {
    const ScaleRange scale{range.lower_limit, range.full_scale, instrument.scale_type,
                           range.fiducial_value};
    TestPlan plan =
        defaultPlan(rangeKind(range.signal.value_or(SignalType::Dc), range.unit), scale);
    if (instrument.scale_divisions > 0) {
        plan = snapPlan(plan, scale, instrument.scale_divisions);
    }
    std::vector<TestPoint> points;
    int index = 0;
    for (double nominal : nominalValues(plan)) {
        points.push_back({range.id, index++, nominal, std::max(1, repeats)});
    }
    return points;
}

std::vector<TestPoint> effectivePlan(const CalibrationSession& session) {
    if (!session.plan.empty()) {
        return session.plan;
    }
    struct Seen {
        double sum = 0.0;
        int count = 0;
        int repeats = 1;
    };
    std::map<std::pair<std::int64_t, int>, Seen> seen;
    for (const Reading& reading : session.readings) {
        Seen& point = seen[{reading.range_id, reading.point_index}];
        point.sum += reading.applied;
        point.count += 1;
        point.repeats = std::max(point.repeats, reading.repeat);
    }
    std::vector<TestPoint> plan;
    for (const auto& [key, point] : seen) {
        plan.push_back({key.first, key.second, point.sum / point.count, point.repeats});
    }
    return plan;
}

std::vector<ReadingKey> plannedReadings(const Instrument& instrument,
                                        const CalibrationSession& session) {
    const std::vector<TestPoint> plan = effectivePlan(session);
    std::vector<ReadingKey> keys;
    for (const RangeSpec& range : instrument.ranges) {
        const std::vector<TestPoint> points = pointsOf(plan, range.id);
        if (points.empty()) {
            continue;
        }
        for (Phase phase : phasesOf(session.phases)) {
            for (Direction direction : {Direction::Up, Direction::Down}) {
                auto add = [&](const TestPoint& point) {
                    for (int repeat = 1; repeat <= point.repeats; ++repeat) {
                        keys.push_back({range.id, point.point_index, direction, phase, repeat});
                    }
                };
                if (direction == Direction::Up) {
                    std::for_each(points.begin(), points.end(), add);
                } else {
                    std::for_each(points.rbegin(), points.rend(), add);
                }
            }
        }
    }
    return keys;
}

std::vector<ReadingKey> missingReadings(const Instrument& instrument,
                                        const CalibrationSession& session) {
    std::set<ReadingKey> held;
    for (const Reading& reading : session.readings) {
        if (reading.indicated) {
            held.insert(keyOf(reading));
        }
    }
    std::vector<ReadingKey> missing;
    for (const ReadingKey& key : plannedReadings(instrument, session)) {
        if (!held.count(key)) {
            missing.push_back(key);
        }
    }
    return missing;
}

std::string describeMissing(const Instrument& instrument, const CalibrationSession& session,
                            const std::vector<ReadingKey>& missing, std::size_t limit) {
    const std::vector<TestPoint> plan = effectivePlan(session);
    std::string text;
    for (std::size_t i = 0; i < missing.size() && i < limit; ++i) {
        const ReadingKey& key = missing[i];
        const RangeSpec* range = rangeOf(instrument, key.range_id);
        const auto point = std::find_if(plan.begin(), plan.end(), [&key](const TestPoint& p) {
            return p.range_id == key.range_id && p.point_index == key.point_index;
        });
        if (!text.empty()) {
            text += "; ";
        }
        text += (range ? range->label : "range " + std::to_string(key.range_id)) + ": point " +
                std::to_string(key.point_index + 1);
        if (point != plan.end() && range) {
            text += " (" + formatEngineering(point->nominal, 4, range->unit) + ")";
        }
        text += key.direction == Direction::Up ? " up-scale " : " down-scale ";
        text += std::string(toText(key.phase));
        if (point != plan.end() && point->repeats > 1) {
            text += " repeat " + std::to_string(key.repeat);
        }
    }
    if (missing.size() > limit) {
        text += "; and " + std::to_string(missing.size() - limit) + " more";
    }
    return text;
}

} // namespace mw
