// The entry points the window calls: the record and history documents of the open workbook,
// and the print preview, which shows the pages the PDF has. On the invented demo workbook.
#include "app/record/record_actions.h"

#include "app/record/document_output.h"
#include "storage/workbook.h"
#include "support/demo_workbook.h"

#include <catch2/catch.hpp>

#include <QApplication>
#include <QPrintPreviewDialog>
#include <QPrintPreviewWidget>
#include <QTemporaryDir>

using namespace mw;
using namespace mw::record;

using mwtest::readOnlyDemo;

TEST_CASE("the window gets the record of a session and the history of an instrument") {
    const auto record = sessionRecord(readOnlyDemo(), 1);
    REQUIRE(record);
    CHECK(record->title == "Calibration record");
    CHECK_FALSE(sessionRecord(readOnlyDemo(), 99999));
    const auto history = instrumentHistory(readOnlyDemo(), 1);
    REQUIRE(history);
    CHECK(history->title.rfind("Instrument history: ", 0) == 0);
    CHECK_FALSE(instrumentHistory(readOnlyDemo(), 99999));
}

TEST_CASE("the print preview shows the pages the PDF has") {
    auto record = sessionRecord(readOnlyDemo(), 1);
    REQUIRE(record);
    QTemporaryDir dir;
    const int pages = writePdf(*record, dir.filePath(QStringLiteral("r.pdf")), false);
    QPrintPreviewDialog* dialog = previewAndPrint(nullptr, *record);
    REQUIRE(dialog);
    QApplication::processEvents();
    const auto* preview = dialog->findChild<QPrintPreviewWidget*>();
    REQUIRE(preview);
    CHECK(preview->pageCount() == pages);
    CHECK(dialog->printer()->fullPage());
    dialog->close(); // deletes itself
    QApplication::processEvents();
}
