// Measuring and painting the blocks of a document at one width: the heights of the pieces a
// page may break between (table rows, fields, rows of charts; a whole paragraph or chart), and
// painting a run of those pieces where the page layout put them.
#pragma once

#include "app/record/page_style.h"
#include "core/record/document.h"

#include <QPointF>

#include <vector>

class QPainter;

namespace mw::record {

struct MeasuredBlock {
    std::vector<double> units;   // heights of the pieces, in order
    double header = 0.0;         // repeated above the first piece on every page (table header)
    double spaceBefore = 0.0;    // gap above the block, dropped at the top of a page
    bool keepWithNext = false;   // a heading stays on the page of what it heads
    std::vector<double> columns; // widths: table columns; a field list's label column
};

class BlockPainter {
public:
    BlockPainter(const PageStyle& style, double width);

    // One label column for every field list of a document, so that they line up: the widest
    // label, within a limit (longer labels wrap).
    double labelWidth(const Document& document) const;
    void setLabelWidth(double width);

    MeasuredBlock measure(const Block& block) const;
    // Paints pieces [first, last) of `block` with their top-left at `origin`, the header first
    // when `withHeader`.
    void paint(QPainter& painter, const Block& block, const MeasuredBlock& measured, QPointF origin,
               std::size_t first, std::size_t last, bool withHeader) const;

private:
    double labelWidth(const std::vector<const FieldList*>& lists) const;
    MeasuredBlock measureTable(const Table& table) const;
    std::vector<double> columnWidths(const Table& table) const;
    double leadingGap(const Table& table, std::size_t column) const;
    double longestWord(const QFont& font, const std::string& text) const;
    MeasuredBlock measureFields(const FieldList& list) const;
    MeasuredBlock measureDriftGrid(const DriftChartGrid& grid) const;
    double paragraphPadding(ParagraphStyle style) const;
    const QFont& paragraphFont(ParagraphStyle style) const;
    double cellPadding() const;
    double driftCellWidth() const;
    double driftCellHeight(const DriftChart& chart) const;

    void paintHeading(QPainter& painter, const Heading& heading, QPointF origin) const;
    void paintParagraph(QPainter& painter, const Paragraph& paragraph, QPointF origin) const;
    void paintFields(QPainter& painter, const FieldList& list, const MeasuredBlock& measured,
                     QPointF origin, std::size_t first, std::size_t last) const;
    void paintTable(QPainter& painter, const Table& table, const MeasuredBlock& measured,
                    QPointF origin, std::size_t first, std::size_t last, bool withHeader) const;
    void paintErrorChart(QPainter& painter, const ErrorChart& chart, QPointF origin) const;
    void paintDriftGrid(QPainter& painter, const DriftChartGrid& grid,
                        const MeasuredBlock& measured, QPointF origin, std::size_t first,
                        std::size_t last) const;

    const PageStyle& style_;
    double width_;
    double label_ = 0.0;
};

} // namespace mw::record
