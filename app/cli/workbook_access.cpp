// Opening workbooks for headless commands.
#include "app/cli/workbook_access.h"

#include "app/cli/cli_support.h"
#include "storage/schema.h"
#include "storage/workbook_error.h"

namespace mw::cli {
namespace {

using Kind = storage::WorkbookError::Kind;

std::unique_ptr<storage::Workbook> open(const QString& path, bool readOnly) {
    storage::OpenOptions options;
    options.readOnly = readOnly;
    try {
        return std::make_unique<storage::Workbook>(path, options);
    } catch (const storage::WorkbookError& error) {
        if (error.kind() == Kind::NeedsUpgrade && readOnly) {
            throw UsageError(QStringLiteral("%1 was written by an earlier version of Meterwright; "
                                            "run \"meterwright upgrade %1\" first (it keeps a copy "
                                            "of the file as it is)")
                                 .arg(path));
        }
        if (error.kind() == Kind::Internal || error.kind() == Kind::Sql) {
            throw; // not the user's doing: the dispatcher reports an internal error
        }
        // One line whatever SQLite said: line breaks inside its text are folded.
        QString message = error.message();
        message.replace(QLatin1Char('\n'), QStringLiteral("; "));
        throw UsageError(QStringLiteral("cannot open the workbook: ") + message.simplified());
    }
}

} // namespace

std::unique_ptr<storage::Workbook> openForReading(const QString& path) {
    return open(path, true);
}

std::unique_ptr<storage::Workbook> openForWriting(const QString& path) {
    return open(path, false);
}

QString onlyWorkbookArgument(const QStringList& positional) {
    if (positional.size() != 1) {
        throw UsageError(
            QStringLiteral("give exactly one WORKBOOK file (got %1)").arg(positional.size()));
    }
    return positional.first();
}

} // namespace mw::cli
