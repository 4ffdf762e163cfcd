// Loading what records and reports are printed from: the session with its instrument, lab,
// standards and people, the amendment that superseded a record, an instrument's latest approved
// record and its history. On the invented demo workbook.
#include "app/record/record_loader.h"

#include "storage/session_repository.h"
#include "storage/signing_keys.h"
#include "storage/workbook.h"
#include "support/demo_workbook.h"

#include <catch2/catch.hpp>

#include <QRegularExpression>

using namespace mw;
using namespace mw::record;

using mwtest::readOnlyDemo;

TEST_CASE("a record's source holds the session, its instrument, lab, standards and people") {
    const RecordLoader loader(readOnlyDemo());
    const auto source = loader.record(1, printTime());
    REQUIRE(source);
    CHECK(source->session.id == 1);
    CHECK(source->instrument.id == source->session.instrument_id);
    REQUIRE(source->lab);
    CHECK(source->lab->name.find("Copperfen") != std::string::npos);
    CHECK(source->standards.size() == 4);
    CHECK(source->users.size() == 3);
    CHECK_FALSE(source->successor);
    // The demo's reviewer signed it: the fingerprint of their key, as verify and the review
    // page show it.
    REQUIRE(source->signerKeyFingerprint);
    CHECK(QRegularExpression(QStringLiteral("^([0-9a-f]{4} ){7}[0-9a-f]{4}$"))
              .match(QString::fromStdString(*source->signerKeyFingerprint))
              .hasMatch());
    CHECK(*source->signerKeyFingerprint ==
          storage::approvalKeyFingerprint(readOnlyDemo().database(), 1)->toStdString());
    CHECK_FALSE(source->session.digest.empty());
    // The chain as it stands now, whatever record is printed: record 1 is its first entry.
    REQUIRE(source->chainAtPrinting);
    CHECK(source->chainAtPrinting->records == 109);
    CHECK(source->chainAtPrinting->headDigest.size() == 64);
    CHECK(source->chainAtPrinting->headDigest != source->session.digest);
    CHECK_FALSE(loader.record(99999, printTime()));
}

TEST_CASE("a superseded record knows the amendment that replaced it") {
    const RecordLoader loader(readOnlyDemo());
    const auto superseded =
        storage::SessionRepository(readOnlyDemo()).withState(SessionState::Superseded);
    REQUIRE(superseded.size() == 1);
    const auto source = loader.record(superseded[0].id, printTime());
    REQUIRE(source);
    REQUIRE(source->successor);
    const auto amendment =
        storage::SessionRepository(readOnlyDemo()).find(source->successor->sessionId);
    REQUIRE(amendment);
    CHECK(amendment->supersedes_id == superseded[0].id);
    CHECK(source->successor->reason == amendment->amendment_reason);
    CHECK(source->successor->revision == 2);
}

TEST_CASE("an instrument by tag, its latest approved record and its history") {
    const RecordLoader loader(readOnlyDemo());
    const auto instrument = loader.instrumentByTag(QStringLiteral("CFM-201"));
    REQUIRE(instrument);
    CHECK_FALSE(loader.instrumentByTag(QStringLiteral("CFM-999")));
    const auto sessions = storage::SessionRepository(readOnlyDemo()).historyOf(instrument->id);
    std::optional<Timestamp> newest;
    std::int64_t expected = 0;
    for (const CalibrationSession& s : sessions) {
        if (s.state == SessionState::Approved && (!newest || *s.approved_at > *newest)) {
            newest = s.approved_at;
            expected = s.id;
        }
    }
    CHECK(loader.latestApproved(instrument->id) == expected);
    const auto history = loader.history(instrument->id, printTime());
    REQUIRE(history);
    CHECK(history->history.rows.size() == sessions.size());
    CHECK_FALSE(loader.history(99999, printTime()));
}
