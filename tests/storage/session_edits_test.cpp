// The bench's edits of a draft: each saved in its own transaction and returning what undoing it
// needs, so that an undo puts the workbook back exactly as it was. Invented fixture data.
#include "storage/session_repository.h"

#include "storage/audit_repository.h"
#include "storage/workbook_error.h"
#include "tests/storage/workbook_fixture.h"

#include <catch2/catch.hpp>

#include <algorithm>

using mw::CalibrationSession;
using mw::storage::SessionRepository;
using mw::storage::WorkbookError;

TEST_CASE("test points are added, changed, removed with their readings and put back", "[edits]") {
    mwtest::TempWorkbook temp;
    auto workbook = temp.open();
    const mwtest::Seed seed = mwtest::seed(*workbook);
    SessionRepository sessions(*workbook);
    CalibrationSession session = mwtest::draft(seed);
    const std::int64_t volts = seed.instrument.ranges[0].id;
    session.plan = {{volts, 0, 2.0, 1}, {volts, 1, 4.0, 1}};
    sessions.create(session);
    const CalibrationSession before = *sessions.find(session.id);

    // The next free index follows both the plan and the readings (points 0-4 have readings).
    const mw::TestPoint added = sessions.addTestPoint(session.id, volts, 5.0, 2);
    CHECK(added.point_index == 5);
    CHECK(sessions.find(session.id)->plan.size() == 3);
    const mw::TestPoint old = sessions.updateTestPoint(session.id, {volts, 5, 5.2, 3});
    CHECK(old == added);
    CHECK(sessions.find(session.id)->plan.back() == mw::TestPoint{volts, 5, 5.2, 3});
    CHECK_THROWS_AS(sessions.updateTestPoint(session.id, {volts, 5, 5.2, 0}), WorkbookError);
    CHECK_THROWS_AS(sessions.updateTestPoint(session.id, {volts, 9, 5.2, 1}), WorkbookError);

    // Removing point 1 takes its two readings with it; restoring puts all of it back.
    const mw::storage::RemovedPoint removed = sessions.removeTestPoint(session.id, volts, 1);
    CHECK(removed.point == mw::TestPoint{volts, 1, 4.0, 1});
    CHECK(removed.readings.size() == 2);
    CHECK(sessions.find(session.id)->readings.size() == before.readings.size() - 2);
    sessions.restoreTestPoint(session.id, removed);
    sessions.removeTestPoint(session.id, volts, 5);
    const CalibrationSession after = *sessions.find(session.id);
    CHECK(after.plan == before.plan);
    CHECK(after.readings == before.readings);
}

TEST_CASE("resistor checks and adjustment notes come back with their ids", "[edits]") {
    mwtest::TempWorkbook temp;
    auto workbook = temp.open();
    const mwtest::Seed seed = mwtest::seed(*workbook);
    SessionRepository sessions(*workbook);
    CalibrationSession session = mwtest::draft(seed);
    sessions.create(session);
    REQUIRE(session.adjustments.front().id > 0);
    REQUIRE(session.resistor_checks.front().id > 0);

    const mw::AdjustmentNote note =
        sessions.addAdjustmentNote(session.id, {0, mwtest::at(2025, 3, 4, 11), "Span trimmed"});
    CHECK(note.id > 0);
    CHECK(sessions.removeAdjustmentNote(session.id, note.id) == note);
    CHECK_THROWS_AS(sessions.removeAdjustmentNote(session.id, note.id), WorkbookError);
    CHECK_THROWS_WITH(sessions.addAdjustmentNote(session.id, {0, mwtest::at(2025, 3, 4), "  "}),
                      Catch::Contains("needs some text"));

    const mw::ResistorCheck check = sessions.addResistorCheck(
        session.id, {0, seed.instrument.ranges[1].id, "R2 shunt", 63.16, 63.19, 0.5});
    CHECK(check.id > 0);
    CHECK(sessions.removeResistorCheck(session.id, check.id) == check);
    CHECK(sessions.find(session.id)->resistor_checks == session.resistor_checks);
}

TEST_CASE("nothing is edited once the session is submitted", "[edits]") {
    mwtest::TempWorkbook temp;
    auto workbook = temp.open();
    const mwtest::Seed seed = mwtest::seed(*workbook);
    SessionRepository sessions(*workbook);
    CalibrationSession session = mwtest::draft(seed);
    sessions.create(session);
    sessions.submit(session.id, mwtest::at(2025, 3, 5));
    const std::int64_t volts = seed.instrument.ranges[0].id;
    CHECK_THROWS_AS(sessions.addTestPoint(session.id, volts, 3.0, 1), WorkbookError);
    CHECK_THROWS_AS(sessions.putReading(session.id, session.readings[0]), WorkbookError);
    CHECK_THROWS_AS(sessions.removeReading(session.id, mw::keyOf(session.readings[0])),
                    WorkbookError);
    CHECK(sessions.find(session.id)->readings == session.readings);
}

TEST_CASE("saves and removals in one step come back as what to set to undo them", "[edits]") {
    mwtest::TempWorkbook temp;
    auto workbook = temp.open();
    const mwtest::Seed seed = mwtest::seed(*workbook);
    SessionRepository sessions(*workbook);
    CalibrationSession session = mwtest::draft(seed);
    sessions.create(session);
    mw::Reading changed = session.readings[1];
    changed.indicated = 1.99;
    mw::Reading added = session.readings[1];
    added.phase = mw::Phase::AsLeft;
    const std::vector<mw::storage::ReadingChange> step = {
        {mw::keyOf(changed), changed},
        {mw::keyOf(added), added},
        {mw::keyOf(session.readings[2]), std::nullopt},
    };
    const auto before = sessions.setReadings(session.id, step);
    REQUIRE(before.size() == 3);
    CHECK(before[0] == session.readings[1]);
    CHECK_FALSE(before[1]);
    CHECK(before[2] == session.readings[2]);
    // Setting back what each key held undoes the step exactly.
    std::vector<mw::storage::ReadingChange> undo;
    for (std::size_t i = 0; i < step.size(); ++i) {
        undo.push_back({step[i].key, before[i]});
    }
    sessions.setReadings(session.id, undo);
    CHECK(sessions.find(session.id)->readings == session.readings);

    // The session log names each reading the step touched.
    const auto log = mw::storage::AuditRepository(*workbook).entriesOfSession(session.id);
    const auto inserted = std::count_if(log.begin(), log.end(), [](const auto& e) {
        return e.table == QLatin1String("readings") && e.action == QLatin1String("insert") &&
               e.newValues.contains(QStringLiteral("\"phase\":\"as-left\""));
    });
    CHECK(inserted == 1);
    CHECK(std::any_of(log.begin(), log.end(),
                      [](const auto& e) { return e.table == QLatin1String("adjustment_notes"); }));
}
