// The history report: the item, every calibration, the interval walk and the drift charts.
#include "core/record/history_report.h"

#include "core/history/calendar.h"
#include "core/record/calibration_record.h"
#include "core/record/record_format.h"
#include "core/record/record_parts.h"

#include <cmath>

namespace mw::record {
namespace {

using detail::text;

std::string outcome(const std::optional<Outcome>& value) {
    return value ? text(displayName(*value)) : std::string("-");
}

std::string percentOfLimit(double fraction) {
    return std::to_string(std::lround(fraction * 100.0)) + " %";
}

// The state in a word, with the revision of an amendment: the table has many columns.
std::string stateWords(const HistoryRow& row) {
    std::string words;
    switch (row.state) {
    case SessionState::Draft:
        words = "Draft";
        break;
    case SessionState::Submitted:
        words = "Awaiting review";
        break;
    case SessionState::Returned:
        words = "Returned";
        break;
    case SessionState::Approved:
        words = "Approved";
        break;
    case SessionState::Superseded:
        words = "Superseded";
        break;
    }
    return row.revision > 1 ? words + " (rev. " + std::to_string(row.revision) + ")" : words;
}

bool outOfTolerance(const std::optional<Outcome>& asFound) {
    return asFound && (*asFound == Outcome::Fail || *asFound == Outcome::ConditionalFail);
}

void addCalibrations(const HistoryReportSource& source, Document& document) {
    const Instrument& instrument = source.instrument;
    Table table;
    table.columns = {{"Started"},  {"Record"},     {"State"},
                     {"As found"}, {"As left"},    {"Worst as found", Align::Right},
                     {"At"},       {"Technician"}, {"Reviewer"}};
    for (const HistoryRow& row : source.history.rows) {
        std::string where = "-";
        std::string worst = "-";
        if (row.worstAsFoundFraction) {
            worst = percentOfLimit(*row.worstAsFoundFraction);
            const RangeSpec* range = nullptr;
            for (const RangeSpec& r : instrument.ranges) {
                range = r.label == row.worstAsFoundRange ? &r : range;
            }
            // The range is named only where the instrument has several.
            where = range ? scaleValue(row.worstAsFoundApplied, *range)
                          : quantity(row.worstAsFoundApplied, row.worstAsFoundUnit);
            if (instrument.ranges.size() > 1) {
                where = row.worstAsFoundRange + ": " + where;
            }
        }
        table.rows.push_back(
            {formatDay(dayOf(row.startedAt)), recordIdentifier(instrument, row.sessionId),
             stateWords(row), outcome(row.asFound), outcome(row.asLeft), worst, where,
             row.technician, row.reviewer.empty() ? std::string("-") : row.reviewer});
        table.emphasised.push_back(outOfTolerance(row.asFound));
    }
    document.blocks.push_back(Heading{"Calibrations", 1});
    if (table.rows.empty()) {
        document.blocks.push_back(Paragraph{"The instrument has not been calibrated yet."});
        return;
    }
    document.blocks.push_back(table);
    document.blocks.push_back(Paragraph{
        "Outcomes are the session evaluator's. Worst as found: the largest error of the "
        "as-found points as a share of the limit of error; At: the applied value where it was "
        "found. Rows in bold "
        "were found out of tolerance. Only approved records are used for the interval and the "
        "drift below; a superseded revision is replaced by its amendment, and work not yet "
        "approved is listed for completeness.",
        ParagraphStyle::Small});
}

std::string stepWords(IntervalStepKind kind) {
    switch (kind) {
    case IntervalStepKind::Lengthen:
        return "lengthened";
    case IntervalStepKind::Keep:
        return "kept";
    case IntervalStepKind::Shorten:
        return "shortened";
    }
    return "?";
}

void addInterval(const HistoryReportSource& source, Document& document) {
    const IntervalFinding& finding = source.history.interval;
    document.blocks.push_back(Heading{"Recalibration interval", 1});
    std::vector<Field> fields{{"Registered interval", days(finding.registeredDays)}};
    if (finding.recommendation) {
        fields.push_back({"Recommended interval", days(finding.recommendation->recommendedDays)});
    }
    document.blocks.push_back(FieldList{fields});
    document.blocks.push_back(Paragraph{finding.summary});
    if (finding.recommendation) {
        Table steps;
        steps.columns = {{"Date"},     {"Record"},
                         {"As found"}, {"Worst as found", Align::Right},
                         {"Interval"}, {"Interval after", Align::Right}};
        const auto& recommendation = *finding.recommendation;
        for (std::size_t i = 0; i < recommendation.steps.size(); ++i) {
            const IntervalStep& step = recommendation.steps[i];
            const AsFoundRecord& record = finding.history.at(i);
            steps.rows.push_back(
                {formatDay(step.date),
                 recordIdentifier(source.instrument, finding.historySessions.at(i)),
                 record.inTolerance ? "in tolerance" : "out of tolerance",
                 percentOfLimit(record.worstFractionOfLimit), stepWords(step.kind),
                 days(std::lround(step.intervalDays))});
            steps.emphasised.push_back(!record.inTolerance);
        }
        document.blocks.push_back(steps);
    }
    document.blocks.push_back(Paragraph{
        "The recommendation is for the laboratory's own planning. A recommended interval goes "
        "on a calibration certificate only where it has been agreed with the customer "
        "(ISO/IEC 17025:2017).",
        ParagraphStyle::Small});
}

void addDrift(const HistoryReportSource& source, Document& document) {
    document.blocks.push_back(Heading{"Drift per test point", 1});
    if (source.history.points.empty()) {
        document.blocks.push_back(Paragraph{"No approved results yet."});
        return;
    }
    document.blocks.push_back(Paragraph{
        "Each chart shows the as-found error of one test point on every approved record (and "
        "the as-left error after an adjustment) against the date, with its limits of error. A "
        "straight line is fitted by least squares to the results since the last adjustment, "
        "which resets the error; its slope is tested against zero with Student's t, and only a "
        "significant drift is projected to the date it reaches a limit.",
        ParagraphStyle::Small});
    DriftChartGrid grid;
    for (const PointHistory& point : source.history.points) {
        const RangeSpec* range = detail::rangeById(source.instrument, point.rangeId);
        const std::string at =
            range ? scaleValue(point.nominal, *range) : quantity(point.nominal, point.unit);
        grid.charts.push_back({point.rangeLabel + " range at " + at, point});
    }
    document.blocks.push_back(std::move(grid));
}

} // namespace

Document buildHistoryReport(const HistoryReportSource& source) {
    Document document;
    const std::string asOf = formatDay(dayOf(source.printedAt));
    document.title = "Instrument history: " + source.instrument.asset_tag;
    document.identifier = "History of " + source.instrument.asset_tag + " as of " + asOf;
    document.runningHead = detail::runningHead(source.lab);
    document.blocks.push_back(Paragraph{
        "For the laboratory's supervisors: every calibration of the instrument up to " + asOf +
        ", the recalibration interval its results lead to, and the drift of each test "
        "point. This report is not a calibration record; the records themselves are "
        "printed one by one."});
    document.blocks.push_back(Heading{"Item", 1});
    std::vector<Field> fields = detail::labFields(source.lab);
    for (Field& field : detail::instrumentFields(source.instrument)) {
        fields.push_back(std::move(field));
    }
    fields.push_back({"Status", text(displayName(source.instrument.status))});
    fields.push_back({"Owner and location",
                      source.instrument.owner + (source.instrument.location.empty()
                                                     ? std::string()
                                                     : ", " + source.instrument.location)});
    document.blocks.push_back(FieldList{fields});
    addCalibrations(source, document);
    addInterval(source, document);
    addDrift(source, document);
    document.endMark = "End of the history of " + source.instrument.asset_tag + ".";
    return document;
}

} // namespace mw::record
