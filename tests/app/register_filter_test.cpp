// The register's filter and sort on the demo workbook, typed into as a person would: text, kind,
// location, due state and last outcome narrow the list; columns sort by what they mean; the
// selection stays on its instrument across a reload.
#include "app/gui/gui_entry.h"
#include "app/gui/instrument_list_model.h"
#include "app/gui/main_window.h"
#include "app/gui/register_filter.h"
#include "app/gui/register_page.h"
#include "app/gui/workspace.h"
#include "storage/demo/demo_workbook.h"

#include <catch2/catch.hpp>

#include <QAbstractItemModelTester>
#include <QComboBox>
#include <QLineEdit>
#include <QTableView>
#include <QTemporaryDir>
#include <QTest>

#include <chrono>

using mw::gui::InstrumentListModel;

namespace {

QStringList shownTags(const mw::gui::RegisterPage& page) {
    QStringList tags;
    for (int i = 0; i < page.filter()->rowCount(); ++i) {
        tags << page.filter()->index(i, InstrumentListModel::AssetTag).data().toString();
    }
    return tags;
}

void choose(mw::gui::RegisterPage& page, const char* combo, const QString& text) {
    auto* box = page.findChild<QComboBox*>(QLatin1String(combo));
    REQUIRE(box != nullptr);
    const int index = box->findText(text);
    REQUIRE(index >= 0);
    box->setCurrentIndex(index);
}

} // namespace

TEST_CASE("the register filters and sorts the demo's meters and keeps the selection") {
    mw::gui::initResources();
    QTemporaryDir dir;
    const QString path = dir.filePath(QStringLiteral("demo.meterwright"));
    mw::demo::writeDemoWorkbook(
        path, std::chrono::floor<std::chrono::days>(std::chrono::system_clock::now()));
    mw::gui::MainWindow window;
    window.show();
    QString error;
    REQUIRE(window.openWorkbook(path, &error));
    window.workspace().waitForBackgroundWork();
    mw::gui::RegisterPage& page = *window.registerPage();
    QAbstractItemModelTester tester(page.filter(),
                                    QAbstractItemModelTester::FailureReportingMode::Fatal);
    const int all = page.filter()->rowCount();
    REQUIRE(all == 25);

    // Text matches tag, description and location; typed key by key.
    page.search()->setFocus();
    QTest::keyClicks(page.search(), QStringLiteral("bridge"));
    REQUIRE(page.filter()->rowCount() > 0);
    for (int i = 0; i < page.filter()->rowCount(); ++i) {
        const QString words =
            page.filter()->index(i, 0).data(InstrumentListModel::SearchTextRole).toString();
        CHECK(words.contains(QStringLiteral("bridge"), Qt::CaseInsensitive));
    }
    CHECK(shownTags(page).contains(QStringLiteral("CFM-402")));
    CHECK_FALSE(shownTags(page).contains(QStringLiteral("CFM-101")));
    page.search()->clear();
    CHECK(page.filter()->rowCount() == all);

    choose(page, "kindFilter", QStringLiteral("DC ammeter"));
    CHECK(shownTags(page) == QStringList({QStringLiteral("CFM-201"), QStringLiteral("CFM-202"),
                                          QStringLiteral("CFM-203"), QStringLiteral("CFM-204"),
                                          QStringLiteral("CFM-205")}));
    choose(page, "kindFilter", QStringLiteral("All kinds"));

    // Overdue or never calibrated: the same meters the register marks with a caution.
    choose(page, "dueFilter", QStringLiteral("Overdue or never calibrated"));
    REQUIRE(page.filter()->rowCount() > 0);
    for (int i = 0; i < page.filter()->rowCount(); ++i) {
        CHECK_FALSE(
            page.filter()->index(i, InstrumentListModel::Due).data(Qt::DecorationRole).isNull());
    }
    choose(page, "dueFilter", QStringLiteral("Retired"));
    CHECK(shownTags(page) == QStringList{QStringLiteral("CFM-105")});
    choose(page, "dueFilter", QStringLiteral("Any due state"));

    choose(page, "locationFilter", QStringLiteral("Standards room"));
    CHECK(shownTags(page).contains(QStringLiteral("CFM-103")));
    choose(page, "locationFilter", QStringLiteral("Any location"));

    choose(page, "outcomeFilter", QStringLiteral("Never approved"));
    for (int i = 0; i < page.filter()->rowCount(); ++i) {
        CHECK(page.filter()->index(i, InstrumentListModel::LastOutcome).data().toString() ==
              QStringLiteral("—"));
    }
    choose(page, "outcomeFilter", QStringLiteral("Any last outcome"));

    // Sorting the due column puts overdue and never-calibrated meters first, by date.
    page.list()->sortByColumn(InstrumentListModel::Due, Qt::AscendingOrder);
    const auto first = page.filter()->index(0, 0).data(InstrumentListModel::DueStateRole).toInt();
    CHECK((first == int(mw::gui::DueState::Overdue) ||
           first == int(mw::gui::DueState::NeverCalibrated)));
    const auto last =
        page.filter()->index(all - 1, 0).data(InstrumentListModel::DueStateRole).toInt();
    CHECK(last == int(mw::gui::DueState::Retired));

    // The selection stays on its instrument through a reload.
    REQUIRE(page.selectByTag(QStringLiteral("CFM-303")));
    page.reload();
    REQUIRE(page.selectedInstrument());
    CHECK(page.list()->currentIndex().siblingAtColumn(0).data().toString() ==
          QStringLiteral("CFM-303"));
}
