// Triggers refusing any write that would replace a row by its primary or unique key.
#include "storage/sqlite_dialect.h"

#include "storage/sql_support.h"

#include <QStringList>

namespace mw::storage::dialect {
namespace {

void run(const QSqlDatabase& db, const QString& statement) {
    sql::execText(db, statement, QStringLiteral("creating a trigger"));
}

// "OLD.a IS NOT NEW.a OR ...": true when any of the columns changes.
QString anyChanged(const QStringList& columns) {
    QStringList changed;
    for (const QString& column : columns) {
        changed << QStringLiteral("OLD.%1 IS NOT NEW.%1").arg(column);
    }
    return QStringLiteral("(%1)").arg(changed.join(QStringLiteral(" OR ")));
}

// A key of a table by its columns; a NULL never equals anything, so NULL keys never collide.
struct TableKey {
    QString table;
    QStringList columns;
};

// Every PRIMARY KEY and UNIQUE constraint of the integrity-checked tables (see schema.cpp).
// The readings key is left out: it starts with session_id, so a reading that would be replaced
// belongs to NEW.session_id, which readings_frozen_insert/_update already require to be a draft
// or returned; and the app saves readings with ON CONFLICT DO UPDATE, which fires BEFORE INSERT
// triggers first, so refusing an existing key there would refuse every re-save. The lab row
// (id = 1) is saved the same way, so it is left out too.
const TableKey kRecordKeys[] = {
    {QStringLiteral("lab"), {QStringLiteral("id")}},
    {QStringLiteral("users"), {QStringLiteral("id")}},
    {QStringLiteral("users"), {QStringLiteral("login")}},
    {QStringLiteral("instruments"), {QStringLiteral("id")}},
    {QStringLiteral("instruments"), {QStringLiteral("asset_tag")}},
    {QStringLiteral("instrument_ranges"), {QStringLiteral("id")}},
    {QStringLiteral("instrument_ranges"),
     {QStringLiteral("instrument_id"), QStringLiteral("label")}},
    {QStringLiteral("reference_standards"), {QStringLiteral("id")}},
    {QStringLiteral("reference_standards"), {QStringLiteral("asset_tag")}},
    {QStringLiteral("standard_specs"), {QStringLiteral("id")}},
    {QStringLiteral("calibration_sessions"), {QStringLiteral("id")}},
    {QStringLiteral("calibration_sessions"), {QStringLiteral("supersedes_id")}},
    {QStringLiteral("session_standards"), {QStringLiteral("id")}},
    {QStringLiteral("session_standards"),
     {QStringLiteral("session_id"), QStringLiteral("standard_id")}},
    {QStringLiteral("resistor_checks"), {QStringLiteral("id")}},
    {QStringLiteral("adjustment_notes"), {QStringLiteral("id")}},
    {QStringLiteral("record_chain"), {QStringLiteral("id")}},
    {QStringLiteral("record_chain"), {QStringLiteral("session_id")}},
    {QStringLiteral("record_chain"), {QStringLiteral("digest")}},
};

// The keys of the audit tables, created with them in schema version 2.
const TableKey kAuditKeys[] = {
    {QStringLiteral("audit_log"), {QStringLiteral("id")}},
    {QStringLiteral("audit_context"), {QStringLiteral("id")}},
};

// "k.a = NEW.a AND k.b = NEW.b": a lookup by the key's own index.
QString sameKey(const QStringList& columns) {
    QStringList equal;
    for (const QString& column : columns) {
        equal << QStringLiteral("k.%1 = NEW.%1").arg(column);
    }
    return equal.join(QStringLiteral(" AND "));
}

// INSERT OR REPLACE and UPDATE OR REPLACE delete the row holding the key without firing any
// DELETE trigger (recursive_triggers is off in every connection, including a sqlite3 shell), so
// neither the frozen-record rules nor the audit log would see it. A write that would collide
// with an existing key is refused before conflict resolution can run.
void createKeyTriggersFor(const QSqlDatabase& db, const TableKey& key) {
    const QString name = QStringLiteral("%1_%2").arg(key.table, key.columns.join(QLatin1Char('_')));
    // Named as SQLite names a UNIQUE failure ("users.login"), so callers see the same column.
    QStringList qualified;
    for (const QString& column : key.columns) {
        qualified << QStringLiteral("%1.%2").arg(key.table, column);
    }
    const QString raise =
        QStringLiteral("BEGIN SELECT RAISE(ABORT, '%1: a row with this %2 already exists; rows "
                       "are never replaced'); END")
            .arg(key.table, qualified.join(QStringLiteral(", ")));
    run(db, QStringLiteral(
                "CREATE TRIGGER IF NOT EXISTS %1_kept_on_insert BEFORE INSERT ON %2 WHEN EXISTS "
                "(SELECT 1 FROM %2 k WHERE %3) %4")
                .arg(name, key.table, sameKey(key.columns), raise));
    // UPDATE OF fires only when a key column is SET, so ordinary edits pay nothing.
    run(db, QStringLiteral(
                "CREATE TRIGGER IF NOT EXISTS %1_kept_on_update BEFORE UPDATE OF %2 ON %3 WHEN %4 "
                "AND EXISTS (SELECT 1 FROM %3 k WHERE %5) %6")
                .arg(name, key.columns.join(QStringLiteral(", ")), key.table,
                     anyChanged(key.columns), sameKey(key.columns), raise));
}

// The reading key may not move onto another reading of the same (editable) session either: the
// replaced reading would vanish without an audit entry.
void createReadingKeyTrigger(const QSqlDatabase& db) {
    const QStringList key = {QStringLiteral("session_id"),  QStringLiteral("range_id"),
                             QStringLiteral("point_index"), QStringLiteral("direction"),
                             QStringLiteral("phase"),       QStringLiteral("repeat_number")};
    run(db, QStringLiteral(
                "CREATE TRIGGER IF NOT EXISTS readings_key_kept_on_update BEFORE UPDATE OF %1 ON "
                "readings WHEN %2 AND EXISTS (SELECT 1 FROM readings k WHERE %3) BEGIN "
                "SELECT RAISE(ABORT, 'readings: a reading with this key already "
                "exists; rows are never replaced'); END")
                .arg(key.join(QStringLiteral(", ")), anyChanged(key), sameKey(key)));
}

} // namespace

void createRecordKeyTriggers(const QSqlDatabase& db) {
    for (const TableKey& key : kRecordKeys) {
        createKeyTriggersFor(db, key);
    }
    createReadingKeyTrigger(db);
}

void createAuditKeyTriggers(const QSqlDatabase& db) {
    for (const TableKey& key : kAuditKeys) {
        createKeyTriggersFor(db, key);
    }
}

void createKeyTriggers(const QSqlDatabase& db) {
    createRecordKeyTriggers(db);
    createAuditKeyTriggers(db);
}

} // namespace mw::storage::dialect
