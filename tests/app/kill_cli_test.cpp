// kill -9 at random moments during demo, backup, automatic backup, restore and upgrade: every
// time, the files under their own names are whole and sound, no partial file takes a name or a
// backup slot, and the next run succeeds. The count per writer is bounded (kKills) so that the
// suite stays quick; the moments are drawn from a fixed seed over each command's own duration.
#include "storage/atomic_file.h"
#include "storage/verification.h"
#include "storage/workbook_error.h"
#include "support/cli_process.h"
#include "support/demo_workbook.h"

#include <catch2/catch.hpp>

#include <QDir>
#include <QElapsedTimer>
#include <QFile>
#include <QFileInfo>
#include <QProcess>
#include <QTemporaryDir>

#include <random>

namespace {

constexpr int kKills = 20;

const QString kBinary = QStringLiteral(MW_BINARY_DIR "/app/meterwright");

// Runs the command to its end once and returns how long it took, in milliseconds.
int durationOf(const QStringList& arguments) {
    QElapsedTimer timer;
    timer.start();
    QProcess process;
    process.start(kBinary, arguments);
    REQUIRE(process.waitForFinished(mwtest::kCliTimeoutMs));
    INFO(process.readAllStandardError().toStdString());
    REQUIRE(process.exitCode() == 0);
    return int(timer.elapsed());
}

// Starts the command and kills it (SIGKILL) after `delayMs`, or lets it end if it ends first.
void killAfter(const QStringList& arguments, int delayMs) {
    QProcess process;
    process.start(kBinary, arguments);
    REQUIRE(process.waitForStarted());
    if (!process.waitForFinished(delayMs)) {
        process.kill();
        REQUIRE(process.waitForFinished(mwtest::kCliTimeoutMs));
    }
}

bool sound(const QString& path) {
    try {
        return mw::storage::verifyWorkbookFile(path).sound();
    } catch (const mw::storage::WorkbookError&) {
        return false;
    }
}

bool companion(const QString& name) {
    return name.endsWith(QLatin1String("-wal")) || name.endsWith(QLatin1String("-shm")) ||
           name.endsWith(QLatin1String("-journal"));
}

// The files under their own names; SQLite's -wal / -shm beside a file a killed process had
// open are its own to recover, not files the program wrote.
QStringList visible(const QString& folder) {
    QStringList names;
    for (const QString& name : QDir(folder).entryList(QDir::Files, QDir::Name)) {
        if (!companion(name)) {
            names << name;
        }
    }
    return names;
}

// Partial files, each counted once with its companions.
int partialFiles(const QString& folder) {
    int count = 0;
    for (const QString& name : QDir(folder).entryList(QDir::Files | QDir::Hidden)) {
        count += mw::storage::isPartialName(name) && !companion(name) ? 1 : 0;
    }
    return count;
}

std::mt19937& random() {
    static std::mt19937 generator(20261202);
    return generator;
}

int momentWithin(int durationMs) {
    return std::uniform_int_distribution<int>(0, durationMs * 6 / 5)(random());
}

QString writeDemo(const QString& path) {
    REQUIRE(QFile::copy(mwtest::demoWorkbookPath(), path));
    QFile::setPermissions(path, QFile::ReadOwner | QFile::WriteOwner);
    return path;
}

} // namespace

TEST_CASE("demo killed at random moments: no half workbook, the next run succeeds", "[kill]") {
    QTemporaryDir dir;
    const QString target = dir.filePath(QStringLiteral("demo.mwb"));
    const QStringList arguments{QStringLiteral("demo"), target, QStringLiteral("--as-of"),
                                QStringLiteral("2026-03-16")};
    const int duration = durationOf(arguments);
    QFile::remove(target);
    int completed = 0;
    for (int kill = 0; kill < kKills; ++kill) {
        CAPTURE(kill);
        killAfter(arguments, momentWithin(duration));
        CHECK(partialFiles(dir.path()) <= 1); // the last run's, until the next one clears it
        if (QFileInfo::exists(target)) {
            CHECK(sound(target));
            QFile::remove(target);
            ++completed;
        }
    }
    killAfter(arguments, mwtest::kCliTimeoutMs);
    CHECK(sound(target));
    CHECK(partialFiles(dir.path()) == 0);
    CHECK(completed < kKills); // most runs were cut short
}

TEST_CASE("backups killed at random moments leave no target, and a retry works", "[kill]") {
    QTemporaryDir dir;
    const QString source = writeDemo(dir.filePath(QStringLiteral("lab.mwb")));
    const QString target = dir.filePath(QStringLiteral("copy.mwb"));
    const QStringList arguments{QStringLiteral("backup"), source, target};
    const int duration = durationOf(arguments);
    QFile::remove(target);
    for (int kill = 0; kill < kKills; ++kill) {
        CAPTURE(kill);
        killAfter(arguments, momentWithin(duration));
        if (QFileInfo::exists(target)) {
            CHECK(sound(target));
            QFile::remove(target);
        }
        CHECK(visible(dir.path()) == QStringList{QStringLiteral("lab.mwb")});
    }
    CHECK(mwtest::runMeterwright(arguments).exitCode == 0);
    CHECK(sound(target));
}

TEST_CASE("automatic backups killed at random moments take no slot", "[kill]") {
    QTemporaryDir dir;
    const QString source = writeDemo(dir.filePath(QStringLiteral("lab.mwb")));
    const QString folder = source + QStringLiteral(".backups");
    const QStringList arguments{QStringLiteral("backup"), source, QStringLiteral("--automatic")};
    const int duration = durationOf(arguments);
    for (int kill = 0; kill < kKills; ++kill) {
        CAPTURE(kill);
        QDir(folder).removeRecursively(); // each run is then due
        killAfter(arguments, momentWithin(duration));
        for (const QString& name : visible(folder)) {
            CHECK(sound(QDir(folder).filePath(name)));
        }
        CHECK(visible(folder).size() <= 1);
    }
    QDir(folder).removeRecursively();
    killAfter(arguments, 0);
    const mwtest::CliResult next = mwtest::runMeterwright(arguments);
    CHECK(next.exitCode == 0);
    CHECK(next.outText().contains(QLatin1String("backup written")));
    CHECK(visible(folder).size() == 1);
    CHECK(partialFiles(folder) == 0);
}

TEST_CASE("restores killed at random moments leave a whole workbook in place", "[kill]") {
    QTemporaryDir dir;
    const QString backup = writeDemo(dir.filePath(QStringLiteral("backup.mwb")));
    const QString target = dir.filePath(QStringLiteral("lab.mwb"));
    REQUIRE(QFile::copy(backup, target));
    const QStringList arguments{QStringLiteral("restore"), backup, target};
    const int duration = durationOf(arguments);
    for (int kill = 0; kill < kKills; ++kill) {
        CAPTURE(kill);
        killAfter(arguments, momentWithin(duration));
        REQUIRE(QFileInfo::exists(target)); // one rename replaces it: never absent
        CHECK(sound(target));
        for (const QString& name : visible(dir.path())) {
            if (name.contains(QLatin1String(".before-restore"))) {
                QFile::remove(dir.filePath(name));
            }
        }
    }
    CHECK(mwtest::runMeterwright(arguments).exitCode == 0);
    CHECK(sound(target));
}

TEST_CASE("upgrades killed at random moments leave a whole workbook of either version", "[kill]") {
    QTemporaryDir dir;
    // Both rebuilding steps: version 2 through 3 and 4, and version 3 to 4, in turn.
    const QString fixtures[] = {QStringLiteral(MW_OLD_WORKBOOKS_DIR "/workbook-v2.mwb"),
                                QStringLiteral(MW_OLD_WORKBOOKS_DIR "/workbook-v3.mwb")};
    const QString target = dir.filePath(QStringLiteral("old.mwb"));
    const QStringList arguments{QStringLiteral("upgrade"), target};
    REQUIRE(QFile::copy(fixtures[0], target));
    const int duration = durationOf(arguments);
    for (int kill = 0; kill < kKills; ++kill) {
        const QString& fixture = fixtures[kill % 2];
        CAPTURE(kill, fixture);
        for (const QString& name : QDir(dir.path()).entryList(QDir::Files | QDir::Hidden)) {
            QFile::remove(dir.filePath(name));
        }
        REQUIRE(QFile::copy(fixture, target));
        QFile::setPermissions(target, QFile::ReadOwner | QFile::WriteOwner);
        killAfter(arguments, momentWithin(duration));
        CHECK(sound(target));
        for (const QString& name : visible(dir.path())) {
            CHECK(sound(dir.filePath(name))); // the copy kept before upgrading, if written
        }
        const mwtest::CliResult next = mwtest::runMeterwright(arguments);
        INFO(next.errText().toStdString());
        CHECK(next.exitCode == 0);
    }
}
