// Fonts, lengths and pens of printed documents for one paint device, and the text measuring and
// drawing every block uses, so that what is measured is what is drawn.
#pragma once

#include <QColor>
#include <QFont>
#include <QFontMetricsF>
#include <QPaintDevice>
#include <QRectF>
#include <QString>

class QPainter;

namespace mw::record {

// Lengths are in the device's pixels; fonts are sized in points and measured on the device.
class PageStyle {
public:
    explicit PageStyle(const QPaintDevice& device);

    double mm(double millimetres) const { return millimetres * dotsPerMm_; }
    double pt(double points) const { return points * dotsPerMm_ * 25.4 / 72.0; }
    const QPaintDevice& device() const { return device_; }

    QFont title;
    QFont heading1;
    QFont heading2;
    QFont body;
    QFont bodyBold;
    QFont small;
    QFont table;
    QFont tableBold;
    QFont verbatim;
    QFont chart;
    QFont watermark;

    QColor ink{0, 0, 0};
    QColor rule{120, 120, 120};
    QColor shade{232, 232, 232}; // table headers, notice boxes
    QColor grid{215, 215, 215};  // chart grid
    QColor muted{90, 90, 90};    // axis labels, running head
    QColor watermarkInk{0, 0, 0, 40};

    QFontMetricsF metrics(const QFont& font) const { return QFontMetricsF(font, &device_); }
    // Height of `text` wrapped at word boundaries in `width` (a word longer than the width is
    // broken anywhere rather than cut off).
    double textHeight(const QFont& font, double width, const QString& text) const;
    // Width of the longest line of `text` unwrapped.
    double textWidth(const QFont& font, const QString& text) const;
    // Draws `text` wrapped as textHeight() measured it, at the top of `rect`.
    void drawText(QPainter& painter, const QFont& font, const QRectF& rect, const QString& text,
                  Qt::Alignment align = Qt::AlignLeft) const;

private:
    QFont font(double points, bool bold = false) const;

    const QPaintDevice& device_;
    double dotsPerMm_;
};

} // namespace mw::record
