// Backups: VACUUM INTO copies on demand and on a schedule, and restoring one.
#include "storage/backup.h"

#include "storage/atomic_file.h"
#include "storage/read_trace.h"
#include "storage/sql_support.h"
#include "storage/sqlite_dialect.h"
#include "storage/verification.h"
#include "storage/workbook.h"
#include "storage/workbook_error.h"

#include <QAtomicInteger>
#include <QDir>
#include <QFile>
#include <QFileInfo>
#include <QSqlDatabase>
#include <QTimeZone>

#include <unistd.h>

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

const char* const kCompanions[] = {"-wal", "-shm"};

void moveCompanions(const QString& from, const QString& to) {
    for (const char* companion : kCompanions) {
        const QString source = from + QLatin1String(companion);
        if (QFileInfo::exists(source) && !QFile::rename(source, to + QLatin1String(companion))) {
            throw WorkbookError(Kind::Io, QStringLiteral("cannot move %1 aside").arg(source));
        }
    }
}

// Keeps the file at `from` as `to` by a second name (a hard link), so that `from` still holds
// it until the restored file replaces it; its -wal / -shm belong to it and move with it.
void keepAside(const QString& from, const QString& to) {
    if (::link(QFile::encodeName(from).constData(), QFile::encodeName(to).constData()) != 0 &&
        !QFile::copy(from, to)) {
        throw WorkbookError(Kind::Io, QStringLiteral("cannot keep %1 as %2").arg(from, to));
    }
    moveCompanions(from, to);
}

// A bare SQLite connection outside Workbook: no pragmas, no checks and no migration, for
// copying an older backup and for testing whether a target file is in use.
class RawConnection {
public:
    RawConnection(const QString& path, bool readOnly, int busyTimeoutMs)
        : trace_(path)
        , name_(QStringLiteral("meterwright-restore-%1").arg(counter_.fetchAndAddRelaxed(1))) {
        QSqlDatabase db = QSqlDatabase::addDatabase(QStringLiteral("QSQLITE"), name_);
        db.setDatabaseName(path);
        QString options = QStringLiteral("QSQLITE_BUSY_TIMEOUT=%1").arg(busyTimeoutMs);
        if (readOnly) {
            options += QStringLiteral(";QSQLITE_OPEN_READONLY");
        }
        db.setConnectOptions(options);
        if (!db.open()) {
            throw sql::errorFrom(db.lastError(), QStringLiteral("opening %1").arg(path));
        }
    }
    ~RawConnection() {
        {
            QSqlDatabase db = QSqlDatabase::database(name_, false);
            db.close();
        }
        QSqlDatabase::removeDatabase(name_);
    }
    RawConnection(const RawConnection&) = delete;
    RawConnection& operator=(const RawConnection&) = delete;
    QSqlDatabase db() const { return QSqlDatabase::database(name_, false); }

private:
    static inline QAtomicInteger<quint64> counter_;
    ReadTrace trace_;
    QString name_;
};

// VACUUM INTO reads through the backup's WAL, which a plain file copy would leave behind.
void copyThroughWal(const QString& backupPath, const QString& copyPath) {
    const RawConnection backup(backupPath, true, 2000);
    dialect::vacuumInto(backup.db(), copyPath);
}

// The backup is checked as it is, whatever its version: an older one's records are checked
// in an upgraded throw-away copy, and the copy restored is upgraded when it is next opened.
void checkRestorable(const QString& backupPath) {
    const VerificationReport report = verifyWorkbookFile(backupPath);
    if (!report.sound()) {
        throw WorkbookError(Kind::Corrupt, QStringLiteral("the backup %1 is not sound: %2")
                                               .arg(backupPath, report.problems.first()));
    }
}

void requireReplaceableTarget(const QString& targetPath) {
    const QFileInfo target(targetPath);
    const QString folder = target.absolutePath();
    if (!QFileInfo(folder).isDir()) {
        throw WorkbookError(Kind::CannotOpen,
                            QStringLiteral("the folder %1 does not exist").arg(folder));
    }
    if ((target.exists() || target.isSymLink()) && !target.isFile()) {
        throw WorkbookError(Kind::CannotOpen, QStringLiteral("%1 exists and is not a file; a "
                                                             "restore only replaces a workbook "
                                                             "file")
                                                  .arg(targetPath));
    }
}

// In WAL mode every open connection holds a shared lock on the database file, so an exclusive
// lock is only granted when no other connection, in any process, has the file open. Closing
// this last connection also checkpoints the WAL into the file that is about to be moved aside.
void requireNotInUse(const QString& targetPath) {
    if (!QFileInfo::exists(targetPath)) {
        return;
    }
    try {
        const RawConnection probe(targetPath, false, 100);
        sql::execText(probe.db(), QStringLiteral("PRAGMA locking_mode = EXCLUSIVE"),
                      QStringLiteral("checking whether %1 is in use").arg(targetPath));
        sql::execText(probe.db(), QStringLiteral("BEGIN EXCLUSIVE"),
                      QStringLiteral("checking whether %1 is in use").arg(targetPath));
        sql::execText(probe.db(), QStringLiteral("COMMIT"),
                      QStringLiteral("checking whether %1 is in use").arg(targetPath));
    } catch (const WorkbookError& error) {
        if (error.kind() == Kind::Locked) {
            throw WorkbookError(Kind::Locked, QStringLiteral("%1 is in use by another program; "
                                                             "close it everywhere first")
                                                  .arg(targetPath));
        }
        // A file SQLite cannot read as a database has no SQLite users; it is only moved aside.
    }
}

} // namespace

void backupWorkbook(const Workbook& workbook, const QString& targetPath) {
    if (QFileInfo::exists(targetPath) || QFileInfo(targetPath).isSymLink()) {
        throw WorkbookError(
            Kind::Io,
            QStringLiteral("%1 already exists; a backup never overwrites a file").arg(targetPath));
    }
    const QString folder = QFileInfo(targetPath).absolutePath();
    if (!QDir().mkpath(folder)) {
        throw WorkbookError(Kind::Io, QStringLiteral("cannot create the folder %1").arg(folder));
    }
    AtomicFile file(targetPath);
    try {
        dialect::vacuumInto(workbook.database(), file.partialPath());
    } catch (const WorkbookError& error) {
        QString message = error.message();
        message.replace(file.partialPath(), targetPath);
        throw WorkbookError(error.kind(), message);
    }
    file.commit();
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

RestoreOutcome restoreWorkbook(const QString& backupPath, const QString& targetPath) {
    if (!QFileInfo(backupPath).isFile()) {
        throw WorkbookError(Kind::CannotOpen,
                            QStringLiteral("the backup %1 does not exist").arg(backupPath));
    }
    requireReplaceableTarget(targetPath);
    checkRestorable(backupPath);
    AtomicFile staging(targetPath, AtomicFile::Existing::Replace);
    try {
        copyThroughWal(backupPath, staging.partialPath());
    } catch (const WorkbookError& error) {
        QString message = error.message();
        message.replace(staging.partialPath(),
                        QStringLiteral("a new file beside %1").arg(targetPath));
        throw WorkbookError(Kind::Io, message);
    }
    RestoreOutcome outcome;
    requireNotInUse(targetPath);
    if (QFileInfo::exists(targetPath)) {
        outcome.replacedKeptAs = freeName(targetPath + QStringLiteral(".before-restore"));
        keepAside(targetPath, outcome.replacedKeptAs);
    }
    // One rename replaces the workbook: whenever the run stops, its name holds a whole file.
    try {
        staging.commit();
    } catch (const WorkbookError&) {
        if (!outcome.replacedKeptAs.isEmpty()) {
            moveCompanions(outcome.replacedKeptAs, targetPath);
        }
        throw WorkbookError(Kind::Io, QStringLiteral("cannot put the restored workbook at %1; "
                                                     "the file there was left as it was")
                                          .arg(targetPath));
    }
    QFile::setPermissions(targetPath, QFile::permissions(targetPath) | QFile::WriteOwner);
    return outcome;
}

} // namespace mw::storage
