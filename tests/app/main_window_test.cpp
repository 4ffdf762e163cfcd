// GUI smoke test: the main window and About box build, show their parts, and close (offscreen).
#include "app/gui/about_dialog.h"
#include "app/gui/gui_entry.h"
#include "app/gui/instrument_detail_panel.h"
#include "app/gui/instrument_list_model.h"
#include "app/gui/main_window.h"
#include "app/gui/safety_notice.h"
#include "app/gui/workspace.h"
#include "storage/backup.h"
#include "storage/chain_anchor.h"
#include "storage/instrument_repository.h"
#include "storage/workbook.h"
#include "support/demo_window.h"

#include <catch2/catch.hpp>

#include <QAbstractItemModelTester>
#include <QApplication>
#include <QCoreApplication>
#include <QFile>
#include <QFileDialog>
#include <QFileInfo>
#include <QLabel>
#include <QLineEdit>
#include <QMenuBar>
#include <QSqlDatabase>
#include <QSqlQuery>
#include <QStatusBar>
#include <QTableView>
#include <QTemporaryDir>
#include <QTest>
#include <QTimer>

using mw::gui::MainWindow;

TEST_CASE("main window opens with a menu bar, an empty register and a status bar") {
    mw::gui::initResources();
    MainWindow window;
    window.show();
    REQUIRE(window.isVisible());

    QStringList menus;
    for (QAction* action : window.menuBar()->actions()) {
        menus << action->text();
    }
    CHECK(menus.contains(QStringLiteral("&Workbook")));
    CHECK(menus.contains(QStringLiteral("&Help")));

    auto* list = window.findChild<QTableView*>(QStringLiteral("instrumentList"));
    REQUIRE(list != nullptr);
    CHECK(list->model()->rowCount() == 0);
    auto* empty = window.findChild<QLabel*>(QStringLiteral("emptyState"));
    REQUIRE(empty != nullptr);
    CHECK(empty->isVisible());
    CHECK(window.statusBar()->currentMessage() == QStringLiteral("No workbook open"));

    CHECK(window.close());
    CHECK_FALSE(window.isVisible());
}

TEST_CASE("register switches from the empty state to the list when rows arrive") {
    MainWindow window;
    window.show();
    mw::gui::InstrumentRow row;
    row.instrumentId = 1;
    row.assetTag = QStringLiteral("T-001");
    row.description = QStringLiteral("Panel voltmeter");
    row.due = QStringLiteral("2027-03-01");
    window.instrumentModel()->setRows({row});
    auto* list = window.findChild<QTableView*>(QStringLiteral("instrumentList"));
    REQUIRE(list != nullptr);
    CHECK(list->isVisible());
    CHECK(list->model()->data(list->model()->index(0, 0)).toString() == QStringLiteral("T-001"));
}

TEST_CASE("instrument list model satisfies the Qt model contract") {
    mw::gui::InstrumentListModel model;
    QAbstractItemModelTester tester(&model, QAbstractItemModelTester::FailureReportingMode::Fatal);
    mw::gui::InstrumentRow row;
    row.instrumentId = 1;
    row.assetTag = QStringLiteral("A");
    model.setRows({row});
    CHECK(model.rowCount() == 1);
    CHECK(model.columnCount() == mw::gui::InstrumentListModel::ColumnCount);
    CHECK(model.headerData(0, Qt::Horizontal).toString() == QStringLiteral("Asset tag"));
}

TEST_CASE("About box names the version and carries the safety notice") {
    mw::gui::AboutDialog dialog;
    auto* heading = dialog.findChild<QLabel*>(QStringLiteral("aboutHeading"));
    REQUIRE(heading != nullptr);
    CHECK(heading->text().contains(QStringLiteral(MW_VERSION)));
    auto* safety = dialog.findChild<QLabel*>(QStringLiteral("aboutSafetyText"));
    REQUIRE(safety != nullptr);
    CHECK(safety->text() == mw::gui::safetyNoticeText());
    // IEC 61010-1 hazardous-live limits (6.3.1 a)), as stated in the notice.
    CHECK(safety->text().contains(QStringLiteral("30 V rms")));
    CHECK(safety->text().contains(QStringLiteral("42.4 V peak")));
    CHECK(safety->text().contains(QStringLiteral("60 V DC")));
}

TEST_CASE("opening a missing workbook fails with a reason and keeps the window empty") {
    MainWindow window;
    QString error;
    CHECK_FALSE(window.openWorkbook(QStringLiteral("/nonexistent/dir/none.mwb"), &error));
    CHECK_FALSE(error.isEmpty());
    CHECK(window.workbook() == nullptr);
    CHECK(window.instrumentModel()->rowCount() == 0);
}

TEST_CASE("opening a workbook fills the register and selecting a row shows the detail") {
    QTemporaryDir dir;
    REQUIRE(dir.isValid());
    const QString path = dir.filePath(QStringLiteral("register.mwb"));
    {
        mw::storage::OpenOptions options;
        options.createIfMissing = true;
        mw::storage::Workbook workbook(path, options);
        mw::Instrument meter;
        meter.asset_tag = "REG-0001";
        meter.description = "Test panel voltmeter";
        meter.kind = mw::InstrumentKind::DcVoltmeter;
        meter.movement = {1e-3, 100.0};
        meter.accuracy_class = 1.5;
        meter.scale_divisions = 50;
        mw::RangeSpec range;
        range.label = "10 V";
        range.unit = mw::Unit::Volt;
        range.full_scale = 10.0;
        range.nominal_ohms = 9900.0;
        meter.ranges.push_back(range);
        mw::storage::InstrumentRepository(workbook).add(meter);
    }
    MainWindow window;
    window.show();
    QString error;
    REQUIRE(window.openWorkbook(path, &error));
    CHECK(error.isEmpty());
    REQUIRE(window.instrumentModel()->rowCount() == 1);
    CHECK(window.instrumentModel()->rowAt(0).assetTag == QStringLiteral("REG-0001"));
    CHECK(window.instrumentModel()->rowAt(0).due == QStringLiteral("Never calibrated"));

    auto* list = window.findChild<QTableView*>(QStringLiteral("instrumentList"));
    REQUIRE(list != nullptr);
    list->setCurrentIndex(list->model()->index(0, 0));
    CHECK(
        window.detailPanel()->fieldText(QStringLiteral("class")).startsWith(QStringLiteral("1.5")));
    CHECK(
        window.detailPanel()->fieldText(QStringLiteral("movement")).contains(QStringLiteral("mA")));
    CHECK(window.statusBar()->currentMessage().contains(QStringLiteral("1 instruments")));

    // Opening a writable workbook keeps the daily rolling backup beside it, written in the
    // background on a connection of its own while the window is already up.
    window.workspace().waitForBackgroundWork();
    QCoreApplication::processEvents();
    CHECK(window.statusBar()->currentMessage().contains(QStringLiteral("automatic backup")));
    CHECK(mw::storage::automaticBackups(path, mw::storage::BackupPolicy{}).size() == 1);
}

TEST_CASE("a workbook the window cannot read is refused with the reason, the window stays") {
    // An older workbook (tests/storage/data/README.md) whose draft has a start that is not a
    // time, as a shell user could have left it: the upgrade refuses it naming the row.
    QTemporaryDir dir;
    const QString path = dir.filePath(QStringLiteral("broken.mwb"));
    REQUIRE(QFile::copy(QStringLiteral(MW_OLD_WORKBOOKS_DIR "/workbook-v2.mwb"), path));
    QFile::setPermissions(path, QFile::ReadOwner | QFile::WriteOwner);
    {
        QSqlDatabase db = QSqlDatabase::addDatabase(QStringLiteral("QSQLITE"), "breaker");
        db.setDatabaseName(path);
        REQUIRE(db.open());
        REQUIRE(QSqlQuery(db).exec(QStringLiteral(
            "UPDATE calibration_sessions SET started_at = 'not a time' WHERE state = 'draft'")));
        db.close();
    }
    QSqlDatabase::removeDatabase(QStringLiteral("breaker"));
    MainWindow window;
    window.show();
    QString error;
    CHECK_FALSE(window.openWorkbook(path, &error));
    CHECK(error.contains(QStringLiteral("table calibration_sessions")));
    CHECK(error.contains(QStringLiteral("started_at")));
    CHECK(window.workbook() == nullptr);
    CHECK(window.isVisible());
    CHECK(window.instrumentModel()->rowCount() == 0);
}

TEST_CASE("Back up now names the chain head of the copy it wrote") {
    mwtest::DemoWindow lab("morgan", "demo-admin");
    const QString target = lab.dir.filePath(QStringLiteral("kept.meterwright"));
    // The save dialog answered as a person does: the proposed name replaced, Enter.
    QTimer::singleShot(0, [&] {
        auto* dialog = qobject_cast<QFileDialog*>(QApplication::activeModalWidget());
        REQUIRE(dialog != nullptr);
        auto* name = dialog->findChild<QLineEdit*>(QStringLiteral("fileNameEdit"));
        REQUIRE(name != nullptr);
        QTest::keyClick(name, Qt::Key_A, Qt::ControlModifier);
        QTest::keyClicks(name, QFileInfo(target).fileName()); // the proposed name's folder
        QTest::keyClick(name, Qt::Key_Return);
    });
    // A dialog still open later is closed with Escape, so that a failure does not hang.
    QTimer::singleShot(20000, [] {
        if (QWidget* open = QApplication::activeModalWidget()) {
            QTest::keyClick(open, Qt::Key_Escape);
        }
    });
    lab.window.backUpNow();
    REQUIRE(QFile::exists(target));
    const mw::storage::ChainHead head = mw::storage::chainHeadOfFile(target);
    REQUIRE(head.length > 0);
    CHECK(lab.window.statusBar()->currentMessage() ==
          QStringLiteral("Backup written to %1 (record chain: %2 approved records, head %3)")
              .arg(target)
              .arg(head.length)
              .arg(head.digest.left(16)));
}
