// Backups: an online copy while the workbook is open, the rolling set of automatic backups,
// and restoring a backup in place of a workbook.
#include "storage/backup.h"

#include "storage/lab_repository.h"
#include "storage/record_digest.h"
#include "storage/workbook_error.h"
#include "tests/storage/workbook_fixture.h"

#include <catch2/catch.hpp>

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
        sessions.approve(s.id, seed.reviewer.id, mwtest::at(2025, 3, 6));
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
