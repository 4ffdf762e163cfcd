// Opening workbooks: new files, pragmas, and refusal of foreign, corrupt, newer, read-only and
// locked files without touching them.
#include "storage/workbook.h"

#include "storage/lab_repository.h"
#include "storage/schema.h"
#include "storage/sqlite_dialect.h"
#include "storage/workbook_error.h"
#include "tests/storage/workbook_fixture.h"

#include <catch2/catch.hpp>

#include <QElapsedTimer>
#include <QFile>
#include <QFileInfo>

#include <atomic>
#include <thread>

using mw::storage::OpenOptions;
using mw::storage::Workbook;
using mw::storage::WorkbookError;
using Kind = WorkbookError::Kind;

namespace {

QString pragma(const Workbook& workbook, const QString& name) {
    QSqlQuery query(workbook.database());
    query.exec(QStringLiteral("PRAGMA ") + name);
    query.next();
    return query.value(0).toString();
}

// Opens `path` expecting a WorkbookError; returns it (fails the test otherwise).
WorkbookError refusal(const QString& path, OpenOptions options = {}) {
    try {
        Workbook workbook(path, options);
    } catch (const WorkbookError& error) {
        return error;
    }
    FAIL("the workbook opened but should have been refused");
    return WorkbookError(Kind::Sql, {});
}

void writeFile(const QString& path, const QByteArray& bytes) {
    QFile file(path);
    REQUIRE(file.open(QIODevice::WriteOnly));
    file.write(bytes);
}

} // namespace

TEST_CASE("a new workbook is created with WAL, foreign keys and the current schema", "[workbook]") {
    mwtest::TempWorkbook temp;
    auto workbook = temp.open();
    CHECK(pragma(*workbook, QStringLiteral("journal_mode")) == QStringLiteral("wal"));
    CHECK(pragma(*workbook, QStringLiteral("foreign_keys")) == QStringLiteral("1"));
    CHECK(pragma(*workbook, QStringLiteral("synchronous")) == QStringLiteral("1")); // NORMAL
    CHECK(pragma(*workbook, QStringLiteral("busy_timeout")).toInt() == 10000);
    CHECK(pragma(*workbook, QStringLiteral("application_id")).toInt() ==
          mw::storage::dialect::kApplicationId);
    CHECK(workbook->schemaVersion() == mw::storage::schema::kCurrentVersion);
    CHECK(pragma(*workbook, QStringLiteral("user_version")).toInt() ==
          mw::storage::schema::kCurrentVersion);
    CHECK_FALSE(workbook->isReadOnly());
    CHECK(workbook->upgradeBackupPath().isEmpty());
}

TEST_CASE("two workbooks can be open at once and reopening keeps the data", "[workbook]") {
    mwtest::TempWorkbook temp;
    mwtest::TempWorkbook other;
    {
        auto first = temp.open();
        auto second = other.open();
        mw::storage::LabRepository(*first).save({"First lab", "1 Road", std::nullopt});
        mw::storage::LabRepository(*second).save({"Second lab", "2 Road", std::nullopt});
    }
    Workbook reopened(temp.path());
    CHECK(mw::storage::LabRepository(reopened).load()->name == "First lab");
}

TEST_CASE("a missing file is not created unless asked", "[workbook]") {
    mwtest::TempWorkbook temp;
    const WorkbookError error = refusal(temp.path());
    CHECK(error.kind() == Kind::CannotOpen);
    CHECK(error.message().contains(QStringLiteral("does not exist")));
    CHECK_FALSE(QFile::exists(temp.path()));
}

TEST_CASE("an existing empty file is refused and left untouched unless asked to initialise it",
          "[workbook]") {
    mwtest::TempWorkbook temp;
    writeFile(temp.path(), QByteArray()); // e.g. a file picked by mistake in an Open dialog
    OpenOptions createOnly;
    createOnly.createIfMissing = true; // creating a missing file is not permission to fill one
    for (const OpenOptions& options : {OpenOptions{}, createOnly}) {
        const WorkbookError error = refusal(temp.path(), options);
        CHECK(error.kind() == Kind::NotAWorkbook);
        CHECK(error.message() == temp.path() + QStringLiteral(" is empty; it is not a workbook"));
        CHECK(QFileInfo(temp.path()).size() == 0);
        CHECK_FALSE(QFile::exists(temp.path() + QStringLiteral("-wal")));
        CHECK_FALSE(QFile::exists(temp.path() + QStringLiteral("-shm")));
    }
    OpenOptions initialise = createOnly;
    initialise.initializeEmptyFile = true;
    Workbook workbook(temp.path(), initialise);
    CHECK(workbook.schemaVersion() == mw::storage::schema::kCurrentVersion);
}

TEST_CASE("a file that is not SQLite is refused and left untouched", "[workbook]") {
    mwtest::TempWorkbook temp;
    writeFile(temp.path(), QByteArray("Date,Reading\n2024-01-01,9.98\n").repeated(200));
    const QByteArray before = mwtest::fileHash(temp.path());
    const WorkbookError error = refusal(temp.path());
    CHECK(error.kind() == Kind::NotAWorkbook);
    CHECK(error.message().contains(QStringLiteral("not an SQLite database")));
    CHECK(mwtest::fileHash(temp.path()) == before);
}

TEST_CASE("an SQLite file of another application is refused and left untouched", "[workbook]") {
    mwtest::TempWorkbook temp;
    REQUIRE(mwtest::rawExec(temp.path(), QStringLiteral("CREATE TABLE recipes (id INTEGER "
                                                        "PRIMARY KEY, name TEXT)"))
                .isEmpty());
    const QByteArray before = mwtest::fileHash(temp.path());
    const WorkbookError error = refusal(temp.path());
    CHECK(error.kind() == Kind::NotAWorkbook);
    CHECK(error.message().contains(QStringLiteral("another application")));
    CHECK(mwtest::fileHash(temp.path()) == before);
}

TEST_CASE("a workbook of a newer schema is refused and left untouched", "[workbook]") {
    mwtest::TempWorkbook temp;
    temp.open().reset();
    REQUIRE(mwtest::rawExec(temp.path(), QStringLiteral("PRAGMA user_version = 99")).isEmpty());
    const QByteArray before = mwtest::fileHash(temp.path());
    const WorkbookError error = refusal(temp.path());
    CHECK(error.kind() == Kind::NewerSchema);
    CHECK(error.message().contains(QStringLiteral("version 99")));
    CHECK(mwtest::fileHash(temp.path()) == before);
}

TEST_CASE("a corrupt workbook is refused and left untouched", "[workbook]") {
    mwtest::TempWorkbook temp;
    {
        auto workbook = temp.open();
        const mwtest::Seed records = mwtest::seed(*workbook);
        mw::storage::SessionRepository sessions(*workbook);
        for (unsigned day = 1; day <= 20; ++day) {
            mw::CalibrationSession session = mwtest::draft(records, mwtest::at(2025, 1, day));
            sessions.create(session);
        }
    }
    QFile file(temp.path());
    REQUIRE(file.size() > 4 * 4096);
    REQUIRE(file.open(QIODevice::ReadWrite));
    file.seek(4096); // page 2 onwards: tables and indexes, not the header
    file.write(QByteArray(3 * 4096, '\x5a'));
    file.close();
    const QByteArray before = mwtest::fileHash(temp.path());
    const WorkbookError error = refusal(temp.path());
    CHECK(error.kind() == Kind::Corrupt);
    CHECK(error.message().contains(temp.path()));
    CHECK(mwtest::fileHash(temp.path()) == before);
}

TEST_CASE("a read-only file opens read-only and says so", "[workbook]") {
    mwtest::TempWorkbook temp;
    temp.open().reset();
    QFile::setPermissions(temp.path(), QFile::ReadOwner | QFile::ReadGroup | QFile::ReadOther);
    const QByteArray before = mwtest::fileHash(temp.path());
    {
        Workbook workbook(temp.path());
        CHECK(workbook.isReadOnly());
        CHECK(workbook.readOnlyReason() == QStringLiteral("the file is marked read-only"));
        CHECK(mw::storage::LabRepository(workbook).load() == std::nullopt);
        try {
            mw::storage::LabRepository(workbook).save({"Lab", "", std::nullopt});
            FAIL("a read-only workbook accepted a write");
        } catch (const WorkbookError& error) {
            CHECK(error.kind() == Kind::ReadOnly);
            CHECK(error.message().contains(QStringLiteral("marked read-only")));
        }
    }
    CHECK(mwtest::fileHash(temp.path()) == before);
    QFile::setPermissions(temp.path(), QFile::ReadOwner | QFile::WriteOwner);
}

TEST_CASE("read-only on request", "[workbook]") {
    mwtest::TempWorkbook temp;
    temp.open().reset();
    OpenOptions options;
    options.readOnly = true;
    Workbook workbook(temp.path(), options);
    CHECK(workbook.isReadOnly());
    CHECK(workbook.readOnlyReason().contains(QStringLiteral("on request")));
    // An empty file read-only cannot become a workbook.
    const QString empty = temp.dir.filePath(QStringLiteral("empty.mwb"));
    writeFile(empty, QByteArray());
    CHECK(refusal(empty, options).kind() == Kind::NotAWorkbook);
}

TEST_CASE("a write waits for another writer and fails as Locked only after the busy timeout",
          "[workbook]") {
    mwtest::TempWorkbook temp;
    temp.open().reset();
    std::atomic<bool> holding{false};
    std::atomic<int> holdMs{600};
    auto holdLock = [&] {
        const QString name = QStringLiteral("lock-holder");
        {
            QSqlDatabase db = QSqlDatabase::addDatabase(QStringLiteral("QSQLITE"), name);
            db.setDatabaseName(temp.path());
            db.open();
            QSqlQuery(db).exec(QStringLiteral("BEGIN IMMEDIATE"));
            holding = true;
            std::this_thread::sleep_for(std::chrono::milliseconds(holdMs.load()));
            QSqlQuery(db).exec(QStringLiteral("COMMIT"));
            db.close();
        }
        QSqlDatabase::removeDatabase(name);
    };

    SECTION("lock held longer than the timeout") {
        OpenOptions options;
        options.busyTimeout = std::chrono::milliseconds(200);
        Workbook workbook(temp.path(), options);
        std::thread holder(holdLock);
        while (!holding) {
            std::this_thread::yield();
        }
        QElapsedTimer timer;
        timer.start();
        try {
            mw::storage::LabRepository(workbook).save({"Lab", "", std::nullopt});
            FAIL("the write went through a held lock");
        } catch (const WorkbookError& error) {
            CHECK(error.kind() == Kind::Locked);
            CHECK(error.message().contains(QStringLiteral("busy")));
        }
        CHECK(timer.elapsed() >= 150);
        holder.join();
    }
    SECTION("lock released within the timeout") {
        holdMs = 300;
        Workbook workbook(temp.path());
        std::thread holder(holdLock);
        while (!holding) {
            std::this_thread::yield();
        }
        mw::storage::LabRepository(workbook).save({"Lab", "", std::nullopt});
        holder.join();
        CHECK(mw::storage::LabRepository(workbook).load()->name == "Lab");
    }
}
