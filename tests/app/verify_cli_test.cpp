// `meterwright verify WORKBOOK` run as a separate process: sound (exit 0), a record edited
// behind the app's back (exit 1, named), and files it cannot open (exit 2, saying why).
#include "storage/instrument_repository.h"
#include "storage/session_repository.h"
#include "storage/user_repository.h"
#include "storage/workbook.h"
#include "support/cli_process.h"
#include "tests/storage/workbook_fixture.h"

#include <catch2/catch.hpp>

#include <QFile>
#include <QJsonDocument>
#include <QJsonObject>
#include <QSqlDatabase>
#include <QSqlQuery>
#include <QTemporaryDir>

#include <chrono>

using mwtest::CliResult;
using mwtest::runMeterwright;

namespace {

mw::Timestamp day(unsigned d, int hour) {
    using namespace std::chrono;
    return mw::Timestamp{sys_days{year{2025} / month{2} / ::std::chrono::day{d}}} + hours{hour};
}

// A workbook with two approved records (invented data); returns the second one's session id.
std::int64_t writeWorkbook(const QString& path) {
    mw::storage::OpenOptions options;
    options.createIfMissing = true;
    mw::storage::Workbook workbook(path, options);
    mw::User tech{0, "tess", "Tess", mw::Role::Technician, true};
    mw::User reviewer{0, "rory", "Rory", mw::Role::Reviewer, true};
    mw::storage::UserRepository users(workbook);
    users.add(tech, QStringLiteral("t-pass"));
    users.add(reviewer, QStringLiteral("r-pass"));
    mw::Instrument meter;
    meter.asset_tag = "VM-7";
    meter.movement = mw::Movement{1e-3, 50.0};
    meter.accuracy_class = 2.5;
    meter.ranges = {
        {0, "10 V", mw::Unit::Volt, 0.0, 10.0, 9950.0, std::nullopt, mw::SignalType::Dc, {}}};
    mw::storage::InstrumentRepository(workbook).add(meter);
    mw::storage::SessionRepository sessions(workbook);
    std::int64_t last = 0;
    for (unsigned d = 1; d <= 2; ++d) {
        mw::CalibrationSession s;
        s.instrument_id = meter.id;
        s.technician_id = tech.id;
        s.started_at = day(d, 9);
        s.readings = {{meter.ranges[0].id, 0, mw::Direction::Up, mw::Phase::AsFound, 1,
                       mw::Unit::Volt, 5.0, 5.04},
                      {meter.ranges[0].id, 0, mw::Direction::Down, mw::Phase::AsFound, 1,
                       mw::Unit::Volt, 5.0, 5.05}};
        sessions.create(s);
        sessions.submit(s.id, day(d, 11));
        sessions.approve(s.id, mwtest::signer(workbook, reviewer.id, QStringLiteral("r-pass")),
                         day(d, 15));
        last = s.id;
    }
    return last;
}

void tamper(const QString& path, std::int64_t sessionId) {
    const QString name = QStringLiteral("tamper");
    {
        QSqlDatabase db = QSqlDatabase::addDatabase(QStringLiteral("QSQLITE"), name);
        db.setDatabaseName(path);
        REQUIRE(db.open());
        QSqlQuery(db).exec(QStringLiteral("DROP TRIGGER readings_frozen_update"));
        QSqlQuery(db).exec(QStringLiteral("DROP TRIGGER readings_range_matches_update"));
        QSqlQuery update(db);
        REQUIRE(update.exec(QStringLiteral("UPDATE readings SET indicated = 5.00 WHERE "
                                           "session_id = %1 AND direction = 'up'")
                                .arg(sessionId)));
        REQUIRE(update.numRowsAffected() == 1);
        db.close();
    }
    QSqlDatabase::removeDatabase(name);
}

// Damages a workbook the way a failing disk would: a filler table large enough to need an
// interior b-tree page is added, then that page's cell pointers are overwritten, which makes
// quick_check report many problems.
void damage(const QString& path) {
    const QString name = QStringLiteral("damage");
    qint64 offset = 0;
    {
        QSqlDatabase db = QSqlDatabase::addDatabase(QStringLiteral("QSQLITE"), name);
        db.setDatabaseName(path);
        REQUIRE(db.open());
        QSqlQuery q(db);
        REQUIRE(q.exec(QStringLiteral("CREATE TABLE filler (id INTEGER PRIMARY KEY, t TEXT)")));
        REQUIRE(q.exec(QStringLiteral(
            "WITH RECURSIVE n(i) AS (SELECT 1 UNION ALL SELECT i + 1 FROM n WHERE i < 3000) "
            "INSERT INTO filler (t) SELECT printf('row %05d of the filler', i) FROM n")));
        REQUIRE(q.exec(QStringLiteral("SELECT rootpage FROM sqlite_master WHERE name = "
                                      "'filler'")));
        REQUIRE(q.next());
        const qint64 root = q.value(0).toLongLong();
        REQUIRE(q.exec(QStringLiteral("PRAGMA page_size")));
        REQUIRE(q.next());
        offset = (root - 1) * q.value(0).toLongLong();
        q.finish();
        db.close();
    }
    QSqlDatabase::removeDatabase(name);
    QFile file(path);
    REQUIRE(file.open(QIODevice::ReadWrite));
    REQUIRE(file.seek(offset + 8));
    file.write(QByteArray(192, char(0xAB)));
}

} // namespace

TEST_CASE("verify: a sound workbook exits 0 and says what was checked", "[verify]") {
    QTemporaryDir dir;
    const QString path = dir.filePath(QStringLiteral("lab.mwb"));
    writeWorkbook(path);
    const CliResult run = runMeterwright({QStringLiteral("verify"), path});
    INFO(run.out.toStdString() << run.err.toStdString());
    CHECK(run.exitCode == 0);
    CHECK(run.outText().contains(QStringLiteral("integrity check: ok")));
    CHECK(run.outText().contains(QStringLiteral("recomputed and matched: 2")));
    CHECK(run.outText().contains(QStringLiteral("result: sound")));
    // The chain head, in the short form people copy: 16 hex digits.
    CHECK(run.outText().contains(
        QRegularExpression(QStringLiteral("chain head: 2 records, last digest [0-9a-f]{16}\n"))));
    CHECK(run.err.isEmpty());
}

TEST_CASE("verify: an edit behind the app's back exits 1 naming the record", "[verify]") {
    QTemporaryDir dir;
    const QString path = dir.filePath(QStringLiteral("lab.mwb"));
    const std::int64_t second = writeWorkbook(path);
    tamper(path, second);
    const CliResult run =
        runMeterwright({QStringLiteral("verify"), path, QStringLiteral("--json")});
    INFO(run.out.toStdString() << run.err.toStdString());
    CHECK(run.exitCode == 1);
    const QJsonObject report = QJsonDocument::fromJson(run.out).object();
    CHECK_FALSE(report.value(QStringLiteral("sound")).toBool());
    CHECK(report.value(QStringLiteral("records_checked")).toInt() == 1);
    // The head is reported in full even when a record no longer matches.
    const QJsonObject head = report.value(QStringLiteral("chain_head")).toObject();
    CHECK(head.value(QStringLiteral("records")).toInt() == 2);
    CHECK(QRegularExpression(QStringLiteral("^[0-9a-f]{64}$"))
              .match(head.value(QStringLiteral("digest")).toString())
              .hasMatch());
    CHECK(report.value(QStringLiteral("first_mismatch_session")).toInteger() == second);
    CHECK(report.value(QStringLiteral("first_mismatch"))
              .toString()
              .startsWith(QStringLiteral("record 2 (session %1").arg(second)));
}

TEST_CASE("verify: files it cannot open exit 2 with the reason", "[verify]") {
    QTemporaryDir dir;
    const QString missing = dir.filePath(QStringLiteral("none.mwb"));
    CliResult run = runMeterwright({QStringLiteral("verify"), missing});
    CHECK(run.exitCode == 2);
    CHECK(run.errText().contains(QStringLiteral("does not exist")));
    CHECK_FALSE(QFile::exists(missing));

    const QString text = dir.filePath(QStringLiteral("notes.txt"));
    {
        QFile file(text);
        REQUIRE(file.open(QIODevice::WriteOnly));
        file.write("not a workbook at all\n");
    }
    run = runMeterwright({QStringLiteral("verify"), text});
    CHECK(run.exitCode == 2);
    CHECK(run.errText().contains(QStringLiteral("not an SQLite database")));
    CHECK(run.errText().count(QLatin1Char('\n')) == 1);

    run = runMeterwright({QStringLiteral("verify")});
    CHECK(run.exitCode == 2);
    CHECK(run.errText().contains(QStringLiteral("exactly one WORKBOOK")));
}

TEST_CASE("verify: a damaged workbook exits 2 with one line naming the first problem", "[verify]") {
    QTemporaryDir dir;
    const QString path = dir.filePath(QStringLiteral("lab.mwb"));
    writeWorkbook(path);
    damage(path);
    const CliResult run = runMeterwright({QStringLiteral("verify"), path});
    const QString err = run.errText();
    INFO(err.toStdString());
    CHECK(run.exitCode == 2);
    CHECK(err.count(QLatin1Char('\n')) == 1);
    CHECK(err.contains(QStringLiteral("is damaged: quick_check reports")));
    CHECK(err.contains(QStringLiteral("page")));
    CHECK(err.contains(QRegularExpression(QStringLiteral("\\(and \\d+ more\\)"))));
    CHECK_FALSE(err.contains(QStringLiteral("***")));
}
