// `meterwright demo WORKBOOK` run as a separate process: a good run, and the refusals (an
// existing file, a malformed date, a missing file name) with exit code 2 and one line on stderr.
#include "storage/instrument_repository.h"
#include "storage/record_digest.h"
#include "storage/workbook.h"

#include <catch2/catch.hpp>

#include <QCryptographicHash>
#include <QFile>
#include <QJsonDocument>
#include <QJsonObject>
#include <QProcess>
#include <QTemporaryDir>

namespace {

struct Run {
    int exitCode = -1;
    QString out;
    QString err;
};

Run meterwright(const QStringList& arguments) {
    QProcess process;
    process.start(QStringLiteral(MW_BINARY_DIR "/app/meterwright"), arguments);
    REQUIRE(process.waitForFinished(120'000));
    REQUIRE(process.exitStatus() == QProcess::NormalExit);
    return Run{process.exitCode(), QString::fromUtf8(process.readAllStandardOutput()),
               QString::fromUtf8(process.readAllStandardError())};
}

QByteArray fileHash(const QString& path) {
    QFile file(path);
    REQUIRE(file.open(QIODevice::ReadOnly));
    return QCryptographicHash::hash(file.readAll(), QCryptographicHash::Sha256);
}

} // namespace

TEST_CASE("demo writes a sound workbook to a new file and reports what it holds") {
    QTemporaryDir dir;
    const QString path = dir.filePath(QStringLiteral("demo.mwb"));
    const Run run = meterwright({QStringLiteral("demo"), path, QStringLiteral("--as-of"),
                                 QStringLiteral("2026-03-16"), QStringLiteral("--json")});
    INFO(run.err.toStdString());
    REQUIRE(run.exitCode == 0);
    CHECK(run.err.isEmpty());
    const QJsonObject summary = QJsonDocument::fromJson(run.out.toUtf8()).object();
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
    REQUIRE(meterwright({QStringLiteral("demo"), path}).exitCode == 0);
    const QByteArray before = fileHash(path);

    const Run again = meterwright({QStringLiteral("demo"), path});
    CHECK(again.exitCode == 2);
    CHECK(again.out.isEmpty());
    CHECK(again.err.count(QLatin1Char('\n')) == 1);
    CHECK(again.err.contains(QStringLiteral("already exists")));
    CHECK(again.err.contains(path));
    CHECK(fileHash(path) == before);
}

TEST_CASE("demo names what is wrong with its arguments") {
    QTemporaryDir dir;
    const QString path = dir.filePath(QStringLiteral("demo.mwb"));
    const Run badDate = meterwright(
        {QStringLiteral("demo"), path, QStringLiteral("--as-of"), QStringLiteral("16/03/2026")});
    CHECK(badDate.exitCode == 2);
    CHECK(badDate.err.contains(QStringLiteral("--as-of")));
    CHECK(badDate.err.count(QLatin1Char('\n')) == 1);
    CHECK_FALSE(QFile::exists(path));

    const Run noFile = meterwright({QStringLiteral("demo")});
    CHECK(noFile.exitCode == 2);
    CHECK(noFile.err.contains(QStringLiteral("WORKBOOK")));
}
