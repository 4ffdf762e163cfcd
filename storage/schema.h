// The workbook schema: one version number (PRAGMA user_version) and ordered migrations,
// each in its own transaction. Version 1: records and integrity rules; version 2: audit log.
#pragma once

#include <QSqlDatabase>

namespace mw::storage::schema {

constexpr int kCurrentVersion = 2;

// Brings the database from its current version up to `targetVersion` (<= kCurrentVersion),
// one step per transaction; each step re-reads the version under the write lock, so two
// processes opening a new file at once do not both create it. Returns the version reached.
int migrate(const QSqlDatabase& db, int targetVersion = kCurrentVersion);

} // namespace mw::storage::schema
