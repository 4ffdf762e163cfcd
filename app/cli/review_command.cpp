// meterwright review --list: the calibrations waiting for review, as the review queue shows
// them. Approving or returning one stays in the window, where the reviewer signs with a
// password a person types.
#include "app/cli/cli_support.h"
#include "app/cli/desk_commands.h"
#include "app/cli/workbook_access.h"
#include "core/history/calendar.h"
#include "storage/instrument_repository.h"
#include "storage/session_repository.h"
#include "storage/sql_support.h"
#include "storage/standard_repository.h"
#include "storage/user_repository.h"

#include <QJsonArray>
#include <QJsonObject>

#include <map>

namespace mw::cli {
namespace {

const QString kCommand = QStringLiteral("review");

// Names by id, read once for the whole queue.
struct Names {
    std::map<std::int64_t, QString> instruments;
    std::map<std::int64_t, QString> standards;
    std::map<std::int64_t, QString> users;

    static QString of(const std::map<std::int64_t, QString>& names, std::int64_t id,
                      const char* what) {
        const auto it = names.find(id);
        return it != names.end() ? it->second : QStringLiteral("%1 %2").arg(what).arg(id);
    }
};

Names namesOf(storage::Workbook& workbook) {
    Names names;
    for (const Instrument& i : storage::InstrumentRepository(workbook).all()) {
        names.instruments[i.id] = fromEngine(i.asset_tag);
    }
    for (const ReferenceStandard& s : storage::StandardRepository(workbook).all()) {
        names.standards[s.id] = fromEngine(s.asset_tag);
    }
    for (const User& u : storage::UserRepository(workbook).all()) {
        names.users[u.id] = fromEngine(u.full_name.empty() ? u.login : u.full_name);
    }
    return names;
}

// A standard used past its due date on the day the work was submitted (the rule the workbook
// enforces at submission, with the justification it then requires).
std::vector<const StandardUse*> overdueUses(const CalibrationSession& session) {
    std::vector<const StandardUse*> uses;
    const auto on = dayOf(session.submitted_at.value_or(session.started_at));
    for (const StandardUse& use : session.standards) {
        if (use.due_date < on) {
            uses.push_back(&use);
        }
    }
    return uses;
}

QJsonObject sessionJson(const CalibrationSession& s, const Names& names) {
    QJsonArray overdue;
    for (const StandardUse* use : overdueUses(s)) {
        overdue.append(QJsonObject{
            {QStringLiteral("asset_tag"), Names::of(names.standards, use->standard_id, "standard")},
            {QStringLiteral("certificate"), fromEngine(use->certificate_number)},
            {QStringLiteral("due_date"), fromEngine(formatDay(use->due_date))},
            {QStringLiteral("justification"), fromEngine(use->overdue_justification)},
        });
    }
    return QJsonObject{
        {QStringLiteral("id"), qint64(s.id)},
        {QStringLiteral("instrument"), Names::of(names.instruments, s.instrument_id, "instrument")},
        {QStringLiteral("technician"), Names::of(names.users, s.technician_id, "user")},
        // ISO 8601, as `meterwright sessions --json` writes times.
        {QStringLiteral("started_at"), storage::sql::toIso(s.started_at)},
        {QStringLiteral("submitted_at"), s.submitted_at
                                             ? QJsonValue(storage::sql::toIso(*s.submitted_at))
                                             : QJsonValue(QJsonValue::Null)},
        {QStringLiteral("outcome"),
         s.outcome ? QJsonValue(fromEngine(toText(*s.outcome))) : QJsonValue(QJsonValue::Null)},
        {QStringLiteral("revision"), s.revision},
        {QStringLiteral("amends"),
         s.supersedes_id ? QJsonValue(qint64(*s.supersedes_id)) : QJsonValue(QJsonValue::Null)},
        {QStringLiteral("overdue_standards"), overdue},
    };
}

void printText(const std::vector<CalibrationSession>& queue, const Names& names) {
    printLine(QStringLiteral("%1 calibration%2 waiting for review")
                  .arg(queue.size())
                  .arg(queue.size() == 1 ? QString() : QStringLiteral("s")));
    for (const CalibrationSession& s : queue) {
        printLine(
            QStringLiteral("%1 %2 %3 submitted %4, %5%6")
                .arg(s.id, 6)
                .arg(Names::of(names.instruments, s.instrument_id, "instrument"), -10)
                .arg(Names::of(names.users, s.technician_id, "user"), -20)
                .arg(s.submitted_at ? fromEngine(formatTimeUtc(*s.submitted_at))
                                    : QStringLiteral("-"),
                     s.outcome ? fromEngine(displayName(*s.outcome)) : QStringLiteral("no outcome"),
                     s.supersedes_id ? QStringLiteral(" (revision %1, amends session %2)")
                                           .arg(s.revision)
                                           .arg(*s.supersedes_id)
                                     : QString()));
        for (const StandardUse* use : overdueUses(s)) {
            printLine(QStringLiteral("       uses %1 past its due date %2: %3")
                          .arg(Names::of(names.standards, use->standard_id, "standard"),
                               fromEngine(formatDay(use->due_date)),
                               fromEngine(use->overdue_justification)));
        }
    }
}

int runReview(const QStringList& arguments) {
    QCommandLineParser parser;
    parser.setApplicationDescription(QStringLiteral(
        "With --list, lists the calibrations submitted and waiting for review, oldest first: "
        "session id, instrument, technician, when submitted, the overall outcome the session "
        "evaluator gave, and any reference standard used past its due date with the "
        "technician's justification. Approving or returning a calibration is done in the "
        "window, where the reviewer signs with their password."));
    parser.addPositionalArgument(QStringLiteral("WORKBOOK"), QStringLiteral("the workbook file"));
    parser.addOption({QStringLiteral("list"), QStringLiteral("List the submitted calibrations.")});
    parseOptions(parser, kCommand, arguments);
    if (helpRequested(parser, kCommand)) {
        return 0;
    }
    const QString path = onlyWorkbookArgument(parser.positionalArguments());
    if (!parser.isSet(QStringLiteral("list"))) {
        throw UsageError(QStringLiteral("give --list to list the calibrations waiting for "
                                        "review; approving or returning one is done in the "
                                        "window, where the reviewer signs with their password"));
    }
    const auto workbook = openForReading(path);
    const Names names = namesOf(*workbook);
    const std::vector<CalibrationSession> queue =
        storage::SessionRepository(*workbook).withState(SessionState::Submitted);
    if (!parser.isSet(QStringLiteral("json"))) {
        printText(queue, names);
        return 0;
    }
    QJsonArray rows;
    for (const CalibrationSession& s : queue) {
        rows.append(sessionJson(s, names));
    }
    printJson(QJsonObject{{QStringLiteral("workbook"), path}, {QStringLiteral("sessions"), rows}});
    return 0;
}

} // namespace

Command reviewCommand() {
    return Command{kCommand, QStringLiteral("list the calibrations waiting for review"), runReview};
}

} // namespace mw::cli
