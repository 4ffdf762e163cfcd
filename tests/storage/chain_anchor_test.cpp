// Comparing the chain of approved records with an older copy of the workbook: records removed
// from the end or changed inside are named, records added since are fine, and a copy of
// another laboratory's workbook is refused. The workbooks are the shared invented fixture; the
// copies are written by the backup itself, the tampering with raw SQL, triggers dropped.
#include "storage/chain_anchor.h"

#include "storage/backup.h"
#include "storage/lab_repository.h"
#include "storage/verification.h"
#include "storage/workbook_error.h"
#include "tests/storage/workbook_fixture.h"

#include <catch2/catch.hpp>

#include <QDir>

using mw::storage::AnchorComparison;
using mw::storage::ChainEntry;
using mw::storage::WorkbookError;

namespace {

// A workbook of a described laboratory with `records` approved calibrations, one a month.
struct LabWorkbook {
    mwtest::TempWorkbook temp;
    std::unique_ptr<mw::storage::Workbook> workbook;
    mwtest::Seed seed;
    std::vector<std::int64_t> approved;
    int month = 0;
    int hour = 9;

    explicit LabWorkbook(const std::string& labName, int records, int firstHour = 9) {
        workbook = temp.open();
        mw::storage::LabRepository(*workbook).save({labName, "1 Test Street", std::nullopt});
        seed = mwtest::seed(*workbook);
        hour = firstHour;
        approve(records);
    }

    void approve(int records) {
        mw::storage::SessionRepository sessions(*workbook);
        for (int i = 0; i < records; ++i) {
            ++month;
            const mw::Timestamp start = mwtest::at(2025, unsigned(month), 4, hour);
            mw::CalibrationSession session = mwtest::draft(seed, start);
            sessions.create(session);
            sessions.submit(session.id, start + std::chrono::hours{3});
            sessions.approve(session.id, mwtest::signer(*workbook, seed.reviewer),
                             start + std::chrono::hours{4});
            approved.push_back(session.id);
        }
    }

    QString backUp(const QString& name) const {
        const QString path = temp.dir.filePath(name);
        mw::storage::backupWorkbook(*workbook, path);
        return path;
    }
};

// Removes the chain's newest entry and returns its session to "submitted", as someone hiding
// the last record with the sqlite3 shell would: the chain that is left still verifies.
void cutNewestRecord(const QString& path, std::int64_t sessionId) {
    mwtest::dropAllTriggers(path);
    REQUIRE(
        mwtest::rawExec(
            path, QStringLiteral("DELETE FROM record_chain WHERE session_id = %1").arg(sessionId))
            .isEmpty());
    REQUIRE(mwtest::rawExec(path, QStringLiteral("UPDATE calibration_sessions SET state = "
                                                 "'submitted', reviewer_id = NULL, approved_at "
                                                 "= NULL WHERE id = %1")
                                      .arg(sessionId))
                .isEmpty());
}

ChainEntry entry(int position, std::int64_t session, const char* digest) {
    ChainEntry e;
    e.position = position;
    e.sessionId = session;
    e.digest = QString::fromLatin1(digest);
    e.instrument = QStringLiteral("VM-001");
    e.revision = 1;
    e.approvedAt = QStringLiteral("2025-03-05T10:00:00+00:00");
    return e;
}

} // namespace

TEST_CASE("a copy equal to the workbook holds, with nothing added", "[anchor]") {
    LabWorkbook lab("Bench Lab", 3);
    const QString copy = lab.backUp(QStringLiteral("copy.mwb"));
    const AnchorComparison result = mw::storage::compareWorkbookWithCopy(lab.temp.path(), copy);
    CHECK(result.holds());
    CHECK(result.copyLength == 3);
    CHECK(result.unchanged == 3);
    CHECK(result.addedSince == 0);
    // The head read with one query is the last entry of the chain read in full.
    const auto head = mw::storage::chainHead(*lab.workbook);
    CHECK(head.length == 3);
    CHECK(head.digest == mw::storage::readChainFile(copy).entries.back().digest);
    CHECK(head.digest.size() == 64);
}

TEST_CASE("records approved after the copy are counted as added since", "[anchor]") {
    LabWorkbook lab("Bench Lab", 2);
    const QString copy = lab.backUp(QStringLiteral("older.mwb"));
    lab.approve(2);
    const AnchorComparison result = mw::storage::compareWorkbookWithCopy(lab.temp.path(), copy);
    CHECK(result.holds());
    CHECK(result.unchanged == 2);
    CHECK(result.workbookLength == 4);
    CHECK(result.addedSince == 2);
}

TEST_CASE("the newest record removed is named though the chain left still verifies", "[anchor]") {
    LabWorkbook lab("Bench Lab", 3);
    const QString copy = lab.backUp(QStringLiteral("copy.mwb"));
    const std::int64_t newest = lab.approved.back();
    lab.workbook.reset();
    cutNewestRecord(lab.temp.path(), newest);

    // Only the dropped triggers show; the shortened chain itself is sound.
    const auto report = mw::storage::verifyWorkbookFile(lab.temp.path());
    CHECK(report.chainLength == 2);
    CHECK(report.recordsChecked == 2);
    for (const QString& problem : report.problems) {
        INFO(problem.toStdString());
        CHECK(problem.startsWith(QLatin1String("schema: trigger")));
    }

    const AnchorComparison result = mw::storage::compareWorkbookWithCopy(lab.temp.path(), copy);
    REQUIRE_FALSE(result.holds());
    CHECK(result.unchanged == 2);
    CHECK(result.firstDifferenceSessionId == newest);
    const QString words = *result.firstDifference;
    INFO(words.toStdString());
    CHECK(words.startsWith(QStringLiteral("record 3 (session %1, instrument VM-001, revision 1, "
                                          "approved 2025-03-04T13:00:00")
                               .arg(newest)));
    CHECK(words.contains(QLatin1String("in the copy copy.mwb is missing from the workbook")));
    CHECK(words.contains(QLatin1String("the copy's last record is gone")));
}

TEST_CASE("a digest changed in the middle is named at its position", "[anchor]") {
    LabWorkbook lab("Bench Lab", 4);
    const QString copy = lab.backUp(QStringLiteral("copy.mwb"));
    const QString before = mw::storage::readChainFile(copy).entries[1].digest;
    lab.workbook.reset();
    // A chain recomputed from the second record on: every later digest differs too.
    mwtest::dropAllTriggers(lab.temp.path());
    REQUIRE(mwtest::rawExec(lab.temp.path(),
                            QStringLiteral("UPDATE record_chain SET digest = printf('%064d', "
                                           "session_id) WHERE session_id >= ") +
                                QString::number(lab.approved[1]))
                .isEmpty());

    const AnchorComparison result = mw::storage::compareWorkbookWithCopy(lab.temp.path(), copy);
    REQUIRE_FALSE(result.holds());
    CHECK(result.unchanged == 1);
    CHECK(result.firstDifferenceSessionId == lab.approved[1]);
    const QString words = *result.firstDifference;
    INFO(words.toStdString());
    CHECK(words.startsWith(QStringLiteral("record 2 (session %1,").arg(lab.approved[1])));
    CHECK(words.contains(
        QStringLiteral("changed since the copy: its digest was %1").arg(before.left(16))));
    CHECK_FALSE(words.contains(QLatin1String("another workbook")));
}

TEST_CASE("a copy of another laboratory's workbook is refused, naming the copy", "[anchor]") {
    LabWorkbook ours("Bench Lab", 2);
    LabWorkbook theirs("Other Lab", 2, 11); // other records: other hours
    const QString copy = theirs.backUp(QStringLiteral("theirs.mwb"));
    try {
        mw::storage::compareWorkbookWithCopy(ours.temp.path(), copy);
        FAIL("another laboratory's workbook was compared");
    } catch (const WorkbookError& error) {
        CHECK(error.kind() == WorkbookError::Kind::BadInput);
        CHECK(error.message() == QStringLiteral("%1 is not a copy of this workbook: it is the "
                                                "workbook of \"Other Lab\", this one is of "
                                                "\"Bench Lab\"")
                                     .arg(copy));
    }
}

TEST_CASE("another workbook of the same laboratory differs from its first record", "[anchor]") {
    LabWorkbook ours("Bench Lab", 2);
    LabWorkbook other("Bench Lab", 2, 11);
    const QString copy = other.backUp(QStringLiteral("other.mwb"));
    const AnchorComparison result = mw::storage::compareWorkbookWithCopy(ours.temp.path(), copy);
    REQUIRE_FALSE(result.holds());
    CHECK(result.unchanged == 0);
    CHECK(result.firstDifference->startsWith(QLatin1String("record 1 (")));
    CHECK(result.firstDifference->endsWith(QLatin1String("the copy may be of another workbook")));
}

TEST_CASE("a laboratory renamed since the copy still compares", "[anchor]") {
    LabWorkbook lab("Bench Lab", 2);
    const QString copy = lab.backUp(QStringLiteral("copy.mwb"));
    mw::storage::LabRepository(*lab.workbook).save({"Bench Lab Ltd", "1 Test Street", {}});
    CHECK(mw::storage::compareWorkbookWithCopy(lab.temp.path(), copy).holds());
}

TEST_CASE("copies of earlier versions are read as they are", "[anchor]") {
    for (const char* fixture : {"workbook-v1.mwb", "workbook-v2.mwb"}) {
        INFO(fixture);
        QTemporaryDir dir;
        const QString old = dir.filePath(QStringLiteral("old.mwb"));
        REQUIRE(
            QFile::copy(QStringLiteral(MW_OLD_WORKBOOKS_DIR "/") + QLatin1String(fixture), old));
        QFile::setPermissions(old, QFile::ReadOwner | QFile::WriteOwner);
        const QString current = dir.filePath(QStringLiteral("current.mwb"));
        REQUIRE(QFile::copy(old, current));
        QFile::setPermissions(current, QFile::ReadOwner | QFile::WriteOwner);
        mw::storage::Workbook(current).database(); // upgraded in place on opening
        const QStringList before = QDir(dir.path()).entryList(QDir::Files);

        const auto stored = mw::storage::readChainFile(old);
        CHECK(stored.schemaVersion < 3);
        // 108 approved records and one amendment (tests/storage/data/README.md).
        CHECK(stored.entries.size() == 109);
        CHECK(stored.entries.front().position == 1);
        CHECK_FALSE(stored.entries.front().instrument.isEmpty());
        const AnchorComparison result = mw::storage::compareWorkbookWithCopy(current, old);
        CHECK(result.holds());
        CHECK(result.unchanged == 109);
        // Read as it is: no upgrade, no file left behind.
        CHECK(mw::storage::readChainFile(old).schemaVersion == stored.schemaVersion);
        CHECK(QDir(dir.path()).entryList(QDir::Files) == before);
    }
}

TEST_CASE("the comparison of two lists of entries", "[anchor]") {
    const std::vector<ChainEntry> three{entry(1, 4, "aa"), entry(2, 7, "bb"), entry(3, 9, "cc")};
    SECTION("an empty copy holds; all is added since") {
        const AnchorComparison r = mw::storage::compareWithCopy({}, three, QStringLiteral("c"));
        CHECK(r.holds());
        CHECK(r.addedSince == 3);
    }
    SECTION("another session at the same position is named") {
        std::vector<ChainEntry> now = three;
        now[2] = entry(3, 12, "dd");
        const AnchorComparison r = mw::storage::compareWithCopy(three, now, QStringLiteral("c"));
        CHECK(r.firstDifferenceSessionId == 9);
        CHECK(*r.firstDifference ==
              QLatin1String("record 3 (session 9, instrument VM-001, revision 1, approved "
                            "2025-03-05T10:00:00+00:00) in the copy c changed since the copy: "
                            "the workbook holds record 3 (session 12, instrument VM-001, "
                            "revision 1, approved 2025-03-05T10:00:00+00:00) at that position"));
    }
    SECTION("several records cut off") {
        const std::vector<ChainEntry> one{three[0]};
        const AnchorComparison r = mw::storage::compareWithCopy(three, one, QStringLiteral("c"));
        CHECK(r.firstDifferenceSessionId == 7);
        CHECK(r.firstDifference->endsWith(
            QLatin1String("whose chain ends at record 1 (the copy's last 2 records are gone)")));
    }
}

TEST_CASE("a file without a chain is not a workbook to compare with", "[anchor]") {
    QTemporaryDir dir;
    const QString path = dir.filePath(QStringLiteral("notes.txt"));
    QFile file(path);
    REQUIRE(file.open(QIODevice::WriteOnly));
    file.write("not a workbook\n");
    file.close();
    try {
        mw::storage::readChainFile(path);
        FAIL("a text file was read as a workbook");
    } catch (const WorkbookError& error) {
        CHECK(error.kind() == WorkbookError::Kind::NotAWorkbook);
        CHECK(error.message().contains(path));
    }
}
