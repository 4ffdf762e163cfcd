// All tables and indexes of the workbook, by schema version, in SQL that PostgreSQL also
// accepts (the id column type comes from the dialect); triggers live in sqlite_dialect.
#include "storage/schema.h"

#include "storage/sql_support.h"
#include "storage/sqlite_dialect.h"

#include <QSqlQuery>
#include <QStringList>

#include <functional>

namespace mw::storage::schema {
namespace {

// Accuracy classes are the class indices of IEC 60051-2 (the same series as
// core/accuracy/accuracy_class.h). Times are ISO 8601 UTC text of one format, so they compare
// as text: a session is submitted after it started (and, once out of the technician's hands,
// after it finished) and approved after it was submitted.
//
// DOUBLE PRECISION, not REAL: PostgreSQL's REAL is single precision; SQLite stores both as
// 8-byte floats.
const char* const kVersion1Tables[] = {
    R"(CREATE TABLE users (
        id {id},
        login TEXT NOT NULL UNIQUE CHECK (length(login) > 0),
        full_name TEXT NOT NULL,
        role TEXT NOT NULL CHECK (role IN ('technician', 'reviewer', 'administrator')),
        active INTEGER NOT NULL CHECK (active IN (0, 1)),
        password_hash TEXT NOT NULL CHECK (password_hash LIKE '$argon2id$%')))",
    R"(CREATE TABLE lab (
        id INTEGER PRIMARY KEY CHECK (id = 1),
        name TEXT NOT NULL CHECK (length(name) > 0),
        address TEXT NOT NULL,
        accreditation_id TEXT))",
    R"(CREATE TABLE instruments (
        id {id},
        asset_tag TEXT NOT NULL UNIQUE CHECK (length(asset_tag) > 0),
        description TEXT NOT NULL,
        manufacturer TEXT NOT NULL,
        model TEXT NOT NULL,
        serial TEXT NOT NULL,
        kind TEXT NOT NULL CHECK (kind IN ('dc-voltmeter', 'dc-ammeter', 'half-wave-ac-voltmeter',
                                           'bridge-ac-voltmeter', 'multi-range')),
        movement_amps_fs DOUBLE PRECISION NOT NULL CHECK (movement_amps_fs > 0),
        movement_ohms DOUBLE PRECISION NOT NULL CHECK (movement_ohms >= 0),
        scale_type TEXT NOT NULL CHECK (scale_type IN ('zero-at-end', 'zero-inside', 'no-zero',
                                                       'non-linear')),
        scale_divisions INTEGER NOT NULL CHECK (scale_divisions >= 0),
        accuracy_class DOUBLE PRECISION NOT NULL
            CHECK (accuracy_class IN (0.05, 0.1, 0.2, 0.3, 0.5, 1, 1.5, 2, 2.5, 3, 5)),
        interval_days INTEGER NOT NULL CHECK (interval_days > 0),
        location TEXT NOT NULL,
        owner TEXT NOT NULL,
        status TEXT NOT NULL CHECK (status IN ('in-service', 'out-of-service', 'retired'))))",
    R"(CREATE TABLE instrument_ranges (
        id {id},
        instrument_id INTEGER NOT NULL REFERENCES instruments (id) ON DELETE CASCADE,
        sort_order INTEGER NOT NULL,
        label TEXT NOT NULL CHECK (length(label) > 0),
        unit TEXT NOT NULL CHECK (unit IN ('V', 'A')),
        lower_limit DOUBLE PRECISION NOT NULL,
        full_scale DOUBLE PRECISION NOT NULL CHECK (full_scale > lower_limit),
        nominal_ohms DOUBLE PRECISION CHECK (nominal_ohms IS NULL OR nominal_ohms > 0),
        fiducial_value DOUBLE PRECISION CHECK (fiducial_value IS NULL OR fiducial_value > 0),
        UNIQUE (instrument_id, label)))",
    R"(CREATE TABLE reference_standards (
        id {id},
        asset_tag TEXT NOT NULL UNIQUE CHECK (length(asset_tag) > 0),
        description TEXT NOT NULL,
        certificate_number TEXT NOT NULL,
        due_date TEXT NOT NULL CHECK (due_date LIKE '____-__-__')))",
    R"(CREATE TABLE standard_specs (
        id {id},
        standard_id INTEGER NOT NULL REFERENCES reference_standards (id) ON DELETE CASCADE,
        sort_order INTEGER NOT NULL,
        label TEXT NOT NULL,
        unit TEXT NOT NULL CHECK (unit IN ('V', 'A', 'ohm')),
        full_scale DOUBLE PRECISION NOT NULL CHECK (full_scale > 0),
        percent_of_reading DOUBLE PRECISION NOT NULL CHECK (percent_of_reading >= 0),
        percent_of_range DOUBLE PRECISION NOT NULL CHECK (percent_of_range >= 0),
        floor_value DOUBLE PRECISION NOT NULL CHECK (floor_value >= 0),
        certificate_expanded_uncertainty DOUBLE PRECISION
            CHECK (certificate_expanded_uncertainty IS NULL OR certificate_expanded_uncertainty > 0),
        coverage_factor DOUBLE PRECISION NOT NULL CHECK (coverage_factor > 0)))",
    R"(CREATE TABLE calibration_sessions (
        id {id},
        instrument_id INTEGER NOT NULL REFERENCES instruments (id),
        technician_id INTEGER NOT NULL REFERENCES users (id),
        started_at TEXT NOT NULL,
        finished_at TEXT CHECK (finished_at IS NULL OR finished_at >= started_at),
        ambient_celsius DOUBLE PRECISION NOT NULL CHECK (ambient_celsius BETWEEN -40 AND 85),
        relative_humidity_percent DOUBLE PRECISION NOT NULL
            CHECK (relative_humidity_percent BETWEEN 0 AND 100),
        method TEXT NOT NULL,
        decision_rule TEXT NOT NULL CHECK (decision_rule IN ('simple', 'guarded')),
        guard_factor DOUBLE PRECISION NOT NULL CHECK (guard_factor >= 0),
        outcome TEXT CHECK (outcome IS NULL OR outcome IN ('pass', 'conditional-pass',
                                                           'conditional-fail', 'fail')),
        state TEXT NOT NULL CHECK (state IN ('draft', 'submitted', 'returned', 'approved',
                                             'superseded')),
        submitted_at TEXT,
        return_comment TEXT NOT NULL,
        returned_at TEXT,
        reviewer_id INTEGER REFERENCES users (id),
        approved_at TEXT,
        revision INTEGER NOT NULL CHECK (revision >= 1),
        supersedes_id INTEGER UNIQUE REFERENCES calibration_sessions (id),
        amendment_reason TEXT NOT NULL,
        amended_at TEXT,
        CHECK (reviewer_id IS NULL OR reviewer_id <> technician_id),
        CHECK (submitted_at IS NULL OR submitted_at >= started_at),
        CHECK (state IN ('draft', 'returned') OR finished_at IS NULL
               OR finished_at <= submitted_at),
        CHECK (approved_at IS NULL OR (submitted_at IS NOT NULL AND approved_at >= submitted_at)),
        CHECK (decision_rule = 'guarded' OR guard_factor = 0),
        CHECK (state = 'draft' OR submitted_at IS NOT NULL),
        CHECK (state <> 'returned' OR length(return_comment) > 0),
        CHECK (state NOT IN ('approved', 'superseded')
               OR (reviewer_id IS NOT NULL AND approved_at IS NOT NULL)),
        CHECK ((supersedes_id IS NULL AND revision = 1)
               OR (supersedes_id IS NOT NULL AND revision > 1
                   AND length(amendment_reason) > 0))))",
    R"(CREATE TABLE session_standards (
        id {id},
        session_id INTEGER NOT NULL REFERENCES calibration_sessions (id) ON DELETE CASCADE,
        standard_id INTEGER NOT NULL REFERENCES reference_standards (id),
        certificate_number TEXT NOT NULL,
        due_date TEXT NOT NULL CHECK (due_date LIKE '____-__-__'),
        overdue_justification TEXT NOT NULL,
        UNIQUE (session_id, standard_id)))",
    // A reading is identified by its natural key and stored in that key's b-tree only (no
    // rowid table plus unique index): half the pages per reading, so quick_check on open reads
    // a quarter less of a large workbook.
    R"(CREATE TABLE readings (
        session_id INTEGER NOT NULL REFERENCES calibration_sessions (id) ON DELETE CASCADE,
        range_id INTEGER NOT NULL REFERENCES instrument_ranges (id),
        point_index INTEGER NOT NULL CHECK (point_index >= 0),
        direction TEXT NOT NULL CHECK (direction IN ('up', 'down')),
        phase TEXT NOT NULL CHECK (phase IN ('as-found', 'as-left')),
        repeat_number INTEGER NOT NULL CHECK (repeat_number >= 1),
        unit TEXT NOT NULL CHECK (unit IN ('V', 'A')),
        applied DOUBLE PRECISION NOT NULL,
        indicated DOUBLE PRECISION NOT NULL,
        PRIMARY KEY (session_id, range_id, point_index, direction, phase, repeat_number))
        {key_only})",
    R"(CREATE TABLE resistor_checks (
        id {id},
        session_id INTEGER NOT NULL REFERENCES calibration_sessions (id) ON DELETE CASCADE,
        range_id INTEGER NOT NULL REFERENCES instrument_ranges (id),
        component TEXT NOT NULL,
        computed_ohms DOUBLE PRECISION NOT NULL CHECK (computed_ohms > 0),
        measured_ohms DOUBLE PRECISION NOT NULL CHECK (measured_ohms > 0),
        tolerance_percent DOUBLE PRECISION NOT NULL CHECK (tolerance_percent >= 0)))",
    R"(CREATE TABLE adjustment_notes (
        id {id},
        session_id INTEGER NOT NULL REFERENCES calibration_sessions (id) ON DELETE CASCADE,
        noted_at TEXT NOT NULL,
        note_text TEXT NOT NULL CHECK (length(note_text) > 0)))",
    R"(CREATE TABLE record_chain (
        id {id},
        session_id INTEGER NOT NULL UNIQUE REFERENCES calibration_sessions (id),
        previous_digest TEXT NOT NULL,
        digest TEXT NOT NULL UNIQUE CHECK (length(digest) = 64),
        recorded_at TEXT NOT NULL))",
    // One instrument's history; the due list (last approved calibration per instrument).
    "CREATE INDEX sessions_by_instrument ON calibration_sessions (instrument_id, started_at)",
    "CREATE INDEX sessions_by_state ON calibration_sessions (state, instrument_id, started_at)",
    // Readings of a session come from their primary key, which starts with session_id.
    "CREATE INDEX resistor_checks_by_session ON resistor_checks (session_id)",
    "CREATE INDEX adjustment_notes_by_session ON adjustment_notes (session_id)",
    "CREATE INDEX standard_specs_by_standard ON standard_specs (standard_id)",
};

const char* const kVersion2Tables[] = {
    R"(CREATE TABLE audit_log (
        id {id},
        at TEXT NOT NULL,
        user_id INTEGER REFERENCES users (id),
        table_name TEXT NOT NULL,
        row_id INTEGER NOT NULL,
        action TEXT NOT NULL CHECK (action IN ('insert', 'update', 'delete')),
        old_values TEXT,
        new_values TEXT))",
    // Who is writing: set by each write transaction, cleared before its commit, so that an
    // edit made outside the app is logged with no user.
    R"(CREATE TABLE audit_context (
        id INTEGER PRIMARY KEY CHECK (id = 1),
        user_id INTEGER REFERENCES users (id)))",
    "INSERT INTO audit_context (id, user_id) VALUES (1, NULL)",
    "CREATE INDEX audit_log_by_row ON audit_log (table_name, row_id)",
};

template <std::size_t N>
void runAll(const QSqlDatabase& db, const char* const (&statements)[N], int version) {
    for (const char* statement : statements) {
        QString text = QString::fromUtf8(statement);
        text.replace(QStringLiteral("{id}"), dialect::idColumn());
        text.replace(QStringLiteral("{key_only}"), dialect::keyOnlyTableOption());
        sql::execText(db, text, QStringLiteral("creating schema version %1").arg(version));
    }
}

void toVersion1(const QSqlDatabase& db) {
    dialect::setApplicationId(db);
    runAll(db, kVersion1Tables, 1);
    dialect::createIntegrityTriggers(db);
}

void toVersion2(const QSqlDatabase& db) {
    runAll(db, kVersion2Tables, 2);
    dialect::createAuditTriggers(db);
}

// Step i brings the schema from version i to version i + 1.
const std::function<void(const QSqlDatabase&)> kSteps[] = {toVersion1, toVersion2};
static_assert(std::size(kSteps) == kCurrentVersion);

void rollback(const QSqlDatabase& db) {
    QSqlQuery(db).exec(QStringLiteral("ROLLBACK"));
}

} // namespace

int migrate(const QSqlDatabase& db, int targetVersion) {
    const QString context = QStringLiteral("upgrading the workbook");
    for (;;) {
        sql::execText(db, dialect::beginWrite(), context);
        const int version = dialect::userVersion(db);
        if (version >= targetVersion) {
            sql::execText(db, QStringLiteral("COMMIT"), context);
            return version;
        }
        try {
            kSteps[version](db);
            dialect::setUserVersion(db, version + 1);
            sql::execText(db, QStringLiteral("COMMIT"), context);
        } catch (...) {
            rollback(db);
            throw;
        }
    }
}

} // namespace mw::storage::schema
