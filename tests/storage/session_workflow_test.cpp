// Submission seals a session with the inputs its verdict rests on and stores the outcome the
// session evaluator computes from them; approval recomputes it; amendments keep the copies of
// the record they amend. The workbook's contents are the shared invented fixture.
#include "storage/session_repository.h"

#include "core/evaluation/session_evaluation.h"
#include "storage/rules_repair.h"
#include "storage/verification.h"
#include "storage/workbook_error.h"
#include "tests/storage/workbook_fixture.h"

#include <catch2/catch.hpp>

using mw::CalibrationSession;
using mw::Outcome;
using mw::storage::SessionRepository;
using mw::storage::WorkbookError;

TEST_CASE("submission copies the inputs and stores the evaluator's outcome", "[workflow]") {
    mwtest::TempWorkbook temp;
    auto workbook = temp.open();
    const mwtest::Seed seed = mwtest::seed(*workbook);
    SessionRepository sessions(*workbook);
    CalibrationSession session = mwtest::draft(seed);
    sessions.create(session);
    CHECK_FALSE(sessions.find(session.id)->sealed);

    const Outcome outcome = sessions.submit(session.id, mwtest::at(2025, 3, 5));
    const auto stored = sessions.find(session.id);
    REQUIRE(stored->sealed);
    CHECK(stored->outcome == outcome);
    CHECK(stored->record_format == mw::kRecordFormat);
    // Every range of the standard used, and the range with readings, as the register holds them.
    REQUIRE(stored->sealed->specs.size() == 1);
    CHECK(stored->sealed->specs[0].spec == seed.standard.specs[0]);
    REQUIRE(stored->sealed->ranges.size() == 1);
    CHECK(stored->sealed->ranges[0].range_id == seed.instrument.ranges[0].id);
    CHECK(stored->sealed->ranges[0].reference == mw::SpecRef{seed.standard.id, 0});
    // The same outcome the one session evaluator gives on those copies.
    const auto evaluation = mw::evaluateSession(seed.instrument, *stored, *stored->sealed);
    CHECK(evaluation.overall == outcome);
    CHECK(outcome == Outcome::Pass);

    // Editing the standard afterwards does not change what the session was submitted with.
    mw::ReferenceStandard better = seed.standard;
    better.specs[0].percent_of_reading = 0.001;
    mw::storage::StandardRepository(*workbook).update(better);
    CHECK(sessions.find(session.id)->sealed == stored->sealed);
    CHECK(sessions
              .approve(session.id, mwtest::signer(*workbook, seed.reviewer), mwtest::at(2025, 3, 6))
              .size() == 64);
    CHECK(mw::storage::verifyWorkbook(*workbook).sound());
}

TEST_CASE("the outcome follows the readings: a failing meter is submitted as failing",
          "[workflow]") {
    mwtest::TempWorkbook temp;
    auto workbook = temp.open();
    const mwtest::Seed seed = mwtest::seed(*workbook);
    SessionRepository sessions(*workbook);
    CalibrationSession session = mwtest::draft(seed);
    // 0.4 V high at 10 V on a class 1.5 range (limit ±0.15 V, IEC 60051-1): fails.
    session.readings[8].indicated = session.readings[8].applied + 0.4;
    sessions.create(session);
    CHECK(sessions.submit(session.id, mwtest::at(2025, 3, 5)) == Outcome::Fail);
    CHECK(sessions.find(session.id)->outcome == Outcome::Fail);
}

TEST_CASE("approval refuses an outcome that no longer follows from the inputs", "[workflow]") {
    mwtest::TempWorkbook temp;
    std::int64_t id = 0;
    mwtest::Seed seed;
    {
        auto workbook = temp.open();
        seed = mwtest::seed(*workbook);
        SessionRepository sessions(*workbook);
        CalibrationSession session = mwtest::draft(seed);
        sessions.create(session);
        sessions.submit(session.id, mwtest::at(2025, 3, 5));
        id = session.id;
    }
    // Someone edits the stored verdict behind the application's back.
    mwtest::dropAllTriggers(temp.path());
    REQUIRE(mwtest::rawExec(temp.path(), QStringLiteral("UPDATE calibration_sessions SET outcome "
                                                        "= 'conditional-pass' WHERE id = %1")
                                             .arg(id))
                .isEmpty());
    {
        // Without its rules the workbook only opens read-only; an administrator puts them back,
        // which does not undo the edit.
        auto withoutRules = temp.open();
        CHECK(withoutRules->isReadOnly());
        mw::storage::OpenOptions repair;
        repair.forRepair = true;
        withoutRules.reset();
        auto repairing = temp.open(repair);
        CHECK_FALSE(mw::storage::repairRules(*repairing, seed.admin.id).isEmpty());
    }
    auto workbook = temp.open();
    REQUIRE_FALSE(workbook->isReadOnly());
    try {
        SessionRepository(*workbook).approve(id, mwtest::signer(*workbook, seed.reviewer),
                                             mwtest::at(2025, 3, 6));
        FAIL("approved an outcome the inputs do not give");
    } catch (const WorkbookError& error) {
        CHECK(error.kind() == WorkbookError::Kind::RuleViolation);
        CHECK(error.message().contains(QStringLiteral("now give \"Pass\", not the \"Conditional "
                                                      "pass\" it was submitted with")));
    }
    CHECK(SessionRepository(*workbook).find(id)->state == mw::SessionState::Submitted);
}

TEST_CASE("submission says what stops the evaluation", "[workflow]") {
    mwtest::TempWorkbook temp;
    auto workbook = temp.open();
    mwtest::Seed seed = mwtest::seed(*workbook);
    SessionRepository sessions(*workbook);

    SECTION("no readings") {
        CalibrationSession empty = mwtest::draft(seed);
        empty.readings.clear();
        empty.resistor_checks.clear();
        sessions.create(empty);
        try {
            sessions.submit(empty.id, mwtest::at(2025, 3, 5));
            FAIL("submitted without readings");
        } catch (const WorkbookError& error) {
            CHECK(error.message().contains(QStringLiteral("it has no readings")));
        }
    }
    SECTION("a range whose signal type is not recorded") {
        seed.instrument.ranges[0].signal.reset();
        mw::storage::InstrumentRepository(*workbook).update(seed.instrument);
        CalibrationSession session = mwtest::draft(seed);
        sessions.create(session);
        try {
            sessions.submit(session.id, mwtest::at(2025, 3, 5));
            FAIL("submitted with a range of unknown signal type");
        } catch (const WorkbookError& error) {
            CHECK(error.kind() == WorkbookError::Kind::RuleViolation);
            CHECK(error.message().contains(QStringLiteral("range \"10 V\", as-found")));
            CHECK(error.message().contains(QStringLiteral("signal type")));
        }
        CHECK(sessions.find(session.id)->state == mw::SessionState::Draft);
    }
    SECTION("a standard recalibrated after it was chosen") {
        CalibrationSession session = mwtest::draft(seed);
        sessions.create(session);
        mw::ReferenceStandard recalibrated = seed.standard;
        recalibrated.certificate_number = "CERT-2025-204";
        mw::storage::StandardRepository(*workbook).update(recalibrated);
        try {
            sessions.submit(session.id, mwtest::at(2025, 3, 5));
            FAIL("submitted under a certificate no longer in force");
        } catch (const WorkbookError& error) {
            CHECK(error.message().contains(QStringLiteral("STD-01 was recalibrated")));
            CHECK(error.message().contains(QStringLiteral("CERT-2025-204")));
        }
    }
}

TEST_CASE("a returned session reopened loses its outcome and copies", "[workflow]") {
    mwtest::TempWorkbook temp;
    auto workbook = temp.open();
    const mwtest::Seed seed = mwtest::seed(*workbook);
    SessionRepository sessions(*workbook);
    CalibrationSession session = mwtest::draft(seed);
    sessions.create(session);
    sessions.submit(session.id, mwtest::at(2025, 3, 5));
    sessions.returnToTechnician(session.id, seed.reviewer.id, QStringLiteral("Repeat point 3"),
                                mwtest::at(2025, 3, 6));
    CHECK(sessions.find(session.id)->outcome == Outcome::Pass); // what the reviewer saw
    sessions.reopen(session.id);
    const auto reopened = sessions.find(session.id);
    CHECK_FALSE(reopened->outcome);
    CHECK_FALSE(reopened->sealed);
    CHECK(sessions.submit(session.id, mwtest::at(2025, 3, 7)) == Outcome::Pass);
}

TEST_CASE("an amendment keeps the copies of the record it amends", "[workflow]") {
    mwtest::TempWorkbook temp;
    auto workbook = temp.open();
    const mwtest::Seed seed = mwtest::seed(*workbook);
    SessionRepository sessions(*workbook);
    CalibrationSession session = mwtest::draft(seed);
    sessions.create(session);
    sessions.submit(session.id, mwtest::at(2025, 3, 5));
    sessions.approve(session.id, mwtest::signer(*workbook, seed.reviewer), mwtest::at(2025, 3, 6));
    const auto original = sessions.find(session.id);

    // The standard is recalibrated with a new specification before the correction is made.
    mw::ReferenceStandard recalibrated = seed.standard;
    recalibrated.certificate_number = "CERT-2025-204";
    recalibrated.due_date = mwtest::date(2026, 6, 30);
    recalibrated.specs[0].percent_of_reading = 0.002;
    mw::storage::StandardRepository(*workbook).update(recalibrated);

    const std::int64_t amendment =
        sessions.amend(session.id, seed.technician.id, QStringLiteral("Point 2 typed wrongly"),
                       mwtest::at(2025, 4, 1));
    auto draft = sessions.find(amendment);
    CHECK(draft->sealed == original->sealed);
    CHECK_FALSE(draft->outcome);
    mw::Reading fixed = draft->readings[2];
    fixed.indicated = fixed.applied + 0.01;
    sessions.putReading(amendment, fixed);
    sessions.submit(amendment, mwtest::at(2025, 4, 2));
    // The record is corrected with the standard as it was that day, not as it is now.
    CHECK(sessions.find(amendment)->sealed == original->sealed);
    sessions.approve(amendment, mwtest::signer(*workbook, seed.reviewer), mwtest::at(2025, 4, 3));
    const auto report = mw::storage::verifyWorkbook(*workbook);
    CHECK(report.sound());
    CHECK(report.verdictsChecked == 2);
}

TEST_CASE("an outcome is never typed into a new session", "[workflow]") {
    mwtest::TempWorkbook temp;
    auto workbook = temp.open();
    const mwtest::Seed seed = mwtest::seed(*workbook);
    CalibrationSession session = mwtest::draft(seed);
    session.outcome = Outcome::Pass;
    CHECK_THROWS_WITH(SessionRepository(*workbook).create(session),
                      Catch::Contains("computed from its readings"));
    // Nor can raw SQL submit one without an outcome, or keep one on a draft.
    session.outcome.reset();
    SessionRepository(*workbook).create(session);
    workbook.reset();
    CHECK(mwtest::rawExec(temp.path(), QStringLiteral("UPDATE calibration_sessions SET outcome = "
                                                      "'pass' WHERE id = %1")
                                           .arg(session.id))
              .contains(QStringLiteral("CHECK constraint failed")));
}
