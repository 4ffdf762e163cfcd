// Bench screen benchmark: how long one typed value takes to become saved results on screen
// (the reading saved in its own transaction, the session read back and evaluated, the grid,
// results, budget and chart updated) on a calibration of 40 test points read up and down,
// beside the floor of one bare evaluateRange call on the same readings, measured in this run.
// Target: within one frame (16 ms). Prints medians; not a test.
#include "app/gui/bench/bench_view.h"
#include "app/gui/bench/reading_grid_model.h"
#include "app/gui/bench/reading_grid_view.h"
#include "app/gui/bench/session_setup_dialog.h"
#include "app/gui/gui_entry.h"
#include "app/gui/main_window.h"
#include "app/gui/session_edits.h"
#include "app/gui/workspace.h"
#include "core/evaluation/session_evaluation.h"
#include "storage/demo/demo_workbook.h"
#include "storage/instrument_repository.h"
#include "storage/session_repository.h"
#include "storage/standard_repository.h"

#include <QApplication>
#include <QTemporaryDir>

#include <algorithm>
#include <chrono>
#include <cstdio>
#include <vector>

namespace {

using Clock = std::chrono::steady_clock;

double median(std::vector<double> values) {
    std::sort(values.begin(), values.end());
    return values[values.size() / 2];
}

double since(Clock::time_point start) {
    return std::chrono::duration<double, std::milli>(Clock::now() - start).count();
}

} // namespace

int main(int argc, char* argv[]) {
    if (qEnvironmentVariableIsEmpty("QT_QPA_PLATFORM")) {
        qputenv("QT_QPA_PLATFORM", "offscreen");
    }
    QApplication app(argc, argv);
    mw::gui::initResources();
    QTemporaryDir dir;
    const QString path = dir.filePath(QStringLiteral("bench.meterwright"));
    const auto today = std::chrono::floor<std::chrono::days>(std::chrono::system_clock::now());
    mw::demo::writeDemoWorkbook(path, today);

    mw::gui::MainWindow window;
    window.resize(1280, 780);
    window.show();
    QString error;
    if (!window.openWorkbook(path, &error) ||
        !window.signIn(QStringLiteral("tess"), QStringLiteral("demo-tech"))) {
        std::fprintf(stderr, "bench: cannot open the demo: %s\n", qPrintable(error));
        return 1;
    }
    window.workspace().waitForBackgroundWork();
    mw::storage::Workbook& workbook = *window.workbook();
    const auto meter =
        mw::storage::InstrumentRepository(workbook).findByTag(QStringLiteral("CFM-103"));
    const auto calibrator =
        mw::storage::StandardRepository(workbook).findByTag(QStringLiteral("CFS-01"));
    mw::gui::SessionSetup setup;
    setup.ranges = {meter->ranges.front().id};
    setup.phases = mw::PhasePlan::AsFound;
    setup.standards = {{calibrator->id, "", {}, ""}};
    setup.environment = {23.0, 45.0};
    setup.rule = mw::DecisionRule::GuardedAcceptance;
    setup.guardFactor = 1.0;
    setup.method = "Benchmark";
    if (!window.startCalibration(meter->id, setup, &error)) {
        std::fprintf(stderr, "bench: cannot start: %s\n", qPrintable(error));
        return 1;
    }
    const std::int64_t session = *window.bench()->sessionId();
    const std::int64_t rangeId = meter->ranges.front().id;
    // 40 test points across the 10 V scale, each read up-scale and down-scale: 80 readings.
    for (const mw::TestPoint& point :
         mw::effectivePlan(*mw::storage::SessionRepository(workbook).find(session))) {
        window.workspace().edits().removePoint(session, point.range_id, point.point_index);
    }
    for (int i = 0; i < 40; ++i) {
        window.workspace().edits().addPoint(session, rangeId, 0.25 * (i + 1), 1);
    }
    QApplication::processEvents();
    mw::gui::ReadingGridModel* model = window.bench()->gridModel();
    const int rows = model->rowCount();
    const auto type = [&](int row, double offset) {
        const QModelIndex cell = model->index(row, mw::gui::ReadingGridModel::Indicated);
        const double applied = model->index(row, mw::gui::ReadingGridModel::Applied)
                                   .data(mw::gui::ReadingGridModel::ValueRole)
                                   .toDouble();
        model->setData(cell, QString::number(applied + offset, 'f', 4));
        QApplication::processEvents(); // the chart and panels repaint as they would for a person
    };
    for (int row = 0; row < rows; ++row) {
        type(row, 0.002 * (row % 7) - 0.006);
    }

    std::vector<double> typed;
    for (int i = 0; i < 101; ++i) {
        const auto start = Clock::now();
        type(i % rows, 0.001 * (i % 11) - 0.005);
        typed.push_back(since(start));
    }

    // Floor: the engine alone on the same 80 readings.
    const auto stored = *mw::storage::SessionRepository(workbook).find(session);
    const mw::Instrument& instrument = *meter;
    const mw::SealedInputs inputs = mw::sealInputs(instrument, stored, {*calibrator});
    const mw::RangeSpec& range = instrument.ranges.front();
    std::vector<double> bare;
    double sink = 0.0;
    for (int i = 0; i < 101; ++i) {
        const auto start = Clock::now();
        const mw::EvaluationInput input =
            mw::evaluationInputFor(instrument, range, stored, inputs, mw::Phase::AsFound);
        sink += mw::evaluateRange(input).points.size();
        bare.push_back(since(start));
    }
    const double typedMs = median(typed);
    const double floorMs = median(bare);
    std::printf("readings in the session:                       %d (40 points, up and down)\n",
                rows);
    std::printf("floor: bare evaluateRange on them              %8.3f ms\n", floorMs);
    std::printf("typed value -> saved, evaluated, shown         %8.3f ms  (%.1f x floor; "
                "target <= 16 ms)\n",
                typedMs, typedMs / floorMs);
    std::printf("(sink %g)\n", sink);
    return 0;
}
