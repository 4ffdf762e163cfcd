// The tables and indexes of schema version 4, each table with its columns listed explicitly, so
// that the triggers built from those lists cover every column (a test holds the lists to the
// tables). Tables are STRICT: SQLite refuses a value of the wrong type instead of storing it.
//
// Placeholders, expanded by expand(): {time:c} says column c holds a UTC time exactly as the
// workbook writes it, "2024-03-05T10:00:00+00:00" (or NULL), {date:c} a date "2024-03-05",
// {finite:c} a finite number.
// Times of one format compare as text: a session is submitted after it started, and so on.
#include "storage/schema_v4.h"

#include "storage/workbook_error.h"

#include <QRegularExpression>

#include <stdexcept>

namespace mw::storage::schema4 {
namespace {

const char* const kClassSeries = "(0.05, 0.1, 0.2, 0.3, 0.5, 1, 1.5, 2, 2.5, 3, 5)";

std::vector<TableDefinition> makeTables() {
    std::vector<TableDefinition> t;
    t.push_back({"users",
                 R"(CREATE TABLE users (
        id INTEGER PRIMARY KEY,
        login TEXT NOT NULL UNIQUE CHECK (length(login) > 0),
        full_name TEXT NOT NULL,
        role TEXT NOT NULL CHECK (role IN ('technician', 'reviewer', 'administrator')),
        active INTEGER NOT NULL CHECK (active IN (0, 1)),
        password_hash TEXT NOT NULL CHECK (password_hash LIKE '$argon2id$%')) STRICT)",
                 {"id", "login", "full_name", "role", "active", "password_hash"}});
    t.push_back(
        {"lab",
         R"(CREATE TABLE lab (
        id INTEGER PRIMARY KEY CHECK (id = 1),
        name TEXT NOT NULL CHECK (length(name) > 0),
        address TEXT NOT NULL,
        accreditation_id TEXT,
        decimal_comma INTEGER NOT NULL DEFAULT 0 CHECK (decimal_comma IN (0, 1)),
        due_window_days INTEGER NOT NULL DEFAULT 30
            CHECK (due_window_days BETWEEN 1 AND 366)) STRICT)",
         {"id", "name", "address", "accreditation_id", "decimal_comma", "due_window_days"}});
    t.push_back({"instruments",
                 R"(CREATE TABLE instruments (
        id INTEGER PRIMARY KEY,
        asset_tag TEXT NOT NULL UNIQUE CHECK (length(asset_tag) > 0),
        description TEXT NOT NULL,
        manufacturer TEXT NOT NULL,
        model TEXT NOT NULL,
        serial TEXT NOT NULL,
        kind TEXT NOT NULL CHECK (kind IN ('dc-voltmeter', 'dc-ammeter', 'half-wave-ac-voltmeter',
                                           'bridge-ac-voltmeter', 'multi-range')),
        movement_amps_fs REAL NOT NULL CHECK (movement_amps_fs > 0 AND {finite:movement_amps_fs}),
        movement_ohms REAL NOT NULL CHECK (movement_ohms >= 0 AND {finite:movement_ohms}),
        scale_type TEXT NOT NULL CHECK (scale_type IN ('zero-at-end', 'zero-inside', 'no-zero',
                                                       'non-linear')),
        scale_divisions INTEGER NOT NULL CHECK (scale_divisions >= 0),
        accuracy_class REAL NOT NULL CHECK (accuracy_class IN {class_series}),
        interval_days INTEGER NOT NULL CHECK (interval_days > 0),
        location TEXT NOT NULL,
        owner TEXT NOT NULL,
        status TEXT NOT NULL CHECK (status IN ('in-service', 'out-of-service', 'retired'))) STRICT)",
                 {"id", "asset_tag", "description", "manufacturer", "model", "serial", "kind",
                  "movement_amps_fs", "movement_ohms", "scale_type", "scale_divisions",
                  "accuracy_class", "interval_days", "location", "owner", "status"}});
    // signal NULL: registered before the workbook recorded it, not yet set. Rectifier ranges
    // are voltage ranges; only they name a diode model.
    t.push_back({"instrument_ranges",
                 R"(CREATE TABLE instrument_ranges (
        id INTEGER PRIMARY KEY,
        instrument_id INTEGER NOT NULL REFERENCES instruments (id) ON DELETE CASCADE,
        sort_order INTEGER NOT NULL,
        label TEXT NOT NULL CHECK (length(label) > 0),
        unit TEXT NOT NULL CHECK (unit IN ('V', 'A')),
        lower_limit REAL NOT NULL CHECK ({finite:lower_limit}),
        full_scale REAL NOT NULL CHECK (full_scale > lower_limit AND {finite:full_scale}),
        nominal_ohms REAL CHECK (nominal_ohms IS NULL OR (nominal_ohms > 0
                                                          AND {finite:nominal_ohms})),
        fiducial_value REAL CHECK (fiducial_value IS NULL OR (fiducial_value > 0
                                                              AND {finite:fiducial_value})),
        signal TEXT CHECK (signal IS NULL OR signal IN ('dc', 'half-wave', 'bridge')),
        diode TEXT CHECK (diode IS NULL OR diode IN ('silicon', 'schottky', 'germanium')),
        CHECK (signal IS NULL OR signal = 'dc' OR unit = 'V'),
        CHECK (diode IS NULL OR signal IN ('half-wave', 'bridge')),
        UNIQUE (instrument_id, label)) STRICT)",
                 {"id", "instrument_id", "sort_order", "label", "unit", "lower_limit", "full_scale",
                  "nominal_ohms", "fiducial_value", "signal", "diode"}});
    t.push_back(
        {"reference_standards",
         R"(CREATE TABLE reference_standards (
        id INTEGER PRIMARY KEY,
        asset_tag TEXT NOT NULL UNIQUE CHECK (length(asset_tag) > 0),
        description TEXT NOT NULL,
        certificate_number TEXT NOT NULL,
        due_date TEXT NOT NULL CHECK ({date:due_date}),
        calibrated_on TEXT CHECK (calibrated_on IS NULL OR ({date:calibrated_on} AND
                                                         calibrated_on <= due_date))) STRICT)",
         {"id", "asset_tag", "description", "certificate_number", "due_date", "calibrated_on"}});
    t.push_back({"standard_specs",
                 R"(CREATE TABLE standard_specs (
        id INTEGER PRIMARY KEY,
        standard_id INTEGER NOT NULL REFERENCES reference_standards (id) ON DELETE CASCADE,
        sort_order INTEGER NOT NULL,
        {spec_columns},
        UNIQUE (standard_id, sort_order)) STRICT)",
                 {"id", "standard_id", "sort_order", "label", "unit", "signal", "full_scale",
                  "percent_of_reading", "percent_of_range", "floor_value",
                  "certificate_expanded_uncertainty", "coverage_factor", "certificate_dof"}});
    t.push_back({"calibration_sessions",
                 R"(CREATE TABLE calibration_sessions (
        id INTEGER PRIMARY KEY,
        instrument_id INTEGER NOT NULL REFERENCES instruments (id),
        technician_id INTEGER NOT NULL REFERENCES users (id),
        started_at TEXT NOT NULL CHECK ({time:started_at}),
        finished_at TEXT CHECK ({time:finished_at} AND (finished_at IS NULL
                                                        OR finished_at >= started_at)),
        ambient_celsius REAL NOT NULL CHECK (ambient_celsius BETWEEN -40 AND 85),
        relative_humidity_percent REAL NOT NULL
            CHECK (relative_humidity_percent BETWEEN 0 AND 100),
        method TEXT NOT NULL,
        decision_rule TEXT NOT NULL CHECK (decision_rule IN ('simple', 'guarded-binary',
                                                             'guarded')),
        guard_factor REAL NOT NULL CHECK (guard_factor >= 0 AND guard_factor <= 10),
        readability_fraction REAL CHECK (readability_fraction IS NULL
                                         OR (readability_fraction > 0
                                             AND readability_fraction <= 1)),
        coverage_probability REAL CHECK (coverage_probability IS NULL
                                         OR (coverage_probability > 0
                                             AND coverage_probability < 1)),
        reference_celsius REAL CHECK (reference_celsius IS NULL
                                      OR reference_celsius BETWEEN -40 AND 85),
        record_format INTEGER NOT NULL CHECK (record_format IN (1, 2)),
        phases TEXT NOT NULL CHECK (phases IN ('as-found', 'as-left', 'both')),
        outcome TEXT CHECK (outcome IS NULL OR outcome IN ('pass', 'conditional-pass',
                                                           'conditional-fail', 'fail')),
        state TEXT NOT NULL CHECK (state IN ('draft', 'submitted', 'returned', 'approved',
                                             'superseded')),
        submitted_at TEXT CHECK ({time:submitted_at}),
        return_comment TEXT NOT NULL,
        returned_at TEXT CHECK ({time:returned_at}),
        reviewer_id INTEGER REFERENCES users (id),
        approved_at TEXT CHECK ({time:approved_at}),
        revision INTEGER NOT NULL CHECK (revision >= 1),
        supersedes_id INTEGER UNIQUE REFERENCES calibration_sessions (id),
        amendment_reason TEXT NOT NULL,
        amended_at TEXT CHECK ({time:amended_at}),
        CHECK (reviewer_id IS NULL OR reviewer_id <> technician_id),
        CHECK (submitted_at IS NULL OR submitted_at >= started_at),
        CHECK (state IN ('draft', 'returned') OR finished_at IS NULL
               OR finished_at <= submitted_at),
        CHECK (approved_at IS NULL OR (submitted_at IS NOT NULL AND approved_at >= submitted_at)),
        CHECK (decision_rule <> 'simple' OR guard_factor = 0),
        CHECK (state = 'draft' OR submitted_at IS NOT NULL),
        CHECK (state <> 'returned' OR length(return_comment) > 0),
        CHECK (state NOT IN ('approved', 'superseded')
               OR (reviewer_id IS NOT NULL AND approved_at IS NOT NULL)),
        CHECK ((supersedes_id IS NULL AND revision = 1)
               OR (supersedes_id IS NOT NULL AND revision > 1
                   AND length(amendment_reason) > 0)),
        CHECK (record_format = 1 OR (readability_fraction IS NOT NULL
                                     AND coverage_probability IS NOT NULL
                                     AND reference_celsius IS NOT NULL)),
        CHECK (state <> 'draft' OR outcome IS NULL),
        CHECK (state = 'draft' OR record_format = 1 OR outcome IS NOT NULL)) STRICT)",
                 {"id",
                  "instrument_id",
                  "technician_id",
                  "started_at",
                  "finished_at",
                  "ambient_celsius",
                  "relative_humidity_percent",
                  "method",
                  "decision_rule",
                  "guard_factor",
                  "readability_fraction",
                  "coverage_probability",
                  "reference_celsius",
                  "record_format",
                  "phases",
                  "outcome",
                  "state",
                  "submitted_at",
                  "return_comment",
                  "returned_at",
                  "reviewer_id",
                  "approved_at",
                  "revision",
                  "supersedes_id",
                  "amendment_reason",
                  "amended_at"}});
    t.push_back({"session_standards",
                 R"(CREATE TABLE session_standards (
        id INTEGER PRIMARY KEY,
        session_id INTEGER NOT NULL REFERENCES calibration_sessions (id) ON DELETE CASCADE,
        standard_id INTEGER NOT NULL REFERENCES reference_standards (id),
        certificate_number TEXT NOT NULL,
        due_date TEXT NOT NULL CHECK ({date:due_date}),
        overdue_justification TEXT NOT NULL,
        UNIQUE (session_id, standard_id)) STRICT)",
                 {"id", "session_id", "standard_id", "certificate_number", "due_date",
                  "overdue_justification"}});
    // The copies of the standards' specifications a session was submitted with.
    t.push_back({"session_standard_specs",
                 R"(CREATE TABLE session_standard_specs (
        session_id INTEGER NOT NULL REFERENCES calibration_sessions (id) ON DELETE CASCADE,
        standard_id INTEGER NOT NULL,
        sort_order INTEGER NOT NULL,
        {spec_columns},
        PRIMARY KEY (session_id, standard_id, sort_order),
        FOREIGN KEY (session_id, standard_id)
            REFERENCES session_standards (session_id, standard_id) ON DELETE CASCADE)
        STRICT, WITHOUT ROWID)",
                 {"session_id", "standard_id", "sort_order", "label", "unit", "signal",
                  "full_scale", "percent_of_reading", "percent_of_range", "floor_value",
                  "certificate_expanded_uncertainty", "coverage_factor", "certificate_dof"},
                 {"standard_id", "sort_order"}});
    // Each range as the session used it, and the standard's range its reference came from.
    t.push_back(
        {"session_ranges",
         R"(CREATE TABLE session_ranges (
        session_id INTEGER NOT NULL REFERENCES calibration_sessions (id) ON DELETE CASCADE,
        range_id INTEGER NOT NULL REFERENCES instrument_ranges (id),
        signal TEXT NOT NULL CHECK (signal IN ('dc', 'half-wave', 'bridge')),
        diode_saturation_amps REAL CHECK (diode_saturation_amps IS NULL
                                          OR diode_saturation_amps > 0),
        diode_emission_coefficient REAL,
        diode_series_ohms REAL,
        diode_nominal_celsius REAL,
        diode_bandgap_ev REAL,
        diode_saturation_exponent REAL,
        resistor_ohms REAL CHECK (resistor_ohms IS NULL OR (resistor_ohms > 0
                                                            AND {finite:resistor_ohms})),
        divisions INTEGER NOT NULL CHECK (divisions >= 0),
        reference_standard_id INTEGER,
        reference_sort_order INTEGER,
        shunt_standard_id INTEGER,
        shunt_sort_order INTEGER,
        CHECK ((diode_saturation_amps IS NULL) = (diode_emission_coefficient IS NULL)
               AND (diode_saturation_amps IS NULL) = (diode_series_ohms IS NULL)
               AND (diode_saturation_amps IS NULL) = (diode_nominal_celsius IS NULL)
               AND (diode_saturation_amps IS NULL) = (diode_bandgap_ev IS NULL)
               AND (diode_saturation_amps IS NULL) = (diode_saturation_exponent IS NULL)),
        CHECK (diode_saturation_amps IS NULL OR signal <> 'dc'),
        CHECK ((reference_standard_id IS NULL) = (reference_sort_order IS NULL)),
        CHECK ((shunt_standard_id IS NULL) = (shunt_sort_order IS NULL)),
        CHECK (shunt_standard_id IS NULL OR reference_standard_id IS NOT NULL),
        PRIMARY KEY (session_id, range_id),
        FOREIGN KEY (session_id, reference_standard_id, reference_sort_order)
            REFERENCES session_standard_specs (session_id, standard_id, sort_order),
        FOREIGN KEY (session_id, shunt_standard_id, shunt_sort_order)
            REFERENCES session_standard_specs (session_id, standard_id, sort_order))
        STRICT, WITHOUT ROWID)",
         {"session_id", "range_id", "signal", "diode_saturation_amps", "diode_emission_coefficient",
          "diode_series_ohms", "diode_nominal_celsius", "diode_bandgap_ev",
          "diode_saturation_exponent", "resistor_ohms", "divisions", "reference_standard_id",
          "reference_sort_order", "shunt_standard_id", "shunt_sort_order"}});
    // The test points a session plans for each range (each taken up and down, `repeats` times,
    // in every phase planned). Records made before plans were kept have none.
    t.push_back({"session_points",
                 R"(CREATE TABLE session_points (
        session_id INTEGER NOT NULL REFERENCES calibration_sessions (id) ON DELETE CASCADE,
        range_id INTEGER NOT NULL REFERENCES instrument_ranges (id),
        point_index INTEGER NOT NULL CHECK (point_index >= 0),
        nominal REAL NOT NULL CHECK ({finite:nominal}),
        repeats INTEGER NOT NULL CHECK (repeats BETWEEN 1 AND 20),
        PRIMARY KEY (session_id, range_id, point_index)) STRICT, WITHOUT ROWID)",
                 {"session_id", "range_id", "point_index", "nominal", "repeats"},
                 {"range_id", "point_index"}});
    // A reading is identified by its natural key and stored in that key's b-tree only. Its
    // indication is NULL while only the applied value has been typed (a pending reading).
    t.push_back({"readings",
                 R"(CREATE TABLE readings (
        session_id INTEGER NOT NULL REFERENCES calibration_sessions (id) ON DELETE CASCADE,
        range_id INTEGER NOT NULL REFERENCES instrument_ranges (id),
        point_index INTEGER NOT NULL CHECK (point_index >= 0),
        direction TEXT NOT NULL CHECK (direction IN ('up', 'down')),
        phase TEXT NOT NULL CHECK (phase IN ('as-found', 'as-left')),
        repeat_number INTEGER NOT NULL CHECK (repeat_number >= 1),
        unit TEXT NOT NULL CHECK (unit IN ('V', 'A')),
        applied REAL NOT NULL CHECK ({finite:applied}),
        indicated REAL CHECK ({finite:indicated}),
        PRIMARY KEY (session_id, range_id, point_index, direction, phase, repeat_number))
        STRICT, WITHOUT ROWID)",
                 {"session_id", "range_id", "point_index", "direction", "phase", "repeat_number",
                  "unit", "applied", "indicated"},
                 {"range_id", "point_index", "direction", "phase", "repeat_number"}});
    t.push_back({"resistor_checks",
                 R"(CREATE TABLE resistor_checks (
        id INTEGER PRIMARY KEY,
        session_id INTEGER NOT NULL REFERENCES calibration_sessions (id) ON DELETE CASCADE,
        range_id INTEGER NOT NULL REFERENCES instrument_ranges (id),
        component TEXT NOT NULL,
        computed_ohms REAL NOT NULL CHECK (computed_ohms > 0 AND {finite:computed_ohms}),
        measured_ohms REAL NOT NULL CHECK (measured_ohms > 0 AND {finite:measured_ohms}),
        tolerance_percent REAL NOT NULL CHECK (tolerance_percent >= 0
                                               AND {finite:tolerance_percent})) STRICT)",
                 {"id", "session_id", "range_id", "component", "computed_ohms", "measured_ohms",
                  "tolerance_percent"}});
    t.push_back({"adjustment_notes",
                 R"(CREATE TABLE adjustment_notes (
        id INTEGER PRIMARY KEY,
        session_id INTEGER NOT NULL REFERENCES calibration_sessions (id) ON DELETE CASCADE,
        noted_at TEXT NOT NULL CHECK ({time:noted_at}),
        note_text TEXT NOT NULL CHECK (length(note_text) > 0)) STRICT)",
                 {"id", "session_id", "noted_at", "note_text"}});
    // A reviewer's approval keys: the public key in the clear, the secret key sealed under a
    // key derived from their password (storage/approval_key.h). A key is retired, never
    // deleted, when its holder's password changes, so that what it signed stays verifiable.
    t.push_back({"signing_keys",
                 R"(CREATE TABLE signing_keys (
        id INTEGER PRIMARY KEY,
        user_id INTEGER NOT NULL REFERENCES users (id),
        public_key BLOB NOT NULL UNIQUE CHECK (length(public_key) = 32),
        sealed_secret BLOB NOT NULL CHECK (length(sealed_secret) > 64),
        created_at TEXT NOT NULL CHECK ({time:created_at}),
        retired_at TEXT CHECK (retired_at IS NULL OR ({time:retired_at} AND
                                                     retired_at >= created_at))) STRICT)",
                 {"id", "user_id", "public_key", "sealed_secret", "created_at", "retired_at"}});
    // Each approval seals the audit log up to its newest row (a running digest over every row
    // in id order) and is signed by its reviewer's key over the record's digest and that seal.
    // Entries made before version 4 carry neither; schema_upgrades says how many there are.
    t.push_back({"record_chain",
                 R"(CREATE TABLE record_chain (
        id INTEGER PRIMARY KEY,
        session_id INTEGER NOT NULL UNIQUE REFERENCES calibration_sessions (id),
        previous_digest TEXT NOT NULL,
        digest TEXT NOT NULL UNIQUE CHECK (length(digest) = 64),
        recorded_at TEXT NOT NULL CHECK ({time:recorded_at}),
        audit_through_id INTEGER CHECK (audit_through_id IS NULL OR audit_through_id > 0),
        audit_digest TEXT CHECK (audit_digest IS NULL OR length(audit_digest) = 64),
        signing_key_id INTEGER REFERENCES signing_keys (id),
        signature BLOB CHECK (signature IS NULL OR length(signature) = 64),
        CHECK ((audit_through_id IS NULL) = (audit_digest IS NULL)),
        CHECK ((signing_key_id IS NULL) = (signature IS NULL))) STRICT)",
                 {"id", "session_id", "previous_digest", "digest", "recorded_at",
                  "audit_through_id", "audit_digest", "signing_key_id", "signature"}});
    t.push_back(
        {"audit_log",
         R"(CREATE TABLE audit_log (
        id INTEGER PRIMARY KEY,
        at TEXT NOT NULL CHECK (strftime('%Y-%m-%dT%H:%M:%fZ', at) IS at),
        user_id INTEGER REFERENCES users (id),
        table_name TEXT NOT NULL,
        row_id INTEGER NOT NULL,
        action TEXT NOT NULL CHECK (action IN ('insert', 'update', 'delete')),
        old_values TEXT,
        new_values TEXT) STRICT)",
         {"id", "at", "user_id", "table_name", "row_id", "action", "old_values", "new_values"}});
    // Who is writing: set by each write transaction, cleared before its commit, so that an
    // edit made outside the app is logged with no user.
    t.push_back({"audit_context",
                 R"(CREATE TABLE audit_context (
        id INTEGER PRIMARY KEY CHECK (id = 1),
        user_id INTEGER REFERENCES users (id)) STRICT)",
                 {"id", "user_id"}});
    // When the workbook reached each version from 4 on, and how long its chain of approved
    // records was then: the entries made before signing began are those of version 3.
    t.push_back({"schema_upgrades",
                 R"(CREATE TABLE schema_upgrades (
        version INTEGER PRIMARY KEY CHECK (version >= 4),
        reached_at TEXT NOT NULL CHECK ({time:reached_at}),
        chain_length INTEGER NOT NULL CHECK (chain_length >= 0)) STRICT)",
                 {"version", "reached_at", "chain_length"}});
    return t;
}

// The columns a standard's range and its copy in a session share.
const char* const kSpecColumns = R"(label TEXT NOT NULL,
        unit TEXT NOT NULL CHECK (unit IN ('V', 'A', 'ohm')),
        signal TEXT NOT NULL CHECK (signal IN ('dc', 'ac')),
        full_scale REAL NOT NULL CHECK (full_scale > 0 AND {finite:full_scale}),
        percent_of_reading REAL NOT NULL CHECK (percent_of_reading >= 0
                                                AND {finite:percent_of_reading}),
        percent_of_range REAL NOT NULL CHECK (percent_of_range >= 0
                                              AND {finite:percent_of_range}),
        floor_value REAL NOT NULL CHECK (floor_value >= 0 AND {finite:floor_value}),
        certificate_expanded_uncertainty REAL
            CHECK (certificate_expanded_uncertainty IS NULL
                   OR (certificate_expanded_uncertainty > 0
                       AND {finite:certificate_expanded_uncertainty})),
        coverage_factor REAL NOT NULL CHECK (coverage_factor > 0 AND {finite:coverage_factor}),
        certificate_dof REAL CHECK (certificate_dof IS NULL OR certificate_dof > 0))";

} // namespace

QString expand(const char* sql) {
    QString text = QString::fromUtf8(sql);
    text.replace(QStringLiteral("{spec_columns}"), QString::fromUtf8(kSpecColumns));
    text.replace(QStringLiteral("{class_series}"), QString::fromUtf8(kClassSeries));
    static const QRegularExpression placeholder(QStringLiteral("\\{(time|date|finite):(\\w+)\\}"));
    QString out;
    qsizetype last = 0;
    for (auto it = placeholder.globalMatch(text); it.hasNext();) {
        const QRegularExpressionMatch match = it.next();
        out += text.mid(last, match.capturedStart() - last);
        const QString kind = match.captured(1);
        const QString column = match.captured(2);
        if (kind == QLatin1String("time")) {
            out += QStringLiteral("strftime('%Y-%m-%dT%H:%M:%S+00:00', %1) IS %1").arg(column);
        } else if (kind == QLatin1String("date")) {
            out += QStringLiteral("date(%1) IS %1").arg(column);
        } else {
            out += QStringLiteral("abs(%1) <= 1.7976931348623157e308").arg(column);
        }
        last = match.capturedEnd();
    }
    out += text.mid(last);
    return out;
}

const std::vector<TableDefinition>& tables() {
    static const std::vector<TableDefinition> definitions = makeTables();
    return definitions;
}

const TableDefinition& table(const QString& name) {
    for (const TableDefinition& definition : tables()) {
        if (name == QLatin1String(definition.name)) {
            return definition;
        }
    }
    throw WorkbookError(WorkbookError::Kind::Internal,
                        QStringLiteral("schema version 3 has no table %1").arg(name));
}

QStringList indexes() {
    return {
        // One instrument's history; the due list (last approved calibration per instrument).
        QStringLiteral("CREATE INDEX sessions_by_instrument ON calibration_sessions "
                       "(instrument_id, started_at)"),
        QStringLiteral("CREATE INDEX sessions_by_state ON calibration_sessions (state, "
                       "instrument_id, started_at)"),
        // Readings and copies of a session come from their primary keys (session_id first).
        QStringLiteral("CREATE INDEX resistor_checks_by_session ON resistor_checks (session_id)"),
        QStringLiteral("CREATE INDEX adjustment_notes_by_session ON adjustment_notes (session_id)"),
        QStringLiteral("CREATE INDEX audit_log_by_row ON audit_log (table_name, row_id)"),
        // One key in use per person.
        QStringLiteral("CREATE UNIQUE INDEX signing_keys_in_use ON signing_keys (user_id) "
                       "WHERE retired_at IS NULL"),
    };
}

} // namespace mw::storage::schema4
