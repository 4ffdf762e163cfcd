// The upgrade from schema version 2 to 3: every table is rebuilt STRICT with its new checks and
// columns, the rows are copied across, and the triggers are created anew from the explicit
// column lists. What version 2 did not record is marked as not recorded, never invented:
// sessions sealed under version 2 keep record format 1 with no evaluation settings and no plan
// (their readings are their plan; the phases planned are those they hold), and a range whose
// signal type the instrument's kind does not settle is left without one.
#include "storage/schema_upgrade.h"

#include "storage/schema.h"
#include "storage/schema_v3.h"
#include "storage/sql_support.h"
#include "storage/sqlite_dialect.h"
#include "storage/sqlite_triggers.h"

#include <QSqlQuery>
#include <QSqlRecord>

namespace mw::storage::schema {
namespace {

const QString kContext = QStringLiteral("upgrading the workbook to version 3");

// The version 2 tables in the order their rows are copied.
const char* const kTables[] = {
    "users",
    "lab",
    "instruments",
    "instrument_ranges",
    "reference_standards",
    "standard_specs",
    "calibration_sessions",
    "session_standards",
    "readings",
    "resistor_checks",
    "adjustment_notes",
    "record_chain",
    "audit_log",
    "audit_context",
};

QString legacy(const char* table) {
    return QStringLiteral("v2_") + QLatin1String(table);
}

// The SELECT list that turns a version 2 row into a version 3 row, column for column in the
// order of schema_v3.cpp; nullptr: every column is copied as it is.
const char* selectFor(const QString& table) {
    if (table == QLatin1String("reference_standards")) {
        // Version 2 did not record the day of the certificate's calibration.
        return "id, asset_tag, description, certificate_number, due_date, NULL FROM "
               "v2_reference_standards";
    }
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

QString columnList(const schema3::TableDefinition& table) {
    QStringList columns;
    for (const char* column : table.columns) {
        columns << QLatin1String(column);
    }
    return columns.join(QStringLiteral(", "));
}

QString selectOf(const schema3::TableDefinition& table) {
    const QString name = QLatin1String(table.name);
    if (const char* special = selectFor(name)) {
        return QStringLiteral("SELECT ") + QLatin1String(special);
    }
    return QStringLiteral("SELECT %1 FROM v2_%2").arg(columnList(table), name);
}

QStringList namesOf(const QSqlDatabase& db, const QString& type) {
    QSqlQuery q = sql::prepare(db, QStringLiteral("SELECT name FROM sqlite_master WHERE type = ? "
                                                  "AND sql IS NOT NULL"));
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
[[noreturn]] void explainRefusedRow(const QSqlDatabase& db, const schema3::TableDefinition& table,
                                    const WorkbookError& bulkError) {
    const QString name = QLatin1String(table.name);
    QSqlQuery rows(db);
    rows.setForwardOnly(true);
    if (!rows.exec(selectOf(table))) {
        throw bulkError;
    }
    QStringList marks;
    for (std::size_t i = 0; i < table.columns.size(); ++i) {
        marks << QStringLiteral("?");
    }
    QSqlQuery insert =
        sql::prepare(db, QStringLiteral("INSERT INTO %1 (%2) VALUES (%3)")
                             .arg(name, columnList(table), marks.join(QStringLiteral(", "))));
    while (rows.next()) {
        for (int i = 0; i < rows.record().count(); ++i) {
            insert.addBindValue(rows.value(i));
        }
        if (!insert.exec()) {
            QStringList key;
            for (int i = 0; i < 2 && i < rows.record().count(); ++i) {
                key << QStringLiteral("%1 = %2").arg(QLatin1String(table.columns[std::size_t(i)]),
                                                     rows.value(i).toString());
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

void copyRows(const QSqlDatabase& db, const schema3::TableDefinition& table) {
    const QString statement =
        QStringLiteral("INSERT INTO %1 (%2) %3")
            .arg(QLatin1String(table.name), columnList(table), selectOf(table));
    try {
        sql::execText(db, statement, kContext);
    } catch (const WorkbookError& error) {
        explainRefusedRow(db, table, error);
    }
}

} // namespace

void upgradeToVersion3(const QSqlDatabase& db) {
    for (const QString& trigger : namesOf(db, QStringLiteral("trigger"))) {
        sql::execText(db, QStringLiteral("DROP TRIGGER %1").arg(trigger), kContext);
    }
    for (const QString& index : namesOf(db, QStringLiteral("index"))) {
        sql::execText(db, QStringLiteral("DROP INDEX %1").arg(index), kContext);
    }
    for (const char* table : kTables) {
        sql::execText(
            db,
            QStringLiteral("ALTER TABLE %1 RENAME TO %2").arg(QLatin1String(table), legacy(table)),
            kContext);
    }
    for (const schema3::TableDefinition& table : schema3::tables()) {
        sql::execText(db, schema3::expand(table.createSql), kContext);
    }
    for (const char* table : kTables) {
        copyRows(db, schema3::table(QLatin1String(table)));
    }
    for (const char* table : kTables) {
        sql::execText(db, QStringLiteral("DROP TABLE %1").arg(legacy(table)), kContext);
    }
    for (const QString& index : schema3::indexes()) {
        sql::execText(db, index, kContext);
    }
    dialect::createTriggers(db);
}

} // namespace mw::storage::schema
