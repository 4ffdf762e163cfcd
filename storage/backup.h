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

struct RestoreOutcome {
    // Where the replaced workbook was kept ("<target>.before-restore", or with a ".2" ...
    // suffix when that name is taken); empty when there was no file to replace.
    QString replacedKeptAs;
};

// Replaces the workbook at `targetPath` by the backup after checking that the backup is a
// sound workbook (an older-schema backup is upgraded in a throw-away copy to be checked).
// The copy is written with VACUUM INTO, so writes still in the backup's WAL come along.
// Refuses (WorkbookError, target untouched) when the target is open in any program (Locked),
// is not a regular file or its folder does not exist (CannotOpen).
RestoreOutcome restoreWorkbook(const QString& backupPath, const QString& targetPath);

} // namespace mw::storage
