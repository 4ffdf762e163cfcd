// The integrity rules of schema version 4 as SQLite triggers: sessions change only through
// their workflow, their parts only while a draft, an approved record never; copies of the
// standards and ranges a session used are true copies; the instrument an approved record rests
// on keeps what the record rests on. Column lists come from schema_v4.cpp, never from the file.
#include "storage/sqlite_triggers.h"

#include "storage/schema_v4.h"
#include "storage/sql_support.h"

namespace mw::storage::dialect {
namespace {

const QString kEditable = QStringLiteral("('draft', 'returned')");

// The parts of a calibration session: frozen together with their session.
const char* const kSessionParts[] = {
    "session_standards", "session_standard_specs", "session_ranges",  "session_points",
    "readings",          "resistor_checks",        "adjustment_notes"};

QString stateOf(const QString& sessionIdExpression) {
    return QStringLiteral("(SELECT state FROM calibration_sessions WHERE id = %1)")
        .arg(sessionIdExpression);
}

QStringList columnsOf(const char* table) {
    QStringList columns;
    for (const char* column : schema4::table(QLatin1String(table)).columns) {
        columns << QLatin1String(column);
    }
    return columns;
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
                "WHEN NEW.state <> 'draft' OR (NEW.supersedes_id IS NOT NULL AND %1 IS NOT "
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
    // A session is submitted with every reading complete: one whose indication was never typed
    // is no observation.
    run(db, QStringLiteral(
                "CREATE TRIGGER sessions_complete_on_submit BEFORE UPDATE OF state ON "
                "calibration_sessions WHEN NEW.state = 'submitted' AND OLD.state <> 'submitted' "
                "AND EXISTS (SELECT 1 FROM readings r WHERE r.session_id = NEW.id AND "
                "r.indicated IS NULL) BEGIN SELECT RAISE(ABORT, 'calibration_sessions: a reading "
                "without its indication cannot be submitted'); END"));
    // A session is submitted with a copy of every range it has readings on (what its verdict
    // was computed from), unless it is a record of the format that predates the copies.
    run(db, QStringLiteral(
                "CREATE TRIGGER sessions_sealed_on_submit BEFORE UPDATE OF state ON "
                "calibration_sessions WHEN NEW.state = 'submitted' AND OLD.state <> 'submitted' "
                "AND NEW.record_format >= 2 AND EXISTS (SELECT 1 FROM readings r WHERE "
                "r.session_id = NEW.id AND NOT EXISTS (SELECT 1 FROM session_ranges c WHERE "
                "c.session_id = NEW.id AND c.range_id = r.range_id)) BEGIN SELECT RAISE(ABORT, "
                "'calibration_sessions: a session is submitted with a copy of every range it has "
                "readings on'); END"));
}

void createFrozenSessionTriggers(const QSqlDatabase& db) {
    QStringList unchanged;
    for (const QString& column : columnsOf("calibration_sessions")) {
        if (column != QLatin1String("state")) {
            unchanged << QStringLiteral("OLD.%1 IS NEW.%1").arg(column);
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

QString same(const QStringList& columns, const QString& a, const QString& b);

void createRecordTriggers(const QSqlDatabase& db) {
    // Readings, resistor checks and range copies belong to a range of the session's own
    // instrument, and a reading is in that range's unit.
    const QString readingRange = QStringLiteral(
        "NOT EXISTS (SELECT 1 FROM instrument_ranges r JOIN calibration_sessions s ON "
        "s.instrument_id = r.instrument_id WHERE r.id = NEW.range_id AND s.id = NEW.session_id "
        "AND r.unit = NEW.unit) BEGIN SELECT RAISE(ABORT, 'readings: the range is not one of the "
        "session''s instrument, or the unit is not the range''s'); END");
    run(db, QStringLiteral("CREATE TRIGGER readings_range_matches BEFORE INSERT ON readings "
                           "WHEN %1")
                .arg(readingRange));
    run(db, QStringLiteral("CREATE TRIGGER readings_range_matches_update BEFORE UPDATE ON "
                           "readings WHEN %1")
                .arg(readingRange));
    for (const char* table : {"resistor_checks", "session_ranges", "session_points"}) {
        run(db, QStringLiteral(
                    "CREATE TRIGGER %1_range_matches BEFORE INSERT ON %1 WHEN NOT EXISTS (SELECT "
                    "1 FROM instrument_ranges r JOIN calibration_sessions s ON s.instrument_id = "
                    "r.instrument_id WHERE r.id = NEW.range_id AND s.id = NEW.session_id) BEGIN "
                    "SELECT RAISE(ABORT, '%1: the range is not one of the session''s "
                    "instrument'); END")
                    .arg(QLatin1String(table)));
    }
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
    // An approval entered from version 4 on is signed with its reviewer's key in use and
    // seals the audit log.
    run(db, QStringLiteral(
                "CREATE TRIGGER record_chain_signed BEFORE INSERT ON record_chain WHEN %1 IS "
                "'approved' AND (NEW.audit_digest IS NULL OR NOT EXISTS (SELECT 1 FROM "
                "signing_keys k JOIN calibration_sessions s ON s.reviewer_id = k.user_id WHERE "
                "k.id = NEW.signing_key_id AND s.id = NEW.session_id AND k.retired_at IS NULL)) "
                "BEGIN SELECT RAISE(ABORT, 'record_chain: an approval is signed with the "
                "reviewer''s own key in use and seals the audit log'); END")
                .arg(stateOf(QStringLiteral("NEW.session_id"))));
    run(db, QStringLiteral("CREATE TRIGGER signing_keys_kept BEFORE DELETE ON signing_keys "
                           "BEGIN SELECT RAISE(ABORT, 'signing_keys: a key is retired, never "
                           "deleted, so that what it signed stays verifiable'); END"));
    run(db, QStringLiteral("CREATE TRIGGER signing_keys_fixed BEFORE UPDATE ON signing_keys "
                           "WHEN OLD.retired_at IS NOT NULL OR NOT (%1) BEGIN SELECT "
                           "RAISE(ABORT, 'signing_keys: a key never changes; it is retired "
                           "once'); END")
                .arg(same({QStringLiteral("id"), QStringLiteral("user_id"),
                           QStringLiteral("public_key"), QStringLiteral("sealed_secret"),
                           QStringLiteral("created_at")},
                          QStringLiteral("NEW"), QStringLiteral("OLD"))));
    // Refused before conflict resolution, so an INSERT OR REPLACE cannot drop the key in use.
    run(db, QStringLiteral("CREATE TRIGGER signing_keys_one_in_use BEFORE INSERT ON "
                           "signing_keys WHEN NEW.retired_at IS NULL AND EXISTS (SELECT 1 FROM "
                           "signing_keys k WHERE k.user_id = NEW.user_id AND k.retired_at IS "
                           "NULL) BEGIN SELECT RAISE(ABORT, 'signing_keys: retire the key in use "
                           "before another is issued'); END"));
    for (const char* event : {"UPDATE", "DELETE"}) {
        run(db, QStringLiteral("CREATE TRIGGER schema_upgrades_append_only_%1 BEFORE %2 ON "
                               "schema_upgrades BEGIN SELECT RAISE(ABORT, 'schema_upgrades: the "
                               "history of the workbook''s versions is append-only'); END")
                    .arg(QString::fromLatin1(event).toLower(), QLatin1String(event)));
    }
    run(db, QStringLiteral("CREATE TRIGGER users_kept BEFORE DELETE ON users BEGIN SELECT "
                           "RAISE(ABORT, 'users: a user is deactivated, never deleted, so that "
                           "records keep their signatures'); END"));
}

// "a.x IS b.x AND ...": the listed columns of two rows are equal (NULLs included).
QString same(const QStringList& columns, const QString& a, const QString& b) {
    QStringList equal;
    for (const QString& column : columns) {
        equal << QStringLiteral("%1.%3 IS %2.%3").arg(a, b, column);
    }
    return equal.join(QStringLiteral(" AND "));
}

// The certificate number and due date a session records for a standard are copies of the
// standard's current certificate, taken when it is used, so an overdue standard cannot pass as
// in date. An amendment may carry over the copies of the record it supersedes.
void createStandardUseTriggers(const QSqlDatabase& db) {
    const QStringList copiedColumns = {QStringLiteral("certificate_number"),
                                       QStringLiteral("due_date")};
    const QString copied =
        QStringLiteral("NOT EXISTS (SELECT 1 FROM reference_standards r WHERE r.id = "
                       "NEW.standard_id AND %1) AND NOT EXISTS (SELECT 1 FROM "
                       "calibration_sessions s JOIN session_standards o ON o.session_id = "
                       "s.supersedes_id WHERE s.id = NEW.session_id AND o.standard_id = "
                       "NEW.standard_id AND %2)")
            .arg(same(copiedColumns, QStringLiteral("r"), QStringLiteral("NEW")),
                 same(copiedColumns, QStringLiteral("o"), QStringLiteral("NEW")));
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

// A session's copy of a standard's range equals that range in the register when it is taken
// (or, in an amendment, the copy of the record it supersedes); copies are replaced, never
// edited.
void createSpecCopyTriggers(const QSqlDatabase& db) {
    QStringList specColumns = columnsOf("session_standard_specs");
    specColumns.removeAll(QStringLiteral("session_id"));
    const QString condition =
        QStringLiteral("NOT EXISTS (SELECT 1 FROM standard_specs s WHERE %1) AND NOT EXISTS "
                       "(SELECT 1 FROM calibration_sessions x JOIN session_standard_specs o ON "
                       "o.session_id = x.supersedes_id WHERE x.id = NEW.session_id AND %2)")
            .arg(same(specColumns, QStringLiteral("s"), QStringLiteral("NEW")),
                 same(specColumns, QStringLiteral("o"), QStringLiteral("NEW")));
    run(db, QStringLiteral(
                "CREATE TRIGGER session_standard_specs_copied BEFORE INSERT ON "
                "session_standard_specs WHEN %1 BEGIN SELECT RAISE(ABORT, "
                "'session_standard_specs: a copy must equal the standard''s range in the register "
                "(or, in an amendment, the copy of the record it supersedes)'); END")
                .arg(condition));
    // The register's side of a range copy: signal, resistor and divisions as they stand.
    const QString rangeCondition = QStringLiteral(
        "NOT EXISTS (SELECT 1 FROM instrument_ranges r JOIN instruments i ON i.id = "
        "r.instrument_id WHERE r.id = NEW.range_id AND r.signal IS NEW.signal AND "
        "r.nominal_ohms IS NEW.resistor_ohms AND i.scale_divisions IS NEW.divisions) AND NOT "
        "EXISTS (SELECT 1 FROM calibration_sessions x JOIN session_ranges o ON o.session_id = "
        "x.supersedes_id WHERE x.id = NEW.session_id AND o.range_id = NEW.range_id AND "
        "o.signal IS NEW.signal AND o.resistor_ohms IS NEW.resistor_ohms AND o.divisions IS "
        "NEW.divisions)");
    run(db, QStringLiteral(
                "CREATE TRIGGER session_ranges_copied BEFORE INSERT ON session_ranges WHEN %1 "
                "BEGIN SELECT RAISE(ABORT, 'session_ranges: a copy must hold the range''s signal "
                "type, resistor and scale divisions as the register has them (or, in an "
                "amendment, as the record it supersedes has them)'); END")
                .arg(rangeCondition));
    for (const char* table : {"session_standard_specs", "session_ranges"}) {
        run(db, QStringLiteral("CREATE TRIGGER %1_never_edited BEFORE UPDATE ON %1 BEGIN SELECT "
                               "RAISE(ABORT, '%1: a copy is replaced, never edited'); END")
                    .arg(QLatin1String(table)));
    }
}

// What an approved record's conformity rests on (and its digest covers) stays as it was: the
// instrument's identity, movement, scale and class, its ranges' limits, and the signatories.
// Location, owner, status, interval, description, a range's resistor and signal type stay
// editable (the record holds its own copies of the last two).
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

} // namespace

void run(const QSqlDatabase& db, const QString& statement) {
    sql::execText(db, statement, QStringLiteral("creating a trigger"));
}

QString anyChanged(const QStringList& columns) {
    QStringList changed;
    for (const QString& column : columns) {
        changed << QStringLiteral("OLD.%1 IS NOT NEW.%1").arg(column);
    }
    return QStringLiteral("(%1)").arg(changed.join(QStringLiteral(" OR ")));
}

void createIntegrityTriggers(const QSqlDatabase& db) {
    for (const char* table : kSessionParts) {
        createPartTriggers(db, QLatin1String(table));
    }
    createSessionStateTriggers(db);
    createFrozenSessionTriggers(db);
    createRecordTriggers(db);
    createStandardUseTriggers(db);
    createSpecCopyTriggers(db);
    createConformityTriggers(db);
}

void createTriggers(const QSqlDatabase& db) {
    createIntegrityTriggers(db);
    createAuditTriggers(db);
    createKeyTriggers(db);
}

} // namespace mw::storage::dialect
