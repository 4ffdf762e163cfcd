// Top-level commands that work on a workbook file: verify (and the others listed in the
// table at the bottom of this file).
#include "app/cli/backup_commands.h"
#include "app/cli/cli_support.h"
#include "app/cli/command_table.h"
#include "app/cli/demo_command.h"
#include "storage/record_digest.h"
#include "storage/workbook.h"
#include "storage/workbook_error.h"

#include <QJsonObject>

namespace mw::cli {
namespace {

constexpr int kCheckFailed = 1;

QString onlyWorkbookArgument(const QCommandLineParser& parser) {
    const QStringList positional = parser.positionalArguments();
    if (positional.size() != 1) {
        throw UsageError(
            QStringLiteral("give exactly one WORKBOOK file (got %1)").arg(positional.size()));
    }
    return positional.first();
}

void printReport(const storage::VerificationReport& report, const QString& path, bool json) {
    if (json) {
        QJsonObject object{
            {QStringLiteral("workbook"), path},
            {QStringLiteral("sound"), report.sound()},
            {QStringLiteral("integrity_check"), report.integrityMessage},
            {QStringLiteral("records_checked"), report.recordsChecked},
            {QStringLiteral("sessions_checked"), report.sessionsChecked},
            {QStringLiteral("chain_head"),
             QJsonObject{{QStringLiteral("records"), report.chainLength},
                         {QStringLiteral("digest"), report.chainHeadDigest}}},
        };
        if (report.firstMismatch) {
            object.insert(QStringLiteral("first_mismatch"), *report.firstMismatch);
            object.insert(QStringLiteral("first_mismatch_session"),
                          qint64(report.firstMismatchSessionId.value_or(0)));
        }
        printJson(object);
        return;
    }
    printLine(QStringLiteral("workbook: %1").arg(path));
    printLine(QStringLiteral("integrity check: %1").arg(report.integrityMessage));
    printLine(QStringLiteral("calibration sessions looked at: %1").arg(report.sessionsChecked));
    printLine(QStringLiteral("approved records whose digest was recomputed and matched: %1")
                  .arg(report.recordsChecked));
    // Compared with a copy kept elsewhere, the head shows a chain cut back or rebuilt.
    printLine(QStringLiteral("chain head: %1 records, last digest %2")
                  .arg(report.chainLength)
                  .arg(report.chainLength == 0 ? QStringLiteral("(none)")
                                               : storage::shortDigest(report.chainHeadDigest)));
    if (report.firstMismatch) {
        printLine(QStringLiteral("FIRST MISMATCH: %1").arg(*report.firstMismatch));
    }
    printLine(report.sound() ? QStringLiteral("result: sound")
                             : QStringLiteral("result: NOT sound"));
}

int runVerify(const QStringList& arguments) {
    QCommandLineParser parser;
    parser.setApplicationDescription(
        QStringLiteral("Checks a workbook: SQLite integrity, and the digest chain of approved "
                       "records. Exit 0 when sound, 1 naming the first record that no longer "
                       "matches, 2 when the file cannot be opened."));
    parser.addPositionalArgument(QStringLiteral("WORKBOOK"), QStringLiteral("the workbook file"));
    const QString commandLine = QStringLiteral("verify");
    parseOptions(parser, commandLine, arguments);
    if (helpRequested(parser, commandLine)) {
        return 0;
    }
    const QString path = onlyWorkbookArgument(parser);
    storage::OpenOptions options;
    options.readOnly = true; // verification never writes
    try {
        const storage::Workbook workbook(path, options);
        const storage::VerificationReport report = storage::verifyWorkbook(workbook);
        printReport(report, path, parser.isSet(QStringLiteral("json")));
        return report.sound() ? 0 : kCheckFailed;
    } catch (const storage::WorkbookError& error) {
        // One line on stderr whatever SQLite said: line breaks inside its text are folded.
        QString message = error.message();
        message.replace(QLatin1Char('\n'), QStringLiteral("; "));
        throw UsageError(QStringLiteral("cannot open the workbook: ") + message.simplified());
    }
}

} // namespace

std::vector<Command> workbookCommands() {
    // One entry per command; each command's code lives above (or in its own file).
    return {
        demoCommand(),
        {QStringLiteral("verify"),
         QStringLiteral("check a workbook's integrity and the digest chain of approved records"),
         runVerify},
        backupCommand(),
        restoreCommand(),
    };
}

} // namespace mw::cli
