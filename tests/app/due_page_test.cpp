// The due view on the demo workbook: exactly the entries of storage's due report (the engine's
// selection), overdue first, overdue ones marked by a shape and words; the window follows the
// lab's setting until changed on the page; a double-click opens the instrument's history.
#include "app/gui/desk/due_page.h"
#include "app/gui/desk/history_page.h"
#include "tests/support/demo_window.h"

#include <catch2/catch.hpp>

#include <QSpinBox>
#include <QTableWidget>
#include <QTest>

using mw::gui::DuePage;
using mw::gui::MainWindow;

TEST_CASE("the due view shows the engine's due list, overdue first") {
    mwtest::DemoWindow lab("rowan", "demo-review");
    lab.window.showPage(MainWindow::Page::Due);
    DuePage* page = lab.window.due();
    REQUIRE(page->report());
    CHECK(page->windowDays()->value() == lab.workspace().lab().due_window_days);
    const auto today = std::chrono::floor<std::chrono::days>(std::chrono::system_clock::now());
    const auto expected =
        mw::storage::dueReport(lab.workbook(), today, page->windowDays()->value());
    int instrumentRow = 0;
    int standardRow = 0;
    for (const mw::DueEntry& entry : expected.entries) {
        QTableWidget* table =
            entry.subject == mw::DueSubject::Instrument ? page->instruments() : page->standards();
        int& row = entry.subject == mw::DueSubject::Instrument ? instrumentRow : standardRow;
        REQUIRE(row < table->rowCount());
        CHECK(table->item(row, 0)->text().toStdString() == entry.assetTag);
        const int stateColumn = entry.subject == mw::DueSubject::Instrument
                                    ? int(DuePage::State)
                                    : int(DuePage::StandardState);
        CHECK(table->item(row, stateColumn)->text().startsWith(mw::gui::dueStateText(entry)));
        const bool overdue = !entry.daysOverdue || *entry.daysOverdue > 0;
        CHECK(table->item(row, stateColumn)->icon().isNull() == !overdue);
        ++row;
    }
    CHECK(instrumentRow == page->instruments()->rowCount());
    CHECK(standardRow == page->standards()->rowCount());
    REQUIRE(standardRow >= 1); // the demo's overdue shunt

    // A wider window lists at least as much.
    const int before = page->instruments()->rowCount();
    page->setWindowDays(366);
    CHECK(page->report()->withinDays == 366);
    CHECK(page->instruments()->rowCount() >= before);

    // Double-click: the instrument's history.
    REQUIRE(page->instruments()->rowCount() > 0);
    const qint64 first = page->instruments()->item(0, 0)->data(Qt::UserRole).toLongLong();
    emit page->instruments()->cellDoubleClicked(0, 0);
    CHECK(lab.window.history()->instrumentId() == first);
}
