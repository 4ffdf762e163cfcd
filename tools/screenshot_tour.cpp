// Regenerates the README's screenshots from the demo workbook: opens the window offscreen, signs
// in as the demo's people, walks through the screens as a technician and a reviewer would, and
// writes what each shows to PNG files.
// Usage: meterwright_tour OUTPUT_FOLDER [WORKBOOK]   (a new demo workbook when none is given)
#include "app/gui/admin/instrument_editor.h"
#include "app/gui/admin/range_table.h"
#include "app/gui/bench/bench_view.h"
#include "app/gui/bench/reading_grid_model.h"
#include "app/gui/bench/reading_grid_view.h"
#include "app/gui/bench/session_setup_dialog.h"
#include "app/gui/designer/range_designer_view.h"
#include "app/gui/designer/range_use_box.h"
#include "app/gui/desk/history_page.h"
#include "app/gui/desk/review_page.h"
#include "app/gui/gui_entry.h"
#include "app/gui/main_window.h"
#include "app/gui/register_page.h"
#include "app/gui/workspace.h"
#include "storage/demo/demo_workbook.h"
#include "storage/instrument_repository.h"
#include "storage/session_repository.h"
#include "storage/standard_repository.h"
#include "tests/support/keyboard.h"

#include <QApplication>
#include <QComboBox>
#include <QDir>
#include <QLineEdit>
#include <QPushButton>
#include <QTabWidget>
#include <QTableWidget>
#include <QTemporaryDir>
#include <QTest>

#include <cstdio>
#include <iterator>

namespace {

void save(QWidget& widget, const QString& folder, const QString& name) {
    QApplication::processEvents();
    const QString path = QDir(folder).filePath(name);
    if (!widget.grab().save(path)) {
        std::fprintf(stderr, "tour: cannot write %s\n", qPrintable(path));
        std::exit(1);
    }
    std::printf("tour: %s\n", qPrintable(path));
}

std::optional<std::int64_t> openSessionOf(mw::gui::MainWindow& window, const QString& tag,
                                          mw::SessionState state) {
    mw::storage::Workbook& workbook = *window.workbook();
    const auto instrument = mw::storage::InstrumentRepository(workbook).findByTag(tag);
    if (!instrument) {
        return std::nullopt;
    }
    std::optional<std::int64_t> found;
    for (const auto& s : mw::storage::SessionRepository(workbook).historyOf(instrument->id)) {
        if (s.state == state) {
            found = s.id;
        }
    }
    return found;
}

} // namespace

int main(int argc, char* argv[]) {
    if (qEnvironmentVariableIsEmpty("QT_QPA_PLATFORM")) {
        qputenv("QT_QPA_PLATFORM", "offscreen");
    }
    QApplication app(argc, argv);
    mw::gui::initResources();
    const QStringList arguments = QApplication::arguments();
    if (arguments.size() < 2) {
        std::fprintf(stderr, "usage: meterwright_tour OUTPUT_FOLDER [WORKBOOK]\n");
        return 2;
    }
    const QString folder = arguments.at(1);
    QDir().mkpath(folder);
    QTemporaryDir scratch;
    QString path = arguments.size() > 2 ? arguments.at(2) : QString();
    if (path.isEmpty()) {
        path = scratch.filePath(QStringLiteral("demo.meterwright"));
        const auto today = std::chrono::floor<std::chrono::days>(std::chrono::system_clock::now());
        mw::demo::writeDemoWorkbook(path, today);
    }
    mw::gui::MainWindow window;
    window.resize(1280, 780);
    window.show();
    QApplication::setActiveWindow(&window);
    QString error;
    if (!window.openWorkbook(path, &error) ||
        !window.signIn(QStringLiteral("tess"), QStringLiteral("demo-tech"))) {
        std::fprintf(stderr, "tour: cannot open %s: %s\n", qPrintable(path), qPrintable(error));
        return 1;
    }
    window.workspace().waitForBackgroundWork();
    window.registerPage()->selectByTag(QStringLiteral("CFM-402"));
    save(window, folder, QStringLiteral("register.png"));

    // The draft in progress: as-found readings typed at the bench, advice showing.
    if (const auto draft =
            openSessionOf(window, QStringLiteral("CFM-402"), mw::SessionState::Draft)) {
        window.openCalibration(*draft, &error);
        mw::gui::ReadingGridView* grid = window.bench()->grid();
        mw::gui::ReadingGridModel* model = window.bench()->gridModel();
        for (int row = 0; row < model->rowCount(); ++row) {
            const QModelIndex cell = model->index(row, mw::gui::ReadingGridModel::Indicated);
            if (!cell.data().toString().isEmpty()) {
                continue;
            }
            grid->setCurrentIndex(cell);
            const double applied = model->index(row, mw::gui::ReadingGridModel::Applied)
                                       .data(mw::gui::ReadingGridModel::ValueRole)
                                       .toDouble();
            mwtest::typeInto(grid, QString::number(applied * 1.012 + 0.05, 'f', 2));
        }
        save(window, folder, QStringLiteral("bench.png"));
        window.bench()->findChild<QTabWidget*>()->setCurrentIndex(2);
        save(window, folder, QStringLiteral("bench-advice.png"));
        window.bench()->findChild<QTabWidget*>()->setCurrentIndex(0);
    }

    // A new calibration under guarded acceptance (ILAC G8:09/2019 4.2.2, r = 1): errors inside
    // the limit but within U of it come out as conditional results.
    const auto lab =
        mw::storage::InstrumentRepository(*window.workbook()).findByTag(QStringLiteral("CFM-103"));
    const auto calibrator =
        mw::storage::StandardRepository(*window.workbook()).findByTag(QStringLiteral("CFS-01"));
    if (lab && calibrator) {
        mw::gui::SessionSetup setup;
        setup.ranges = {lab->ranges.front().id};
        setup.phases = mw::PhasePlan::AsFound;
        setup.standards = {{calibrator->id, "", {}, ""}};
        setup.environment = {22.6, 44.0};
        setup.rule = mw::DecisionRule::GuardedAcceptance;
        setup.guardFactor = 1.0;
        setup.method = "Calibrator set to each test point; indication read on the mirror scale.";
        if (!window.startCalibration(lab->id, setup, &error)) {
            std::fprintf(stderr, "tour: cannot start a calibration: %s\n", qPrintable(error));
            return 1;
        }
        mw::gui::ReadingGridView* grid = window.bench()->grid();
        mw::gui::ReadingGridModel* model = window.bench()->gridModel();
        const double offsets[] = {0.01, 0.03, 0.04, 0.045, 0.06, 0.02, -0.01, 0.035, 0.02, 0.0};
        grid->setCurrentIndex(model->index(0, mw::gui::ReadingGridModel::Indicated));
        for (int row = 0; row < model->rowCount(); ++row) {
            const double applied = model->index(row, mw::gui::ReadingGridModel::Applied)
                                       .data(mw::gui::ReadingGridModel::ValueRole)
                                       .toDouble();
            const double offset = offsets[std::size_t(row) % std::size(offsets)];
            mwtest::typeInto(grid, QString::number(applied + offset, 'f', 3));
        }
        save(window, folder, QStringLiteral("bench-guarded.png"));
    }

    // The reviewer's desk: the queue, one calibration under review with a point's budget, and a
    // meter's history with its drift projected to the limit.
    if (window.signIn(QStringLiteral("rowan"), QStringLiteral("demo-review"))) {
        window.showPage(mw::gui::MainWindow::Page::Review);
        mw::gui::ReviewPage* review = window.review();
        if (review->queue()->rowCount() > 0) {
            review->queue()->selectRow(0);
        }
        save(window, folder, QStringLiteral("review-queue.png"));
        if (auto* tabs = review->view()->findChild<QTabWidget*>()) {
            tabs->setCurrentIndex(1);
            review->view()->grid()->setCurrentIndex(
                review->view()->gridModel()->index(2, mw::gui::ReadingGridModel::Indicated));
        }
        save(window, folder, QStringLiteral("review-record.png"));
        window.registerPage()->selectByTag(QStringLiteral("CFM-205"));
        window.showHistoryOfSelected();
        save(window, folder, QStringLiteral("history.png"));
        window.showPage(mw::gui::MainWindow::Page::Due);
        save(window, folder, QStringLiteral("due.png"));
        // Last, so the other pictures show the queue as the demo leaves it: one approval, signed
        // with the reviewer's key.
        window.showPage(mw::gui::MainWindow::Page::Review);
        if (review->queue()->rowCount() > 0) {
            review->queue()->selectRow(0);
            QString message;
            if (review->approve(QStringLiteral("demo-review"), &message)) {
                save(window, folder, QStringLiteral("review-approved.png"));
            }
        }
    }

    // The administrator's instrument editor, a value refused beside its field.
    if (window.signIn(QStringLiteral("morgan"), QStringLiteral("demo-admin"))) {
        window.showPage(mw::gui::MainWindow::Page::Standards);
        save(window, folder, QStringLiteral("standards.png"));
        window.showPage(mw::gui::MainWindow::Page::Register);
        mw::gui::InstrumentEditor editor(window.workspace(), std::nullopt, &window);
        editor.show();
        const auto set = [&editor](const char* name, const QString& text) {
            if (auto* line = editor.findChild<QLineEdit*>(QLatin1String(name))) {
                line->setText(text);
            }
        };
        set("asset_tag", QStringLiteral("CFM-601"));
        set("description", QStringLiteral("Panel voltmeter, 0-30 V DC"));
        set("manufacturer", QStringLiteral("Vennmoor Instruments"));
        set("model", QStringLiteral("P72-V"));
        set("serial", QStringLiteral("V72-2210"));
        set("location", QStringLiteral("Bench 2 test rack"));
        set("owner", QStringLiteral("Shop test bench"));
        set("movement_amps_fs", QStringLiteral("1 mA"));
        set("movement_ohms", QStringLiteral("100"));
        if (auto* accuracy = editor.findChild<QComboBox*>(QStringLiteral("accuracy_class"))) {
            accuracy->setCurrentText(QStringLiteral("1.2"));
        }
        mw::gui::RangeTable* ranges = editor.ranges();
        ranges->item(0, mw::gui::RangeTable::Label)->setText(QStringLiteral("30 V"));
        ranges->item(0, mw::gui::RangeTable::FullScale)->setText(QStringLiteral("30"));
        ranges->item(0, mw::gui::RangeTable::Resistor)->setText(QStringLiteral("29k9"));
        ranges->addRange(mw::Unit::Volt);
        ranges->item(1, mw::gui::RangeTable::Label)->setText(QStringLiteral("50 mV"));
        ranges->item(1, mw::gui::RangeTable::FullScale)->setText(QStringLiteral("50 mV"));
        ranges->resizeColumnsToContents();
        save(editor, folder, QStringLiteral("instrument-editor.png"));

        // The range designer on a bridge rectifier range of the demo, its values taken from the
        // register, with cold diodes so that the loss at the bottom of the scale shows.
        mw::gui::RangeDesignerView designer(window.workspace());
        designer.resize(1280, 780);
        designer.show();
        if (designer.useBox()->choose(QStringLiteral("CFM-404"), QStringLiteral("30 V~"))) {
            auto* take = designer.findChild<QPushButton*>(QStringLiteral("use_take"));
            take->setFocus();
            QTest::keyClick(take, Qt::Key_Space);
        }
        if (auto* celsius =
                designer.findChild<QLineEdit*>(QStringLiteral("rectifier_temperature"))) {
            celsius->setFocus();
            celsius->selectAll();
            QTest::keyClicks(celsius, QStringLiteral("5 °C"));
        }
        save(designer, folder, QStringLiteral("designer.png"));
    }
    return 0;
}
