// The SQL of earlier schema versions as it shipped (storage/sql/schema_v*.sql), kept so that a
// workbook of every version can be created in tests and upgraded step by step.
#pragma once

#include <QSqlDatabase>
#include <QStringList>

namespace mw::storage::frozen {

extern const char* const kSchemaVersion1Sql; // records and integrity rules
extern const char* const kSchemaVersion2Sql; // the audit log
extern const char* const kSchemaVersion3Sql; // STRICT tables, sealed sessions (whole schema)

// The statements of a frozen file in order: separated by a line holding only ";", with the
// file's leading comment lines left out.
QStringList statements(const char* sql);

// Runs every statement of a frozen file on `db` (inside the caller's transaction).
void run(const QSqlDatabase& db, const char* sql, int version);

} // namespace mw::storage::frozen
