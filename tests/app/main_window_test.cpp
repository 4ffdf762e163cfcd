// GUI smoke test: the main window and About box build, show their parts, and close (offscreen).
#include "app/gui/about_dialog.h"
#include "app/gui/gui_entry.h"
#include "app/gui/instrument_list_model.h"
#include "app/gui/main_window.h"
#include "app/gui/safety_notice.h"

#include <catch2/catch.hpp>

#include <QAbstractItemModelTester>
#include <QLabel>
#include <QMenuBar>
#include <QStatusBar>
#include <QTableView>

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
    window.instrumentModel()->setRows(
        {{QStringLiteral("T-001"), QStringLiteral("Panel voltmeter"),
          QStringLiteral("DC voltmeter"), QStringLiteral("In service"),
          QStringLiteral("2027-03-01")}});
    auto* list = window.findChild<QTableView*>(QStringLiteral("instrumentList"));
    REQUIRE(list != nullptr);
    CHECK(list->isVisible());
    CHECK(list->model()->data(list->model()->index(0, 0)).toString() == QStringLiteral("T-001"));
}

TEST_CASE("instrument list model satisfies the Qt model contract") {
    mw::gui::InstrumentListModel model;
    QAbstractItemModelTester tester(&model, QAbstractItemModelTester::FailureReportingMode::Fatal);
    model.setRows({{QStringLiteral("A"), QStringLiteral("B"), QStringLiteral("C"),
                    QStringLiteral("D"), QStringLiteral("E")}});
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
    // IEC 61010-1 hazardous-live limits, as stated in the notice (check-values / IEC 61010-1).
    CHECK(safety->text().contains(QStringLiteral("30 V rms")));
    CHECK(safety->text().contains(QStringLiteral("42.4 V peak")));
    CHECK(safety->text().contains(QStringLiteral("60 V DC")));
}
