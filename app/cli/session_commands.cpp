// meterwright sessions: the calibration sessions of a workbook, and one session with its
// evaluation by the session evaluator (the keys of `calc evaluate --json` per range and phase).
#include "app/cli/session_commands.h"

#include "app/cli/calc_evaluate_output.h"
#include "app/cli/cli_support.h"
#include "app/cli/workbook_access.h"
#include "core/evaluation/session_evaluation.h"
#include "storage/instrument_repository.h"
#include "storage/session_repository.h"
#include "storage/sql_support.h"
#include "storage/standard_repository.h"

#include <QJsonArray>
#include <QJsonObject>

#include <map>

namespace mw::cli {
namespace {

const QString kCommand = QStringLiteral("sessions");

QString text(std::string_view view) {
    return QString::fromUtf8(view.data(), qsizetype(view.size()));
}

QJsonValue time(const std::optional<Timestamp>& at) {
    return at ? QJsonValue(storage::sql::toIso(*at)) : QJsonValue(QJsonValue::Null);
}

QString day(const std::optional<Timestamp>& at) {
    return at ? storage::sql::toIso(*at).left(10) : QStringLiteral("-");
}

QJsonObject summaryJson(const CalibrationSession& s, const QString& tag) {
    return QJsonObject{
        {QStringLiteral("id"), qint64(s.id)},
        {QStringLiteral("instrument"), tag},
        {QStringLiteral("state"), text(toText(s.state))},
        {QStringLiteral("outcome"),
         s.outcome ? QJsonValue(text(toText(*s.outcome))) : QJsonValue(QJsonValue::Null)},
        {QStringLiteral("started_at"), time(s.started_at)},
        {QStringLiteral("submitted_at"), time(s.submitted_at)},
        {QStringLiteral("approved_at"), time(s.approved_at)},
        {QStringLiteral("revision"), s.revision},
        {QStringLiteral("supersedes"),
         s.supersedes_id ? QJsonValue(qint64(*s.supersedes_id)) : QJsonValue(QJsonValue::Null)},
    };
}

std::optional<SessionState> stateOption(const QCommandLineParser& parser) {
    if (!parser.isSet(QStringLiteral("state"))) {
        return std::nullopt;
    }
    const QString word = parser.value(QStringLiteral("state"));
    if (auto state = fromText<SessionState>(word.toStdString())) {
        return state;
    }
    throw UsageError(QStringLiteral("option --state \"%1\": use draft, submitted, returned, "
                                    "approved or superseded")
                         .arg(word));
}

int list(storage::Workbook& workbook, const QCommandLineParser& parser) {
    storage::InstrumentRepository instruments(workbook);
    std::map<std::int64_t, QString> tags;
    for (const Instrument& i : instruments.all()) {
        tags[i.id] = QString::fromStdString(i.asset_tag);
    }
    std::vector<CalibrationSession> sessions;
    storage::SessionRepository repository(workbook);
    if (parser.isSet(QStringLiteral("instrument"))) {
        const QString tag = parser.value(QStringLiteral("instrument"));
        const auto instrument = instruments.findByTag(tag);
        if (!instrument) {
            throw UsageError(QStringLiteral("no instrument with asset tag \"%1\"").arg(tag));
        }
        sessions = repository.historyOf(instrument->id);
    } else {
        for (SessionState state :
             {SessionState::Draft, SessionState::Submitted, SessionState::Returned,
              SessionState::Approved, SessionState::Superseded}) {
            for (CalibrationSession& s : repository.withState(state)) {
                sessions.push_back(std::move(s));
            }
        }
        std::sort(sessions.begin(), sessions.end(),
                  [](const auto& a, const auto& b) { return a.id < b.id; });
    }
    const std::optional<SessionState> only = stateOption(parser);
    std::erase_if(sessions,
                  [&only](const CalibrationSession& s) { return only && s.state != *only; });
    if (parser.isSet(QStringLiteral("json"))) {
        QJsonArray rows;
        for (const CalibrationSession& s : sessions) {
            rows.append(summaryJson(s, tags[s.instrument_id]));
        }
        printJson(QJsonObject{{QStringLiteral("sessions"), rows}});
        return 0;
    }
    printLine(QStringLiteral("%1 %2 %3 %4 %5 %6 %7")
                  .arg(QStringLiteral("id"), 6)
                  .arg(QStringLiteral("instrument"), -10)
                  .arg(QStringLiteral("started"), -10)
                  .arg(QStringLiteral("submitted"), -10)
                  .arg(QStringLiteral("approved"), -10)
                  .arg(QStringLiteral("state"), -10)
                  .arg(QStringLiteral("outcome")));
    for (const CalibrationSession& s : sessions) {
        printLine(QStringLiteral("%1 %2 %3 %4 %5 %6 %7")
                      .arg(s.id, 6)
                      .arg(tags[s.instrument_id], -10)
                      .arg(day(s.started_at), -10)
                      .arg(day(s.submitted_at), -10)
                      .arg(day(s.approved_at), -10)
                      .arg(text(toText(s.state)), -10)
                      .arg(s.outcome ? text(toText(*s.outcome)) : QStringLiteral("-")));
    }
    return 0;
}

QJsonValue optionalOutcome(const std::optional<Outcome>& outcome) {
    return outcome ? QJsonValue(text(toText(*outcome))) : QJsonValue(QJsonValue::Null);
}

QJsonObject evaluationOf(const Instrument& instrument, const CalibrationSession& s,
                         const SealedInputs& inputs, const SessionEvaluation& evaluation) {
    QJsonArray ranges;
    for (const RangeEvaluation& part : evaluation.ranges) {
        QJsonObject range;
        if (part.result) {
            for (const RangeSpec& spec : instrument.ranges) {
                if (spec.id == part.rangeId) {
                    range = evaluationJson(
                        *part.result, evaluationInputFor(instrument, spec, s, inputs, part.phase));
                }
            }
        }
        range[QStringLiteral("range_id")] = qint64(part.rangeId);
        range[QStringLiteral("range_label")] = QString::fromStdString(part.rangeLabel);
        range[QStringLiteral("phase")] = text(toText(part.phase));
        range[QStringLiteral("reference")] =
            part.reference.empty() ? QJsonValue(QJsonValue::Null)
                                   : QJsonValue(QString::fromStdString(part.reference));
        range[QStringLiteral("problem")] = part.problem.empty()
                                               ? QJsonValue(QJsonValue::Null)
                                               : QJsonValue(QString::fromStdString(part.problem));
        ranges.append(range);
    }
    QJsonArray problems;
    for (const std::string& problem : evaluation.problems) {
        problems.append(QString::fromStdString(problem));
    }
    return QJsonObject{
        {QStringLiteral("overall"), optionalOutcome(evaluation.overall)},
        {QStringLiteral("as_found"), optionalOutcome(evaluation.asFound)},
        {QStringLiteral("as_left"), optionalOutcome(evaluation.asLeft)},
        {QStringLiteral("hazard_caution"),
         evaluation.hazardCaution ? QJsonValue(QString::fromStdString(*evaluation.hazardCaution))
                                  : QJsonValue(QJsonValue::Null)},
        {QStringLiteral("problems"), problems},
        {QStringLiteral("ranges"), ranges},
    };
}

int one(storage::Workbook& workbook, const QCommandLineParser& parser) {
    bool ok = false;
    const QString raw = parser.value(QStringLiteral("session"));
    const qint64 id = raw.toLongLong(&ok);
    const auto session = ok ? storage::SessionRepository(workbook).find(id) : std::nullopt;
    if (!session) {
        throw UsageError(QStringLiteral("no calibration session with id \"%1\"").arg(raw));
    }
    const auto instrument = storage::InstrumentRepository(workbook).find(session->instrument_id);
    if (!instrument) {
        throw UsageError(QStringLiteral("session %1 refers to a missing instrument").arg(id));
    }
    // A record is evaluated with what it was sealed with; a draft, and a record sealed before
    // inputs were recorded, with the register as it stands now (and it says so).
    const bool sealed = session->sealed && session->state != SessionState::Draft &&
                        session->state != SessionState::Returned;
    const SealedInputs inputs =
        sealed ? *session->sealed
               : sealInputs(*instrument, *session, storage::StandardRepository(workbook).all(),
                            session->supersedes_id ? session->sealed : std::nullopt);
    const SessionEvaluation evaluation = evaluateSession(*instrument, *session, inputs);
    QJsonObject out = summaryJson(*session, QString::fromStdString(instrument->asset_tag));
    out[QStringLiteral("record_format")] = session->record_format;
    out[QStringLiteral("inputs")] =
        sealed ? QStringLiteral("sealed with the session")
               : QStringLiteral("the register as it stands now (not sealed with the session)");
    out[QStringLiteral("settings_recorded")] = session->settings.has_value();
    out[QStringLiteral("phases")] = text(toText(session->phases));
    out[QStringLiteral("evaluation")] = evaluationOf(*instrument, *session, inputs, evaluation);
    if (parser.isSet(QStringLiteral("json"))) {
        printJson(out);
        return 0;
    }
    printLine(QStringLiteral("session %1 of %2: %3, outcome %4")
                  .arg(id)
                  .arg(QString::fromStdString(instrument->asset_tag),
                       text(displayName(session->state)),
                       session->outcome ? text(displayName(*session->outcome))
                                        : QStringLiteral("not yet computed")));
    printLine(QStringLiteral("inputs: %1").arg(out.value(QStringLiteral("inputs")).toString()));
    for (const RangeEvaluation& part : evaluation.ranges) {
        printLine(QStringLiteral("%1, %2: %3")
                      .arg(QString::fromStdString(part.rangeLabel), text(toText(part.phase)),
                           part.result ? text(displayName(part.result->overall))
                                       : QString::fromStdString(part.problem)));
    }
    printLine(QStringLiteral("overall: %1")
                  .arg(evaluation.overall ? text(displayName(*evaluation.overall))
                                          : QStringLiteral("none")));
    return 0;
}

int runSessions(const QStringList& arguments) {
    QCommandLineParser parser;
    parser.setApplicationDescription(QStringLiteral(
        "Lists the calibration sessions of a workbook (id, instrument, dates, state, outcome), "
        "or shows one session with its evaluation by the session evaluator: per range and phase "
        "the points with the keys of `calc evaluate --json`, and the overall outcome."));
    parser.addPositionalArgument(QStringLiteral("WORKBOOK"), QStringLiteral("the workbook file"));
    parser.addOption({QStringLiteral("instrument"),
                      QStringLiteral("Only the sessions of the instrument with this asset tag."),
                      QStringLiteral("TAG")});
    parser.addOption({QStringLiteral("state"),
                      QStringLiteral("Only sessions in this state: draft, submitted, returned, "
                                     "approved, superseded."),
                      QStringLiteral("STATE")});
    parser.addOption({QStringLiteral("session"),
                      QStringLiteral("Show this session with its evaluation."),
                      QStringLiteral("ID")});
    parseOptions(parser, kCommand, arguments);
    if (helpRequested(parser, kCommand)) {
        return 0;
    }
    const auto workbook = openForReading(onlyWorkbookArgument(parser.positionalArguments()));
    return parser.isSet(QStringLiteral("session")) ? one(*workbook, parser)
                                                   : list(*workbook, parser);
}

} // namespace

Command sessionsCommand() {
    return Command{kCommand,
                   QStringLiteral("list calibration sessions, or show one with its evaluation"),
                   runSessions};
}

} // namespace mw::cli
