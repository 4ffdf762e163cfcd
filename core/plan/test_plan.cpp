// Test-point plans and their edits.
#include "core/plan/test_plan.h"

#include <algorithm>
#include <cmath>
#include <stdexcept>
#include <string>

namespace mw {
namespace {

bool sameValue(double a, double b) {
    return std::fabs(a - b) <= 1e-9 * std::max({1.0, std::fabs(a), std::fabs(b)});
}

// Builds the up-run over ascending `values` and the down-run back over them.
TestPlan upThenDown(std::vector<double> values) {
    std::sort(values.begin(), values.end());
    values.erase(std::unique(values.begin(), values.end(), sameValue), values.end());
    TestPlan plan;
    for (double value : values) {
        plan.points.push_back({value, Direction::Up, 1});
    }
    for (auto it = values.rbegin(); it != values.rend(); ++it) {
        plan.points.push_back({*it, Direction::Down, 1});
    }
    return plan;
}

void requireRange(const ScaleRange& range) {
    if (!(range.upper > range.lower) || !std::isfinite(range.lower) ||
        !std::isfinite(range.upper)) {
        throw std::invalid_argument("test plan: the upper limit must be greater than the lower");
    }
}

} // namespace

TestPlan defaultPlan(InstrumentKind kind, const ScaleRange& range) {
    requireRange(range);
    const double span = range.upper - range.lower;
    std::vector<double> values;
    for (int step = 0; step <= 5; ++step) {
        values.push_back(range.lower + span * step / 5.0);
    }
    const bool rectifier =
        kind == InstrumentKind::HalfWaveAcVoltmeter || kind == InstrumentKind::BridgeAcVoltmeter;
    if (rectifier && range.lower == 0.0) {
        values.front() = 0.1 * span;
    }
    if (range.lower < 0.0 && range.upper > 0.0) {
        values.push_back(0.0); // the zero of a centre-zero scale is always a test point
    }
    return upThenDown(values);
}

double divisionValue(const ScaleRange& range, int divisions) {
    requireRange(range);
    if (divisions < 1) {
        throw std::invalid_argument("scale divisions must be at least 1, got " +
                                    std::to_string(divisions));
    }
    return (range.upper - range.lower) / divisions;
}

double snapToMark(double value, const ScaleRange& range, int divisions) {
    const double division = divisionValue(range, divisions);
    const double marks = std::round((value - range.lower) / division);
    return std::clamp(range.lower + marks * division, range.lower, range.upper);
}

TestPlan snapPlan(const TestPlan& plan, const ScaleRange& range, int divisions) {
    TestPlan snapped;
    for (const PlannedPoint& point : plan.points) {
        PlannedPoint moved = point;
        moved.nominal = snapToMark(point.nominal, range, divisions);
        const bool duplicate = std::any_of(
            snapped.points.begin(), snapped.points.end(), [&moved](const PlannedPoint& other) {
                return sameValue(other.nominal, moved.nominal) &&
                       other.direction == moved.direction && other.repeat == moved.repeat;
            });
        if (!duplicate) {
            snapped.points.push_back(moved);
        }
    }
    return snapped;
}

TestPlan withRepeats(const TestPlan& plan, int repeats) {
    if (repeats < 1) {
        throw std::invalid_argument("test plan: repeats must be at least 1, got " +
                                    std::to_string(repeats));
    }
    TestPlan repeated;
    for (const PlannedPoint& point : plan.points) {
        if (point.repeat != 1) {
            continue; // existing repeats are rebuilt from the first one
        }
        for (int r = 1; r <= repeats; ++r) {
            repeated.points.push_back({point.nominal, point.direction, r});
        }
    }
    return repeated;
}

TestPlan addPoint(const TestPlan& plan, double nominal) {
    if (!std::isfinite(nominal)) {
        throw std::invalid_argument("test plan: a point needs a finite nominal value");
    }
    std::vector<double> values = nominalValues(plan);
    values.push_back(nominal);
    int repeats = 1;
    for (const PlannedPoint& point : plan.points) {
        repeats = std::max(repeats, point.repeat);
    }
    TestPlan rebuilt = upThenDown(values);
    return repeats > 1 ? withRepeats(rebuilt, repeats) : rebuilt;
}

TestPlan removePoint(const TestPlan& plan, double nominal) {
    TestPlan kept;
    for (const PlannedPoint& point : plan.points) {
        if (!sameValue(point.nominal, nominal)) {
            kept.points.push_back(point);
        }
    }
    return kept;
}

std::vector<double> nominalValues(const TestPlan& plan) {
    std::vector<double> values;
    for (const PlannedPoint& point : plan.points) {
        values.push_back(point.nominal);
    }
    std::sort(values.begin(), values.end());
    values.erase(std::unique(values.begin(), values.end(), sameValue), values.end());
    return values;
}

} // namespace mw
