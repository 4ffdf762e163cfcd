// Killing the program at the bench loses nothing that was shown as accepted: a child process
// (this test program, running its hidden child case) types readings into a calibration through
// key events and reports each one the grid accepted; it is killed with SIGKILL at a random
// moment, and the workbook then opens, passes SQLite's quick_check, and holds every reported
// reading (or the value being typed after it, whose save may have finished before the kill).
#include "app/gui/bench/bench_view.h"
#include "app/gui/bench/reading_grid_model.h"
#include "app/gui/bench/reading_grid_view.h"
#include "app/gui/bench/session_setup_dialog.h"
#include "app/gui/gui_entry.h"
#include "app/gui/main_window.h"
#include "app/gui/workspace.h"
#include "core/plan/session_plan.h"
#include "storage/demo/demo_workbook.h"
#include "storage/instrument_repository.h"
#include "storage/session_repository.h"
#include "storage/sqlite_dialect.h"
#include "storage/standard_repository.h"
#include "tests/support/keyboard.h"

#include <catch2/catch.hpp>

#include <QApplication>
#include <QProcess>
#include <QTemporaryDir>
#include <QThread>

#include <chrono>
#include <cstdio>
#include <map>
#include <random>

using mw::gui::ReadingGridModel;

namespace {

const char* const kWorkbookVariable = "MW_CRASH_WORKBOOK";
const char* const kSessionVariable = "MW_CRASH_SESSION";
const char* const kRoundVariable = "MW_CRASH_ROUND";

QString keyText(const mw::ReadingKey& key) {
    return QStringLiteral("%1/%2/%3/%4/%5")
        .arg(key.range_id)
        .arg(key.point_index)
        .arg(int(key.direction))
        .arg(int(key.phase))
        .arg(key.repeat);
}

// What the child said about one reading: the value last reported saved, and the value it was
// typing when it was killed (if any).
struct Reported {
    std::optional<double> saved;
    std::optional<double> typing;
};

std::map<QString, Reported> readReport(const QByteArray& output) {
    std::map<QString, Reported> report;
    for (const QByteArray& line : output.split('\n')) {
        const QList<QByteArray> words = line.split(' ');
        if (words.size() != 3) {
            continue;
        }
        Reported& entry = report[QString::fromLatin1(words[1])];
        const double value = words[2].toDouble();
        if (words[0] == "typing") {
            entry.typing = value;
        } else if (words[0] == "saved") {
            entry.saved = value;
            entry.typing.reset();
        }
    }
    return report;
}

} // namespace

// The child: opens the workbook as a technician, continues the calibration, and types values
// down the grid, over and over, until it is killed.
TEST_CASE("crash child: type readings until killed", "[.crash-child]") {
    const QString path = qEnvironmentVariable(kWorkbookVariable);
    const auto sessionId = qEnvironmentVariable(kSessionVariable).toLongLong();
    const int round = qEnvironmentVariable(kRoundVariable).toInt();
    REQUIRE(!path.isEmpty());
    mw::gui::initResources();
    mw::gui::MainWindow window;
    window.resize(1200, 760);
    window.show();
    QString error;
    REQUIRE(window.openWorkbook(path, &error));
    REQUIRE(window.signIn(QStringLiteral("tess"), QStringLiteral("demo-tech")));
    REQUIRE(window.openCalibration(sessionId, &error));
    mw::gui::ReadingGridView* grid = window.bench()->grid();
    ReadingGridModel* model = window.bench()->gridModel();
    std::printf("ready\n");
    std::fflush(stdout);
    for (int pass = 0;; ++pass) {
        for (int row = 0; row < model->rowCount(); ++row) {
            const QModelIndex cell = model->index(row, ReadingGridModel::Indicated);
            const double applied = model->index(row, ReadingGridModel::Applied)
                                       .data(ReadingGridModel::ValueRole)
                                       .toDouble();
            const double value = applied + 0.001 * (round * 100 + pass % 100) + 0.0001 * row;
            const QString key = keyText(model->keyAt(row));
            const QString typed = QString::number(value, 'f', 4);
            std::printf("typing %s %s\n", qPrintable(key), qPrintable(typed));
            std::fflush(stdout);
            grid->setCurrentIndex(cell);
            mwtest::typeInto(grid, typed);
            if (!cell.data(ReadingGridModel::RejectedRole).toBool()) {
                std::printf("saved %s %s\n", qPrintable(key), qPrintable(typed));
                std::fflush(stdout);
            }
        }
    }
}

TEST_CASE("readings shown as accepted survive a kill -9 at the bench") {
    QTemporaryDir dir;
    const QString path = dir.filePath(QStringLiteral("bench.meterwright"));
    const auto today = std::chrono::floor<std::chrono::days>(std::chrono::system_clock::now());
    mw::demo::writeDemoWorkbook(path, today);
    std::int64_t sessionId = 0;
    {
        mw::gui::initResources();
        mw::gui::MainWindow window;
        QString error;
        REQUIRE(window.openWorkbook(path, &error));
        REQUIRE(window.signIn(QStringLiteral("tess"), QStringLiteral("demo-tech")));
        window.workspace().waitForBackgroundWork();
        const auto meter = mw::storage::InstrumentRepository(*window.workbook())
                               .findByTag(QStringLiteral("CFM-101"));
        const auto calibrator =
            mw::storage::StandardRepository(*window.workbook()).findByTag(QStringLiteral("CFS-01"));
        mw::gui::SessionSetup setup;
        setup.ranges = {meter->ranges.front().id};
        setup.phases = mw::PhasePlan::AsFound;
        setup.standards = {{calibrator->id, "", {}, ""}};
        setup.environment = {23.0, 45.0};
        setup.method = "Calibrator in parallel; indication read against the applied value.";
        REQUIRE(window.startCalibration(meter->id, setup, &error));
        sessionId = *window.bench()->sessionId();
    }

    std::mt19937 random(20261202); // fixed: a failure can be repeated
    std::uniform_int_distribution<int> delayMs(50, 1500);
    int killedWhileTyping = 0;
    const int rounds = 20;
    for (int round = 0; round < rounds; ++round) {
        QProcess child;
        QProcessEnvironment environment = QProcessEnvironment::systemEnvironment();
        environment.insert(QLatin1String(kWorkbookVariable), path);
        environment.insert(QLatin1String(kSessionVariable), QString::number(sessionId));
        environment.insert(QLatin1String(kRoundVariable), QString::number(round));
        environment.insert(QStringLiteral("QT_QPA_PLATFORM"), QStringLiteral("offscreen"));
        child.setProcessEnvironment(environment);
        child.setProcessChannelMode(QProcess::SeparateChannels);
        child.start(QCoreApplication::applicationFilePath(), {QStringLiteral("[crash-child]")});
        REQUIRE(child.waitForStarted(10000));
        // Wait until it types, then let it type for a random while.
        QByteArray output;
        while (!output.contains("ready\n")) {
            REQUIRE(child.waitForReadyRead(30000));
            output += child.readAllStandardOutput();
        }
        QThread::msleep(static_cast<unsigned long>(delayMs(random)));
        child.kill(); // SIGKILL
        REQUIRE(child.waitForFinished(10000));
        output += child.readAllStandardOutput();
        INFO("round " << round
                      << ", child's errors: " << child.readAllStandardError().toStdString());
        REQUIRE(child.exitStatus() == QProcess::CrashExit);

        const std::map<QString, Reported> report = readReport(output);
        REQUIRE_FALSE(report.empty());
        mw::storage::OpenOptions options;
        options.readOnly = true;
        mw::storage::Workbook workbook(path, options); // runs the cheap checks
        CHECK(mw::storage::dialect::quickCheck(workbook.database()) == QStringLiteral("ok"));
        const auto session = mw::storage::SessionRepository(workbook).find(sessionId);
        REQUIRE(session);
        std::map<QString, double> stored;
        for (const mw::Reading& reading : session->readings) {
            if (reading.indicated) {
                stored[keyText(mw::keyOf(reading))] = *reading.indicated;
            }
        }
        for (const auto& [key, reported] : report) {
            INFO("round " << round << ", reading " << key.toStdString());
            if (!reported.saved && !reported.typing) {
                continue;
            }
            const auto found = stored.find(key);
            if (reported.typing) {
                ++killedWhileTyping;
            }
            if (reported.saved) {
                REQUIRE(found != stored.end());
                const bool savedValue = found->second == Approx(*reported.saved).margin(1e-12);
                const bool typingValue =
                    reported.typing && found->second == Approx(*reported.typing).margin(1e-12);
                CHECK((savedValue || typingValue));
            }
        }
    }
    // The kills landed while typing, not only between values (the moments are random).
    CHECK(killedWhileTyping > 0);
}
