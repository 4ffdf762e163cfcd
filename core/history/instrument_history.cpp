// An instrument's history: rows from the session evaluator, error series per test point, drift
// fitted since the last adjustment, and the staircase interval.
#include "core/history/instrument_history.h"

#include "core/evaluation/session_evaluation.h"
#include "core/history/calendar.h"
#include "core/history/evaluation_basis.h"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <map>
#include <stdexcept>

namespace mw {
namespace {

constexpr double kDaysPerYear = 365.25; // as core/interval/drift.cpp counts a year

std::string nameOf(const std::vector<User>& users, std::int64_t id) {
    for (const User& user : users) {
        if (user.id == id) {
            return user.full_name.empty() ? user.login : user.full_name;
        }
    }
    return "user " + std::to_string(id);
}

bool submitted(const CalibrationSession& session) {
    return session.state == SessionState::Submitted || session.state == SessionState::Approved ||
           session.state == SessionState::Superseded;
}

// The planned nominal value of a point; without a plan (records made before plans were kept)
// the readings were the plan, and the point is known by its applied value.
double nominalOf(const CalibrationSession& session, std::int64_t rangeId, const PointResult& p) {
    for (const TestPoint& point : session.plan) {
        if (point.range_id == rangeId && point.point_index == p.pointIndex) {
            return point.nominal;
        }
    }
    return p.applied;
}

void findWorst(const SessionEvaluation& evaluation, const Instrument& instrument, HistoryRow& row) {
    for (const RangeEvaluation& part : evaluation.ranges) {
        if (part.phase != Phase::AsFound || !part.result) {
            continue;
        }
        for (const PointResult& p : part.result->points) {
            const double fraction = std::fabs(p.error) / p.permissibleError;
            if (!row.worstAsFoundFraction || fraction > *row.worstAsFoundFraction) {
                row.worstAsFoundFraction = fraction;
                row.worstAsFoundRange = part.rangeLabel;
                row.worstAsFoundApplied = p.applied;
                for (const RangeSpec& range : instrument.ranges) {
                    if (range.id == part.rangeId) {
                        row.worstAsFoundUnit = range.unit;
                    }
                }
            }
        }
    }
}

// Test points keyed by range and nominal value.
using PointKey = std::pair<std::int64_t, double>;

void collectSamples(const Instrument& instrument, const CalibrationSession& session,
                    const SessionEvaluation& evaluation, std::map<PointKey, PointHistory>& points) {
    for (const RangeEvaluation& part : evaluation.ranges) {
        if (!part.result) {
            continue;
        }
        const auto range =
            std::find_if(instrument.ranges.begin(), instrument.ranges.end(),
                         [&part](const RangeSpec& r) { return r.id == part.rangeId; });
        for (const PointResult& p : part.result->points) {
            const double nominal = nominalOf(session, part.rangeId, p);
            PointHistory& history = points[{part.rangeId, nominal}];
            history.rangeId = part.rangeId;
            history.rangeLabel = part.rangeLabel;
            history.unit = range != instrument.ranges.end() ? range->unit : Unit::Volt;
            history.nominal = nominal;
            history.permissibleError = p.permissibleError; // sessions come oldest first
            const PointSample sample{dayOf(session.started_at), session.id, part.phase, p.applied,
                                     p.error};
            (part.phase == Phase::AsFound ? history.asFound : history.asLeft).push_back(sample);
        }
    }
}

std::string quantity(double value, Unit unit) {
    return formatEngineering(value, 3, unit);
}

// Written with a leading sign, as errors are on records.
std::string signedQuantity(double value, Unit unit) {
    std::string text(value >= 0.0 ? "+" : "");
    return text.append(quantity(value, unit));
}

std::string withP(double pValue) {
    char text[32];
    std::snprintf(text, sizeof text, "p = %.2g", pValue);
    return text;
}

std::string describeDrift(const PointHistory& point, double significanceLevel) {
    const DriftResult& drift = *point.drift;
    const std::string basis =
        " (" + std::to_string(point.fittedCount) + " results" +
        (point.fittedSince ? " since the adjustment of " + formatDay(*point.fittedSince) : "") +
        "; t-test of the slope at the " + std::to_string(std::lround(significanceLevel * 100)) +
        " % level)";
    if (!drift.significant) {
        return "no significant drift: slope " + signedQuantity(drift.slopePerYear, point.unit) +
               " per year, " + withP(drift.pValue) + basis + ".";
    }
    std::string text = "drift of " + signedQuantity(drift.slopePerYear, point.unit) +
                       " per year, " + withP(drift.pValue) + basis;
    if (drift.projectedLimitDate) {
        const double limit =
            drift.slopePerYear > 0.0 ? point.permissibleError : -point.permissibleError;
        const bool passed = point.line && *drift.projectedLimitDate <= point.line->to;
        text += passed ? "; the fitted line had already reached the limit of "
                       : "; the fitted line reaches the limit of ";
        text +=
            signedQuantity(limit, point.unit) + " around " + formatDay(*drift.projectedLimitDate);
    }
    return text + ".";
}

void analyse(PointHistory& point, double significanceLevel) {
    std::vector<DriftObservation> observations;
    if (!point.asLeft.empty()) {
        const PointSample& reset = point.asLeft.back();
        point.fittedSince = reset.date;
        observations.push_back({reset.date, reset.error});
    }
    for (const PointSample& sample : point.asFound) {
        if (!point.fittedSince || sample.date > *point.fittedSince) {
            observations.push_back({sample.date, sample.error});
        }
    }
    point.fittedCount = observations.size();
    const bool twoDates =
        observations.size() >= 2 && observations.front().date != observations.back().date;
    if (observations.size() < 3 || !twoDates || !(point.permissibleError > 0.0)) {
        point.summary =
            "no drift analysis: " + std::to_string(observations.size()) + " result" +
            (observations.size() == 1 ? "" : "s") +
            (point.fittedSince ? " since the adjustment of " + formatDay(*point.fittedSince)
                               : std::string()) +
            ", and a trend needs at least three on two or more dates.";
        return;
    }
    point.drift = analyseDrift(observations, point.permissibleError, significanceLevel);
    DriftLine line;
    line.from = observations.front().date;
    line.to = observations.back().date;
    line.slopePerYear = point.drift->slopePerYear;
    line.errorAtTo = point.drift->errorAtLast;
    line.errorAtFrom =
        line.errorAtTo - line.slopePerYear * (line.to - line.from).count() / kDaysPerYear;
    line.reachesLimit = point.drift->projectedLimitDate;
    point.line = line;
    point.summary = describeDrift(point, significanceLevel);
}

std::string percentText(double fraction) {
    return std::to_string(std::lround(fraction * 100.0)) + " %";
}

void recommend(const Instrument& instrument, const std::vector<HistoryRow>& rows,
               const StaircaseSettings& settings, IntervalFinding& finding) {
    finding.registeredDays = instrument.interval_days;
    std::size_t withoutAsFound = 0;
    for (const HistoryRow& row : rows) {
        if (!row.counted) {
            continue;
        }
        if (!row.asFound || !row.worstAsFoundFraction) {
            ++withoutAsFound;
            continue;
        }
        // In tolerance as the evaluator decided it: a pass or a conditional pass (the error is
        // within the limit either way, ILAC G8:09/2019 4.2.3).
        const bool inTolerance =
            *row.asFound == Outcome::Pass || *row.asFound == Outcome::ConditionalPass;
        finding.history.push_back({dayOf(row.startedAt), inTolerance, *row.worstAsFoundFraction});
        finding.historySessions.push_back(row.sessionId);
    }
    if (finding.history.empty()) {
        finding.summary = "no recommendation: the instrument has no approved record with "
                          "as-found results yet; the registered interval of " +
                          std::to_string(instrument.interval_days) + " days stands.";
        return;
    }
    const IntervalRecommendation& r = finding.recommendation.emplace(
        recommendInterval(instrument.interval_days, finding.history, settings));
    std::string text =
        "Starting from the registered interval of " + std::to_string(instrument.interval_days) +
        " days, the " + std::to_string(r.total) + " approved as-found result" +
        (r.total == 1 ? "" : "s") + " (" + std::to_string(r.inToleranceCount) +
        " in tolerance, an observed reliability of " + percentText(r.observedReliability) +
        ") were applied in date order and lead to " + std::to_string(r.recommendedDays) + " days.";
    if (withoutAsFound > 0) {
        text += ' ';
        text += std::to_string(withoutAsFound) + " approved record" +
                (withoutAsFound == 1 ? " has" : "s have") +
                " no as-found results (calibrated after repair) and " +
                (withoutAsFound == 1 ? "was" : "were") + " left out.";
    }
    finding.summary = text + " Method: " + r.method + ".";
}

} // namespace

InstrumentHistory buildHistory(const Instrument& instrument,
                               const std::vector<CalibrationSession>& sessions,
                               const std::vector<ReferenceStandard>& registerStandards,
                               const std::vector<User>& users, const HistorySettings& settings) {
    std::vector<const CalibrationSession*> ordered;
    for (const CalibrationSession& session : sessions) {
        if (session.instrument_id != instrument.id) {
            throw std::invalid_argument(
                "history: session " + std::to_string(session.id) + " belongs to instrument " +
                std::to_string(session.instrument_id) + ", not to " + instrument.asset_tag);
        }
        ordered.push_back(&session);
    }
    std::sort(ordered.begin(), ordered.end(), [](const auto* a, const auto* b) {
        return a->started_at != b->started_at ? a->started_at < b->started_at : a->id < b->id;
    });
    InstrumentHistory history;
    std::map<PointKey, PointHistory> points;
    for (const CalibrationSession* session : ordered) {
        HistoryRow row;
        row.sessionId = session->id;
        row.revision = session->revision;
        row.state = session->state;
        row.supersedesId = session->supersedes_id;
        row.amendmentReason = session->amendment_reason;
        row.startedAt = session->started_at;
        row.approvedAt = session->approved_at;
        row.technician = nameOf(users, session->technician_id);
        row.reviewer = session->reviewer_id ? nameOf(users, *session->reviewer_id) : "";
        row.counted = session->state == SessionState::Approved;
        if (submitted(*session)) {
            const EvaluationBasis basis = evaluationBasis(instrument, *session, registerStandards);
            // The history shows no advice, so the diode curve (a circuit solve per reading of
            // a rectifier range) is left out; results and outcomes are the same without it.
            const SessionEvaluation evaluation =
                evaluateSession(instrument, *session, basis.inputs, RectifierCurve::Omitted);
            row.asFound = evaluation.asFound;
            row.asLeft = evaluation.asLeft;
            row.overall = evaluation.overall;
            row.problems = evaluation.problems;
            row.adjusted = std::any_of(
                evaluation.ranges.begin(), evaluation.ranges.end(),
                [](const RangeEvaluation& part) { return part.phase == Phase::AsLeft; });
            findWorst(evaluation, instrument, row);
            if (row.counted) {
                collectSamples(instrument, *session, evaluation, points);
            }
        }
        history.rows.push_back(std::move(row));
    }
    for (const HistoryRow& amending : history.rows) {
        if (amending.supersedesId) {
            for (HistoryRow& amended : history.rows) {
                if (amended.sessionId == *amending.supersedesId &&
                    amended.state == SessionState::Superseded) {
                    amended.supersededBy = amending.sessionId;
                }
            }
        }
    }
    for (const RangeSpec& range : instrument.ranges) {
        for (auto& [key, point] : points) { // std::map: ascending nominal within a range
            if (key.first == range.id) {
                analyse(point, settings.significanceLevel);
                history.points.push_back(std::move(point));
            }
        }
    }
    recommend(instrument, history.rows, settings.staircase, history.interval);
    return history;
}

double fittedErrorOn(const DriftLine& line, std::chrono::sys_days day) {
    return line.errorAtTo + line.slopePerYear * (day - line.to).count() / kDaysPerYear;
}

} // namespace mw
