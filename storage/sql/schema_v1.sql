-- Schema version 1 of a Meterwright workbook, exactly as the program wrote it: records and
-- the integrity rules. Frozen: a workbook of this version is upgraded by later steps, never by
-- editing this file. Statements are separated by a line holding only ";".
CREATE TABLE users (
        id INTEGER PRIMARY KEY,
        login TEXT NOT NULL UNIQUE CHECK (length(login) > 0),
        full_name TEXT NOT NULL,
        role TEXT NOT NULL CHECK (role IN ('technician', 'reviewer', 'administrator')),
        active INTEGER NOT NULL CHECK (active IN (0, 1)),
        password_hash TEXT NOT NULL CHECK (password_hash LIKE '$argon2id$%'))
;
CREATE TABLE lab (
        id INTEGER PRIMARY KEY CHECK (id = 1),
        name TEXT NOT NULL CHECK (length(name) > 0),
        address TEXT NOT NULL,
        accreditation_id TEXT)
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
        status TEXT NOT NULL CHECK (status IN ('in-service', 'out-of-service', 'retired')))
;
CREATE TABLE instrument_ranges (
        id INTEGER PRIMARY KEY,
        instrument_id INTEGER NOT NULL REFERENCES instruments (id) ON DELETE CASCADE,
        sort_order INTEGER NOT NULL,
        label TEXT NOT NULL CHECK (length(label) > 0),
        unit TEXT NOT NULL CHECK (unit IN ('V', 'A')),
        lower_limit DOUBLE PRECISION NOT NULL,
        full_scale DOUBLE PRECISION NOT NULL CHECK (full_scale > lower_limit),
        nominal_ohms DOUBLE PRECISION CHECK (nominal_ohms IS NULL OR nominal_ohms > 0),
        fiducial_value DOUBLE PRECISION CHECK (fiducial_value IS NULL OR fiducial_value > 0),
        UNIQUE (instrument_id, label))
;
CREATE TABLE reference_standards (
        id INTEGER PRIMARY KEY,
        asset_tag TEXT NOT NULL UNIQUE CHECK (length(asset_tag) > 0),
        description TEXT NOT NULL,
        certificate_number TEXT NOT NULL,
        due_date TEXT NOT NULL CHECK (due_date LIKE '____-__-__'))
;
CREATE TABLE standard_specs (
        id INTEGER PRIMARY KEY,
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
        coverage_factor DOUBLE PRECISION NOT NULL CHECK (coverage_factor > 0))
;
CREATE TABLE calibration_sessions (
        id INTEGER PRIMARY KEY,
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
                   AND length(amendment_reason) > 0)))
;
CREATE TABLE session_standards (
        id INTEGER PRIMARY KEY,
        session_id INTEGER NOT NULL REFERENCES calibration_sessions (id) ON DELETE CASCADE,
        standard_id INTEGER NOT NULL REFERENCES reference_standards (id),
        certificate_number TEXT NOT NULL,
        due_date TEXT NOT NULL CHECK (due_date LIKE '____-__-__'),
        overdue_justification TEXT NOT NULL,
        UNIQUE (session_id, standard_id))
;
CREATE TABLE readings (
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
        WITHOUT ROWID
;
CREATE TABLE resistor_checks (
        id INTEGER PRIMARY KEY,
        session_id INTEGER NOT NULL REFERENCES calibration_sessions (id) ON DELETE CASCADE,
        range_id INTEGER NOT NULL REFERENCES instrument_ranges (id),
        component TEXT NOT NULL,
        computed_ohms DOUBLE PRECISION NOT NULL CHECK (computed_ohms > 0),
        measured_ohms DOUBLE PRECISION NOT NULL CHECK (measured_ohms > 0),
        tolerance_percent DOUBLE PRECISION NOT NULL CHECK (tolerance_percent >= 0))
;
CREATE TABLE adjustment_notes (
        id INTEGER PRIMARY KEY,
        session_id INTEGER NOT NULL REFERENCES calibration_sessions (id) ON DELETE CASCADE,
        noted_at TEXT NOT NULL,
        note_text TEXT NOT NULL CHECK (length(note_text) > 0))
;
CREATE TABLE record_chain (
        id INTEGER PRIMARY KEY,
        session_id INTEGER NOT NULL UNIQUE REFERENCES calibration_sessions (id),
        previous_digest TEXT NOT NULL,
        digest TEXT NOT NULL UNIQUE CHECK (length(digest) = 64),
        recorded_at TEXT NOT NULL)
;
CREATE INDEX sessions_by_instrument ON calibration_sessions (instrument_id, started_at)
;
CREATE INDEX sessions_by_state ON calibration_sessions (state, instrument_id, started_at)
;
CREATE INDEX resistor_checks_by_session ON resistor_checks (session_id)
;
CREATE INDEX adjustment_notes_by_session ON adjustment_notes (session_id)
;
CREATE INDEX standard_specs_by_standard ON standard_specs (standard_id)
;
CREATE TRIGGER session_standards_frozen_insert BEFORE INSERT ON session_standards WHEN (SELECT state FROM calibration_sessions WHERE id = NEW.session_id) NOT IN ('draft', 'returned') BEGIN SELECT RAISE(ABORT, 'session_standards: the calibration session is submitted or approved, so its contents cannot change (amend an approved record)'); END
;
CREATE TRIGGER session_standards_frozen_update BEFORE UPDATE ON session_standards WHEN (SELECT state FROM calibration_sessions WHERE id = OLD.session_id) NOT IN ('draft', 'returned') OR (SELECT state FROM calibration_sessions WHERE id = NEW.session_id) NOT IN ('draft', 'returned') BEGIN SELECT RAISE(ABORT, 'session_standards: the calibration session is submitted or approved, so its contents cannot change (amend an approved record)'); END
;
CREATE TRIGGER session_standards_frozen_delete BEFORE DELETE ON session_standards WHEN (SELECT state FROM calibration_sessions WHERE id = OLD.session_id) NOT IN ('draft', 'returned') BEGIN SELECT RAISE(ABORT, 'session_standards: the calibration session is submitted or approved, so its contents cannot change (amend an approved record)'); END
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
CREATE TRIGGER sessions_start_as_draft BEFORE INSERT ON calibration_sessions WHEN NEW.state <> 'draft' OR (NEW.supersedes_id IS NOT NULL AND (SELECT state FROM calibration_sessions WHERE id = NEW.supersedes_id) <> 'approved') BEGIN SELECT RAISE(ABORT, 'calibration_sessions: a session starts as a draft, and only an approved session can be amended'); END
;
CREATE TRIGGER sessions_state_flow BEFORE UPDATE OF state ON calibration_sessions WHEN OLD.state <> NEW.state AND NOT ((OLD.state = 'draft' AND NEW.state = 'submitted') OR (OLD.state = 'returned' AND NEW.state IN ('draft', 'submitted')) OR (OLD.state = 'submitted' AND NEW.state IN ('returned', 'approved')) OR (OLD.state = 'approved' AND NEW.state = 'superseded')) BEGIN SELECT RAISE(ABORT, 'calibration_sessions: this change of state is not allowed (draft -> submitted -> approved or returned; approved -> superseded)'); END
;
CREATE TRIGGER sessions_superseded_by_amendment BEFORE UPDATE OF state ON calibration_sessions WHEN OLD.state = 'approved' AND NEW.state = 'superseded' AND NOT EXISTS (SELECT 1 FROM calibration_sessions a WHERE a.supersedes_id = OLD.id AND a.state = 'approved') BEGIN SELECT RAISE(ABORT, 'calibration_sessions: only an approved amendment supersedes a record'); END
;
CREATE TRIGGER sessions_reviewer BEFORE UPDATE OF state ON calibration_sessions WHEN NEW.state IN ('approved', 'returned') AND OLD.state = 'submitted' AND (NEW.reviewer_id IS NULL OR NEW.reviewer_id = NEW.technician_id OR NOT EXISTS (SELECT 1 FROM users u WHERE u.id = NEW.reviewer_id AND u.active = 1 AND u.role IN ('reviewer', 'administrator'))) BEGIN SELECT RAISE(ABORT, 'calibration_sessions: the reviewer must be an active reviewer or administrator other than the technician'); END
;
CREATE TRIGGER sessions_standards_in_date BEFORE UPDATE OF state ON calibration_sessions WHEN NEW.state = 'submitted' AND OLD.state <> 'submitted' AND EXISTS (SELECT 1 FROM session_standards u WHERE u.session_id = NEW.id AND u.due_date < substr(CASE WHEN NEW.supersedes_id IS NULL THEN NEW.submitted_at ELSE NEW.started_at END, 1, 10) AND length(trim(u.overdue_justification)) = 0) BEGIN SELECT RAISE(ABORT, 'calibration_sessions: a reference standard used is past its due date and no justification is recorded'); END
;
CREATE TRIGGER sessions_approved_frozen BEFORE UPDATE ON calibration_sessions WHEN OLD.state IN ('approved', 'superseded') AND NOT (OLD.state = 'approved' AND NEW.state = 'superseded' AND OLD.id IS NEW.id AND OLD.instrument_id IS NEW.instrument_id AND OLD.technician_id IS NEW.technician_id AND OLD.started_at IS NEW.started_at AND OLD.finished_at IS NEW.finished_at AND OLD.ambient_celsius IS NEW.ambient_celsius AND OLD.relative_humidity_percent IS NEW.relative_humidity_percent AND OLD.method IS NEW.method AND OLD.decision_rule IS NEW.decision_rule AND OLD.guard_factor IS NEW.guard_factor AND OLD.outcome IS NEW.outcome AND OLD.submitted_at IS NEW.submitted_at AND OLD.return_comment IS NEW.return_comment AND OLD.returned_at IS NEW.returned_at AND OLD.reviewer_id IS NEW.reviewer_id AND OLD.approved_at IS NEW.approved_at AND OLD.revision IS NEW.revision AND OLD.supersedes_id IS NEW.supersedes_id AND OLD.amendment_reason IS NEW.amendment_reason AND OLD.amended_at IS NEW.amended_at) BEGIN SELECT RAISE(ABORT, 'calibration_sessions: an approved record cannot be changed; amend it with a reason instead'); END
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
CREATE TRIGGER record_chain_approved_only BEFORE INSERT ON record_chain WHEN (SELECT state FROM calibration_sessions WHERE id = NEW.session_id) IS NOT 'approved' BEGIN SELECT RAISE(ABORT, 'record_chain: only an approved session enters the chain'); END
;
CREATE TRIGGER record_chain_append_only_update BEFORE UPDATE ON record_chain BEGIN SELECT RAISE(ABORT, 'record_chain: the chain of approved records is append-only'); END
;
CREATE TRIGGER record_chain_append_only_delete BEFORE DELETE ON record_chain BEGIN SELECT RAISE(ABORT, 'record_chain: the chain of approved records is append-only'); END
;
CREATE TRIGGER users_kept BEFORE DELETE ON users BEGIN SELECT RAISE(ABORT, 'users: a user is deactivated, never deleted, so that records keep their signatures'); END
;
CREATE TRIGGER session_standards_current_insert BEFORE INSERT ON session_standards WHEN NOT EXISTS (SELECT 1 FROM reference_standards r WHERE r.id = NEW.standard_id AND r.certificate_number = NEW.certificate_number AND r.due_date = NEW.due_date) AND NOT EXISTS (SELECT 1 FROM calibration_sessions s JOIN session_standards o ON o.session_id = s.supersedes_id WHERE s.id = NEW.session_id AND o.standard_id = NEW.standard_id AND o.certificate_number = NEW.certificate_number AND o.due_date = NEW.due_date) BEGIN SELECT RAISE(ABORT, 'session_standards: the certificate number and due date must be those of the reference standard''s current certificate (or, in an amendment, those of the record it supersedes)'); END
;
CREATE TRIGGER session_standards_current_update BEFORE UPDATE ON session_standards WHEN (OLD.session_id IS NOT NEW.session_id OR OLD.standard_id IS NOT NEW.standard_id OR OLD.certificate_number IS NOT NEW.certificate_number OR OLD.due_date IS NOT NEW.due_date) AND NOT EXISTS (SELECT 1 FROM reference_standards r WHERE r.id = NEW.standard_id AND r.certificate_number = NEW.certificate_number AND r.due_date = NEW.due_date) AND NOT EXISTS (SELECT 1 FROM calibration_sessions s JOIN session_standards o ON o.session_id = s.supersedes_id WHERE s.id = NEW.session_id AND o.standard_id = NEW.standard_id AND o.certificate_number = NEW.certificate_number AND o.due_date = NEW.due_date) BEGIN SELECT RAISE(ABORT, 'session_standards: the certificate number and due date must be those of the reference standard''s current certificate (or, in an amendment, those of the record it supersedes)'); END
;
CREATE TRIGGER instruments_conformity_kept BEFORE UPDATE ON instruments WHEN (OLD.asset_tag IS NOT NEW.asset_tag OR OLD.serial IS NOT NEW.serial OR OLD.kind IS NOT NEW.kind OR OLD.movement_amps_fs IS NOT NEW.movement_amps_fs OR OLD.movement_ohms IS NOT NEW.movement_ohms OR OLD.scale_type IS NOT NEW.scale_type OR OLD.scale_divisions IS NOT NEW.scale_divisions OR OLD.accuracy_class IS NOT NEW.accuracy_class) AND EXISTS (SELECT 1 FROM calibration_sessions s WHERE s.instrument_id = OLD.id AND s.state IN ('approved', 'superseded')) BEGIN SELECT RAISE(ABORT, 'instruments: an approved calibration record refers to this instrument, so its asset tag, serial, kind, movement, scale and accuracy class cannot change; register a new instrument or amend the record'); END
;
CREATE TRIGGER instrument_ranges_conformity_kept BEFORE UPDATE ON instrument_ranges WHEN (OLD.instrument_id IS NOT NEW.instrument_id OR OLD.label IS NOT NEW.label OR OLD.unit IS NOT NEW.unit OR OLD.lower_limit IS NOT NEW.lower_limit OR OLD.full_scale IS NOT NEW.full_scale OR OLD.fiducial_value IS NOT NEW.fiducial_value) AND EXISTS (SELECT 1 FROM calibration_sessions s WHERE s.instrument_id = OLD.instrument_id AND s.state IN ('approved', 'superseded')) BEGIN SELECT RAISE(ABORT, 'instrument_ranges: an approved calibration record refers to this instrument, so a range''s label, unit, limits and fiducial value cannot change; register a new instrument or amend the record'); END
;
CREATE TRIGGER users_signature_kept BEFORE UPDATE ON users WHEN (OLD.login IS NOT NEW.login OR OLD.full_name IS NOT NEW.full_name) AND EXISTS (SELECT 1 FROM calibration_sessions s WHERE (s.technician_id = OLD.id OR s.reviewer_id = OLD.id) AND s.state IN ('approved', 'superseded')) BEGIN SELECT RAISE(ABORT, 'users: this user signed approved calibration records, so the login and name cannot change; add a new user and deactivate this one'); END
;
