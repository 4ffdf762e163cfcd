// Editing a workbook behind the program's back, as someone with the sqlite3 shell would: for
// the tests that check verify finds what such edits change.
#pragma once

#include "support/demo_workbook.h"

#include <catch2/catch.hpp>

#include <QFile>
#include <QProcess>
#include <QString>
#include <QTemporaryDir>

namespace mwtest {

// A writable copy of the demo workbook in `dir`.
inline QString copyOfDemo(const QTemporaryDir& dir,
                          const QString& name = QStringLiteral("lab.mwb")) {
    const QString path = dir.filePath(name);
    REQUIRE(QFile::copy(demoWorkbookPath(), path));
    QFile::setPermissions(path, QFile::ReadOwner | QFile::WriteOwner);
    return path;
}

// Runs `sql` with the sqlite3 shell on `path`; returns what it printed.
inline QString shell(const QString& path, const QString& sql) {
    QProcess process;
    process.start(QStringLiteral("sqlite3"), {path, sql});
    REQUIRE(process.waitForFinished(60'000));
    return QString::fromUtf8(process.readAllStandardOutput()).trimmed();
}

// The statements that drop every trigger whose name is LIKE `like`.
inline QString dropTriggers(const QString& path, const QString& like = QStringLiteral("%")) {
    QString drops;
    for (const QString& name :
         shell(path, QStringLiteral("SELECT name FROM sqlite_master WHERE type = 'trigger' AND "
                                    "name LIKE '%1'")
                         .arg(like))
             .split(QLatin1Char('\n'), Qt::SkipEmptyParts)) {
        drops += QStringLiteral("DROP TRIGGER \"%1\";").arg(name);
    }
    return drops;
}

} // namespace mwtest
