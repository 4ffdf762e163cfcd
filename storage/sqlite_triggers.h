// The triggers of the current schema version (SQLite RAISE syntax), built from the explicit
// column lists of schema_v4.cpp: integrity rules (sqlite_triggers.cpp), the audit log and the
// key guards (sqlite_triggers_audit.cpp).
#pragma once

#include <QSqlDatabase>
#include <QString>
#include <QStringList>

namespace mw::storage::dialect {

// Every trigger of the current version, on a database holding its tables and none of its
// triggers.
void createTriggers(const QSqlDatabase& db);

void createIntegrityTriggers(const QSqlDatabase& db);
// Audit triggers on every table that holds records, and the log's own append-only rule.
void createAuditTriggers(const QSqlDatabase& db);
// Triggers refusing a write that would replace a row by its primary or unique key.
void createKeyTriggers(const QSqlDatabase& db);

// Shared by the trigger files.
void run(const QSqlDatabase& db, const QString& statement);
// "(OLD.a IS NOT NEW.a OR ...)": true when any of the columns changes.
QString anyChanged(const QStringList& columns);

} // namespace mw::storage::dialect
