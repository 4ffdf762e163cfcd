// Backups: VACUUM INTO copies on demand and on a schedule, and restoring one.
#include "storage/backup.h"

#include "storage/record_digest.h"
#include "storage/sqlite_dialect.h"
#include "storage/workbook.h"
#include "storage/workbook_error.h"

#include <QDir>
#include <QFile>
#include <QFileInfo>
#include <QTimeZone>

namespace mw::storage {
namespace {

using Kind = WorkbookError::Kind;

const QString kStampFormat = QStringLiteral("yyyyMMdd'T'HHmmss'Z'");
const QString kSuffix = QStringLiteral(".backup");

QString prefixOf(const QString& workbookPath) {
    return QFileInfo(workbookPath).completeBaseName() + QStringLiteral("-");
}

QString freeName(const QString& wanted) {
    QString candidate = wanted;
    for (int n = 2; QFileInfo::exists(candidate); ++n) {
        candidate = wanted + QStringLiteral(".%1").arg(n);
    }
    return candidate;
}

// Moves `from` (and its -wal / -shm companions, which belong to it) to `to`.
void moveWithCompanions(const QString& from, const QString& to) {
    if (!QFile::rename(from, to)) {
        throw WorkbookError(Kind::Io, QStringLiteral("cannot move %1 aside to %2").arg(from, to));
    }
    for (const char* companion : {"-wal", "-shm"}) {
        const QString source = from + QLatin1String(companion);
        if (QFileInfo::exists(source) && !QFile::rename(source, to + QLatin1String(companion))) {
            throw WorkbookError(Kind::Io, QStringLiteral("cannot move %1 aside").arg(source));
        }
    }
}

void checkRestorable(const QString& backupPath) {
    OpenOptions options;
    options.readOnly = true;
    try {
        const Workbook backup(backupPath, options);
        const VerificationReport report = verifyWorkbook(backup);
        if (!report.sound()) {
            throw WorkbookError(Kind::Corrupt, QStringLiteral("the backup %1 is not sound: %2")
                                                   .arg(backupPath, report.firstMismatch.value_or(
                                                                        report.integrityMessage)));
        }
    } catch (const WorkbookError& error) {
        if (error.kind() != Kind::NeedsUpgrade) { // an older workbook is upgraded when opened
            throw;
        }
    }
}

} // namespace

void backupWorkbook(const Workbook& workbook, const QString& targetPath) {
    if (QFileInfo::exists(targetPath)) {
        throw WorkbookError(
            Kind::Io,
            QStringLiteral("%1 already exists; a backup never overwrites a file").arg(targetPath));
    }
    const QString folder = QFileInfo(targetPath).absolutePath();
    if (!QDir().mkpath(folder)) {
        throw WorkbookError(Kind::Io, QStringLiteral("cannot create the folder %1").arg(folder));
    }
    dialect::vacuumInto(workbook.database(), targetPath);
}

QString backupDirectory(const QString& workbookPath, const BackupPolicy& policy) {
    if (!policy.directory.isEmpty()) {
        return policy.directory;
    }
    return QFileInfo(workbookPath).absoluteFilePath() + QStringLiteral(".backups");
}

QStringList automaticBackups(const QString& workbookPath, const BackupPolicy& policy) {
    const QDir folder(backupDirectory(workbookPath, policy));
    const QString prefix = prefixOf(workbookPath);
    QStringList found;
    for (const QString& name :
         folder.entryList({prefix + QStringLiteral("*") + kSuffix}, QDir::Files, QDir::Name)) {
        const QString stamp = name.mid(prefix.size(), name.size() - prefix.size() - kSuffix.size());
        if (QDateTime::fromString(stamp, kStampFormat).isValid()) {
            found.prepend(folder.absoluteFilePath(name)); // names sort by time: newest first
        }
    }
    return found;
}

std::optional<QString> backupIfDue(const Workbook& workbook, const BackupPolicy& policy,
                                   const QDateTime& now) {
    const QStringList existing = automaticBackups(workbook.path(), policy);
    const QString prefix = prefixOf(workbook.path());
    if (!existing.isEmpty()) {
        const QString newest = QFileInfo(existing.front()).fileName();
        QDateTime taken = QDateTime::fromString(
            newest.mid(prefix.size(), newest.size() - prefix.size() - kSuffix.size()),
            kStampFormat);
        taken.setTimeZone(QTimeZone::utc());
        if (taken.secsTo(now) < std::chrono::seconds(policy.every).count()) {
            return std::nullopt;
        }
    }
    const QString target =
        QDir(backupDirectory(workbook.path(), policy))
            .absoluteFilePath(prefix + now.toUTC().toString(kStampFormat) + kSuffix);
    backupWorkbook(workbook, target);
    const QStringList all = automaticBackups(workbook.path(), policy);
    for (int i = std::max(policy.keep, 1); i < all.size(); ++i) {
        QFile::remove(all[i]);
    }
    return target;
}

void restoreWorkbook(const QString& backupPath, const QString& targetPath) {
    if (!QFileInfo(backupPath).isFile()) {
        throw WorkbookError(Kind::CannotOpen,
                            QStringLiteral("the backup %1 does not exist").arg(backupPath));
    }
    checkRestorable(backupPath);
    const QString staging = freeName(targetPath + QStringLiteral(".restoring"));
    if (!QFile::copy(backupPath, staging)) {
        throw WorkbookError(Kind::Io,
                            QStringLiteral("cannot copy %1 to %2").arg(backupPath, staging));
    }
    if (QFileInfo::exists(targetPath)) {
        moveWithCompanions(targetPath, freeName(targetPath + QStringLiteral(".before-restore")));
    }
    if (!QFile::rename(staging, targetPath)) {
        throw WorkbookError(Kind::Io, QStringLiteral("cannot put the restored workbook at %1; "
                                                     "it is at %2")
                                          .arg(targetPath, staging));
    }
    QFile::setPermissions(targetPath, QFile::permissions(targetPath) | QFile::WriteOwner);
}

} // namespace mw::storage
