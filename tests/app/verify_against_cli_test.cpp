// `meterwright verify WORKBOOK --against COPY` run as a separate process on copies of the
// invented demo: a backup's records all still there (exit 0, saying how many were added since),
// the newest record removed and the rules put back so that the workbook alone verifies (exit 1,
// naming the record), a digest changed (exit 1), and a COPY that is not this workbook's (exit
// 2, naming it). Tampering is done with the sqlite3 shell, as behind the program's back.
#include "storage/demo/demo_workbook.h"
#include "storage/lab_repository.h"
#include "storage/workbook.h"
#include "support/cli_process.h"
#include "support/demo_workbook.h"
#include "support/sqlite_shell.h"

#include <catch2/catch.hpp>

#include <QCryptographicHash>
#include <QDir>
#include <QFile>
#include <QJsonDocument>
#include <QJsonObject>
#include <QProcess>
#include <QTemporaryDir>

using mwtest::CliResult;
using mwtest::runMeterwright;

using mwtest::copyOfDemo;
using mwtest::dropTriggers;
using mwtest::shell;

namespace {

// Removes the newest record from the chain and returns its session to "submitted"; returns
// that session's id.
QString cutNewestRecord(const QString& path) {
    const QString newest =
        shell(path, QStringLiteral("SELECT session_id FROM record_chain ORDER BY id DESC LIMIT 1"));
    REQUIRE_FALSE(newest.isEmpty());
    shell(path, dropTriggers(path) +
                    QStringLiteral("DELETE FROM record_chain WHERE session_id = %1; UPDATE "
                                   "calibration_sessions SET state = 'submitted', reviewer_id = "
                                   "NULL, approved_at = NULL WHERE id = %1;")
                        .arg(newest));
    return newest;
}

CliResult verifyAgainst(const QString& path, const QString& copy, bool json = false) {
    QStringList arguments{QStringLiteral("verify"), path, QStringLiteral("--against"), copy};
    if (json) {
        arguments << QStringLiteral("--json");
    }
    return runMeterwright(arguments);
}

QByteArray hashOf(const QString& path) {
    QFile file(path);
    REQUIRE(file.open(QIODevice::ReadOnly));
    return QCryptographicHash::hash(file.readAll(), QCryptographicHash::Sha256);
}

} // namespace

TEST_CASE("verify --against a backup: every record still there, exit 0", "[verify][anchor]") {
    QTemporaryDir dir;
    const QString path = copyOfDemo(dir, QStringLiteral("lab.mwb"));
    const QString copy = dir.filePath(QStringLiteral("backup.mwb"));
    REQUIRE(runMeterwright({QStringLiteral("backup"), path, copy}).exitCode == 0);
    const QStringList files = QDir(dir.path()).entryList(QDir::Files);

    const CliResult same = verifyAgainst(path, copy);
    INFO(same.outText().toStdString() << same.errText().toStdString());
    CHECK(same.exitCode == 0);
    CHECK(same.outText().contains(
        QStringLiteral("compared with %1: all 109 of its records unchanged, 0 added since")
            .arg(copy)));

    // A copy older by one record: the record approved since is fine.
    shell(copy, dropTriggers(copy) +
                    QStringLiteral("DELETE FROM record_chain WHERE id = (SELECT max(id) FROM "
                                   "record_chain);"));
    const QByteArray edited = hashOf(copy);
    const CliResult older = verifyAgainst(path, copy, true);
    CHECK(older.exitCode == 0);
    const QJsonObject against =
        QJsonDocument::fromJson(older.out).object().value(QStringLiteral("against")).toObject();
    CHECK(against.value(QStringLiteral("holds")).toBool());
    CHECK(against.value(QStringLiteral("copy_records")).toInt() == 108);
    CHECK(against.value(QStringLiteral("added_since")).toInt() == 1);
    // Opened as verify opens files: nothing written, nothing left behind.
    CHECK(QDir(dir.path()).entryList(QDir::Files) == files);
    CHECK(hashOf(copy) == edited);
}

TEST_CASE("verify --against names the newest record removed though the rest verifies",
          "[verify][anchor]") {
    QTemporaryDir dir;
    const QString path = copyOfDemo(dir, QStringLiteral("lab.mwb"));
    const QString copy = dir.filePath(QStringLiteral("backup.mwb"));
    REQUIRE(runMeterwright({QStringLiteral("backup"), path, copy}).exitCode == 0);
    const QString newest = cutNewestRecord(path);
    // The rules put back by an administrator: the workbook alone is sound again.
    const CliResult repaired = mwtest::runMeterwrightWithInput(
        {QStringLiteral("repair"), path, QStringLiteral("--admin"), QStringLiteral("morgan")},
        "demo-admin\n");
    INFO(repaired.errText().toStdString());
    REQUIRE(repaired.exitCode == 0);
    const CliResult alone = runMeterwright({QStringLiteral("verify"), path});
    INFO(alone.outText().toStdString());
    CHECK(alone.exitCode == 0);

    const CliResult compared = verifyAgainst(path, copy);
    INFO(compared.outText().toStdString());
    CHECK(compared.exitCode == 1);
    CHECK(compared.outText().contains(
        QStringLiteral("FIRST MISMATCH: record 109 (session %1, instrument ").arg(newest)));
    CHECK(compared.outText().contains(
        QLatin1String("in the copy backup.mwb is missing from the workbook, whose chain ends at "
                      "record 108 (the copy's last record is gone)")));
    CHECK(compared.outText().contains(QLatin1String("result: NOT sound")));
}

TEST_CASE("verify --against names a record changed since the copy", "[verify][anchor]") {
    QTemporaryDir dir;
    const QString path = copyOfDemo(dir, QStringLiteral("lab.mwb"));
    const QString copy = dir.filePath(QStringLiteral("backup.mwb"));
    REQUIRE(runMeterwright({QStringLiteral("backup"), path, copy}).exitCode == 0);
    const QString session =
        shell(path, QStringLiteral("SELECT session_id FROM record_chain WHERE id = 50"));
    shell(path,
          dropTriggers(path) + QStringLiteral("UPDATE record_chain SET digest = printf('%064d', 7) "
                                              "WHERE id = 50;"));
    const CliResult compared = verifyAgainst(path, copy, true);
    CHECK(compared.exitCode == 1);
    const QJsonObject report = QJsonDocument::fromJson(compared.out).object();
    const QJsonObject against = report.value(QStringLiteral("against")).toObject();
    CHECK_FALSE(against.value(QStringLiteral("holds")).toBool());
    CHECK(against.value(QStringLiteral("unchanged")).toInt() == 49);
    CHECK(against.value(QStringLiteral("first_difference_session")).toInt() == session.toInt());
    const QString words = against.value(QStringLiteral("first_difference")).toString();
    INFO(words.toStdString());
    CHECK(words.startsWith(QStringLiteral("record 50 (session %1, ").arg(session)));
    CHECK(words.contains(QLatin1String("changed since the copy: its digest was ")));
    CHECK(words.endsWith(QLatin1String(", the workbook holds 0000000000000000")));
}

TEST_CASE("verify --against a copy of an earlier version reads it as it is", "[verify][anchor]") {
    QTemporaryDir dir;
    const QString old = dir.filePath(QStringLiteral("old.mwb"));
    REQUIRE(QFile::copy(QStringLiteral(MW_OLD_WORKBOOKS_DIR "/workbook-v2.mwb"), old));
    QFile::setPermissions(old, QFile::ReadOwner | QFile::WriteOwner);
    const QString current = dir.filePath(QStringLiteral("current.mwb"));
    REQUIRE(QFile::copy(old, current));
    QFile::setPermissions(current, QFile::ReadOwner | QFile::WriteOwner);
    REQUIRE(runMeterwright({QStringLiteral("upgrade"), current}).exitCode == 0);
    const QStringList files = QDir(dir.path()).entryList(QDir::Files);
    const QByteArray oldHash = hashOf(old);

    const CliResult compared = verifyAgainst(current, old);
    INFO(compared.outText().toStdString() << compared.errText().toStdString());
    CHECK(compared.exitCode == 0);
    CHECK(compared.outText().contains(QLatin1String("all 109 of its records unchanged")));
    CHECK(hashOf(old) == oldHash);
    CHECK(QDir(dir.path()).entryList(QDir::Files) == files);
}

TEST_CASE("verify --against a file that is no copy of the workbook exits 2 naming it",
          "[verify][anchor]") {
    QTemporaryDir dir;
    const QString path = copyOfDemo(dir, QStringLiteral("lab.mwb"));
    const QString junk = dir.filePath(QStringLiteral("notes.mwb"));
    {
        QFile file(junk);
        REQUIRE(file.open(QIODevice::WriteOnly));
        file.write("a shopping list, not a workbook\n");
    }
    mwtest::requireUsageError({QStringLiteral("verify"), path, QStringLiteral("--against"), junk},
                              "cannot compare with the copy: ");
    const CliResult notWorkbook = verifyAgainst(path, junk);
    CHECK(notWorkbook.errText().contains(junk + QStringLiteral(" is not a workbook")));
    mwtest::requireUsageError({QStringLiteral("verify"), path, QStringLiteral("--against"),
                               dir.filePath(QStringLiteral("missing.mwb"))},
                              "missing.mwb does not exist");

    // Another laboratory's workbook: other records from the first on, another name.
    const QString other = dir.filePath(QStringLiteral("other-lab.mwb"));
    mw::demo::writeDemoWorkbook(
        other, std::chrono::sys_days{std::chrono::year{2025} / std::chrono::June / 2});
    {
        mw::storage::Workbook workbook(other);
        mw::storage::LabRepository labs(workbook);
        mw::Lab lab = *labs.load();
        lab.name = "Harrowgate Gauge Room";
        labs.save(lab);
    }
    const CliResult another = mwtest::requireUsageError(
        {QStringLiteral("verify"), path, QStringLiteral("--against"), other},
        "is not a copy of this workbook");
    CHECK(another.errText().contains(other + QStringLiteral(" is not a copy of this workbook: it "
                                                            "is the workbook of \"Harrowgate "
                                                            "Gauge Room\"")));
}
