// Files appear whole or not at all: the partial name, its removal on failure, leftovers of
// killed runs ignored and cleared, and reading a workbook leaving no -wal / -shm behind.
#include "storage/atomic_file.h"

#include "storage/backup.h"
#include "storage/verification.h"
#include "storage/workbook_error.h"
#include "tests/storage/workbook_fixture.h"

#include <catch2/catch.hpp>

#include <QDir>
#include <QFile>
#include <QFileInfo>
#include <QTimeZone>

using mw::storage::AtomicFile;

namespace {

void writeText(const QString& path, const QByteArray& text) {
    QFile file(path);
    REQUIRE(file.open(QIODevice::WriteOnly));
    file.write(text);
}

QStringList entries(const QString& folder) {
    return QDir(folder).entryList(QDir::Files | QDir::Hidden, QDir::Name);
}

// No process has this id (Linux pid_max is at most 2^22).
const QString kDeadProcess = QStringLiteral("99999999");

} // namespace

TEST_CASE("a committed file appears under its name, and only then", "[atomic]") {
    QTemporaryDir dir;
    const QString target = dir.filePath(QStringLiteral("out.pdf"));
    {
        AtomicFile file(target);
        CHECK(mw::storage::isPartialName(QFileInfo(file.partialPath()).fileName()));
        CHECK(QFileInfo(file.partialPath()).absolutePath() == QFileInfo(target).absolutePath());
        writeText(file.partialPath(), "whole");
        CHECK_FALSE(QFileInfo::exists(target));
        file.commit();
    }
    CHECK(entries(dir.path()) == QStringList{QStringLiteral("out.pdf")});
    CHECK_THROWS_AS(AtomicFile(target), mw::storage::WorkbookError);
    {
        AtomicFile replace(target, AtomicFile::Existing::Replace);
        writeText(replace.partialPath(), "second");
        replace.commit();
    }
    QFile file(target);
    REQUIRE(file.open(QIODevice::ReadOnly));
    CHECK(file.readAll() == "second");
}

TEST_CASE("a file never committed leaves nothing behind", "[atomic]") {
    QTemporaryDir dir;
    const QString target = dir.filePath(QStringLiteral("lab.mwb"));
    {
        AtomicFile file(target);
        for (const char* suffix : {"", "-wal", "-shm", "-journal"}) {
            writeText(file.partialPath() + QLatin1String(suffix), "half");
        }
    }
    CHECK(entries(dir.path()).isEmpty());
}

TEST_CASE("leftovers of a killed run are cleared by the next, a running one's are kept",
          "[atomic]") {
    QTemporaryDir dir;
    const QString dead =
        dir.filePath(QStringLiteral(".lab.mwb.partial-%1-0123abcd").arg(kDeadProcess));
    const QString running = mw::storage::partialPathFor(dir.filePath(QStringLiteral("x.mwb")));
    const QString unrelated = dir.filePath(QStringLiteral(".notes.partial"));
    for (const QString& path : {dead, dead + QStringLiteral("-wal"), running, unrelated}) {
        writeText(path, "x");
    }
    AtomicFile next(dir.filePath(QStringLiteral("lab.mwb")));
    CHECK_FALSE(QFileInfo::exists(dead));
    CHECK_FALSE(QFileInfo::exists(dead + QStringLiteral("-wal")));
    CHECK(QFileInfo::exists(running)); // this process is still writing it
    CHECK(QFileInfo::exists(unrelated));
}

TEST_CASE("a partial automatic backup takes no slot and is cleared by the next run",
          "[atomic][backup]") {
    mwtest::TempWorkbook temp;
    auto workbook = temp.open();
    const mw::storage::BackupPolicy policy;
    const QString folder = mw::storage::backupDirectory(workbook->path(), policy);
    REQUIRE(QDir().mkpath(folder));
    // What a run killed while writing today's backup leaves: newer than any complete one.
    const QString partial = QDir(folder).filePath(
        QStringLiteral(".lab-20260301T090000Z.backup.partial-%1-00000001").arg(kDeadProcess));
    writeText(partial, "half a backup");
    CHECK(mw::storage::automaticBackups(workbook->path(), policy).isEmpty());
    const QDateTime now(QDate(2026, 3, 1), QTime(10, 0), QTimeZone::utc());
    const auto written = mw::storage::backupIfDue(*workbook, policy, now);
    REQUIRE(written);
    CHECK(mw::storage::automaticBackups(workbook->path(), policy) == QStringList{*written});
    CHECK_FALSE(QFileInfo::exists(partial));
    CHECK(mw::storage::verifyWorkbookFile(*written).sound());
}

TEST_CASE("a failed backup leaves no target, so trying again works", "[atomic][backup]") {
    mwtest::TempWorkbook temp;
    auto workbook = temp.open();
    const QString target = temp.dir.filePath(QStringLiteral("copy.mwb"));
    // A directory where the partial file would go makes VACUUM INTO fail midway.
    mwtest::rawExec(workbook->path(), QStringLiteral("SELECT 1"));
    {
        AtomicFile blocker(target);
        REQUIRE(QDir().mkdir(blocker.partialPath()));
    }
    mw::storage::backupWorkbook(*workbook, target);
    CHECK(QFileInfo(target).isFile());
    CHECK(mw::storage::verifyWorkbookFile(target).sound());
}

TEST_CASE("verifying leaves no -wal or -shm beside the file", "[atomic][verify]") {
    mwtest::TempWorkbook temp;
    temp.open().reset();
    const QByteArray before = mwtest::fileHash(temp.path());
    CHECK(mw::storage::verifyWorkbookFile(temp.path()).sound());
    CHECK(entries(temp.dir.path()) == QStringList{QStringLiteral("lab.mwb")});
    CHECK(mwtest::fileHash(temp.path()) == before);
    // A WAL database of another application is refused, and left as it was found.
    const QString other = temp.dir.filePath(QStringLiteral("other.db"));
    mwtest::rawExec(other, QStringLiteral("PRAGMA journal_mode = WAL"));
    mwtest::rawExec(other, QStringLiteral("CREATE TABLE t (x)"));
    CHECK_THROWS_AS(mw::storage::verifyWorkbookFile(other), mw::storage::WorkbookError);
    CHECK(entries(temp.dir.path()) ==
          (QStringList{QStringLiteral("lab.mwb"), QStringLiteral("other.db")}));
}

TEST_CASE("workbooks of earlier versions are verified as they are", "[atomic][verify]") {
    for (const char* fixture : {"workbook-v1.mwb", "workbook-v2-early.mwb", "workbook-v2.mwb"}) {
        CAPTURE(fixture);
        QTemporaryDir dir;
        const QString path = dir.filePath(QStringLiteral("old.mwb"));
        REQUIRE(
            QFile::copy(QStringLiteral(MW_OLD_WORKBOOKS_DIR "/") + QLatin1String(fixture), path));
        const QByteArray before = mwtest::fileHash(path);
        const mw::storage::VerificationReport report = mw::storage::verifyWorkbookFile(path);
        INFO(report.problems.join(QLatin1Char('\n')).toStdString());
        CHECK(report.sound());
        CHECK(report.schemaVersion < 3);
        CHECK(report.recordsChecked > 100);
        CHECK(mwtest::fileHash(path) == before);
        CHECK(entries(dir.path()) == QStringList{QStringLiteral("old.mwb")});
    }
}
