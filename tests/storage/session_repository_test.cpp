// Calibration sessions: every field round-trips, readings are upserted by their key, and the
// workflow draft -> submitted -> returned/approved -> amended behaves as the design says.
#include "storage/session_repository.h"

#include "storage/workbook_error.h"
#include "tests/storage/workbook_fixture.h"

#include <catch2/catch.hpp>

using mw::CalibrationSession;
using mw::SessionState;
using mw::storage::SessionRepository;
using mw::storage::WorkbookError;

TEST_CASE("a session round-trips every field", "[session]") {
    mwtest::TempWorkbook temp;
    CalibrationSession written;
    {
        auto workbook = temp.open();
        const mwtest::Seed seed = mwtest::seed(*workbook);
        written = mwtest::draft(seed);
        written.method = "Line one\nline two | with a bar";
        written.standards[0].overdue_justification = "none needed";
        SessionRepository(*workbook).create(written);
        REQUIRE(written.id > 0);
    }
    mw::storage::Workbook workbook(temp.path());
    const auto read = SessionRepository(workbook).find(written.id);
    REQUIRE(read);
    CalibrationSession expected = written;
    // The standard's certificate and due date were copied from the register at the time of use.
    expected.standards[0].certificate_number = "CERT-2024-117";
    expected.standards[0].due_date = mwtest::date(2025, 6, 30);
    CHECK(*read == expected);
    CHECK(read->state == SessionState::Draft);
    CHECK(read->digest.empty());
}

TEST_CASE("readings are saved by their key and can be removed", "[session]") {
    mwtest::TempWorkbook temp;
    auto workbook = temp.open();
    const mwtest::Seed seed = mwtest::seed(*workbook);
    SessionRepository sessions(*workbook);
    CalibrationSession session = mwtest::draft(seed);
    sessions.create(session);
    mw::Reading changed = session.readings[0];
    changed.indicated = 2.07;
    // Saving says what it replaced (what an undo puts back), or nothing for a new reading.
    CHECK(sessions.putReading(session.id, changed) == session.readings[0]);
    auto read = sessions.find(session.id);
    REQUIRE(read->readings.size() == session.readings.size());
    CHECK(read->readings[0].indicated == 2.07);
    CHECK(sessions.removeReading(session.id, mw::keyOf(changed)) == changed);
    CHECK(sessions.find(session.id)->readings.size() == session.readings.size() - 1);
    CHECK(sessions.readingCount() == std::int64_t(session.readings.size() - 1));
    CHECK_THROWS_AS(sessions.removeReading(session.id, mw::keyOf(changed)), WorkbookError);
    CHECK_FALSE(sessions.putReading(session.id, changed)); // new again
    // A reading whose applied value is typed before its indication is kept, pending.
    mw::Reading pending = changed;
    pending.point_index = 7;
    pending.indicated.reset();
    CHECK_FALSE(sessions.putReading(session.id, pending));
    CHECK_FALSE(sessions.find(session.id)->readings.back().indicated);

    session.environment = {21.0, 38.5};
    session.outcome = mw::Outcome::ConditionalFail; // never written: submit() computes it
    session.decision_rule = mw::DecisionRule::SimpleAcceptance;
    session.guard_factor = 0.0;
    session.settings = mw::EvaluationSettings{0.1, 0.99, 20.0};
    sessions.updateDetails(session);
    read = sessions.find(session.id);
    CHECK(read->environment == mw::Environment{21.0, 38.5});
    CHECK_FALSE(read->outcome);
    CHECK(read->settings == mw::EvaluationSettings{0.1, 0.99, 20.0});
    sessions.addAdjustmentNote(session.id, {0, mwtest::at(2025, 3, 4, 12), "Span trimmed"});
    sessions.addResistorCheck(session.id,
                              {0, seed.instrument.ranges[1].id, "shunt", 63.16, 63.2, 0.5});
    read = sessions.find(session.id);
    CHECK(read->adjustments.size() == 2);
    CHECK(read->resistor_checks.size() == 2);
}

TEST_CASE("history and state lists load whole sessions, oldest first", "[session]") {
    mwtest::TempWorkbook temp;
    auto workbook = temp.open();
    const mwtest::Seed seed = mwtest::seed(*workbook);
    SessionRepository sessions(*workbook);
    CalibrationSession later = mwtest::draft(seed, mwtest::at(2025, 5, 1));
    CalibrationSession earlier = mwtest::draft(seed, mwtest::at(2024, 5, 1));
    sessions.create(later);
    sessions.create(earlier);
    sessions.submit(later.id, mwtest::at(2025, 5, 2));
    const auto history = sessions.historyOf(seed.instrument.id);
    REQUIRE(history.size() == 2);
    CHECK(history[0].id == earlier.id);
    CHECK(history[1].id == later.id);
    CHECK(history[1].readings.size() == later.readings.size());
    const auto queue = sessions.withState(SessionState::Submitted);
    REQUIRE(queue.size() == 1);
    CHECK(queue[0].id == later.id);
    CHECK(sessions.historyOf(seed.instrument.id + 1000).empty());
    // The register's quick list: not yet approved, oldest first, without contents.
    const auto open = sessions.openSessions();
    REQUIRE(open.size() == 2);
    CHECK(open[0].id == earlier.id);
    CHECK(open[0].state == SessionState::Draft);
    CHECK(open[1].id == later.id);
    CHECK(open[1].state == SessionState::Submitted);
    CHECK(open[1].instrument_id == seed.instrument.id);
    CHECK(sessions.openSessions(seed.instrument.id).size() == 2);
    CHECK(sessions.openSessions(seed.instrument.id + 1000).empty());
    CHECK_FALSE(sessions.hasApprovedRecords(seed.instrument.id)); // submitted is not approved
}

TEST_CASE("the review workflow: submit, return, reopen, approve, amend", "[session]") {
    mwtest::TempWorkbook temp;
    auto workbook = temp.open();
    const mwtest::Seed seed = mwtest::seed(*workbook);
    SessionRepository sessions(*workbook);
    CalibrationSession session = mwtest::draft(seed);
    sessions.create(session);

    sessions.submit(session.id, mwtest::at(2025, 3, 5));
    CHECK_THROWS_AS(sessions.returnToTechnician(session.id, seed.reviewer.id, QStringLiteral(" "),
                                                mwtest::at(2025, 3, 6)),
                    WorkbookError);
    sessions.returnToTechnician(session.id, seed.reviewer.id,
                                QStringLiteral("Point 3 down reading missing"),
                                mwtest::at(2025, 3, 6));
    auto read = sessions.find(session.id);
    CHECK(read->state == SessionState::Returned);
    CHECK(read->return_comment == "Point 3 down reading missing");
    CHECK(read->returned_at == mwtest::at(2025, 3, 6));
    sessions.reopen(session.id);
    CHECK(sessions.find(session.id)->state == SessionState::Draft);
    sessions.submit(session.id, mwtest::at(2025, 3, 7));

    // The technician cannot approve their own work.
    try {
        sessions.approve(session.id, mwtest::signer(*workbook, seed.technician),
                         mwtest::at(2025, 3, 8));
        FAIL("self-approval accepted");
    } catch (const WorkbookError& error) {
        CHECK(error.kind() == WorkbookError::Kind::RuleViolation);
    }
    CHECK_FALSE(sessions.hasApprovedRecords(seed.instrument.id));
    const QString digest = sessions.approve(session.id, mwtest::signer(*workbook, seed.reviewer),
                                            mwtest::at(2025, 3, 8));
    CHECK(digest.size() == 64);
    CHECK(sessions.hasApprovedRecords(seed.instrument.id));
    const auto outcomes = sessions.latestApprovedOutcomes();
    REQUIRE(outcomes.count(seed.instrument.id) == 1);
    CHECK(outcomes.at(seed.instrument.id) == *read->outcome);
    read = sessions.find(session.id);
    CHECK(read->state == SessionState::Approved);
    CHECK(read->reviewer_id == seed.reviewer.id);
    CHECK(read->approved_at == mwtest::at(2025, 3, 8));
    CHECK(read->digest == digest.toStdString());

    CHECK_THROWS_AS(
        sessions.amend(session.id, seed.technician.id, QString(), mwtest::at(2025, 4, 1)),
        WorkbookError);
    const std::int64_t amendment =
        sessions.amend(session.id, seed.technician.id,
                       QStringLiteral("Value copied wrongly at point 2"), mwtest::at(2025, 4, 1));
    auto revision = sessions.find(amendment);
    CHECK(revision->revision == 2);
    CHECK(revision->supersedes_id == session.id);
    CHECK(revision->amendment_reason == "Value copied wrongly at point 2");
    CHECK(revision->amended_at == mwtest::at(2025, 4, 1));
    CHECK(revision->readings == read->readings);
    CHECK(revision->state == SessionState::Draft);
    // Until the amendment is approved, the original stays the approved record.
    CHECK(sessions.find(session.id)->state == SessionState::Approved);
    mw::Reading fixed = revision->readings[2];
    fixed.indicated = 4.01;
    sessions.putReading(amendment, fixed);
    sessions.submit(amendment, mwtest::at(2025, 4, 2));
    sessions.approve(amendment, mwtest::signer(*workbook, seed.admin), mwtest::at(2025, 4, 3));
    CHECK(sessions.find(session.id)->state == SessionState::Superseded);
    CHECK(sessions.find(amendment)->state == SessionState::Approved);
    // An approved record is never amended twice in parallel, nor a superseded one at all.
    CHECK_THROWS_AS(sessions.amend(session.id, seed.technician.id, QStringLiteral("again"),
                                   mwtest::at(2025, 4, 4)),
                    WorkbookError);
}

TEST_CASE("a standard past due needs a recorded justification to submit", "[session]") {
    mwtest::TempWorkbook temp;
    auto workbook = temp.open();
    const mwtest::Seed seed = mwtest::seed(*workbook);
    SessionRepository sessions(*workbook);
    CalibrationSession session = mwtest::draft(seed, mwtest::at(2025, 7, 8));
    sessions.create(session);
    try {
        sessions.submit(session.id, mwtest::at(2025, 7, 9));
        FAIL("submitted with an overdue standard");
    } catch (const WorkbookError& error) {
        CHECK(error.kind() == WorkbookError::Kind::RuleViolation);
        CHECK(error.message().contains(QStringLiteral("past its due date")));
        CHECK(error.message().contains(QStringLiteral("submitting calibration session")));
    }
    session.standards[0].overdue_justification = "Intermediate check passed on 2025-07-01";
    sessions.setStandards(session.id, session.standards);
    sessions.submit(session.id, mwtest::at(2025, 7, 9));
    CHECK(sessions.find(session.id)->state == SessionState::Submitted);
}

TEST_CASE("drafts can be deleted, submitted sessions cannot", "[session]") {
    mwtest::TempWorkbook temp;
    auto workbook = temp.open();
    const mwtest::Seed seed = mwtest::seed(*workbook);
    SessionRepository sessions(*workbook);
    CalibrationSession keep = mwtest::draft(seed);
    CalibrationSession drop = mwtest::draft(seed);
    sessions.create(keep);
    sessions.create(drop);
    sessions.submit(keep.id, mwtest::at(2025, 3, 5));
    sessions.removeDraft(drop.id);
    CHECK_FALSE(sessions.find(drop.id));
    CHECK_THROWS_AS(sessions.removeDraft(keep.id), WorkbookError);
    CHECK_THROWS_AS(sessions.removeDraft(9999), WorkbookError);
    CalibrationSession notDraft = mwtest::draft(seed);
    notDraft.state = SessionState::Approved;
    CHECK_THROWS_AS(sessions.create(notDraft), WorkbookError);
}
