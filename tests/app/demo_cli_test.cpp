// `meterwright demo WORKBOOK` run as a separate process: a good run, and the refusals (an
// existing file, a malformed date, a missing file name) with exit code 2 and one line on stderr.
#include "storage/instrument_repository.h"
#include "storage/verification.h"
#include "storage/workbook.h"
#include "support/cli_process.h"

#include <catch2/catch.hpp>

#include <QCryptographicHash>
#include <QFile>
#include <QJsonDocument>
#include <QJsonObject>
#include <QTemporaryDir>

using mwtest::CliResult;
using mwtest::runMeterwright;

namespace {

QByteArray fileHash(const QString& path) {
    QFile file(path);
    REQUIRE(file.open(QIODevice::ReadOnly));
    return QCryptographicHash::hash(file.readAll(), QCryptographicHash::Sha256);
}

} // namespace

TEST_CASE("demo writes a sound workbook to a new file and reports what it holds") {
    QTemporaryDir dir;
    const QString path = dir.filePath(QStringLiteral("demo.mwb"));
    const CliResult run = runMeterwright({QStringLiteral("demo"), path, QStringLiteral("--as-of"),
                                          QStringLiteral("2026-03-16"), QStringLiteral("--json")});
    INFO(run.err.toStdString());
    REQUIRE(run.exitCode == 0);
    CHECK(run.err.isEmpty());
    const QJsonObject summary = QJsonDocument::fromJson(run.out).object();
    CHECK(summary.value(QStringLiteral("instruments")).toInt() == 25);
    CHECK(summary.value(QStringLiteral("overdue_standards")).toInt() == 1);
    CHECK(summary.value(QStringLiteral("users")).toInt() == 3);
    CHECK(summary.value(QStringLiteral("amendments")).toInt() == 1);

    mw::storage::Workbook workbook(path);
    CHECK(mw::storage::InstrumentRepository(workbook).count() == 25);
    CHECK(mw::storage::verifyWorkbook(workbook).sound());
}

TEST_CASE("demo refuses to write over an existing file and leaves it untouched") {
    QTemporaryDir dir;
    const QString path = dir.filePath(QStringLiteral("demo.mwb"));
    REQUIRE(runMeterwright({QStringLiteral("demo"), path}).exitCode == 0);
    const QByteArray before = fileHash(path);

    const CliResult again =
        mwtest::requireUsageError({QStringLiteral("demo"), path}, "already exists");
    CHECK(again.errText().contains(path));
    CHECK(fileHash(path) == before);
}

TEST_CASE("demo names what is wrong with its arguments") {
    QTemporaryDir dir;
    const QString path = dir.filePath(QStringLiteral("demo.mwb"));
    const CliResult badDate = runMeterwright(
        {QStringLiteral("demo"), path, QStringLiteral("--as-of"), QStringLiteral("16/03/2026")});
    CHECK(badDate.exitCode == 2);
    CHECK(badDate.errText().contains(QStringLiteral("--as-of")));
    CHECK(badDate.errText().count(QLatin1Char('\n')) == 1);
    CHECK_FALSE(QFile::exists(path));

    const CliResult noFile = runMeterwright({QStringLiteral("demo")});
    CHECK(noFile.exitCode == 2);
    CHECK(noFile.errText().contains(QStringLiteral("WORKBOOK")));
}
