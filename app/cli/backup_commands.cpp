// `meterwright backup` and `meterwright restore`.
#include "app/cli/backup_commands.h"

#include "app/cli/cli_support.h"
#include "storage/backup.h"
#include "storage/chain_anchor.h"
#include "storage/workbook.h"
#include "storage/workbook_error.h"

#include <QDateTime>
#include <QFileInfo>
#include <QJsonObject>

namespace mw::cli {
namespace {

QString countOfArguments(qsizetype count) {
    return count == 1 ? QStringLiteral("1 argument") : QStringLiteral("%1 arguments").arg(count);
}

QStringList exactlyTwo(const QCommandLineParser& parser, const QString& names) {
    const QStringList positional = parser.positionalArguments();
    if (positional.size() != 2) {
        throw UsageError(
            QStringLiteral("give %1 (got %2)").arg(names, countOfArguments(positional.size())));
    }
    return positional;
}

// Storage errors are one line for the user; SQLite's own line breaks are folded.
[[noreturn]] void rethrowAsUsage(const storage::WorkbookError& error, const QString& doing) {
    QString message = error.message();
    message.replace(QLatin1Char('\n'), QStringLiteral("; "));
    throw UsageError(doing + QStringLiteral(": ") + message.simplified());
}

int runBackup(const QStringList& arguments) {
    QCommandLineParser parser;
    parser.setApplicationDescription(QStringLiteral(
        "Writes a consistent copy of WORKBOOK to TARGET (SQLite VACUUM INTO) while others may "
        "keep working in it. TARGET must not exist. With --automatic instead of TARGET, writes "
        "the daily rolling backup into WORKBOOK.backups/ if one is due and keeps the newest 7."));
    parser.addPositionalArgument(QStringLiteral("WORKBOOK"), QStringLiteral("the workbook"));
    parser.addPositionalArgument(QStringLiteral("TARGET"), QStringLiteral("the new copy"));
    parser.addOption({QStringLiteral("automatic"),
                      QStringLiteral("Write the rolling automatic backup instead of TARGET.")});
    const QString commandLine = QStringLiteral("backup");
    parseOptions(parser, commandLine, arguments);
    if (helpRequested(parser, commandLine)) {
        return 0;
    }
    const bool automatic = parser.isSet(QStringLiteral("automatic"));
    const QStringList positional = parser.positionalArguments();
    if (automatic ? positional.size() != 1 : positional.size() != 2) {
        throw UsageError(automatic ? QStringLiteral("give WORKBOOK only with --automatic")
                                   : QStringLiteral("give WORKBOOK and TARGET (got %1)")
                                         .arg(countOfArguments(positional.size())));
    }
    QString written;
    try {
        storage::OpenOptions options;
        options.readOnly = true; // a backup only reads the workbook, of any version
        options.acceptOlderSchema = true;
        const storage::Workbook workbook(positional.at(0), options);
        if (automatic) {
            const auto file = storage::backupIfDue(workbook, storage::BackupPolicy{},
                                                   QDateTime::currentDateTime());
            written = file.value_or(QString());
        } else {
            storage::backupWorkbook(workbook, positional.at(1));
            written = positional.at(1);
        }
    } catch (const storage::WorkbookError& error) {
        rethrowAsUsage(error, QStringLiteral("cannot back up %1").arg(positional.at(0)));
    }
    // The chain head as the copy holds it (read back from the copy, not the workbook, which
    // others may have added to since): kept with the backup, it anchors the chain.
    storage::ChainHead head;
    if (!written.isEmpty()) {
        try {
            head = storage::chainHeadOfFile(written);
        } catch (const storage::WorkbookError& error) {
            rethrowAsUsage(error, QStringLiteral("backup written to %1, but it cannot be read "
                                                 "back")
                                      .arg(written));
        }
    }
    if (parser.isSet(QStringLiteral("json"))) {
        QJsonObject object{
            {QStringLiteral("workbook"), positional.at(0)},
            {QStringLiteral("backup"), written.isEmpty() ? QJsonValue() : QJsonValue(written)}};
        if (!written.isEmpty()) {
            object.insert(QStringLiteral("chain_head"),
                          QJsonObject{{QStringLiteral("records"), head.length},
                                      {QStringLiteral("digest"), head.digest}});
        }
        printJson(object);
    } else if (written.isEmpty()) {
        printLine(QStringLiteral("no automatic backup was due"));
    } else {
        printLine(QStringLiteral("backup written: %1").arg(written));
        printLine(QStringLiteral("chain head of the backup: %1 records, last digest %2")
                      .arg(head.length)
                      .arg(head.length == 0 ? QStringLiteral("(none)") : head.digest));
    }
    return 0;
}

int runRestore(const QStringList& arguments) {
    QCommandLineParser parser;
    parser.setApplicationDescription(QStringLiteral(
        "Replaces WORKBOOK by BACKUP after checking that BACKUP opens as a sound workbook. The "
        "replaced file is kept beside it as WORKBOOK.before-restore (with a number added when "
        "that name is taken). Refuses while WORKBOOK is open in any program."));
    parser.addPositionalArgument(QStringLiteral("BACKUP"), QStringLiteral("the backup to restore"));
    parser.addPositionalArgument(QStringLiteral("WORKBOOK"),
                                 QStringLiteral("the workbook file to replace"));
    const QString commandLine = QStringLiteral("restore");
    parseOptions(parser, commandLine, arguments);
    if (helpRequested(parser, commandLine)) {
        return 0;
    }
    const QStringList positional = exactlyTwo(parser, QStringLiteral("BACKUP and WORKBOOK"));
    storage::RestoreOutcome outcome;
    try {
        outcome = storage::restoreWorkbook(positional.at(0), positional.at(1));
    } catch (const storage::WorkbookError& error) {
        rethrowAsUsage(error, QStringLiteral("cannot restore %1").arg(positional.at(0)));
    }
    if (outcome.replacedKeptAs.isEmpty()) {
        printLine(QStringLiteral("restored %1 from %2 as a new file")
                      .arg(positional.at(1), positional.at(0)));
    } else {
        printLine(QStringLiteral("restored %1 from %2; the replaced file is kept as %3")
                      .arg(positional.at(1), positional.at(0),
                           QFileInfo(outcome.replacedKeptAs).fileName()));
    }
    return 0;
}

} // namespace

Command backupCommand() {
    return {QStringLiteral("backup"),
            QStringLiteral("write a consistent copy of a workbook while it is in use"), runBackup};
}

Command restoreCommand() {
    return {QStringLiteral("restore"),
            QStringLiteral("put a backup back in place of a workbook (the old file is kept)"),
            runRestore};
}

} // namespace mw::cli
