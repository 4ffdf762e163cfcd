// History benchmark: opening one instrument's history (ten years of records) as the history
// screen and `meterwright history` do — the instrument, its sessions with their readings and
// copies, the standards and users, and buildHistory's evaluations and drift fits — in a
// workbook of ~10,000 readings and in one of ~1,000,000, each beside the floor of the bare
// history query (the SQL reading that instrument's sessions and readings) on the same file in
// the same run. Prints medians and ratios; not a test.
//
// Usage: storage_history_bench [--large FILE] [--small FILE]
//   FILE is built there and kept when missing, reused when present (storage_workbook_bench
//   --keep FILE writes the same large workbook). Without them both are built in a scratch folder.
#include "bench/bench_timing.h"
#include "bench/bench_workbook.h"
#include "core/history/instrument_history.h"

#include <QCoreApplication>
#include <QFileInfo>
#include <QSqlQuery>
#include <QTemporaryDir>
#include <QVariant>

#include <algorithm>
#include <cstdio>
#include <string>
#include <vector>

namespace {

using mw::storage::Workbook;
using mwbench::medianOf;
using mwbench::millisecondsOf;

// One instrument's history, median of a few runs each.
struct Figures {
    double openHistoryMs = 0.0; // everything the screen needs, buildHistory included
    double loadMs = 0.0;        // the sessions with all they hold (historyOf)
    double buildMs = 0.0;       // buildHistory on what was loaded
    double floorMs = 0.0;       // the bare SQL of the sessions and their readings
    std::size_t sessions = 0;
    std::size_t readings = 0;
    std::string what; // the demo meter the instrument was cloned from
};

constexpr int kRuns = 7;
constexpr int kTypes = 20; // catalogue positions present in both workbooks

int drain(QSqlQuery& q) {
    int n = 0;
    while (q.next()) {
        for (int c = 0; c < 4; ++c) {
            n += q.value(c).isNull() ? 0 : 1;
        }
    }
    return n;
}

// The floor: what any history must read, and nothing else, in two statements.
double floorOf(Workbook& workbook, std::int64_t id) {
    QSqlQuery sessions(workbook.database());
    sessions.prepare(QStringLiteral(
        "SELECT id, started_at, state, outcome FROM calibration_sessions WHERE instrument_id = ?"));
    QSqlQuery readings(workbook.database());
    readings.prepare(QStringLiteral(
        "SELECT r.session_id, r.point_index, r.applied, r.indicated, r.range_id, r.direction, "
        "r.phase, r.repeat_number FROM calibration_sessions s JOIN readings r ON r.session_id = "
        "s.id WHERE s.instrument_id = ?"));
    return medianOf(kRuns, [&](int) {
        sessions.addBindValue(qint64(id));
        sessions.exec();
        drain(sessions);
        readings.addBindValue(qint64(id));
        readings.exec();
        drain(readings);
    });
}

// Per catalogue position (the workbooks clone the demo's meters in turn, so instrument i is a
// copy of demo meter i % 25): the same kinds of meter are compared in both workbooks, taken
// from across the large one's register.
std::vector<Figures> measure(const QString& path) {
    Workbook workbook(path);
    mw::storage::InstrumentRepository instruments(workbook);
    mw::storage::SessionRepository sessions(workbook);
    const std::int64_t copies = instruments.count() / 25;
    const auto catalogue = mw::demo::demoInstruments();
    std::vector<Figures> all;
    for (int type = 0; type < kTypes; ++type) {
        const std::int64_t id = 1 + type + 25 * (copies > 1 ? (type * 37 + 11) % copies : 0);
        Figures f;
        f.what = catalogue[static_cast<std::size_t>(type)].asset_tag;
        f.openHistoryMs = medianOf(kRuns, [&](int) {
            const auto instrument = instruments.find(id);
            const auto history = mw::buildHistory(*instrument, sessions.historyOf(instrument->id),
                                                  mw::storage::StandardRepository(workbook).all(),
                                                  mw::storage::UserRepository(workbook).all());
            f.sessions = history.rows.size();
        });
        std::vector<mw::CalibrationSession> loaded;
        f.loadMs = medianOf(kRuns, [&](int) { loaded = sessions.historyOf(id); });
        for (const auto& s : loaded) {
            f.readings += s.readings.size();
        }
        const auto instrument = *instruments.find(id);
        const auto standards = mw::storage::StandardRepository(workbook).all();
        const auto users = mw::storage::UserRepository(workbook).all();
        f.buildMs =
            medianOf(kRuns, [&](int) { mw::buildHistory(instrument, loaded, standards, users); });
        f.floorMs = floorOf(workbook, id);
        all.push_back(f);
    }
    return all;
}

QString prepared(const QString& given, const QTemporaryDir& scratch, const char* name,
                 int instrumentCount) {
    const QString path = given.isEmpty() ? scratch.filePath(QString::fromLatin1(name)) : given;
    if (QFileInfo::exists(path)) {
        std::printf("reusing %s\n", qPrintable(path));
        return path;
    }
    std::printf("building %s: %d instruments x 10 years x 50 readings...\n", qPrintable(path),
                instrumentCount);
    std::fflush(stdout);
    const double ms = millisecondsOf([&] {
        mwbench::build(path, mwbench::Settings{instrumentCount, 10, {}});
    });
    std::printf("  built in %.1f s\n", ms / 1000);
    return path;
}

double summary(const std::vector<Figures>& figures, double Figures::*member, bool worst) {
    std::vector<double> values;
    for (const Figures& f : figures) {
        values.push_back(f.*member);
    }
    return worst ? *std::max_element(values.begin(), values.end()) : mwbench::median(values);
}

} // namespace

int main(int argc, char* argv[]) {
    QCoreApplication app(argc, argv);
    QString large;
    QString small;
    const QStringList arguments = QCoreApplication::arguments();
    for (int i = 1; i + 1 < arguments.size(); i += 2) {
        if (arguments[i] == QStringLiteral("--large")) {
            large = arguments[i + 1];
        } else if (arguments[i] == QStringLiteral("--small")) {
            small = arguments[i + 1];
        } else {
            std::fprintf(stderr, "unknown option %s\n", qPrintable(arguments[i]));
            return 2;
        }
    }
    QTemporaryDir scratch;
    const QString smallPath = prepared(small, scratch, "small.mwb", 20);
    const QString largePath = prepared(large, scratch, "large.mwb", 2000);
    const std::vector<Figures> s = measure(smallPath);
    const std::vector<Figures> l = measure(largePath);
    long long smallReadings = 0;
    long long largeReadings = 0;
    {
        Workbook small(smallPath);
        smallReadings = mw::storage::SessionRepository(small).readingCount();
        Workbook large(largePath);
        largeReadings = mw::storage::SessionRepository(large).readingCount();
    }
    std::printf("\nopen one instrument's history, median of %d runs, ms: 10 k = %lld readings, "
                "1 M = %lld readings\n",
                kRuns, smallReadings, largeReadings);
    std::printf("%-8s %5s %5s | %8s %7s %7s %7s | %8s %7s %7s %7s | %6s\n", "clone of", "cals",
                "rdgs", "10k hist", "load", "build", "floor", "1M hist", "load", "build", "floor",
                "1M/10k");
    for (std::size_t i = 0; i < s.size(); ++i) {
        std::printf("%-8s %5zu %5zu | %8.2f %7.2f %7.2f %7.3f | %8.2f %7.2f %7.2f %7.3f | %6.2f\n",
                    s[i].what.c_str(), l[i].sessions, l[i].readings, s[i].openHistoryMs,
                    s[i].loadMs, s[i].buildMs, s[i].floorMs, l[i].openHistoryMs, l[i].loadMs,
                    l[i].buildMs, l[i].floorMs, l[i].openHistoryMs / s[i].openHistoryMs);
    }
    for (bool worst : {false, true}) {
        const double history = summary(l, &Figures::openHistoryMs, worst);
        const double floor = summary(l, &Figures::floorMs, worst);
        std::printf("%s over the kinds: 1 M history %.2f ms (10 k: %.2f ms), floor %.3f ms (10 k: "
                    "%.3f ms), history x%.0f floor\n",
                    worst ? "worst " : "median", history,
                    summary(s, &Figures::openHistoryMs, worst), floor,
                    summary(s, &Figures::floorMs, worst), history / floor);
    }
    std::vector<double> ratios;
    for (std::size_t i = 0; i < s.size(); ++i) {
        ratios.push_back(l[i].openHistoryMs / s[i].openHistoryMs);
    }
    const double worstMs = summary(l, &Figures::openHistoryMs, true);
    const double ratio = mwbench::median(ratios);
    std::printf("target: under 100 ms for every kind (worst %.1f ms) and flat from 10 k to 1 M "
                "(median ratio %.2f) -> %s\n",
                worstMs, ratio, worstMs < 100.0 && ratio < 1.5 ? "met" : "MISSED");
    return 0;
}
