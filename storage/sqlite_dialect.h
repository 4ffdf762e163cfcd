// SQLite-only statements of the workbook: pragmas, BEGIN IMMEDIATE, checks, VACUUM INTO. The
// triggers (RAISE syntax) are in sqlite_triggers.h. A PostgreSQL back end would replace these
// files and keep the rest of storage/.
#pragma once

#include <QSqlDatabase>
#include <QString>

#include <chrono>
#include <optional>

namespace mw::storage::dialect {

// PRAGMA application_id of a Meterwright workbook ("MWBK"): tells our files from other
// SQLite files.
constexpr int kApplicationId = 0x4D57424B;

// Expression for "now" as ISO 8601 UTC with milliseconds, used by the audit triggers.
QString nowUtcExpression();

// Per-connection settings: foreign_keys=ON, busy_timeout, and for writers journal_mode=WAL
// with synchronous=NORMAL (approvals switch to FULL for their commit).
void configureConnection(const QSqlDatabase& db, bool readOnly,
                         std::chrono::milliseconds busyTimeout);
void setFullSync(const QSqlDatabase& db, bool full);
// Opens a write transaction taking the write lock at once, so that a writer waits on the busy
// timeout instead of failing when it later upgrades a read lock.
QString beginWrite();

int applicationId(const QSqlDatabase& db);
void setApplicationId(const QSqlDatabase& db);
int userVersion(const QSqlDatabase& db);
void setUserVersion(const QSqlDatabase& db, int version);
int tableCount(const QSqlDatabase& db);

// "ok", or the first complaint of PRAGMA quick_check / integrity_check.
QString quickCheck(const QSqlDatabase& db);
QString integrityCheck(const QSqlDatabase& db);
// Writes a consistent copy of the database to a new file.
void vacuumInto(const QSqlDatabase& db, const QString& targetPath);

// Foreign key enforcement is off while tables are rebuilt (it cannot change inside a
// transaction); foreignKeyProblem() then names the first row that refers to nothing.
void setForeignKeys(const QSqlDatabase& db, bool on);
std::optional<QString> foreignKeyProblem(const QSqlDatabase& db);

} // namespace mw::storage::dialect
