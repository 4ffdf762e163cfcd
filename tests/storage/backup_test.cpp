// Backups: an online copy while the workbook is open, the rolling set of automatic backups,
// and restoring a backup in place of a workbook.
#include "storage/backup.h"

#include "storage/lab_repository.h"
#include "storage/schema.h"
#include "storage/verification.h"
#include "storage/workbook_error.h"
#include "tests/storage/workbook_fixture.h"

#include <catch2/catch.hpp>

#include <QDir>
#include <QFile>
#include <QFileInfo>
#include <QTimeZone>

using mw::storage::BackupPolicy;
using mw::storage::Workbook;
using mw::storage::WorkbookError;

namespace {

QDateTime utc(int y, int m, int d, int h) {
    return QDateTime(QDate(y, m, d), QTime(h, 0), QTimeZone::utc());
}

} // namespace

TEST_CASE("backup and restore round-trip a workbook", "[backup]") {
    mwtest::TempWorkbook temp;
    const QString backup = temp.dir.filePath(QStringLiteral("copies/lab-copy.mwb"));
    std::int64_t sessionId = 0;
    {
        auto workbook = temp.open();
        const mwtest::Seed seed = mwtest::seed(*workbook);
        mw::CalibrationSession s = mwtest::draft(seed);
        mw::storage::SessionRepository sessions(*workbook);
        sessions.create(s);
        sessions.submit(s.id, mwtest::at(2025, 3, 5));
        sessions.approve(s.id, mwtest::signer(*workbook, seed.reviewer), mwtest::at(2025, 3, 6));
        sessionId = s.id;
        mw::storage::LabRepository(*workbook).save({"Before", "", std::nullopt});
        mw::storage::backupWorkbook(*workbook, backup); // online: the workbook stays open
        CHECK_THROWS_AS(mw::storage::backupWorkbook(*workbook, backup), WorkbookError);
        // Changes after the backup are what a restore takes back.
        mw::storage::LabRepository(*workbook).save({"After", "", std::nullopt});
    }
    mw::storage::restoreWorkbook(backup, temp.path());
    CHECK(QFileInfo::exists(temp.path() + QStringLiteral(".before-restore")));
    Workbook restored(temp.path());
    CHECK(mw::storage::LabRepository(restored).load()->name == "Before");
    const auto session = mw::storage::SessionRepository(restored).find(sessionId);
    REQUIRE(session);
    CHECK(session->state == mw::SessionState::Approved);
    CHECK(mw::storage::verifyWorkbook(restored).sound());
    // The replaced workbook was kept, with what it held.
    Workbook replaced(temp.path() + QStringLiteral(".before-restore"));
    CHECK(mw::storage::LabRepository(replaced).load()->name == "After");
}

TEST_CASE("a restore refuses what is not a sound workbook and leaves the target alone",
          "[backup]") {
    mwtest::TempWorkbook temp;
    temp.open().reset();
    const QByteArray before = mwtest::fileHash(temp.path());
    const QString junk = temp.dir.filePath(QStringLiteral("junk.mwb"));
    {
        QFile file(junk);
        REQUIRE(file.open(QIODevice::WriteOnly));
        file.write("this is not a backup");
    }
    CHECK_THROWS_AS(mw::storage::restoreWorkbook(junk, temp.path()), WorkbookError);
    CHECK_THROWS_AS(
        mw::storage::restoreWorkbook(temp.dir.filePath(QStringLiteral("none")), temp.path()),
        WorkbookError);
    CHECK(mwtest::fileHash(temp.path()) == before);
    CHECK_FALSE(QFileInfo::exists(temp.path() + QStringLiteral(".before-restore")));
}

TEST_CASE("automatic backups are taken when due and the oldest are pruned", "[backup]") {
    mwtest::TempWorkbook temp;
    auto workbook = temp.open();
    BackupPolicy policy;
    policy.keep = 3;
    policy.every = std::chrono::hours{24};
    CHECK(mw::storage::automaticBackups(workbook->path(), policy).isEmpty());

    const auto first = mw::storage::backupIfDue(*workbook, policy, utc(2025, 3, 1, 8));
    REQUIRE(first);
    CHECK(first->startsWith(mw::storage::backupDirectory(workbook->path(), policy)));
    CHECK_FALSE(mw::storage::backupIfDue(*workbook, policy, utc(2025, 3, 1, 20))); // not due
    for (int day = 2; day <= 5; ++day) {
        CHECK(mw::storage::backupIfDue(*workbook, policy, utc(2025, 3, day, 8)));
    }
    const QStringList kept = mw::storage::automaticBackups(workbook->path(), policy);
    REQUIRE(kept.size() == 3);
    CHECK(kept[0].contains(QStringLiteral("20250305T080000Z")));
    CHECK(kept[2].contains(QStringLiteral("20250303T080000Z")));
    CHECK_FALSE(QFileInfo::exists(*first));
    // Each automatic backup is itself a workbook.
    mw::storage::OpenOptions readOnly;
    readOnly.readOnly = true;
    Workbook copy(kept[0], readOnly);
    CHECK(mw::storage::verifyWorkbook(copy).sound());
}

namespace {

QStringList filesIn(const QTemporaryDir& dir) {
    return QDir(dir.path()).entryList(QDir::Files | QDir::Dirs | QDir::NoDotAndDotDot);
}

} // namespace

TEST_CASE("a restore is refused while another connection has the workbook open", "[backup]") {
    mwtest::TempWorkbook temp;
    const QString backup = temp.dir.filePath(QStringLiteral("copy.mwb"));
    {
        auto original = temp.open();
        mw::storage::backupWorkbook(*original, backup);
    }
    auto holder = temp.open(); // e.g. the GUI of a colleague, still writing
    mw::storage::LabRepository(*holder).save({"Still working", "", std::nullopt});
    const QStringList before = filesIn(temp.dir);
    try {
        mw::storage::restoreWorkbook(backup, temp.path());
        FAIL("the restore should have been refused");
    } catch (const WorkbookError& error) {
        CHECK(error.kind() == WorkbookError::Kind::Locked);
        CHECK(error.message().contains(QStringLiteral("is in use by another program")));
        CHECK_FALSE(error.message().contains(QStringLiteral(".restoring")));
    }
    CHECK(filesIn(temp.dir) == before); // nothing moved aside, no staging file left
    // The holder's writes still go to the workbook everyone opens.
    mw::storage::LabRepository(*holder).save({"Later", "", std::nullopt});
    holder.reset();
    CHECK(mw::storage::LabRepository(*temp.open()).load()->name == "Later");
    // Once closed everywhere, the same restore goes through.
    const auto outcome = mw::storage::restoreWorkbook(backup, temp.path());
    CHECK(outcome.replacedKeptAs == temp.path() + QStringLiteral(".before-restore"));
}

TEST_CASE("a restore brings along writes still in the backup's write-ahead log", "[backup]") {
    mwtest::TempWorkbook temp;
    temp.open().reset();
    const QString backup = temp.dir.filePath(QStringLiteral("live-copy.mwb"));
    mw::storage::OpenOptions create;
    create.createIfMissing = true;
    Workbook source(backup, create);
    mw::storage::LabRepository(source).save({"Only in the WAL", "", std::nullopt});
    // The write is not checkpointed while the source stays open: a plain file copy loses it.
    REQUIRE(QFileInfo(backup + QStringLiteral("-wal")).size() > 0);

    const auto outcome = mw::storage::restoreWorkbook(backup, temp.path());
    CHECK(outcome.replacedKeptAs == temp.path() + QStringLiteral(".before-restore"));
    Workbook restored(temp.path());
    REQUIRE(mw::storage::LabRepository(restored).load());
    CHECK(mw::storage::LabRepository(restored).load()->name == "Only in the WAL");
}

TEST_CASE("a restore refuses a target that is a folder or lies in a missing folder", "[backup]") {
    mwtest::TempWorkbook temp;
    temp.open().reset();
    const QString folder = temp.dir.filePath(QStringLiteral("records"));
    REQUIRE(QDir().mkpath(folder));
    try {
        mw::storage::restoreWorkbook(temp.path(), folder);
        FAIL("a folder must not be replaced");
    } catch (const WorkbookError& error) {
        CHECK(error.kind() == WorkbookError::Kind::CannotOpen);
        CHECK(error.message().contains(QStringLiteral("is not a file")));
    }
    CHECK(QFileInfo(folder).isDir());
    CHECK_FALSE(QFileInfo::exists(folder + QStringLiteral(".before-restore")));

    const QString nowhere = temp.dir.filePath(QStringLiteral("missing/lab.mwb"));
    try {
        mw::storage::restoreWorkbook(temp.path(), nowhere);
        FAIL("a missing folder must be named");
    } catch (const WorkbookError& error) {
        CHECK(error.message().contains(QStringLiteral("folder")));
        CHECK(error.message().contains(QStringLiteral("does not exist")));
    }
    // A new file in an existing folder is written and nothing is reported as replaced.
    const QString fresh = temp.dir.filePath(QStringLiteral("fresh.mwb"));
    CHECK(mw::storage::restoreWorkbook(temp.path(), fresh).replacedKeptAs.isEmpty());
    CHECK(mw::storage::verifyWorkbook(Workbook(fresh)).sound());
}

TEST_CASE("an older-schema backup is upgraded in a copy and its chain checked", "[backup]") {
    mwtest::TempWorkbook temp;
    temp.open().reset();
    // A backup written by an earlier version of the program (tests/storage/data/README.md).
    const QString backup = temp.dir.filePath(QStringLiteral("old.mwb"));
    REQUIRE(QFile::copy(QStringLiteral(MW_OLD_WORKBOOKS_DIR "/workbook-v2.mwb"), backup));
    QFile::setPermissions(backup, QFile::ReadOwner | QFile::WriteOwner);
    const std::int64_t sessionId =
        mwtest::rawValues(backup, "SELECT session_id FROM record_chain ORDER BY id LIMIT 1")
            .front()
            .toLongLong();
    const QByteArray backupBefore = mwtest::fileHash(backup);

    SECTION("a sound older backup is restored and upgraded when opened") {
        mw::storage::restoreWorkbook(backup, temp.path());
        CHECK(mwtest::fileHash(backup) == backupBefore); // the check ran on a copy
        Workbook restored(temp.path());
        CHECK(restored.schemaVersion() == mw::storage::schema::kCurrentVersion);
        CHECK(mw::storage::SessionRepository(restored).find(sessionId));
    }
    SECTION("a tampered older backup is refused") {
        mwtest::dropAllTriggers(backup);
        REQUIRE(mwtest::rawExec(backup, QStringLiteral("UPDATE readings SET indicated = "
                                                       "indicated + 0.01 WHERE session_id = %1")
                                            .arg(sessionId))
                    .isEmpty());
        const QByteArray target = mwtest::fileHash(temp.path());
        try {
            mw::storage::restoreWorkbook(backup, temp.path());
            FAIL("a backup whose record chain does not verify must not be restored");
        } catch (const WorkbookError& error) {
            CHECK(error.kind() == WorkbookError::Kind::Corrupt);
            CHECK(error.message().contains(QStringLiteral("is not sound")));
        }
        CHECK(mwtest::fileHash(temp.path()) == target);
        CHECK_FALSE(QFileInfo::exists(temp.path() + QStringLiteral(".before-restore")));
    }
}
