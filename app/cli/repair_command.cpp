// Reinstalling the rules of a workbook that opens read-only because they are missing.
#include "app/cli/repair_command.h"

#include "app/cli/cli_support.h"
#include "app/cli/password_input.h"
#include "app/cli/workbook_access.h"
#include "storage/rules_repair.h"
#include "storage/user_repository.h"
#include "storage/workbook.h"
#include "storage/workbook_error.h"

#include <QCommandLineParser>

namespace mw::cli {
namespace {

const QString kCommand = QStringLiteral("repair");

int runRepair(const QStringList& arguments) {
    QCommandLineParser parser;
    parser.setApplicationDescription(QStringLiteral(
        "Reinstalls the rules (integrity, audit and key triggers) of a workbook whose rules were "
        "removed or changed, which therefore opens read-only, and records the repair in its "
        "audit log. Needs an administrator's login; the password is typed at the terminal or "
        "piped on standard input. Run \"meterwright verify\" afterwards: the repair restores the "
        "rules, not records changed while they were missing."));
    parser.addPositionalArgument(QStringLiteral("WORKBOOK"), QStringLiteral("the workbook file"));
    parser.addOption({QStringLiteral("admin"), QStringLiteral("Login of an administrator."),
                      QStringLiteral("LOGIN")});
    parseOptions(parser, kCommand, arguments);
    if (helpRequested(parser, kCommand)) {
        return 0;
    }
    const QString path = onlyWorkbookArgument(parser.positionalArguments());
    const QString login = requireText(parser, QStringLiteral("admin")).trimmed();
    QStringList repaired;
    try {
        storage::OpenOptions options;
        options.forRepair = true;
        storage::Workbook workbook(path, options);
        workbook.requireWritable(QStringLiteral("reinstall the rules"));
        const auto administrator =
            storage::UserRepository(workbook).authenticate(login, readPassword(login));
        if (!administrator) {
            throw UsageError(QStringLiteral("the login or the password is wrong"));
        }
        repaired = storage::repairRules(workbook, administrator->id);
    } catch (const storage::WorkbookError& error) {
        using Kind = storage::WorkbookError::Kind;
        if (error.kind() == Kind::Internal || error.kind() == Kind::Sql) {
            throw;
        }
        QString message = error.message();
        message.replace(QLatin1Char('\n'), QStringLiteral("; "));
        throw UsageError(QStringLiteral("cannot repair %1: %2").arg(path, message.simplified()));
    }
    if (repaired.isEmpty()) {
        printLine(QStringLiteral("%1 has all its rules; nothing to do").arg(path));
    } else {
        printLine(QStringLiteral("reinstalled the rules of %1 (%2 were missing or changed); the "
                                 "repair is in the audit log")
                      .arg(path)
                      .arg(repaired.size()));
    }
    return 0;
}

} // namespace

Command repairCommand() {
    return {kCommand, QStringLiteral("reinstall a workbook's rules (administrator; logged)"),
            runRepair};
}

} // namespace mw::cli
