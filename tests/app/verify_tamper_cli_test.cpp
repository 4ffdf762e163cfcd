// `meterwright verify` against edits made with the sqlite3 shell (each must be found, exit 1,
// naming the rule, table or record), `repair` after the rules were dropped, and every writer
// under a file-size limit (a full disk): no target and no partial file is left behind.
#include "storage/workbook.h"
#include "support/cli_process.h"
#include "support/demo_workbook.h"
#include "support/sqlite_shell.h"

#include <catch2/catch.hpp>

#include <QDir>
#include <QFile>
#include <QJsonArray>
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

// verify --json exits 1 and one of the problems it lists holds `words`; returns them all.
QString requireUnsound(const QString& path, const QString& words) {
    const CliResult result =
        runMeterwright({QStringLiteral("verify"), path, QStringLiteral("--json")});
    INFO(result.outText().toStdString() << result.errText().toStdString());
    CHECK(result.exitCode == 1);
    const QJsonObject report = QJsonDocument::fromJson(result.out).object();
    CHECK_FALSE(report.value(QStringLiteral("sound")).toBool());
    QStringList problems;
    for (const QJsonValue& problem : report.value(QStringLiteral("problems")).toArray()) {
        problems << problem.toString();
    }
    const QString all = problems.join(QLatin1Char('\n'));
    INFO(all.toStdString());
    CHECK(all.contains(words));
    return all;
}

// Runs `meterwright ARGUMENTS` in bash with files limited to `kilobytes` (SIGXFSZ ignored, so a
// write past it fails as on a full disk instead of killing the process).
CliResult runWithFileLimit(int kilobytes, const QStringList& arguments,
                           const QByteArray& input = {}) {
    QProcess process;
    QStringList quoted;
    for (const QString& argument : arguments) {
        quoted << QLatin1Char('\'') +
                      QString(argument).replace(QLatin1Char('\''), QStringLiteral("'\\''")) +
                      QLatin1Char('\'');
    }
    process.start(QStringLiteral("bash"),
                  {QStringLiteral("-c"),
                   QStringLiteral("trap '' XFSZ; ulimit -f %1; exec '%2' %3")
                       .arg(kilobytes)
                       .arg(QStringLiteral(MW_BINARY_DIR "/app/meterwright"), quoted.join(' '))});
    REQUIRE(process.waitForStarted());
    process.write(input);
    process.closeWriteChannel();
    REQUIRE(process.waitForFinished(mwtest::kCliTimeoutMs));
    return {process.exitCode(), process.readAllStandardOutput(), process.readAllStandardError()};
}

QStringList filesIn(const QString& folder) {
    return QDir(folder).entryList(QDir::Files | QDir::Hidden, QDir::Name);
}

} // namespace

TEST_CASE("verify finds dropped rules, and the workbook opens read-only until repaired",
          "[verify][repair]") {
    QTemporaryDir dir;
    const QString path = copyOfDemo(dir);
    shell(path, dropTriggers(path));
    requireUnsound(path, QStringLiteral("schema: trigger"));
    {
        const mw::storage::Workbook workbook(path);
        CHECK(workbook.isReadOnly());
        CHECK(workbook.readOnlyReason().contains(QLatin1String("meterwright repair")));
    }
    const CliResult wrong = mwtest::runMeterwrightWithInput(
        {QStringLiteral("repair"), path, QStringLiteral("--admin"), QStringLiteral("tess")},
        "demo-tech\n");
    CHECK(wrong.exitCode == 2);
    const CliResult repaired = mwtest::runMeterwrightWithInput(
        {QStringLiteral("repair"), path, QStringLiteral("--admin"), QStringLiteral("morgan")},
        "demo-admin\n");
    INFO(repaired.errText().toStdString());
    REQUIRE(repaired.exitCode == 0);
    CHECK(runMeterwright({QStringLiteral("verify"), path}).exitCode == 0);
    CHECK(shell(path, QStringLiteral("SELECT count(*) FROM audit_log WHERE table_name = "
                                     "'sqlite_master' AND user_id = (SELECT id FROM users WHERE "
                                     "login = 'morgan')")) == QLatin1String("1"));
    CHECK_FALSE(mw::storage::Workbook(path).isReadOnly());
}

TEST_CASE("the audit log edited with the shell is found by the approval that sealed it",
          "[verify][seals]") {
    // The demo's approvals are signed and seal the audit log; rows up to the newest approval
    // are covered, whether the rules stay in place or are dropped for the edit.
    QTemporaryDir dir;
    const QString lastSealed = QStringLiteral("(SELECT max(audit_through_id) FROM record_chain)");
    SECTION("all rows deleted, triggers dropped") {
        const QString path = copyOfDemo(dir);
        shell(path, dropTriggers(path) + QStringLiteral("DELETE FROM audit_log;"));
        requireUnsound(path, QStringLiteral("is missing from the log"));
    }
    SECTION("one row deleted, its rule put back") {
        const QString path = copyOfDemo(dir);
        const QString rule = shell(path, QStringLiteral("SELECT sql FROM sqlite_master WHERE name "
                                                        "= 'audit_log_append_only_delete'"));
        shell(path, QStringLiteral("DROP TRIGGER audit_log_append_only_delete; DELETE FROM "
                                   "audit_log WHERE id = %1 - 10; %2;")
                        .arg(lastSealed, rule));
        requireUnsound(path, QStringLiteral("is missing"));
    }
    SECTION("one row's values edited, triggers dropped") {
        const QString path = copyOfDemo(dir);
        shell(path, dropTriggers(path) +
                        QStringLiteral("UPDATE audit_log SET new_values = '{}' WHERE id = %1 - 3;")
                            .arg(lastSealed));
        requireUnsound(path, QStringLiteral("changed or removed"));
    }
    SECTION("a signature stripped") {
        const QString path = copyOfDemo(dir);
        shell(path, dropTriggers(path, QStringLiteral("record_chain%")) +
                        QStringLiteral("UPDATE record_chain SET signature = NULL, signing_key_id "
                                       "= NULL WHERE id = 40;"));
        requireUnsound(path, QStringLiteral("it is not signed"));
    }
}

TEST_CASE("verify finds a changed rule by its definition", "[verify]") {
    QTemporaryDir dir;
    const QString path = copyOfDemo(dir);
    shell(path, dropTriggers(path, QStringLiteral("readings_frozen_update")) +
                    QStringLiteral("CREATE TRIGGER readings_frozen_update BEFORE UPDATE ON "
                                   "readings WHEN 0 BEGIN SELECT 1; END;"));
    requireUnsound(path,
                   QStringLiteral("trigger readings_frozen_update differs from its definition"));
}

TEST_CASE("verify runs the foreign key check", "[verify]") {
    QTemporaryDir dir;
    const QString path = copyOfDemo(dir);
    // The shell has foreign keys off: a standard behind approved records can be deleted.
    shell(path, dropTriggers(path, QStringLiteral("%reference_standards%")) +
                    QStringLiteral("DELETE FROM reference_standards WHERE id = 1;"));
    requireUnsound(path, QStringLiteral("refers to a missing row of table reference_standards"));
}

TEST_CASE("a value outside its vocabulary in a sealed record names the record, exit 1",
          "[verify]") {
    QTemporaryDir dir;
    const QString path = copyOfDemo(dir);
    const QString session = shell(path, QStringLiteral("SELECT min(id) FROM calibration_sessions "
                                                       "WHERE state = 'approved'"));
    shell(path,
          dropTriggers(path, QStringLiteral("readings_%")) +
              QStringLiteral("PRAGMA ignore_check_constraints = 1; UPDATE readings SET "
                             "direction = 'sideways' WHERE session_id = %1 AND direction = 'up';")
                  .arg(session));
    const QString problems = requireUnsound(path, QStringLiteral("table readings"));
    CHECK(problems.contains(
        QStringLiteral("(session %1): CHECK constraint failed: direction IN").arg(session)));
}

TEST_CASE("a session that is not approved is checked too", "[verify]") {
    QTemporaryDir dir;
    const QString path = copyOfDemo(dir);
    const QString session = shell(path, QStringLiteral("SELECT min(id) FROM calibration_sessions "
                                                       "WHERE state = 'submitted'"));
    REQUIRE_FALSE(session.isEmpty());
    shell(path, dropTriggers(path, QStringLiteral("%calibration_sessions_%")) +
                    dropTriggers(path, QStringLiteral("sessions_%")) +
                    QStringLiteral("UPDATE calibration_sessions SET outcome = CASE outcome WHEN "
                                   "'pass' THEN 'fail' ELSE 'pass' END WHERE id = %1;")
                        .arg(session));
    requireUnsound(path, QStringLiteral("session %1 (").arg(session));
}

TEST_CASE("verify and backup take an older workbook as it is", "[verify][backup]") {
    QTemporaryDir dir;
    const QString path = dir.filePath(QStringLiteral("old.mwb"));
    REQUIRE(QFile::copy(QStringLiteral(MW_OLD_WORKBOOKS_DIR "/workbook-v2.mwb"), path));
    const CliResult verified = runMeterwright({QStringLiteral("verify"), path});
    INFO(verified.outText().toStdString());
    CHECK(verified.exitCode == 0);
    CHECK(verified.outText().contains(QLatin1String("(version 2)")));
    const QString copy = dir.filePath(QStringLiteral("old-copy.mwb"));
    CHECK(runMeterwright({QStringLiteral("backup"), path, copy}).exitCode == 0);
    CHECK(filesIn(dir.path()) ==
          (QStringList{QStringLiteral("old-copy.mwb"), QStringLiteral("old.mwb")}));
    CHECK(runMeterwright({QStringLiteral("verify"), copy}).exitCode == 0);
}

TEST_CASE("every writer on a full disk leaves no file, and a retry works", "[full-disk]") {
    QTemporaryDir dir;
    const QString source = copyOfDemo(dir, QStringLiteral("source.mwb"));
    QTemporaryDir out;
    const QString target = out.filePath(QStringLiteral("made"));
    struct Writer {
        const char* name;
        QStringList arguments;
        QByteArray input;
    };
    const QString session = shell(source, QStringLiteral("SELECT min(id) FROM "
                                                         "calibration_sessions WHERE state = "
                                                         "'approved'"));
    const std::vector<Writer> writers{
        {"demo",
         {QStringLiteral("demo"), target, QStringLiteral("--as-of"), QStringLiteral("2026-03-16")},
         {}},
        {"backup", {QStringLiteral("backup"), source, target}, {}},
        {"new",
         {QStringLiteral("new"), target, QStringLiteral("--lab"), QStringLiteral("Lab"),
          QStringLiteral("--admin"), QStringLiteral("ada")},
         "long-enough-1\n"},
        {"record",
         {QStringLiteral("record"), source, QStringLiteral("--session"), session,
          QStringLiteral("--out"), target},
         {}},
        {"restore", {QStringLiteral("restore"), source, target}, {}},
    };
    for (const Writer& writer : writers) {
        CAPTURE(writer.name);
        const CliResult starved = runWithFileLimit(8, writer.arguments, writer.input);
        INFO(starved.errText().toStdString());
        CHECK(starved.exitCode != 0);
        CHECK(filesIn(out.path()).isEmpty());
        const CliResult retried = runWithFileLimit(1 << 20, writer.arguments, writer.input);
        INFO(retried.errText().toStdString());
        CHECK(retried.exitCode == 0);
        CHECK(filesIn(out.path()) == QStringList{QStringLiteral("made")});
        QFile::remove(target);
    }
    // The automatic backup: nothing takes a slot, and the next run writes it.
    const QStringList automatic{QStringLiteral("backup"), source, QStringLiteral("--automatic")};
    CHECK(runWithFileLimit(8, automatic).exitCode != 0);
    CHECK(filesIn(source + QStringLiteral(".backups")).isEmpty());
    CHECK(runWithFileLimit(1 << 20, automatic).exitCode == 0);
    CHECK(filesIn(source + QStringLiteral(".backups")).size() == 1);
}
