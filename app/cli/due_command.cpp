// meterwright due: the instruments and reference standards due within a window of a day,
// overdue first, as storage's dueReport selects them (the same list as the window's due view).
#include "app/cli/cli_support.h"
#include "app/cli/desk_commands.h"
#include "app/cli/workbook_access.h"
#include "core/history/calendar.h"
#include "storage/due_query.h"

#include <QJsonArray>
#include <QJsonObject>

namespace mw::cli {
namespace {

const QString kCommand = QStringLiteral("due");

QJsonValue day(std::optional<std::chrono::sys_days> date) {
    return date ? QJsonValue(fromEngine(formatDay(*date))) : QJsonValue(QJsonValue::Null);
}

QString kindWord(DueSubject subject) {
    return subject == DueSubject::Instrument ? QStringLiteral("instrument")
                                             : QStringLiteral("standard");
}

QJsonObject entryJson(const DueEntry& entry) {
    QJsonObject out{
        {QStringLiteral("kind"), kindWord(entry.subject)},
        {QStringLiteral("asset_tag"), fromEngine(entry.assetTag)},
        {QStringLiteral("description"), fromEngine(entry.description)},
        {QStringLiteral("due_date"), day(entry.dueDate)},
        {QStringLiteral("days_overdue"),
         entry.daysOverdue ? QJsonValue(*entry.daysOverdue) : QJsonValue(QJsonValue::Null)},
        {QStringLiteral("last_calibrated"), day(entry.lastCalibrated)},
    };
    if (entry.subject == DueSubject::Standard) {
        return out;
    }
    QJsonArray standards;
    for (const DueStandardUse& use : entry.standards) {
        standards.append(QJsonObject{{QStringLiteral("asset_tag"), fromEngine(use.assetTag)},
                                     {QStringLiteral("due_date"), day(use.dueDate)},
                                     {QStringLiteral("in_date"), use.inDate}});
    }
    out[QStringLiteral("location")] = fromEngine(entry.location);
    out[QStringLiteral("status")] = fromEngine(toText(entry.status));
    out[QStringLiteral("last_session")] = entry.lastSessionId
                                              ? QJsonValue(qint64(*entry.lastSessionId))
                                              : QJsonValue(QJsonValue::Null);
    out[QStringLiteral("standards")] = standards;
    out[QStringLiteral("open_session")] =
        entry.openSessionId
            ? QJsonValue(
                  QJsonObject{{QStringLiteral("id"), qint64(*entry.openSessionId)},
                              {QStringLiteral("state"),
                               fromEngine(toText(entry.openState.value_or(SessionState::Draft)))}})
            : QJsonValue(QJsonValue::Null);
    return out;
}

QString whenWords(const DueEntry& entry) {
    if (!entry.daysOverdue) {
        return QStringLiteral("never calibrated");
    }
    const int n = *entry.daysOverdue;
    if (n == 0) {
        return QStringLiteral("due today");
    }
    const int count = n > 0 ? n : -n;
    return QStringLiteral("%1 day%2 %3")
        .arg(count)
        .arg(count == 1 ? QString() : QStringLiteral("s"))
        .arg(n > 0 ? QStringLiteral("overdue") : QStringLiteral("to go"));
}

QString standardsWords(const DueEntry& entry) {
    QStringList words;
    for (const DueStandardUse& use : entry.standards) {
        words << QStringLiteral("%1 (%2)").arg(
            fromEngine(use.assetTag),
            use.inDate ? QStringLiteral("in date")
                       : (use.dueDate ? QStringLiteral("out of date since %1")
                                            .arg(fromEngine(formatDay(*use.dueDate)))
                                      : QStringLiteral("no longer registered")));
    }
    return words.isEmpty() ? QStringLiteral("-") : words.join(QStringLiteral(", "));
}

void printText(const storage::DueReport& report) {
    printLine(QStringLiteral("due on or before %1 (%2 days from %3): %4 item%5")
                  .arg(fromEngine(formatDay(report.asOf + std::chrono::days(report.withinDays))))
                  .arg(report.withinDays)
                  .arg(fromEngine(formatDay(report.asOf)))
                  .arg(report.entries.size())
                  .arg(report.entries.size() == 1 ? QString() : QStringLiteral("s")));
    for (const DueEntry& entry : report.entries) {
        const QString due =
            entry.dueDate ? fromEngine(formatDay(*entry.dueDate)) : QStringLiteral("-");
        QString line = QStringLiteral("%1 %2 %3 %4")
                           .arg(kindWord(entry.subject), -10)
                           .arg(fromEngine(entry.assetTag), -10)
                           .arg(due, -10)
                           .arg(whenWords(entry), -18);
        if (entry.subject == DueSubject::Instrument) {
            line += QStringLiteral(" at %1; standards last used: %2")
                        .arg(fromEngine(entry.location), standardsWords(entry));
            if (entry.openSessionId) {
                line += QStringLiteral("; under way: session %1 (%2)")
                            .arg(*entry.openSessionId)
                            .arg(fromEngine(
                                displayName(entry.openState.value_or(SessionState::Draft))));
            }
        } else {
            line += QStringLiteral(" ") + fromEngine(entry.description);
        }
        printLine(line);
    }
}

int runDue(const QStringList& arguments) {
    QCommandLineParser parser;
    parser.setApplicationDescription(QStringLiteral(
        "Lists the instruments and reference standards due on or before a day plus a window, "
        "overdue first: each with its asset tag, due date and days overdue (negative when not "
        "yet due); instruments also with where they are and the reference standards their "
        "last approved calibration used, and whether those are in date on the day. An "
        "instrument's due date is its last approved calibration plus its interval; retired "
        "instruments are left out."));
    parser.addPositionalArgument(QStringLiteral("WORKBOOK"), QStringLiteral("the workbook file"));
    parser.addOption({QStringLiteral("within"),
                      QStringLiteral("Days after the day to look ahead (default: the lab's due "
                                     "window setting, 30 days unless changed)."),
                      QStringLiteral("DAYS")});
    parser.addOption({QStringLiteral("as-of"),
                      QStringLiteral("The day to count from (default: today, UTC)."),
                      QStringLiteral("YYYY-MM-DD")});
    parseOptions(parser, kCommand, arguments);
    if (helpRequested(parser, kCommand)) {
        return 0;
    }
    std::optional<int> within;
    if (parser.isSet(QStringLiteral("within"))) {
        bool ok = false;
        const QString raw = parser.value(QStringLiteral("within"));
        const int days = raw.toInt(&ok);
        if (!ok || days < 0) {
            throw UsageError(
                QStringLiteral("option --within \"%1\": expected a whole number of days, 0 or "
                               "more")
                    .arg(raw));
        }
        within = days;
    }
    const auto asOf =
        optionalDate(parser, QStringLiteral("as-of"))
            .value_or(std::chrono::floor<std::chrono::days>(std::chrono::system_clock::now()));
    const QString path = onlyWorkbookArgument(parser.positionalArguments());
    const auto workbook = openForReading(path);
    const storage::DueReport report = storage::dueReport(*workbook, asOf, within);
    if (!parser.isSet(QStringLiteral("json"))) {
        printText(report);
        return 0;
    }
    QJsonArray items;
    for (const DueEntry& entry : report.entries) {
        items.append(entryJson(entry));
    }
    printJson(QJsonObject{{QStringLiteral("workbook"), path},
                          {QStringLiteral("as_of"), day(report.asOf)},
                          {QStringLiteral("within_days"), report.withinDays},
                          {QStringLiteral("items"), items}});
    return 0;
}

} // namespace

Command dueCommand() {
    return Command{kCommand, QStringLiteral("list instruments and standards due or overdue"),
                   runDue};
}

} // namespace mw::cli
