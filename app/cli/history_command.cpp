// meterwright history: one instrument over time as core's buildHistory gives it (every
// calibration newest first, the as-found error of each test point with its drift analysis,
// and the recalibration interval the staircase recommends). The command only formats.
#include "app/cli/cli_support.h"
#include "app/cli/desk_commands.h"
#include "app/cli/workbook_access.h"
#include "app/record/record_loader.h"
#include "core/history/calendar.h"
#include "core/history/instrument_history.h"

#include <QJsonArray>
#include <QJsonObject>

#include <cmath>

namespace mw::cli {
namespace {

const QString kCommand = QStringLiteral("history");

QJsonValue orNull(bool present, const QJsonValue& value) {
    return present ? value : QJsonValue(QJsonValue::Null);
}

QJsonValue day(std::optional<std::chrono::sys_days> date) {
    return orNull(date.has_value(), date ? fromEngine(formatDay(*date)) : QString());
}

QJsonValue outcome(std::optional<Outcome> value) {
    return orNull(value.has_value(), value ? fromEngine(toText(*value)) : QString());
}

QString outcomeWords(std::optional<Outcome> value) {
    return value ? fromEngine(displayName(*value)) : QStringLiteral("-");
}

std::optional<std::chrono::sys_days> dayOfOptional(std::optional<Timestamp> at) {
    return at ? std::optional(dayOf(*at)) : std::nullopt;
}

QJsonObject rowJson(const HistoryRow& row) {
    QJsonArray problems;
    for (const std::string& problem : row.problems) {
        problems.append(fromEngine(problem));
    }
    const bool worst = row.worstAsFoundFraction.has_value();
    return QJsonObject{
        {QStringLiteral("session"), qint64(row.sessionId)},
        {QStringLiteral("revision"), row.revision},
        {QStringLiteral("state"), fromEngine(toText(row.state))},
        {QStringLiteral("started_on"), day(dayOf(row.startedAt))},
        {QStringLiteral("approved_on"), day(dayOfOptional(row.approvedAt))},
        {QStringLiteral("as_found"), outcome(row.asFound)},
        {QStringLiteral("as_left"), outcome(row.asLeft)},
        {QStringLiteral("overall"), outcome(row.overall)},
        {QStringLiteral("worst_as_found_percent_of_limit"),
         orNull(worst, jsonNumber(row.worstAsFoundFraction.value_or(0.0) * 100.0))},
        {QStringLiteral("worst_as_found_range"), orNull(worst, fromEngine(row.worstAsFoundRange))},
        {QStringLiteral("worst_as_found_applied"),
         orNull(worst, jsonNumber(row.worstAsFoundApplied))},
        {QStringLiteral("technician"), fromEngine(row.technician)},
        {QStringLiteral("reviewer"), orNull(!row.reviewer.empty(), fromEngine(row.reviewer))},
        {QStringLiteral("adjusted"), row.adjusted},
        {QStringLiteral("counted"), row.counted},
        {QStringLiteral("problems"), problems},
    };
}

QJsonArray samplesJson(const std::vector<PointSample>& samples) {
    QJsonArray out;
    for (const PointSample& s : samples) {
        out.append(QJsonObject{{QStringLiteral("date"), day(s.date)},
                               {QStringLiteral("session"), qint64(s.sessionId)},
                               {QStringLiteral("applied"), jsonNumber(s.applied)},
                               {QStringLiteral("error"), jsonNumber(s.error)}});
    }
    return out;
}

QJsonObject pointJson(const PointHistory& point) {
    const std::optional<DriftResult>& drift = point.drift;
    return QJsonObject{
        {QStringLiteral("range"), fromEngine(point.rangeLabel)},
        {QStringLiteral("range_id"), qint64(point.rangeId)},
        {QStringLiteral("unit"), fromEngine(unitSymbol(point.unit))},
        {QStringLiteral("applied"), jsonNumber(point.nominal)},
        {QStringLiteral("limit"), jsonNumber(point.permissibleError)},
        {QStringLiteral("observations"), samplesJson(point.asFound)},
        {QStringLiteral("as_left"), samplesJson(point.asLeft)},
        {QStringLiteral("fitted_since"), day(point.fittedSince)},
        {QStringLiteral("fitted_count"), qint64(point.fittedCount)},
        {QStringLiteral("slope_per_year"),
         orNull(drift.has_value(), jsonNumber(drift ? drift->slopePerYear : 0.0))},
        {QStringLiteral("p_value"),
         orNull(drift.has_value(), jsonNumber(drift ? drift->pValue : 0.0))},
        {QStringLiteral("significant"), drift && drift->significant},
        {QStringLiteral("projected_limit_date"),
         day(drift ? drift->projectedLimitDate : std::nullopt)},
        {QStringLiteral("summary"), fromEngine(point.summary)},
    };
}

QString stepWord(IntervalStepKind kind) {
    switch (kind) {
    case IntervalStepKind::Lengthen:
        return QStringLiteral("lengthen");
    case IntervalStepKind::Shorten:
        return QStringLiteral("shorten");
    case IntervalStepKind::Keep:
        break;
    }
    return QStringLiteral("keep");
}

QJsonObject intervalJson(const IntervalFinding& finding) {
    const auto& r = finding.recommendation;
    QJsonArray steps;
    if (r) {
        for (std::size_t i = 0; i < r->steps.size(); ++i) {
            const IntervalStep& step = r->steps[i];
            const bool known = i < finding.historySessions.size();
            steps.append(QJsonObject{
                {QStringLiteral("date"), day(step.date)},
                {QStringLiteral("session"),
                 orNull(known, known ? qint64(finding.historySessions[i]) : 0)},
                {QStringLiteral("step"), stepWord(step.kind)},
                {QStringLiteral("interval_days"), jsonNumber(step.intervalDays)},
            });
        }
    }
    return QJsonObject{
        {QStringLiteral("registered_days"), finding.registeredDays},
        {QStringLiteral("recommended_days"), orNull(r.has_value(), r ? r->recommendedDays : 0)},
        {QStringLiteral("in_tolerance"),
         orNull(r.has_value(), qint64(r ? r->inToleranceCount : 0))},
        {QStringLiteral("total"), orNull(r.has_value(), qint64(r ? r->total : 0))},
        {QStringLiteral("observed_reliability"),
         orNull(r.has_value(), jsonNumber(r ? r->observedReliability : 0.0))},
        {QStringLiteral("method"), orNull(r.has_value(), fromEngine(r ? r->method : ""))},
        {QStringLiteral("steps"), steps},
        {QStringLiteral("summary"), fromEngine(finding.summary)},
    };
}

QJsonObject historyJson(const Instrument& instrument, const InstrumentHistory& history) {
    QJsonArray rows;
    for (auto it = history.rows.rbegin(); it != history.rows.rend(); ++it) {
        rows.append(rowJson(*it)); // newest first, as the screen lists them
    }
    QJsonArray points;
    for (const PointHistory& point : history.points) {
        points.append(pointJson(point));
    }
    return QJsonObject{{QStringLiteral("instrument"), fromEngine(instrument.asset_tag)},
                       {QStringLiteral("description"), fromEngine(instrument.description)},
                       {QStringLiteral("calibrations"), rows},
                       {QStringLiteral("points"), points},
                       {QStringLiteral("interval"), intervalJson(history.interval)}};
}

QString percent(const std::optional<double>& fraction) {
    return fraction ? QStringLiteral("%1 %").arg(std::lround(*fraction * 100.0))
                    : QStringLiteral("-");
}

void printText(const Instrument& instrument, const InstrumentHistory& history) {
    printLine(QStringLiteral("history of %1 (%2): %3 calibration%4")
                  .arg(fromEngine(instrument.asset_tag), fromEngine(instrument.description))
                  .arg(history.rows.size())
                  .arg(history.rows.size() == 1 ? QString() : QStringLiteral("s")));
    printLine(QStringLiteral("%1  %2 %3 %4 %5 %6 %7 %8 %9")
                  .arg(QStringLiteral("session"), 7)
                  .arg(QStringLiteral("started"), -10)
                  .arg(QStringLiteral("approved"), -10)
                  .arg(QStringLiteral("as found"), -17)
                  .arg(QStringLiteral("as left"), -17)
                  .arg(QStringLiteral("worst"), 6)
                  .arg(QStringLiteral("technician"), -20)
                  .arg(QStringLiteral("reviewer"), -20)
                  .arg(QStringLiteral("state")));
    for (auto it = history.rows.rbegin(); it != history.rows.rend(); ++it) {
        const HistoryRow& row = *it;
        printLine(
            QStringLiteral("%1  %2 %3 %4 %5 %6 %7 %8 %9")
                .arg(row.sessionId, 7)
                .arg(fromEngine(formatDay(dayOf(row.startedAt))), -10)
                .arg(row.approvedAt ? fromEngine(formatDay(dayOf(*row.approvedAt)))
                                    : QStringLiteral("-"),
                     -10)
                .arg(outcomeWords(row.asFound), -17)
                .arg(outcomeWords(row.asLeft), -17)
                .arg(percent(row.worstAsFoundFraction), 6)
                .arg(fromEngine(row.technician), -20)
                .arg(row.reviewer.empty() ? QStringLiteral("-") : fromEngine(row.reviewer), -20)
                .arg(fromEngine(displayName(row.state))));
    }
    printLine(QString());
    for (const PointHistory& point : history.points) {
        printLine(QStringLiteral("%1 at %2: %3")
                      .arg(fromEngine(point.rangeLabel),
                           fromEngine(formatEngineering(point.nominal, 4, point.unit)),
                           fromEngine(point.summary)));
    }
    printLine(QString());
    printLine(QStringLiteral("interval: %1").arg(fromEngine(history.interval.summary)));
}

int runHistory(const QStringList& arguments) {
    QCommandLineParser parser;
    parser.setApplicationDescription(QStringLiteral(
        "Shows the history of one instrument: every calibration newest first (dates, as-found "
        "and as-left outcome, worst as-found point as % of its limit, technician, reviewer, "
        "state), the as-found error of each test point over its approved records with the "
        "drift analysis (slope per year, p-value, whether it is significant, the date the "
        "fitted line reaches the limit), and the recalibration interval the staircase "
        "recommends with each step. With --json, the same as one JSON object."));
    parser.addPositionalArgument(QStringLiteral("WORKBOOK"), QStringLiteral("the workbook file"));
    parser.addOption({QStringLiteral("instrument"), QStringLiteral("The instrument's asset tag."),
                      QStringLiteral("TAG")});
    parseOptions(parser, kCommand, arguments);
    if (helpRequested(parser, kCommand)) {
        return 0;
    }
    const QString path = onlyWorkbookArgument(parser.positionalArguments());
    const QString tag = requireText(parser, QStringLiteral("instrument"));
    const auto workbook = openForReading(path);
    const record::RecordLoader loader(*workbook);
    const auto instrument = loader.instrumentByTag(tag);
    if (!instrument) {
        throw UsageError(QStringLiteral("no instrument with asset tag \"%1\" in %2 (see "
                                        "meterwright sessions)")
                             .arg(tag, path));
    }
    const auto source = loader.history(instrument->id, record::printTime());
    if (parser.isSet(QStringLiteral("json"))) {
        printJson(historyJson(*instrument, source->history));
    } else {
        printText(*instrument, source->history);
    }
    return 0;
}

} // namespace

Command historyCommand() {
    return Command{kCommand,
                   QStringLiteral("show an instrument's calibrations, drift and interval"),
                   runHistory};
}

} // namespace mw::cli
