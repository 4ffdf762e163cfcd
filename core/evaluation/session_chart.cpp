// The numbers of the session chart.
#include "core/evaluation/session_chart.h"

#include "core/accuracy/accuracy_class.h"
#include "core/decision/decision.h"

#include <algorithm>
#include <cmath>

namespace mw {
namespace {

const RangeSpec* findRange(const Instrument& instrument, std::int64_t rangeId) {
    for (const RangeSpec& range : instrument.ranges) {
        if (range.id == rangeId) {
            return &range;
        }
    }
    return nullptr;
}

void addSeries(const EvaluationResult& result, Phase phase, RangeChart& chart) {
    for (Direction direction : {Direction::Up, Direction::Down}) {
        ChartSeries series;
        series.phase = phase;
        series.direction = direction;
        for (const PointResult& point : result.points) {
            const std::optional<double>& error =
                direction == Direction::Up ? point.errorUp : point.errorDown;
            if (!error) {
                continue;
            }
            series.marks.push_back({point.applied, *error / result.fiducialValue * 100.0,
                                    point.budget.expandedRounded / result.fiducialValue * 100.0,
                                    point.decision});
        }
        if (!series.marks.empty()) {
            chart.series.push_back(std::move(series));
        }
    }
}

// The acceptance limits of guarded acceptance along the points of the first phase shown.
void addGuardBand(const EvaluationResult& result, const CalibrationSession& session,
                  RangeChart& chart) {
    if (session.decision_rule == DecisionRule::SimpleAcceptance || chart.guardUpper) {
        return;
    }
    const DecisionSettings settings{session.decision_rule, session.guard_factor};
    ChartLine upper;
    ChartLine lower;
    for (const PointResult& point : result.points) {
        const double w = guardBand(settings, point.budget.expandedRounded);
        const double acceptance = std::max(0.0, point.permissibleError - w);
        upper.points.emplace_back(point.applied, acceptance / result.fiducialValue * 100.0);
        lower.points.emplace_back(point.applied, -acceptance / result.fiducialValue * 100.0);
    }
    chart.guardUpper = upper;
    chart.guardLower = lower;
}

void addPrediction(const Instrument& instrument, const RangeSpec& range,
                   const CalibrationSession& session, const SealedInputs& inputs, double fiducial,
                   RangeChart& chart) {
    try {
        const Phase phase = phasesOf(session.phases).front();
        const EvaluationInput input = evaluationInputFor(instrument, range, session, inputs, phase);
        if (!input.predictedError) {
            return;
        }
        ChartLine line;
        const double span = range.full_scale - range.lower_limit;
        for (int step = 1; step <= 40; ++step) {
            const double applied = range.lower_limit + span * step / 40.0;
            line.points.emplace_back(applied, input.predictedError(applied) / fiducial * 100.0);
        }
        chart.predicted = line;
    } catch (const std::exception&) {
        // No curve where the model has no answer; the measured series stand on their own.
    }
}

double extentOf(const RangeChart& chart) {
    double extent = chart.limitPercent;
    for (const ChartSeries& series : chart.series) {
        for (const ChartMark& mark : series.marks) {
            extent = std::max(extent, std::fabs(mark.errorPercent) + mark.uncertaintyPercent);
        }
    }
    if (chart.predicted) {
        for (const auto& [x, y] : chart.predicted->points) {
            extent = std::max(extent, std::fabs(y));
        }
    }
    return extent * 1.15;
}

} // namespace

RangeChart rangeChart(const Instrument& instrument, const CalibrationSession& session,
                      const SealedInputs& inputs, const SessionEvaluation& evaluation,
                      std::int64_t rangeId) {
    RangeChart chart;
    const RangeSpec* range = findRange(instrument, rangeId);
    if (range == nullptr) {
        return chart;
    }
    chart.lower = range->lower_limit;
    chart.upper = range->full_scale;
    chart.limitPercent = instrument.accuracy_class;
    double fiducial = 0.0;
    for (const RangeEvaluation& part : evaluation.ranges) {
        if (part.rangeId != rangeId || !part.result) {
            continue;
        }
        fiducial = part.result->fiducialValue;
        addSeries(*part.result, part.phase, chart);
        addGuardBand(*part.result, session, chart);
    }
    if (fiducial == 0.0) {
        try {
            fiducial = fiducialValue(ScaleRange{range->lower_limit, range->full_scale,
                                                instrument.scale_type, range->fiducial_value});
        } catch (const std::exception&) {
            fiducial = 0.0;
        }
    }
    if (fiducial > 0.0) {
        addPrediction(instrument, *range, session, inputs, fiducial, chart);
    }
    chart.yExtent = extentOf(chart);
    return chart;
}

} // namespace mw
