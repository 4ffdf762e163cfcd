// The workbook schema: one version number (PRAGMA user_version) and ordered migrations, each in
// its own transaction. Version 1: records and integrity rules; 2: the audit log; 3: STRICT
// tables with checked times, signal types, and the copies a session is sealed with; 4: signed
// approvals that seal the audit log, and the day a standard's certificate was issued.
#pragma once

#include <QSqlDatabase>

namespace mw::storage::schema {

constexpr int kCurrentVersion = 4;

// Brings the database from its current version up to `targetVersion` (1 … kCurrentVersion;
// lower targets only make old workbooks for tests). An empty database asked for the current
// version is created at it directly; an older one is upgraded one step per transaction. Each
// step re-reads the version under the write lock, so two processes opening a new file at once
// do not both create it. Returns the version reached.
int migrate(const QSqlDatabase& db, int targetVersion = kCurrentVersion);

// Creates every table, index and trigger of the current version in an empty database (inside
// the caller's transaction).
void createCurrentVersion(const QSqlDatabase& db);

} // namespace mw::storage::schema
