// Tamper evidence: the canonical record, the SHA-256 chain, and verification naming the first
// record changed behind the app's back (triggers dropped, rows edited with raw SQL).
#include "storage/record_digest.h"
#include "storage/verification.h"

#include "tests/storage/workbook_fixture.h"

#include <catch2/catch.hpp>

#include <QCryptographicHash>

using mw::storage::canonicalRecord;
using mw::storage::chainDigest;
using mw::storage::verifyWorkbook;

namespace {

// Three approved records in a chain plus a draft; returns their session ids in approval order.
std::vector<std::int64_t> approveThree(mw::storage::Workbook& workbook, const mwtest::Seed& seed) {
    mw::storage::SessionRepository sessions(workbook);
    std::vector<std::int64_t> ids;
    for (unsigned day = 1; day <= 3; ++day) {
        mw::CalibrationSession s = mwtest::draft(seed, mwtest::at(2025, 2, day));
        sessions.create(s);
        sessions.submit(s.id, mwtest::at(2025, 2, day, 14));
        sessions.approve(s.id, mwtest::signer(workbook, seed.reviewer),
                         mwtest::at(2025, 2, day, 16));
        ids.push_back(s.id);
    }
    mw::CalibrationSession draft = mwtest::draft(seed, mwtest::at(2025, 2, 10));
    sessions.create(draft);
    return ids;
}

} // namespace

TEST_CASE("the canonical record is independent of part order and sensitive to every value",
          "[digest]") {
    mwtest::Seed seed;
    seed.instrument = mwtest::demoInstrument();
    seed.instrument.ranges[0].id = 7;
    seed.instrument.ranges[1].id = 8;
    mw::CalibrationSession s = mwtest::draft(seed);
    s.id = 12;
    const mw::storage::RecordContext context{
        seed.instrument, mw::User{3, "tess", "Tess Bench", mw::Role::Technician, true},
        mw::User{4, "rory", "Rory Review", mw::Role::Reviewer, true}};
    s.sealed = mw::SealedInputs{
        {{7, mw::SignalType::Dc, std::nullopt, 198800.0, 50, mw::SpecRef{5, 0}, std::nullopt}},
        {{5, 0,
          mw::StandardRangeSpec{"20 V DC", mw::Unit::Volt, 20.0, 0.005, 0.001, 2e-5, std::nullopt,
                                2.0, std::nullopt, mw::SignalKind::Dc}}}};
    const QByteArray text = canonicalRecord(s, context);
    CHECK(text.startsWith("format=meterwright-record 2\nsession=12\n"));
    // The settings and the copies the verdict rests on (record format 2).
    CHECK(text.contains("settings=0.2|0.9544997361036416|23\n"));
    CHECK(text.contains("spec_copy=5|0|20 V DC|V|dc|20|0.005|0.001|2e-05|-|2|-\n"));
    CHECK(text.contains("range_copy=7|dc|-|198800|50|5|0|-|-\n"));
    CHECK(text.contains("reading=7|0|up|as-found|1|V|2|2.05\n"));
    CHECK(text.contains("technician_signature=tess|Tess Bench\n"));
    CHECK(text.contains("reviewer_signature=rory|Rory Review\n"));
    CHECK(text.contains("instrument_spec=VM-001|S/N 4711|multi-range|5e-05|1200|zero-at-end|50|"
                        "1.5\n"));
    // Only the range used (the volt range) is written, without its nominal resistor.
    CHECK(text.contains("range_spec=7|10 V|V|0|10|-\n"));
    CHECK_FALSE(text.contains("range_spec=8|"));

    mw::CalibrationSession reordered = s;
    std::reverse(reordered.readings.begin(), reordered.readings.end());
    CHECK(canonicalRecord(reordered, context) == text);

    mw::CalibrationSession nudged = s;
    nudged.readings[3].indicated = std::nextafter(*nudged.readings[3].indicated, 100.0);
    CHECK(canonicalRecord(nudged, context) != text);
    mw::CalibrationSession noted = s;
    noted.adjustments[0].text += ".";
    CHECK(canonicalRecord(noted, context) != text);
    // A field separator inside a text cannot forge another field.
    mw::CalibrationSession tricky = s;
    tricky.method = "a\nreading=1|2";
    CHECK_FALSE(canonicalRecord(tricky, context).contains("\nreading=1|2\n"));

    // What the conformity decision rests on changes the text; the nominal resistor does not.
    mw::storage::RecordContext other = context;
    other.instrument->accuracy_class = 5.0;
    CHECK(canonicalRecord(s, other) != text);
    other = context;
    other.instrument->ranges[0].full_scale = 20.0;
    CHECK(canonicalRecord(s, other) != text);
    other = context;
    other.instrument->ranges[0].fiducial_value = 10.0;
    CHECK(canonicalRecord(s, other) != text);
    other = context;
    other.instrument->scale_divisions = 100;
    CHECK(canonicalRecord(s, other) != text);
    other = context;
    other.reviewer->full_name = "Someone Else";
    CHECK(canonicalRecord(s, other) != text);
    other = context;
    other.instrument->ranges[0].nominal_ohms = 198700.0;
    other.instrument->ranges[1].full_scale = 2e-3; // a range the record does not use
    other.instrument->location = "Store";
    CHECK(canonicalRecord(s, other) == text);
    other = context;
    other.instrument.reset();
    CHECK(canonicalRecord(s, other).contains("instrument_spec=missing\n"));

    // Every sealed input changes the text.
    mw::CalibrationSession resealed = s;
    resealed.sealed->specs[0].spec.percent_of_reading = 0.006;
    CHECK(canonicalRecord(resealed, context) != text);
    resealed = s;
    resealed.sealed->ranges[0].reference.reset();
    CHECK(canonicalRecord(resealed, context) != text);
    resealed = s;
    resealed.settings->readability_fraction = 0.1;
    CHECK(canonicalRecord(resealed, context) != text);

    // A record sealed before the copies keeps its first format, word for word.
    mw::CalibrationSession early = s;
    early.record_format = mw::kRecordFormatWithoutInputs;
    early.settings.reset();
    early.sealed.reset();
    const QByteArray first = canonicalRecord(early, context);
    CHECK(first.startsWith("format=meterwright-record 1\nsession=12\n"));
    CHECK_FALSE(first.contains("settings="));
    CHECK_FALSE(first.contains("spec_copy="));
}

TEST_CASE("a digest is SHA-256 of the previous digest, a newline and the record", "[digest]") {
    const QByteArray record("format=meterwright-record 1\n");
    const QString expected = QString::fromLatin1(
        QCryptographicHash::hash(QByteArray("abc\n") + record, QCryptographicHash::Sha256).toHex());
    CHECK(chainDigest(QStringLiteral("abc"), record) == expected);
    // FIPS 180-2 Appendix B.1: SHA-256("abc") -- checks the hash the chain is built on.
    CHECK(QCryptographicHash::hash("abc", QCryptographicHash::Sha256).toHex() ==
          "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
}

TEST_CASE("a sound workbook verifies", "[digest]") {
    mwtest::TempWorkbook temp;
    auto workbook = temp.open();
    approveThree(*workbook, mwtest::seed(*workbook));
    const auto report = verifyWorkbook(*workbook);
    CHECK(report.sound());
    CHECK(report.integrityOk);
    CHECK(report.recordsChecked == 3);
    CHECK(report.sessionsChecked == 4);
    CHECK_FALSE(report.firstMismatch);
    // The head is the last entry of the chain, in full; people compare its first 16 digits.
    QSqlQuery last(workbook->database());
    REQUIRE(last.exec(QStringLiteral("SELECT digest FROM record_chain ORDER BY id DESC")));
    REQUIRE(last.next());
    CHECK(report.chainLength == 3);
    CHECK(report.chainHeadDigest == last.value(0).toString());
    CHECK(mw::storage::shortDigest(report.chainHeadDigest) == last.value(0).toString().left(16));
}

TEST_CASE("an empty workbook has an empty chain head", "[digest]") {
    mwtest::TempWorkbook temp;
    auto workbook = temp.open();
    const auto report = verifyWorkbook(*workbook);
    CHECK(report.sound());
    CHECK(report.chainLength == 0);
    CHECK(report.chainHeadDigest.isEmpty());
}

TEST_CASE("a record is superseded exactly when an approved amendment supersedes it", "[digest]") {
    mwtest::TempWorkbook temp;
    std::vector<std::int64_t> ids;
    std::int64_t amendmentId = 0;
    {
        auto workbook = temp.open();
        const mwtest::Seed seed = mwtest::seed(*workbook);
        ids = approveThree(*workbook, seed);
        mw::storage::SessionRepository sessions(*workbook);
        amendmentId =
            sessions.amend(ids[0], seed.technician.id,
                           QStringLiteral("Value copied wrongly at 6 V"), mwtest::at(2025, 2, 20));
        sessions.submit(amendmentId, mwtest::at(2025, 2, 20, 14));
        sessions.approve(amendmentId, mwtest::signer(*workbook, seed.reviewer),
                         mwtest::at(2025, 2, 20, 16));
        const auto report = verifyWorkbook(*workbook);
        REQUIRE(report.sound());
        CHECK(report.chainLength == 4);
    }
    // With the triggers in place the flip is refused; someone drops them first.
    const QString flip = QStringLiteral("UPDATE calibration_sessions SET state = 'superseded' "
                                        "WHERE id = %1")
                             .arg(ids[1]);
    REQUIRE_FALSE(mwtest::rawExec(temp.path(), flip).isEmpty());
    mwtest::dropAllTriggers(temp.path());

    SECTION("an approved record marked superseded with no amendment") {
        REQUIRE(mwtest::rawExec(temp.path(), flip).isEmpty());
        mw::storage::Workbook workbook(temp.path());
        const auto report = verifyWorkbook(workbook);
        CHECK_FALSE(report.sound());
        CHECK(report.firstMismatchSessionId == ids[1]);
        REQUIRE(report.firstMismatch);
        CHECK(report.firstMismatch->startsWith(QStringLiteral("record 2 (session %1").arg(ids[1])));
        CHECK(report.firstMismatch->contains(QStringLiteral("no approved amendment")));
    }
    SECTION("a superseded record set back to approved") {
        REQUIRE(mwtest::rawExec(temp.path(), QStringLiteral("UPDATE calibration_sessions SET "
                                                            "state = 'approved' WHERE id = %1")
                                                 .arg(ids[0]))
                    .isEmpty());
        mw::storage::Workbook workbook(temp.path());
        const auto report = verifyWorkbook(workbook);
        CHECK(report.firstMismatchSessionId == ids[0]);
        REQUIRE(report.firstMismatch);
        CHECK(report.firstMismatch->contains(QStringLiteral("an approved amendment supersedes "
                                                            "it, yet it is marked \"approved\"")));
    }
    SECTION("the amendment's link to the record it corrects removed") {
        REQUIRE(mwtest::rawExec(temp.path(), QStringLiteral("UPDATE calibration_sessions SET "
                                                            "supersedes_id = NULL, revision = 1 "
                                                            "WHERE id = %1")
                                                 .arg(amendmentId))
                    .isEmpty());
        mw::storage::Workbook workbook(temp.path());
        const auto report = verifyWorkbook(workbook);
        // The superseded original is named first: nothing in the chain supersedes it any more.
        CHECK(report.firstMismatchSessionId == ids[0]);
        REQUIRE(report.firstMismatch);
        CHECK(report.firstMismatch->contains(QStringLiteral("no approved amendment")));
    }
}

TEST_CASE("a stored outcome that no longer follows from the sealed inputs is named", "[digest]") {
    mwtest::TempWorkbook temp;
    std::int64_t waiting = 0;
    std::vector<std::int64_t> ids;
    {
        auto workbook = temp.open();
        const mwtest::Seed seed = mwtest::seed(*workbook);
        ids = approveThree(*workbook, seed);
        mw::storage::SessionRepository sessions(*workbook);
        mw::CalibrationSession s = mwtest::draft(seed, mwtest::at(2025, 2, 20));
        sessions.create(s);
        CHECK(sessions.submit(s.id, mwtest::at(2025, 2, 20, 15)) == mw::Outcome::Pass);
        waiting = s.id;
    }
    {
        mw::storage::Workbook workbook(temp.path());
        const auto report = verifyWorkbook(workbook);
        CHECK(report.sound());
        CHECK(report.verdictsChecked == 4); // three approved, one waiting for review
    }
    mwtest::dropAllTriggers(temp.path());
    SECTION("the outcome of a session waiting for review rewritten") {
        REQUIRE(mwtest::rawExec(temp.path(), QStringLiteral("UPDATE calibration_sessions SET "
                                                            "outcome = 'fail' WHERE id = %1")
                                                 .arg(waiting))
                    .isEmpty());
        mw::storage::Workbook workbook(temp.path());
        const auto report = verifyWorkbook(workbook);
        CHECK(report.firstMismatchSessionId == waiting);
        REQUIRE(report.firstMismatch);
        CHECK(report.firstMismatch->contains(QStringLiteral("stored outcome \"fail\" no longer "
                                                            "follows from its inputs, which give "
                                                            "\"pass\"")));
    }
    SECTION("a reading of a waiting session pushed past the limit") {
        REQUIRE(mwtest::rawExec(temp.path(), QStringLiteral("UPDATE readings SET indicated = "
                                                            "applied + 0.5 WHERE session_id = %1 "
                                                            "AND point_index = 2")
                                                 .arg(waiting))
                    .isEmpty());
        mw::storage::Workbook workbook(temp.path());
        const auto report = verifyWorkbook(workbook);
        CHECK(report.firstMismatchSessionId == waiting);
        CHECK(report.firstMismatch->contains(QStringLiteral("no longer follows")));
    }
}

TEST_CASE("an edit behind the app's back names the first record that no longer matches",
          "[digest]") {
    mwtest::TempWorkbook temp;
    std::vector<std::int64_t> ids;
    {
        auto workbook = temp.open();
        ids = approveThree(*workbook, mwtest::seed(*workbook));
    }
    // The triggers refuse the edit ...
    const QString edit = QStringLiteral("UPDATE readings SET indicated = indicated + 0.01 WHERE "
                                        "session_id = %1 AND point_index = 2")
                             .arg(ids[1]);
    REQUIRE_FALSE(mwtest::rawExec(temp.path(), edit).isEmpty());
    // ... so someone drops them first, as with the sqlite3 shell.
    mwtest::dropAllTriggers(temp.path());

    SECTION("a reading changed") {
        REQUIRE(mwtest::rawExec(temp.path(), edit).isEmpty());
        mw::storage::Workbook workbook(temp.path());
        const auto report = verifyWorkbook(workbook);
        CHECK_FALSE(report.sound());
        CHECK(report.firstMismatchSessionId == ids[1]);
        REQUIRE(report.firstMismatch);
        CHECK(report.firstMismatch->startsWith(QStringLiteral("record 2 (session %1").arg(ids[1])));
        CHECK(report.firstMismatch->contains(QStringLiteral("no longer match")));
        CHECK(report.recordsChecked == 1);
    }
    SECTION("an approved record set back to draft") {
        REQUIRE(mwtest::rawExec(temp.path(), QStringLiteral("UPDATE calibration_sessions SET "
                                                            "state = 'draft', outcome = NULL "
                                                            "WHERE id = %1")
                                                 .arg(ids[2]))
                    .isEmpty());
        mw::storage::Workbook workbook(temp.path());
        const auto report = verifyWorkbook(workbook);
        CHECK(report.firstMismatchSessionId == ids[2]);
        CHECK(report.firstMismatch->contains(QStringLiteral("state was changed")));
    }
    SECTION("an approved record flipped to superseded") {
        REQUIRE(mwtest::rawExec(temp.path(), QStringLiteral("UPDATE calibration_sessions SET "
                                                            "state = 'superseded' WHERE id = %1")
                                                 .arg(ids[0]))
                    .isEmpty());
        mw::storage::Workbook workbook(temp.path());
        const auto report = verifyWorkbook(workbook);
        CHECK(report.firstMismatchSessionId == ids[0]);
        CHECK(report.firstMismatch->contains(QStringLiteral("marked superseded")));
    }
    SECTION("a record removed from the chain") {
        REQUIRE(mwtest::rawExec(temp.path(), QStringLiteral("DELETE FROM record_chain WHERE "
                                                            "session_id = %1")
                                                 .arg(ids[0]))
                    .isEmpty());
        mw::storage::Workbook workbook(temp.path());
        const auto report = verifyWorkbook(workbook);
        CHECK(report.firstMismatchSessionId == ids[1]);
        CHECK(report.firstMismatch->contains(QStringLiteral("link to the previous record")));
    }
    SECTION("a draft marked approved without being sealed") {
        REQUIRE(mwtest::rawExec(
                    temp.path(),
                    QStringLiteral("UPDATE calibration_sessions SET state = "
                                   "'approved', outcome = 'pass', submitted_at = finished_at, "
                                   "reviewer_id = (SELECT id FROM users WHERE login = 'rory'), "
                                   "approved_at = finished_at "
                                   "WHERE state = 'draft'"))
                    .isEmpty());
        mw::storage::Workbook workbook(temp.path());
        const auto report = verifyWorkbook(workbook);
        CHECK(report.recordsChecked == 3);
        CHECK(report.firstMismatch->contains(QStringLiteral("never sealed")));
    }
    SECTION("a copy of a standard's specification the record was sealed with changed") {
        REQUIRE(mwtest::rawExec(temp.path(), QStringLiteral("UPDATE session_standard_specs SET "
                                                            "percent_of_reading = 2 WHERE "
                                                            "session_id = %1")
                                                 .arg(ids[1]))
                    .isEmpty());
        mw::storage::Workbook workbook(temp.path());
        const auto report = verifyWorkbook(workbook);
        CHECK(report.firstMismatchSessionId == ids[1]);
        CHECK(report.firstMismatch->contains(QStringLiteral("no longer match")));
    }
    SECTION("the reference chosen for a range in the record removed") {
        REQUIRE(mwtest::rawExec(temp.path(), QStringLiteral("UPDATE session_ranges SET "
                                                            "reference_standard_id = NULL, "
                                                            "reference_sort_order = NULL WHERE "
                                                            "session_id = %1")
                                                 .arg(ids[2]))
                    .isEmpty());
        mw::storage::Workbook workbook(temp.path());
        CHECK(verifyWorkbook(workbook).firstMismatchSessionId == ids[2]);
    }
    SECTION("the instrument's accuracy class changed") {
        REQUIRE(mwtest::rawExec(temp.path(), QStringLiteral("UPDATE instruments SET "
                                                            "accuracy_class = 5"))
                    .isEmpty());
        mw::storage::Workbook workbook(temp.path());
        const auto report = verifyWorkbook(workbook);
        CHECK(report.firstMismatchSessionId == ids[0]);
        CHECK(report.recordsChecked == 0);
    }
    SECTION("a range's full scale doubled") {
        REQUIRE(mwtest::rawExec(temp.path(), QStringLiteral("UPDATE instrument_ranges SET "
                                                            "full_scale = 2 * full_scale"))
                    .isEmpty());
        mw::storage::Workbook workbook(temp.path());
        CHECK(verifyWorkbook(workbook).firstMismatchSessionId == ids[0]);
    }
    SECTION("the reviewer's name rewritten") {
        REQUIRE(mwtest::rawExec(temp.path(), QStringLiteral("UPDATE users SET full_name = "
                                                            "'Someone Else' WHERE login = "
                                                            "'rory'"))
                    .isEmpty());
        mw::storage::Workbook workbook(temp.path());
        CHECK(verifyWorkbook(workbook).firstMismatchSessionId == ids[0]);
    }
    SECTION("the standard's certificate rewritten in the record") {
        REQUIRE(mwtest::rawExec(temp.path(), QStringLiteral("UPDATE session_standards SET "
                                                            "certificate_number = 'CERT-X' "
                                                            "WHERE session_id = %1")
                                                 .arg(ids[0]))
                    .isEmpty());
        mw::storage::Workbook workbook(temp.path());
        CHECK(verifyWorkbook(workbook).firstMismatchSessionId == ids[0]);
    }
}

TEST_CASE("legitimate edits after approval keep the chain sound", "[digest]") {
    mwtest::TempWorkbook temp;
    auto workbook = temp.open();
    const mwtest::Seed seed = mwtest::seed(*workbook);
    approveThree(*workbook, seed);
    // An adjustment changed the multiplier; the instrument moved and its interval was changed.
    mw::Instrument moved = *mw::storage::InstrumentRepository(*workbook).find(seed.instrument.id);
    moved.ranges[0].nominal_ohms = 198700.0;
    moved.location = "Store room";
    moved.interval_days = 730;
    mw::storage::InstrumentRepository(*workbook).update(moved);
    // The standard was recalibrated: the records keep the copies taken when it was used.
    mw::ReferenceStandard recalibrated = seed.standard;
    recalibrated.certificate_number = "CERT-2025-044";
    recalibrated.due_date = mwtest::date(2026, 6, 30);
    mw::storage::StandardRepository(*workbook).update(recalibrated);
    const auto report = verifyWorkbook(*workbook);
    CHECK(report.sound());
    CHECK(report.recordsChecked == 3);
}
