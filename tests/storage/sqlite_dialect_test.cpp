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
        mw::CalibrationSession submitted = mwtest::draft(seed, mwtest::at(2025, 3, 2));
        sessions.create(submitted);
        sessions.submit(submitted.id, mwtest::at(2025, 3, 2, 15));
        submittedId = submitted.id;
        mw::CalibrationSession approved = mwtest::draft(seed, mwtest::at(2025, 3, 3));
        sessions.create(approved);
        sessions.submit(approved.id, mwtest::at(2025, 3, 3, 15));
        sessions.approve(approved.id, seed.reviewer.id, mwtest::at(2025, 3, 4));
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
};

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
                    "approved_at = '2025-03-05T10:00:00Z' WHERE id = {submitted}")
              .contains(QStringLiteral("reviewer")));
    CHECK(r.attempt("UPDATE calibration_sessions SET reviewer_id = {tech} WHERE id = {draft}")
              .contains(QStringLiteral("CHECK constraint failed")));
    // A technician who is not the session's technician still cannot approve.
    REQUIRE(r.attempt("INSERT INTO users (login, full_name, role, active, password_hash) VALUES "
                      "('tom', 'Tom', 'technician', 1, '$argon2id$x')")
                .isEmpty());
    CHECK(r.attempt("UPDATE calibration_sessions SET state = 'approved', reviewer_id = (SELECT "
                    "id FROM users WHERE login = 'tom'), approved_at = '2025-03-05T10:00:00Z' "
                    "WHERE id = {submitted}")
              .contains(QStringLiteral("must be an active reviewer or administrator")));
}

TEST_CASE("no submission with a standard past due unless justified", "[integrity]") {
    Records r;
    // The seeded standard is due 2025-06-30.
    CHECK(r.attempt("UPDATE calibration_sessions SET state = 'submitted', submitted_at = "
                    "'2025-07-10T09:00:00Z' WHERE id = {draft}")
              .contains(QStringLiteral("past its due date")));
    REQUIRE(r.attempt("UPDATE session_standards SET overdue_justification = 'Checked against "
                      "the second calibrator the same day' WHERE session_id = {draft}")
                .isEmpty());
    CHECK(r.attempt("UPDATE calibration_sessions SET state = 'submitted', submitted_at = "
                    "'2025-07-10T09:00:00Z' WHERE id = {draft}")
              .isEmpty());
}

TEST_CASE("the workflow cannot be skipped", "[integrity]") {
    Records r;
    CHECK(r.attempt("UPDATE calibration_sessions SET state = 'approved', reviewer_id = "
                    "{reviewer}, approved_at = '2025-03-05T10:00:00Z', submitted_at = "
                    "'2025-03-05T09:00:00Z' WHERE id = {draft}")
              .contains(QStringLiteral("this change of state is not allowed")));
    CHECK(r.attempt("INSERT INTO calibration_sessions (instrument_id, technician_id, started_at, "
                    "ambient_celsius, relative_humidity_percent, method, decision_rule, "
                    "guard_factor, state, submitted_at, return_comment, reviewer_id, "
                    "approved_at, revision, amendment_reason) VALUES ({instrument}, {tech}, "
                    "'2025-01-01T00:00:00Z', 23, 50, '', 'simple', 0, 'approved', "
                    "'2025-01-01T00:00:00Z', '', {reviewer}, '2025-01-01T00:00:00Z', 1, '')")
              .contains(QStringLiteral("a session starts as a draft")));
    CHECK(r.attempt("UPDATE calibration_sessions SET state = 'returned', reviewer_id = "
                    "{reviewer} WHERE id = {submitted}")
              .contains(QStringLiteral("CHECK constraint failed"))); // a comment is required
    CHECK(r.attempt("INSERT INTO record_chain (session_id, previous_digest, digest, recorded_at) "
                    "VALUES ({draft}, '', printf('%064d', 1), '2025-01-01T00:00:00Z')")
              .contains(QStringLiteral("only an approved session enters the chain")));
    CHECK(r.attempt("UPDATE record_chain SET digest = printf('%064d', 2)")
              .contains(QStringLiteral("append-only")));
    CHECK(r.attempt("DELETE FROM record_chain").contains(QStringLiteral("append-only")));
}

TEST_CASE("enumerations, units and foreign keys are constrained", "[integrity]") {
    Records r;
    CHECK(r.attempt("UPDATE instruments SET kind = 'digital-multimeter'")
              .contains(QStringLiteral("CHECK constraint failed")));
    CHECK(r.attempt("UPDATE instruments SET status = 'lost'")
              .contains(QStringLiteral("CHECK constraint failed")));
    CHECK(r.attempt("UPDATE users SET role = 'guest'")
              .contains(QStringLiteral("CHECK constraint failed")));
    CHECK(r.attempt("UPDATE instrument_ranges SET unit = 'mV'")
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
                    "guard_factor, state, return_comment, revision, amendment_reason) VALUES "
                    "(9999, {tech}, '2025-01-01T00:00:00Z', 23, 50, '', 'simple', 0, 'draft', "
                    "'', 1, '')")
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
