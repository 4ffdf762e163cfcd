// Signed approvals and the audit log's seals, as verify checks them: every approval signed by
// its reviewer's key over its digest and audit seal; every audit row up to a seal unchanged.
#include "storage/signing_keys.h"

#include "storage/audit_seal.h"
#include "storage/session_repository.h"
#include "storage/user_repository.h"
#include "storage/verification.h"
#include "storage/workbook_error.h"
#include "tests/storage/workbook_fixture.h"

#include <catch2/catch.hpp>

using mw::storage::verifyWorkbookFile;
using mw::storage::WorkbookError;

namespace {

// Three approved records, each a session submitted and approved by seed's reviewer.
void approveThree(mw::storage::Workbook& workbook, const mwtest::Seed& seed) {
    mw::storage::SessionRepository sessions(workbook);
    for (unsigned day = 1; day <= 3; ++day) {
        mw::CalibrationSession s = mwtest::draft(seed, mwtest::at(2025, 2, day));
        sessions.create(s);
        sessions.submit(s.id, mwtest::at(2025, 2, day, 14));
        sessions.approve(s.id, mwtest::signer(workbook, seed.reviewer),
                         mwtest::at(2025, 2, day, 16));
    }
}

// Runs `statement` on the file as someone with the sqlite3 shell would, with `trigger` out of
// the way for that one statement and put back as it was, so only the edit itself is left.
void editPast(const QString& path, const QString& trigger, const QString& statement) {
    const QStringList definition =
        mwtest::rawValues(path, QStringLiteral("SELECT sql FROM sqlite_master WHERE name = '%1'")
                                    .arg(trigger)
                                    .toUtf8()
                                    .constData());
    REQUIRE(definition.size() == 1);
    REQUIRE(mwtest::rawExec(path, QStringLiteral("DROP TRIGGER %1").arg(trigger)).isEmpty());
    REQUIRE(mwtest::rawExec(path, statement).isEmpty());
    REQUIRE(mwtest::rawExec(path, definition.front()).isEmpty());
}

QString joined(const mw::storage::VerificationReport& report) {
    return report.problems.join(QStringLiteral("\n"));
}

struct Signed {
    mwtest::TempWorkbook temp;
    mwtest::Seed seed;
    Signed() {
        auto workbook = temp.open();
        seed = mwtest::seed(*workbook);
        workbook->setActor(seed.reviewer.id);
        approveThree(*workbook, seed);
    }
};

} // namespace

TEST_CASE("every approval is signed and seals the audit log", "[seals]") {
    Signed s;
    const auto report = verifyWorkbookFile(s.temp.path());
    INFO(joined(report).toStdString());
    CHECK(report.sound());
    CHECK(report.signaturesChecked == 3);
    CHECK(report.auditRowsChecked > 20);
    // The last approval's own chain entry and what followed it wait for the next seal.
    CHECK(report.auditRowsUnsealed >= 1);
    CHECK(report.auditRowsUnsealed < 5);
    // One key, of the reviewer, in use; a new workbook began signing with its first record.
    CHECK(mwtest::rawValues(s.temp.path(), "SELECT user_id FROM signing_keys") ==
          QStringList{QString::number(s.seed.reviewer.id)});
    CHECK(mwtest::rawValues(s.temp.path(), "SELECT chain_length FROM schema_upgrades WHERE "
                                           "version = 4") == QStringList{QStringLiteral("0")});
}

TEST_CASE("an audit row edited or deleted up to a seal is found", "[seals]") {
    SECTION("edited") {
        Signed s;
        editPast(
            s.temp.path(), QStringLiteral("audit_log_append_only_update"),
            QStringLiteral("UPDATE audit_log SET at = '2020-01-01T00:00:00.000Z' WHERE id = 3"));
        const auto report = verifyWorkbookFile(s.temp.path());
        CHECK_FALSE(report.sound());
        CHECK(joined(report).contains(QStringLiteral("the audit log as sealed by record 1")));
        CHECK(joined(report).contains(QStringLiteral("changed or removed")));
    }
    SECTION("deleted") {
        Signed s;
        editPast(s.temp.path(), QStringLiteral("audit_log_append_only_delete"),
                 QStringLiteral("DELETE FROM audit_log WHERE id = 7"));
        const auto report = verifyWorkbookFile(s.temp.path());
        CHECK_FALSE(report.sound());
        CHECK(joined(report).contains(QStringLiteral("row 7 is missing")));
    }
    SECTION("every row deleted") {
        Signed s;
        editPast(s.temp.path(), QStringLiteral("audit_log_append_only_delete"),
                 QStringLiteral("DELETE FROM audit_log"));
        const auto report = verifyWorkbookFile(s.temp.path());
        CHECK_FALSE(report.sound());
        CHECK(joined(report).contains(QStringLiteral("is missing from the log")));
    }
}

TEST_CASE("a signature changed, removed or made with another key is found", "[seals]") {
    SECTION("changed") {
        Signed s;
        editPast(s.temp.path(), QStringLiteral("record_chain_append_only_update"),
                 QStringLiteral("UPDATE record_chain SET signature = zeroblob(64) WHERE id = 2"));
        const auto report = verifyWorkbookFile(s.temp.path());
        CHECK_FALSE(report.sound());
        CHECK(joined(report).contains(QStringLiteral("record 2 (session")));
        CHECK(joined(report).contains(QStringLiteral("signature does not match")));
        REQUIRE(report.firstMismatchSessionId);
    }
    SECTION("removed") {
        Signed s;
        editPast(s.temp.path(), QStringLiteral("record_chain_append_only_update"),
                 QStringLiteral("UPDATE record_chain SET signature = NULL, signing_key_id = NULL "
                                "WHERE id = 3"));
        const auto report = verifyWorkbookFile(s.temp.path());
        CHECK_FALSE(report.sound());
        CHECK(joined(report).contains(QStringLiteral("record 3 (session")));
        CHECK(joined(report).contains(QStringLiteral("it is not signed")));
    }
    SECTION("the audit seal rewritten to match an edited log") {
        // Recomputing the seal needs no key, but the signature covers it.
        Signed s;
        editPast(s.temp.path(), QStringLiteral("record_chain_append_only_update"),
                 QStringLiteral("UPDATE record_chain SET audit_digest = '%1' WHERE id = 1")
                     .arg(QString(64, QLatin1Char('a'))));
        const auto report = verifyWorkbookFile(s.temp.path());
        CHECK_FALSE(report.sound());
        CHECK(joined(report).contains(QStringLiteral("record 1 (session")));
        CHECK(joined(report).contains(QStringLiteral("signature does not match")));
    }
    SECTION("the key of another person") {
        Signed s;
        {
            auto workbook = s.temp.open();
            mwtest::signer(*workbook, s.seed.admin); // issues the administrator's key
        }
        const QString adminKey =
            mwtest::rawValues(s.temp.path(), "SELECT id FROM signing_keys WHERE user_id = (SELECT "
                                             "id FROM users WHERE login = 'ada')")
                .front();
        editPast(s.temp.path(), QStringLiteral("record_chain_append_only_update"),
                 QStringLiteral("UPDATE record_chain SET signing_key_id = %1 WHERE id = 2")
                     .arg(adminKey));
        const auto report = verifyWorkbookFile(s.temp.path());
        CHECK_FALSE(report.sound());
        CHECK(joined(report).contains(QStringLiteral("not with a key of its reviewer")));
    }
    SECTION("the workbook no longer says when signing began") {
        Signed s;
        editPast(s.temp.path(), QStringLiteral("schema_upgrades_append_only_delete"),
                 QStringLiteral("DELETE FROM schema_upgrades"));
        const auto report = verifyWorkbookFile(s.temp.path());
        CHECK_FALSE(report.sound());
        CHECK(joined(report).contains(QStringLiteral("schema_upgrades")));
    }
}

TEST_CASE("the database refuses unsigned approvals and changes to keys", "[seals]") {
    Signed s;
    const QString path = s.temp.path();
    CHECK(mwtest::rawExec(path, QStringLiteral("DELETE FROM signing_keys"))
              .contains(QStringLiteral("never deleted")));
    CHECK(mwtest::rawExec(path, QStringLiteral("UPDATE signing_keys SET public_key = "
                                               "zeroblob(32)"))
              .contains(QStringLiteral("never changes")));
    CHECK(mwtest::rawExec(path, QStringLiteral("INSERT OR REPLACE INTO signing_keys (user_id, "
                                               "public_key, sealed_secret, created_at) SELECT "
                                               "user_id, randomblob(32), sealed_secret, "
                                               "created_at FROM signing_keys"))
              .contains(QStringLiteral("retire the key in use")));
    CHECK(mwtest::rawExec(path, QStringLiteral("DELETE FROM schema_upgrades"))
              .contains(QStringLiteral("append-only")));
    // A fourth session approved by hand, without a signature.
    {
        auto workbook = s.temp.open();
        mw::storage::SessionRepository sessions(*workbook);
        mw::CalibrationSession d = mwtest::draft(s.seed, mwtest::at(2025, 2, 5));
        sessions.create(d);
        sessions.submit(d.id, mwtest::at(2025, 2, 5, 14));
        REQUIRE(mwtest::rawExec(path, QStringLiteral("UPDATE calibration_sessions SET state = "
                                                     "'approved', reviewer_id = %1, approved_at "
                                                     "= '2025-02-05T16:00:00+00:00' WHERE id = %2")
                                          .arg(s.seed.reviewer.id)
                                          .arg(d.id))
                    .isEmpty());
        CHECK(mwtest::rawExec(path, QStringLiteral("INSERT INTO record_chain (session_id, "
                                                   "previous_digest, digest, recorded_at) VALUES "
                                                   "(%1, '', '%2', "
                                                   "'2025-02-05T16:00:00+00:00')")
                                        .arg(d.id)
                                        .arg(QString(64, QLatin1Char('b'))))
                  .contains(QStringLiteral("signed with the reviewer's own key")));
    }
}

TEST_CASE("a changed password retires the key, and what it signed still verifies", "[seals]") {
    Signed s;
    const QString path = s.temp.path();
    {
        auto workbook = s.temp.open();
        // A wrong password opens nothing and issues nothing.
        try {
            mw::storage::unlockApprovalKey(*workbook, s.seed.admin.id, QStringLiteral("wrong"),
                                           mwtest::at(2025, 3, 1));
            FAIL("a wrong password opened an approval key");
        } catch (const WorkbookError& error) {
            CHECK(error.kind() == WorkbookError::Kind::BadInput);
        }
        CHECK(mwtest::rawValues(path, "SELECT count(*) FROM signing_keys") ==
              QStringList{QStringLiteral("1")});
        mw::storage::UserRepository(*workbook).setPassword(s.seed.reviewer.id,
                                                           QStringLiteral("new-secret"));
        CHECK(mwtest::rawValues(path, "SELECT count(*) FROM signing_keys WHERE retired_at IS NOT "
                                      "NULL") == QStringList{QStringLiteral("1")});
        // The old password no longer opens a key; the new one is issued one.
        CHECK_THROWS_AS(mw::storage::unlockApprovalKey(*workbook, s.seed.reviewer.id,
                                                       QStringLiteral("rory-pass"),
                                                       mwtest::at(2025, 3, 1)),
                        WorkbookError);
        mw::storage::SessionRepository sessions(*workbook);
        mw::CalibrationSession d = mwtest::draft(s.seed, mwtest::at(2025, 3, 2));
        sessions.create(d);
        sessions.submit(d.id, mwtest::at(2025, 3, 2, 14));
        sessions.approve(
            d.id, mwtest::signer(*workbook, s.seed.reviewer.id, QStringLiteral("new-secret")),
            mwtest::at(2025, 3, 2, 16));
    }
    const auto report = verifyWorkbookFile(path);
    INFO(joined(report).toStdString());
    CHECK(report.sound());
    CHECK(report.signaturesChecked == 4);
    CHECK(mwtest::rawValues(path, "SELECT count(DISTINCT signing_key_id) FROM record_chain") ==
          QStringList{QStringLiteral("2")});
}
