// meterwright upgrade: an older workbook (written by an earlier version of the program, see
// tests/storage/data/README.md) is upgraded in place after a copy is kept; read-only commands
// given an older workbook say to run it and leave the file alone.
#include "support/cli_process.h"

#include <catch2/catch.hpp>

#include <QCryptographicHash>
#include <QFile>
#include <QFileInfo>
#include <QJsonObject>
#include <QTemporaryDir>

using mwtest::runMeterwright;

namespace {

QString copyOfOldWorkbook(const QTemporaryDir& dir) {
    const QString path = dir.filePath(QStringLiteral("old lab.mwb"));
    REQUIRE(QFile::copy(QStringLiteral(MW_OLD_WORKBOOKS_DIR "/workbook-v2.mwb"), path));
    QFile::setPermissions(path, QFile::ReadOwner | QFile::WriteOwner);
    return path;
}

QByteArray hashOf(const QString& path) {
    QFile file(path);
    REQUIRE(file.open(QIODevice::ReadOnly));
    return QCryptographicHash::hash(file.readAll(), QCryptographicHash::Sha256);
}

} // namespace

TEST_CASE("a read-only command given an older workbook says to upgrade it", "[upgrade]") {
    QTemporaryDir dir;
    const QString path = copyOfOldWorkbook(dir);
    const QByteArray before = hashOf(path);
    // verify and backup take an older workbook as it is; listing its sessions needs the upgrade.
    const auto run = runMeterwright({QStringLiteral("sessions"), path});
    CHECK(run.exitCode == 2);
    CHECK(run.errText().contains(QStringLiteral("run \"meterwright upgrade %1\"").arg(path)));
    CHECK(run.errText().count(QLatin1Char('\n')) == 1);
    CHECK(hashOf(path) == before);
}

TEST_CASE("upgrade keeps a copy, upgrades in place, and does nothing the second time",
          "[upgrade]") {
    QTemporaryDir dir;
    const QString path = copyOfOldWorkbook(dir);
    const QByteArray before = hashOf(path);
    auto run = runMeterwright({QStringLiteral("upgrade"), path});
    INFO(run.out.toStdString() << run.err.toStdString());
    REQUIRE(run.exitCode == 0);
    const QString kept = path + QStringLiteral(".before-v4.bak");
    CHECK(run.outText().contains(
        QStringLiteral("upgraded %1 from workbook version 2 to 4; the file as it was is kept as")
            .arg(path)));
    CHECK(run.outText().contains(kept));
    REQUIRE(QFileInfo::exists(kept));
    CHECK(hashOf(kept) != before); // a consistent copy, written by SQLite itself

    // The upgraded workbook verifies: every digest, and outcomes sealed without their inputs
    // counted as such.
    run = runMeterwright({QStringLiteral("verify"), path});
    CHECK(run.exitCode == 0);
    CHECK(run.outText().contains(QStringLiteral("result: sound")));
    CHECK(run.outText().contains(QStringLiteral("not recomputable): 113")));

    const QJsonObject again = mwtest::runJson({QStringLiteral("upgrade"), path});
    CHECK(again.value(QStringLiteral("version_before")).toInt() == 4);
    CHECK(again.value(QStringLiteral("version")).toInt() == 4);
    CHECK(again.value(QStringLiteral("kept_as")).isNull());
    run = runMeterwright({QStringLiteral("upgrade"), path});
    CHECK(run.outText().contains(QStringLiteral("already at workbook version 4")));
}

TEST_CASE("upgrade refuses what is not a workbook and leaves it alone", "[upgrade]") {
    QTemporaryDir dir;
    const QString text = dir.filePath(QStringLiteral("notes.txt"));
    {
        QFile file(text);
        REQUIRE(file.open(QIODevice::WriteOnly));
        file.write("shopping list\n");
    }
    const auto run = runMeterwright({QStringLiteral("upgrade"), text});
    CHECK(run.exitCode == 2);
    CHECK(run.errText().contains(QStringLiteral("not an SQLite database")));
    CHECK(QFileInfo(text).size() == 14);
    CHECK(runMeterwright({QStringLiteral("upgrade")}).exitCode == 2);
}
