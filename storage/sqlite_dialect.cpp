// SQLite-only statements: connection pragmas, write locking, backups and all triggers.
#include "storage/sqlite_dialect.h"

#include "storage/sql_support.h"

#include <QSqlQuery>
#include <QStringList>

namespace mw::storage::dialect {
namespace {

// Tables whose rows are records: every write to them is audited.
const QStringList kAuditedTables = {
    QStringLiteral("users"),
    QStringLiteral("lab"),
    QStringLiteral("instruments"),
    QStringLiteral("instrument_ranges"),
    QStringLiteral("reference_standards"),
    QStringLiteral("standard_specs"),
    QStringLiteral("calibration_sessions"),
    QStringLiteral("session_standards"),
    QStringLiteral("readings"),
    QStringLiteral("resistor_checks"),
    QStringLiteral("adjustment_notes"),
    QStringLiteral("record_chain"),
};

// The parts of a calibration session: frozen together with their session.
const QStringList kSessionParts = {
    QStringLiteral("session_standards"),
    QStringLiteral("readings"),
    QStringLiteral("resistor_checks"),
    QStringLiteral("adjustment_notes"),
};

// Columns never written to the audit log (a password hash is no one's business).
const QStringList kUnaudited = {QStringLiteral("password_hash")};

const QString kEditable = QStringLiteral("('draft', 'returned')");

QStringList columnsOf(const QSqlDatabase& db, const QString& table) {
    QSqlQuery query(db);
    if (!query.exec(QStringLiteral("PRAGMA table_info(%1)").arg(table))) {
        throw sql::errorFrom(query.lastError(), QStringLiteral("reading the columns of ") + table);
    }
    QStringList columns;
    while (query.next()) {
        columns << query.value(1).toString();
    }
    return columns;
}

void run(const QSqlDatabase& db, const QString& statement) {
    sql::execText(db, statement, QStringLiteral("creating a trigger"));
}

QString stateOf(const QString& sessionIdExpression) {
    return QStringLiteral("(SELECT state FROM calibration_sessions WHERE id = %1)")
        .arg(sessionIdExpression);
}

// The parts of a session change only while it is a draft or returned to its technician.
void createPartTriggers(const QSqlDatabase& db, const QString& table) {
    const QString raise =
        QStringLiteral("BEGIN SELECT RAISE(ABORT, '%1: the calibration session is submitted or "
                       "approved, so its contents cannot change (amend an approved record)'); END")
            .arg(table);
    run(db, QStringLiteral("CREATE TRIGGER %1_frozen_insert BEFORE INSERT ON %1 "
                           "WHEN %2 NOT IN %3 %4")
                .arg(table, stateOf(QStringLiteral("NEW.session_id")), kEditable, raise));
    run(db, QStringLiteral("CREATE TRIGGER %1_frozen_update BEFORE UPDATE ON %1 "
                           "WHEN %2 NOT IN %4 OR %3 NOT IN %4 %5")
                .arg(table, stateOf(QStringLiteral("OLD.session_id")),
                     stateOf(QStringLiteral("NEW.session_id")), kEditable, raise));
    run(db, QStringLiteral("CREATE TRIGGER %1_frozen_delete BEFORE DELETE ON %1 "
                           "WHEN %2 NOT IN %3 %4")
                .arg(table, stateOf(QStringLiteral("OLD.session_id")), kEditable, raise));
}

void createSessionStateTriggers(const QSqlDatabase& db) {
    // A session is born a draft; an amendment may only supersede an approved record.
    run(db, QStringLiteral(
                "CREATE TRIGGER sessions_start_as_draft BEFORE INSERT ON calibration_sessions "
                "WHEN NEW.state <> 'draft' OR (NEW.supersedes_id IS NOT NULL AND %1 <> "
                "'approved') BEGIN SELECT RAISE(ABORT, 'calibration_sessions: a session starts "
                "as a draft, and only an approved session can be amended'); END")
                .arg(stateOf(QStringLiteral("NEW.supersedes_id"))));
    // The workflow: draft -> submitted -> approved; submitted -> returned -> draft or
    // submitted; approved -> superseded (by an approved amendment only).
    run(db, QStringLiteral(
                "CREATE TRIGGER sessions_state_flow BEFORE UPDATE OF state ON "
                "calibration_sessions WHEN OLD.state <> NEW.state AND NOT ("
                "(OLD.state = 'draft' AND NEW.state = 'submitted') OR "
                "(OLD.state = 'returned' AND NEW.state IN ('draft', 'submitted')) OR "
                "(OLD.state = 'submitted' AND NEW.state IN ('returned', 'approved')) OR "
                "(OLD.state = 'approved' AND NEW.state = 'superseded')) "
                "BEGIN SELECT RAISE(ABORT, 'calibration_sessions: this change of state is not "
                "allowed (draft -> submitted -> approved or returned; approved -> superseded)'); "
                "END"));
    run(db, QStringLiteral(
                "CREATE TRIGGER sessions_superseded_by_amendment BEFORE UPDATE OF state ON "
                "calibration_sessions WHEN OLD.state = 'approved' AND NEW.state = 'superseded' "
                "AND NOT EXISTS (SELECT 1 FROM calibration_sessions a WHERE a.supersedes_id = "
                "OLD.id AND a.state = 'approved') BEGIN SELECT RAISE(ABORT, "
                "'calibration_sessions: only an approved amendment supersedes a record'); END"));
    // The reviewer who approves or returns is an active reviewer or administrator and never
    // the technician (the table CHECK covers the latter too).
    run(db, QStringLiteral(
                "CREATE TRIGGER sessions_reviewer BEFORE UPDATE OF state ON calibration_sessions "
                "WHEN NEW.state IN ('approved', 'returned') AND OLD.state = 'submitted' AND ("
                "NEW.reviewer_id IS NULL OR NEW.reviewer_id = NEW.technician_id OR NOT EXISTS ("
                "SELECT 1 FROM users u WHERE u.id = NEW.reviewer_id AND u.active = 1 AND u.role "
                "IN ('reviewer', 'administrator'))) BEGIN SELECT RAISE(ABORT, "
                "'calibration_sessions: the reviewer must be an active reviewer or administrator "
                "other than the technician'); END"));
    // No submission with a standard past its due date unless a justification is recorded. An
    // amendment corrects a record made earlier with the standards of that day, so its date of
    // use (the start it keeps from the original) counts, not the day the correction is filed.
    run(db, QStringLiteral(
                "CREATE TRIGGER sessions_standards_in_date BEFORE UPDATE OF state ON "
                "calibration_sessions WHEN NEW.state = 'submitted' AND OLD.state <> 'submitted' "
                "AND EXISTS (SELECT 1 FROM session_standards u WHERE u.session_id = NEW.id AND "
                "u.due_date < substr(CASE WHEN NEW.supersedes_id IS NULL THEN NEW.submitted_at "
                "ELSE NEW.started_at END, 1, 10) AND "
                "length(trim(u.overdue_justification)) = 0) BEGIN SELECT RAISE(ABORT, "
                "'calibration_sessions: a reference standard used is past its due date and no "
                "justification is recorded'); END"));
}

// "OLD.a IS NOT NEW.a OR OLD.b IS NOT NEW.b ...": true when any of the columns changes.
QString anyChanged(const QStringList& columns) {
    QStringList changed;
    for (const QString& column : columns) {
        changed << QStringLiteral("OLD.%1 IS NOT NEW.%1").arg(column);
    }
    return QStringLiteral("(%1)").arg(changed.join(QStringLiteral(" OR ")));
}

// The certificate number and due date a session records for a standard are copies of the
// standard's current certificate, taken when it is used, so an overdue standard cannot pass as
// in date. An amendment may carry over the copies of the record it supersedes.
void createStandardCopyTriggers(const QSqlDatabase& db) {
    const QString copied = QStringLiteral(
        "NOT EXISTS (SELECT 1 FROM reference_standards r WHERE r.id = NEW.standard_id AND "
        "r.certificate_number = NEW.certificate_number AND r.due_date = NEW.due_date) AND NOT "
        "EXISTS (SELECT 1 FROM calibration_sessions s JOIN session_standards o ON o.session_id = "
        "s.supersedes_id WHERE s.id = NEW.session_id AND o.standard_id = NEW.standard_id AND "
        "o.certificate_number = NEW.certificate_number AND o.due_date = NEW.due_date)");
    const QString raise = QStringLiteral(
        "BEGIN SELECT RAISE(ABORT, 'session_standards: the certificate number and due date "
        "must be those of the reference standard''s current certificate (or, in an amendment, "
        "those of the record it supersedes)'); END");
    run(db, QStringLiteral("CREATE TRIGGER session_standards_current_insert BEFORE INSERT ON "
                           "session_standards WHEN %1 %2")
                .arg(copied, raise));
    run(db, QStringLiteral("CREATE TRIGGER session_standards_current_update BEFORE UPDATE ON "
                           "session_standards WHEN %1 AND %2 %3")
                .arg(anyChanged({QStringLiteral("session_id"), QStringLiteral("standard_id"),
                                 QStringLiteral("certificate_number"), QStringLiteral("due_date")}),
                     copied, raise));
}

// What an approved record's conformity rests on (and its digest covers) stays as it was: the
// instrument's identity, movement, scale and class, its ranges' limits, and the signatories.
// Location, owner, status, interval, description and a range's nominal resistor stay editable.
void createConformityTriggers(const QSqlDatabase& db) {
    const QString sealed = QStringLiteral("state IN ('approved', 'superseded')");
    run(db,
        QStringLiteral(
            "CREATE TRIGGER instruments_conformity_kept BEFORE UPDATE ON instruments WHEN %1 "
            "AND EXISTS (SELECT 1 FROM calibration_sessions s WHERE s.instrument_id = OLD.id "
            "AND s.%2) BEGIN SELECT RAISE(ABORT, 'instruments: an approved calibration record "
            "refers to this instrument, so its asset tag, serial, kind, movement, scale and "
            "accuracy class cannot change; register a new instrument or amend the record'); "
            "END")
            .arg(anyChanged({QStringLiteral("asset_tag"), QStringLiteral("serial"),
                             QStringLiteral("kind"), QStringLiteral("movement_amps_fs"),
                             QStringLiteral("movement_ohms"), QStringLiteral("scale_type"),
                             QStringLiteral("scale_divisions"), QStringLiteral("accuracy_class")}),
                 sealed));
    run(db, QStringLiteral(
                "CREATE TRIGGER instrument_ranges_conformity_kept BEFORE UPDATE ON "
                "instrument_ranges WHEN %1 AND EXISTS (SELECT 1 FROM calibration_sessions s "
                "WHERE s.instrument_id = OLD.instrument_id AND s.%2) BEGIN SELECT RAISE(ABORT, "
                "'instrument_ranges: an approved calibration record refers to this instrument, so "
                "a range''s label, unit, limits and fiducial value cannot change; register a new "
                "instrument or amend the record'); END")
                .arg(anyChanged({QStringLiteral("instrument_id"), QStringLiteral("label"),
                                 QStringLiteral("unit"), QStringLiteral("lower_limit"),
                                 QStringLiteral("full_scale"), QStringLiteral("fiducial_value")}),
                     sealed));
    run(db, QStringLiteral(
                "CREATE TRIGGER users_signature_kept BEFORE UPDATE ON users WHEN %1 AND EXISTS "
                "(SELECT 1 FROM calibration_sessions s WHERE (s.technician_id = OLD.id OR "
                "s.reviewer_id = OLD.id) AND s.%2) BEGIN SELECT RAISE(ABORT, 'users: this user "
                "signed approved calibration records, so the login and name cannot change; add a "
                "new user and deactivate this one'); END")
                .arg(anyChanged({QStringLiteral("login"), QStringLiteral("full_name")}), sealed));
}

void createFrozenSessionTriggers(const QSqlDatabase& db) {
    QStringList unchanged;
    QStringList columns;
    for (const QString& column : columnsOf(db, QStringLiteral("calibration_sessions"))) {
        if (column != QLatin1String("state")) {
            unchanged << QStringLiteral("OLD.%1 IS NEW.%1").arg(column);
            columns << column;
        }
    }
    // An approved or superseded record never changes, except approved -> superseded alone.
    run(db, QStringLiteral(
                "CREATE TRIGGER sessions_approved_frozen BEFORE UPDATE ON calibration_sessions "
                "WHEN OLD.state IN ('approved', 'superseded') AND NOT (OLD.state = 'approved' AND "
                "NEW.state = 'superseded' AND %1) BEGIN SELECT RAISE(ABORT, "
                "'calibration_sessions: an approved record cannot be changed; amend it with a "
                "reason instead'); END")
                .arg(unchanged.join(QStringLiteral(" AND "))));
    // Fields other than the state change only while a draft (or returned), so a submitted
    // session is what the reviewer sees; the workflow columns are set by the transition itself.
    run(db, QStringLiteral(
                "CREATE TRIGGER sessions_submitted_frozen BEFORE UPDATE ON calibration_sessions "
                "WHEN OLD.state = 'submitted' AND NEW.state = 'submitted' BEGIN SELECT "
                "RAISE(ABORT, 'calibration_sessions: a submitted session cannot be edited; the "
                "reviewer returns it first'); END"));
    run(db, QStringLiteral(
                "CREATE TRIGGER sessions_kept BEFORE DELETE ON calibration_sessions WHEN "
                "OLD.state NOT IN %1 BEGIN SELECT RAISE(ABORT, 'calibration_sessions: only a "
                "draft can be deleted; submitted and approved records are kept'); END")
                .arg(kEditable));
}

void createRecordTriggers(const QSqlDatabase& db) {
    // Readings and resistor checks belong to a range of the session's own instrument, and a
    // reading is in that range's unit.
    run(db, QStringLiteral(
                "CREATE TRIGGER readings_range_matches BEFORE INSERT ON readings WHEN NOT EXISTS "
                "(SELECT 1 FROM instrument_ranges r JOIN calibration_sessions s ON "
                "s.instrument_id = r.instrument_id WHERE r.id = NEW.range_id AND s.id = "
                "NEW.session_id AND r.unit = NEW.unit) BEGIN SELECT RAISE(ABORT, 'readings: the "
                "range is not one of the session''s instrument, or the unit is not the "
                "range''s'); END"));
    run(db, QStringLiteral(
                "CREATE TRIGGER readings_range_matches_update BEFORE UPDATE ON readings WHEN NOT "
                "EXISTS (SELECT 1 FROM instrument_ranges r JOIN calibration_sessions s ON "
                "s.instrument_id = r.instrument_id WHERE r.id = NEW.range_id AND s.id = "
                "NEW.session_id AND r.unit = NEW.unit) BEGIN SELECT RAISE(ABORT, 'readings: the "
                "range is not one of the session''s instrument, or the unit is not the "
                "range''s'); END"));
    run(db, QStringLiteral(
                "CREATE TRIGGER resistor_checks_range_matches BEFORE INSERT ON resistor_checks "
                "WHEN NOT EXISTS (SELECT 1 FROM instrument_ranges r JOIN calibration_sessions s "
                "ON s.instrument_id = r.instrument_id WHERE r.id = NEW.range_id AND s.id = "
                "NEW.session_id) BEGIN SELECT RAISE(ABORT, 'resistor_checks: the range is not "
                "one of the session''s instrument'); END"));
    // The digest chain is append-only, and only approved sessions enter it.
    run(db, QStringLiteral(
                "CREATE TRIGGER record_chain_approved_only BEFORE INSERT ON record_chain WHEN %1 "
                "IS NOT 'approved' BEGIN SELECT RAISE(ABORT, 'record_chain: only an approved "
                "session enters the chain'); END")
                .arg(stateOf(QStringLiteral("NEW.session_id"))));
    for (const char* event : {"UPDATE", "DELETE"}) {
        run(db, QStringLiteral("CREATE TRIGGER record_chain_append_only_%1 BEFORE %2 ON "
                               "record_chain BEGIN SELECT RAISE(ABORT, 'record_chain: the chain "
                               "of approved records is append-only'); END")
                    .arg(QString::fromLatin1(event).toLower(), QLatin1String(event)));
    }
    run(db, QStringLiteral("CREATE TRIGGER users_kept BEFORE DELETE ON users BEGIN SELECT "
                           "RAISE(ABORT, 'users: a user is deactivated, never deleted, so that "
                           "records keep their signatures'); END"));
}

QString jsonOf(const QStringList& columns, const QString& row) {
    QStringList pairs;
    for (const QString& column : columns) {
        if (!kUnaudited.contains(column)) {
            pairs << QStringLiteral("'%1', %2.%1").arg(column, row);
        }
    }
    return QStringLiteral("json_object(%1)").arg(pairs.join(QStringLiteral(", ")));
}

// An insert is logged without its values: the row itself holds them, and any later update or
// delete logs them as old values. Repeating every reading in the log would double the file and
// the time quick_check takes on every open.
void createAuditTriggersFor(const QSqlDatabase& db, const QString& table) {
    const QStringList columns = columnsOf(db, table);
    const QString insert = QStringLiteral(
        "INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) "
        "VALUES (%1, (SELECT user_id FROM audit_context WHERE id = 1), '%2', %3, '%4', %5, %6);");
    const QString now = nowUtcExpression();
    const QString oldJson = jsonOf(columns, QStringLiteral("OLD"));
    const QString newJson = jsonOf(columns, QStringLiteral("NEW"));
    const QString null = QStringLiteral("NULL");
    // A reading has no id of its own: it is logged under its session's id, and its values
    // (logged on update and delete) name the reading by its key.
    const QString idColumn =
        columns.contains(QLatin1String("id")) ? QStringLiteral("id") : QStringLiteral("session_id");
    run(db, QStringLiteral("CREATE TRIGGER audit_%1_insert AFTER INSERT ON %1 BEGIN %2 END")
                .arg(table, insert.arg(now, table, QStringLiteral("NEW.") + idColumn,
                                       QStringLiteral("insert"), null, null)));
    run(db, QStringLiteral("CREATE TRIGGER audit_%1_update AFTER UPDATE ON %1 BEGIN %2 END")
                .arg(table, insert.arg(now, table, QStringLiteral("NEW.") + idColumn,
                                       QStringLiteral("update"), oldJson, newJson)));
    run(db, QStringLiteral("CREATE TRIGGER audit_%1_delete AFTER DELETE ON %1 BEGIN %2 END")
                .arg(table, insert.arg(now, table, QStringLiteral("OLD.") + idColumn,
                                       QStringLiteral("delete"), oldJson, null)));
}

int intPragma(const QSqlDatabase& db, const QString& pragma) {
    return sql::scalar(db, QStringLiteral("PRAGMA ") + pragma, QStringLiteral("reading ") + pragma)
        .toInt();
}

// SQLite answers a check with one row per problem, and a row may itself hold several lines
// (b-tree problems come as one text under a "*** in database main ***" heading). Callers show
// the verdict on one line, so it is summarised as the first problem and a count of the rest.
QString checkPragma(const QSqlDatabase& db, const QString& pragma) {
    QSqlQuery query(db);
    query.setForwardOnly(true);
    if (!query.exec(QStringLiteral("PRAGMA ") + pragma)) {
        throw sql::errorFrom(query.lastError(), QStringLiteral("running ") + pragma);
    }
    QStringList problems;
    while (query.next()) {
        for (const QString& line : query.value(0).toString().split(QLatin1Char('\n'))) {
            const QString trimmed = line.trimmed();
            if (!trimmed.isEmpty() && !trimmed.startsWith(QLatin1String("***"))) {
                problems << trimmed;
            }
        }
    }
    if (problems.isEmpty()) {
        return QStringLiteral("no answer");
    }
    if (problems.size() == 1) {
        return problems.first();
    }
    return QStringLiteral("%1 (and %2 more)").arg(problems.first()).arg(problems.size() - 1);
}

} // namespace

QString idColumn() {
    return QStringLiteral("INTEGER PRIMARY KEY");
}

QString keyOnlyTableOption() {
    return QStringLiteral("WITHOUT ROWID");
}

QString nowUtcExpression() {
    return QStringLiteral("strftime('%Y-%m-%dT%H:%M:%fZ', 'now')");
}

void configureConnection(const QSqlDatabase& db, bool readOnly,
                         std::chrono::milliseconds busyTimeout) {
    const QString context = QStringLiteral("configuring the connection");
    sql::execText(db, QStringLiteral("PRAGMA busy_timeout = %1").arg(busyTimeout.count()), context);
    sql::execText(db, QStringLiteral("PRAGMA foreign_keys = ON"), context);
    if (!readOnly) {
        sql::execText(db, QStringLiteral("PRAGMA journal_mode = WAL"), context);
        sql::execText(db, QStringLiteral("PRAGMA synchronous = NORMAL"), context);
    }
}

void setFullSync(const QSqlDatabase& db, bool full) {
    sql::execText(db,
                  full ? QStringLiteral("PRAGMA synchronous = FULL")
                       : QStringLiteral("PRAGMA synchronous = NORMAL"),
                  QStringLiteral("setting the durability of commits"));
}

QString beginWrite() {
    return QStringLiteral("BEGIN IMMEDIATE");
}

int applicationId(const QSqlDatabase& db) {
    return intPragma(db, QStringLiteral("application_id"));
}

void setApplicationId(const QSqlDatabase& db) {
    sql::execText(db, QStringLiteral("PRAGMA application_id = %1").arg(kApplicationId),
                  QStringLiteral("marking the file as a workbook"));
}

int userVersion(const QSqlDatabase& db) {
    return intPragma(db, QStringLiteral("user_version"));
}

void setUserVersion(const QSqlDatabase& db, int version) {
    sql::execText(db, QStringLiteral("PRAGMA user_version = %1").arg(version),
                  QStringLiteral("recording the schema version"));
}

int tableCount(const QSqlDatabase& db) {
    return sql::scalar(db,
                       QStringLiteral("SELECT COUNT(*) FROM sqlite_master WHERE type = 'table'"),
                       QStringLiteral("listing tables"))
        .toInt();
}

QString quickCheck(const QSqlDatabase& db) {
    return checkPragma(db, QStringLiteral("quick_check"));
}

QString integrityCheck(const QSqlDatabase& db) {
    return checkPragma(db, QStringLiteral("integrity_check"));
}

void vacuumInto(const QSqlDatabase& db, const QString& targetPath) {
    QString quoted = targetPath;
    quoted.replace(QLatin1Char('\''), QStringLiteral("''"));
    sql::execText(db, QStringLiteral("VACUUM INTO '%1'").arg(quoted),
                  QStringLiteral("writing a backup to %1").arg(targetPath));
}

void createIntegrityTriggers(const QSqlDatabase& db) {
    for (const QString& table : kSessionParts) {
        createPartTriggers(db, table);
    }
    createSessionStateTriggers(db);
    createFrozenSessionTriggers(db);
    createRecordTriggers(db);
    createStandardCopyTriggers(db);
    createConformityTriggers(db);
    createRecordKeyTriggers(db);
}

void createAuditTriggers(const QSqlDatabase& db) {
    for (const QString& table : kAuditedTables) {
        createAuditTriggersFor(db, table);
    }
    for (const char* event : {"UPDATE", "DELETE"}) {
        run(db, QStringLiteral("CREATE TRIGGER audit_log_append_only_%1 BEFORE %2 ON audit_log "
                               "BEGIN SELECT RAISE(ABORT, 'audit_log: the audit log is "
                               "append-only'); END")
                    .arg(QString::fromLatin1(event).toLower(), QLatin1String(event)));
    }
    createAuditKeyTriggers(db);
}

} // namespace mw::storage::dialect
