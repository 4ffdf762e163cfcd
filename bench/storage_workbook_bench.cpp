// Storage benchmark: builds a workbook of ~1,000,000 readings (2,000 instruments, ten years)
// through the repositories (one bulk transaction, then the approvals), then times opening it, one
// instrument's history, the due list and saving a 40-reading session, each beside a floor measured
// in the same run on a plain SQLite table of the same size. Prints medians; not a test.
//
// Usage: storage_workbook_bench [--instruments N] [--years N] [--keep FILE]
//   --keep FILE  build the workbook at FILE and keep it; an existing FILE is reused as it is.
#include "bench/bench_timing.h"
#include "bench/bench_workbook.h"

#include <QCoreApplication>
#include <QFileInfo>
#include <QSqlDatabase>
#include <QSqlQuery>
#include <QTemporaryDir>
#include <QVariant>

#include <algorithm>
#include <chrono>
#include <cstdio>
#include <functional>
#include <vector>

namespace {

using namespace std::chrono;
using mw::Timestamp;
using mw::storage::Workbook;
using mwbench::build;
using mwbench::medianOf;
using mwbench::millisecondsOf;
using mwbench::People;
using mwbench::sessionOf;
using mwbench::Settings;

// The floor: a plain table of the same number of rows in its own SQLite file, same pragmas,
// 500 rows per key stored together as an instrument's readings are.
struct Floor {
    QString connection = QStringLiteral("bench-floor");
    double insertAllMs = 0.0;
    QSqlDatabase db() const { return QSqlDatabase::database(connection); }
};

void exec(QSqlDatabase db, const QString& text) {
    QSqlQuery q(db);
    if (!q.exec(text)) {
        std::fprintf(stderr, "floor: %s failed\n", qPrintable(text));
    }
}

Floor makeFloor(const QString& path, int rows) {
    Floor baseline;
    QSqlDatabase db = QSqlDatabase::addDatabase(QStringLiteral("QSQLITE"), baseline.connection);
    db.setDatabaseName(path);
    db.open();
    exec(db, QStringLiteral("PRAGMA journal_mode = WAL"));
    exec(db, QStringLiteral("PRAGMA synchronous = NORMAL"));
    exec(db, QStringLiteral("CREATE TABLE rows (id INTEGER PRIMARY KEY, k INTEGER NOT NULL, "
                            "p INTEGER NOT NULL, a REAL NOT NULL, b REAL NOT NULL, u TEXT)"));
    exec(db, QStringLiteral("CREATE INDEX rows_by_k ON rows (k)"));
    baseline.insertAllMs = millisecondsOf([&] {
        db.transaction();
        QSqlQuery q(db);
        q.prepare(QStringLiteral("INSERT INTO rows (k, p, a, b, u) VALUES (?, ?, ?, ?, 'V')"));
        for (int i = 0; i < rows; ++i) {
            q.addBindValue(i / 500); // clustered like one instrument's readings
            q.addBindValue(i % 5);
            q.addBindValue(1.0 + i * 1e-6);
            q.addBindValue(1.0);
            q.exec();
        }
        db.commit();
    });
    return baseline;
}

int countRows(QSqlQuery& q) {
    int n = 0;
    while (q.next()) {
        n += q.value(0).toInt() >= 0 ? 1 : 0;
    }
    return n;
}

struct Line {
    const char* what;
    double ms;
    double targetMs;
    double floorMs;
};

void print(const std::vector<Line>& lines) {
    std::printf("\n%-46s %10s %8s %10s %8s  %s\n", "measure (median)", "ms", "target", "floor ms",
                "x floor", "verdict");
    for (const Line& line : lines) {
        std::printf("%-46s %10.3f %8.0f %10.3f %8.1f  %s\n", line.what, line.ms, line.targetMs,
                    line.floorMs, line.floorMs > 0 ? line.ms / line.floorMs : 0.0,
                    line.targetMs <= 0         ? "-"
                    : line.ms <= line.targetMs ? "ok"
                                               : "MISSED");
    }
}

Settings parse(const QStringList& arguments) {
    Settings settings;
    for (int i = 1; i + 1 < arguments.size(); i += 2) {
        if (arguments[i] == QStringLiteral("--instruments")) {
            settings.instruments = arguments[i + 1].toInt();
        } else if (arguments[i] == QStringLiteral("--years")) {
            settings.years = arguments[i + 1].toInt();
        } else if (arguments[i] == QStringLiteral("--keep")) {
            settings.keep = arguments[i + 1];
        }
    }
    return settings;
}

} // namespace

namespace {

std::vector<Line> measureReads(const QString& path, const Floor& baseline) {
    std::vector<Line> lines;
    const double openMs = medianOf(7, [&](int) { Workbook workbook(path); });
    const double quickCheckFloorMs = medianOf(7, [&](int i) {
        const QString name = QStringLiteral("bench-raw-%1").arg(i);
        {
            QSqlDatabase raw = QSqlDatabase::addDatabase(QStringLiteral("QSQLITE"), name);
            raw.setDatabaseName(path);
            raw.setConnectOptions(QStringLiteral("QSQLITE_OPEN_READONLY")); // as the workbook
            raw.open();
            QSqlQuery q(raw);
            q.exec(QStringLiteral("PRAGMA quick_check"));
            q.next();
        }
        QSqlDatabase::removeDatabase(name);
    });
    lines.push_back({"open workbook (with quick_check)", openMs, 500, quickCheckFloorMs});
    mw::storage::OpenOptions fast;
    fast.quickCheck = false;
    lines.push_back({"open workbook (without quick_check)",
                     medianOf(7, [&](int) { Workbook workbook(path, fast); }), 0,
                     quickCheckFloorMs});

    Workbook workbook(path);
    mw::storage::InstrumentRepository instruments(workbook);
    mw::storage::SessionRepository sessions(workbook);
    const auto count = instruments.count();
    std::printf("workbook: %lld instruments, %lld readings, file %.0f MB\n",
                static_cast<long long>(count), static_cast<long long>(sessions.readingCount()),
                QFileInfo(path).size() / 1e6);
    std::size_t loaded = 0;
    const double historyMs = medianOf(
        101, [&](int i) { loaded += sessions.historyOf(1 + (i * 7919LL) % count).size(); });
    QSqlQuery byKey(baseline.db());
    byKey.prepare(QStringLiteral("SELECT id, k, p, a, b, u FROM rows WHERE k = ?"));
    const double historyFloorMs = medianOf(101, [&](int i) {
        byKey.addBindValue((i * 7919) % 2000); // 500 rows each
        byKey.exec();
        countRows(byKey);
    });
    lines.push_back(
        {"history of one instrument (10 sessions, 500 rdg)", historyMs, 5, historyFloorMs});

    std::size_t due = 0;
    const double dueMs = medianOf(21, [&](int) { due = instruments.dueList().size(); });
    QSqlQuery span(baseline.db());
    span.prepare(QStringLiteral("SELECT id, k, p, a, b, u FROM rows WHERE k BETWEEN ? AND ?"));
    const double dueFloorMs = medianOf(21, [&](int i) {
        span.addBindValue(i * 10);
        span.addBindValue(i * 10 + 3);
        span.exec();
        countRows(span);
    });
    lines.push_back({"due list (2,000 instruments)", dueMs, 20, dueFloorMs});
    std::printf("(loaded %zu sessions in the history runs, due list of %zu lines)\n", loaded, due);
    return lines;
}

std::vector<Line> measureWrites(const QString& path, const Floor& baseline) {
    std::vector<Line> lines;
    Workbook workbook(path);
    mw::storage::UserRepository users(workbook);
    const People people{users.findByLogin(QStringLiteral("bench-tech"))->id,
                        users.findByLogin(QStringLiteral("bench-review"))->id};
    const auto standardId = mw::storage::StandardRepository(workbook).all().front().id;
    mw::storage::InstrumentRepository instruments(workbook);
    mw::storage::SessionRepository sessions(workbook);
    const sys_days today = floor<days>(system_clock::now());
    std::vector<mw::CalibrationSession> saved;
    const double createMs = medianOf(41, [&](int i) {
        const auto instrument = instruments.find(1 + (i * 104729LL) % instruments.count());
        mw::CalibrationSession session =
            sessionOf(*instrument, people, standardId, today + days(1), 40);
        sessions.create(session);
        saved.push_back(session);
    });
    QSqlQuery insert(baseline.db());
    insert.prepare(QStringLiteral("INSERT INTO rows (k, p, a, b, u) VALUES (?, ?, ?, ?, 'V')"));
    const double insertFloorMs = medianOf(41, [&](int i) {
        baseline.db().transaction();
        for (int r = 0; r < 40; ++r) {
            insert.addBindValue(i);
            insert.addBindValue(r);
            insert.addBindValue(1.0);
            insert.addBindValue(1.0);
            insert.exec();
        }
        baseline.db().commit();
    });
    lines.push_back({"save a new 40-reading session (one commit)", createMs, 20, insertFloorMs});
    const double replaceMs = medianOf(41, [&](int i) {
        auto readings = saved[static_cast<std::size_t>(i)].readings;
        for (mw::Reading& reading : readings) {
            reading.applied *= 1.0001;
        }
        sessions.putReadings(saved[static_cast<std::size_t>(i)].id, readings);
    });
    lines.push_back({"re-save the 40 readings of a draft", replaceMs, 20, insertFloorMs});
    const mw::storage::ApprovalSigner signer = mw::storage::unlockApprovalKey(
        workbook, people.reviewer, QStringLiteral("bench-password"), today - days(365 * 20));
    const double approveMs = medianOf(21, [&](int i) {
        const auto& session = saved[static_cast<std::size_t>(i)];
        sessions.submit(session.id, *session.finished_at + minutes(5));
        sessions.approve(session.id, signer, *session.finished_at + minutes(30));
    });
    lines.push_back({"submit + approve (synchronous=FULL)", approveMs, 0, insertFloorMs});
    for (std::size_t i = 21; i < saved.size(); ++i) {
        sessions.removeDraft(saved[i].id); // leave a kept workbook as it was built
    }
    return lines;
}

} // namespace

int main(int argc, char* argv[]) {
    QCoreApplication app(argc, argv);
    const Settings settings = parse(QCoreApplication::arguments());
    QTemporaryDir scratch;
    const QString path =
        settings.keep.isEmpty() ? scratch.filePath(QStringLiteral("bench.mwb")) : settings.keep;
    std::printf("storage benchmark: %s\n", qPrintable(path));
    double buildMs = 0.0;
    if (!QFileInfo::exists(path)) {
        std::printf("building %d instruments x %d years x 50 readings through the repositories, "
                    "one transaction...\n",
                    settings.instruments, settings.years);
        buildMs = millisecondsOf([&] { build(path, settings); });
    } else {
        std::printf("reusing the existing workbook\n");
    }
    const int floorRows = settings.instruments * settings.years * 50;
    std::printf("building the floor table of %d rows...\n", floorRows);
    Floor baseline = makeFloor(scratch.filePath(QStringLiteral("floor.sqlite")), floorRows);

    std::vector<Line> lines;
    if (buildMs > 0) {
        lines.push_back({"build (bulk transaction + approvals), s", buildMs / 1000, 0,
                         baseline.insertAllMs / 1000});
    }
    for (auto&& part : {measureReads(path, baseline), measureWrites(path, baseline)}) {
        lines.insert(lines.end(), part.begin(), part.end());
    }
    print(lines);
    return 0;
}
