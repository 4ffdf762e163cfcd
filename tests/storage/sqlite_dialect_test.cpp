// Every integrity rule the database enforces, tried with raw SQL on the file (as another
// program would) and refused with a message naming the rule.
#include "storage/sqlite_dialect.h"

#include "tests/storage/workbook_fixture.h"

#include <catch2/catch.hpp>

using mwtest::rawExec;

namespace {

struct Records {
    mwtest::TempWorkbook temp;
    mwtest::Seed seed;
    std::int64_t draftId = 0;
    std::int64_t submittedId = 0;
    std::int64_t approvedId = 0;

    Records() {
        auto workbook = temp.open();
        seed = mwtest::seed(*workbook);
        mw::storage::SessionRepository sessions(*workbook);
        mw::CalibrationSession draft = mwtest::draft(seed, mwtest::at(2025, 3, 1));
        sessions.create(draft);
        draftId = draft.id;
        // The copy of its range a draft is submitted with, so that a raw submission below
        // meets every rule but the one each test tries.
        REQUIRE(rawExec(temp.path(), QStringLiteral("INSERT INTO session_ranges (session_id, "
                                                    "range_id, signal, resistor_ohms, "
                                                    "divisions) VALUES (%1, %2, 'dc', 198800, "
                                                    "50)")
                                         .arg(draftId)
                                         .arg(seed.instrument.ranges[0].id))
                    .isEmpty());
        mw::CalibrationSession submitted = mwtest::draft(seed, mwtest::at(2025, 3, 2));
        sessions.create(submitted);
        sessions.submit(submitted.id, mwtest::at(2025, 3, 2, 15));
        submittedId = submitted.id;
        mw::CalibrationSession approved = mwtest::draft(seed, mwtest::at(2025, 3, 3));
        sessions.create(approved);
        sessions.submit(approved.id, mwtest::at(2025, 3, 3, 15));
        sessions.approve(approved.id, mwtest::signer(*workbook, seed.reviewer),
                         mwtest::at(2025, 3, 4));
        approvedId = approved.id;
    }
    QString sql(const QString& statement) const { return rawExec(temp.path(), statement); }
    QString arg(QString text) const {
        return text.replace(QStringLiteral("{draft}"), QString::number(draftId))
            .replace(QStringLiteral("{submitted}"), QString::number(submittedId))
            .replace(QStringLiteral("{approved}"), QString::number(approvedId))
            .replace(QStringLiteral("{tech}"), QString::number(seed.technician.id))
            .replace(QStringLiteral("{reviewer}"), QString::number(seed.reviewer.id))
            .replace(QStringLiteral("{range}"), QString::number(seed.instrument.ranges[0].id))
            .replace(QStringLiteral("{amp_range}"), QString::number(seed.instrument.ranges[1].id))
            .replace(QStringLiteral("{instrument}"), QString::number(seed.instrument.id));
    }
    // Runs the statement and returns the error (empty when SQLite accepted it).
    QString attempt(const char* statement) const { return sql(arg(QString::fromUtf8(statement))); }
    // The first column of the first row of a query, read on its own connection.
    QString value(const char* query) const {
        const QString name = QStringLiteral("value-connection");
        QString result;
        {
            QSqlDatabase db = QSqlDatabase::addDatabase(QStringLiteral("QSQLITE"), name);
            db.setDatabaseName(temp.path());
            REQUIRE(db.open());
            QSqlQuery q(db);
            REQUIRE(q.exec(arg(QString::fromUtf8(query))));
            REQUIRE(q.next());
            result = q.value(0).toString();
            db.close();
        }
        QSqlDatabase::removeDatabase(name);
        return result;
    }
};

const QString kNeverReplaced = QStringLiteral("rows are never replaced");

} // namespace

TEST_CASE("an approved session and its parts cannot be changed or deleted", "[integrity]") {
    Records r;
    CHECK(r.attempt("UPDATE calibration_sessions SET method = 'x' WHERE id = {approved}")
              .contains(QStringLiteral("an approved record cannot be changed")));
    CHECK(r.attempt("UPDATE calibration_sessions SET state = 'draft' WHERE id = {approved}")
              .contains(QStringLiteral("calibration_sessions:")));
    CHECK(r.attempt("DELETE FROM calibration_sessions WHERE id = {approved}")
              .contains(QStringLiteral("only a draft can be deleted")));
    CHECK(r.attempt("UPDATE readings SET indicated = 9.9 WHERE session_id = {approved}")
              .contains(QStringLiteral("readings: the calibration session is submitted or "
                                       "approved")));
    CHECK(r.attempt("DELETE FROM readings WHERE session_id = {approved}")
              .contains(QStringLiteral("readings:")));
    CHECK(r.attempt("INSERT INTO readings (session_id, range_id, point_index, direction, phase, "
                    "repeat_number, unit, applied, indicated) VALUES ({approved}, {range}, 9, "
                    "'up', 'as-left', 1, 'V', 1, 1)")
              .contains(QStringLiteral("readings:")));
    CHECK(r.attempt("UPDATE resistor_checks SET measured_ohms = 1 WHERE session_id = {approved}")
              .contains(QStringLiteral("resistor_checks:")));
    CHECK(r.attempt("DELETE FROM adjustment_notes WHERE session_id = {approved}")
              .contains(QStringLiteral("adjustment_notes:")));
    CHECK(r.attempt("UPDATE session_standards SET due_date = '2099-01-01' WHERE session_id = "
                    "{approved}")
              .contains(QStringLiteral("session_standards:")));
    // Superseding without an approved amendment is refused too.
    CHECK(r.attempt("UPDATE calibration_sessions SET state = 'superseded' WHERE id = {approved}")
              .contains(QStringLiteral("only an approved amendment supersedes")));
}

TEST_CASE("a submitted session is frozen until the reviewer returns it", "[integrity]") {
    Records r;
    CHECK(r.attempt("UPDATE calibration_sessions SET method = 'x' WHERE id = {submitted}")
              .contains(QStringLiteral("a submitted session cannot be edited")));
    CHECK(r.attempt("UPDATE readings SET indicated = 9.9 WHERE session_id = {submitted}")
              .contains(QStringLiteral("readings:")));
    // A draft is still editable by the same raw SQL.
    CHECK(r.attempt("UPDATE readings SET indicated = 9.9 WHERE session_id = {draft}").isEmpty());
}

TEST_CASE("the reviewer is never the technician and must be a reviewer", "[integrity]") {
    Records r;
    CHECK(r.attempt("UPDATE calibration_sessions SET state = 'approved', reviewer_id = {tech}, "
                    "approved_at = '2025-03-05T10:00:00+00:00' WHERE id = {submitted}")
              .contains(QStringLiteral("reviewer")));
    CHECK(r.attempt("UPDATE calibration_sessions SET reviewer_id = {tech} WHERE id = {draft}")
              .contains(QStringLiteral("CHECK constraint failed")));
    // A technician who is not the session's technician still cannot approve.
    REQUIRE(r.attempt("INSERT INTO users (login, full_name, role, active, password_hash) VALUES "
                      "('tom', 'Tom', 'technician', 1, '$argon2id$x')")
                .isEmpty());
    CHECK(r.attempt("UPDATE calibration_sessions SET state = 'approved', reviewer_id = (SELECT "
                    "id FROM users WHERE login = 'tom'), approved_at = '2025-03-05T10:00:00+00:00' "
                    "WHERE id = {submitted}")
              .contains(QStringLiteral("must be an active reviewer or administrator")));
}

TEST_CASE("no submission with a standard past due unless justified", "[integrity]") {
    Records r;
    // The seeded standard is due 2025-06-30.
    CHECK(r.attempt("UPDATE calibration_sessions SET state = 'submitted', outcome = 'pass', "
                    "submitted_at = "
                    "'2025-07-10T09:00:00+00:00' WHERE id = {draft}")
              .contains(QStringLiteral("past its due date")));
    REQUIRE(r.attempt("UPDATE session_standards SET overdue_justification = 'Checked against "
                      "the second calibrator the same day' WHERE session_id = {draft}")
                .isEmpty());
    CHECK(r.attempt("UPDATE calibration_sessions SET state = 'submitted', outcome = 'pass', "
                    "submitted_at = "
                    "'2025-07-10T09:00:00+00:00' WHERE id = {draft}")
              .isEmpty());
}

TEST_CASE("the workflow cannot be skipped", "[integrity]") {
    Records r;
    CHECK(r.attempt("UPDATE calibration_sessions SET state = 'approved', reviewer_id = "
                    "{reviewer}, approved_at = '2025-03-05T10:00:00+00:00', submitted_at = "
                    "'2025-03-05T09:00:00+00:00' WHERE id = {draft}")
              .contains(QStringLiteral("this change of state is not allowed")));
    CHECK(r.attempt(
               "INSERT INTO calibration_sessions (instrument_id, technician_id, started_at, "
               "ambient_celsius, relative_humidity_percent, method, decision_rule, "
               "guard_factor, state, submitted_at, return_comment, reviewer_id, "
               "approved_at, revision, amendment_reason) VALUES ({instrument}, {tech}, "
               "'2025-01-01T00:00:00+00:00', 23, 50, '', 'simple', 0, 'approved', "
               "'2025-01-01T00:00:00+00:00', '', {reviewer}, '2025-01-01T00:00:00+00:00', 1, '')")
              .contains(QStringLiteral("a session starts as a draft")));
    CHECK(r.attempt("UPDATE calibration_sessions SET state = 'returned', reviewer_id = "
                    "{reviewer} WHERE id = {submitted}")
              .contains(QStringLiteral("CHECK constraint failed"))); // a comment is required
    CHECK(r.attempt("INSERT INTO record_chain (session_id, previous_digest, digest, recorded_at) "
                    "VALUES ({draft}, '', printf('%064d', 1), '2025-01-01T00:00:00+00:00')")
              .contains(QStringLiteral("only an approved session enters the chain")));
    CHECK(r.attempt("UPDATE record_chain SET digest = printf('%064d', 2)")
              .contains(QStringLiteral("append-only")));
    CHECK(r.attempt("DELETE FROM record_chain").contains(QStringLiteral("append-only")));
}

TEST_CASE("enumerations, units and foreign keys are constrained", "[integrity]") {
    Records r;
    // An instrument no approved record refers to, so only the CHECKs answer.
    REQUIRE(r.attempt("INSERT INTO instruments (asset_tag, description, manufacturer, model, "
                      "serial, kind, movement_amps_fs, movement_ohms, scale_type, "
                      "scale_divisions, accuracy_class, interval_days, location, owner, status) "
                      "VALUES ('RAW-1', '', '', '', '', 'dc-voltmeter', 0.001, 100, "
                      "'zero-at-end', 50, 2.5, 365, '', '', 'in-service')")
                .isEmpty());
    REQUIRE(r.attempt("INSERT INTO instrument_ranges (instrument_id, sort_order, label, unit, "
                      "lower_limit, full_scale) VALUES ((SELECT id FROM instruments WHERE "
                      "asset_tag = 'RAW-1'), 0, '10 V', 'V', 0, 10)")
                .isEmpty());
    CHECK(r.attempt("UPDATE instruments SET kind = 'digital-multimeter' WHERE asset_tag = "
                    "'RAW-1'")
              .contains(QStringLiteral("CHECK constraint failed")));
    CHECK(r.attempt("UPDATE instruments SET status = 'lost'")
              .contains(QStringLiteral("CHECK constraint failed")));
    CHECK(r.attempt("UPDATE users SET role = 'guest'")
              .contains(QStringLiteral("CHECK constraint failed")));
    CHECK(r.attempt("UPDATE instrument_ranges SET unit = 'mV' WHERE label = '10 V' AND "
                    "instrument_id <> {instrument}")
              .contains(QStringLiteral("CHECK constraint failed")));
    CHECK(r.attempt("UPDATE readings SET direction = 'sideways' WHERE session_id = {draft}")
              .contains(QStringLiteral("CHECK constraint failed")));
    CHECK(r.attempt("UPDATE readings SET phase = 'as-seen' WHERE session_id = {draft}")
              .contains(QStringLiteral("CHECK constraint failed")));
    CHECK(r.attempt("UPDATE calibration_sessions SET decision_rule = 'lenient' WHERE id = "
                    "{draft}")
              .contains(QStringLiteral("CHECK constraint failed")));
    // A reading in amperes on a volt range, or on another instrument's range.
    CHECK(r.attempt("UPDATE readings SET unit = 'A' WHERE session_id = {draft}")
              .contains(QStringLiteral("the unit is not the range's")));
    CHECK(r.attempt("INSERT INTO readings (session_id, range_id, point_index, direction, phase, "
                    "repeat_number, unit, applied, indicated) VALUES ({draft}, {amp_range}, 0, "
                    "'up', 'as-found', 1, 'V', 1, 1)")
              .contains(QStringLiteral("readings:")));
    CHECK(r.attempt("INSERT INTO calibration_sessions (instrument_id, technician_id, started_at, "
                    "ambient_celsius, relative_humidity_percent, method, decision_rule, "
                    "guard_factor, state, return_comment, revision, amendment_reason, "
                    "record_format, readability_fraction, coverage_probability, "
                    "reference_celsius, phases) VALUES (9999, {tech}, "
                    "'2025-01-01T00:00:00+00:00', 23, 50, '', 'simple', 0, 'draft', '', 1, '', 2, "
                    "0.2, 0.95, 23, 'as-found')")
              .contains(QStringLiteral("FOREIGN KEY constraint failed")));
    CHECK(r.attempt("DELETE FROM instruments WHERE id = {instrument}")
              .contains(QStringLiteral("FOREIGN KEY constraint failed")));
    CHECK(r.attempt("DELETE FROM users WHERE id = {tech}")
              .contains(QStringLiteral("deactivated, never deleted")));
}

TEST_CASE("the audit log is append-only", "[integrity]") {
    Records r;
    CHECK(r.attempt("UPDATE audit_log SET user_id = NULL").contains(QStringLiteral("append-only")));
    CHECK(r.attempt("DELETE FROM audit_log").contains(QStringLiteral("append-only")));
}

TEST_CASE("the accuracy class is a class index of IEC 60051-2", "[integrity]") {
    Records r;
    const char* insert =
        "INSERT INTO instruments (asset_tag, description, manufacturer, model, serial, kind, "
        "movement_amps_fs, movement_ohms, scale_type, scale_divisions, accuracy_class, "
        "interval_days, location, owner, status) VALUES ('RAW-%1', '', '', '', '', "
        "'dc-voltmeter', 0.001, 100, 'zero-at-end', 50, %1, 365, '', '', 'in-service')";
    // IEC 60051-2 class indices (from memory; core/accuracy/accuracy_class.cpp holds the series).
    for (const char* index :
         {"0.05", "0.1", "0.2", "0.3", "0.5", "1", "1.5", "2", "2.5", "3", "5"}) {
        CAPTURE(index);
        CHECK(r.sql(QString::fromUtf8(insert).arg(QString::fromUtf8(index))).isEmpty());
    }
    for (const char* index : {"4", "0.25", "1.0001", "10", "0"}) {
        CAPTURE(index);
        CHECK(r.sql(QString::fromUtf8(insert).arg(QString::fromUtf8(index)))
                  .contains(QStringLiteral("CHECK constraint failed")));
    }
}

TEST_CASE("a session's copy of a standard's certificate is the standard's current one",
          "[integrity]") {
    Records r;
    // The seeded standard holds CERT-2024-117, due 2025-06-30.
    CHECK(r.attempt("UPDATE session_standards SET due_date = '2099-01-01' WHERE session_id = "
                    "{draft}")
              .contains(QStringLiteral("session_standards: the certificate number and due date "
                                       "must be those of the reference standard's current")));
    CHECK(r.attempt("UPDATE session_standards SET certificate_number = 'CERT-FORGED' WHERE "
                    "session_id = {draft}")
              .contains(QStringLiteral("current certificate")));
    REQUIRE(r.attempt("INSERT INTO reference_standards (asset_tag, description, "
                      "certificate_number, due_date) VALUES ('STD-02', 'Shunt', 'C-2', "
                      "'2025-05-01')")
                .isEmpty());
    CHECK(r.attempt("INSERT INTO session_standards (session_id, standard_id, certificate_number, "
                    "due_date, overdue_justification) VALUES ({draft}, (SELECT id FROM "
                    "reference_standards WHERE asset_tag = 'STD-02'), 'C-2', '2099-01-01', '')")
              .contains(QStringLiteral("current certificate")));
    CHECK(r.attempt("INSERT INTO session_standards (session_id, standard_id, certificate_number, "
                    "due_date, overdue_justification) VALUES ({draft}, (SELECT id FROM "
                    "reference_standards WHERE asset_tag = 'STD-02'), 'C-2', '2025-05-01', '')")
              .isEmpty());
    // The justification stays the way to submit with an overdue standard.
    CHECK(r.attempt("UPDATE calibration_sessions SET state = 'submitted', outcome = 'pass', "
                    "submitted_at = "
                    "'2025-05-10T09:00:00+00:00' WHERE id = {draft}")
              .contains(QStringLiteral("past its due date")));
    REQUIRE(r.attempt("UPDATE session_standards SET overdue_justification = 'Cross-checked "
                      "against STD-01 the same day' WHERE session_id = {draft}")
                .isEmpty());
    CHECK(r.attempt("UPDATE calibration_sessions SET state = 'submitted', outcome = 'pass', "
                    "submitted_at = "
                    "'2025-05-10T09:00:00+00:00' WHERE id = {draft}")
              .isEmpty());
}

TEST_CASE("recalibrating a standard: new sessions copy the new certificate, amendments keep the "
          "old one",
          "[integrity]") {
    Records r;
    mw::storage::Workbook workbook(r.temp.path());
    mw::storage::StandardRepository standards(workbook);
    mw::ReferenceStandard recalibrated = r.seed.standard;
    recalibrated.certificate_number = "CERT-2025-044";
    recalibrated.due_date = mwtest::date(2026, 6, 30);
    standards.update(recalibrated);
    REQUIRE(standards.find(recalibrated.id)->certificate_number == "CERT-2025-044");

    mw::storage::SessionRepository sessions(workbook);
    mw::CalibrationSession later = mwtest::draft(r.seed, mwtest::at(2025, 9, 1));
    sessions.create(later); // empty copy: the current certificate is taken
    CHECK(sessions.find(later.id)->standards.at(0).certificate_number == "CERT-2025-044");
    sessions.submit(later.id, mwtest::at(2025, 9, 1, 15));

    mw::CalibrationSession stale = mwtest::draft(r.seed, mwtest::at(2025, 9, 2));
    stale.standards = {{r.seed.standard.id, "CERT-2024-117", mwtest::date(2025, 6, 30), ""}};
    CHECK_THROWS_WITH(sessions.create(stale),
                      Catch::Contains("reference standard's current certificate"));

    // The approved record of 2025-03-03 used CERT-2024-117; its amendment, filed after the
    // recalibration and after the old due date, carries that copy over.
    const std::int64_t amendment =
        sessions.amend(r.approvedId, r.seed.technician.id,
                       QStringLiteral("Value copied wrongly at point 3"), mwtest::at(2025, 9, 3));
    CHECK(sessions.find(amendment)->standards.at(0).certificate_number == "CERT-2024-117");
    sessions.submit(amendment, mwtest::at(2025, 9, 3, 10));
    sessions.approve(amendment, mwtest::signer(workbook, r.seed.reviewer),
                     mwtest::at(2025, 9, 3, 12));
    CHECK(sessions.find(r.approvedId)->state == mw::SessionState::Superseded);
}

TEST_CASE("a session's times run forward", "[integrity]") {
    Records r;
    // The draft started 2025-03-01 09:00 and finished at 11:00.
    CHECK(r.attempt("UPDATE calibration_sessions SET state = 'submitted', outcome = 'pass', "
                    "submitted_at = "
                    "'2025-02-28T09:00:00+00:00' WHERE id = {draft}")
              .contains(QStringLiteral("CHECK constraint failed")));
    CHECK(r.attempt("UPDATE calibration_sessions SET state = 'submitted', outcome = 'pass', "
                    "submitted_at = "
                    "'2025-03-01T10:00:00+00:00' WHERE id = {draft}")
              .contains(QStringLiteral("CHECK constraint failed")));
    // The submitted one went in at 2025-03-02 15:00.
    CHECK(r.attempt("UPDATE calibration_sessions SET state = 'approved', reviewer_id = "
                    "{reviewer}, approved_at = '2025-03-02T14:00:00+00:00' WHERE id = {submitted}")
              .contains(QStringLiteral("CHECK constraint failed")));
    CHECK(r.attempt("UPDATE calibration_sessions SET state = 'approved', reviewer_id = "
                    "{reviewer}, approved_at = '2025-03-02T16:00:00+00:00' WHERE id = {submitted}")
              .isEmpty());
    CHECK(r.attempt("UPDATE calibration_sessions SET state = 'submitted', outcome = 'pass', "
                    "submitted_at = "
                    "'2025-03-01T11:00:00+00:00' WHERE id = {draft}")
              .isEmpty());
}

TEST_CASE("what an approved record's conformity rests on cannot change under it", "[integrity]") {
    Records r;
    const QString kept = QStringLiteral("register a new instrument or amend the record");
    for (const char* edit :
         {"UPDATE instruments SET accuracy_class = 5 WHERE id = {instrument}",
          "UPDATE instruments SET serial = 'S/N 9' WHERE id = {instrument}",
          "UPDATE instruments SET asset_tag = 'VM-999' WHERE id = {instrument}",
          "UPDATE instruments SET kind = 'dc-voltmeter' WHERE id = {instrument}",
          "UPDATE instruments SET movement_amps_fs = 1e-4 WHERE id = {instrument}",
          "UPDATE instruments SET movement_ohms = 1000 WHERE id = {instrument}",
          "UPDATE instruments SET scale_type = 'no-zero' WHERE id = {instrument}",
          "UPDATE instruments SET scale_divisions = 100 WHERE id = {instrument}",
          "UPDATE instrument_ranges SET full_scale = full_scale * 2 WHERE id = {range}",
          "UPDATE instrument_ranges SET lower_limit = -10 WHERE id = {range}",
          "UPDATE instrument_ranges SET label = '20 V' WHERE id = {range}",
          "UPDATE instrument_ranges SET fiducial_value = 2e-3 WHERE id = {amp_range}"}) {
        CAPTURE(edit);
        CHECK(r.attempt(edit).contains(kept));
    }
    CHECK(r.attempt("UPDATE users SET full_name = 'Someone Else' WHERE id = {reviewer}")
              .contains(QStringLiteral("users: this user signed approved calibration records")));
    CHECK(r.attempt("UPDATE users SET login = 'tess2' WHERE id = {tech}")
              .contains(QStringLiteral("signed approved")));
    // What may change after approval: where it is, who owns it, its state and interval, and a
    // range's nominal resistor after an adjustment.
    for (const char* edit :
         {"UPDATE instruments SET location = 'Store', owner = 'Lab', status = 'out-of-service', "
          "interval_days = 730, description = 'Panel voltmeter' WHERE id = {instrument}",
          "UPDATE instrument_ranges SET nominal_ohms = 198700 WHERE id = {range}",
          "UPDATE instruments SET accuracy_class = accuracy_class WHERE id = {instrument}",
          "UPDATE users SET active = 0 WHERE id = {tech}",
          "UPDATE users SET full_name = 'Ada Admin-Smith' WHERE login = 'ada'"}) {
        CAPTURE(edit);
        CHECK(r.attempt(edit).isEmpty());
    }
    // Through the repository the refusal is a WorkbookError naming the rule.
    mw::storage::Workbook workbook(r.temp.path());
    mw::Instrument changed = r.seed.instrument;
    changed.accuracy_class = 2.5;
    CHECK_THROWS_WITH(mw::storage::InstrumentRepository(workbook).update(changed),
                      Catch::Contains("register a new instrument"));
}

TEST_CASE("an instrument without approved records may still be corrected", "[integrity]") {
    mwtest::TempWorkbook temp;
    {
        auto workbook = temp.open();
        const mwtest::Seed seed = mwtest::seed(*workbook);
        mw::storage::SessionRepository sessions(*workbook);
        mw::CalibrationSession submitted = mwtest::draft(seed, mwtest::at(2025, 3, 2));
        sessions.create(submitted);
        sessions.submit(submitted.id, mwtest::at(2025, 3, 2, 15));
    }
    CHECK(rawExec(temp.path(), QStringLiteral("UPDATE instruments SET accuracy_class = 2.5, "
                                              "serial = 'S/N 4712'"))
              .isEmpty());
    CHECK(rawExec(temp.path(), QStringLiteral("UPDATE instrument_ranges SET full_scale = 20 "
                                              "WHERE label = '10 V'"))
              .isEmpty());
}

// REPLACE conflict resolution deletes the row holding the key without firing DELETE triggers
// (recursive_triggers is off, as in any sqlite3 shell), so each form is refused before it runs.
TEST_CASE("INSERT OR REPLACE cannot swap out a record's row", "[integrity]") {
    Records r;
    SECTION("an approved session re-inserted as a draft") {
        CHECK(r.attempt("INSERT OR REPLACE INTO calibration_sessions (id, instrument_id, "
                        "technician_id, started_at, ambient_celsius, relative_humidity_percent, "
                        "method, decision_rule, guard_factor, state, return_comment, revision, "
                        "amendment_reason) SELECT id, instrument_id, technician_id, started_at, "
                        "ambient_celsius, relative_humidity_percent, method, decision_rule, "
                        "guard_factor, 'draft', '', 1, '' FROM calibration_sessions WHERE id = "
                        "{approved}")
                  .contains(QStringLiteral(
                      "calibration_sessions: a row with this calibration_sessions.id")));
        CHECK(r.value("SELECT state FROM calibration_sessions WHERE id = {approved}") ==
              QStringLiteral("approved"));
    }
    SECTION("a signer renamed by id or by login") {
        CHECK(r.attempt("INSERT OR REPLACE INTO users (id, login, full_name, role, active, "
                        "password_hash) VALUES ({reviewer}, 'rory', 'Someone Else', 'reviewer', "
                        "1, '$argon2id$x')")
                  .contains(QStringLiteral("users: a row with this")));
        CHECK(r.attempt("INSERT OR REPLACE INTO users (login, full_name, role, active, "
                        "password_hash) VALUES ('rory', 'Someone Else', 'reviewer', 1, "
                        "'$argon2id$x')")
                  .contains(QStringLiteral("a row with this users.login")));
        CHECK(r.value("SELECT full_name FROM users WHERE id = {reviewer}") ==
              QStringLiteral("Rory Review"));
        CHECK(r.value("SELECT count(*) FROM users") == QStringLiteral("3"));
    }
    SECTION("the lab identity replaced instead of updated") {
        CHECK(r.attempt("INSERT INTO lab (id, name, address) SELECT 1, 'Bench Lab', 'Street 1' "
                        "WHERE NOT EXISTS (SELECT 1 FROM lab)")
                  .isEmpty());
        const QString name = r.value("SELECT name FROM lab");
        CHECK(r.attempt("INSERT OR REPLACE INTO lab (id, name, address) VALUES (1, 'Other', "
                        "'Elsewhere')")
                  .contains(QStringLiteral("lab: a row with this lab.id")));
        CHECK(r.value("SELECT name FROM lab") == name);
    }
    SECTION("a digest of the chain swapped") {
        const QString digest = r.value("SELECT digest FROM record_chain");
        CHECK(r.attempt("INSERT OR REPLACE INTO record_chain (id, session_id, previous_digest, "
                        "digest, recorded_at) SELECT id, session_id, previous_digest, "
                        "printf('%064d', 0), recorded_at FROM record_chain WHERE session_id = "
                        "{approved}")
                  .contains(kNeverReplaced));
        CHECK(r.value("SELECT digest FROM record_chain") == digest);
    }
    SECTION("an audit entry overwritten") {
        const QString count = r.value("SELECT count(*) FROM audit_log");
        const QString first = r.value("SELECT table_name || action FROM audit_log ORDER BY id");
        CHECK(r.attempt("INSERT OR REPLACE INTO audit_log (id, at, table_name, row_id, action) "
                        "VALUES ((SELECT min(id) FROM audit_log), '2025-01-01T00:00:00+00:00', "
                        "'lab', 1, 'update')")
                  .contains(QStringLiteral("a row with this audit_log.id")));
        CHECK(r.value("SELECT count(*) FROM audit_log") == count);
        CHECK(r.value("SELECT table_name || action FROM audit_log ORDER BY id") == first);
        CHECK(r.attempt("INSERT OR REPLACE INTO audit_context (id, user_id) VALUES (1, "
                        "{reviewer})")
                  .contains(kNeverReplaced));
    }
    SECTION("a reading of an approved session") {
        const QString sum = r.value("SELECT sum(indicated) FROM readings WHERE session_id = "
                                    "{approved}");
        CHECK(r.attempt("INSERT OR REPLACE INTO readings SELECT session_id, range_id, "
                        "point_index, direction, phase, repeat_number, unit, applied, indicated "
                        "+ 1 FROM readings WHERE session_id = {approved} LIMIT 1")
                  .contains(QStringLiteral("readings:")));
        CHECK(r.value("SELECT sum(indicated) FROM readings WHERE session_id = {approved}") == sum);
    }
    SECTION("a standard row of an approved session taken over by a draft") {
        CHECK(r.attempt("INSERT OR REPLACE INTO session_standards (id, session_id, standard_id, "
                        "certificate_number, due_date, overdue_justification) SELECT id, "
                        "{draft}, standard_id, certificate_number, due_date, '' FROM "
                        "session_standards WHERE session_id = {approved}")
                  .contains(kNeverReplaced));
        CHECK(r.value("SELECT count(*) FROM session_standards WHERE session_id = {approved}") ==
              QStringLiteral("1"));
    }
    SECTION("a resistor check and a note of an approved session") {
        CHECK(r.attempt("INSERT OR REPLACE INTO resistor_checks (id, session_id, range_id, "
                        "component, computed_ohms, measured_ohms, tolerance_percent) SELECT id, "
                        "{draft}, range_id, 'R9', 1, 1, 1 FROM resistor_checks WHERE session_id "
                        "= {approved}")
                  .contains(QStringLiteral("a row with this resistor_checks.id")));
        CHECK(r.attempt("INSERT OR REPLACE INTO adjustment_notes (id, session_id, noted_at, "
                        "note_text) SELECT id, {draft}, noted_at, 'x' FROM adjustment_notes "
                        "WHERE session_id = {approved}")
                  .contains(QStringLiteral("a row with this adjustment_notes.id")));
        CHECK(r.value("SELECT count(*) FROM resistor_checks WHERE session_id = {approved}") ==
              QStringLiteral("1"));
        CHECK(r.value("SELECT count(*) FROM adjustment_notes WHERE session_id = {approved}") ==
              QStringLiteral("1"));
    }
    SECTION("an instrument, its range or a standard re-registered under its key") {
        CHECK(r.attempt("INSERT OR REPLACE INTO instruments SELECT id, 'VM-NEW', description, "
                        "manufacturer, model, serial, kind, movement_amps_fs, movement_ohms, "
                        "scale_type, scale_divisions, 5, interval_days, location, owner, status "
                        "FROM instruments WHERE id = {instrument}")
                  .contains(QStringLiteral("a row with this instruments.id")));
        CHECK(r.attempt("INSERT OR REPLACE INTO instrument_ranges (instrument_id, sort_order, "
                        "label, unit, lower_limit, full_scale) VALUES ({instrument}, 0, '10 V', "
                        "'V', 0, 20)")
                  .contains(QStringLiteral("instrument_ranges: a row with this "
                                           "instrument_ranges.instrument_id, "
                                           "instrument_ranges.label")));
        CHECK(r.attempt("INSERT OR REPLACE INTO reference_standards (asset_tag, description, "
                        "certificate_number, due_date) VALUES ('STD-01', 'x', 'CERT-X', "
                        "'2099-01-01')")
                  .contains(QStringLiteral(
                      "reference_standards: a row with this reference_standards.asset_tag")));
        CHECK(r.value("SELECT accuracy_class FROM instruments") == QStringLiteral("1.5"));
        CHECK(r.value("SELECT full_scale FROM instrument_ranges WHERE id = {range}") ==
              QStringLiteral("10"));
    }
}

TEST_CASE("UPDATE OR REPLACE cannot move a key onto another row", "[integrity]") {
    Records r;
    SECTION("a draft's standard row renumbered onto an approved session's") {
        CHECK(r.attempt("UPDATE OR REPLACE session_standards SET id = (SELECT id FROM "
                        "session_standards WHERE session_id = {approved}) WHERE session_id = "
                        "{draft}")
                  .contains(QStringLiteral("a row with this session_standards.id")));
        CHECK(r.value("SELECT count(*) FROM session_standards WHERE session_id = {approved}") ==
              QStringLiteral("1"));
    }
    SECTION("a user's login moved onto a signer's") {
        REQUIRE(r.attempt("INSERT INTO users (login, full_name, role, active, password_hash) "
                          "VALUES ('tom', 'Tom', 'technician', 1, '$argon2id$x')")
                    .isEmpty());
        CHECK(r.attempt("UPDATE OR REPLACE users SET login = 'rory' WHERE login = 'tom'")
                  .contains(QStringLiteral("a row with this users.login")));
        CHECK(r.attempt("UPDATE OR REPLACE users SET id = {reviewer} WHERE login = 'tom'")
                  .contains(QStringLiteral("a row with this users.id")));
        CHECK(r.value("SELECT count(*) FROM users") == QStringLiteral("4"));
    }
    SECTION("a draft session renumbered onto an approved one") {
        CHECK(r.attempt("UPDATE OR REPLACE calibration_sessions SET id = {approved} WHERE id = "
                        "{draft}")
                  .contains(QStringLiteral("calibration_sessions:")));
        CHECK(r.value("SELECT state FROM calibration_sessions WHERE id = {approved}") ==
              QStringLiteral("approved"));
    }
    SECTION("a draft's reading moved onto another reading of the draft") {
        const QString count = r.value("SELECT count(*) FROM readings WHERE session_id = {draft}");
        CHECK(r.attempt("UPDATE OR REPLACE readings SET direction = 'down' WHERE session_id = "
                        "{draft} AND direction = 'up'")
                  .contains(QStringLiteral("readings: a row with this readings.session_id")));
        CHECK(r.value("SELECT count(*) FROM readings WHERE session_id = {draft}") == count);
    }
    SECTION("an edit that keeps the keys works; a draft's reading is updated, never replaced") {
        CHECK(r.attempt("UPDATE users SET login = login, active = 1 WHERE id = {tech}").isEmpty());
        CHECK(r.attempt("UPDATE instruments SET location = 'Shelf 4', asset_tag = asset_tag")
                  .isEmpty());
        CHECK(r.attempt("INSERT OR REPLACE INTO readings (session_id, range_id, point_index, "
                        "direction, phase, repeat_number, unit, applied, indicated) VALUES "
                        "({draft}, {range}, 0, 'up', 'as-found', 1, 'V', 2, 2.5)")
                  .contains(kNeverReplaced));
        CHECK(r.attempt("UPDATE readings SET indicated = 2.5 WHERE session_id = {draft} AND "
                        "point_index = 0 AND direction = 'up'")
                  .isEmpty());
        CHECK(r.value("SELECT indicated FROM readings WHERE session_id = {draft} AND "
                      "point_index = 0 AND direction = 'up'") == QStringLiteral("2.5"));
    }
}
