// The upgrades that rebuild every table: the old tables are renamed aside, the new ones created,
// the rows copied across, the old ones dropped, and the indexes and triggers created anew.
//
// 2 -> 3 (to the frozen SQL of version 3): every table STRICT with its new checks and columns.
// What version 2 did not record is marked as not recorded, never invented: sessions sealed
// under version 2 keep record format 1 with no evaluation settings and no plan (their readings
// are their plan; the phases planned are those they hold), and a range whose signal type the
// instrument's kind does not settle is left without one.
//
// 3 -> 4 (to schema_v4.cpp): the day a standard's certificate was issued, approval keys and
// signatures, the audit log's seals, and the history of versions. The entries of the chain made
// under version 3 stay unsigned and unsealed; schema_upgrades records how many there are.
#include "storage/schema_upgrade.h"

#include "storage/frozen_schema.h"
#include "storage/schema.h"
#include "storage/schema_v4.h"
#include "storage/sql_support.h"
#include "storage/sqlite_dialect.h"
#include "storage/sqlite_triggers.h"

#include <QSqlQuery>
#include <QSqlRecord>

namespace mw::storage::schema {
namespace {

const QString kContext = QStringLiteral("upgrading the workbook");

// A table of the version being reached, with its columns in order.
struct Target {
    QString name;
    QStringList columns;
};

// The SELECT list that turns a version 2 row into a version 3 row, column for column in the
// order of the frozen version 3 tables; nullptr: every column is copied as it is.
const char* selectFromVersion2(const QString& table) {
    if (table == QLatin1String("lab")) {
        // Version 2 had no number-writing or due-window settings: the defaults.
        return "id, name, address, accreditation_id, 0, 30 FROM v2_lab";
    }
    if (table == QLatin1String("instrument_ranges")) {
        // A kind of one signal settles it; a multi-range meter's current ranges are DC (there
        // are no rectifier ammeters); its voltage ranges are not recorded.
        return "r.id, r.instrument_id, r.sort_order, r.label, r.unit, r.lower_limit, "
               "r.full_scale, r.nominal_ohms, r.fiducial_value, CASE i.kind "
               "WHEN 'dc-voltmeter' THEN 'dc' WHEN 'dc-ammeter' THEN 'dc' "
               "WHEN 'half-wave-ac-voltmeter' THEN 'half-wave' "
               "WHEN 'bridge-ac-voltmeter' THEN 'bridge' "
               "ELSE CASE WHEN r.unit = 'A' THEN 'dc' END END, NULL "
               "FROM v2_instrument_ranges r LEFT JOIN v2_instruments i ON i.id = r.instrument_id";
    }
    if (table == QLatin1String("standard_specs")) {
        // A standard's voltage range says AC in its label when it is one; all else is DC.
        return "id, standard_id, sort_order, label, unit, CASE WHEN unit = 'V' AND "
               "(' ' || label || ' ') LIKE '% AC %' THEN 'ac' ELSE 'dc' END, full_scale, "
               "percent_of_reading, percent_of_range, floor_value, "
               "certificate_expanded_uncertainty, coverage_factor, NULL FROM v2_standard_specs";
    }
    if (table == QLatin1String("calibration_sessions")) {
        // A draft is not yet a record: it takes the default settings and has no outcome.
        // Everything else was submitted without its inputs being copied: record format 1.
        return "id, instrument_id, technician_id, started_at, finished_at, ambient_celsius, "
               "relative_humidity_percent, method, decision_rule, guard_factor, "
               "CASE WHEN state = 'draft' THEN 0.2 END, "
               "CASE WHEN state = 'draft' THEN 0.95449973610364158 END, "
               "CASE WHEN state = 'draft' THEN 23.0 END, "
               "CASE WHEN state = 'draft' THEN 2 ELSE 1 END, "
               "CASE WHEN EXISTS (SELECT 1 FROM v2_readings r WHERE r.session_id = "
               "v2_calibration_sessions.id AND r.phase = 'as-left') THEN 'both' ELSE "
               "'as-found' END, "
               "CASE WHEN state = 'draft' THEN NULL ELSE outcome END, state, submitted_at, "
               "return_comment, returned_at, reviewer_id, approved_at, revision, supersedes_id, "
               "amendment_reason, amended_at FROM v2_calibration_sessions";
    }
    return nullptr;
}

QStringList columnsOf(const QSqlDatabase& db, const QString& table) {
    QSqlQuery q = sql::prepare(db, QStringLiteral("SELECT name FROM pragma_table_info(?)"));
    q.addBindValue(table);
    sql::exec(q, kContext);
    QStringList columns;
    while (q.next()) {
        columns << q.value(0).toString();
    }
    return columns;
}

// The SELECT that gives a new row of `table` from the old table renamed aside as
// `prefix + name`: a column the old table has is copied, a new one is NULL (not recorded).
QString selectOf(const QSqlDatabase& db, const Target& table, const QString& prefix,
                 int fromVersion) {
    if (fromVersion == 2) {
        if (const char* special = selectFromVersion2(table.name)) {
            return QStringLiteral("SELECT ") + QLatin1String(special);
        }
    }
    const QStringList old = columnsOf(db, prefix + table.name);
    QStringList select;
    for (const QString& column : table.columns) {
        select << (old.contains(column) ? column : QStringLiteral("NULL"));
    }
    return QStringLiteral("SELECT %1 FROM %2%3")
        .arg(select.join(QStringLiteral(", ")), prefix, table.name);
}

QStringList namesOf(const QSqlDatabase& db, const QString& type) {
    QSqlQuery q = sql::prepare(db, QStringLiteral("SELECT name FROM sqlite_master WHERE type = ? "
                                                  "AND sql IS NOT NULL AND name NOT LIKE "
                                                  "'sqlite\\_%' ESCAPE '\\' ORDER BY rowid"));
    q.addBindValue(type);
    sql::exec(q, kContext);
    QStringList names;
    while (q.next()) {
        names << q.value(0).toString();
    }
    return names;
}

// A failed bulk copy is repeated row by row to name the row a version 3 check refuses (a time
// that is not a time, text in a number column ...), so the user knows what to repair.
[[noreturn]] void explainRefusedRow(const QSqlDatabase& db, const Target& table,
                                    const QString& select, const WorkbookError& bulkError) {
    const QString& name = table.name;
    QSqlQuery rows(db);
    rows.setForwardOnly(true);
    if (!rows.exec(select)) {
        throw bulkError;
    }
    QStringList marks;
    for (qsizetype i = 0; i < table.columns.size(); ++i) {
        marks << QStringLiteral("?");
    }
    QSqlQuery insert = sql::prepare(db, QStringLiteral("INSERT INTO %1 (%2) VALUES (%3)")
                                            .arg(name, table.columns.join(QStringLiteral(", ")),
                                                 marks.join(QStringLiteral(", "))));
    while (rows.next()) {
        for (int i = 0; i < rows.record().count(); ++i) {
            insert.addBindValue(rows.value(i));
        }
        if (!insert.exec()) {
            QStringList key;
            for (int i = 0; i < 2 && i < rows.record().count(); ++i) {
                key << QStringLiteral("%1 = %2").arg(table.columns[i], rows.value(i).toString());
            }
            throw WorkbookError(
                WorkbookError::Kind::Corrupt,
                QStringLiteral("cannot upgrade the workbook: table %1, row with "
                               "%2: %3; correct that row and open it again")
                    .arg(name, key.join(QStringLiteral(", ")), insert.lastError().databaseText()));
        }
    }
    throw bulkError;
}

void copyRows(const QSqlDatabase& db, const Target& table, const QString& prefix, int fromVersion) {
    const QString select = selectOf(db, table, prefix, fromVersion);
    const QString statement =
        QStringLiteral("INSERT INTO %1 (%2) %3")
            .arg(table.name, table.columns.join(QStringLiteral(", ")), select);
    try {
        sql::execText(db, statement, kContext);
    } catch (const WorkbookError& error) {
        explainRefusedRow(db, table, select, error);
    }
}

// Renames every table of the old version aside (its triggers and indexes dropped first), runs
// `createTables`, copies the rows of each old table into the new table of the same name, and
// drops the old ones. Returns the new tables. The caller then creates indexes and triggers.
template <typename CreateTables>
void rebuildTables(const QSqlDatabase& db, int fromVersion, CreateTables createTables) {
    const QString prefix = QStringLiteral("v%1_").arg(fromVersion);
    for (const QString& trigger : namesOf(db, QStringLiteral("trigger"))) {
        sql::execText(db, QStringLiteral("DROP TRIGGER %1").arg(trigger), kContext);
    }
    for (const QString& index : namesOf(db, QStringLiteral("index"))) {
        sql::execText(db, QStringLiteral("DROP INDEX %1").arg(index), kContext);
    }
    const QStringList oldTables = namesOf(db, QStringLiteral("table"));
    for (const QString& table : oldTables) {
        sql::execText(db, QStringLiteral("ALTER TABLE %1 RENAME TO %2%1").arg(table, prefix),
                      kContext);
    }
    const std::vector<Target> created = createTables();
    for (const Target& table : created) {
        if (oldTables.contains(table.name)) {
            copyRows(db, table, prefix, fromVersion);
        }
    }
    for (const QString& table : oldTables) {
        sql::execText(db, QStringLiteral("DROP TABLE %1%2").arg(prefix, table), kContext);
    }
}

bool startsWith(const QString& statement, const char* keyword) {
    return statement.trimmed().startsWith(QLatin1String(keyword), Qt::CaseInsensitive);
}

} // namespace

void upgradeToVersion3(const QSqlDatabase& db) {
    const QStringList statements = frozen::statements(frozen::kSchemaVersion3Sql);
    rebuildTables(db, 2, [&] {
        std::vector<Target> created;
        for (const QString& statement : statements) {
            if (startsWith(statement, "CREATE TABLE")) {
                sql::execText(db, statement, kContext);
                const QString name = statement.section(QLatin1Char(' '), 2, 2);
                created.push_back({name, columnsOf(db, name)});
            }
        }
        return created;
    });
    // Indexes, then triggers, as version 3 created them; its one row of audit context came
    // across with the rows.
    for (const QString& statement : statements) {
        if (startsWith(statement, "CREATE INDEX") || startsWith(statement, "CREATE UNIQUE")) {
            sql::execText(db, statement, kContext);
        }
    }
    for (const QString& statement : statements) {
        if (startsWith(statement, "CREATE TRIGGER")) {
            sql::execText(db, statement, kContext);
        }
    }
}

void upgradeToVersion4(const QSqlDatabase& db, Timestamp at) {
    rebuildTables(db, 3, [&] {
        std::vector<Target> created;
        for (const schema4::TableDefinition& table : schema4::tables()) {
            sql::execText(db, schema4::expand(table.createSql), kContext);
            QStringList columns;
            for (const char* column : table.columns) {
                columns << QLatin1String(column);
            }
            created.push_back({QLatin1String(table.name), columns});
        }
        return created;
    });
    for (const QString& index : schema4::indexes()) {
        sql::execText(db, index, kContext);
    }
    recordVersionReached(db, 4, at);
    dialect::createTriggers(db);
}

void recordVersionReached(const QSqlDatabase& db, int version, Timestamp at) {
    QSqlQuery q = sql::prepare(db, QStringLiteral("INSERT INTO schema_upgrades (version, "
                                                  "reached_at, chain_length) VALUES (?, ?, "
                                                  "(SELECT count(*) FROM record_chain))"));
    q.addBindValue(version);
    q.addBindValue(sql::toIso(at));
    sql::exec(q, kContext);
}

} // namespace mw::storage::schema
