// Migrations: a workbook of every earlier schema version opens, is backed up, upgraded step by
// step in transactions, and keeps its records.
#include "storage/schema.h"

#include "storage/audit_repository.h"
#include "storage/lab_repository.h"
#include "storage/sqlite_dialect.h"
#include "storage/workbook_error.h"
#include "tests/storage/workbook_fixture.h"

#include <catch2/catch.hpp>

#include <QFileInfo>

namespace {

// Writes a workbook at `version` with the raw migration steps (no repository may run on an
// older schema), then one lab row and one instrument so there is something to keep.
void writeOldWorkbook(const QString& path, int version) {
    const QString name = QStringLiteral("old-writer");
    {
        QSqlDatabase db = QSqlDatabase::addDatabase(QStringLiteral("QSQLITE"), name);
        db.setDatabaseName(path);
        REQUIRE(db.open());
        REQUIRE(mw::storage::schema::migrate(db, version) == version);
        if (version >= 1) {
            QSqlQuery q(db);
            REQUIRE(q.exec(QStringLiteral("INSERT INTO lab (id, name, address) VALUES (1, "
                                          "'Old lab', 'Old road 1')")));
            REQUIRE(q.exec(QStringLiteral(
                "INSERT INTO instruments (asset_tag, description, manufacturer, model, serial, "
                "kind, movement_amps_fs, movement_ohms, scale_type, scale_divisions, "
                "accuracy_class, interval_days, location, owner, status) VALUES ('OLD-1', "
                "'Old meter', '', '', '', 'dc-voltmeter', 0.001, 100, 'zero-at-end', 50, 2.5, "
                "365, '', '', 'in-service')")));
        }
        db.close();
    }
    QSqlDatabase::removeDatabase(name);
}

} // namespace

TEST_CASE("a workbook of every earlier version is upgraded and keeps its records", "[schema]") {
    for (int version = 1; version < mw::storage::schema::kCurrentVersion; ++version) {
        CAPTURE(version);
        mwtest::TempWorkbook temp;
        writeOldWorkbook(temp.path(), version);
        mw::storage::Workbook workbook(temp.path());
        CHECK(workbook.schemaVersion() == mw::storage::schema::kCurrentVersion);
        CHECK(mw::storage::LabRepository(workbook).load()->name == "Old lab");
        const auto old =
            mw::storage::InstrumentRepository(workbook).findByTag(QStringLiteral("OLD-1"));
        REQUIRE(old);
        CHECK(old->accuracy_class == 2.5);
        // A copy of the file as it was is kept beside it, at its old version.
        REQUIRE_FALSE(workbook.upgradeBackupPath().isEmpty());
        CHECK(QFileInfo::exists(workbook.upgradeBackupPath()));
        {
            const QString name = QStringLiteral("backup-reader");
            {
                QSqlDatabase db = QSqlDatabase::addDatabase(QStringLiteral("QSQLITE"), name);
                db.setDatabaseName(workbook.upgradeBackupPath());
                REQUIRE(db.open());
                CHECK(mw::storage::dialect::userVersion(db) == version);
                db.close();
            }
            QSqlDatabase::removeDatabase(name);
        }
        // Version 2's audit log works on the upgraded file.
        mw::storage::LabRepository(workbook).save({"New lab", "New road 2", "ACC-9"});
        const auto entries = mw::storage::AuditRepository(workbook).entries(QStringLiteral("lab"));
        REQUIRE(entries.size() == 1);
        CHECK(entries[0].oldValues.contains(QStringLiteral("Old lab")));
        CHECK(entries[0].newValues.contains(QStringLiteral("New lab")));
    }
}

TEST_CASE("an empty file becomes a workbook, and a current one is not migrated again", "[schema]") {
    mwtest::TempWorkbook temp;
    writeOldWorkbook(temp.path(), 0);
    {
        auto workbook = temp.open();
        CHECK(workbook->schemaVersion() == mw::storage::schema::kCurrentVersion);
        CHECK(workbook->upgradeBackupPath().isEmpty()); // nothing to keep in a new file
    }
    mw::storage::Workbook again(temp.path());
    CHECK(again.upgradeBackupPath().isEmpty());
    CHECK(mw::storage::schema::migrate(again.database()) == mw::storage::schema::kCurrentVersion);
}

TEST_CASE("an older workbook opened read-only is not upgraded and says why", "[schema]") {
    mwtest::TempWorkbook temp;
    writeOldWorkbook(temp.path(), 1);
    mw::storage::OpenOptions options;
    options.readOnly = true;
    try {
        mw::storage::Workbook workbook(temp.path(), options);
        FAIL("an old workbook opened read-only without an upgrade");
    } catch (const mw::storage::WorkbookError& error) {
        CHECK(error.kind() == mw::storage::WorkbookError::Kind::NeedsUpgrade);
        CHECK(error.message().contains(QStringLiteral("version 1")));
    }
}
