// Every SQLite-only statement of the workbook in one place: pragmas, BEGIN IMMEDIATE,
// VACUUM INTO, and the triggers (RAISE syntax) that enforce integrity and write the audit log.
// A PostgreSQL back end would replace this file and keep the rest of storage/.
#pragma once

#include <QSqlDatabase>
#include <QString>

#include <chrono>

namespace mw::storage::dialect {

// PRAGMA application_id of a Meterwright workbook ("MWBK"): tells our files from other
// SQLite files.
constexpr int kApplicationId = 0x4D57424B;

// Column type of surrogate keys (PostgreSQL: "BIGINT GENERATED ALWAYS AS IDENTITY PRIMARY KEY").
QString idColumn();
// Table option for a table stored in its primary key's b-tree alone (SQLite's WITHOUT ROWID;
// empty where tables are heaps anyway).
QString keyOnlyTableOption();
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

// The integrity rules of schema version 1 (see the comment of each trigger in the .cpp).
void createIntegrityTriggers(const QSqlDatabase& db);
// Audit triggers of schema version 2 on every table that holds records.
void createAuditTriggers(const QSqlDatabase& db);
// The triggers refusing a write that would replace a row by its key (INSERT OR REPLACE,
// UPDATE OR REPLACE), in sqlite_dialect_keys.cpp: those of the record tables (created with the
// version 1 rules) and of the audit tables (version 2). createKeyTriggers adds any missing ones
// to a workbook made before they existed, and is harmless to repeat.
void createRecordKeyTriggers(const QSqlDatabase& db);
void createAuditKeyTriggers(const QSqlDatabase& db);
void createKeyTriggers(const QSqlDatabase& db);

} // namespace mw::storage::dialect
