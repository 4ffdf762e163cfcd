// Start-up benchmark: from the start of the process to the window's first paint, opening the
// demo workbook and, when given, a large one (about 1,000,000 readings: storage_workbook_bench
// --keep FILE writes it), beside the floor of a minimal Qt window holding one chart, measured
// in the same run. Every sample is a fresh process (this program re-run with --once), so
// library loading and the first read of the file count as they do for a person. Targets: at
// most 1.5 x the floor, and not growing with the workbook's size. Prints medians; not a test.
//
// Usage: app_startup_bench [--large FILE] [--runs N]
#include "app/gui/gui_entry.h"
#include "app/gui/main_window.h"
#include "app/gui/workspace.h"
#include "storage/demo/demo_workbook.h"

#include <QApplication>
#include <QChart>
#include <QChartView>
#include <QFileInfo>
#include <QLineSeries>
#include <QMainWindow>
#include <QProcess>
#include <QTemporaryDir>
#include <QTimer>

#include <algorithm>
#include <chrono>
#include <cstdio>
#include <cstdlib>
#include <cstring>
#include <vector>

namespace {

using Clock = std::chrono::steady_clock;
const Clock::time_point kProcessStart = Clock::now(); // static initialisation: before main()

// Records the first paint of any widget, then ends the process at once (background work such
// as the automatic backup is not waited for: it does not delay the first paint).
class FirstPaint : public QObject {
public:
    bool eventFilter(QObject* watched, QEvent* event) override {
        if (event->type() == QEvent::Paint && !seen_) {
            seen_ = true;
            QTimer::singleShot(0, [] {
                const double ms =
                    std::chrono::duration<double, std::milli>(Clock::now() - kProcessStart).count();
                std::printf("%.3f\n", ms);
                std::fflush(stdout);
                std::_Exit(0);
            });
        }
        return QObject::eventFilter(watched, event);
    }

private:
    bool seen_ = false;
};

int once(int argc, char* argv[], const char* what, const char* path) {
    QApplication app(argc, argv);
    FirstPaint watcher;
    app.installEventFilter(&watcher);
    if (std::strcmp(what, "floor") == 0) {
        QMainWindow window;
        auto* series = new QLineSeries;
        for (int i = 0; i <= 10; ++i) {
            series->append(i, i * 0.1);
        }
        auto* chart = new QChart;
        chart->addSeries(series);
        chart->createDefaultAxes();
        window.setCentralWidget(new QChartView(chart));
        window.resize(1280, 780);
        window.show();
        return QApplication::exec();
    }
    mw::gui::initResources();
    mw::gui::MainWindow window;
    window.resize(1280, 780);
    QString error;
    if (!window.openWorkbook(QString::fromLocal8Bit(path), &error)) {
        std::fprintf(stderr, "bench: %s\n", qPrintable(error));
        return 1;
    }
    window.show();
    return QApplication::exec();
}

double medianOf(const QString& self, const QStringList& arguments, int runs) {
    std::vector<double> times;
    for (int i = 0; i < runs; ++i) {
        QProcess child;
        child.start(self, arguments);
        if (!child.waitForFinished(120000) || child.exitCode() != 0) {
            std::fprintf(stderr, "bench: a run failed: %s\n",
                         child.readAllStandardError().constData());
            std::exit(1);
        }
        times.push_back(child.readAllStandardOutput().trimmed().toDouble());
    }
    std::sort(times.begin(), times.end());
    return times[times.size() / 2];
}

} // namespace

int main(int argc, char* argv[]) {
    if (qEnvironmentVariableIsEmpty("QT_QPA_PLATFORM")) {
        qputenv("QT_QPA_PLATFORM", "offscreen");
    }
    if (argc >= 3 && std::strcmp(argv[1], "--once") == 0) {
        return once(argc, argv, argv[2], argc > 3 ? argv[3] : "");
    }
    QCoreApplication app(argc, argv);
    QString large;
    int runs = 9;
    const QStringList arguments = QCoreApplication::arguments();
    for (int i = 1; i + 1 < arguments.size(); i += 2) {
        if (arguments[i] == QLatin1String("--large")) {
            large = arguments[i + 1];
        } else if (arguments[i] == QLatin1String("--runs")) {
            runs = std::max(1, arguments[i + 1].toInt());
        }
    }
    QTemporaryDir dir;
    const QString demo = dir.filePath(QStringLiteral("demo.meterwright"));
    const auto today = std::chrono::floor<std::chrono::days>(std::chrono::system_clock::now());
    mw::demo::writeDemoWorkbook(demo, today);
    const QString self = QCoreApplication::applicationFilePath();

    medianOf(self, {QStringLiteral("--once"), QStringLiteral("floor")}, 2); // warm the caches
    const double floorMs =
        medianOf(self, {QStringLiteral("--once"), QStringLiteral("floor")}, runs);
    std::printf("floor: minimal window with one chart, first paint  %8.1f ms\n", floorMs);
    const double demoMs =
        medianOf(self, {QStringLiteral("--once"), QStringLiteral("workbook"), demo}, runs);
    std::printf("demo workbook (%5.1f MB), first paint             %8.1f ms  (%.2f x floor; "
                "target <= 1.5)\n",
                double(QFileInfo(demo).size()) / 1e6, demoMs, demoMs / floorMs);
    if (!large.isEmpty()) {
        const double largeMs =
            medianOf(self, {QStringLiteral("--once"), QStringLiteral("workbook"), large}, runs);
        std::printf("large workbook (%5.1f MB), first paint            %8.1f ms  (%.2f x floor, "
                    "%.2f x demo)\n",
                    double(QFileInfo(large).size()) / 1e6, largeMs, largeMs / floorMs,
                    largeMs / demoMs);
    }
    return 0;
}
