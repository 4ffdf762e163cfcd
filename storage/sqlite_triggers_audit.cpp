// The audit log's triggers and the guards that refuse replacing a row by its key, for schema
// version 4, with every column named from schema_v4.cpp.
#include "storage/schema_v4.h"
#include "storage/sqlite_dialect.h"
#include "storage/sqlite_triggers.h"

namespace mw::storage::dialect {
namespace {

// Tables whose rows are records: every write to them is audited.
const char* const kAuditedTables[] = {
    "users",
    "lab",
    "instruments",
    "instrument_ranges",
    "reference_standards",
    "standard_specs",
    "calibration_sessions",
    "session_standards",
    "session_standard_specs",
    "session_ranges",
    "readings",
    "resistor_checks",
    "adjustment_notes",
    "record_chain",
    "signing_keys",
};

// Columns never written to the audit log: a password hash or a sealed key is no one's business,
// and JSON holds no BLOB (a key or a signature is its row's, which is never deleted).
const QStringList kUnaudited = {QStringLiteral("password_hash"), QStringLiteral("sealed_secret"),
                                QStringLiteral("public_key"), QStringLiteral("signature")};

QString jsonOf(const std::vector<const char*>& columns, const QString& row) {
    QStringList pairs;
    for (const char* name : columns) {
        const QString column = QLatin1String(name);
        if (!kUnaudited.contains(column)) {
            pairs << QStringLiteral("'%1', %2.%1").arg(column, row);
        }
    }
    return QStringLiteral("json_object(%1)").arg(pairs.join(QStringLiteral(", ")));
}

// An insert is logged without its values: the row itself holds them, and any later update or
// delete logs them as old values. Repeating every reading in the log would double the file and
// the time quick_check takes on every open. A row without an id of its own is logged with its
// key, so the log can say which reading was added.
void createAuditTriggersFor(const QSqlDatabase& db, const schema4::TableDefinition& table) {
    const QString name = QLatin1String(table.name);
    const QString insert = QStringLiteral(
        "INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) "
        "VALUES (%1, (SELECT user_id FROM audit_context WHERE id = 1), '%2', %3, '%4', %5, %6);");
    const QString now = nowUtcExpression();
    const QString oldJson = jsonOf(table.columns, QStringLiteral("OLD"));
    const QString newJson = jsonOf(table.columns, QStringLiteral("NEW"));
    const QString null = QStringLiteral("NULL");
    // Rows without an id of their own (readings, a session's copies) are logged under their
    // session's id; their values (logged on update and delete) name them by their key.
    const QString idColumn = QLatin1String(table.columns.front()) == QLatin1String("id")
                                 ? QStringLiteral("id")
                                 : QStringLiteral("session_id");
    const QString insertedKey =
        table.keyColumns.empty() ? null : jsonOf(table.keyColumns, QStringLiteral("NEW"));
    run(db, QStringLiteral("CREATE TRIGGER audit_%1_insert AFTER INSERT ON %1 BEGIN %2 END")
                .arg(name, insert.arg(now, name, QStringLiteral("NEW.") + idColumn,
                                      QStringLiteral("insert"), null, insertedKey)));
    run(db, QStringLiteral("CREATE TRIGGER audit_%1_update AFTER UPDATE ON %1 BEGIN %2 END")
                .arg(name, insert.arg(now, name, QStringLiteral("NEW.") + idColumn,
                                      QStringLiteral("update"), oldJson, newJson)));
    run(db, QStringLiteral("CREATE TRIGGER audit_%1_delete AFTER DELETE ON %1 BEGIN %2 END")
                .arg(name, insert.arg(now, name, QStringLiteral("OLD.") + idColumn,
                                      QStringLiteral("delete"), oldJson, null)));
}

// A key of a table by its columns; a NULL never equals anything, so NULL keys never collide.
struct TableKey {
    const char* table;
    QStringList columns;
};

// Every PRIMARY KEY and UNIQUE constraint of the tables of schema_v4.cpp. Rows are saved by
// updating the existing row, then inserting a new one: never by an upsert, whose BEFORE INSERT
// triggers would refuse every re-save.
std::vector<TableKey> recordKeys() {
    auto key = [](const char* table, std::initializer_list<const char*> columns) {
        TableKey k{table, {}};
        for (const char* column : columns) {
            k.columns << QLatin1String(column);
        }
        return k;
    };
    return {
        key("lab", {"id"}),
        key("users", {"id"}),
        key("users", {"login"}),
        key("instruments", {"id"}),
        key("instruments", {"asset_tag"}),
        key("instrument_ranges", {"id"}),
        key("instrument_ranges", {"instrument_id", "label"}),
        key("reference_standards", {"id"}),
        key("reference_standards", {"asset_tag"}),
        key("standard_specs", {"id"}),
        key("standard_specs", {"standard_id", "sort_order"}),
        key("calibration_sessions", {"id"}),
        key("calibration_sessions", {"supersedes_id"}),
        key("session_standards", {"id"}),
        key("session_standards", {"session_id", "standard_id"}),
        key("session_standard_specs", {"session_id", "standard_id", "sort_order"}),
        key("session_ranges", {"session_id", "range_id"}),
        key("session_points", {"session_id", "range_id", "point_index"}),
        key("readings",
            {"session_id", "range_id", "point_index", "direction", "phase", "repeat_number"}),
        key("resistor_checks", {"id"}),
        key("adjustment_notes", {"id"}),
        key("record_chain", {"id"}),
        key("record_chain", {"session_id"}),
        key("record_chain", {"digest"}),
        key("signing_keys", {"id"}),
        key("signing_keys", {"public_key"}),
        key("schema_upgrades", {"version"}),
        key("audit_log", {"id"}),
        key("audit_context", {"id"}),
    };
}

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
    const QString table = QLatin1String(key.table);
    const QString name = QStringLiteral("%1_%2").arg(table, key.columns.join(QLatin1Char('_')));
    // Named as SQLite names a UNIQUE failure ("users.login"), so callers see the same column.
    QStringList qualified;
    for (const QString& column : key.columns) {
        qualified << QStringLiteral("%1.%2").arg(table, column);
    }
    const QString raise =
        QStringLiteral("BEGIN SELECT RAISE(ABORT, '%1: a row with this %2 already exists; rows "
                       "are never replaced'); END")
            .arg(table, qualified.join(QStringLiteral(", ")));
    run(db, QStringLiteral("CREATE TRIGGER %1_kept_on_insert BEFORE INSERT ON %2 WHEN EXISTS "
                           "(SELECT 1 FROM %2 k WHERE %3) %4")
                .arg(name, table, sameKey(key.columns), raise));
    // UPDATE OF fires only when a key column is SET, so ordinary edits pay nothing.
    run(db, QStringLiteral("CREATE TRIGGER %1_kept_on_update BEFORE UPDATE OF %2 ON %3 WHEN %4 "
                           "AND EXISTS (SELECT 1 FROM %3 k WHERE %5) %6")
                .arg(name, key.columns.join(QStringLiteral(", ")), table, anyChanged(key.columns),
                     sameKey(key.columns), raise));
}

} // namespace

void createAuditTriggers(const QSqlDatabase& db) {
    for (const char* table : kAuditedTables) {
        createAuditTriggersFor(db, schema4::table(QLatin1String(table)));
    }
    for (const char* event : {"UPDATE", "DELETE"}) {
        run(db, QStringLiteral("CREATE TRIGGER audit_log_append_only_%1 BEFORE %2 ON audit_log "
                               "BEGIN SELECT RAISE(ABORT, 'audit_log: the audit log is "
                               "append-only'); END")
                    .arg(QString::fromLatin1(event).toLower(), QLatin1String(event)));
    }
}

void createKeyTriggers(const QSqlDatabase& db) {
    for (const TableKey& key : recordKeys()) {
        createKeyTriggersFor(db, key);
    }
}

} // namespace mw::storage::dialect
