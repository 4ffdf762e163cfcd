// `meterwright backup` and `meterwright restore` run as separate processes: a copy made while the
// workbook is in use verifies sound, nothing is overwritten, a restore keeps the old file and
// says where, and a restore is refused while the workbook is open elsewhere.
#include "support/cli_process.h"

#include <catch2/catch.hpp>

#include <QDir>
#include <QFile>
#include <QFileInfo>
#include <QJsonDocument>
#include <QJsonObject>
#include <QSqlDatabase>
#include <QSqlQuery>
#include <QTemporaryDir>

using mwtest::requireUsageError;
using mwtest::runMeterwright;

namespace {

QString makeDemo(const QTemporaryDir& dir) {
    const QString path = dir.filePath(QStringLiteral("shop.mwb"));
    const auto result = runMeterwright({QStringLiteral("demo"), path});
    INFO(result.err.toStdString());
    REQUIRE(result.exitCode == 0);
    return path;
}

} // namespace

TEST_CASE("backup writes a sound copy and refuses to overwrite") {
    QTemporaryDir dir;
    REQUIRE(dir.isValid());
    const QString workbook = makeDemo(dir);
    const QString copy = dir.filePath(QStringLiteral("copy.mwb"));

    const auto written = runMeterwright({QStringLiteral("backup"), workbook, copy});
    INFO(written.err.toStdString());
    REQUIRE(written.exitCode == 0);
    CHECK(runMeterwright({QStringLiteral("verify"), copy}).exitCode == 0);
    // The chain head the copy holds, in full, as verify reads it from the copy.
    const QJsonObject head = mwtest::runJson({QStringLiteral("verify"), copy})
                                 .value(QStringLiteral("chain_head"))
                                 .toObject();
    CHECK(head.value(QStringLiteral("digest")).toString().size() == 64);
    CHECK(written.outText().contains(
        QStringLiteral("chain head of the backup: %1 records, last digest %2")
            .arg(head.value(QStringLiteral("records")).toInt())
            .arg(head.value(QStringLiteral("digest")).toString())));

    const QByteArray before = [&] {
        QFile file(copy);
        REQUIRE(file.open(QIODevice::ReadOnly));
        return file.readAll();
    }();
    requireUsageError({QStringLiteral("backup"), workbook, copy}, "already exists");
    QFile again(copy);
    REQUIRE(again.open(QIODevice::ReadOnly));
    CHECK(again.readAll() == before);
}

TEST_CASE("automatic backup is written once a day into the folder beside the workbook") {
    QTemporaryDir dir;
    REQUIRE(dir.isValid());
    const QString workbook = makeDemo(dir);
    const auto first = runMeterwright({QStringLiteral("backup"), QStringLiteral("--automatic"),
                                       workbook, QStringLiteral("--json")});
    REQUIRE(first.exitCode == 0);
    CHECK(first.outText().contains(QStringLiteral("shop.mwb.backups")));
    const QJsonObject firstHead =
        QJsonDocument::fromJson(first.out).object().value(QStringLiteral("chain_head")).toObject();
    CHECK(firstHead.value(QStringLiteral("records")).toInt() > 0);
    CHECK(firstHead.value(QStringLiteral("digest")).toString().size() == 64);
    const auto second =
        runMeterwright({QStringLiteral("backup"), QStringLiteral("--automatic"), workbook});
    REQUIRE(second.exitCode == 0);
    CHECK(second.outText().contains(QStringLiteral("no automatic backup was due")));
    CHECK(QDir(workbook + QStringLiteral(".backups")).entryList(QDir::Files).size() == 1);
}

TEST_CASE("restore puts a backup back and says where the replaced file is kept") {
    QTemporaryDir dir;
    REQUIRE(dir.isValid());
    const QString workbook = makeDemo(dir);
    const QString copy = dir.filePath(QStringLiteral("copy.mwb"));
    REQUIRE(runMeterwright({QStringLiteral("backup"), workbook, copy}).exitCode == 0);

    const auto restored = runMeterwright({QStringLiteral("restore"), copy, workbook});
    INFO(restored.err.toStdString());
    REQUIRE(restored.exitCode == 0);
    CHECK(restored.outText().contains(QStringLiteral("kept as shop.mwb.before-restore\n")));
    CHECK(QFile::exists(workbook + QStringLiteral(".before-restore")));
    CHECK(runMeterwright({QStringLiteral("verify"), workbook}).exitCode == 0);

    // The name is taken now, so the next replaced file gets a number, and the message says so.
    const auto again = runMeterwright({QStringLiteral("restore"), copy, workbook});
    REQUIRE(again.exitCode == 0);
    CHECK(again.outText().contains(QStringLiteral("kept as shop.mwb.before-restore.2\n")));
    CHECK(QFile::exists(workbook + QStringLiteral(".before-restore.2")));

    const QString fresh = dir.filePath(QStringLiteral("fresh.mwb"));
    const auto created = runMeterwright({QStringLiteral("restore"), copy, fresh});
    REQUIRE(created.exitCode == 0);
    CHECK(created.outText().contains(QStringLiteral("as a new file")));
    CHECK_FALSE(created.outText().contains(QStringLiteral("kept")));
    CHECK(runMeterwright({QStringLiteral("verify"), fresh}).exitCode == 0);
}

TEST_CASE("restore refuses a workbook open in another program, a folder and a missing folder") {
    QTemporaryDir dir;
    REQUIRE(dir.isValid());
    const QString workbook = makeDemo(dir);
    const QString copy = dir.filePath(QStringLiteral("copy.mwb"));
    REQUIRE(runMeterwright({QStringLiteral("backup"), workbook, copy}).exitCode == 0);
    {
        // This test process plays the other program: an open connection that has read the file.
        QSqlDatabase holder =
            QSqlDatabase::addDatabase(QStringLiteral("QSQLITE"), QStringLiteral("holder"));
        holder.setDatabaseName(workbook);
        REQUIRE(holder.open());
        QSqlQuery read(holder);
        REQUIRE(read.exec(QStringLiteral("SELECT count(*) FROM sqlite_master")));
        REQUIRE(read.next());
        const auto refused = requireUsageError({QStringLiteral("restore"), copy, workbook},
                                               "is in use by another program; close it");
        CHECK_FALSE(refused.errText().contains(QStringLiteral(".restoring")));
        CHECK_FALSE(QFile::exists(workbook + QStringLiteral(".before-restore")));
        read.finish();
        holder.close();
    }
    QSqlDatabase::removeDatabase(QStringLiteral("holder"));
    CHECK(runMeterwright({QStringLiteral("verify"), workbook}).exitCode == 0);

    const QString folder = dir.filePath(QStringLiteral("records"));
    REQUIRE(QDir().mkpath(folder));
    requireUsageError({QStringLiteral("restore"), copy, folder}, "is not a file");
    CHECK(QFileInfo(folder).isDir());
    requireUsageError({QStringLiteral("restore"), copy, dir.filePath(QStringLiteral("no/x.mwb"))},
                      "does not exist");
}

TEST_CASE("restore refuses a file that is not a workbook and leaves the workbook alone") {
    QTemporaryDir dir;
    REQUIRE(dir.isValid());
    const QString workbook = makeDemo(dir);
    const QString junk = dir.filePath(QStringLiteral("junk.mwb"));
    QFile file(junk);
    REQUIRE(file.open(QIODevice::WriteOnly));
    file.write("not a workbook\n");
    file.close();

    requireUsageError({QStringLiteral("restore"), junk, workbook}, "not a workbook");
    CHECK_FALSE(QFile::exists(workbook + QStringLiteral(".before-restore")));
    CHECK(runMeterwright({QStringLiteral("verify"), workbook}).exitCode == 0);
    requireUsageError({QStringLiteral("backup")}, "give WORKBOOK and TARGET");
    requireUsageError({QStringLiteral("restore"), junk},
                      "give BACKUP and WORKBOOK (got 1 argument)");
    requireUsageError({QStringLiteral("backup"), junk},
                      "give WORKBOOK and TARGET (got 1 argument)");
    requireUsageError({QStringLiteral("restore"), junk, junk, junk}, "(got 3 arguments)");
}
