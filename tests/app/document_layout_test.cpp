// Pagination of printed documents: tables break between rows only and repeat their header,
// headings stay with what they head, nothing runs past the foot of the page, the end mark never
// stands alone, and the draft watermark is on every page. Documents are invented.
#include "app/record/document_layout.h"

#include <catch2/catch.hpp>

#include <QImage>
#include <QPageSize>
#include <QPainter>

#include <string>

using namespace mw;
using namespace mw::record;

namespace {

// A long table (a many-point session) between headings and paragraphs.
Document longDocument(int rows) {
    Document document;
    document.title = "Calibration record";
    document.identifier = "Record TEST-00001, revision 1";
    document.runningHead = "Test laboratory";
    document.endMark = "End of record TEST-00001.";
    document.blocks.push_back(Heading{"Laboratory and record", 1});
    document.blocks.push_back(
        FieldList{{{"Laboratory", "Test laboratory"}, {"Address", "1 Test Street\nTest Town"}}});
    document.blocks.push_back(Heading{"Results", 1});
    Table table;
    table.columns = {{"Point", Align::Right}, {"Applied", Align::Right}, {"Decision"}};
    for (int i = 1; i <= rows; ++i) {
        table.rows.push_back({std::to_string(i), std::to_string(i) + ".000 V",
                              i % 7 == 0 ? "Conditional pass, within the guard band" : "Pass"});
        table.emphasised.push_back(i % 7 == 0);
    }
    document.blocks.push_back(table);
    document.blocks.push_back(Heading{"Statement of conformity", 1});
    document.blocks.push_back(
        Paragraph{std::string(40, 'x') + " the instrument conforms.", ParagraphStyle::Statement});
    return document;
}

QImage page(int dpi) {
    const QSize size = QPageSize(QPageSize::A4).sizePixels(dpi);
    QImage image(size, QImage::Format_RGB32);
    image.setDotsPerMeterX(qRound(dpi / 0.0254));
    image.setDotsPerMeterY(qRound(dpi / 0.0254));
    image.fill(Qt::white);
    return image;
}

} // namespace

TEST_CASE("a long table breaks between rows, with its header on every page") {
    // Common practice on calibration certificates: no row split, column headings repeated.
    for (int dpi : {100, 600}) {
        const QImage device = page(dpi);
        const Document document = longDocument(150);
        const DocumentLayout layout(document, device, QSizeF(device.size()));
        REQUIRE(layout.pageCount() >= 3);
        std::size_t nextRow = 0;
        for (int p = 0; p < layout.pageCount(); ++p) {
            for (const auto& placed : layout.placements(p)) {
                INFO("page " << p + 1 << " at " << dpi << " dpi");
                CHECK(placed.box.bottom() <= layout.body().bottom() + 0.5);
                CHECK(placed.box.top() >= layout.body().top() - 0.5);
                if (placed.block == 3) { // the table
                    CHECK(placed.header);
                    CHECK(placed.first == nextRow); // rows in order, none twice, none lost
                    CHECK(placed.last > placed.first);
                    nextRow = placed.last;
                }
            }
        }
        CHECK(nextRow == 150);
    }
}

TEST_CASE("a heading is never the last thing on a page") {
    const QImage device = page(100);
    // Enough rows that the table ends near the foot of a page for some length.
    for (int rows = 40; rows <= 90; ++rows) {
        const Document document = longDocument(rows);
        const DocumentLayout layout(document, device, QSizeF(device.size()));
        for (int p = 0; p < layout.pageCount(); ++p) {
            const auto placements = layout.placements(p);
            REQUIRE_FALSE(placements.empty()); // no empty page, nor one with the end mark alone
            const Block& last = document.blocks[placements.back().block];
            INFO(rows << " rows, page " << p + 1);
            CHECK_FALSE(std::holds_alternative<Heading>(last));
        }
    }
}

TEST_CASE("the watermark is painted on every page of a draft and on none of a record") {
    const QImage device = page(100);
    Document draft = longDocument(150);
    draft.watermark = "DRAFT \u2013 NOT A CALIBRATION RECORD";
    const Document record = longDocument(150);
    const DocumentLayout withMark(draft, device, QSizeF(device.size()));
    const DocumentLayout without(record, device, QSizeF(device.size()));
    REQUIRE(withMark.pageCount() == without.pageCount());
    for (int p = 0; p < withMark.pageCount(); ++p) {
        QImage marked = page(100);
        QImage plain = page(100);
        QPainter a(&marked);
        withMark.paintPage(a, p);
        a.end();
        QPainter b(&plain);
        without.paintPage(b, p);
        b.end();
        // The watermark crosses the middle of the page; count the pixels it changed there.
        int changed = 0;
        const QRect middle(marked.width() / 4, marked.height() / 3, marked.width() / 2,
                           marked.height() / 3);
        for (int y = middle.top(); y < middle.bottom(); y += 2) {
            for (int x = middle.left(); x < middle.right(); x += 2) {
                changed += marked.pixel(x, y) != plain.pixel(x, y) ? 1 : 0;
            }
        }
        INFO("page " << p + 1);
        CHECK(changed > 500);
    }
}

TEST_CASE("a superseded banner takes its room on every page") {
    const QImage device = page(100);
    Document plain = longDocument(10);
    Document superseded = plain;
    superseded.banner = "SUPERSEDED. Replaced by record TEST-00002 (revision 2).";
    const DocumentLayout a(plain, device, QSizeF(device.size()));
    const DocumentLayout b(superseded, device, QSizeF(device.size()));
    CHECK(b.body().top() > a.body().top() + 20.0); // a boxed line of bold text and its gap
    CHECK(b.body().bottom() == a.body().bottom());
}
