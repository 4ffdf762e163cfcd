// Opening a workbook: refuse what is not ours, damaged or too new without touching it, then
// set the connection up, back up and migrate an older schema.
#include "storage/workbook.h"

#include "storage/atomic_file.h"
#include "storage/read_trace.h"
#include "storage/schema.h"
#include "storage/schema_check.h"
#include "storage/sql_support.h"
#include "storage/sqlite_dialect.h"
#include "storage/workbook_error.h"

#include <QAtomicInteger>
#include <QFile>
#include <QFileInfo>
#include <QSqlQuery>

namespace mw::storage {
namespace {

using Kind = WorkbookError::Kind;

QString nextConnectionName() {
    static QAtomicInteger<quint64> counter;
    return QStringLiteral("meterwright-workbook-%1").arg(counter.fetchAndAddRelaxed(1));
}

QSqlDatabase addConnection(const QString& name, const QString& path, bool readOnly,
                           std::chrono::milliseconds busyTimeout) {
    QSqlDatabase db = QSqlDatabase::addDatabase(QStringLiteral("QSQLITE"), name);
    db.setDatabaseName(path);
    QString options = QStringLiteral("QSQLITE_BUSY_TIMEOUT=%1").arg(busyTimeout.count());
    if (readOnly) {
        options += QStringLiteral(";QSQLITE_OPEN_READONLY");
    }
    db.setConnectOptions(options);
    return db;
}

void dropConnection(const QString& name) {
    {
        QSqlDatabase db = QSqlDatabase::database(name, false);
        if (db.isValid()) {
            db.close();
        }
    }
    QSqlDatabase::removeDatabase(name);
}

// Why a file that exists cannot be written, or an empty string when it can. Root may write
// anything, so a file with no write permission bit at all also counts as marked read-only.
QString readOnlyReasonOf(const QString& path) {
    const QFileInfo info(path);
    const QFile::Permissions anyWrite = QFile::WriteOwner | QFile::WriteGroup | QFile::WriteOther;
    if (!info.isWritable() || (info.permissions() & anyWrite) == 0) {
        return QStringLiteral("the file is marked read-only");
    }
    if (!QFileInfo(info.absolutePath()).isWritable()) {
        return QStringLiteral("its folder cannot be written (the journal files live there)");
    }
    return {};
}

// Facts read from an existing file over a separate read-only connection, so that a file we
// refuse is never written to.
struct Inspection {
    int applicationId = 0;
    int version = 0;
    int tables = 0;
};

Inspection inspect(const QString& path, const OpenOptions& options) {
    const QString name = nextConnectionName();
    Inspection found;
    try {
        QSqlDatabase db = addConnection(name, path, true, options.busyTimeout);
        if (!db.open()) {
            throw sql::errorFrom(db.lastError(), QStringLiteral("opening %1").arg(path));
        }
        found.applicationId = dialect::applicationId(db);
        found.version = dialect::userVersion(db);
        found.tables = dialect::tableCount(db);
        if (options.quickCheck && found.applicationId == dialect::kApplicationId) {
            const QString verdict = dialect::quickCheck(db);
            if (verdict != QLatin1String("ok")) {
                throw WorkbookError(Kind::Corrupt, QStringLiteral("%1 is damaged: quick_check "
                                                                  "reports \"%2\"")
                                                       .arg(path, verdict));
            }
        }
    } catch (const WorkbookError& error) {
        dropConnection(name);
        if (error.kind() == Kind::Corrupt || error.kind() == Kind::NotAWorkbook) {
            const QString message = error.message();
            throw WorkbookError(
                error.kind(),
                message.startsWith(path)
                    ? message
                    : QStringLiteral("%1 is damaged or not a workbook (%2)").arg(path, message));
        }
        throw;
    }
    dropConnection(name);
    return found;
}

QString freeName(const QString& wanted) {
    QString candidate = wanted;
    for (int n = 2; QFileInfo::exists(candidate); ++n) {
        candidate = wanted + QStringLiteral(".%1").arg(n);
    }
    return candidate;
}

} // namespace

Workbook::Workbook(const QString& path, const OpenOptions& options)
    : path_(QFileInfo(path).absoluteFilePath())
    , trace_(std::make_unique<ReadTrace>(path_))
    , connectionName_(nextConnectionName()) {
    checkHeaderBeforeOpening(options);
    try {
        inspectAndMigrate(options);
    } catch (...) {
        dropConnection(connectionName_);
        throw;
    }
}

Workbook::~Workbook() {
    dropConnection(connectionName_);
}

QSqlDatabase Workbook::database() const {
    return QSqlDatabase::database(connectionName_, false);
}

void Workbook::requireWritable(const QString& what) const {
    if (isReadOnly()) {
        throw WorkbookError(Kind::ReadOnly, QStringLiteral("cannot %1: the workbook %2 is open "
                                                           "read-only because %3")
                                                .arg(what, path_, readOnlyReason_));
    }
}

void Workbook::checkHeaderBeforeOpening(const OpenOptions& options) {
    const QFileInfo info(path_);
    if (!info.exists()) {
        if (!options.createIfMissing || options.readOnly) {
            throw WorkbookError(Kind::CannotOpen, QStringLiteral("%1 does not exist").arg(path_));
        }
        return;
    }
    if (!info.isFile()) {
        throw WorkbookError(Kind::CannotOpen, QStringLiteral("%1 is not a file").arg(path_));
    }
    if (info.size() == 0 &&
        !(options.createIfMissing && options.initializeEmptyFile && !options.readOnly)) {
        throw WorkbookError(Kind::NotAWorkbook,
                            QStringLiteral("%1 is empty; it is not a workbook").arg(path_));
    }
    QFile file(path_);
    if (!file.open(QIODevice::ReadOnly)) {
        throw WorkbookError(Kind::CannotOpen,
                            QStringLiteral("%1 cannot be read: %2").arg(path_, file.errorString()));
    }
    const QByteArray header = file.read(16);
    // Every SQLite 3 database starts with these 16 bytes (sqlite.org/fileformat.html 1.3.1).
    if (!header.isEmpty() && header != QByteArray("SQLite format 3\0", 16)) {
        throw WorkbookError(
            Kind::NotAWorkbook,
            QStringLiteral("%1 is not a workbook: it is not an SQLite database").arg(path_));
    }
    readOnlyReason_ = options.readOnly ? QStringLiteral("it was opened read-only on request")
                                       : readOnlyReasonOf(path_);
}

void Workbook::inspectAndMigrate(const OpenOptions& options) {
    const bool existing = QFileInfo(path_).size() > 0;
    Inspection found;
    if (existing) {
        found = inspect(path_, options);
        if (found.applicationId != dialect::kApplicationId &&
            !(found.applicationId == 0 && found.tables == 0)) {
            throw WorkbookError(Kind::NotAWorkbook,
                                QStringLiteral("%1 is not a workbook: it is an SQLite database of "
                                               "another application")
                                    .arg(path_));
        }
        if (found.version > schema::kCurrentVersion) {
            throw WorkbookError(Kind::NewerSchema,
                                QStringLiteral("%1 was written by a newer Meterwright (workbook "
                                               "version %2; this one reads up to %3); it was "
                                               "left untouched")
                                    .arg(path_)
                                    .arg(found.version)
                                    .arg(schema::kCurrentVersion));
        }
        if (isReadOnly() && found.version < schema::kCurrentVersion &&
            !(options.readOnly && options.acceptOlderSchema && found.version > 0)) {
            throw WorkbookError(Kind::NeedsUpgrade,
                                QStringLiteral("%1 has workbook version %2 and must be upgraded "
                                               "to %3, but %4")
                                    .arg(path_)
                                    .arg(found.version)
                                    .arg(schema::kCurrentVersion)
                                    .arg(readOnlyReason_));
        }
    }
    if (!existing && isReadOnly()) {
        throw WorkbookError(Kind::NotAWorkbook,
                            QStringLiteral("%1 is empty, not a workbook").arg(path_));
    }
    versionWhenOpened_ = found.version;
    openConnection(options);
    if (isReadOnly()) {
        schemaVersion_ = found.version;
        return;
    }
    const QSqlDatabase db = database();
    if (existing && found.version > 0 && found.version < schema::kCurrentVersion) {
        AtomicFile copy(
            freeName(path_ + QStringLiteral(".before-v%1.bak").arg(schema::kCurrentVersion)));
        dialect::vacuumInto(db, copy.partialPath());
        copy.commit();
        upgradeBackupPath_ = copy.targetPath();
    }
    schemaVersion_ = schema::migrate(db);
    if (!options.forRepair) {
        refuseWritesWithoutRules();
    }
}

// Without its triggers a workbook accepts any edit unnoticed (a sealed record changed, an
// audit row removed), so it is only read until an administrator reinstalls them.
void Workbook::refuseWritesWithoutRules() {
    const QStringList missing = schema::missingRules(database(), schemaVersion_);
    if (!missing.isEmpty()) {
        readOnlyReason_ =
            QStringLiteral("%1 of its rules are missing or changed (first: %2), so edits would "
                           "go unchecked; an administrator can reinstall them with "
                           "\"meterwright repair\"")
                .arg(missing.size())
                .arg(missing.first());
    }
}

void Workbook::openConnection(const OpenOptions& options) {
    QSqlDatabase db = addConnection(connectionName_, path_, isReadOnly(), options.busyTimeout);
    if (!db.open()) {
        throw sql::errorFrom(db.lastError(), QStringLiteral("opening %1").arg(path_));
    }
    dialect::configureConnection(db, isReadOnly(), options.busyTimeout);
}

} // namespace mw::storage
