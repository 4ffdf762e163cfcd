// The per-point part of evaluateRange(): readings grouped into test points with exact decimal
// sums, the budget components at a point, and each point's errors, budget, decision and risk.
// Internal to core/evaluation.
#pragma once

#include "core/evaluation/evaluation.h"
#include "core/units/decimal.h"

#include <optional>
#include <vector>

namespace mw::evaluation {

// The readings of one test point. Errors are exact decimals (indicated − applied as typed);
// the doubles are kept for the statistics of the Type A component.
struct PointGroup {
    int point = -1; // the test-point index the readings share (-1: grouped by value)
    std::vector<double> applied;
    ExactDecimal appliedSum;
    std::vector<double> errorsUp;
    std::vector<double> errorsDown;
    ExactMean up{{}, 0}; // count 0: no reading in that direction
    ExactMean down{{}, 0};
};

// Readings with the same point index (or, without one, the same applied value) form a point;
// points come back in ascending applied value. Two numbered readings with the same repeat
// number at one point and direction are refused (EvaluationError, field "repeat").
std::vector<PointGroup> groupReadings(const std::vector<EvaluationReading>& readings, Unit unit);

// What every budget of the evaluation holds at `applied` besides the Type A component.
std::vector<UncertaintyComponent> typeBComponents(const EvaluationInput& input, double applied,
                                                  double referenceRangeValue);

struct EvaluatedPoint {
    PointResult result;
    ExactMean error; // the direction that decides, exact
};

EvaluatedPoint evaluatePoint(const EvaluationInput& input, const PointGroup& group, double fiducial,
                             const ExactDecimal& limit, double referenceRangeValue);

} // namespace mw::evaluation
