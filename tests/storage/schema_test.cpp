// Migrations: workbooks written by earlier versions of the program (checked in, see
// tests/storage/data/README.md) are upgraded step by step, keep their records and digests, end
// with exactly the schema of a new workbook, and say what they did not record.
#include "storage/schema.h"

#include "storage/audit_repository.h"
#include "storage/frozen_schema.h"
#include "storage/lab_repository.h"
#include "storage/schema_v4.h"
#include "storage/sqlite_dialect.h"
#include "storage/verification.h"
#include "storage/workbook_error.h"
#include "tests/storage/workbook_fixture.h"

#include <catch2/catch.hpp>

#include <QFile>
#include <QFileInfo>
#include <QSet>

#include <set>

using mw::storage::Workbook;
using mw::storage::WorkbookError;

namespace {

// A copy of a checked-in workbook in a temporary folder (the fixture itself is never opened).
QString copyOf(const mwtest::TempWorkbook& temp, const char* fixture) {
    const QString source = QStringLiteral(MW_OLD_WORKBOOKS_DIR "/") + QLatin1String(fixture);
    REQUIRE(QFileInfo::exists(source));
    QFile::remove(temp.path());
    REQUIRE(QFile::copy(source, temp.path()));
    QFile::setPermissions(temp.path(), QFile::ReadOwner | QFile::WriteOwner);
    return temp.path();
}

// Writes a workbook at `version` with the frozen migration steps, then one lab row and one
// instrument so there is something to keep.
void writeOldWorkbook(const QString& path, int version) {
    const QString name = QStringLiteral("old-writer");
    {
        QSqlDatabase db = QSqlDatabase::addDatabase(QStringLiteral("QSQLITE"), name);
        db.setDatabaseName(path);
        REQUIRE(db.open());
        REQUIRE(mw::storage::schema::migrate(db, version) == version);
        QSqlQuery q(db);
        REQUIRE(q.exec(QStringLiteral("INSERT INTO lab (id, name, address) VALUES (1, 'Old lab', "
                                      "'Old road 1')")));
        REQUIRE(q.exec(QStringLiteral(
            "INSERT INTO instruments (asset_tag, description, manufacturer, model, serial, "
            "kind, movement_amps_fs, movement_ohms, scale_type, scale_divisions, "
            "accuracy_class, interval_days, location, owner, status) VALUES ('OLD-1', "
            "'Old meter', '', '', '', 'dc-voltmeter', 0.001, 100, 'zero-at-end', 50, 2.5, "
            "365, '', '', 'in-service')")));
        db.close();
    }
    QSqlDatabase::removeDatabase(name);
}

// Every schema object as (type, name, table, SQL text), the root page left out.
std::set<QString> schemaOf(const QString& path) {
    std::set<QString> objects;
    for (const QString& row : mwtest::rawValues(path, "SELECT type || '|' || name || '|' || "
                                                      "tbl_name || '|' || coalesce(sql, '') FROM "
                                                      "sqlite_master")) {
        objects.insert(row);
    }
    return objects;
}

QString freshWorkbook(const QTemporaryDir& dir) {
    const QString path = dir.filePath(QStringLiteral("fresh.mwb"));
    mw::storage::OpenOptions options;
    options.createIfMissing = true;
    Workbook(path, options);
    return path;
}

} // namespace

TEST_CASE("the frozen SQL of versions 1 and 2 writes what the program shipped", "[schema]") {
    // The checked-in workbooks were written by the program itself (README in the data folder);
    // the frozen steps must give exactly their schema, object for object, text for text.
    mwtest::TempWorkbook temp;
    const QString v1 = copyOf(temp, "workbook-v1.mwb");
    const std::set<QString> shippedV1 = schemaOf(v1);
    const QString v2 = temp.dir.filePath(QStringLiteral("v2.mwb"));
    REQUIRE(QFile::copy(QStringLiteral(MW_OLD_WORKBOOKS_DIR "/workbook-v2-early.mwb"), v2));
    const std::set<QString> shippedV2 = schemaOf(v2);
    for (int version : {1, 2}) {
        CAPTURE(version);
        const QString written = temp.dir.filePath(QStringLiteral("written-%1.mwb").arg(version));
        writeOldWorkbook(written, version);
        CHECK(schemaOf(written) == (version == 1 ? shippedV1 : shippedV2));
    }
}

TEST_CASE("the frozen SQL of version 3 is what the program shipped", "[schema]") {
    // workbook-v3.mwb was written by the last program with schema 3; an upgrade from version 2
    // through the frozen SQL must give its schema, object for object, text for text.
    mwtest::TempWorkbook temp;
    const std::set<QString> shipped = schemaOf(copyOf(temp, "workbook-v3.mwb"));
    const QString written = temp.dir.filePath(QStringLiteral("written-3.mwb"));
    {
        QSqlDatabase db = QSqlDatabase::addDatabase(QStringLiteral("QSQLITE"), "v3-writer");
        db.setDatabaseName(written);
        REQUIRE(db.open());
        REQUIRE(mw::storage::schema::migrate(db, 3) == 3);
        db.close();
    }
    QSqlDatabase::removeDatabase(QStringLiteral("v3-writer"));
    CHECK(schemaOf(written) == shipped);
    CHECK(mwtest::rawValues(written,
                            "SELECT count(*) FROM pragma_table_info('reference_standards') "
                            "WHERE name = 'calibrated_on'") == QStringList{QStringLiteral("0")});
}

TEST_CASE("workbooks of every earlier version upgrade and keep every record", "[schema]") {
    QTemporaryDir freshDir;
    const std::set<QString> fresh = schemaOf(freshWorkbook(freshDir));
    for (const char* fixture :
         {"workbook-v1.mwb", "workbook-v2-early.mwb", "workbook-v2.mwb", "workbook-v3.mwb"}) {
        const bool version3 = QLatin1String(fixture) == QLatin1String("workbook-v3.mwb");
        CAPTURE(fixture);
        mwtest::TempWorkbook temp;
        const QString path = copyOf(temp, fixture);
        const QStringList sessionsBefore = mwtest::rawValues(
            path, "SELECT id || ' ' || state || ' ' || coalesce(outcome, '-') FROM "
                  "calibration_sessions ORDER BY id");
        const QStringList chainBefore =
            mwtest::rawValues(path, "SELECT digest FROM record_chain ORDER BY id");
        REQUIRE(chainBefore.size() > 100);
        const int readingsBefore =
            mwtest::rawValues(path, "SELECT count(*) FROM readings").front().toInt();
        {
            Workbook workbook(path);
            CHECK(workbook.schemaVersion() == mw::storage::schema::kCurrentVersion);
            REQUIRE_FALSE(workbook.upgradeBackupPath().isEmpty());
            CHECK(QFileInfo::exists(workbook.upgradeBackupPath()));
            // Every digest taken under the old version still verifies. Verdicts of version 2
            // were made without copies of their inputs, so they are counted as not recorded;
            // those of version 3 are recomputed. None of them was signed.
            const mw::storage::VerificationReport report = mw::storage::verifyWorkbook(workbook);
            CHECK(report.sound());
            CHECK(report.recordsChecked == chainBefore.size());
            const int decided = int(sessionsBefore.size()) - 1; // one draft
            CHECK(report.verdictsChecked == (version3 ? decided : 0));
            CHECK(report.verdictsNotRecorded == (version3 ? 0 : decided));
            CHECK(report.signaturesChecked == 0);
            CHECK(mwtest::rawValues(path, "SELECT chain_length FROM schema_upgrades WHERE "
                                          "version = 4") ==
                  QStringList{QString::number(chainBefore.size())});
        }
        // The same sessions, states, outcomes and chain (drafts lose the outcome they never had
        // a right to: it is computed at submission now).
        QStringList expected = sessionsBefore;
        for (QString& row : expected) {
            if (row.contains(QStringLiteral(" draft "))) {
                row = row.section(QLatin1Char(' '), 0, 1) + QStringLiteral(" -");
            }
        }
        CHECK(mwtest::rawValues(path, "SELECT id || ' ' || state || ' ' || coalesce(outcome, "
                                      "'-') FROM calibration_sessions ORDER BY id") == expected);
        CHECK(mwtest::rawValues(path, "SELECT digest FROM record_chain ORDER BY id") ==
              chainBefore);
        CHECK(mwtest::rawValues(path, "SELECT count(*) FROM readings").front().toInt() ==
              readingsBefore);
        // Exactly the schema of a new workbook: every table, index and trigger, by definition.
        CHECK(schemaOf(path) == fresh);
        CHECK(mwtest::rawValues(path, "PRAGMA foreign_key_check").isEmpty());
    }
}

TEST_CASE("an upgrade records what the old workbook did not know as not recorded", "[schema]") {
    mwtest::TempWorkbook temp;
    const QString path = copyOf(temp, "workbook-v2.mwb");
    Workbook(path).schemaVersion();
    // Sealed records keep format 1 and no settings; the draft takes the defaults.
    CHECK(mwtest::rawValues(path, "SELECT DISTINCT record_format FROM calibration_sessions "
                                  "WHERE state <> 'draft'") == QStringList{QStringLiteral("1")});
    CHECK(mwtest::rawValues(path, "SELECT count(*) FROM calibration_sessions WHERE state <> "
                                  "'draft' AND readability_fraction IS NOT NULL") ==
          QStringList{QStringLiteral("0")});
    CHECK(mwtest::rawValues(path, "SELECT record_format || ' ' || readability_fraction FROM "
                                  "calibration_sessions WHERE state = 'draft'") ==
          QStringList{QStringLiteral("2 0.2")});
    // A meter of one kind of signal says which; a multi-range meter's voltage ranges do not.
    CHECK(mwtest::rawValues(path,
                            "SELECT DISTINCT r.signal FROM instrument_ranges r JOIN "
                            "instruments i ON i.id = r.instrument_id WHERE i.kind = "
                            "'bridge-ac-voltmeter'") == QStringList{QStringLiteral("bridge")});
    CHECK(mwtest::rawValues(path, "SELECT count(*) FROM instrument_ranges r JOIN instruments i "
                                  "ON i.id = r.instrument_id WHERE i.kind = 'multi-range' AND "
                                  "r.unit = 'V' AND r.signal IS NOT NULL") ==
          QStringList{QStringLiteral("0")});
    CHECK(mwtest::rawValues(path, "SELECT DISTINCT signal FROM instrument_ranges WHERE unit = "
                                  "'A'") == QStringList{QStringLiteral("dc")});
    CHECK(mwtest::rawValues(path, "SELECT count(*) FROM instrument_ranges WHERE diode IS NOT "
                                  "NULL") == QStringList{QStringLiteral("0")});
    // A standard's AC ranges are those that say so.
    CHECK(mwtest::rawValues(path, "SELECT label FROM standard_specs WHERE signal = 'ac' ORDER BY "
                                  "id") == QStringList{QStringLiteral("20 V AC 45 Hz-1 kHz"),
                                                       QStringLiteral("200 V AC 45 Hz-1 kHz"),
                                                       QStringLiteral("1000 V AC 45 Hz-1 kHz")});
}

TEST_CASE("a submission from before the copies is returned before it can be approved", "[schema]") {
    mwtest::TempWorkbook temp;
    const QString path = copyOf(temp, "workbook-v2.mwb");
    Workbook workbook(path);
    mw::storage::SessionRepository sessions(workbook);
    const auto waiting = sessions.withState(mw::SessionState::Submitted);
    REQUIRE_FALSE(waiting.empty());
    const auto reviewer =
        mw::storage::UserRepository(workbook).findByLogin(QStringLiteral("rowan"));
    REQUIRE(reviewer);
    const mw::CalibrationSession& old = waiting.front();
    CHECK(old.record_format == mw::kRecordFormatWithoutInputs);
    CHECK_FALSE(old.settings);
    CHECK_FALSE(old.sealed);
    workbook.setActor(reviewer->id);
    try {
        sessions.approve(old.id,
                         mwtest::signer(workbook, reviewer->id, QStringLiteral("demo-review")),
                         *old.submitted_at + std::chrono::hours(30));
        FAIL("a submission without its sealed inputs was approved");
    } catch (const WorkbookError& error) {
        CHECK(error.kind() == WorkbookError::Kind::RuleViolation);
        CHECK(error.message().contains(QStringLiteral("return it to the technician")));
    }
    // Returned, reopened and submitted again, it is sealed and evaluated like any other.
    const mw::Timestamp back = *old.submitted_at + std::chrono::hours(26);
    sessions.returnToTechnician(old.id, reviewer->id, QStringLiteral("Submit it again"), back);
    sessions.reopen(old.id);
    const auto technician =
        mw::storage::UserRepository(workbook).findByLogin(QStringLiteral("tess"));
    workbook.setActor(technician->id);
    const mw::Outcome outcome = sessions.submit(old.id, back + std::chrono::hours(1));
    const auto resubmitted = sessions.find(old.id);
    CHECK(resubmitted->record_format == mw::kRecordFormat);
    CHECK(resubmitted->outcome == outcome);
    REQUIRE(resubmitted->sealed);
    CHECK_FALSE(resubmitted->sealed->specs.empty());
    workbook.setActor(reviewer->id);
    CHECK(sessions
              .approve(old.id,
                       mwtest::signer(workbook, reviewer->id, QStringLiteral("demo-review")),
                       back + std::chrono::hours(3))
              .size() == 64);
    const auto report = mw::storage::verifyWorkbook(workbook);
    CHECK(report.sound());
    CHECK(report.verdictsChecked == 1);
}

TEST_CASE("a row a version 3 check refuses stops the upgrade, named, file unchanged", "[schema]") {
    mwtest::TempWorkbook temp;
    const QString path = copyOf(temp, "workbook-v2.mwb");
    // A draft's start edited to something that is not a time, as a shell user could.
    REQUIRE(mwtest::rawExec(path, QStringLiteral("UPDATE calibration_sessions SET started_at = "
                                                 "'not a time' WHERE state = 'draft'"))
                .isEmpty());
    const QString draftId =
        mwtest::rawValues(path, "SELECT id FROM calibration_sessions WHERE state = 'draft'")
            .front();
    const QByteArray before = mwtest::fileHash(path);
    try {
        Workbook workbook(path);
        FAIL("a workbook with a broken time was upgraded");
    } catch (const WorkbookError& error) {
        CHECK(error.kind() == WorkbookError::Kind::Corrupt);
        CHECK(error.message().contains(QStringLiteral("table calibration_sessions, row with id = "
                                                      "%1")
                                           .arg(draftId)));
        CHECK(error.message().contains(QStringLiteral("started_at")));
    }
    CHECK(mwtest::fileHash(path) == before);
    CHECK(mwtest::rawValues(path, "PRAGMA user_version") == QStringList{QStringLiteral("2")});
}

TEST_CASE("the upgrade reinstalls the key triggers a workbook was made without", "[schema]") {
    mwtest::TempWorkbook temp;
    const QString path = copyOf(temp, "workbook-v2-early.mwb");
    const QString replace = QStringLiteral(
        "INSERT OR REPLACE INTO users (id, login, full_name, role, active, password_hash) SELECT "
        "id, login, 'Someone else', role, active, password_hash FROM users WHERE login = 'tess'");
    REQUIRE(mwtest::rawValues(path, "SELECT count(*) FROM sqlite_master WHERE name LIKE "
                                    "'%_kept_on_insert'") == QStringList{QStringLiteral("0")});
    Workbook(path).schemaVersion();
    CHECK(mwtest::rawExec(path, replace).contains(QStringLiteral("rows are never replaced")));
}

TEST_CASE("every column of every table is named in its audit and freeze triggers", "[schema]") {
    // Triggers list their columns explicitly, so a column added later that is not listed would
    // escape them: the lists must match the tables exactly.
    QTemporaryDir dir;
    const QString path = freshWorkbook(dir);
    for (const mw::storage::schema4::TableDefinition& table : mw::storage::schema4::tables()) {
        CAPTURE(table.name);
        QStringList listed;
        for (const char* column : table.columns) {
            listed << QLatin1String(column);
        }
        const QStringList actual =
            mwtest::rawValues(path, QStringLiteral("SELECT name FROM pragma_table_info('%1')")
                                        .arg(QLatin1String(table.name))
                                        .toUtf8()
                                        .constData());
        CHECK(actual == listed);
        const QStringList audit = mwtest::rawValues(
            path, QStringLiteral("SELECT sql FROM sqlite_master WHERE name = 'audit_%1_update'")
                      .arg(QLatin1String(table.name))
                      .toUtf8()
                      .constData());
        if (audit.isEmpty()) {
            continue; // the audit tables themselves
        }
        // Secrets and binary keys stay out of the log (JSON holds no BLOB); their rows are
        // never deleted and a key changes only by being retired.
        const QStringList unaudited = {QStringLiteral("password_hash"),
                                       QStringLiteral("sealed_secret"),
                                       QStringLiteral("public_key"), QStringLiteral("signature")};
        for (const QString& column : listed) {
            if (!unaudited.contains(column)) {
                CHECK(audit.front().contains(QStringLiteral("'%1', NEW.%1").arg(column)));
            }
        }
    }
    const QString frozen = mwtest::rawValues(path, "SELECT sql FROM sqlite_master WHERE name = "
                                                   "'sessions_approved_frozen'")
                               .front();
    for (const char* column :
         mw::storage::schema4::table(QStringLiteral("calibration_sessions")).columns) {
        if (QLatin1String(column) != QLatin1String("state")) {
            CHECK(frozen.contains(QStringLiteral("OLD.%1 IS NEW.%1").arg(QLatin1String(column))));
        }
    }
}

TEST_CASE("an empty file becomes a workbook, and a current one is not migrated again", "[schema]") {
    mwtest::TempWorkbook temp;
    {
        auto workbook = temp.open();
        CHECK(workbook->schemaVersion() == mw::storage::schema::kCurrentVersion);
        CHECK(workbook->upgradeBackupPath().isEmpty()); // nothing to keep in a new file
    }
    Workbook again(temp.path());
    CHECK(again.upgradeBackupPath().isEmpty());
    CHECK(mw::storage::schema::migrate(again.database()) == mw::storage::schema::kCurrentVersion);
}

TEST_CASE("an older workbook opened read-only is not upgraded and says why", "[schema]") {
    mwtest::TempWorkbook temp;
    writeOldWorkbook(temp.path(), 1);
    mw::storage::OpenOptions options;
    options.readOnly = true;
    try {
        Workbook workbook(temp.path(), options);
        FAIL("an old workbook opened read-only without an upgrade");
    } catch (const WorkbookError& error) {
        CHECK(error.kind() == WorkbookError::Kind::NeedsUpgrade);
        CHECK(error.message().contains(QStringLiteral("version 1")));
    }
}

TEST_CASE("a workbook written with the frozen steps upgrades and its audit log works", "[schema]") {
    for (int version = 1; version < mw::storage::schema::kCurrentVersion; ++version) {
        CAPTURE(version);
        mwtest::TempWorkbook temp;
        writeOldWorkbook(temp.path(), version);
        Workbook workbook(temp.path());
        CHECK(workbook.schemaVersion() == mw::storage::schema::kCurrentVersion);
        CHECK(mw::storage::LabRepository(workbook).load()->name == "Old lab");
        CHECK(mw::storage::InstrumentRepository(workbook)
                  .findByTag(QStringLiteral("OLD-1"))
                  ->ranges.empty());
        mw::storage::LabRepository(workbook).save({"New lab", "New road 2", "ACC-9"});
        bool logged = false;
        for (const auto& entry :
             mw::storage::AuditRepository(workbook).entries(QStringLiteral("lab"))) {
            logged = logged || (entry.oldValues.contains(QStringLiteral("Old lab")) &&
                                entry.newValues.contains(QStringLiteral("New lab")));
        }
        CHECK(logged);
    }
}
