// Where documents go: PDF files written whole or not at all, never over a file unless asked,
// the same pages on a printer as in a PDF, and page images for previews. Invented content.
#include "app/record/document_output.h"

#include "support/pdf_text.h"

#include <catch2/catch.hpp>

#include <QDir>
#include <QFile>
#include <QPrinter>
#include <QProcess>
#include <QTemporaryDir>

#include <string>

using namespace mw::record;

namespace {

Document threePages() {
    Document document;
    document.title = "Calibration record";
    document.identifier = "Record TEST-00042, revision 1";
    document.runningHead = "Test laboratory";
    document.endMark = "End of record TEST-00042.";
    Table table;
    table.columns = {{"Point", Align::Right}, {"Decision"}};
    for (int i = 1; i <= 120; ++i) {
        table.rows.push_back({std::to_string(i), "Pass"});
    }
    document.blocks.push_back(Heading{"Results", 1});
    document.blocks.push_back(table);
    return document;
}

QByteArray contents(const QString& path) {
    QFile file(path);
    REQUIRE(file.open(QIODevice::ReadOnly));
    return file.readAll();
}

} // namespace

TEST_CASE("a PDF carries every page with its identity and number") {
    QTemporaryDir dir;
    const QString path = dir.filePath(QStringLiteral("record.pdf"));
    const int pages = writePdf(threePages(), path, false);
    REQUIRE(pages >= 3);
    CHECK(contents(path).startsWith("%PDF-"));
    const QStringList text = mwtest::pdfPages(path);
    REQUIRE(text.size() == pages);
    for (int i = 0; i < pages; ++i) {
        INFO("page " << i + 1);
        CHECK(text[i].contains(QStringLiteral("Record TEST-00042, revision 1")));
        CHECK(text[i].contains(QStringLiteral("Page %1 of %2").arg(i + 1).arg(pages)));
        CHECK(text[i].contains(QStringLiteral("Test laboratory")));
    }
    CHECK(text.last().contains(QStringLiteral("End of record TEST-00042.")));
    CHECK(renderPages(threePages(), 100).size() == std::size_t(pages));
}

TEST_CASE("an existing file is kept unless replacing it is asked for") {
    QTemporaryDir dir;
    const QString path = dir.filePath(QStringLiteral("record.pdf"));
    QFile file(path);
    REQUIRE(file.open(QIODevice::WriteOnly));
    file.write("kept");
    file.close();
    CHECK_THROWS_WITH(writePdf(threePages(), path, false),
                      Catch::Contains("already exists") && Catch::Contains("record.pdf"));
    CHECK(contents(path) == "kept");
    writePdf(threePages(), path, true);
    CHECK(contents(path).startsWith("%PDF-"));
}

TEST_CASE("a file that cannot be written leaves nothing behind") {
    QTemporaryDir dir;
    const QString path = dir.filePath(QStringLiteral("missing-folder/record.pdf"));
    CHECK_THROWS_WITH(writePdf(threePages(), path, false),
                      Catch::Contains("cannot be written") && Catch::Contains("missing-folder"));
    CHECK(QDir(dir.path()).entryList(QDir::AllEntries | QDir::NoDotAndDotDot).isEmpty());
}

TEST_CASE("charts go into the PDF as vector paths, not as pictures") {
    Document document = threePages();
    mw::RangeChart chart;
    chart.upper = 10.0;
    chart.limitPercent = 1.5;
    chart.yExtent = 2.0;
    chart.series = {{mw::Phase::AsFound, mw::Direction::Up, {{5.0, 0.5, 0.2, mw::Outcome::Pass}}}};
    document.blocks.push_back(ErrorChart{"Errors", chart, mw::Unit::Volt});
    QTemporaryDir dir;
    const QString path = dir.filePath(QStringLiteral("chart.pdf"));
    writePdf(document, path, false);
    // pdfimages (poppler) lists every raster image of a PDF after two header lines.
    QProcess images;
    images.start(QStringLiteral("pdfimages"), {QStringLiteral("-list"), path});
    REQUIRE(images.waitForFinished(60'000));
    REQUIRE(images.exitCode() == 0);
    const QStringList lines =
        QString::fromUtf8(images.readAllStandardOutput()).split(QChar('\n'), Qt::SkipEmptyParts);
    CHECK(lines.size() == 2);
}

TEST_CASE("a printer gets the same pages as the PDF") {
    QTemporaryDir dir;
    // A printer printing to a file stands in for a real one (no print server in tests).
    QPrinter printer(QPrinter::HighResolution);
    printer.setOutputFormat(QPrinter::PdfFormat);
    printer.setOutputFileName(dir.filePath(QStringLiteral("printed.pdf")));
    printer.setFullPage(true);
    const int printed = paintDocument(threePages(), printer);
    const int written = writePdf(threePages(), dir.filePath(QStringLiteral("written.pdf")), false);
    CHECK(printed == written);
    CHECK(mwtest::pdfPages(dir.filePath(QStringLiteral("printed.pdf"))).size() == printed);
}
