// Top-level commands that work on a workbook file: verify, upgrade (and the others listed in
// the table at the bottom of this file).
#include "app/cli/backup_commands.h"
#include "app/cli/cli_support.h"
#include "app/cli/command_table.h"
#include "app/cli/demo_command.h"
#include "app/cli/desk_commands.h"
#include "app/cli/record_commands.h"
#include "app/cli/repair_command.h"
#include "app/cli/session_commands.h"
#include "app/cli/workbook_access.h"
#include "storage/chain_anchor.h"
#include "storage/record_digest.h"
#include "storage/verification.h"
#include "storage/workbook.h"
#include "storage/workbook_error.h"

#include <QJsonArray>
#include <QJsonObject>

#include <optional>

namespace mw::cli {
namespace {

constexpr int kCheckFailed = 1;

// SQLite's texts may hold line breaks; every line of the report stays one line.
QString oneLine(QString text) {
    text.replace(QLatin1Char('\n'), QStringLiteral("; "));
    return text.simplified();
}

// The comparison with an older copy (verify --against), when one was asked for.
struct CopyComparison {
    QString copyPath;
    storage::AnchorComparison result;
};

QString anchorLine(const CopyComparison& compared) {
    const storage::AnchorComparison& r = compared.result;
    if (!r.holds()) {
        return QStringLiteral("compared with %1: %2 of its %3 records unchanged, then a record "
                              "removed or changed")
            .arg(compared.copyPath)
            .arg(r.unchanged)
            .arg(r.copyLength);
    }
    return QStringLiteral("compared with %1: all %2 of its records unchanged, %3 added since")
        .arg(compared.copyPath)
        .arg(r.copyLength)
        .arg(r.addedSince);
}

QJsonObject anchorJson(const CopyComparison& compared) {
    const storage::AnchorComparison& r = compared.result;
    QJsonObject object{
        {QStringLiteral("copy"), compared.copyPath},    {QStringLiteral("holds"), r.holds()},
        {QStringLiteral("copy_records"), r.copyLength}, {QStringLiteral("unchanged"), r.unchanged},
        {QStringLiteral("added_since"), r.addedSince},
    };
    if (r.firstDifference) {
        object.insert(QStringLiteral("first_difference"), *r.firstDifference);
        object.insert(QStringLiteral("first_difference_session"),
                      qint64(r.firstDifferenceSessionId));
    }
    return object;
}

void printReport(const storage::VerificationReport& report, const QString& path,
                 const std::optional<CopyComparison>& compared, bool json) {
    if (json) {
        QJsonObject object{
            {QStringLiteral("workbook"), path},
            {QStringLiteral("sound"), report.sound()},
            {QStringLiteral("schema_version"), report.schemaVersion},
            {QStringLiteral("integrity_check"), report.integrityMessage},
            {QStringLiteral("records_checked"), report.recordsChecked},
            {QStringLiteral("sessions_checked"), report.sessionsChecked},
            {QStringLiteral("verdicts_checked"), report.verdictsChecked},
            {QStringLiteral("verdicts_not_recorded"), report.verdictsNotRecorded},
            {QStringLiteral("signatures_checked"), report.signaturesChecked},
            {QStringLiteral("audit_rows_checked"), report.auditRowsChecked},
            {QStringLiteral("audit_rows_unsealed"), report.auditRowsUnsealed},
            {QStringLiteral("chain_head"),
             QJsonObject{{QStringLiteral("records"), report.chainLength},
                         {QStringLiteral("digest"), report.chainHeadDigest}}},
        };
        if (report.firstMismatch) {
            object.insert(QStringLiteral("first_mismatch"), *report.firstMismatch);
            object.insert(QStringLiteral("first_mismatch_session"),
                          qint64(report.firstMismatchSessionId.value_or(0)));
        }
        if (compared) {
            object.insert(QStringLiteral("against"), anchorJson(*compared));
        }
        object.insert(QStringLiteral("problems"), QJsonArray::fromStringList(report.problems));
        printJson(object);
        return;
    }
    printLine(QStringLiteral("workbook: %1 (version %2)").arg(path).arg(report.schemaVersion));
    printLine(QStringLiteral("integrity check: %1").arg(report.integrityMessage));
    printLine(QStringLiteral("calibration sessions looked at: %1").arg(report.sessionsChecked));
    printLine(QStringLiteral("approved records whose digest was recomputed and matched: %1")
                  .arg(report.recordsChecked));
    printLine(QStringLiteral("stored outcomes recomputed from the inputs they were sealed with: %1")
                  .arg(report.verdictsChecked));
    if (report.verdictsNotRecorded > 0) {
        printLine(QStringLiteral("outcomes sealed before their inputs were recorded (not "
                                 "recomputable): %1")
                      .arg(report.verdictsNotRecorded));
    }
    // Compared with a copy kept elsewhere, the head shows a chain cut back or rebuilt.
    printLine(QStringLiteral("approvals whose reviewer's signature was checked: %1")
                  .arg(report.signaturesChecked));
    printLine(QStringLiteral("audit log rows checked against the seals of approvals: %1 (%2 "
                             "after the newest approval, sealed by the next)")
                  .arg(report.auditRowsChecked - report.auditRowsUnsealed)
                  .arg(report.auditRowsUnsealed));
    printLine(QStringLiteral("chain head: %1 records, last digest %2")
                  .arg(report.chainLength)
                  .arg(report.chainLength == 0 ? QStringLiteral("(none)")
                                               : storage::shortDigest(report.chainHeadDigest)));
    if (compared) {
        printLine(anchorLine(*compared));
    }
    if (report.firstMismatch) {
        printLine(QStringLiteral("FIRST MISMATCH: %1").arg(oneLine(*report.firstMismatch)));
    }
    // Every further problem, up to a screenful; the JSON output lists them all.
    constexpr int kShown = 20;
    for (qsizetype i = 1; i < report.problems.size() && i <= kShown; ++i) {
        printLine(QStringLiteral("also: %1").arg(oneLine(report.problems[i])));
    }
    if (report.problems.size() > kShown + 1) {
        printLine(QStringLiteral("and %1 more problems").arg(report.problems.size() - kShown - 1));
    }
    printLine(report.sound() ? QStringLiteral("result: sound")
                             : QStringLiteral("result: NOT sound"));
}

CopyComparison compareAgainst(const QString& path, const QString& copyPath) {
    if (copyPath.isEmpty()) {
        throw UsageError(QStringLiteral("--against needs the file of an older copy"));
    }
    try {
        return {copyPath, storage::compareWorkbookWithCopy(path, copyPath)};
    } catch (const storage::WorkbookError& error) {
        using Kind = storage::WorkbookError::Kind;
        if (error.kind() == Kind::Internal || error.kind() == Kind::Sql) {
            throw;
        }
        throw UsageError(QStringLiteral("cannot compare with the copy: ") +
                         oneLine(error.message()));
    }
}

int runVerify(const QStringList& arguments) {
    QCommandLineParser parser;
    parser.setApplicationDescription(QStringLiteral(
        "Checks a workbook as it is, of any version, without writing to it: SQLite integrity and "
        "foreign keys, every table, index and trigger against the definitions of the workbook's "
        "version, every stored value against its column's type and vocabulary, the digest chain "
        "of approved records, and every stored outcome against the session evaluator on the "
        "inputs the session was sealed with. With --against, every record of an older copy "
        "(a backup) must still be in the chain, at its position, with its digest. Exit 0 when "
        "sound, 1 naming what failed, 2 when a file cannot be opened as a workbook."));
    parser.addPositionalArgument(QStringLiteral("WORKBOOK"), QStringLiteral("the workbook file"));
    parser.addOption({QStringLiteral("against"),
                      QStringLiteral("Compare the chain of approved records with COPY, an older "
                                     "copy of the workbook: finds records removed or the chain "
                                     "recomputed since."),
                      QStringLiteral("COPY")});
    const QString commandLine = QStringLiteral("verify");
    parseOptions(parser, commandLine, arguments);
    if (helpRequested(parser, commandLine)) {
        return 0;
    }
    const QString path = onlyWorkbookArgument(parser.positionalArguments());
    storage::VerificationReport report;
    try {
        report = storage::verifyWorkbookFile(path); // never writes, of any version
    } catch (const storage::WorkbookError& error) {
        using Kind = storage::WorkbookError::Kind;
        if (error.kind() == Kind::Internal || error.kind() == Kind::Sql) {
            throw; // not the user's doing: the dispatcher reports an internal error
        }
        throw UsageError(QStringLiteral("cannot open the workbook: ") + oneLine(error.message()));
    }
    std::optional<CopyComparison> compared;
    if (parser.isSet(QStringLiteral("against"))) {
        compared = compareAgainst(path, parser.value(QStringLiteral("against")));
        if (const auto& difference = compared->result.firstDifference) {
            report.note(*difference, compared->result.firstDifferenceSessionId);
        }
    }
    printReport(report, path, compared, parser.isSet(QStringLiteral("json")));
    return report.sound() ? 0 : kCheckFailed;
}

int runUpgrade(const QStringList& arguments) {
    QCommandLineParser parser;
    parser.setApplicationDescription(QStringLiteral(
        "Upgrades a workbook written by an earlier version of Meterwright to the current one, in "
        "place, as opening it in the window does: a copy of the file as it is is written beside "
        "it first, and each step runs in its own transaction, so a step that fails leaves the "
        "file as it was. Exit 0 when upgraded or already current, 2 when it cannot be."));
    parser.addPositionalArgument(QStringLiteral("WORKBOOK"), QStringLiteral("the workbook file"));
    const QString commandLine = QStringLiteral("upgrade");
    parseOptions(parser, commandLine, arguments);
    if (helpRequested(parser, commandLine)) {
        return 0;
    }
    const QString path = onlyWorkbookArgument(parser.positionalArguments());
    const auto workbook = openForWriting(path);
    const bool upgraded = !workbook->upgradeBackupPath().isEmpty();
    if (parser.isSet(QStringLiteral("json"))) {
        printJson(QJsonObject{
            {QStringLiteral("workbook"), path},
            {QStringLiteral("version_before"), workbook->versionWhenOpened()},
            {QStringLiteral("version"), workbook->schemaVersion()},
            {QStringLiteral("kept_as"),
             upgraded ? QJsonValue(workbook->upgradeBackupPath()) : QJsonValue(QJsonValue::Null)},
        });
    } else if (upgraded) {
        printLine(QStringLiteral("upgraded %1 from workbook version %2 to %3; the file as it was "
                                 "is kept as %4")
                      .arg(path)
                      .arg(workbook->versionWhenOpened())
                      .arg(workbook->schemaVersion())
                      .arg(workbook->upgradeBackupPath()));
    } else {
        printLine(QStringLiteral("%1 is already at workbook version %2; nothing to do")
                      .arg(path)
                      .arg(workbook->schemaVersion()));
    }
    return 0;
}

} // namespace

std::vector<Command> workbookCommands() {
    // One entry per command; each command's code lives above (or in its own file).
    std::vector<Command> commands{
        demoCommand(),
        {QStringLiteral("verify"),
         QStringLiteral("check a workbook's integrity and the digest chain of approved records"),
         runVerify},
        {QStringLiteral("upgrade"),
         QStringLiteral("upgrade a workbook of an earlier version in place (a copy is kept)"),
         runUpgrade},
        sessionsCommand(),
        historyCommand(),
        dueCommand(),
        reviewCommand(),
        backupCommand(),
        restoreCommand(),
        repairCommand(),
    };
    for (auto&& family : {peopleCommands(), recordCommands()}) {
        for (const Command& command : family) {
            commands.push_back(command);
        }
    }
    return commands;
}

} // namespace mw::cli
