// Measuring and painting headings, paragraphs, field lists, tables and chart blocks.
#include "app/record/block_painter.h"

#include "app/record/chart_painters.h"

#include <QPainter>
#include <QPainterPath>
#include <QRegularExpression>

#include <algorithm>
#include <numeric>

namespace mw::record {
namespace {

QString qs(const std::string& text) {
    return QString::fromStdString(text);
}

// Lengths of the layout, in millimetres.
constexpr double kHeading1Before = 5.0;
constexpr double kHeading2Before = 3.0;
constexpr double kBlockBefore = 1.8;
constexpr double kChartBefore = 3.0;
constexpr double kBoxPadding = 2.0;
constexpr double kCautionMark = 7.0;
constexpr double kStatementIndent = 3.0;
constexpr double kFieldGap = 0.9;
constexpr double kLabelMax = 52.0;
constexpr double kErrorChartHeight = 70.0;
constexpr double kDriftPlotHeight = 40.0;
constexpr double kGridGap = 5.0;
constexpr double kTextAfterNumber = 2.5; // left-aligned text after a column of numbers

} // namespace

BlockPainter::BlockPainter(const PageStyle& style, double width)
    : style_(style)
    , width_(width) {}

double BlockPainter::cellPadding() const {
    return style_.mm(1.2);
}

double BlockPainter::paragraphPadding(ParagraphStyle style) const {
    return style == ParagraphStyle::Caution || style == ParagraphStyle::Notice
               ? style_.mm(kBoxPadding)
               : 0.0;
}

const QFont& BlockPainter::paragraphFont(ParagraphStyle style) const {
    return style == ParagraphStyle::Small ? style_.small : style_.body;
}

MeasuredBlock BlockPainter::measure(const Block& block) const {
    if (const auto* heading = std::get_if<Heading>(&block)) {
        const bool section = heading->level <= 1;
        const QFont& font = section ? style_.heading1 : style_.heading2;
        MeasuredBlock m;
        m.units = {style_.textHeight(font, width_, qs(heading->text)) + style_.mm(1.2)};
        m.spaceBefore = style_.mm(section ? kHeading1Before : kHeading2Before);
        m.keepWithNext = true;
        return m;
    }
    if (const auto* paragraph = std::get_if<Paragraph>(&block)) {
        const double pad = paragraphPadding(paragraph->style);
        double inset = 2.0 * pad;
        if (paragraph->style == ParagraphStyle::Caution) {
            inset += style_.mm(kCautionMark);
        } else if (paragraph->style == ParagraphStyle::Statement) {
            inset += style_.mm(kStatementIndent);
        }
        MeasuredBlock m;
        m.units = {style_.textHeight(paragraphFont(paragraph->style), width_ - inset,
                                     qs(paragraph->text)) +
                   2.0 * pad};
        m.spaceBefore = style_.mm(kBlockBefore);
        return m;
    }
    if (const auto* list = std::get_if<FieldList>(&block)) {
        return measureFields(*list);
    }
    if (const auto* table = std::get_if<Table>(&block)) {
        return measureTable(*table);
    }
    if (const auto* chart = std::get_if<ErrorChart>(&block)) {
        MeasuredBlock m;
        m.units = {style_.textHeight(style_.small, width_, qs(chart->caption)) + style_.mm(1.0) +
                   style_.mm(kErrorChartHeight)};
        m.spaceBefore = style_.mm(kChartBefore);
        return m;
    }
    return measureDriftGrid(std::get<DriftChartGrid>(block));
}

double BlockPainter::labelWidth(const std::vector<const FieldList*>& lists) const {
    double label = 0.0;
    for (const FieldList* list : lists) {
        for (const Field& field : list->fields) {
            label = std::max(label, style_.textWidth(style_.bodyBold, qs(field.label)));
        }
    }
    return std::min(label + style_.mm(3.0), style_.mm(kLabelMax));
}

double BlockPainter::labelWidth(const Document& document) const {
    std::vector<const FieldList*> lists;
    for (const Block& block : document.blocks) {
        if (const auto* list = std::get_if<FieldList>(&block)) {
            lists.push_back(list);
        }
    }
    return labelWidth(lists);
}

void BlockPainter::setLabelWidth(double width) {
    label_ = width;
}

MeasuredBlock BlockPainter::measureFields(const FieldList& list) const {
    MeasuredBlock m;
    const double label = label_ > 0.0 ? label_ : labelWidth({&list});
    m.columns = {label};
    for (const Field& field : list.fields) {
        const double value = style_.textHeight(field.verbatim ? style_.verbatim : style_.body,
                                               width_ - label, qs(field.value));
        const double name =
            style_.textHeight(style_.bodyBold, label - style_.mm(2.0), qs(field.label));
        m.units.push_back(std::max(value, name) + style_.mm(kFieldGap));
    }
    m.spaceBefore = style_.mm(kBlockBefore);
    return m;
}

double BlockPainter::longestWord(const QFont& font, const std::string& text) const {
    double widest = 0.0;
    const QFontMetricsF fm = style_.metrics(font);
    for (const QString& word : qs(text).split(QRegularExpression(QStringLiteral("\\s+")))) {
        widest = std::max(widest, fm.horizontalAdvance(word));
    }
    return widest;
}

double BlockPainter::leadingGap(const Table& table, std::size_t column) const {
    const bool afterNumbers = column > 0 && table.columns[column - 1].align == Align::Right &&
                              table.columns[column].align == Align::Left;
    return afterNumbers ? style_.mm(kTextAfterNumber) : 0.0;
}

std::vector<double> BlockPainter::columnWidths(const Table& table) const {
    const double pad = 2.0 * cellPadding();
    const std::size_t n = table.columns.size();
    // Natural: each column on one line; least: its longest word, so no word is broken.
    std::vector<double> natural(n, 0.0);
    std::vector<double> least(n, 0.0);
    for (std::size_t c = 0; c < n; ++c) {
        const std::string& header = table.columns[c].header;
        natural[c] = style_.textWidth(style_.tableBold, qs(header));
        least[c] = longestWord(style_.tableBold, header);
        for (std::size_t r = 0; r < table.rows.size(); ++r) {
            const bool bold = r < table.emphasised.size() && table.emphasised[r];
            const QFont& font = bold ? style_.tableBold : style_.table;
            const std::string& cell = table.rows[r].at(c);
            natural[c] = std::max(natural[c], style_.textWidth(font, qs(cell)));
            // Numbers (right-aligned) are never wrapped.
            least[c] = std::max(least[c], table.columns[c].align == Align::Right
                                              ? style_.textWidth(font, qs(cell))
                                              : longestWord(font, cell));
        }
        natural[c] += pad + leadingGap(table, c);
        least[c] += pad + leadingGap(table, c);
    }
    const double naturalTotal = std::accumulate(natural.begin(), natural.end(), 0.0);
    const double leastTotal = std::accumulate(least.begin(), least.end(), 0.0);
    std::vector<double> widths(n);
    if (naturalTotal <= width_) {
        // Everything fits on one line: the spare room is shared evenly.
        const double spare = (width_ - naturalTotal) / static_cast<double>(n);
        for (std::size_t c = 0; c < n; ++c) {
            widths[c] = natural[c] + spare;
        }
    } else if (leastTotal <= width_) {
        // Every column gets its longest word; the room left is shared out evenly, a column
        // taking no more than it needs to stand on one line, so that short columns stay whole
        // and the long ones wrap.
        std::vector<std::size_t> order(n);
        std::iota(order.begin(), order.end(), std::size_t{0});
        std::sort(order.begin(), order.end(), [&](std::size_t a, std::size_t b) {
            return natural[a] - least[a] < natural[b] - least[b];
        });
        double room = width_ - leastTotal;
        for (std::size_t i = 0; i < n; ++i) {
            const std::size_t c = order[i];
            const double grant = std::min(natural[c] - least[c], room / static_cast<double>(n - i));
            widths[c] = least[c] + grant;
            room -= grant;
        }
    } else {
        for (std::size_t c = 0; c < n; ++c) {
            widths[c] = least[c] * width_ / leastTotal; // words break; nothing runs off the page
        }
    }
    return widths;
}

MeasuredBlock BlockPainter::measureTable(const Table& table) const {
    MeasuredBlock m;
    const double pad = cellPadding();
    const std::size_t n = table.columns.size();
    m.columns = columnWidths(table);
    for (std::size_t c = 0; c < n; ++c) {
        m.header =
            std::max(m.header, style_.textHeight(style_.tableBold,
                                                 m.columns[c] - 2 * pad - leadingGap(table, c),
                                                 qs(table.columns[c].header)));
    }
    m.header += 2.0 * style_.mm(0.9);
    for (std::size_t r = 0; r < table.rows.size(); ++r) {
        const bool bold = r < table.emphasised.size() && table.emphasised[r];
        double height = 0.0;
        for (std::size_t c = 0; c < n; ++c) {
            height =
                std::max(height, style_.textHeight(bold ? style_.tableBold : style_.table,
                                                   m.columns[c] - 2 * pad - leadingGap(table, c),
                                                   qs(table.rows[r].at(c))));
        }
        m.units.push_back(height + 2.0 * style_.mm(0.7));
    }
    m.spaceBefore = style_.mm(kBlockBefore);
    return m;
}

double BlockPainter::driftCellWidth() const {
    return (width_ - style_.mm(kGridGap)) / 2.0;
}

double BlockPainter::driftCellHeight(const DriftChart& chart) const {
    const double w = driftCellWidth();
    return style_.textHeight(style_.heading2, w, qs(chart.caption)) + style_.mm(1.0) +
           style_.mm(kDriftPlotHeight) + style_.mm(1.0) +
           style_.textHeight(style_.small, w, qs(chart.point.summary));
}

MeasuredBlock BlockPainter::measureDriftGrid(const DriftChartGrid& grid) const {
    MeasuredBlock m;
    for (std::size_t i = 0; i < grid.charts.size(); i += 2) {
        double row = driftCellHeight(grid.charts[i]);
        if (i + 1 < grid.charts.size()) {
            row = std::max(row, driftCellHeight(grid.charts[i + 1]));
        }
        m.units.push_back(row + style_.mm(kGridGap));
    }
    m.spaceBefore = style_.mm(kChartBefore);
    return m;
}

void BlockPainter::paint(QPainter& painter, const Block& block, const MeasuredBlock& measured,
                         QPointF origin, std::size_t first, std::size_t last,
                         bool withHeader) const {
    painter.setPen(style_.ink);
    if (const auto* heading = std::get_if<Heading>(&block)) {
        paintHeading(painter, *heading, origin);
    } else if (const auto* paragraph = std::get_if<Paragraph>(&block)) {
        paintParagraph(painter, *paragraph, origin);
    } else if (const auto* list = std::get_if<FieldList>(&block)) {
        paintFields(painter, *list, measured, origin, first, last);
    } else if (const auto* table = std::get_if<Table>(&block)) {
        paintTable(painter, *table, measured, origin, first, last, withHeader);
    } else if (const auto* chart = std::get_if<ErrorChart>(&block)) {
        paintErrorChart(painter, *chart, origin);
    } else {
        paintDriftGrid(painter, std::get<DriftChartGrid>(block), measured, origin, first, last);
    }
}

void BlockPainter::paintHeading(QPainter& painter, const Heading& heading, QPointF origin) const {
    const bool section = heading.level <= 1;
    const QFont& font = section ? style_.heading1 : style_.heading2;
    const double height = style_.textHeight(font, width_, qs(heading.text));
    style_.drawText(painter, font, QRectF(origin, QSizeF(width_, height)), qs(heading.text));
    if (section) {
        painter.setPen(QPen(style_.rule, style_.pt(0.6)));
        const double y = origin.y() + height + style_.mm(0.4);
        painter.drawLine(QPointF(origin.x(), y), QPointF(origin.x() + width_, y));
    }
}

void BlockPainter::paintParagraph(QPainter& painter, const Paragraph& paragraph,
                                  QPointF origin) const {
    const QFont& font = paragraphFont(paragraph.style);
    const QString text = qs(paragraph.text);
    const double pad = paragraphPadding(paragraph.style);
    if (paragraph.style == ParagraphStyle::Statement) {
        const double indent = style_.mm(kStatementIndent);
        const double height = style_.textHeight(font, width_ - indent, text);
        painter.setPen(QPen(style_.rule, style_.pt(2.0)));
        painter.drawLine(origin + QPointF(style_.pt(1.0), 0.0),
                         origin + QPointF(style_.pt(1.0), height));
        painter.setPen(style_.ink);
        style_.drawText(painter, font,
                        QRectF(origin + QPointF(indent, 0.0), QSizeF(width_ - indent, height)),
                        text);
        return;
    }
    if (pad == 0.0) {
        style_.drawText(painter, font, QRectF(origin, QSizeF(width_, 1.0)), text);
        return;
    }
    const bool caution = paragraph.style == ParagraphStyle::Caution;
    const double mark = caution ? style_.mm(kCautionMark) : 0.0;
    const double height = style_.textHeight(font, width_ - 2.0 * pad - mark, text) + 2.0 * pad;
    const QRectF box(origin, QSizeF(width_, height));
    painter.setPen(QPen(style_.ink, style_.pt(caution ? 1.2 : 0.6)));
    painter.setBrush(caution ? Qt::NoBrush : QBrush(style_.shade));
    painter.drawRect(box);
    painter.setBrush(Qt::NoBrush);
    if (caution) {
        // A caution triangle with an exclamation mark: the shape says it, not a colour.
        const double side = style_.mm(5.0);
        const QPointF top = origin + QPointF(pad + side / 2.0, pad);
        QPainterPath triangle;
        triangle.moveTo(top);
        triangle.lineTo(top + QPointF(side / 2.0, side * 0.87));
        triangle.lineTo(top + QPointF(-side / 2.0, side * 0.87));
        triangle.closeSubpath();
        painter.setPen(QPen(style_.ink, style_.pt(1.2)));
        painter.drawPath(triangle);
        style_.drawText(painter, style_.bodyBold,
                        QRectF(top + QPointF(-side / 2.0, side * 0.22), QSizeF(side, side)),
                        QStringLiteral("!"), Qt::AlignHCenter);
    }
    painter.setPen(style_.ink);
    style_.drawText(painter, font,
                    QRectF(origin + QPointF(pad + mark, pad),
                           QSizeF(width_ - 2.0 * pad - mark, height - 2.0 * pad)),
                    text);
}

void BlockPainter::paintFields(QPainter& painter, const FieldList& list,
                               const MeasuredBlock& measured, QPointF origin, std::size_t first,
                               std::size_t last) const {
    const double label = measured.columns.at(0);
    double y = origin.y();
    for (std::size_t i = first; i < last; ++i) {
        const Field& field = list.fields[i];
        style_.drawText(painter, style_.bodyBold,
                        QRectF(origin.x(), y, label - style_.mm(2.0), measured.units[i]),
                        qs(field.label));
        style_.drawText(painter, field.verbatim ? style_.verbatim : style_.body,
                        QRectF(origin.x() + label, y, width_ - label, measured.units[i]),
                        qs(field.value));
        y += measured.units[i];
    }
}

void BlockPainter::paintTable(QPainter& painter, const Table& table, const MeasuredBlock& measured,
                              QPointF origin, std::size_t first, std::size_t last,
                              bool withHeader) const {
    const double pad = cellPadding();
    const double total = std::accumulate(measured.columns.begin(), measured.columns.end(), 0.0);
    const auto drawRow = [&](double y, double height, const std::vector<QString>& cells,
                             const QFont& font) {
        double x = origin.x();
        for (std::size_t c = 0; c < cells.size(); ++c) {
            const Qt::Alignment align =
                table.columns[c].align == Align::Right ? Qt::AlignRight : Qt::AlignLeft;
            const double gap = leadingGap(table, c);
            style_.drawText(painter, font,
                            QRectF(x + pad + gap, y + style_.mm(0.7),
                                   measured.columns[c] - 2 * pad - gap, height),
                            cells[c], align);
            x += measured.columns[c];
        }
    };
    double y = origin.y();
    if (withHeader) {
        painter.fillRect(QRectF(origin.x(), y, total, measured.header), style_.shade);
        std::vector<QString> headers;
        for (const Column& column : table.columns) {
            headers.push_back(qs(column.header));
        }
        painter.setPen(style_.ink);
        drawRow(y + style_.mm(0.2), measured.header, headers, style_.tableBold);
        y += measured.header;
        painter.setPen(QPen(style_.rule, style_.pt(0.6)));
        painter.drawLine(QPointF(origin.x(), y), QPointF(origin.x() + total, y));
    }
    for (std::size_t r = first; r < last; ++r) {
        std::vector<QString> cells;
        for (const std::string& cell : table.rows[r]) {
            cells.push_back(qs(cell));
        }
        const bool bold = r < table.emphasised.size() && table.emphasised[r];
        painter.setPen(style_.ink);
        drawRow(y, measured.units[r], cells, bold ? style_.tableBold : style_.table);
        y += measured.units[r];
        painter.setPen(QPen(style_.grid, style_.pt(0.4)));
        painter.drawLine(QPointF(origin.x(), y), QPointF(origin.x() + total, y));
    }
}

void BlockPainter::paintErrorChart(QPainter& painter, const ErrorChart& chart,
                                   QPointF origin) const {
    const double caption = style_.textHeight(style_.small, width_, qs(chart.caption));
    style_.drawText(painter, style_.small, QRectF(origin, QSizeF(width_, caption)),
                    qs(chart.caption));
    const QRectF area(origin.x(), origin.y() + caption + style_.mm(1.0), width_,
                      style_.mm(kErrorChartHeight));
    paintRangeChart(painter, style_, chart.chart, chart.unit, area);
}

void BlockPainter::paintDriftGrid(QPainter& painter, const DriftChartGrid& grid,
                                  const MeasuredBlock& measured, QPointF origin, std::size_t first,
                                  std::size_t last) const {
    const double w = driftCellWidth();
    double y = origin.y();
    for (std::size_t row = first; row < last; ++row) {
        for (std::size_t i = row * 2; i < std::min(row * 2 + 2, grid.charts.size()); ++i) {
            const DriftChart& chart = grid.charts[i];
            const double x = origin.x() + (i % 2) * (w + style_.mm(kGridGap));
            const double caption = style_.textHeight(style_.heading2, w, qs(chart.caption));
            painter.setPen(style_.ink);
            style_.drawText(painter, style_.heading2, QRectF(x, y, w, caption), qs(chart.caption));
            const QRectF plot(x, y + caption + style_.mm(1.0), w, style_.mm(kDriftPlotHeight));
            paintDriftPlot(painter, style_, chart.point, plot);
            painter.setPen(style_.ink);
            style_.drawText(painter, style_.small,
                            QRectF(x, plot.bottom() + style_.mm(1.0), w, measured.units[row]),
                            qs(chart.point.summary));
        }
        y += measured.units[row];
    }
}

} // namespace mw::record
