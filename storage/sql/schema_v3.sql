-- Schema version 3 of a Meterwright workbook, exactly as the program wrote it: every table
-- STRICT with its checks, the copies a session is sealed with, the indexes, the audit context's
-- one row, and every trigger. Frozen: a workbook of this version is upgraded by later steps,
-- never by editing this file. Statements are separated by a line holding only ";".
CREATE TABLE users (
        id INTEGER PRIMARY KEY,
        login TEXT NOT NULL UNIQUE CHECK (length(login) > 0),
        full_name TEXT NOT NULL,
        role TEXT NOT NULL CHECK (role IN ('technician', 'reviewer', 'administrator')),
        active INTEGER NOT NULL CHECK (active IN (0, 1)),
        password_hash TEXT NOT NULL CHECK (password_hash LIKE '$argon2id$%')) STRICT
;
CREATE TABLE lab (
        id INTEGER PRIMARY KEY CHECK (id = 1),
        name TEXT NOT NULL CHECK (length(name) > 0),
        address TEXT NOT NULL,
        accreditation_id TEXT,
        decimal_comma INTEGER NOT NULL DEFAULT 0 CHECK (decimal_comma IN (0, 1)),
        due_window_days INTEGER NOT NULL DEFAULT 30
            CHECK (due_window_days BETWEEN 1 AND 366)) STRICT
;
CREATE TABLE instruments (
        id INTEGER PRIMARY KEY,
        asset_tag TEXT NOT NULL UNIQUE CHECK (length(asset_tag) > 0),
        description TEXT NOT NULL,
        manufacturer TEXT NOT NULL,
        model TEXT NOT NULL,
        serial TEXT NOT NULL,
        kind TEXT NOT NULL CHECK (kind IN ('dc-voltmeter', 'dc-ammeter', 'half-wave-ac-voltmeter',
                                           'bridge-ac-voltmeter', 'multi-range')),
        movement_amps_fs REAL NOT NULL CHECK (movement_amps_fs > 0 AND abs(movement_amps_fs) <= 1.7976931348623157e308),
        movement_ohms REAL NOT NULL CHECK (movement_ohms >= 0 AND abs(movement_ohms) <= 1.7976931348623157e308),
        scale_type TEXT NOT NULL CHECK (scale_type IN ('zero-at-end', 'zero-inside', 'no-zero',
                                                       'non-linear')),
        scale_divisions INTEGER NOT NULL CHECK (scale_divisions >= 0),
        accuracy_class REAL NOT NULL CHECK (accuracy_class IN (0.05, 0.1, 0.2, 0.3, 0.5, 1, 1.5, 2, 2.5, 3, 5)),
        interval_days INTEGER NOT NULL CHECK (interval_days > 0),
        location TEXT NOT NULL,
        owner TEXT NOT NULL,
        status TEXT NOT NULL CHECK (status IN ('in-service', 'out-of-service', 'retired'))) STRICT
;
CREATE TABLE instrument_ranges (
        id INTEGER PRIMARY KEY,
        instrument_id INTEGER NOT NULL REFERENCES instruments (id) ON DELETE CASCADE,
        sort_order INTEGER NOT NULL,
        label TEXT NOT NULL CHECK (length(label) > 0),
        unit TEXT NOT NULL CHECK (unit IN ('V', 'A')),
        lower_limit REAL NOT NULL CHECK (abs(lower_limit) <= 1.7976931348623157e308),
        full_scale REAL NOT NULL CHECK (full_scale > lower_limit AND abs(full_scale) <= 1.7976931348623157e308),
        nominal_ohms REAL CHECK (nominal_ohms IS NULL OR (nominal_ohms > 0
                                                          AND abs(nominal_ohms) <= 1.7976931348623157e308)),
        fiducial_value REAL CHECK (fiducial_value IS NULL OR (fiducial_value > 0
                                                              AND abs(fiducial_value) <= 1.7976931348623157e308)),
        signal TEXT CHECK (signal IS NULL OR signal IN ('dc', 'half-wave', 'bridge')),
        diode TEXT CHECK (diode IS NULL OR diode IN ('silicon', 'schottky', 'germanium')),
        CHECK (signal IS NULL OR signal = 'dc' OR unit = 'V'),
        CHECK (diode IS NULL OR signal IN ('half-wave', 'bridge')),
        UNIQUE (instrument_id, label)) STRICT
;
CREATE TABLE reference_standards (
        id INTEGER PRIMARY KEY,
        asset_tag TEXT NOT NULL UNIQUE CHECK (length(asset_tag) > 0),
        description TEXT NOT NULL,
        certificate_number TEXT NOT NULL,
        due_date TEXT NOT NULL CHECK (date(due_date) IS due_date)) STRICT
;
CREATE TABLE standard_specs (
        id INTEGER PRIMARY KEY,
        standard_id INTEGER NOT NULL REFERENCES reference_standards (id) ON DELETE CASCADE,
        sort_order INTEGER NOT NULL,
        label TEXT NOT NULL,
        unit TEXT NOT NULL CHECK (unit IN ('V', 'A', 'ohm')),
        signal TEXT NOT NULL CHECK (signal IN ('dc', 'ac')),
        full_scale REAL NOT NULL CHECK (full_scale > 0 AND abs(full_scale) <= 1.7976931348623157e308),
        percent_of_reading REAL NOT NULL CHECK (percent_of_reading >= 0
                                                AND abs(percent_of_reading) <= 1.7976931348623157e308),
        percent_of_range REAL NOT NULL CHECK (percent_of_range >= 0
                                              AND abs(percent_of_range) <= 1.7976931348623157e308),
        floor_value REAL NOT NULL CHECK (floor_value >= 0 AND abs(floor_value) <= 1.7976931348623157e308),
        certificate_expanded_uncertainty REAL
            CHECK (certificate_expanded_uncertainty IS NULL
                   OR (certificate_expanded_uncertainty > 0
                       AND abs(certificate_expanded_uncertainty) <= 1.7976931348623157e308)),
        coverage_factor REAL NOT NULL CHECK (coverage_factor > 0 AND abs(coverage_factor) <= 1.7976931348623157e308),
        certificate_dof REAL CHECK (certificate_dof IS NULL OR certificate_dof > 0),
        UNIQUE (standard_id, sort_order)) STRICT
;
CREATE TABLE calibration_sessions (
        id INTEGER PRIMARY KEY,
        instrument_id INTEGER NOT NULL REFERENCES instruments (id),
        technician_id INTEGER NOT NULL REFERENCES users (id),
        started_at TEXT NOT NULL CHECK (strftime('%Y-%m-%dT%H:%M:%S+00:00', started_at) IS started_at),
        finished_at TEXT CHECK (strftime('%Y-%m-%dT%H:%M:%S+00:00', finished_at) IS finished_at AND (finished_at IS NULL
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
        submitted_at TEXT CHECK (strftime('%Y-%m-%dT%H:%M:%S+00:00', submitted_at) IS submitted_at),
        return_comment TEXT NOT NULL,
        returned_at TEXT CHECK (strftime('%Y-%m-%dT%H:%M:%S+00:00', returned_at) IS returned_at),
        reviewer_id INTEGER REFERENCES users (id),
        approved_at TEXT CHECK (strftime('%Y-%m-%dT%H:%M:%S+00:00', approved_at) IS approved_at),
        revision INTEGER NOT NULL CHECK (revision >= 1),
        supersedes_id INTEGER UNIQUE REFERENCES calibration_sessions (id),
        amendment_reason TEXT NOT NULL,
        amended_at TEXT CHECK (strftime('%Y-%m-%dT%H:%M:%S+00:00', amended_at) IS amended_at),
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
        CHECK (state = 'draft' OR record_format = 1 OR outcome IS NOT NULL)) STRICT
;
CREATE TABLE session_standards (
        id INTEGER PRIMARY KEY,
        session_id INTEGER NOT NULL REFERENCES calibration_sessions (id) ON DELETE CASCADE,
        standard_id INTEGER NOT NULL REFERENCES reference_standards (id),
        certificate_number TEXT NOT NULL,
        due_date TEXT NOT NULL CHECK (date(due_date) IS due_date),
        overdue_justification TEXT NOT NULL,
        UNIQUE (session_id, standard_id)) STRICT
;
CREATE TABLE session_standard_specs (
        session_id INTEGER NOT NULL REFERENCES calibration_sessions (id) ON DELETE CASCADE,
        standard_id INTEGER NOT NULL,
        sort_order INTEGER NOT NULL,
        label TEXT NOT NULL,
        unit TEXT NOT NULL CHECK (unit IN ('V', 'A', 'ohm')),
        signal TEXT NOT NULL CHECK (signal IN ('dc', 'ac')),
        full_scale REAL NOT NULL CHECK (full_scale > 0 AND abs(full_scale) <= 1.7976931348623157e308),
        percent_of_reading REAL NOT NULL CHECK (percent_of_reading >= 0
                                                AND abs(percent_of_reading) <= 1.7976931348623157e308),
        percent_of_range REAL NOT NULL CHECK (percent_of_range >= 0
                                              AND abs(percent_of_range) <= 1.7976931348623157e308),
        floor_value REAL NOT NULL CHECK (floor_value >= 0 AND abs(floor_value) <= 1.7976931348623157e308),
        certificate_expanded_uncertainty REAL
            CHECK (certificate_expanded_uncertainty IS NULL
                   OR (certificate_expanded_uncertainty > 0
                       AND abs(certificate_expanded_uncertainty) <= 1.7976931348623157e308)),
        coverage_factor REAL NOT NULL CHECK (coverage_factor > 0 AND abs(coverage_factor) <= 1.7976931348623157e308),
        certificate_dof REAL CHECK (certificate_dof IS NULL OR certificate_dof > 0),
        PRIMARY KEY (session_id, standard_id, sort_order),
        FOREIGN KEY (session_id, standard_id)
            REFERENCES session_standards (session_id, standard_id) ON DELETE CASCADE)
        STRICT, WITHOUT ROWID
;
CREATE TABLE session_ranges (
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
                                                            AND abs(resistor_ohms) <= 1.7976931348623157e308)),
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
        STRICT, WITHOUT ROWID
;
CREATE TABLE session_points (
        session_id INTEGER NOT NULL REFERENCES calibration_sessions (id) ON DELETE CASCADE,
        range_id INTEGER NOT NULL REFERENCES instrument_ranges (id),
        point_index INTEGER NOT NULL CHECK (point_index >= 0),
        nominal REAL NOT NULL CHECK (abs(nominal) <= 1.7976931348623157e308),
        repeats INTEGER NOT NULL CHECK (repeats BETWEEN 1 AND 20),
        PRIMARY KEY (session_id, range_id, point_index)) STRICT, WITHOUT ROWID
;
CREATE TABLE readings (
        session_id INTEGER NOT NULL REFERENCES calibration_sessions (id) ON DELETE CASCADE,
        range_id INTEGER NOT NULL REFERENCES instrument_ranges (id),
        point_index INTEGER NOT NULL CHECK (point_index >= 0),
        direction TEXT NOT NULL CHECK (direction IN ('up', 'down')),
        phase TEXT NOT NULL CHECK (phase IN ('as-found', 'as-left')),
        repeat_number INTEGER NOT NULL CHECK (repeat_number >= 1),
        unit TEXT NOT NULL CHECK (unit IN ('V', 'A')),
        applied REAL NOT NULL CHECK (abs(applied) <= 1.7976931348623157e308),
        indicated REAL CHECK (abs(indicated) <= 1.7976931348623157e308),
        PRIMARY KEY (session_id, range_id, point_index, direction, phase, repeat_number))
        STRICT, WITHOUT ROWID
;
CREATE TABLE resistor_checks (
        id INTEGER PRIMARY KEY,
        session_id INTEGER NOT NULL REFERENCES calibration_sessions (id) ON DELETE CASCADE,
        range_id INTEGER NOT NULL REFERENCES instrument_ranges (id),
        component TEXT NOT NULL,
        computed_ohms REAL NOT NULL CHECK (computed_ohms > 0 AND abs(computed_ohms) <= 1.7976931348623157e308),
        measured_ohms REAL NOT NULL CHECK (measured_ohms > 0 AND abs(measured_ohms) <= 1.7976931348623157e308),
        tolerance_percent REAL NOT NULL CHECK (tolerance_percent >= 0
                                               AND abs(tolerance_percent) <= 1.7976931348623157e308)) STRICT
;
CREATE TABLE adjustment_notes (
        id INTEGER PRIMARY KEY,
        session_id INTEGER NOT NULL REFERENCES calibration_sessions (id) ON DELETE CASCADE,
        noted_at TEXT NOT NULL CHECK (strftime('%Y-%m-%dT%H:%M:%S+00:00', noted_at) IS noted_at),
        note_text TEXT NOT NULL CHECK (length(note_text) > 0)) STRICT
;
CREATE TABLE record_chain (
        id INTEGER PRIMARY KEY,
        session_id INTEGER NOT NULL UNIQUE REFERENCES calibration_sessions (id),
        previous_digest TEXT NOT NULL,
        digest TEXT NOT NULL UNIQUE CHECK (length(digest) = 64),
        recorded_at TEXT NOT NULL CHECK (strftime('%Y-%m-%dT%H:%M:%S+00:00', recorded_at) IS recorded_at)) STRICT
;
CREATE TABLE audit_log (
        id INTEGER PRIMARY KEY,
        at TEXT NOT NULL CHECK (strftime('%Y-%m-%dT%H:%M:%fZ', at) IS at),
        user_id INTEGER REFERENCES users (id),
        table_name TEXT NOT NULL,
        row_id INTEGER NOT NULL,
        action TEXT NOT NULL CHECK (action IN ('insert', 'update', 'delete')),
        old_values TEXT,
        new_values TEXT) STRICT
;
CREATE TABLE audit_context (
        id INTEGER PRIMARY KEY CHECK (id = 1),
        user_id INTEGER REFERENCES users (id)) STRICT
;
CREATE INDEX sessions_by_instrument ON calibration_sessions (instrument_id, started_at)
;
CREATE INDEX sessions_by_state ON calibration_sessions (state, instrument_id, started_at)
;
CREATE INDEX resistor_checks_by_session ON resistor_checks (session_id)
;
CREATE INDEX adjustment_notes_by_session ON adjustment_notes (session_id)
;
CREATE INDEX audit_log_by_row ON audit_log (table_name, row_id)
;
INSERT INTO audit_context (id, user_id) VALUES (1, NULL)
;
CREATE TRIGGER session_standards_frozen_insert BEFORE INSERT ON session_standards WHEN (SELECT state FROM calibration_sessions WHERE id = NEW.session_id) NOT IN ('draft', 'returned') BEGIN SELECT RAISE(ABORT, 'session_standards: the calibration session is submitted or approved, so its contents cannot change (amend an approved record)'); END
;
CREATE TRIGGER session_standards_frozen_update BEFORE UPDATE ON session_standards WHEN (SELECT state FROM calibration_sessions WHERE id = OLD.session_id) NOT IN ('draft', 'returned') OR (SELECT state FROM calibration_sessions WHERE id = NEW.session_id) NOT IN ('draft', 'returned') BEGIN SELECT RAISE(ABORT, 'session_standards: the calibration session is submitted or approved, so its contents cannot change (amend an approved record)'); END
;
CREATE TRIGGER session_standards_frozen_delete BEFORE DELETE ON session_standards WHEN (SELECT state FROM calibration_sessions WHERE id = OLD.session_id) NOT IN ('draft', 'returned') BEGIN SELECT RAISE(ABORT, 'session_standards: the calibration session is submitted or approved, so its contents cannot change (amend an approved record)'); END
;
CREATE TRIGGER session_standard_specs_frozen_insert BEFORE INSERT ON session_standard_specs WHEN (SELECT state FROM calibration_sessions WHERE id = NEW.session_id) NOT IN ('draft', 'returned') BEGIN SELECT RAISE(ABORT, 'session_standard_specs: the calibration session is submitted or approved, so its contents cannot change (amend an approved record)'); END
;
CREATE TRIGGER session_standard_specs_frozen_update BEFORE UPDATE ON session_standard_specs WHEN (SELECT state FROM calibration_sessions WHERE id = OLD.session_id) NOT IN ('draft', 'returned') OR (SELECT state FROM calibration_sessions WHERE id = NEW.session_id) NOT IN ('draft', 'returned') BEGIN SELECT RAISE(ABORT, 'session_standard_specs: the calibration session is submitted or approved, so its contents cannot change (amend an approved record)'); END
;
CREATE TRIGGER session_standard_specs_frozen_delete BEFORE DELETE ON session_standard_specs WHEN (SELECT state FROM calibration_sessions WHERE id = OLD.session_id) NOT IN ('draft', 'returned') BEGIN SELECT RAISE(ABORT, 'session_standard_specs: the calibration session is submitted or approved, so its contents cannot change (amend an approved record)'); END
;
CREATE TRIGGER session_ranges_frozen_insert BEFORE INSERT ON session_ranges WHEN (SELECT state FROM calibration_sessions WHERE id = NEW.session_id) NOT IN ('draft', 'returned') BEGIN SELECT RAISE(ABORT, 'session_ranges: the calibration session is submitted or approved, so its contents cannot change (amend an approved record)'); END
;
CREATE TRIGGER session_ranges_frozen_update BEFORE UPDATE ON session_ranges WHEN (SELECT state FROM calibration_sessions WHERE id = OLD.session_id) NOT IN ('draft', 'returned') OR (SELECT state FROM calibration_sessions WHERE id = NEW.session_id) NOT IN ('draft', 'returned') BEGIN SELECT RAISE(ABORT, 'session_ranges: the calibration session is submitted or approved, so its contents cannot change (amend an approved record)'); END
;
CREATE TRIGGER session_ranges_frozen_delete BEFORE DELETE ON session_ranges WHEN (SELECT state FROM calibration_sessions WHERE id = OLD.session_id) NOT IN ('draft', 'returned') BEGIN SELECT RAISE(ABORT, 'session_ranges: the calibration session is submitted or approved, so its contents cannot change (amend an approved record)'); END
;
CREATE TRIGGER session_points_frozen_insert BEFORE INSERT ON session_points WHEN (SELECT state FROM calibration_sessions WHERE id = NEW.session_id) NOT IN ('draft', 'returned') BEGIN SELECT RAISE(ABORT, 'session_points: the calibration session is submitted or approved, so its contents cannot change (amend an approved record)'); END
;
CREATE TRIGGER session_points_frozen_update BEFORE UPDATE ON session_points WHEN (SELECT state FROM calibration_sessions WHERE id = OLD.session_id) NOT IN ('draft', 'returned') OR (SELECT state FROM calibration_sessions WHERE id = NEW.session_id) NOT IN ('draft', 'returned') BEGIN SELECT RAISE(ABORT, 'session_points: the calibration session is submitted or approved, so its contents cannot change (amend an approved record)'); END
;
CREATE TRIGGER session_points_frozen_delete BEFORE DELETE ON session_points WHEN (SELECT state FROM calibration_sessions WHERE id = OLD.session_id) NOT IN ('draft', 'returned') BEGIN SELECT RAISE(ABORT, 'session_points: the calibration session is submitted or approved, so its contents cannot change (amend an approved record)'); END
;
CREATE TRIGGER readings_frozen_insert BEFORE INSERT ON readings WHEN (SELECT state FROM calibration_sessions WHERE id = NEW.session_id) NOT IN ('draft', 'returned') BEGIN SELECT RAISE(ABORT, 'readings: the calibration session is submitted or approved, so its contents cannot change (amend an approved record)'); END
;
CREATE TRIGGER readings_frozen_update BEFORE UPDATE ON readings WHEN (SELECT state FROM calibration_sessions WHERE id = OLD.session_id) NOT IN ('draft', 'returned') OR (SELECT state FROM calibration_sessions WHERE id = NEW.session_id) NOT IN ('draft', 'returned') BEGIN SELECT RAISE(ABORT, 'readings: the calibration session is submitted or approved, so its contents cannot change (amend an approved record)'); END
;
CREATE TRIGGER readings_frozen_delete BEFORE DELETE ON readings WHEN (SELECT state FROM calibration_sessions WHERE id = OLD.session_id) NOT IN ('draft', 'returned') BEGIN SELECT RAISE(ABORT, 'readings: the calibration session is submitted or approved, so its contents cannot change (amend an approved record)'); END
;
CREATE TRIGGER resistor_checks_frozen_insert BEFORE INSERT ON resistor_checks WHEN (SELECT state FROM calibration_sessions WHERE id = NEW.session_id) NOT IN ('draft', 'returned') BEGIN SELECT RAISE(ABORT, 'resistor_checks: the calibration session is submitted or approved, so its contents cannot change (amend an approved record)'); END
;
CREATE TRIGGER resistor_checks_frozen_update BEFORE UPDATE ON resistor_checks WHEN (SELECT state FROM calibration_sessions WHERE id = OLD.session_id) NOT IN ('draft', 'returned') OR (SELECT state FROM calibration_sessions WHERE id = NEW.session_id) NOT IN ('draft', 'returned') BEGIN SELECT RAISE(ABORT, 'resistor_checks: the calibration session is submitted or approved, so its contents cannot change (amend an approved record)'); END
;
CREATE TRIGGER resistor_checks_frozen_delete BEFORE DELETE ON resistor_checks WHEN (SELECT state FROM calibration_sessions WHERE id = OLD.session_id) NOT IN ('draft', 'returned') BEGIN SELECT RAISE(ABORT, 'resistor_checks: the calibration session is submitted or approved, so its contents cannot change (amend an approved record)'); END
;
CREATE TRIGGER adjustment_notes_frozen_insert BEFORE INSERT ON adjustment_notes WHEN (SELECT state FROM calibration_sessions WHERE id = NEW.session_id) NOT IN ('draft', 'returned') BEGIN SELECT RAISE(ABORT, 'adjustment_notes: the calibration session is submitted or approved, so its contents cannot change (amend an approved record)'); END
;
CREATE TRIGGER adjustment_notes_frozen_update BEFORE UPDATE ON adjustment_notes WHEN (SELECT state FROM calibration_sessions WHERE id = OLD.session_id) NOT IN ('draft', 'returned') OR (SELECT state FROM calibration_sessions WHERE id = NEW.session_id) NOT IN ('draft', 'returned') BEGIN SELECT RAISE(ABORT, 'adjustment_notes: the calibration session is submitted or approved, so its contents cannot change (amend an approved record)'); END
;
CREATE TRIGGER adjustment_notes_frozen_delete BEFORE DELETE ON adjustment_notes WHEN (SELECT state FROM calibration_sessions WHERE id = OLD.session_id) NOT IN ('draft', 'returned') BEGIN SELECT RAISE(ABORT, 'adjustment_notes: the calibration session is submitted or approved, so its contents cannot change (amend an approved record)'); END
;
CREATE TRIGGER sessions_start_as_draft BEFORE INSERT ON calibration_sessions WHEN NEW.state <> 'draft' OR (NEW.supersedes_id IS NOT NULL AND (SELECT state FROM calibration_sessions WHERE id = NEW.supersedes_id) IS NOT 'approved') BEGIN SELECT RAISE(ABORT, 'calibration_sessions: a session starts as a draft, and only an approved session can be amended'); END
;
CREATE TRIGGER sessions_state_flow BEFORE UPDATE OF state ON calibration_sessions WHEN OLD.state <> NEW.state AND NOT ((OLD.state = 'draft' AND NEW.state = 'submitted') OR (OLD.state = 'returned' AND NEW.state IN ('draft', 'submitted')) OR (OLD.state = 'submitted' AND NEW.state IN ('returned', 'approved')) OR (OLD.state = 'approved' AND NEW.state = 'superseded')) BEGIN SELECT RAISE(ABORT, 'calibration_sessions: this change of state is not allowed (draft -> submitted -> approved or returned; approved -> superseded)'); END
;
CREATE TRIGGER sessions_superseded_by_amendment BEFORE UPDATE OF state ON calibration_sessions WHEN OLD.state = 'approved' AND NEW.state = 'superseded' AND NOT EXISTS (SELECT 1 FROM calibration_sessions a WHERE a.supersedes_id = OLD.id AND a.state = 'approved') BEGIN SELECT RAISE(ABORT, 'calibration_sessions: only an approved amendment supersedes a record'); END
;
CREATE TRIGGER sessions_reviewer BEFORE UPDATE OF state ON calibration_sessions WHEN NEW.state IN ('approved', 'returned') AND OLD.state = 'submitted' AND (NEW.reviewer_id IS NULL OR NEW.reviewer_id = NEW.technician_id OR NOT EXISTS (SELECT 1 FROM users u WHERE u.id = NEW.reviewer_id AND u.active = 1 AND u.role IN ('reviewer', 'administrator'))) BEGIN SELECT RAISE(ABORT, 'calibration_sessions: the reviewer must be an active reviewer or administrator other than the technician'); END
;
CREATE TRIGGER sessions_standards_in_date BEFORE UPDATE OF state ON calibration_sessions WHEN NEW.state = 'submitted' AND OLD.state <> 'submitted' AND EXISTS (SELECT 1 FROM session_standards u WHERE u.session_id = NEW.id AND u.due_date < substr(CASE WHEN NEW.supersedes_id IS NULL THEN NEW.submitted_at ELSE NEW.started_at END, 1, 10) AND length(trim(u.overdue_justification)) = 0) BEGIN SELECT RAISE(ABORT, 'calibration_sessions: a reference standard used is past its due date and no justification is recorded'); END
;
CREATE TRIGGER sessions_complete_on_submit BEFORE UPDATE OF state ON calibration_sessions WHEN NEW.state = 'submitted' AND OLD.state <> 'submitted' AND EXISTS (SELECT 1 FROM readings r WHERE r.session_id = NEW.id AND r.indicated IS NULL) BEGIN SELECT RAISE(ABORT, 'calibration_sessions: a reading without its indication cannot be submitted'); END
;
CREATE TRIGGER sessions_sealed_on_submit BEFORE UPDATE OF state ON calibration_sessions WHEN NEW.state = 'submitted' AND OLD.state <> 'submitted' AND NEW.record_format >= 2 AND EXISTS (SELECT 1 FROM readings r WHERE r.session_id = NEW.id AND NOT EXISTS (SELECT 1 FROM session_ranges c WHERE c.session_id = NEW.id AND c.range_id = r.range_id)) BEGIN SELECT RAISE(ABORT, 'calibration_sessions: a session is submitted with a copy of every range it has readings on'); END
;
CREATE TRIGGER sessions_approved_frozen BEFORE UPDATE ON calibration_sessions WHEN OLD.state IN ('approved', 'superseded') AND NOT (OLD.state = 'approved' AND NEW.state = 'superseded' AND OLD.id IS NEW.id AND OLD.instrument_id IS NEW.instrument_id AND OLD.technician_id IS NEW.technician_id AND OLD.started_at IS NEW.started_at AND OLD.finished_at IS NEW.finished_at AND OLD.ambient_celsius IS NEW.ambient_celsius AND OLD.relative_humidity_percent IS NEW.relative_humidity_percent AND OLD.method IS NEW.method AND OLD.decision_rule IS NEW.decision_rule AND OLD.guard_factor IS NEW.guard_factor AND OLD.readability_fraction IS NEW.readability_fraction AND OLD.coverage_probability IS NEW.coverage_probability AND OLD.reference_celsius IS NEW.reference_celsius AND OLD.record_format IS NEW.record_format AND OLD.phases IS NEW.phases AND OLD.outcome IS NEW.outcome AND OLD.submitted_at IS NEW.submitted_at AND OLD.return_comment IS NEW.return_comment AND OLD.returned_at IS NEW.returned_at AND OLD.reviewer_id IS NEW.reviewer_id AND OLD.approved_at IS NEW.approved_at AND OLD.revision IS NEW.revision AND OLD.supersedes_id IS NEW.supersedes_id AND OLD.amendment_reason IS NEW.amendment_reason AND OLD.amended_at IS NEW.amended_at) BEGIN SELECT RAISE(ABORT, 'calibration_sessions: an approved record cannot be changed; amend it with a reason instead'); END
;
CREATE TRIGGER sessions_submitted_frozen BEFORE UPDATE ON calibration_sessions WHEN OLD.state = 'submitted' AND NEW.state = 'submitted' BEGIN SELECT RAISE(ABORT, 'calibration_sessions: a submitted session cannot be edited; the reviewer returns it first'); END
;
CREATE TRIGGER sessions_kept BEFORE DELETE ON calibration_sessions WHEN OLD.state NOT IN ('draft', 'returned') BEGIN SELECT RAISE(ABORT, 'calibration_sessions: only a draft can be deleted; submitted and approved records are kept'); END
;
CREATE TRIGGER readings_range_matches BEFORE INSERT ON readings WHEN NOT EXISTS (SELECT 1 FROM instrument_ranges r JOIN calibration_sessions s ON s.instrument_id = r.instrument_id WHERE r.id = NEW.range_id AND s.id = NEW.session_id AND r.unit = NEW.unit) BEGIN SELECT RAISE(ABORT, 'readings: the range is not one of the session''s instrument, or the unit is not the range''s'); END
;
CREATE TRIGGER readings_range_matches_update BEFORE UPDATE ON readings WHEN NOT EXISTS (SELECT 1 FROM instrument_ranges r JOIN calibration_sessions s ON s.instrument_id = r.instrument_id WHERE r.id = NEW.range_id AND s.id = NEW.session_id AND r.unit = NEW.unit) BEGIN SELECT RAISE(ABORT, 'readings: the range is not one of the session''s instrument, or the unit is not the range''s'); END
;
CREATE TRIGGER resistor_checks_range_matches BEFORE INSERT ON resistor_checks WHEN NOT EXISTS (SELECT 1 FROM instrument_ranges r JOIN calibration_sessions s ON s.instrument_id = r.instrument_id WHERE r.id = NEW.range_id AND s.id = NEW.session_id) BEGIN SELECT RAISE(ABORT, 'resistor_checks: the range is not one of the session''s instrument'); END
;
CREATE TRIGGER session_ranges_range_matches BEFORE INSERT ON session_ranges WHEN NOT EXISTS (SELECT 1 FROM instrument_ranges r JOIN calibration_sessions s ON s.instrument_id = r.instrument_id WHERE r.id = NEW.range_id AND s.id = NEW.session_id) BEGIN SELECT RAISE(ABORT, 'session_ranges: the range is not one of the session''s instrument'); END
;
CREATE TRIGGER session_points_range_matches BEFORE INSERT ON session_points WHEN NOT EXISTS (SELECT 1 FROM instrument_ranges r JOIN calibration_sessions s ON s.instrument_id = r.instrument_id WHERE r.id = NEW.range_id AND s.id = NEW.session_id) BEGIN SELECT RAISE(ABORT, 'session_points: the range is not one of the session''s instrument'); END
;
CREATE TRIGGER record_chain_approved_only BEFORE INSERT ON record_chain WHEN (SELECT state FROM calibration_sessions WHERE id = NEW.session_id) IS NOT 'approved' BEGIN SELECT RAISE(ABORT, 'record_chain: only an approved session enters the chain'); END
;
CREATE TRIGGER record_chain_append_only_update BEFORE UPDATE ON record_chain BEGIN SELECT RAISE(ABORT, 'record_chain: the chain of approved records is append-only'); END
;
CREATE TRIGGER record_chain_append_only_delete BEFORE DELETE ON record_chain BEGIN SELECT RAISE(ABORT, 'record_chain: the chain of approved records is append-only'); END
;
CREATE TRIGGER users_kept BEFORE DELETE ON users BEGIN SELECT RAISE(ABORT, 'users: a user is deactivated, never deleted, so that records keep their signatures'); END
;
CREATE TRIGGER session_standards_current_insert BEFORE INSERT ON session_standards WHEN NOT EXISTS (SELECT 1 FROM reference_standards r WHERE r.id = NEW.standard_id AND r.certificate_number IS NEW.certificate_number AND r.due_date IS NEW.due_date) AND NOT EXISTS (SELECT 1 FROM calibration_sessions s JOIN session_standards o ON o.session_id = s.supersedes_id WHERE s.id = NEW.session_id AND o.standard_id = NEW.standard_id AND o.certificate_number IS NEW.certificate_number AND o.due_date IS NEW.due_date) BEGIN SELECT RAISE(ABORT, 'session_standards: the certificate number and due date must be those of the reference standard''s current certificate (or, in an amendment, those of the record it supersedes)'); END
;
CREATE TRIGGER session_standards_current_update BEFORE UPDATE ON session_standards WHEN (OLD.session_id IS NOT NEW.session_id OR OLD.standard_id IS NOT NEW.standard_id OR OLD.certificate_number IS NOT NEW.certificate_number OR OLD.due_date IS NOT NEW.due_date) AND NOT EXISTS (SELECT 1 FROM reference_standards r WHERE r.id = NEW.standard_id AND r.certificate_number IS NEW.certificate_number AND r.due_date IS NEW.due_date) AND NOT EXISTS (SELECT 1 FROM calibration_sessions s JOIN session_standards o ON o.session_id = s.supersedes_id WHERE s.id = NEW.session_id AND o.standard_id = NEW.standard_id AND o.certificate_number IS NEW.certificate_number AND o.due_date IS NEW.due_date) BEGIN SELECT RAISE(ABORT, 'session_standards: the certificate number and due date must be those of the reference standard''s current certificate (or, in an amendment, those of the record it supersedes)'); END
;
CREATE TRIGGER session_standard_specs_copied BEFORE INSERT ON session_standard_specs WHEN NOT EXISTS (SELECT 1 FROM standard_specs s WHERE s.standard_id IS NEW.standard_id AND s.sort_order IS NEW.sort_order AND s.label IS NEW.label AND s.unit IS NEW.unit AND s.signal IS NEW.signal AND s.full_scale IS NEW.full_scale AND s.percent_of_reading IS NEW.percent_of_reading AND s.percent_of_range IS NEW.percent_of_range AND s.floor_value IS NEW.floor_value AND s.certificate_expanded_uncertainty IS NEW.certificate_expanded_uncertainty AND s.coverage_factor IS NEW.coverage_factor AND s.certificate_dof IS NEW.certificate_dof) AND NOT EXISTS (SELECT 1 FROM calibration_sessions x JOIN session_standard_specs o ON o.session_id = x.supersedes_id WHERE x.id = NEW.session_id AND o.standard_id IS NEW.standard_id AND o.sort_order IS NEW.sort_order AND o.label IS NEW.label AND o.unit IS NEW.unit AND o.signal IS NEW.signal AND o.full_scale IS NEW.full_scale AND o.percent_of_reading IS NEW.percent_of_reading AND o.percent_of_range IS NEW.percent_of_range AND o.floor_value IS NEW.floor_value AND o.certificate_expanded_uncertainty IS NEW.certificate_expanded_uncertainty AND o.coverage_factor IS NEW.coverage_factor AND o.certificate_dof IS NEW.certificate_dof) BEGIN SELECT RAISE(ABORT, 'session_standard_specs: a copy must equal the standard''s range in the register (or, in an amendment, the copy of the record it supersedes)'); END
;
CREATE TRIGGER session_ranges_copied BEFORE INSERT ON session_ranges WHEN NOT EXISTS (SELECT 1 FROM instrument_ranges r JOIN instruments i ON i.id = r.instrument_id WHERE r.id = NEW.range_id AND r.signal IS NEW.signal AND r.nominal_ohms IS NEW.resistor_ohms AND i.scale_divisions IS NEW.divisions) AND NOT EXISTS (SELECT 1 FROM calibration_sessions x JOIN session_ranges o ON o.session_id = x.supersedes_id WHERE x.id = NEW.session_id AND o.range_id = NEW.range_id AND o.signal IS NEW.signal AND o.resistor_ohms IS NEW.resistor_ohms AND o.divisions IS NEW.divisions) BEGIN SELECT RAISE(ABORT, 'session_ranges: a copy must hold the range''s signal type, resistor and scale divisions as the register has them (or, in an amendment, as the record it supersedes has them)'); END
;
CREATE TRIGGER session_standard_specs_never_edited BEFORE UPDATE ON session_standard_specs BEGIN SELECT RAISE(ABORT, 'session_standard_specs: a copy is replaced, never edited'); END
;
CREATE TRIGGER session_ranges_never_edited BEFORE UPDATE ON session_ranges BEGIN SELECT RAISE(ABORT, 'session_ranges: a copy is replaced, never edited'); END
;
CREATE TRIGGER instruments_conformity_kept BEFORE UPDATE ON instruments WHEN (OLD.asset_tag IS NOT NEW.asset_tag OR OLD.serial IS NOT NEW.serial OR OLD.kind IS NOT NEW.kind OR OLD.movement_amps_fs IS NOT NEW.movement_amps_fs OR OLD.movement_ohms IS NOT NEW.movement_ohms OR OLD.scale_type IS NOT NEW.scale_type OR OLD.scale_divisions IS NOT NEW.scale_divisions OR OLD.accuracy_class IS NOT NEW.accuracy_class) AND EXISTS (SELECT 1 FROM calibration_sessions s WHERE s.instrument_id = OLD.id AND s.state IN ('approved', 'superseded')) BEGIN SELECT RAISE(ABORT, 'instruments: an approved calibration record refers to this instrument, so its asset tag, serial, kind, movement, scale and accuracy class cannot change; register a new instrument or amend the record'); END
;
CREATE TRIGGER instrument_ranges_conformity_kept BEFORE UPDATE ON instrument_ranges WHEN (OLD.instrument_id IS NOT NEW.instrument_id OR OLD.label IS NOT NEW.label OR OLD.unit IS NOT NEW.unit OR OLD.lower_limit IS NOT NEW.lower_limit OR OLD.full_scale IS NOT NEW.full_scale OR OLD.fiducial_value IS NOT NEW.fiducial_value) AND EXISTS (SELECT 1 FROM calibration_sessions s WHERE s.instrument_id = OLD.instrument_id AND s.state IN ('approved', 'superseded')) BEGIN SELECT RAISE(ABORT, 'instrument_ranges: an approved calibration record refers to this instrument, so a range''s label, unit, limits and fiducial value cannot change; register a new instrument or amend the record'); END
;
CREATE TRIGGER users_signature_kept BEFORE UPDATE ON users WHEN (OLD.login IS NOT NEW.login OR OLD.full_name IS NOT NEW.full_name) AND EXISTS (SELECT 1 FROM calibration_sessions s WHERE (s.technician_id = OLD.id OR s.reviewer_id = OLD.id) AND s.state IN ('approved', 'superseded')) BEGIN SELECT RAISE(ABORT, 'users: this user signed approved calibration records, so the login and name cannot change; add a new user and deactivate this one'); END
;
CREATE TRIGGER audit_users_insert AFTER INSERT ON users BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'users', NEW.id, 'insert', NULL, NULL); END
;
CREATE TRIGGER audit_users_update AFTER UPDATE ON users BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'users', NEW.id, 'update', json_object('id', OLD.id, 'login', OLD.login, 'full_name', OLD.full_name, 'role', OLD.role, 'active', OLD.active), json_object('id', NEW.id, 'login', NEW.login, 'full_name', NEW.full_name, 'role', NEW.role, 'active', NEW.active)); END
;
CREATE TRIGGER audit_users_delete AFTER DELETE ON users BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'users', OLD.id, 'delete', json_object('id', OLD.id, 'login', OLD.login, 'full_name', OLD.full_name, 'role', OLD.role, 'active', OLD.active), NULL); END
;
CREATE TRIGGER audit_lab_insert AFTER INSERT ON lab BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'lab', NEW.id, 'insert', NULL, NULL); END
;
CREATE TRIGGER audit_lab_update AFTER UPDATE ON lab BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'lab', NEW.id, 'update', json_object('id', OLD.id, 'name', OLD.name, 'address', OLD.address, 'accreditation_id', OLD.accreditation_id, 'decimal_comma', OLD.decimal_comma, 'due_window_days', OLD.due_window_days), json_object('id', NEW.id, 'name', NEW.name, 'address', NEW.address, 'accreditation_id', NEW.accreditation_id, 'decimal_comma', NEW.decimal_comma, 'due_window_days', NEW.due_window_days)); END
;
CREATE TRIGGER audit_lab_delete AFTER DELETE ON lab BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'lab', OLD.id, 'delete', json_object('id', OLD.id, 'name', OLD.name, 'address', OLD.address, 'accreditation_id', OLD.accreditation_id, 'decimal_comma', OLD.decimal_comma, 'due_window_days', OLD.due_window_days), NULL); END
;
CREATE TRIGGER audit_instruments_insert AFTER INSERT ON instruments BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'instruments', NEW.id, 'insert', NULL, NULL); END
;
CREATE TRIGGER audit_instruments_update AFTER UPDATE ON instruments BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'instruments', NEW.id, 'update', json_object('id', OLD.id, 'asset_tag', OLD.asset_tag, 'description', OLD.description, 'manufacturer', OLD.manufacturer, 'model', OLD.model, 'serial', OLD.serial, 'kind', OLD.kind, 'movement_amps_fs', OLD.movement_amps_fs, 'movement_ohms', OLD.movement_ohms, 'scale_type', OLD.scale_type, 'scale_divisions', OLD.scale_divisions, 'accuracy_class', OLD.accuracy_class, 'interval_days', OLD.interval_days, 'location', OLD.location, 'owner', OLD.owner, 'status', OLD.status), json_object('id', NEW.id, 'asset_tag', NEW.asset_tag, 'description', NEW.description, 'manufacturer', NEW.manufacturer, 'model', NEW.model, 'serial', NEW.serial, 'kind', NEW.kind, 'movement_amps_fs', NEW.movement_amps_fs, 'movement_ohms', NEW.movement_ohms, 'scale_type', NEW.scale_type, 'scale_divisions', NEW.scale_divisions, 'accuracy_class', NEW.accuracy_class, 'interval_days', NEW.interval_days, 'location', NEW.location, 'owner', NEW.owner, 'status', NEW.status)); END
;
CREATE TRIGGER audit_instruments_delete AFTER DELETE ON instruments BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'instruments', OLD.id, 'delete', json_object('id', OLD.id, 'asset_tag', OLD.asset_tag, 'description', OLD.description, 'manufacturer', OLD.manufacturer, 'model', OLD.model, 'serial', OLD.serial, 'kind', OLD.kind, 'movement_amps_fs', OLD.movement_amps_fs, 'movement_ohms', OLD.movement_ohms, 'scale_type', OLD.scale_type, 'scale_divisions', OLD.scale_divisions, 'accuracy_class', OLD.accuracy_class, 'interval_days', OLD.interval_days, 'location', OLD.location, 'owner', OLD.owner, 'status', OLD.status), NULL); END
;
CREATE TRIGGER audit_instrument_ranges_insert AFTER INSERT ON instrument_ranges BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'instrument_ranges', NEW.id, 'insert', NULL, NULL); END
;
CREATE TRIGGER audit_instrument_ranges_update AFTER UPDATE ON instrument_ranges BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'instrument_ranges', NEW.id, 'update', json_object('id', OLD.id, 'instrument_id', OLD.instrument_id, 'sort_order', OLD.sort_order, 'label', OLD.label, 'unit', OLD.unit, 'lower_limit', OLD.lower_limit, 'full_scale', OLD.full_scale, 'nominal_ohms', OLD.nominal_ohms, 'fiducial_value', OLD.fiducial_value, 'signal', OLD.signal, 'diode', OLD.diode), json_object('id', NEW.id, 'instrument_id', NEW.instrument_id, 'sort_order', NEW.sort_order, 'label', NEW.label, 'unit', NEW.unit, 'lower_limit', NEW.lower_limit, 'full_scale', NEW.full_scale, 'nominal_ohms', NEW.nominal_ohms, 'fiducial_value', NEW.fiducial_value, 'signal', NEW.signal, 'diode', NEW.diode)); END
;
CREATE TRIGGER audit_instrument_ranges_delete AFTER DELETE ON instrument_ranges BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'instrument_ranges', OLD.id, 'delete', json_object('id', OLD.id, 'instrument_id', OLD.instrument_id, 'sort_order', OLD.sort_order, 'label', OLD.label, 'unit', OLD.unit, 'lower_limit', OLD.lower_limit, 'full_scale', OLD.full_scale, 'nominal_ohms', OLD.nominal_ohms, 'fiducial_value', OLD.fiducial_value, 'signal', OLD.signal, 'diode', OLD.diode), NULL); END
;
CREATE TRIGGER audit_reference_standards_insert AFTER INSERT ON reference_standards BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'reference_standards', NEW.id, 'insert', NULL, NULL); END
;
CREATE TRIGGER audit_reference_standards_update AFTER UPDATE ON reference_standards BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'reference_standards', NEW.id, 'update', json_object('id', OLD.id, 'asset_tag', OLD.asset_tag, 'description', OLD.description, 'certificate_number', OLD.certificate_number, 'due_date', OLD.due_date), json_object('id', NEW.id, 'asset_tag', NEW.asset_tag, 'description', NEW.description, 'certificate_number', NEW.certificate_number, 'due_date', NEW.due_date)); END
;
CREATE TRIGGER audit_reference_standards_delete AFTER DELETE ON reference_standards BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'reference_standards', OLD.id, 'delete', json_object('id', OLD.id, 'asset_tag', OLD.asset_tag, 'description', OLD.description, 'certificate_number', OLD.certificate_number, 'due_date', OLD.due_date), NULL); END
;
CREATE TRIGGER audit_standard_specs_insert AFTER INSERT ON standard_specs BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'standard_specs', NEW.id, 'insert', NULL, NULL); END
;
CREATE TRIGGER audit_standard_specs_update AFTER UPDATE ON standard_specs BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'standard_specs', NEW.id, 'update', json_object('id', OLD.id, 'standard_id', OLD.standard_id, 'sort_order', OLD.sort_order, 'label', OLD.label, 'unit', OLD.unit, 'signal', OLD.signal, 'full_scale', OLD.full_scale, 'percent_of_reading', OLD.percent_of_reading, 'percent_of_range', OLD.percent_of_range, 'floor_value', OLD.floor_value, 'certificate_expanded_uncertainty', OLD.certificate_expanded_uncertainty, 'coverage_factor', OLD.coverage_factor, 'certificate_dof', OLD.certificate_dof), json_object('id', NEW.id, 'standard_id', NEW.standard_id, 'sort_order', NEW.sort_order, 'label', NEW.label, 'unit', NEW.unit, 'signal', NEW.signal, 'full_scale', NEW.full_scale, 'percent_of_reading', NEW.percent_of_reading, 'percent_of_range', NEW.percent_of_range, 'floor_value', NEW.floor_value, 'certificate_expanded_uncertainty', NEW.certificate_expanded_uncertainty, 'coverage_factor', NEW.coverage_factor, 'certificate_dof', NEW.certificate_dof)); END
;
CREATE TRIGGER audit_standard_specs_delete AFTER DELETE ON standard_specs BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'standard_specs', OLD.id, 'delete', json_object('id', OLD.id, 'standard_id', OLD.standard_id, 'sort_order', OLD.sort_order, 'label', OLD.label, 'unit', OLD.unit, 'signal', OLD.signal, 'full_scale', OLD.full_scale, 'percent_of_reading', OLD.percent_of_reading, 'percent_of_range', OLD.percent_of_range, 'floor_value', OLD.floor_value, 'certificate_expanded_uncertainty', OLD.certificate_expanded_uncertainty, 'coverage_factor', OLD.coverage_factor, 'certificate_dof', OLD.certificate_dof), NULL); END
;
CREATE TRIGGER audit_calibration_sessions_insert AFTER INSERT ON calibration_sessions BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'calibration_sessions', NEW.id, 'insert', NULL, NULL); END
;
CREATE TRIGGER audit_calibration_sessions_update AFTER UPDATE ON calibration_sessions BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'calibration_sessions', NEW.id, 'update', json_object('id', OLD.id, 'instrument_id', OLD.instrument_id, 'technician_id', OLD.technician_id, 'started_at', OLD.started_at, 'finished_at', OLD.finished_at, 'ambient_celsius', OLD.ambient_celsius, 'relative_humidity_percent', OLD.relative_humidity_percent, 'method', OLD.method, 'decision_rule', OLD.decision_rule, 'guard_factor', OLD.guard_factor, 'readability_fraction', OLD.readability_fraction, 'coverage_probability', OLD.coverage_probability, 'reference_celsius', OLD.reference_celsius, 'record_format', OLD.record_format, 'phases', OLD.phases, 'outcome', OLD.outcome, 'state', OLD.state, 'submitted_at', OLD.submitted_at, 'return_comment', OLD.return_comment, 'returned_at', OLD.returned_at, 'reviewer_id', OLD.reviewer_id, 'approved_at', OLD.approved_at, 'revision', OLD.revision, 'supersedes_id', OLD.supersedes_id, 'amendment_reason', OLD.amendment_reason, 'amended_at', OLD.amended_at), json_object('id', NEW.id, 'instrument_id', NEW.instrument_id, 'technician_id', NEW.technician_id, 'started_at', NEW.started_at, 'finished_at', NEW.finished_at, 'ambient_celsius', NEW.ambient_celsius, 'relative_humidity_percent', NEW.relative_humidity_percent, 'method', NEW.method, 'decision_rule', NEW.decision_rule, 'guard_factor', NEW.guard_factor, 'readability_fraction', NEW.readability_fraction, 'coverage_probability', NEW.coverage_probability, 'reference_celsius', NEW.reference_celsius, 'record_format', NEW.record_format, 'phases', NEW.phases, 'outcome', NEW.outcome, 'state', NEW.state, 'submitted_at', NEW.submitted_at, 'return_comment', NEW.return_comment, 'returned_at', NEW.returned_at, 'reviewer_id', NEW.reviewer_id, 'approved_at', NEW.approved_at, 'revision', NEW.revision, 'supersedes_id', NEW.supersedes_id, 'amendment_reason', NEW.amendment_reason, 'amended_at', NEW.amended_at)); END
;
CREATE TRIGGER audit_calibration_sessions_delete AFTER DELETE ON calibration_sessions BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'calibration_sessions', OLD.id, 'delete', json_object('id', OLD.id, 'instrument_id', OLD.instrument_id, 'technician_id', OLD.technician_id, 'started_at', OLD.started_at, 'finished_at', OLD.finished_at, 'ambient_celsius', OLD.ambient_celsius, 'relative_humidity_percent', OLD.relative_humidity_percent, 'method', OLD.method, 'decision_rule', OLD.decision_rule, 'guard_factor', OLD.guard_factor, 'readability_fraction', OLD.readability_fraction, 'coverage_probability', OLD.coverage_probability, 'reference_celsius', OLD.reference_celsius, 'record_format', OLD.record_format, 'phases', OLD.phases, 'outcome', OLD.outcome, 'state', OLD.state, 'submitted_at', OLD.submitted_at, 'return_comment', OLD.return_comment, 'returned_at', OLD.returned_at, 'reviewer_id', OLD.reviewer_id, 'approved_at', OLD.approved_at, 'revision', OLD.revision, 'supersedes_id', OLD.supersedes_id, 'amendment_reason', OLD.amendment_reason, 'amended_at', OLD.amended_at), NULL); END
;
CREATE TRIGGER audit_session_standards_insert AFTER INSERT ON session_standards BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'session_standards', NEW.id, 'insert', NULL, NULL); END
;
CREATE TRIGGER audit_session_standards_update AFTER UPDATE ON session_standards BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'session_standards', NEW.id, 'update', json_object('id', OLD.id, 'session_id', OLD.session_id, 'standard_id', OLD.standard_id, 'certificate_number', OLD.certificate_number, 'due_date', OLD.due_date, 'overdue_justification', OLD.overdue_justification), json_object('id', NEW.id, 'session_id', NEW.session_id, 'standard_id', NEW.standard_id, 'certificate_number', NEW.certificate_number, 'due_date', NEW.due_date, 'overdue_justification', NEW.overdue_justification)); END
;
CREATE TRIGGER audit_session_standards_delete AFTER DELETE ON session_standards BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'session_standards', OLD.id, 'delete', json_object('id', OLD.id, 'session_id', OLD.session_id, 'standard_id', OLD.standard_id, 'certificate_number', OLD.certificate_number, 'due_date', OLD.due_date, 'overdue_justification', OLD.overdue_justification), NULL); END
;
CREATE TRIGGER audit_session_standard_specs_insert AFTER INSERT ON session_standard_specs BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'session_standard_specs', NEW.session_id, 'insert', NULL, json_object('standard_id', NEW.standard_id, 'sort_order', NEW.sort_order)); END
;
CREATE TRIGGER audit_session_standard_specs_update AFTER UPDATE ON session_standard_specs BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'session_standard_specs', NEW.session_id, 'update', json_object('session_id', OLD.session_id, 'standard_id', OLD.standard_id, 'sort_order', OLD.sort_order, 'label', OLD.label, 'unit', OLD.unit, 'signal', OLD.signal, 'full_scale', OLD.full_scale, 'percent_of_reading', OLD.percent_of_reading, 'percent_of_range', OLD.percent_of_range, 'floor_value', OLD.floor_value, 'certificate_expanded_uncertainty', OLD.certificate_expanded_uncertainty, 'coverage_factor', OLD.coverage_factor, 'certificate_dof', OLD.certificate_dof), json_object('session_id', NEW.session_id, 'standard_id', NEW.standard_id, 'sort_order', NEW.sort_order, 'label', NEW.label, 'unit', NEW.unit, 'signal', NEW.signal, 'full_scale', NEW.full_scale, 'percent_of_reading', NEW.percent_of_reading, 'percent_of_range', NEW.percent_of_range, 'floor_value', NEW.floor_value, 'certificate_expanded_uncertainty', NEW.certificate_expanded_uncertainty, 'coverage_factor', NEW.coverage_factor, 'certificate_dof', NEW.certificate_dof)); END
;
CREATE TRIGGER audit_session_standard_specs_delete AFTER DELETE ON session_standard_specs BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'session_standard_specs', OLD.session_id, 'delete', json_object('session_id', OLD.session_id, 'standard_id', OLD.standard_id, 'sort_order', OLD.sort_order, 'label', OLD.label, 'unit', OLD.unit, 'signal', OLD.signal, 'full_scale', OLD.full_scale, 'percent_of_reading', OLD.percent_of_reading, 'percent_of_range', OLD.percent_of_range, 'floor_value', OLD.floor_value, 'certificate_expanded_uncertainty', OLD.certificate_expanded_uncertainty, 'coverage_factor', OLD.coverage_factor, 'certificate_dof', OLD.certificate_dof), NULL); END
;
CREATE TRIGGER audit_session_ranges_insert AFTER INSERT ON session_ranges BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'session_ranges', NEW.session_id, 'insert', NULL, NULL); END
;
CREATE TRIGGER audit_session_ranges_update AFTER UPDATE ON session_ranges BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'session_ranges', NEW.session_id, 'update', json_object('session_id', OLD.session_id, 'range_id', OLD.range_id, 'signal', OLD.signal, 'diode_saturation_amps', OLD.diode_saturation_amps, 'diode_emission_coefficient', OLD.diode_emission_coefficient, 'diode_series_ohms', OLD.diode_series_ohms, 'diode_nominal_celsius', OLD.diode_nominal_celsius, 'diode_bandgap_ev', OLD.diode_bandgap_ev, 'diode_saturation_exponent', OLD.diode_saturation_exponent, 'resistor_ohms', OLD.resistor_ohms, 'divisions', OLD.divisions, 'reference_standard_id', OLD.reference_standard_id, 'reference_sort_order', OLD.reference_sort_order, 'shunt_standard_id', OLD.shunt_standard_id, 'shunt_sort_order', OLD.shunt_sort_order), json_object('session_id', NEW.session_id, 'range_id', NEW.range_id, 'signal', NEW.signal, 'diode_saturation_amps', NEW.diode_saturation_amps, 'diode_emission_coefficient', NEW.diode_emission_coefficient, 'diode_series_ohms', NEW.diode_series_ohms, 'diode_nominal_celsius', NEW.diode_nominal_celsius, 'diode_bandgap_ev', NEW.diode_bandgap_ev, 'diode_saturation_exponent', NEW.diode_saturation_exponent, 'resistor_ohms', NEW.resistor_ohms, 'divisions', NEW.divisions, 'reference_standard_id', NEW.reference_standard_id, 'reference_sort_order', NEW.reference_sort_order, 'shunt_standard_id', NEW.shunt_standard_id, 'shunt_sort_order', NEW.shunt_sort_order)); END
;
CREATE TRIGGER audit_session_ranges_delete AFTER DELETE ON session_ranges BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'session_ranges', OLD.session_id, 'delete', json_object('session_id', OLD.session_id, 'range_id', OLD.range_id, 'signal', OLD.signal, 'diode_saturation_amps', OLD.diode_saturation_amps, 'diode_emission_coefficient', OLD.diode_emission_coefficient, 'diode_series_ohms', OLD.diode_series_ohms, 'diode_nominal_celsius', OLD.diode_nominal_celsius, 'diode_bandgap_ev', OLD.diode_bandgap_ev, 'diode_saturation_exponent', OLD.diode_saturation_exponent, 'resistor_ohms', OLD.resistor_ohms, 'divisions', OLD.divisions, 'reference_standard_id', OLD.reference_standard_id, 'reference_sort_order', OLD.reference_sort_order, 'shunt_standard_id', OLD.shunt_standard_id, 'shunt_sort_order', OLD.shunt_sort_order), NULL); END
;
CREATE TRIGGER audit_readings_insert AFTER INSERT ON readings BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'readings', NEW.session_id, 'insert', NULL, json_object('range_id', NEW.range_id, 'point_index', NEW.point_index, 'direction', NEW.direction, 'phase', NEW.phase, 'repeat_number', NEW.repeat_number)); END
;
CREATE TRIGGER audit_readings_update AFTER UPDATE ON readings BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'readings', NEW.session_id, 'update', json_object('session_id', OLD.session_id, 'range_id', OLD.range_id, 'point_index', OLD.point_index, 'direction', OLD.direction, 'phase', OLD.phase, 'repeat_number', OLD.repeat_number, 'unit', OLD.unit, 'applied', OLD.applied, 'indicated', OLD.indicated), json_object('session_id', NEW.session_id, 'range_id', NEW.range_id, 'point_index', NEW.point_index, 'direction', NEW.direction, 'phase', NEW.phase, 'repeat_number', NEW.repeat_number, 'unit', NEW.unit, 'applied', NEW.applied, 'indicated', NEW.indicated)); END
;
CREATE TRIGGER audit_readings_delete AFTER DELETE ON readings BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'readings', OLD.session_id, 'delete', json_object('session_id', OLD.session_id, 'range_id', OLD.range_id, 'point_index', OLD.point_index, 'direction', OLD.direction, 'phase', OLD.phase, 'repeat_number', OLD.repeat_number, 'unit', OLD.unit, 'applied', OLD.applied, 'indicated', OLD.indicated), NULL); END
;
CREATE TRIGGER audit_resistor_checks_insert AFTER INSERT ON resistor_checks BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'resistor_checks', NEW.id, 'insert', NULL, NULL); END
;
CREATE TRIGGER audit_resistor_checks_update AFTER UPDATE ON resistor_checks BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'resistor_checks', NEW.id, 'update', json_object('id', OLD.id, 'session_id', OLD.session_id, 'range_id', OLD.range_id, 'component', OLD.component, 'computed_ohms', OLD.computed_ohms, 'measured_ohms', OLD.measured_ohms, 'tolerance_percent', OLD.tolerance_percent), json_object('id', NEW.id, 'session_id', NEW.session_id, 'range_id', NEW.range_id, 'component', NEW.component, 'computed_ohms', NEW.computed_ohms, 'measured_ohms', NEW.measured_ohms, 'tolerance_percent', NEW.tolerance_percent)); END
;
CREATE TRIGGER audit_resistor_checks_delete AFTER DELETE ON resistor_checks BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'resistor_checks', OLD.id, 'delete', json_object('id', OLD.id, 'session_id', OLD.session_id, 'range_id', OLD.range_id, 'component', OLD.component, 'computed_ohms', OLD.computed_ohms, 'measured_ohms', OLD.measured_ohms, 'tolerance_percent', OLD.tolerance_percent), NULL); END
;
CREATE TRIGGER audit_adjustment_notes_insert AFTER INSERT ON adjustment_notes BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'adjustment_notes', NEW.id, 'insert', NULL, NULL); END
;
CREATE TRIGGER audit_adjustment_notes_update AFTER UPDATE ON adjustment_notes BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'adjustment_notes', NEW.id, 'update', json_object('id', OLD.id, 'session_id', OLD.session_id, 'noted_at', OLD.noted_at, 'note_text', OLD.note_text), json_object('id', NEW.id, 'session_id', NEW.session_id, 'noted_at', NEW.noted_at, 'note_text', NEW.note_text)); END
;
CREATE TRIGGER audit_adjustment_notes_delete AFTER DELETE ON adjustment_notes BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'adjustment_notes', OLD.id, 'delete', json_object('id', OLD.id, 'session_id', OLD.session_id, 'noted_at', OLD.noted_at, 'note_text', OLD.note_text), NULL); END
;
CREATE TRIGGER audit_record_chain_insert AFTER INSERT ON record_chain BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'record_chain', NEW.id, 'insert', NULL, NULL); END
;
CREATE TRIGGER audit_record_chain_update AFTER UPDATE ON record_chain BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'record_chain', NEW.id, 'update', json_object('id', OLD.id, 'session_id', OLD.session_id, 'previous_digest', OLD.previous_digest, 'digest', OLD.digest, 'recorded_at', OLD.recorded_at), json_object('id', NEW.id, 'session_id', NEW.session_id, 'previous_digest', NEW.previous_digest, 'digest', NEW.digest, 'recorded_at', NEW.recorded_at)); END
;
CREATE TRIGGER audit_record_chain_delete AFTER DELETE ON record_chain BEGIN INSERT INTO audit_log (at, user_id, table_name, row_id, action, old_values, new_values) VALUES (strftime('%Y-%m-%dT%H:%M:%fZ', 'now'), (SELECT user_id FROM audit_context WHERE id = 1), 'record_chain', OLD.id, 'delete', json_object('id', OLD.id, 'session_id', OLD.session_id, 'previous_digest', OLD.previous_digest, 'digest', OLD.digest, 'recorded_at', OLD.recorded_at), NULL); END
;
CREATE TRIGGER audit_log_append_only_update BEFORE UPDATE ON audit_log BEGIN SELECT RAISE(ABORT, 'audit_log: the audit log is append-only'); END
;
CREATE TRIGGER audit_log_append_only_delete BEFORE DELETE ON audit_log BEGIN SELECT RAISE(ABORT, 'audit_log: the audit log is append-only'); END
;
CREATE TRIGGER lab_id_kept_on_insert BEFORE INSERT ON lab WHEN EXISTS (SELECT 1 FROM lab k WHERE k.id = NEW.id) BEGIN SELECT RAISE(ABORT, 'lab: a row with this lab.id already exists; rows are never replaced'); END
;
CREATE TRIGGER lab_id_kept_on_update BEFORE UPDATE OF id ON lab WHEN (OLD.id IS NOT NEW.id) AND EXISTS (SELECT 1 FROM lab k WHERE k.id = NEW.id) BEGIN SELECT RAISE(ABORT, 'lab: a row with this lab.id already exists; rows are never replaced'); END
;
CREATE TRIGGER users_id_kept_on_insert BEFORE INSERT ON users WHEN EXISTS (SELECT 1 FROM users k WHERE k.id = NEW.id) BEGIN SELECT RAISE(ABORT, 'users: a row with this users.id already exists; rows are never replaced'); END
;
CREATE TRIGGER users_id_kept_on_update BEFORE UPDATE OF id ON users WHEN (OLD.id IS NOT NEW.id) AND EXISTS (SELECT 1 FROM users k WHERE k.id = NEW.id) BEGIN SELECT RAISE(ABORT, 'users: a row with this users.id already exists; rows are never replaced'); END
;
CREATE TRIGGER users_login_kept_on_insert BEFORE INSERT ON users WHEN EXISTS (SELECT 1 FROM users k WHERE k.login = NEW.login) BEGIN SELECT RAISE(ABORT, 'users: a row with this users.login already exists; rows are never replaced'); END
;
CREATE TRIGGER users_login_kept_on_update BEFORE UPDATE OF login ON users WHEN (OLD.login IS NOT NEW.login) AND EXISTS (SELECT 1 FROM users k WHERE k.login = NEW.login) BEGIN SELECT RAISE(ABORT, 'users: a row with this users.login already exists; rows are never replaced'); END
;
CREATE TRIGGER instruments_id_kept_on_insert BEFORE INSERT ON instruments WHEN EXISTS (SELECT 1 FROM instruments k WHERE k.id = NEW.id) BEGIN SELECT RAISE(ABORT, 'instruments: a row with this instruments.id already exists; rows are never replaced'); END
;
CREATE TRIGGER instruments_id_kept_on_update BEFORE UPDATE OF id ON instruments WHEN (OLD.id IS NOT NEW.id) AND EXISTS (SELECT 1 FROM instruments k WHERE k.id = NEW.id) BEGIN SELECT RAISE(ABORT, 'instruments: a row with this instruments.id already exists; rows are never replaced'); END
;
CREATE TRIGGER instruments_asset_tag_kept_on_insert BEFORE INSERT ON instruments WHEN EXISTS (SELECT 1 FROM instruments k WHERE k.asset_tag = NEW.asset_tag) BEGIN SELECT RAISE(ABORT, 'instruments: a row with this instruments.asset_tag already exists; rows are never replaced'); END
;
CREATE TRIGGER instruments_asset_tag_kept_on_update BEFORE UPDATE OF asset_tag ON instruments WHEN (OLD.asset_tag IS NOT NEW.asset_tag) AND EXISTS (SELECT 1 FROM instruments k WHERE k.asset_tag = NEW.asset_tag) BEGIN SELECT RAISE(ABORT, 'instruments: a row with this instruments.asset_tag already exists; rows are never replaced'); END
;
CREATE TRIGGER instrument_ranges_id_kept_on_insert BEFORE INSERT ON instrument_ranges WHEN EXISTS (SELECT 1 FROM instrument_ranges k WHERE k.id = NEW.id) BEGIN SELECT RAISE(ABORT, 'instrument_ranges: a row with this instrument_ranges.id already exists; rows are never replaced'); END
;
CREATE TRIGGER instrument_ranges_id_kept_on_update BEFORE UPDATE OF id ON instrument_ranges WHEN (OLD.id IS NOT NEW.id) AND EXISTS (SELECT 1 FROM instrument_ranges k WHERE k.id = NEW.id) BEGIN SELECT RAISE(ABORT, 'instrument_ranges: a row with this instrument_ranges.id already exists; rows are never replaced'); END
;
CREATE TRIGGER instrument_ranges_instrument_id_label_kept_on_insert BEFORE INSERT ON instrument_ranges WHEN EXISTS (SELECT 1 FROM instrument_ranges k WHERE k.instrument_id = NEW.instrument_id AND k.label = NEW.label) BEGIN SELECT RAISE(ABORT, 'instrument_ranges: a row with this instrument_ranges.instrument_id, instrument_ranges.label already exists; rows are never replaced'); END
;
CREATE TRIGGER instrument_ranges_instrument_id_label_kept_on_update BEFORE UPDATE OF instrument_id, label ON instrument_ranges WHEN (OLD.instrument_id IS NOT NEW.instrument_id OR OLD.label IS NOT NEW.label) AND EXISTS (SELECT 1 FROM instrument_ranges k WHERE k.instrument_id = NEW.instrument_id AND k.label = NEW.label) BEGIN SELECT RAISE(ABORT, 'instrument_ranges: a row with this instrument_ranges.instrument_id, instrument_ranges.label already exists; rows are never replaced'); END
;
CREATE TRIGGER reference_standards_id_kept_on_insert BEFORE INSERT ON reference_standards WHEN EXISTS (SELECT 1 FROM reference_standards k WHERE k.id = NEW.id) BEGIN SELECT RAISE(ABORT, 'reference_standards: a row with this reference_standards.id already exists; rows are never replaced'); END
;
CREATE TRIGGER reference_standards_id_kept_on_update BEFORE UPDATE OF id ON reference_standards WHEN (OLD.id IS NOT NEW.id) AND EXISTS (SELECT 1 FROM reference_standards k WHERE k.id = NEW.id) BEGIN SELECT RAISE(ABORT, 'reference_standards: a row with this reference_standards.id already exists; rows are never replaced'); END
;
CREATE TRIGGER reference_standards_asset_tag_kept_on_insert BEFORE INSERT ON reference_standards WHEN EXISTS (SELECT 1 FROM reference_standards k WHERE k.asset_tag = NEW.asset_tag) BEGIN SELECT RAISE(ABORT, 'reference_standards: a row with this reference_standards.asset_tag already exists; rows are never replaced'); END
;
CREATE TRIGGER reference_standards_asset_tag_kept_on_update BEFORE UPDATE OF asset_tag ON reference_standards WHEN (OLD.asset_tag IS NOT NEW.asset_tag) AND EXISTS (SELECT 1 FROM reference_standards k WHERE k.asset_tag = NEW.asset_tag) BEGIN SELECT RAISE(ABORT, 'reference_standards: a row with this reference_standards.asset_tag already exists; rows are never replaced'); END
;
CREATE TRIGGER standard_specs_id_kept_on_insert BEFORE INSERT ON standard_specs WHEN EXISTS (SELECT 1 FROM standard_specs k WHERE k.id = NEW.id) BEGIN SELECT RAISE(ABORT, 'standard_specs: a row with this standard_specs.id already exists; rows are never replaced'); END
;
CREATE TRIGGER standard_specs_id_kept_on_update BEFORE UPDATE OF id ON standard_specs WHEN (OLD.id IS NOT NEW.id) AND EXISTS (SELECT 1 FROM standard_specs k WHERE k.id = NEW.id) BEGIN SELECT RAISE(ABORT, 'standard_specs: a row with this standard_specs.id already exists; rows are never replaced'); END
;
CREATE TRIGGER standard_specs_standard_id_sort_order_kept_on_insert BEFORE INSERT ON standard_specs WHEN EXISTS (SELECT 1 FROM standard_specs k WHERE k.standard_id = NEW.standard_id AND k.sort_order = NEW.sort_order) BEGIN SELECT RAISE(ABORT, 'standard_specs: a row with this standard_specs.standard_id, standard_specs.sort_order already exists; rows are never replaced'); END
;
CREATE TRIGGER standard_specs_standard_id_sort_order_kept_on_update BEFORE UPDATE OF standard_id, sort_order ON standard_specs WHEN (OLD.standard_id IS NOT NEW.standard_id OR OLD.sort_order IS NOT NEW.sort_order) AND EXISTS (SELECT 1 FROM standard_specs k WHERE k.standard_id = NEW.standard_id AND k.sort_order = NEW.sort_order) BEGIN SELECT RAISE(ABORT, 'standard_specs: a row with this standard_specs.standard_id, standard_specs.sort_order already exists; rows are never replaced'); END
;
CREATE TRIGGER calibration_sessions_id_kept_on_insert BEFORE INSERT ON calibration_sessions WHEN EXISTS (SELECT 1 FROM calibration_sessions k WHERE k.id = NEW.id) BEGIN SELECT RAISE(ABORT, 'calibration_sessions: a row with this calibration_sessions.id already exists; rows are never replaced'); END
;
CREATE TRIGGER calibration_sessions_id_kept_on_update BEFORE UPDATE OF id ON calibration_sessions WHEN (OLD.id IS NOT NEW.id) AND EXISTS (SELECT 1 FROM calibration_sessions k WHERE k.id = NEW.id) BEGIN SELECT RAISE(ABORT, 'calibration_sessions: a row with this calibration_sessions.id already exists; rows are never replaced'); END
;
CREATE TRIGGER calibration_sessions_supersedes_id_kept_on_insert BEFORE INSERT ON calibration_sessions WHEN EXISTS (SELECT 1 FROM calibration_sessions k WHERE k.supersedes_id = NEW.supersedes_id) BEGIN SELECT RAISE(ABORT, 'calibration_sessions: a row with this calibration_sessions.supersedes_id already exists; rows are never replaced'); END
;
CREATE TRIGGER calibration_sessions_supersedes_id_kept_on_update BEFORE UPDATE OF supersedes_id ON calibration_sessions WHEN (OLD.supersedes_id IS NOT NEW.supersedes_id) AND EXISTS (SELECT 1 FROM calibration_sessions k WHERE k.supersedes_id = NEW.supersedes_id) BEGIN SELECT RAISE(ABORT, 'calibration_sessions: a row with this calibration_sessions.supersedes_id already exists; rows are never replaced'); END
;
CREATE TRIGGER session_standards_id_kept_on_insert BEFORE INSERT ON session_standards WHEN EXISTS (SELECT 1 FROM session_standards k WHERE k.id = NEW.id) BEGIN SELECT RAISE(ABORT, 'session_standards: a row with this session_standards.id already exists; rows are never replaced'); END
;
CREATE TRIGGER session_standards_id_kept_on_update BEFORE UPDATE OF id ON session_standards WHEN (OLD.id IS NOT NEW.id) AND EXISTS (SELECT 1 FROM session_standards k WHERE k.id = NEW.id) BEGIN SELECT RAISE(ABORT, 'session_standards: a row with this session_standards.id already exists; rows are never replaced'); END
;
CREATE TRIGGER session_standards_session_id_standard_id_kept_on_insert BEFORE INSERT ON session_standards WHEN EXISTS (SELECT 1 FROM session_standards k WHERE k.session_id = NEW.session_id AND k.standard_id = NEW.standard_id) BEGIN SELECT RAISE(ABORT, 'session_standards: a row with this session_standards.session_id, session_standards.standard_id already exists; rows are never replaced'); END
;
CREATE TRIGGER session_standards_session_id_standard_id_kept_on_update BEFORE UPDATE OF session_id, standard_id ON session_standards WHEN (OLD.session_id IS NOT NEW.session_id OR OLD.standard_id IS NOT NEW.standard_id) AND EXISTS (SELECT 1 FROM session_standards k WHERE k.session_id = NEW.session_id AND k.standard_id = NEW.standard_id) BEGIN SELECT RAISE(ABORT, 'session_standards: a row with this session_standards.session_id, session_standards.standard_id already exists; rows are never replaced'); END
;
CREATE TRIGGER session_standard_specs_session_id_standard_id_sort_order_kept_on_insert BEFORE INSERT ON session_standard_specs WHEN EXISTS (SELECT 1 FROM session_standard_specs k WHERE k.session_id = NEW.session_id AND k.standard_id = NEW.standard_id AND k.sort_order = NEW.sort_order) BEGIN SELECT RAISE(ABORT, 'session_standard_specs: a row with this session_standard_specs.session_id, session_standard_specs.standard_id, session_standard_specs.sort_order already exists; rows are never replaced'); END
;
CREATE TRIGGER session_standard_specs_session_id_standard_id_sort_order_kept_on_update BEFORE UPDATE OF session_id, standard_id, sort_order ON session_standard_specs WHEN (OLD.session_id IS NOT NEW.session_id OR OLD.standard_id IS NOT NEW.standard_id OR OLD.sort_order IS NOT NEW.sort_order) AND EXISTS (SELECT 1 FROM session_standard_specs k WHERE k.session_id = NEW.session_id AND k.standard_id = NEW.standard_id AND k.sort_order = NEW.sort_order) BEGIN SELECT RAISE(ABORT, 'session_standard_specs: a row with this session_standard_specs.session_id, session_standard_specs.standard_id, session_standard_specs.sort_order already exists; rows are never replaced'); END
;
CREATE TRIGGER session_ranges_session_id_range_id_kept_on_insert BEFORE INSERT ON session_ranges WHEN EXISTS (SELECT 1 FROM session_ranges k WHERE k.session_id = NEW.session_id AND k.range_id = NEW.range_id) BEGIN SELECT RAISE(ABORT, 'session_ranges: a row with this session_ranges.session_id, session_ranges.range_id already exists; rows are never replaced'); END
;
CREATE TRIGGER session_ranges_session_id_range_id_kept_on_update BEFORE UPDATE OF session_id, range_id ON session_ranges WHEN (OLD.session_id IS NOT NEW.session_id OR OLD.range_id IS NOT NEW.range_id) AND EXISTS (SELECT 1 FROM session_ranges k WHERE k.session_id = NEW.session_id AND k.range_id = NEW.range_id) BEGIN SELECT RAISE(ABORT, 'session_ranges: a row with this session_ranges.session_id, session_ranges.range_id already exists; rows are never replaced'); END
;
CREATE TRIGGER session_points_session_id_range_id_point_index_kept_on_insert BEFORE INSERT ON session_points WHEN EXISTS (SELECT 1 FROM session_points k WHERE k.session_id = NEW.session_id AND k.range_id = NEW.range_id AND k.point_index = NEW.point_index) BEGIN SELECT RAISE(ABORT, 'session_points: a row with this session_points.session_id, session_points.range_id, session_points.point_index already exists; rows are never replaced'); END
;
CREATE TRIGGER session_points_session_id_range_id_point_index_kept_on_update BEFORE UPDATE OF session_id, range_id, point_index ON session_points WHEN (OLD.session_id IS NOT NEW.session_id OR OLD.range_id IS NOT NEW.range_id OR OLD.point_index IS NOT NEW.point_index) AND EXISTS (SELECT 1 FROM session_points k WHERE k.session_id = NEW.session_id AND k.range_id = NEW.range_id AND k.point_index = NEW.point_index) BEGIN SELECT RAISE(ABORT, 'session_points: a row with this session_points.session_id, session_points.range_id, session_points.point_index already exists; rows are never replaced'); END
;
CREATE TRIGGER readings_session_id_range_id_point_index_direction_phase_repeat_number_kept_on_insert BEFORE INSERT ON readings WHEN EXISTS (SELECT 1 FROM readings k WHERE k.session_id = NEW.session_id AND k.range_id = NEW.range_id AND k.point_index = NEW.point_index AND k.direction = NEW.direction AND k.phase = NEW.phase AND k.repeat_number = NEW.repeat_number) BEGIN SELECT RAISE(ABORT, 'readings: a row with this readings.session_id, readings.range_id, readings.point_index, readings.direction, readings.phase, readings.repeat_number already exists; rows are never replaced'); END
;
CREATE TRIGGER readings_session_id_range_id_point_index_direction_phase_repeat_number_kept_on_update BEFORE UPDATE OF session_id, range_id, point_index, direction, phase, repeat_number ON readings WHEN (OLD.session_id IS NOT NEW.session_id OR OLD.range_id IS NOT NEW.range_id OR OLD.point_index IS NOT NEW.point_index OR OLD.direction IS NOT NEW.direction OR OLD.phase IS NOT NEW.phase OR OLD.repeat_number IS NOT NEW.repeat_number) AND EXISTS (SELECT 1 FROM readings k WHERE k.session_id = NEW.session_id AND k.range_id = NEW.range_id AND k.point_index = NEW.point_index AND k.direction = NEW.direction AND k.phase = NEW.phase AND k.repeat_number = NEW.repeat_number) BEGIN SELECT RAISE(ABORT, 'readings: a row with this readings.session_id, readings.range_id, readings.point_index, readings.direction, readings.phase, readings.repeat_number already exists; rows are never replaced'); END
;
CREATE TRIGGER resistor_checks_id_kept_on_insert BEFORE INSERT ON resistor_checks WHEN EXISTS (SELECT 1 FROM resistor_checks k WHERE k.id = NEW.id) BEGIN SELECT RAISE(ABORT, 'resistor_checks: a row with this resistor_checks.id already exists; rows are never replaced'); END
;
CREATE TRIGGER resistor_checks_id_kept_on_update BEFORE UPDATE OF id ON resistor_checks WHEN (OLD.id IS NOT NEW.id) AND EXISTS (SELECT 1 FROM resistor_checks k WHERE k.id = NEW.id) BEGIN SELECT RAISE(ABORT, 'resistor_checks: a row with this resistor_checks.id already exists; rows are never replaced'); END
;
CREATE TRIGGER adjustment_notes_id_kept_on_insert BEFORE INSERT ON adjustment_notes WHEN EXISTS (SELECT 1 FROM adjustment_notes k WHERE k.id = NEW.id) BEGIN SELECT RAISE(ABORT, 'adjustment_notes: a row with this adjustment_notes.id already exists; rows are never replaced'); END
;
CREATE TRIGGER adjustment_notes_id_kept_on_update BEFORE UPDATE OF id ON adjustment_notes WHEN (OLD.id IS NOT NEW.id) AND EXISTS (SELECT 1 FROM adjustment_notes k WHERE k.id = NEW.id) BEGIN SELECT RAISE(ABORT, 'adjustment_notes: a row with this adjustment_notes.id already exists; rows are never replaced'); END
;
CREATE TRIGGER record_chain_id_kept_on_insert BEFORE INSERT ON record_chain WHEN EXISTS (SELECT 1 FROM record_chain k WHERE k.id = NEW.id) BEGIN SELECT RAISE(ABORT, 'record_chain: a row with this record_chain.id already exists; rows are never replaced'); END
;
CREATE TRIGGER record_chain_id_kept_on_update BEFORE UPDATE OF id ON record_chain WHEN (OLD.id IS NOT NEW.id) AND EXISTS (SELECT 1 FROM record_chain k WHERE k.id = NEW.id) BEGIN SELECT RAISE(ABORT, 'record_chain: a row with this record_chain.id already exists; rows are never replaced'); END
;
CREATE TRIGGER record_chain_session_id_kept_on_insert BEFORE INSERT ON record_chain WHEN EXISTS (SELECT 1 FROM record_chain k WHERE k.session_id = NEW.session_id) BEGIN SELECT RAISE(ABORT, 'record_chain: a row with this record_chain.session_id already exists; rows are never replaced'); END
;
CREATE TRIGGER record_chain_session_id_kept_on_update BEFORE UPDATE OF session_id ON record_chain WHEN (OLD.session_id IS NOT NEW.session_id) AND EXISTS (SELECT 1 FROM record_chain k WHERE k.session_id = NEW.session_id) BEGIN SELECT RAISE(ABORT, 'record_chain: a row with this record_chain.session_id already exists; rows are never replaced'); END
;
CREATE TRIGGER record_chain_digest_kept_on_insert BEFORE INSERT ON record_chain WHEN EXISTS (SELECT 1 FROM record_chain k WHERE k.digest = NEW.digest) BEGIN SELECT RAISE(ABORT, 'record_chain: a row with this record_chain.digest already exists; rows are never replaced'); END
;
CREATE TRIGGER record_chain_digest_kept_on_update BEFORE UPDATE OF digest ON record_chain WHEN (OLD.digest IS NOT NEW.digest) AND EXISTS (SELECT 1 FROM record_chain k WHERE k.digest = NEW.digest) BEGIN SELECT RAISE(ABORT, 'record_chain: a row with this record_chain.digest already exists; rows are never replaced'); END
;
CREATE TRIGGER audit_log_id_kept_on_insert BEFORE INSERT ON audit_log WHEN EXISTS (SELECT 1 FROM audit_log k WHERE k.id = NEW.id) BEGIN SELECT RAISE(ABORT, 'audit_log: a row with this audit_log.id already exists; rows are never replaced'); END
;
CREATE TRIGGER audit_log_id_kept_on_update BEFORE UPDATE OF id ON audit_log WHEN (OLD.id IS NOT NEW.id) AND EXISTS (SELECT 1 FROM audit_log k WHERE k.id = NEW.id) BEGIN SELECT RAISE(ABORT, 'audit_log: a row with this audit_log.id already exists; rows are never replaced'); END
;
CREATE TRIGGER audit_context_id_kept_on_insert BEFORE INSERT ON audit_context WHEN EXISTS (SELECT 1 FROM audit_context k WHERE k.id = NEW.id) BEGIN SELECT RAISE(ABORT, 'audit_context: a row with this audit_context.id already exists; rows are never replaced'); END
;
CREATE TRIGGER audit_context_id_kept_on_update BEFORE UPDATE OF id ON audit_context WHEN (OLD.id IS NOT NEW.id) AND EXISTS (SELECT 1 FROM audit_context k WHERE k.id = NEW.id) BEGIN SELECT RAISE(ABORT, 'audit_context: a row with this audit_context.id already exists; rows are never replaced'); END
;
