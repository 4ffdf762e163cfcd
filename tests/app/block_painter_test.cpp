// Measuring blocks: tables share the width so that no word is broken while there is room,
// numbers never wrap, field lists of a document share one label column, and a caution's box
// holds its text. Invented content.
#include "app/record/block_painter.h"

#include <catch2/catch.hpp>

#include <QImage>

#include <numeric>

using namespace mw::record;

namespace {

QImage device() {
    QImage image(800, 1100, QImage::Format_RGB32);
    image.setDotsPerMeterX(qRound(100 / 0.0254));
    image.setDotsPerMeterY(qRound(100 / 0.0254));
    return image;
}

double sum(const std::vector<double>& widths) {
    return std::accumulate(widths.begin(), widths.end(), 0.0);
}

} // namespace

TEST_CASE("a table fills the width, and short columns stay on one line") {
    const QImage image = device();
    const PageStyle style(image);
    const double width = style.mm(174.0);
    const BlockPainter painter(style, width);
    Table standards;
    standards.columns = {{"Standard"}, {"Description"}, {"Certificate"}, {"Due"}, {"Used for"}};
    standards.rows = {{"CFS-01",
                       "Multifunction calibrator: DC/AC voltage to 1000 V, DC current "
                       "to 2 A, resistance to 100 MOhm, with its own long description",
                       "EXT-CAL-0412/2024-967", "2025-10-18", "2 A DC for 1 A"}};
    const MeasuredBlock m = painter.measure(standards);
    REQUIRE(m.columns.size() == 5);
    CHECK(sum(m.columns) == Approx(width).epsilon(1e-9));
    // The short columns are as wide as their text on one line; the description wraps.
    const auto oneLine = [&](const std::string& text) {
        return style.textWidth(style.table, QString::fromStdString(text));
    };
    CHECK(m.columns[0] >= oneLine("CFS-01"));
    CHECK(m.columns[3] >= oneLine("2025-10-18"));
    CHECK(m.columns[4] >= oneLine("2 A DC for 1 A"));
    CHECK(m.columns[1] < oneLine(standards.rows[0][1]));
    REQUIRE(m.units.size() == 1);
    CHECK(m.units[0] > 2.0 * style.metrics(style.table).height()); // wrapped onto lines
}

TEST_CASE("numbers keep their width when a table is too wide for the page") {
    const QImage image = device();
    const PageStyle style(image);
    const double width = style.mm(60.0);
    const BlockPainter painter(style, width);
    Table narrow;
    narrow.columns = {{"Applied", Align::Right}, {"Note"}};
    narrow.rows = {{"10.000 V", "a note long enough to wrap over several lines of a column"}};
    const MeasuredBlock m = painter.measure(narrow);
    CHECK(m.columns[0] >= style.textWidth(style.table, QStringLiteral("10.000 V")));
    CHECK(sum(m.columns) == Approx(width).epsilon(1e-9));
}

TEST_CASE("every field list of a document shares one label column") {
    const QImage image = device();
    const PageStyle style(image);
    BlockPainter painter(style, style.mm(174.0));
    Document document;
    document.blocks = {FieldList{{{"A", "1"}}}, FieldList{{{"Reference temperature", "23 C"}}}};
    painter.setLabelWidth(painter.labelWidth(document));
    const MeasuredBlock first = painter.measure(document.blocks[0]);
    const MeasuredBlock second = painter.measure(document.blocks[1]);
    CHECK(first.columns == second.columns);
    CHECK(first.columns[0] >
          style.textWidth(style.bodyBold, QStringLiteral("Reference temperature")));
}

TEST_CASE("boxed paragraphs and headings measure what they hold") {
    const QImage image = device();
    const PageStyle style(image);
    const BlockPainter painter(style, style.mm(174.0));
    const std::string text(600, 'w'); // one long word: broken rather than cut off
    const MeasuredBlock plain = painter.measure(Paragraph{text, ParagraphStyle::Body});
    const MeasuredBlock caution = painter.measure(Paragraph{text, ParagraphStyle::Caution});
    CHECK(plain.units[0] > 3.0 * style.metrics(style.body).height());
    CHECK(caution.units[0] > plain.units[0]); // the box's padding and the caution mark
    const MeasuredBlock heading = painter.measure(Heading{"Results", 1});
    CHECK(heading.keepWithNext);
    CHECK_FALSE(plain.keepWithNext);
}
