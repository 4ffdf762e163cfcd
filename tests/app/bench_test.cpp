// The bench driven as a technician drives it, offscreen, through key events only: sign in,
// start a calibration of a demo meter, type the as-found readings cell to cell, adjust, type the
// as-left readings, submit. The workbook is then read back and everything the screen showed is
// compared with the session evaluator on the same inputs. Invented demo data throughout.
#include "app/gui/bench/bench_view.h"
#include "app/gui/bench/reading_grid_model.h"
#include "app/gui/bench/reading_grid_view.h"
#include "app/gui/bench/session_chart_view.h"
#include "app/gui/bench/session_setup_dialog.h"
#include "app/gui/bench/work_panels.h"
#include "app/gui/gui_entry.h"
#include "app/gui/main_window.h"
#include "app/gui/register_page.h"
#include "app/gui/workspace.h"
#include "core/evaluation/session_chart.h"
#include "core/evaluation/session_evaluation.h"
#include "core/plan/session_plan.h"
#include "storage/demo/demo_workbook.h"
#include "storage/instrument_repository.h"
#include "storage/lab_repository.h"
#include "storage/session_repository.h"
#include "storage/standard_repository.h"
#include "tests/support/keyboard.h"

#include <catch2/catch.hpp>

#include <QAbstractItemModelTester>
#include <QApplication>
#include <QChart>
#include <QClipboard>
#include <QFile>
#include <QImage>
#include <QLabel>
#include <QListWidget>
#include <QPushButton>
#include <QTableWidget>
#include <QTemporaryDir>
#include <QUndoStack>

using mw::gui::MainWindow;
using mw::gui::ReadingGridModel;

namespace {

// The demo counts its due dates from the day it is written: today, as the bench works now.
const auto kToday = std::chrono::floor<std::chrono::days>(std::chrono::system_clock::now());

struct Bench {
    QTemporaryDir dir;
    QString path = dir.filePath(QStringLiteral("demo.meterwright"));
    MainWindow window;

    explicit Bench(const char* login = "tess", const char* password = "demo-tech") {
        mw::gui::initResources();
        mw::demo::writeDemoWorkbook(path, kToday);
        window.resize(1280, 780);
        window.show();
        QApplication::setActiveWindow(&window);
        QString error;
        REQUIRE(window.openWorkbook(path, &error));
        REQUIRE(window.signIn(QLatin1String(login), QLatin1String(password)));
        window.workspace().waitForBackgroundWork();
    }
    mw::storage::Workbook& workbook() { return *window.workbook(); }
    mw::Instrument instrument(const char* tag) {
        return *mw::storage::InstrumentRepository(workbook()).findByTag(QLatin1String(tag));
    }
    // Starts a calibration of `tag` as the set-up dialog would make it.
    void start(const char* tag, mw::PhasePlan phases, mw::DecisionRule rule, double r = 0.0) {
        const mw::Instrument meter = instrument(tag);
        mw::gui::SessionSetup setup;
        for (const mw::RangeSpec& range : meter.ranges) {
            setup.ranges.push_back(range.id);
        }
        setup.phases = phases;
        const auto calibrator =
            mw::storage::StandardRepository(workbook()).findByTag(QStringLiteral("CFS-01"));
        setup.standards = {{calibrator->id, "", {}, ""}};
        setup.environment = {22.8, 41.0};
        setup.rule = rule;
        setup.guardFactor = r;
        setup.method = "Calibrator in series; indication read against the applied value.";
        QString error;
        REQUIRE(window.startCalibration(meter.id, setup, &error));
    }
    mw::gui::ReadingGridView* grid() { return window.bench()->grid(); }
    ReadingGridModel* model() { return window.bench()->gridModel(); }
    std::int64_t session() { return *window.bench()->sessionId(); }
    mw::CalibrationSession stored() {
        return *mw::storage::SessionRepository(workbook()).find(session());
    }
    // Types an indication into every row of the shown range and phase, going down with Enter:
    // `errorOf(applied)` is how far the meter reads off.
    template <typename Error>
    void typeColumn(Error errorOf) {
        grid()->setCurrentIndex(model()->index(0, ReadingGridModel::Indicated));
        for (int row = 0; row < model()->rowCount(); ++row) {
            REQUIRE(grid()->currentIndex().row() == row); // Enter moved down
            const double applied = model()
                                       ->index(row, ReadingGridModel::Applied)
                                       .data(ReadingGridModel::ValueRole)
                                       .toDouble();
            mwtest::typeInto(grid(), QString::number(applied + errorOf(applied), 'g', 6));
        }
    }
};

} // namespace

TEST_CASE("a technician types a full calibration with the keyboard and submits it") {
    Bench bench;
    bench.start("CFM-101", mw::PhasePlan::AsFoundAndAsLeft, mw::DecisionRule::SimpleAcceptance);
    QAbstractItemModelTester tester(bench.model(),
                                    QAbstractItemModelTester::FailureReportingMode::Fatal);
    // 0-15 V class 1.5: the limit is ±0.225 V (IEC 60051-1). As found the meter reads 2 % high
    // (0.3 V at full scale: out of tolerance), so it is adjusted.
    REQUIRE(bench.model()->rowCount() == 12); // six marks up, six down
    bench.typeColumn([](double applied) { return 0.02 * applied; });
    CHECK(bench.window.bench()->overallText().contains(QStringLiteral("Fail")));
    QString message;
    REQUIRE(bench.window.bench()->notes()->addNote(QStringLiteral("Span reset with the magnetic "
                                                                  "shunt."),
                                                   &message));
    bench.window.bench()->showRange(bench.model()->rangeId(), mw::Phase::AsLeft);
    bench.typeColumn([](double applied) { return 0.002 * applied; });
    CHECK(bench.window.bench()->overallText().contains(QStringLiteral("Pass")));

    // What is saved is what was typed, and the screen shows the evaluator's results.
    const mw::CalibrationSession stored = bench.stored();
    REQUIRE(stored.readings.size() == 24);
    for (const mw::Reading& reading : stored.readings) {
        const double factor = reading.phase == mw::Phase::AsFound ? 0.02 : 0.002;
        CHECK(*reading.indicated == Approx(reading.applied * (1.0 + factor)).epsilon(1e-9));
    }
    const mw::Instrument meter = bench.instrument("CFM-101");
    const mw::SessionEvaluation evaluation = mw::evaluateSession(
        meter, stored,
        mw::sealInputs(meter, stored, mw::storage::StandardRepository(bench.workbook()).all()));
    REQUIRE(evaluation.overall == mw::Outcome::Pass);
    REQUIRE(evaluation.asFound == mw::Outcome::Fail);
    const mw::EvaluationResult& asLeft = *evaluation.ranges.back().result;
    for (int row = 0; row < bench.model()->rowCount(); ++row) {
        const mw::ReadingKey key = bench.model()->keyAt(row);
        for (const mw::PointResult& point : asLeft.points) {
            if (point.pointIndex == key.point_index) {
                CHECK(bench.model()
                          ->index(row, ReadingGridModel::Uncertainty)
                          .data(ReadingGridModel::ValueRole)
                          .toDouble() == point.budget.expandedRounded);
                CHECK(bench.model()
                          ->index(row, ReadingGridModel::Decision)
                          .data(ReadingGridModel::OutcomeRole)
                          .toInt() == int(point.decision));
            }
        }
    }
    const bool submitted = bench.window.bench()->submit(&message);
    INFO(message.toStdString());
    REQUIRE(submitted);
    CHECK(message.contains(QStringLiteral("Outcome: Pass")));
    CHECK(bench.stored().state == mw::SessionState::Submitted);
    CHECK(bench.stored().outcome == mw::Outcome::Pass);
    // Submitted work is no longer edited on the bench.
    CHECK_FALSE(bench.model()->flags(bench.model()->index(0, ReadingGridModel::Indicated)) &
                Qt::ItemIsEditable);
}

TEST_CASE("an entry that does not parse stays in its cell, marked, and nothing is saved") {
    Bench bench;
    bench.start("CFM-101", mw::PhasePlan::AsFound, mw::DecisionRule::SimpleAcceptance);
    const std::size_t before = bench.stored().readings.size();
    bench.grid()->setCurrentIndex(bench.model()->index(2, ReadingGridModel::Indicated));
    mwtest::typeInto(bench.grid(), QStringLiteral("6..1"));
    const QModelIndex cell = bench.model()->index(2, ReadingGridModel::Indicated);
    CHECK(cell.data(ReadingGridModel::RejectedRole).toBool());
    CHECK(cell.data().toString() == QStringLiteral("6..1"));
    CHECK(cell.data(Qt::ToolTipRole).toString().contains(QStringLiteral("Not saved")));
    CHECK_FALSE(cell.data(Qt::DecorationRole).isNull()); // a shape, not a colour alone
    CHECK(bench.stored().readings.size() == before);
    // A wrong unit is refused the same way; the lab's decimal comma is accepted when set.
    bench.grid()->setCurrentIndex(cell);
    mwtest::typeInto(bench.grid(), QStringLiteral("6 mA"));
    CHECK(cell.data(ReadingGridModel::RejectedRole).toBool());
    mw::storage::LabRepository labs(*bench.window.workspace().workbook());
    mw::Lab lab = *labs.load();
    lab.decimal_comma = true;
    labs.save(lab);
    bench.window.bench()->openSession(*bench.window.bench()->sessionId());
    bench.grid()->setCurrentIndex(cell);
    mwtest::typeInto(bench.grid(), QStringLiteral("6,04"));
    CHECK_FALSE(cell.data(ReadingGridModel::RejectedRole).toBool());
    CHECK(*bench.stored().readings.back().indicated == Approx(6.04).epsilon(1e-12));
}

TEST_CASE("every edit is undone and redone, a pasted column as one step") {
    Bench bench;
    bench.start("CFM-201", mw::PhasePlan::AsFound, mw::DecisionRule::SimpleAcceptance);
    QUndoStack* undo = bench.window.workspace().undoStack();
    // A bare number is in the range's unit: 0-1 A, so "0.402" is 0.402 A.
    QApplication::clipboard()->setText(
        QStringLiteral("0.001\n0.2015\r\n0.402\t(ignored)\n0.603\n"));
    bench.grid()->setCurrentIndex(bench.model()->index(0, ReadingGridModel::Indicated));
    QTest::keyClick(bench.grid(), Qt::Key_V, Qt::ControlModifier);
    REQUIRE(bench.stored().readings.size() == 4);
    CHECK(undo->count() == 1); // one step for the whole paste
    CHECK(*bench.stored().readings[2].indicated == Approx(0.402).epsilon(1e-12));
    mwtest::typeInto(bench.grid(), QStringLiteral("0.5"));
    const auto typed = bench.stored().readings;
    undo->undo();
    undo->undo();
    CHECK(bench.stored().readings.empty());
    CHECK(bench.model()->index(0, ReadingGridModel::Indicated).data().toString().isEmpty());
    undo->redo();
    undo->redo();
    CHECK(bench.stored().readings == typed);
    // A point removed with its readings comes back with them.
    QString message;
    bench.grid()->setCurrentIndex(bench.model()->index(1, ReadingGridModel::Indicated));
    REQUIRE(bench.window.bench()->removeCurrentPoint(&message));
    CHECK(bench.stored().readings.size() == typed.size() - 1);
    undo->undo();
    CHECK(bench.stored().readings == typed);
}

TEST_CASE("a point is added, moved before it is measured, and removed, each undoable") {
    Bench bench;
    bench.start("CFM-103", mw::PhasePlan::AsFound, mw::DecisionRule::SimpleAcceptance);
    QUndoStack* undo = bench.window.workspace().undoStack();
    const int rows = bench.model()->rowCount();
    QString message;
    REQUIRE(bench.window.bench()->addPoint(QStringLiteral("7.5"), &message)); // 0-10 V: volts
    CHECK(bench.model()->rowCount() > rows);
    const mw::TestPoint added = mw::effectivePlan(bench.stored()).back();
    CHECK(added.nominal == 7.5);
    // Move the new point to another value.
    int last = 0;
    while (bench.model()->keyAt(last).point_index != added.point_index) {
        ++last;
    }
    bench.grid()->setCurrentIndex(bench.model()->index(last, ReadingGridModel::Indicated));
    REQUIRE(bench.window.bench()->moveCurrentPoint(QStringLiteral("7500 mV"), &message));
    CHECK(mw::effectivePlan(bench.stored()).back().nominal == Approx(7.5));
    REQUIRE(bench.window.bench()->moveCurrentPoint(QStringLiteral("8.5"), &message));
    CHECK(mw::effectivePlan(bench.stored()).back().nominal == 8.5);
    CHECK(message.contains(QStringLiteral("moved to 8.5")));
    CHECK_FALSE(bench.window.bench()->moveCurrentPoint(QStringLiteral("x"), &message));
    CHECK(message.contains(QStringLiteral("not moved")));
    undo->undo(); // back to 7.5
    CHECK(mw::effectivePlan(bench.stored()).back().nominal == 7.5);
    // Once it holds a reading it stays where it is.
    bench.grid()->setCurrentIndex(bench.model()->index(last, ReadingGridModel::Indicated));
    mwtest::typeInto(bench.grid(), QStringLiteral("7.52"));
    bench.grid()->setCurrentIndex(bench.model()->index(last, ReadingGridModel::Indicated));
    CHECK_FALSE(bench.window.bench()->moveCurrentPoint(QStringLiteral("9"), &message));
    CHECK(message.contains(QStringLiteral("already has readings")));
    CHECK(mw::effectivePlan(bench.stored()).back().nominal == 7.5);
}

TEST_CASE("resistor checks against the engine's design, notes and the session log") {
    Bench bench;
    bench.start("CFM-101", mw::PhasePlan::AsFoundAndAsLeft, mw::DecisionRule::SimpleAcceptance);
    mw::gui::ResistorPanel* resistors = bench.window.bench()->resistors();
    // A 15 V range on a 1 mA, 100 Ω movement: Rs = V / I_fs − R_m = 14.9 kΩ (the multiplier
    // formula of any electrical measurements textbook; common practice).
    const QString designed =
        resistors->findChild<QLabel*>(QStringLiteral("designedResistor"))->text();
    CHECK(designed.contains(QStringLiteral("14.900 kΩ")));
    QString message;
    REQUIRE(resistors->recordMeasured(QStringLiteral("14k95"), &message));   // +0.34 %
    REQUIRE(resistors->recordMeasured(QStringLiteral("15.2 kΩ"), &message)); // +2.0 %
    CHECK_FALSE(resistors->recordMeasured(QStringLiteral("15 V"), &message));
    CHECK(message.contains(QStringLiteral("V")));
    REQUIRE(bench.stored().resistor_checks.size() == 2);
    CHECK(bench.stored().resistor_checks[0].measured_ohms == Approx(14950.0));
    CHECK(bench.stored().resistor_checks[0].computed_ohms == Approx(14900.0));
    QTableWidget* checks = resistors->checks();
    REQUIRE(checks->rowCount() == 2);
    QStringList verdicts;
    for (int row = 0; row < 2; ++row) {
        verdicts << checks->item(row, checks->columnCount() - 1)->text();
    }
    CHECK(verdicts.filter(QStringLiteral("within ±1")).size() == 1); // 1 % resistor, the default
    CHECK(verdicts.filter(QStringLiteral("outside ±1")).size() == 1);

    mw::gui::NotesPanel* notes = bench.window.bench()->notes();
    REQUIRE(notes->addNote(QStringLiteral("Zero reset; span trimmed by 50 Ω."), &message));
    CHECK_FALSE(notes->addNote(QStringLiteral("   "), &message));
    REQUIRE(bench.stored().adjustments.size() == 1);
    CHECK(notes->notes()->count() == 1);
    CHECK(notes->notes()->item(0)->text().contains(QStringLiteral("span trimmed")));
    bench.window.workspace().undoStack()->undo();
    CHECK(bench.stored().adjustments.empty());
    CHECK(notes->notes()->count() == 0);

    // The log says what was saved: typing a reading adds a line naming it.
    bench.grid()->setCurrentIndex(bench.model()->index(1, ReadingGridModel::Indicated));
    mwtest::typeInto(bench.grid(), QStringLiteral("3.02"));
    QTableWidget* log = bench.window.bench()->log()->table();
    QStringList lines;
    for (int row = 0; row < log->rowCount(); ++row) {
        for (int column = 0; column < log->columnCount(); ++column) {
            if (log->item(row, column) != nullptr) {
                lines << log->item(row, column)->text();
            }
        }
    }
    CHECK(lines.filter(QStringLiteral("reading added: point 2")).size() == 1);
    CHECK(lines.filter(QStringLiteral("tess")).size() > 0);
}

TEST_CASE("the chart draws the engine's series, follows the palette and exports PNG and SVG") {
    Bench bench;
    bench.start("CFM-402", mw::PhasePlan::AsFound, mw::DecisionRule::GuardedAcceptance, 1.0);
    bench.typeColumn([](double applied) { return 0.01 * applied - 0.05; });
    mw::gui::SessionChartView* chart = bench.window.bench()->chart();
    const mw::SessionEvaluation evaluation = mw::evaluateSession(
        bench.instrument("CFM-402"), bench.stored(), bench.window.bench()->bench()->inputs());
    const mw::RangeChart expected = mw::rangeChart(
        bench.instrument("CFM-402"), bench.stored(), bench.window.bench()->bench()->inputs(),
        evaluation, bench.instrument("CFM-402").ranges.front().id);
    // The class limit line sits at the engine's limit, and the bridge rectifier's predicted
    // curve is drawn (the range records its diodes).
    const QList<QPointF> limit = chart->seriesPoints(QStringLiteral("Class limit"));
    REQUIRE_FALSE(limit.isEmpty());
    CHECK(limit.front().y() == Approx(expected.limitPercent));
    REQUIRE(expected.predicted);
    CHECK(chart->seriesPoints(QStringLiteral("Diode model")).size() ==
          qsizetype(expected.predicted->points.size()));
    CHECK(chart->seriesPoints(QStringLiteral("Guard band")).size() > 0);
    std::size_t marks = 0;
    for (const mw::ChartSeries& series : expected.series) {
        marks += series.marks.size();
    }
    CHECK(qsizetype(marks) == chart->seriesPoints(QStringLiteral("As-found ▲")).size() +
                                  chart->seriesPoints(QStringLiteral("As-found ▼")).size());

    const QPalette light = QApplication::palette();
    QPalette dark = light;
    dark.setColor(QPalette::Window, QColor(0x20, 0x20, 0x24));
    dark.setColor(QPalette::WindowText, QColor(0xee, 0xee, 0xee));
    dark.setColor(QPalette::Base, QColor(0x18, 0x18, 0x1c));
    dark.setColor(QPalette::Text, QColor(0xee, 0xee, 0xee));
    QApplication::setPalette(dark);
    QApplication::processEvents();
    CHECK(chart->chart()->theme() == QChart::ChartThemeDark);
    QApplication::setPalette(light);
    QApplication::processEvents();
    CHECK(chart->chart()->theme() == QChart::ChartThemeLight);

    QTemporaryDir dir;
    QString error;
    REQUIRE(chart->exportTo(dir.filePath(QStringLiteral("chart.png")), &error));
    CHECK_FALSE(QImage(dir.filePath(QStringLiteral("chart.png"))).isNull());
    REQUIRE(chart->exportTo(dir.filePath(QStringLiteral("chart.svg")), &error));
    QFile svg(dir.filePath(QStringLiteral("chart.svg")));
    REQUIRE(svg.open(QIODevice::ReadOnly));
    CHECK(svg.readAll().contains("<svg"));
    CHECK_FALSE(chart->exportTo(QStringLiteral("/nonexistent/dir/chart.png"), &error));
    CHECK(error.contains(QStringLiteral("cannot be written")));
}

TEST_CASE("submit names the readings still missing and the workbook's refusals") {
    Bench bench;
    bench.start("CFM-103", mw::PhasePlan::AsFound, mw::DecisionRule::GuardedAcceptance, 1.0);
    bench.grid()->setCurrentIndex(bench.model()->index(0, ReadingGridModel::Indicated));
    mwtest::typeInto(bench.grid(), QStringLiteral("0.004"));
    QString message;
    CHECK_FALSE(bench.window.bench()->submit(&message));
    CHECK(message.contains(QStringLiteral("Not submitted")));
    CHECK(message.contains(QStringLiteral("not taken yet")));
    CHECK(message.contains(QStringLiteral("10 V: point 2")));
    CHECK(bench.stored().state == mw::SessionState::Draft);
}

TEST_CASE("a hazardous test value raises the caution banner, not a dialog") {
    Bench bench;
    bench.start("CFM-102", mw::PhasePlan::AsFound, mw::DecisionRule::SimpleAcceptance);
    CHECK_FALSE(bench.window.bench()->cautionShown());
    const int last = bench.model()->rowCount() / 2 - 1; // 300 V up-scale
    bench.grid()->setCurrentIndex(bench.model()->index(last, ReadingGridModel::Indicated));
    mwtest::typeInto(bench.grid(), QStringLiteral("301"));
    CHECK(bench.window.bench()->cautionShown());
    // IEC 61010-1:2010 6.3.1: 60 V DC is the hazardous-live limit for a steady DC voltage.
    CHECK(bench.window.bench()->cautionText().contains(QStringLiteral("60 V DC")));
    CHECK(bench.window.bench()->cautionText().contains(QStringLiteral("local electrical codes")));
}

TEST_CASE("a reviewer cannot calibrate, and signing in checks the password") {
    Bench bench("rowan", "demo-review");
    CHECK_FALSE(bench.window.workspace().can(mw::gui::Capability::Calibrate));
    CHECK(bench.window.workspace().can(mw::gui::Capability::Review));
    bench.window.registerPage()->selectByTag(QStringLiteral("CFM-101"));
    auto* start =
        bench.window.registerPage()->findChild<QPushButton*>(QStringLiteral("startCalibration"));
    REQUIRE(start != nullptr);
    CHECK_FALSE(start->isEnabled());
    CHECK(start->toolTip().contains(QStringLiteral("does not calibrate")));
    CHECK(bench.window.personLabel()->text().contains(QStringLiteral("Rowan Ettrick")));
    CHECK(bench.window.personLabel()->text().contains(QStringLiteral("Reviewer")));
    bench.window.signOut();
    CHECK_FALSE(bench.window.signIn(QStringLiteral("tess"), QStringLiteral("wrong")));
    CHECK_FALSE(bench.window.signIn(QStringLiteral("nobody"), QStringLiteral("demo-tech")));
    CHECK(bench.window.personLabel()->text() == QStringLiteral("Nobody signed in"));
    CHECK(bench.window.signIn(QStringLiteral("tess"), QStringLiteral("demo-tech")));
    CHECK(start->isEnabled());
}
