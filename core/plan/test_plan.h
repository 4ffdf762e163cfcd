// Test-point plans: the default cardinal points of a range taken up-scale then down-scale, and
// the edits a technician makes (add, remove, repeat, snap to scale marks).
#pragma once

#include "core/accuracy/accuracy_class.h"
#include "core/model/vocabulary.h"

#include <vector>

namespace mw {

struct PlannedPoint {
    double nominal = 0.0; // value at which the point is taken, in the unit of the range
    Direction direction = Direction::Up;
    int repeat = 1; // 1-based repeat number of this nominal value in this direction
};

struct TestPlan {
    std::vector<PlannedPoint> points; // in the order they are to be taken
};

// Default plan for a range: the cardinal points (common practice: every 20 % of the span, i.e.
// the numbered marks of a five-major-division scale) up-scale, then back down-scale. Rectifier
// AC voltmeters start at 10 % because the diode makes the bottom of the scale unusable and the
// low end is where their non-linearity shows; centre-zero scales run from the lower limit up.
TestPlan defaultPlan(InstrumentKind kind, const ScaleRange& range);

// The value of one scale division; throws std::invalid_argument unless divisions ≥ 1.
double divisionValue(const ScaleRange& range, int divisions);

// The scale mark nearest to `value` (marks every division from the lower limit), clamped to the
// range.
double snapToMark(double value, const ScaleRange& range, int divisions);

// Snaps every point of the plan; points that fall on the same mark and direction are merged.
TestPlan snapPlan(const TestPlan& plan, const ScaleRange& range, int divisions);

// Each point taken `repeats` times in a row (repeat numbers 1…repeats).
TestPlan withRepeats(const TestPlan& plan, int repeats);

// Adds a nominal value in both directions at its place in the up-scale and down-scale runs.
TestPlan addPoint(const TestPlan& plan, double nominal);

// Removes every point at `nominal` (tolerance 1e-9 of the value).
TestPlan removePoint(const TestPlan& plan, double nominal);

// The distinct nominal values of a plan in ascending order.
std::vector<double> nominalValues(const TestPlan& plan);

} // namespace mw
