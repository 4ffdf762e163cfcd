// Online backup (VACUUM INTO), a rolling set of automatic backups, and restore.
#pragma once

#include <QDateTime>
#include <QString>
#include <QStringList>

#include <chrono>
#include <optional>

namespace mw::storage {

class Workbook;

// Writes a consistent copy of the open workbook to `targetPath` while others keep working.
// Refuses to overwrite an existing file (WorkbookError Io).
void backupWorkbook(const Workbook& workbook, const QString& targetPath);

struct BackupPolicy {
    QString directory; // empty: "<workbook file>.backups" beside the workbook
    int keep = 7;      // newest automatic backups kept; older ones are deleted
    std::chrono::hours every{24};
};

// The folder automatic backups of `workbookPath` go to under `policy`.
QString backupDirectory(const QString& workbookPath, const BackupPolicy& policy);
// Automatic backups of the workbook, newest first.
QStringList automaticBackups(const QString& workbookPath, const BackupPolicy& policy);
// Writes an automatic backup when the newest is older than policy.every (or none exists),
// then prunes to policy.keep. Returns the new file, or nullopt when none was due.
std::optional<QString> backupIfDue(const Workbook& workbook, const BackupPolicy& policy,
                                   const QDateTime& now);

// Replaces the (closed) workbook at `targetPath` by the backup after checking that the backup
// opens as a sound workbook. The replaced file is kept as "<target>.before-restore".
void restoreWorkbook(const QString& backupPath, const QString& targetPath);

} // namespace mw::storage
