// What the session chart shows for one range, computed from the session evaluation: errors as a
// percentage of the fiducial value against the applied value, the class limits, the guard band
// of guarded acceptance, U at each point, and a rectifier range's predicted curve. The chart
// widget only draws these numbers.
#pragma once

#include "core/evaluation/session_evaluation.h"

#include <optional>
#include <vector>

namespace mw {

struct ChartMark {
    double applied = 0.0;
    double errorPercent = 0.0;       // of the fiducial value
    double uncertaintyPercent = 0.0; // U of the point, same scale (drawn as a bar)
    Outcome decision = Outcome::Pass;
};

// The errors of one phase in one direction (drawn with their own marker shape).
struct ChartSeries {
    Phase phase = Phase::AsFound;
    Direction direction = Direction::Up;
    std::vector<ChartMark> marks; // ascending applied value
};

struct ChartLine {
    std::vector<std::pair<double, double>> points; // (applied, % of fiducial value)
};

struct RangeChart {
    double lower = 0.0; // the range's scale, for the x axis
    double upper = 0.0;
    double limitPercent = 0.0; // ± class index
    std::vector<ChartSeries> series;
    // Guarded acceptance: the acceptance limits ±(limit − w) along the points, w = r·U.
    std::optional<ChartLine> guardUpper;
    std::optional<ChartLine> guardLower;
    std::optional<ChartLine> predicted; // rectifier range with its diode model
    double yExtent = 0.0;               // symmetric y axis: everything drawn fits within ±
};

// The chart of `rangeId` from `evaluation` (which holds its results) and the input the range
// was evaluated with (for the predicted curve). An empty chart (no series) when the range has
// no results yet.
RangeChart rangeChart(const Instrument& instrument, const CalibrationSession& session,
                      const SealedInputs& inputs, const SessionEvaluation& evaluation,
                      std::int64_t rangeId);

} // namespace mw
